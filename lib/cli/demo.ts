// `shiftload demo`: generate the invented parcel-packing study from its simulation spec (nothing
// large is committed), analyze it, and say where the outputs are and what to open first.
import { existsSync, readdirSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import type { CommandModule } from 'yargs';
import { InputError } from '../errors.js';
import { msg } from '../messages.js';
import { generateSampleStudy } from '../sim/generate-sample-study.js';
import { analyzeJob } from './analyze.js';
import type { WithIO } from './cli-io.js';

/** A file that marks a folder as made by `shiftload demo`, so a rerun may refresh it. */
const MARKER = '.shiftload-demo';

type DemoArgs = WithIO & { out: string; full: boolean; force: boolean; report: boolean; seed?: number };

export const demoCommand: CommandModule<object, DemoArgs> = {
  command: 'demo',
  describe: 'Generate an invented sample study (6 workers, 2 benches, 2 muscles), analyze it and write its report',
  builder: (y) => y
    .option('out', { alias: 'o', type: 'string', default: 'shiftload-demo', describe: 'folder for the generated study and its results' })
    .option('full', { type: 'boolean', default: false, describe: 'full 8-hour shifts instead of 25-minute recordings (slower, ~1 GB)' })
    .option('force', { type: 'boolean', default: false, describe: 'use a folder that holds other files' })
    .option('report', { type: 'boolean', default: true, describe: 'write report.pdf (--no-report to skip)' })
    .option('seed', { type: 'number', describe: 'simulation seed (default: the one in the sample spec)' })
    .example('$0 demo', 'generate and analyze the sample study in ./shiftload-demo')
    .example('$0 demo --out /tmp/demo --full', 'the same with 8-hour recordings') as never,
  handler: async (argv) => {
    const io = argv.io;
    const out = resolve(argv.out);
    const ours = existsSync(join(out, MARKER));
    if (existsSync(out) && readdirSync(out).length > 0 && !ours && !argv.force) {
      throw new InputError(msg.outputExists(argv.out), { file: argv.out });
    }
    const data = join(out, 'study');
    io.err(`generating the sample study (${argv.full ? '8-hour' : '25-minute'} recordings) in ${shown(data)} …\n`);
    const gen = await generateSampleStudy({ outDir: data, full: argv.full, seed: argv.seed, force: true });
    writeFileSync(join(out, MARKER), 'made by shiftload demo; a rerun of the demo may replace this folder\n');
    io.err('analyzing …\n');
    const outcome = await analyzeJob(gen.jobPath, { out: join(out, 'results'), force: true, report: argv.report }, io);
    const r = outcome.results;
    const workers = new Set(r.rows.map((x) => x.worker)).size;
    const conditions = [...new Set(r.rows.map((x) => x.condition))];
    const lines = [
      `Sample study: ${r.title}`,
      `  ${workers} workers × ${conditions.length} conditions (${conditions.join(', ')}), ${gen.files.length} recordings, ${r.rows.length} result rows`,
      '',
      'Open first:',
      ...(argv.report ? [`  ${shown(join(outcome.outDir, 'report.pdf'))}   page 1 is the summary for the safety committee`] : []),
      `  ${shown(join(outcome.outDir, 'segments.csv'))}   one row per worker × condition × muscle × task`,
      `  ${shown(join(outcome.outDir, 'results.json'))}   everything, with the settings used and input checksums`,
      '',
      `The study is simulated with known truth: ${shown(gen.truthPath)} holds the designed values,`,
      `and ${shown(gen.jobPath)} is an example job file to copy for your own study.`,
      'Invented company, workers and data; the figures describe muscle load, not anyone\'s injury risk.',
    ];
    io.out(lines.join('\n') + '\n');
  },
};

function shown(p: string): string {
  const r = relative(process.cwd(), p);
  return r && !r.startsWith('..') ? r : p;
}
