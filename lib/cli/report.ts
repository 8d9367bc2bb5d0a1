// `shiftload report RESULTS.json [-o report.pdf] [--svg DIR]`: render the exposure report (PDF)
// from a results file written by `analyze`. The report code (pdf-lib, fontkit) loads lazily.
import { readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import type { CommandModule } from 'yargs';
import { InputError } from '../errors.js';
import { writeAtomic } from '../io/write-atomic.js';
import { msg, reportMsg } from '../messages.js';
import { assertResults } from '../report/assert-results.js';
import type { StudyResults } from '../study/results.js';
import type { WithIO } from './cli-io.js';

interface ReportArgs extends WithIO { results: string; output?: string; svg?: string }

/** Read and validate a results file; InputError naming the file (and field) on any problem. */
export async function readResultsFile(file: string): Promise<StudyResults> {
  let text: string;
  try {
    if (statSync(file).isDirectory()) throw new InputError(msg.notAFile(file), { file });
    text = readFileSync(file, 'utf8');
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(code === 'ENOENT' ? msg.fileNotFound(file) : msg.cannotRead(file, code ?? String(e)), { file });
  }
  if (text.trim() === '') throw new InputError(msg.emptyFile(file), { file });
  let value: unknown;
  try { value = JSON.parse(text); } catch (e) { throw new InputError(reportMsg.notJson(file, (e as Error).message.split('\n')[0]), { file }); }
  assertResults(value, file);
  return value;
}

export const reportCommand: CommandModule<object, ReportArgs> = {
  command: 'report <results>',
  describe: 'Render the exposure report (PDF, optional SVG charts) from a results.json',
  builder: (y) => y
    .positional('results', { type: 'string', demandOption: true, describe: 'results file written by analyze (shiftload-results/1)' })
    .option('output', { alias: 'o', type: 'string', describe: 'PDF to write (default: report.pdf beside the results file)' })
    .option('svg', { type: 'string', describe: 'also write every chart as an SVG file into this folder' })
    .example('$0 report out/results.json', 'write out/report.pdf')
    .example('$0 report out/results.json -o bench-trial.pdf', 'choose the PDF file name')
    .example('$0 report out/results.json --svg out/charts', 'also write the charts as SVG (for slides)') as never,
  handler: async (argv) => {
    const started = performance.now();
    const results = await readResultsFile(argv.results);
    const out = argv.output ?? join(dirname(argv.results), 'report.pdf');
    if (resolve(out) === resolve(argv.results)) throw new InputError(msg.outputIsInput(out), { file: out });
    const { renderReportInfo } = await import('../report/render-report.js');
    const r = await renderReportInfo(results, { svgDir: argv.svg });
    writeAtomic(out, r.bytes);
    argv.io.err(reportMsg.wrote(out, r.pageCount, Math.round(performance.now() - started)));
    if (argv.svg) argv.io.err(reportMsg.wroteSvg(argv.svg, r.svgFiles.length));
  },
};
