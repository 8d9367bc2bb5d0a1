// Where a command writes: the real process streams from the launcher, buffers in tests.

export interface CliIO {
  /** Write to standard output (the command's result). */
  out(text: string): void;
  /** Write to standard error (progress, warnings). */
  err(text: string): void;
  /** True when stderr is a terminal (progress bars are drawn only then). */
  readonly errIsTTY: boolean;
}

export const processIO: CliIO = {
  out: (t) => { process.stdout.write(t); },
  err: (t) => { process.stderr.write(t); },
  get errIsTTY() { return process.stderr.isTTY === true; },
};

/** An IO that keeps everything in memory (tests). */
export function bufferIO(): CliIO & { stdout: string; stderr: string } {
  const io = {
    stdout: '',
    stderr: '',
    errIsTTY: false,
    out(t: string) { io.stdout += t; },
    err(t: string) { io.stderr += t; },
  };
  return io;
}

/** The argv shape every command handler receives: its options plus the IO context. */
export interface WithIO { io: CliIO; debug?: boolean }
