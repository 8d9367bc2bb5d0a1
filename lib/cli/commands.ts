// The list of command modules, one file per command. Add a new command here.
import type { CommandModule } from 'yargs';

import { convertCommand } from './convert.js';
import { inspectCommand } from './inspect.js';
import { reportCommand } from './report.js';
import { versionInfoCommand } from './version-info.js';
import { analyzeCommand } from './analyze.js';
import { checkCommand } from './check.js';
import { compareCommand } from './compare.js';
import { demoCommand } from './demo.js';
import { initCommand } from './init.js';
import { schemaCommand } from './schema.js';
import { simulateCommand } from './simulate.js';
import { spectrumCommand } from './spectrum.js';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
// In the order a user meets them: try it, set up a study, run it, look at files, tools.
export const commands: CommandModule<any, any>[] = [
  demoCommand,
  initCommand,
  checkCommand,
  analyzeCommand,
  reportCommand,
  compareCommand,
  inspectCommand,
  spectrumCommand,
  convertCommand,
  simulateCommand,
  schemaCommand,
  versionInfoCommand,
];
