// A job file with one or more problems. The message is the first problem (one line, exit code 2);
// `issues` keeps every problem found in the same pass, for tools that want them all.
import { InputError } from '../errors.js';
import { jobMsg } from '../messages.js';
import { formatKeyPath, type KeyPathStep } from './key-path.js';

/** One problem in a job file. */
export interface JobIssue {
  /** The file as the user named it. */
  file: string;
  /** 1-based line in that file. */
  line: number;
  /** Key path inside the file. */
  path: KeyPathStep[];
  /** What is wrong and what was expected (no file or path). */
  what: string;
  /** The full one-line message: "job.yaml:14 workers[0].id: …". */
  message: string;
}

/** Build an issue (and its message) from its parts. */
export function jobIssue(file: string, line: number, path: KeyPathStep[], what: string): JobIssue {
  return { file, line, path, what, message: jobMsg.at(file, line, formatKeyPath(path), what) };
}

/** An issue at a line of a file that has no key paths (a CSV segment file). */
export function lineIssue(file: string, line: number, what: string): JobIssue {
  return { file, line, path: [], what, message: jobMsg.atLine(file, line, what) };
}

export class JobValidationError extends InputError {
  readonly issues: JobIssue[];
  constructor(issues: JobIssue[]) {
    const first = issues[0];
    super(first.message, { file: first.file, where: `${first.line} ${formatKeyPath(first.path)}` });
    this.name = 'JobValidationError';
    this.issues = issues;
  }
}
