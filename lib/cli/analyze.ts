// `shiftload analyze JOB [--out DIR]`: the whole study job — job file in, results.json,
// segments.csv and report.pdf out.
import { existsSync, rmSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { basename, dirname, extname, join, relative } from 'node:path';
import type { CommandModule } from 'yargs';
import { UsageError } from '../errors.js';
import { loadJob } from '../job/load-job.js';
import { msg } from '../messages.js';
import type { Study } from '../job/study-types.js';
import { compareConditions } from '../study/compare-conditions.js';
import { parseDetect, planComparisons, type DetectTargets } from '../study/plan-comparisons.js';
import type { StudyResults } from '../study/results.js';
import { runStudy } from '../study/run-study.js';
import { stableJson } from '../study/stable-json.js';
import { OUTPUT_NAMES, prepareOutputFolder, writeStudyOutputs } from '../study/write-study-outputs.js';
import type { CliIO, WithIO } from './cli-io.js';
import { ProgressBar } from './progress-bar.js';

export interface AnalyzeOptions {
  out?: string;
  force?: boolean;
  report?: boolean;
  svg?: boolean;
  /** Worker threads (≥ 2) or inline (1). @default defaultJobs() */
  jobs?: number;
  /** Differences to plan for (--detect), per measure key. */
  detect?: DetectTargets;
}

export interface AnalyzeOutcome {
  study: Study;
  results: StudyResults;
  outDir: string;
  files: string[];
  /** Outputs of an earlier run removed because they no longer match (report.pdf with --no-report). */
  removed?: string[];
}

/**
 * Threads used when --jobs is not given (this one and jobs − 1 workers): one per core, at most 4
 * (reading, not filtering, limits beyond that on typical machines).
 */
export function defaultJobs(): number {
  return Math.max(1, Math.min(4, availableParallelism()));
}

/** Default output folder: beside the job file, named after it. */
export function defaultOutDir(jobPath: string): string {
  return join(dirname(jobPath), `${basename(jobPath, extname(jobPath))}-results`);
}

/** Every file a study reads (none may be overwritten by an output). */
function studyInputs(study: Study): string[] {
  const files = [study.jobFile];
  for (const w of study.workers) for (const r of w.recordings) {
    files.push(r.file);
    for (const sp of [...r.reference, ...r.rest, ...r.mveReference]) files.push(sp.file);
  }
  return files;
}

/** Run a study job and write its outputs (library form of the command; `demo` uses it too). */
export async function analyzeJob(jobPath: string, options: AnalyzeOptions, io: CliIO): Promise<AnalyzeOutcome> {
  const study = await loadJob(jobPath);
  const outDir = options.out ?? defaultOutDir(jobPath);
  prepareOutputFolder(outDir, { force: options.force ?? false, inputs: studyInputs(study) });
  const bar = new ProgressBar(io, 'analyzing');
  let results: StudyResults;
  try {
    results = await runStudy(study, { jobs: options.jobs ?? defaultJobs(), onProgress: (d, t, note) => bar.update(d, t, note) });
  } finally {
    bar.stop();
  }
  results.comparisons = planComparisons(compareConditions(results.rows, {}), options.detect);
  // The report is drawn from results as written (numbers rounded in results.json), so that
  // `shiftload report results.json` later gives the same bytes. It is rendered before anything is
  // written, so a failing renderer leaves every previous output as it was; then all outputs are
  // written under temporary names and renamed together.
  const computed = results;
  results = JSON.parse(stableJson(computed)) as StudyResults;
  let pdfBytes: Uint8Array | null = null;
  if (options.report !== false) {
    const { renderReport } = await import('../report/render-report.js');
    pdfBytes = await renderReport(results, { svgDir: options.svg ? join(outDir, 'charts') : undefined });
  }
  const written = writeStudyOutputs(outDir, computed, pdfBytes ?? undefined);
  const files = [written.results, written.rows, ...(written.report !== undefined ? [written.report] : [])];
  const pdf = join(outDir, OUTPUT_NAMES.report);
  const removed: string[] = [];
  if (pdfBytes === null && existsSync(pdf)) {
    // --no-report into a reused folder: a report of an earlier run must not sit beside new results
    rmSync(pdf);
    removed.push(pdf);
  }
  return { study, results, outDir, files, removed };
}

/** A short plain summary printed after the analysis. */
export function summaryText(outcome: AnalyzeOutcome): string {
  const { results } = outcome;
  const workers = new Set(results.rows.map((r) => r.worker)).size;
  const errors = results.findings.filter((f) => f.severity === 'error').length;
  const warnings = results.findings.filter((f) => f.severity === 'warning').length;
  const lines = [
    `${results.title}: ${workers} worker(s), ${results.rows.length} rows (worker × condition × muscle × segment)`,
    `findings: ${errors} error(s), ${warnings} warning(s), ${results.findings.length - errors - warnings} note(s)`,
    ...outcome.files.map((f) => `wrote ${relative(process.cwd(), f) || f}`),
    ...(outcome.removed ?? []).map((f) => `removed ${relative(process.cwd(), f) || f} (from an earlier run; --no-report)`),
  ];
  return lines.join('\n') + '\n';
}

type AnalyzeArgs = WithIO & { job: string; out?: string; force: boolean; report: boolean; svg: boolean; jobs: number; detect?: string[] };

export const analyzeCommand: CommandModule<object, AnalyzeArgs> = {
  command: 'analyze <job>',
  describe: 'Run a study job: envelopes, normalization, per-segment APDF and rest, results and report',
  builder: (y) => y
    .positional('job', { type: 'string', demandOption: true, describe: 'job file (YAML, see `shiftload init`)' })
    .option('out', { alias: 'o', type: 'string', describe: 'output folder (default: <job>-results beside the job file)' })
    .option('force', { type: 'boolean', default: false, describe: 'reuse an output folder that already holds files' })
    .option('report', { type: 'boolean', default: true, describe: 'write report.pdf (--no-report to skip)' })
    .option('svg', { type: 'boolean', default: false, describe: 'also write every chart as SVG into <out>/charts' })
    .option('jobs', { alias: 'j', type: 'number', default: defaultJobs(), defaultDescription: 'cores, at most 4', describe: 'threads working at once, this one included (recordings and channel groups in parallel); results are identical for any value' })
    .example('$0 analyze study/job.yaml', 'analyze and write study/job-results/{results.json,segments.csv,report.pdf}')
    .example('$0 analyze job.yaml -o out --force --no-report', 'results only, into an existing folder')
    .option('detect', { type: 'string', array: true, describe: 'plan for a difference between conditions: 2 (median load), p90=5, gaps_per_min=1; adds the workers needed' })
    .example('$0 analyze job.yaml --detect 2', 'also say how many workers would detect a 2-unit change in median load')
    .example('$0 analyze job.yaml --jobs 2', 'use two cores for a study of many recordings') as never,
  handler: async (argv) => {
    if (!(Number.isInteger(argv.jobs) && argv.jobs >= 1 && argv.jobs <= 64)) throw new UsageError(msg.badOption('jobs', 'a whole number from 1 to 64', String(argv.jobs)));
    const outcome = await analyzeJob(argv.job, { out: argv.out, force: argv.force, report: argv.report, svg: argv.svg, jobs: argv.jobs, detect: parseDetect(argv.detect ?? []) }, argv.io);
    argv.io.out(summaryText(outcome));
  },
};
