// The list of command modules, one file per command. Add a new command here.
import type { CommandModule } from 'yargs';

import { reportCommand } from './report.js';
import { versionInfoCommand } from './version-info.js';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const commands: CommandModule<any, any>[] = [
  versionInfoCommand,
  reportCommand,
];
