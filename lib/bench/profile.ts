// `npm run bench:profile -- --case NAME [--hours N] [--top K]`: run one bench case in a child
// process under V8's CPU profiler (node --cpu-prof, one profile per thread, worker threads
// included) and print where the time goes: self time per function, summed over threads, with the
// share of each thread's busy time. This is the "profile first" step of every speed change
// (DEVELOPERS.md, "Speed"); `npm run bench` then measures the result.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchCases } from './cases.js';
import { makeBenchEdf } from './make-bench-edf.js';

interface ProfileNode { id: number; callFrame: { functionName: string; url: string; lineNumber: number } }
interface CpuProfile { nodes: ProfileNode[]; samples: number[]; timeDeltas: number[] }

/** Self time (ms) per "function file:line" of one profile, and its total. */
export function selfTimes(p: CpuProfile): { total: number; byFunction: Map<string, number> } {
  const byId = new Map(p.nodes.map((n) => [n.id, n]));
  const byFunction = new Map<string, number>();
  let total = 0;
  for (let i = 0; i < p.samples.length; i++) {
    const n = byId.get(p.samples[i]!);
    if (!n) continue;
    const dt = (p.timeDeltas[i] ?? 0) / 1000;
    const cf = n.callFrame;
    const where = cf.url ? `${cf.url.split('/').slice(-2).join('/')}:${cf.lineNumber + 1}` : '';
    const key = `${cf.functionName || '(anonymous)'} ${where}`.trim();
    byFunction.set(key, (byFunction.get(key) ?? 0) + dt);
    total += dt;
  }
  return { total, byFunction };
}

function parseArgs(argv: string[]): { name: string; hours: number; top: number } {
  let name = 'analyze', hours = 1, top = 25;
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--case') name = argv[++i]!;
    else if (argv[i] === '--hours') hours = Number(argv[++i]);
    else if (argv[i] === '--top') top = Number(argv[++i]);
    else throw new Error(`unknown argument ${argv[i]} (use --case NAME, --hours N, --top K)`);
  }
  if (!benchCases.some((c) => c.name === name)) throw new Error(`unknown case ${name}; cases: ${benchCases.map((c) => c.name).join(', ')}`);
  if (!(hours > 0) || !(top > 0)) throw new Error('--hours and --top: expected positive numbers');
  return { name, hours, top };
}

function main(): void {
  const { name, hours, top } = parseArgs(process.argv.slice(2));
  const file = makeBenchEdf(hours);
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-profile-'));
  try {
    const runner = fileURLToPath(new URL('./run.js', import.meta.url));
    const r = spawnSync(process.execPath, ['--cpu-prof', `--cpu-prof-dir=${dir}`, runner, '--child', name, file], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`case ${name} failed: ${r.stderr}`);
    const res = JSON.parse(r.stdout.trim().split('\n').pop()!) as { wall_s: number; cpu_s: number; maxrss_kb: number };
    process.stdout.write(`profile of ${name} on ${hours} h: wall ${res.wall_s.toFixed(2)} s, CPU ${res.cpu_s.toFixed(2)} s, peak RSS ${(res.maxrss_kb / 1024).toFixed(0)} MB\n`);
    const sum = new Map<string, number>();
    let busy = 0;
    const files = readdirSync(dir).filter((f) => f.endsWith('.cpuprofile')).sort();
    for (const f of files) {
      const { total, byFunction } = selfTimes(JSON.parse(readFileSync(join(dir, f), 'utf8')) as CpuProfile);
      const idle = byFunction.get('(idle)') ?? 0;
      process.stdout.write(`  thread ${f.split('.').slice(-3, -2)[0]}: ${total.toFixed(0)} ms profiled, ${idle.toFixed(0)} ms idle\n`);
      for (const [k, v] of byFunction) if (k !== '(idle)') { sum.set(k, (sum.get(k) ?? 0) + v); busy += v; }
    }
    process.stdout.write(`\nself time over all threads (busy ${busy.toFixed(0)} ms):\n`);
    for (const [k, v] of [...sum].sort((a, b) => b[1] - a[1]).slice(0, top)) {
      process.stdout.write(`${v.toFixed(0).padStart(7)} ms ${((100 * v) / busy).toFixed(1).padStart(5)} %  ${k}\n`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

try {
  main();
} catch (e) {
  process.stderr.write(`bench:profile: ${(e as Error).message}\n`);
  process.exitCode = 1;
}
