// `npm run bench [-- --case NAME] [--hours N]`: generate the bench recording(s) if missing, then run
// each case in a fresh child process (so cases do not share heap or peak RSS) and print throughput,
// wall time and peak RSS. Default: every case on a 1-hour and an 8-hour file, to show that memory
// does not grow with the recording length (a case may name its default lengths: read-csv runs at
// 1 h only, since an 8-hour CSV is a 2 GB file to generate).
import { spawnSync } from 'node:child_process';
import { availableParallelism, loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { benchCases } from './cases.js';
import { makeBenchCsv } from './make-bench-csv.js';
import { makeBenchEdf } from './make-bench-edf.js';

interface ChildResult { bytes: number; samples: number; check: string; wall_s: number; cpu_s: number; maxrss_kb: number }

async function child(caseName: string, file: string): Promise<void> {
  const c = benchCases.find((x) => x.name === caseName);
  if (!c) throw new Error(`unknown case ${caseName}`);
  const t0 = process.hrtime.bigint();
  const work = await c.run(file);
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  const ru = process.resourceUsage();
  // CPU time of every thread (worker threads included): the fair measure on a shared machine.
  const res: ChildResult = { ...work, wall_s: wall, cpu_s: (ru.userCPUTime + ru.systemCPUTime) / 1e6, maxrss_kb: ru.maxRSS };
  process.stdout.write(JSON.stringify(res) + '\n');
}

function parseArgs(argv: string[]): { cases: string[]; hours: number[] } {
  const cases: string[] = [];
  let hours: number[] = [1, 8];
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--case') cases.push(...argv[++i].split(','));
    else if (argv[i] === '--hours') hours = argv[++i].split(',').map(Number);
    else if (argv[i] === '--list') {
      for (const c of benchCases) process.stdout.write(`${c.name.padEnd(14)} ${c.describe}\n`);
      process.exit(0);
    } else throw new Error(`unknown argument ${argv[i]} (use --case NAME, --hours N, --list)`);
  }
  for (const c of cases) if (!benchCases.some((x) => x.name === c)) throw new Error(`unknown case ${c}; cases: ${benchCases.map((x) => x.name).join(', ')}`);
  if (hours.some((h) => !(h > 0))) throw new Error('--hours: expected a positive number');
  return { cases, hours };
}

async function parent(argv: string[]): Promise<void> {
  const { cases: asked, hours } = parseArgs(argv);
  const self = fileURLToPath(import.meta.url);
  process.stdout.write(`shiftload bench — node ${process.version}, ${process.platform}-${process.arch}, ${availableParallelism()} cores, load average ${loadavg().map((v) => v.toFixed(1)).join(' ')}\n`);
  const rows: string[][] = [['case', 'file', 'MB', 'wall s', 'CPU s', 'MB/s', 'M samples/s', 'peak RSS MB', 'check']];
  for (const h of hours) {
    // without --case: every case, each at its default lengths
    const cases = asked.length ? asked : benchCases.filter((c) => !c.defaultHours || c.defaultHours.includes(h)).map((c) => c.name);
    const files = new Map<string, string>();
    for (const input of new Set(cases.map((name) => benchCases.find((x) => x.name === name)!.input ?? 'edf'))) {
      const g0 = Date.now();
      files.set(input, input === 'csv' ? makeBenchCsv(h) : makeBenchEdf(h));
      process.stdout.write(`bench file ${files.get(input)} ready (${((Date.now() - g0) / 1000).toFixed(1)} s)\n`);
    }
    for (const name of cases) {
      const file = files.get(benchCases.find((x) => x.name === name)!.input ?? 'edf')!;
      const r = spawnSync(process.execPath, [self, '--child', name, file], { encoding: 'utf8', maxBuffer: 1 << 20 });
      if (r.status !== 0) throw new Error(`case ${name} failed: ${r.stderr}`);
      const res = JSON.parse(r.stdout.trim().split('\n').pop()!) as ChildResult;
      rows.push([name, `${h} h`, (res.bytes / 1e6).toFixed(1), res.wall_s.toFixed(2), res.cpu_s.toFixed(2), (res.bytes / 1e6 / res.wall_s).toFixed(0),
        (res.samples / 1e6 / res.wall_s).toFixed(1), (res.maxrss_kb / 1024).toFixed(0), res.check]);
      process.stdout.write(`  ${name} on ${h} h: ${res.wall_s.toFixed(2)} s\n`);
    }
  }
  const w = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  process.stdout.write('\n' + rows.map((r) => r.map((c, i) => (i === 0 || i === 8 ? c.padEnd(w[i]) : c.padStart(w[i]))).join('  ').trimEnd()).join('\n') + '\n');
}

const args = process.argv.slice(2);
const run = args[0] === '--child' ? child(args[1], args[2]) : parent(args);
run.catch((e: Error) => {
  process.stderr.write(`bench: ${e.message}\n`);
  process.exitCode = 1;
});
