// `shiftload init [DIR]`: write a commented template job.yaml to start a study from.
import { mkdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import type { CommandModule } from 'yargs';
import { InputError } from '../errors.js';
import { jobMsg } from '../messages.js';
import { writeAtomic } from '../io/write-atomic.js';
import type { WithIO } from './cli-io.js';

/** Text of the shipped job template (templates/job-template.yaml). */
export function jobTemplateText(): string {
  return readFileSync(new URL('../../templates/job-template.yaml', import.meta.url), 'utf8');
}

export const initCommand: CommandModule<object, WithIO & { dir: string; force: boolean }> = {
  command: 'init [dir]',
  describe: 'Write a commented template job.yaml to start a study',
  builder: (y) => y
    .positional('dir', { type: 'string', default: '.', describe: 'folder for job.yaml (created if missing)' })
    .option('force', { type: 'boolean', default: false, describe: 'overwrite an existing job.yaml' })
    .example('$0 init', 'write ./job.yaml')
    .example('$0 init studies/packing', 'write studies/packing/job.yaml')
    .example('$0 init --force', 'replace an existing ./job.yaml with the template') as never,
  handler: (argv) => {
    const dir = argv.dir;
    let st;
    try { st = statSync(dir); } catch { st = null; }
    if (st && !st.isDirectory()) throw new InputError(jobMsg.initNotFolder(dir), { file: dir });
    if (!st) mkdirSync(dir, { recursive: true });
    const target = join(dir, 'job.yaml');
    let exists = false;
    try { exists = statSync(target) !== null; } catch { exists = false; }
    if (exists && !argv.force) throw new InputError(jobMsg.initExists(target), { file: target });
    writeAtomic(target, jobTemplateText());
    const shown = relative(process.cwd(), target) || target;
    argv.io.out(
      `wrote ${shown}\n`
      + 'next:\n'
      + '  1. put your recordings (EDF, EDF+, BDF, BDF+ or CSV) beside it, or write paths relative to it\n'
      + '  2. edit title, workers, files, signal labels and segments (the comments say what each key means)\n'
      + `  3. shiftload check ${shown}   (validates everything without analysing)\n`,
    );
  },
};

