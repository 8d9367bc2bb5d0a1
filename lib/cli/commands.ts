// The list of command modules, one file per command. Add a new command here.
import type { CommandModule } from 'yargs';

import { convertCommand } from './convert.js';
import { inspectCommand } from './inspect.js';
import { versionInfoCommand } from './version-info.js';
import { analyzeCommand } from './analyze.js';
import { checkCommand } from './check.js';
import { demoCommand } from './demo.js';
import { initCommand } from './init.js';
import { schemaCommand } from './schema.js';
import { simulateCommand } from './simulate.js';
import { spectrumCommand } from './spectrum.js';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const commands: CommandModule<any, any>[] = [
  versionInfoCommand,
  initCommand,
  checkCommand,
  analyzeCommand,
  demoCommand,
  schemaCommand,
  inspectCommand,
  convertCommand,
  spectrumCommand,
  simulateCommand,
];
