// `shiftload compare A.json B.json`: two separately analyzed studies (before and after a change made
// months apart) compared worker by worker, for every task × muscle × measure, where the same
// workers appear in both. Rows of like-named conditions are compared (or the two named ones).
import { readFileSync } from 'node:fs';
import type { CommandModule } from 'yargs';
import { InputError, UsageError } from '../errors.js';
import { msg } from '../messages.js';
import { compareConditions } from '../study/compare-conditions.js';
import { parseDetect, planComparisons, type DetectTargets } from '../study/plan-comparisons.js';
import type { Comparison, ResultRow, StudyResults } from '../study/results.js';
import { stableJson } from '../study/stable-json.js';
import { writeAtomic } from '../io/write-atomic.js';
import type { WithIO } from './cli-io.js';

export interface CompareStudiesOptions {
  /** Names of the two studies in statements. @default 'A' / 'B' */
  label_a?: string;
  label_b?: string;
  /** Condition of study A (and B) to use; default: every condition present in both. */
  condition_a?: string;
  condition_b?: string;
  measures?: string[];
  detect?: DetectTargets;
  seed?: number;
}

export interface StudiesComparison {
  format: 'shiftload-comparison/1';
  study_a: { title: string; file: string; condition: string };
  study_b: { title: string; file: string; condition: string };
  comparisons: Comparison[];
}

/** Read a results.json, checking only what the comparison needs. */
export function readResults(file: string): StudyResults {
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw new InputError(msg.fileNotFound(file), { file });
    if (code === 'EISDIR') throw new InputError(msg.notAFile(file), { file });
    throw new InputError(msg.notResults(file, `not valid JSON (${(e as Error).message})`), { file });
  }
  const r = data as Partial<StudyResults>;
  if (!r || typeof r !== 'object' || r.format !== 'shiftload-results/1') throw new InputError(msg.notResults(file, "field format: expected 'shiftload-results/1'"), { file });
  if (!Array.isArray(r.rows)) throw new InputError(msg.notResults(file, 'field rows: expected a list'), { file });
  return r as StudyResults;
}

/**
 * Compare two studies: rows of A's condition become condition `label_a`, B's become `label_b`,
 * then the usual paired comparison runs (workers matched by id).
 * @throws UsageError when the named conditions are missing or the studies share no condition
 */
export function compareStudies(a: StudyResults, b: StudyResults, files: [string, string], o: CompareStudiesOptions = {}): StudiesComparison[] {
  const la = o.label_a ?? 'A';
  const lb = o.label_b ?? 'B';
  if (la === lb) throw new UsageError(msg.badOption('label-b', 'a label different from --label-a', la));
  const condsA = [...new Set(a.rows.map((r) => r.condition))];
  const condsB = [...new Set(b.rows.map((r) => r.condition))];
  let pairs: [string, string][];
  if (o.condition_a !== undefined || o.condition_b !== undefined) {
    const ca = o.condition_a ?? o.condition_b!;
    const cb = o.condition_b ?? o.condition_a!;
    if (!condsA.includes(ca)) throw new UsageError(msg.badOption('condition-a', `a condition of ${files[0]} (${condsA.join(', ')})`, ca));
    if (!condsB.includes(cb)) throw new UsageError(msg.badOption('condition-b', `a condition of ${files[1]} (${condsB.join(', ')})`, cb));
    pairs = [[ca, cb]];
  } else {
    pairs = condsA.filter((c) => condsB.includes(c)).map((c) => [c, c]);
    if (pairs.length === 0) {
      if (condsA.length === 1 && condsB.length === 1) pairs = [[condsA[0]!, condsB[0]!]];
      else throw new UsageError(msg.badOption('condition-a', `a condition to compare: the studies share none (${condsA.join(', ')} / ${condsB.join(', ')})`, 'none given'));
    }
  }
  return pairs.map(([ca, cb]) => {
    const rows: ResultRow[] = [
      ...a.rows.filter((r) => r.condition === ca).map((r) => ({ ...r, condition: la })),
      ...b.rows.filter((r) => r.condition === cb).map((r) => ({ ...r, condition: lb })),
    ];
    const comparisons = planComparisons(compareConditions(rows, { measures: o.measures, seed: o.seed, condition_pairs: [[la, lb]] }), o.detect);
    return {
      format: 'shiftload-comparison/1' as const,
      study_a: { title: a.title, file: files[0], condition: ca },
      study_b: { title: b.title, file: files[1], condition: cb },
      comparisons,
    };
  });
}

/** Plain text: one line per comparison, grouped by task and muscle. */
export function comparisonText(result: StudiesComparison[]): string {
  const lines: string[] = [];
  for (const r of result) {
    lines.push(`${r.study_a.title} [${r.study_a.condition}] → ${r.study_b.title} [${r.study_b.condition}]`);
    let group = '';
    for (const c of r.comparisons) {
      const g = `${c.muscle}, ${c.segment}`;
      if (g !== group) { lines.push(`  ${g}`); group = g; }
      let line = `    ${c.statement}`;
      if (c.planning) {
        line += ` [could detect about ${c.planning.detectable_difference.toPrecision(2)} ${c.unit} with ${c.planning.n} workers`;
        if (c.planning.workers_needed !== null) line += `; ${c.planning.workers_needed} workers to detect ${c.planning.detect} ${c.unit}`;
        line += ']';
      }
      lines.push(line);
    }
  }
  lines.push('', 'Differences describe muscle load in these workers, not anyone\'s injury risk; decisions belong to occupational-health professionals.');
  return lines.join('\n') + '\n';
}

type CompareArgs = WithIO & {
  a: string; b: string; 'label-a': string; 'label-b': string; 'condition-a'?: string; 'condition-b'?: string;
  measures?: string; detect?: string[]; json: boolean; out?: string; seed: number;
};

export const compareCommand: CommandModule<object, CompareArgs> = {
  command: 'compare <a> <b>',
  describe: 'Compare two analyzed studies (before and after a change) worker by worker',
  builder: (y) => y
    .positional('a', { type: 'string', demandOption: true, describe: 'results.json of the first study (before)' })
    .positional('b', { type: 'string', demandOption: true, describe: 'results.json of the second study (after)' })
    .option('label-a', { type: 'string', default: 'before', describe: 'name of the first study in statements' })
    .option('label-b', { type: 'string', default: 'after', describe: 'name of the second study in statements' })
    .option('condition-a', { type: 'string', describe: 'condition of the first study to use (default: like-named conditions)' })
    .option('condition-b', { type: 'string', describe: 'condition of the second study to use' })
    .option('measures', { type: 'string', describe: 'comma-separated measures (default p10,p50,p90,gaps_per_min,rest_pct)' })
    .option('detect', { type: 'string', array: true, describe: 'plan for a difference: 2 (median load), p90=5, gaps_per_min=1' })
    .option('seed', { type: 'number', default: 1, describe: 'bootstrap seed' })
    .option('json', { type: 'boolean', default: false, describe: 'print the comparison as JSON' })
    .option('out', { alias: 'o', type: 'string', describe: 'also write the JSON to this file' })
    .example('$0 compare 2025/results/results.json 2026/results/results.json', 'before vs after, like-named conditions')
    .example('$0 compare old.json new.json --condition-a bench-fixed --condition-b bench-adjustable --detect 2', 'named conditions, with the workers needed to detect 2 %MVE') as never,
  handler: (argv) => {
    const a = readResults(argv.a);
    const b = readResults(argv.b);
    const result = compareStudies(a, b, [argv.a, argv.b], {
      label_a: argv['label-a'], label_b: argv['label-b'], condition_a: argv['condition-a'], condition_b: argv['condition-b'],
      measures: argv.measures?.split(',').map((m) => m.trim()).filter(Boolean), detect: parseDetect(argv.detect ?? []), seed: argv.seed,
    });
    if (argv.out) {
      if ([argv.a, argv.b].includes(argv.out)) throw new InputError(msg.outputIsInput(argv.out), { file: argv.out });
      writeAtomic(argv.out, stableJson(result));
    }
    argv.io.out(argv.json ? stableJson(result) : comparisonText(result));
  },
};
