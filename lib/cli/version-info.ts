// `shiftload about`: tool version, Node version and where templates live (for bug reports).
import type { CommandModule } from 'yargs';
import type { WithIO } from './cli-io.js';
import { toolVersion } from './tool-version.js';

export const versionInfoCommand: CommandModule<object, WithIO & { json?: boolean }> = {
  command: 'about',
  describe: 'Print the tool version and runtime, for bug reports and methods sections',
  builder: (y) => y
    .option('json', { type: 'boolean', default: false, describe: 'print one JSON object' })
    .example('$0 about', 'show version information')
    .example('$0 about --json', 'the same as JSON') as never,
  handler: (argv) => {
    const info = { name: 'shiftload', version: toolVersion(), node: process.version, platform: `${process.platform}-${process.arch}` };
    if (argv.json) argv.io.out(JSON.stringify(info, null, 2) + '\n');
    else argv.io.out(`shiftload ${info.version} (Node ${info.node}, ${info.platform})\n`);
  },
};
