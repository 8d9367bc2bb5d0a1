// CLI entry: yargs setup over the command modules. Returns the exit code; never calls process.exit,
// so tests call main([...]) in-process with a buffer IO.
//   0 success · 2 bad input or usage (one line on stderr) · 1 unexpected internal error
import yargs from 'yargs';
import { isUserError, UsageError } from '../errors.js';
import { commands } from './commands.js';
import { type CliIO, processIO } from './cli-io.js';
import { toolVersion } from './tool-version.js';

export async function main(args: string[], io: CliIO = processIO): Promise<number> {
  const debug = args.includes('--debug');
  let helpOrVersionShown = false;
  try {
    let y = yargs(args)
      .scriptName('shiftload')
      .usage('$0 <command> [options]\n\nWhole-shift surface-EMG exposure analysis: load envelopes, APDF, muscular rest, reports.')
      .version(toolVersion())
      .exitProcess(false)
      .option('debug', { type: 'boolean', default: false, describe: 'show stack traces of internal errors' })
      .fail((message, err) => {
        if (err) throw err;
        throw new UsageError(message);
      })
      .demandCommand(1, 'name a command; see shiftload --help')
      .recommendCommands()
      .strict()
      .wrap(Math.min(110, process.stdout.columns || 100))
      .help();
    for (const c of commands) y = y.command(c);
    await y.parseAsync(args, { io }, (err, _argv, output) => {
      if (output && !err) {
        helpOrVersionShown = true;
        io.out(output.endsWith('\n') ? output : output + '\n');
      }
    });
    return 0;
  } catch (e) {
    if (isUserError(e)) {
      io.err(`shiftload: ${firstLine(e.message)}\n`);
      return 2;
    }
    const err = e as Error;
    io.err(`shiftload: internal error: ${firstLine(err?.message ?? String(e))}\n`);
    if (debug && err?.stack) io.err(err.stack + '\n');
    else io.err('(run again with --debug for details, and please report it)\n');
    return 1;
  } finally {
    void helpOrVersionShown;
  }
}

function firstLine(s: string): string {
  const i = s.indexOf('\n');
  return i < 0 ? s : s.slice(0, i);
}
