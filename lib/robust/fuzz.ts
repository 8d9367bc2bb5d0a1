// The robustness fuzzer: seeded mutations of EDF/BDF, CSV/TSV, segment CSV and job YAML inputs run
// in-process through the CLI (`inspect`, `convert`, `check`, `analyze --no-report`). Every case must
// end with exit 0, or exit 2 and exactly one line on stderr — never exit 1 (internal error), an
// uncaught exception, a hang, or a half-written output under a final name.
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { CommandModule } from 'yargs';
import { analyzeCommand } from '../cli/analyze.js';
import { checkCommand } from '../cli/check.js';
import { bufferIO, type CliIO } from '../cli/cli-io.js';
import { convertCommand } from '../cli/convert.js';
import { inspectCommand } from '../cli/inspect.js';
import { main } from '../cli/main.js';
import { isUserError } from '../errors.js';
import { SplitMix64 } from '../stats/splitmix64.js';
import { mutateCsv, mutateEdf, mutateYaml, type Mutant } from './mutate.js';
import { SHARED_EDF_SEEDS, seedBytes, writeSeedFiles } from './seed-files.js';

export interface FuzzOptions {
  /** Master seed; case i uses a generator derived from (seed, i). */
  seed: number;
  /** Number of cases. */
  cases: number;
  /** First case number. @default 0 */
  first?: number;
  /** Per-case time bound, ms (wall clock, including a synchronous stall). @default 5000 */
  timeoutMs?: number;
  /** Scratch folder (created; emptied case by case). */
  dir: string;
  /** Restrict to these case kinds. @default all */
  kinds?: readonly FuzzKind[];
  /**
   * Run every n-th case through `main()` (yargs parsing included) and the others through the
   * command's handler with the same exit-code rule as `main()` — yargs renders the help text on
   * every call (~20 ms), which would dominate a bounded run. @default 1 (all through main)
   */
  mainEvery?: number;
  /** Called after each case (progress, logging). */
  onCase?: (r: CaseResult) => void;
}

export const FUZZ_KINDS = [
  'edf-inspect', 'edf-convert', 'edf-analyze', 'csv-inspect', 'csv-convert', 'yaml-check', 'yaml-analyze', 'segments-check',
] as const;
export type FuzzKind = (typeof FUZZ_KINDS)[number];

/** Relative frequency of each kind (analyze is the slowest, so it is drawn least). */
const WEIGHTS: Record<FuzzKind, number> = {
  'edf-inspect': 30, 'edf-convert': 14, 'edf-analyze': 5, 'csv-inspect': 16, 'csv-convert': 8,
  'yaml-check': 18, 'yaml-analyze': 3, 'segments-check': 6,
};

export interface CaseResult {
  seed: number;
  case: number;
  kind: FuzzKind;
  args: string[];
  /** 'main' or 'handler' (see FuzzOptions.mainEvery) */
  via: 'main' | 'handler';
  edits: string[];
  code: number | 'timeout' | 'threw';
  ms: number;
  stderr: string;
  /** Why the case counts as a failure, or null. */
  failure: string | null;
  /** Exit 2 only: whether the line names one of the case's input files (base name). */
  named?: boolean;
}

export interface FuzzSummary {
  cases: number;
  exit0: number;
  exit2: number;
  failures: CaseResult[];
  /** Exit-2 cases whose line names none of the case's input files (worth a look, not failures). */
  unnamed: CaseResult[];
  byKind: Record<string, { cases: number; exit0: number; exit2: number }>;
  slowestMs: number;
}

/** The generator of case `i` under master seed `seed`. */
export function caseRng(seed: number, i: number): SplitMix64 {
  return new SplitMix64((BigInt(seed) << 32n) + BigInt(i));
}

function drawKind(rng: SplitMix64, kinds: readonly FuzzKind[]): FuzzKind {
  const total = kinds.reduce((a, k) => a + WEIGHTS[k], 0);
  let x = rng.random() * total;
  for (const k of kinds) { x -= WEIGHTS[k]; if (x < 0) return k; }
  return kinds[kinds.length - 1];
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyCommand = CommandModule<any, any>;
interface Prepared {
  kind: FuzzKind;
  args: string[];
  /** The same call as `args`, as the handler's parsed options. */
  command: AnyCommand;
  argv: Record<string, unknown>;
  edits: string[];
  outputs: string[];
  /** Base names of the case's input files (an exit-2 line should name one of them). */
  inputs: string[];
}

/**
 * Call a command's handler the way `main()` does after parsing, with main's exit-code rule:
 * 0 success, 2 with one line for InputError/UsageError, 1 for anything else.
 */
export async function runHandler(command: AnyCommand, argv: Record<string, unknown>, io: CliIO): Promise<number> {
  try {
    await (command.handler as (a: unknown) => Promise<void>)({ _: [], $0: 'shiftload', ...argv, io });
    return 0;
  } catch (e) {
    const text = e instanceof Error ? e.message : String(e);
    const first = text.split('\n')[0];
    if (isUserError(e)) { io.err(`shiftload: ${first}\n`); return 2; }
    io.err(`shiftload: internal error: ${first}\n`);
    return 1;
  }
}

/** Lay out case `i`'s inputs in `work` (seeds in `seeds`) and return the command line. */
function prepareCase(kind: FuzzKind, rng: SplitMix64, seeds: string, work: string): Omit<Prepared, 'inputs'> & { inputs?: string[] } {
  const put = (name: string, m: Mutant) => { writeFileSync(join(work, name), m.bytes); return join(work, name); };
  const copy = (name: string, as = name) => { writeFileSync(join(work, as), seedBytes(seeds, name)); return join(work, as); };
  const out = join(work, 'out');
  if (kind === 'edf-inspect' || kind === 'edf-convert') {
    const seed = rng.int(3) === 0 ? (rng.int(2) === 0 ? 'tiny.edf' : 'tiny.bdf') : SHARED_EDF_SEEDS[rng.int(SHARED_EDF_SEEDS.length)];
    const m = mutateEdf(seedBytes(seeds, seed), rng);
    const ext = seed.endsWith('.bdf') ? '.bdf' : '.edf';
    const file = put('case' + ext, m);
    const edits = [seed, ...m.edits];
    if (kind === 'edf-inspect') {
      const json = rng.int(2) === 1;
      return { kind, args: ['inspect', file, ...(json ? ['--json'] : [])], command: inspectCommand, argv: { file, json }, edits, outputs: [] };
    }
    const fmt = rng.int(2) ? 'csv' : 'edf';
    const span = rng.int(3) === 0 ? { start: rng.int(4), end: 2 + rng.int(14) } : {};
    const o = join(out, `converted.${fmt}`);
    mkdirSync(out, { recursive: true });
    return {
      kind, args: ['convert', file, '--format', fmt, '-o', o, ...Object.entries(span).flatMap(([k, v]) => [`--${k}`, String(v)])],
      command: convertCommand, argv: { file, format: fmt, out: o, ...span }, edits, outputs: [o],
    };
  }
  if (kind === 'edf-analyze') {
    const bdf = rng.int(4) === 0;
    const m = mutateEdf(seedBytes(seeds, bdf ? 'tiny.bdf' : 'tiny.edf'), rng);
    put(bdf ? 'tiny.bdf' : 'tiny.edf', m);
    let job = seedBytes(seeds, 'tiny-job.yaml').toString('utf8');
    if (bdf) job = job.replaceAll('tiny.edf', 'tiny.bdf');
    writeFileSync(join(work, 'tiny-job.yaml'), job);
    return analyzeCase(kind, join(work, 'tiny-job.yaml'), out, [bdf ? 'tiny.bdf' : 'tiny.edf', ...m.edits], rng.int(6) === 0 ? 2 : 1);
  }
  if (kind === 'csv-inspect' || kind === 'csv-convert') {
    const seed = ['time-column.csv', 'decimal-comma.csv', 'no-time.tsv'][rng.int(3)];
    const m = mutateCsv(seedBytes(seeds, seed), rng);
    const file = put('case' + (seed.endsWith('.tsv') ? '.tsv' : '.csv'), m);
    const rate = seed === 'no-time.tsv' || rng.int(8) === 0 ? { rate: [1000, 0, -5, 1e-9, 1e12][rng.int(5)] } : {};
    const rateArgs = rate.rate !== undefined ? ['--rate', String(rate.rate)] : [];
    const edits = [seed, ...m.edits];
    if (kind === 'csv-inspect') {
      const json = rng.int(2) === 1;
      return { kind, args: ['inspect', file, ...rateArgs, ...(json ? ['--json'] : [])], command: inspectCommand, argv: { file, json, ...rate }, edits, outputs: [] };
    }
    const fmt = rng.int(3) ? 'edf' : 'csv';
    const o = join(out, `converted.${fmt}`);
    mkdirSync(out, { recursive: true });
    return { kind, args: ['convert', file, '--format', fmt, '-o', o, ...rateArgs], command: convertCommand, argv: { file, format: fmt, out: o, ...rate }, edits, outputs: [o] };
  }
  // job YAML and segment CSV cases share the tiny recording
  copy('tiny.edf');
  copy('tiny-segments.csv');
  if (kind === 'segments-check') {
    const text = seedBytes(seeds, 'tiny-job.yaml').toString('utf8')
      .replace(/segments:\n(\s+- .*\n)+/, 'segments: { csv: tiny-segments.csv }\n');
    writeFileSync(join(work, 'tiny-job.yaml'), text);
    const m = mutateCsv(seedBytes(seeds, 'tiny-segments.csv'), rng);
    put('tiny-segments.csv', m);
    const job = join(work, 'tiny-job.yaml');
    return { kind, args: ['check', job], command: checkCommand, argv: { job, json: false }, edits: ['tiny-segments.csv', ...m.edits], outputs: [] };
  }
  const m = mutateYaml(seedBytes(seeds, 'tiny-job.yaml'), rng);
  const job = put('tiny-job.yaml', m);
  if (kind === 'yaml-check') {
    const json = rng.int(4) === 0;
    return { kind, args: ['check', job, ...(json ? ['--json'] : [])], command: checkCommand, argv: { job, json }, edits: ['tiny-job.yaml', ...m.edits], outputs: [] };
  }
  return analyzeCase(kind, job, out, ['tiny-job.yaml', ...m.edits], rng.int(6) === 0 ? 2 : 1);
}

function analyzeCase(kind: FuzzKind, job: string, out: string, edits: string[], jobs: number): Omit<Prepared, 'inputs'> {
  return {
    kind, args: ['analyze', job, '--no-report', '-o', out, '--jobs', String(jobs)], command: analyzeCommand,
    argv: { job, out, force: false, report: false, svg: false, jobs }, edits,
    outputs: [join(out, 'results.json'), join(out, 'segments.csv')],
  };
}

/** Files in `dir` that look like temporary outputs left behind (".name.pid.tmp"). */
function strayTemps(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).filter((f) => f.startsWith('.') && f.endsWith('.tmp'));
}

/**
 * What must hold after exit 0: every output exists (and results.json parses); `inspect --json`
 * reports finite positive rates and durations and finite physical ranges (a non-finite value there
 * means a damaged number was accepted).
 */
function postconditionFailure(p: Omit<Prepared, 'inputs'>, stdout: string): string | null {
  const missing = p.outputs.filter((o) => !existsSync(o));
  if (missing.length > 0) return `exit 0 but no output ${missing.join(', ')}`;
  if (p.kind.endsWith('analyze')) {
    try { JSON.parse(readFileSync(p.outputs[0], 'utf8')); } catch { return 'exit 0 but results.json does not parse'; }
  }
  if (p.argv.json === true && p.command === inspectCommand) {
    let r: { duration_s: unknown; signals: { rate_hz: unknown; physical_min: unknown; physical_max: unknown; samples: unknown }[] };
    try { r = JSON.parse(stdout); } catch { return 'inspect --json printed no JSON'; }
    const fin = (x: unknown) => typeof x === 'number' && Number.isFinite(x);
    if (!fin(r.duration_s) || (r.duration_s as number) < 0) return `inspect --json: duration_s ${String(r.duration_s)}`;
    for (const sg of r.signals) {
      if (!fin(sg.rate_hz) || !((sg.rate_hz as number) > 0)) return `inspect --json: rate_hz ${String(sg.rate_hz)}`;
      if (!fin(sg.physical_min) || !fin(sg.physical_max)) return `inspect --json: physical range ${String(sg.physical_min)}…${String(sg.physical_max)}`;
      if (!Number.isInteger(sg.samples) || (sg.samples as number) < 0) return `inspect --json: samples ${String(sg.samples)}`;
    }
  }
  return null;
}

/** Run one case and judge it. */
export async function runCase(seed: number, i: number, seeds: string, work: string, timeoutMs: number, kinds: readonly FuzzKind[] = FUZZ_KINDS, via: 'main' | 'handler' = 'main'): Promise<CaseResult> {
  rmSync(work, { recursive: true, force: true });
  mkdirSync(work, { recursive: true });
  const rng = caseRng(seed, i);
  const kind = drawKind(rng, kinds);
  const p = prepareCase(kind, rng, seeds, work);
  p.inputs = readdirSync(work).filter((f) => f !== 'out');
  const io = bufferIO();
  const t0 = performance.now();
  let timer: NodeJS.Timeout | undefined;
  let code: CaseResult['code'];
  try {
    code = await Promise.race([
      via === 'main' ? main(p.args, io) : runHandler(p.command, p.argv, io),
      new Promise<'timeout'>((res) => { timer = setTimeout(() => res('timeout'), timeoutMs); }),
    ]);
  } catch {
    code = 'threw';
  } finally {
    clearTimeout(timer);
  }
  const ms = performance.now() - t0;
  let failure: string | null = null;
  const lines = io.stderr.split('\n').filter((l) => l.length > 0);
  if (code === 'timeout') failure = `no answer within ${timeoutMs} ms`;
  else if (code === 'threw') failure = 'main() threw';
  else if (ms > timeoutMs) failure = `took ${Math.round(ms)} ms (bound ${timeoutMs} ms)`;
  else if (code === 1) failure = 'internal error (exit 1)';
  else if (code === 2 && lines.length !== 1) failure = `exit 2 with ${lines.length} stderr lines`;
  else if (code === 2 && !lines[0].startsWith('shiftload: ')) failure = 'exit 2 without the shiftload: prefix';
  else if (code !== 0 && code !== 2) failure = `exit ${code}`;
  else if (code === 2 && p.outputs.some((o) => existsSync(o))) failure = 'exit 2 but an output exists under its final name';
  if (failure === null && code === 0) failure = postconditionFailure(p, io.stdout);
  if (failure === null) {
    const temps = [...strayTemps(work), ...strayTemps(join(work, 'out'))];
    if (temps.length > 0) failure = `temporary files left: ${temps.join(', ')}`;
  }
  // an option error names the option instead of a file
  const named = code === 2 && lines.length === 1 ? lines[0].startsWith('shiftload: --') || p.inputs.some((f) => lines[0].includes(f)) : undefined;
  return { seed, case: i, kind, args: p.args, via, edits: p.edits, code, ms, stderr: io.stderr, failure, ...(named !== undefined ? { named } : {}) };
}

/**
 * Run `cases` fuzz cases and summarize them. Deterministic: the same seed gives the same inputs.
 * @example const s = await runFuzz({ seed: 1, cases: 500, dir: '/tmp/fz' }); s.failures.length
 */
export async function runFuzz(o: FuzzOptions): Promise<FuzzSummary> {
  const seeds = writeSeedFiles(join(o.dir, 'seeds'));
  const work = join(o.dir, 'work');
  const kinds = o.kinds ?? FUZZ_KINDS;
  const summary: FuzzSummary = { cases: 0, exit0: 0, exit2: 0, failures: [], unnamed: [], byKind: {}, slowestMs: 0 };
  const first = o.first ?? 0;
  for (let i = first; i < first + o.cases; i++) {
    const via = i % (o.mainEvery ?? 1) === 0 ? 'main' : 'handler';
    const r = await runCase(o.seed, i, seeds, work, o.timeoutMs ?? 5000, kinds, via);
    summary.cases++;
    const k = (summary.byKind[r.kind] ??= { cases: 0, exit0: 0, exit2: 0 });
    k.cases++;
    if (r.code === 0) { summary.exit0++; k.exit0++; }
    if (r.code === 2) { summary.exit2++; k.exit2++; }
    summary.slowestMs = Math.max(summary.slowestMs, r.ms);
    if (r.failure !== null) summary.failures.push(r);
    else if (r.named === false) summary.unnamed.push(r);
    o.onCase?.(r);
  }
  rmSync(work, { recursive: true, force: true });
  return summary;
}

/** One line describing a case, enough to rerun it (`npm run fuzz -- --seed S --first I --cases 1`). */
export function describeCase(r: CaseResult): string {
  return `seed ${r.seed} case ${r.case} [${r.kind} via ${r.via}] ${r.failure ?? `exit ${r.code}`}: ${r.edits.join('; ')} :: shiftload ${r.args.join(' ')} :: ${r.stderr.trim().split('\n')[0] ?? ''}`;
}
