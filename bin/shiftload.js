#!/usr/bin/env node
// Launcher only: runs the CLI and sets the exit code from its result.
import { main } from '../dist/cli/main.js';

process.stdout.on('error', (e) => {
  if (e && e.code === 'EPIPE') process.exit(0);
  throw e;
});

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (err) => { process.stderr.write(`shiftload: internal error: ${err instanceof Error ? err.message : String(err)}\n`); process.exitCode = 1; },
);
