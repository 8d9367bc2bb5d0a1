// `shiftload schema`: print the job file's JSON Schema, for editors that validate and complete YAML.
import type { CommandModule } from 'yargs';
import type { WithIO } from './cli-io.js';
import { jobSchema } from '../job/job-schema.js';

export const schemaCommand: CommandModule<object, WithIO> = {
  command: 'schema',
  describe: 'Print the JSON Schema of job files (for editor validation and completion)',
  builder: (y) => y
    .example('$0 schema > shiftload-job.schema.json', 'save the schema for your editor')
    .example('$0 schema | head', 'look at the top of it') as never,
  handler: (argv) => {
    argv.io.out(JSON.stringify(jobSchema, null, 2) + '\n');
  },
};
