// Writing an analysis' outputs into a folder: results.json, segments.csv (and the report, when the
// caller passes a renderer). Each file is written atomically, so a killed run leaves the previous
// outputs intact (and its temporary files are removed by the next run); an existing non-empty folder is reused only when asked (--force), and no output
// may overwrite an input.
import { existsSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { InputError } from '../errors.js';
import { removeStaleTemps, writeAtomicSet } from '../io/write-atomic.js';
import { msg } from '../messages.js';
import type { StudyResults } from './results.js';
import { rowsToCsv } from './rows-csv.js';
import { stableJson } from './stable-json.js';

export interface OutputFolderOptions {
  /** Reuse a folder that already holds files. */
  force: boolean;
  /** Absolute paths of every input; none may be overwritten. */
  inputs: string[];
}

/** The fixed names of the files an analysis writes. */
export const OUTPUT_NAMES = { results: 'results.json', rows: 'segments.csv', report: 'report.pdf' } as const;

/**
 * Make sure `dir` can take the outputs: create it, or accept it when empty or with `force`.
 * @throws InputError when the folder is a file, is not empty without force, or an output would
 *   overwrite an input
 */
export function prepareOutputFolder(dir: string, options: OutputFolderOptions): void {
  const abs = resolve(dir);
  if (existsSync(abs)) {
    if (!statSync(abs).isDirectory()) throw new InputError(msg.outputNotFolder(dir), { file: dir });
    // temporary files of a killed earlier run are not outputs: remove them first
    removeStaleTemps(abs, Object.values(OUTPUT_NAMES));
    if (!options.force && readdirSync(abs).length > 0) throw new InputError(msg.outputExists(dir), { file: dir });
  } else {
    mkdirSync(abs, { recursive: true });
  }
  const inputs = new Set(options.inputs.map((p) => resolve(p)));
  for (const name of Object.values(OUTPUT_NAMES)) {
    const target = join(abs, name);
    if (inputs.has(target)) throw new InputError(msg.outputIsInput(target), { file: target });
  }
}

/**
 * Write results.json and segments.csv (and report.pdf when `reportPdf` is given) into `dir` as one
 * set: all are written and synced under temporary names, then renamed into place together
 * (writeAtomicSet). Returns the paths written.
 */
export function writeStudyOutputs(dir: string, results: StudyResults, reportPdf?: Uint8Array): { results: string; rows: string; report?: string } {
  const r = join(dir, OUTPUT_NAMES.results);
  const c = join(dir, OUTPUT_NAMES.rows);
  const p = join(dir, OUTPUT_NAMES.report);
  writeAtomicSet([
    { target: r, data: stableJson(results) },
    { target: c, data: rowsToCsv(results.rows) },
    ...(reportPdf !== undefined ? [{ target: p, data: reportPdf }] : []),
  ]);
  return { results: r, rows: c, ...(reportPdf !== undefined ? { report: p } : {}) };
}
