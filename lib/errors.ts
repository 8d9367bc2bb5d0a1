// Typed errors. Only the launcher turns them into exit codes: InputError and UsageError → 2
// (one line on stderr naming the file and field), anything else → 1 (internal error).
// Message texts live in lib/messages.ts; errors only carry them.

/** Bad input data or a bad job file: exit code 2, one line naming the file and the field/line/byte. */
export class InputError extends Error {
  readonly exitCode = 2;
  /** The file the problem is in (as the user named it), if any. */
  readonly file: string | undefined;
  /** The field, key path, line or byte within the file, if known. */
  readonly where: string | undefined;
  constructor(message: string, options: { file?: string; where?: string } = {}) {
    super(message);
    this.name = 'InputError';
    this.file = options.file;
    this.where = options.where;
  }
}

/** Bad command-line usage or an out-of-range parameter: exit code 2. */
export class UsageError extends Error {
  readonly exitCode = 2;
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** True for the errors that mean "the user's input is wrong" (exit code 2). */
export function isUserError(e: unknown): e is InputError | UsageError {
  return e instanceof InputError || e instanceof UsageError;
}
