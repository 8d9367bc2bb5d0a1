// Shared state of one job load: where issues go (with lines), how input files are checked, and
// the recording describer with its cache (each file is opened once per load).
import { realpathSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError } from '../errors.js';
import { jobMsg } from '../messages.js';
import type { DescribeRecording, RecordingDescription } from './describe-recording.js';
import { jobIssue, JobValidationError, type JobIssue } from './job-validation-error.js';
import { formatKeyPath, type KeyPathStep } from './key-path.js';

/** Slack for comparing times read from files (EDF+ stores 100 ns ticks), s. */
export const TIME_EPS = 1e-9;

/** Shared state of one load: where issues go, how files are checked and described (cached). */
export class JobContext {
  readonly issues: JobIssue[] = [];
  readonly baseDir: string;
  private readonly described = new Map<string, Promise<RecordingDescription | Error>>();
  private readonly jobReal: string;
  constructor(
    readonly shown: string,
    readonly jobFile: string,
    readonly lineOf: (p: readonly KeyPathStep[]) => number,
    private readonly describeFn: DescribeRecording,
  ) {
    this.baseDir = dirname(jobFile);
    this.jobReal = realpathSync(jobFile);
  }

  issue(path: KeyPathStep[], what: string): void {
    this.issues.push(jobIssue(this.shown, this.lineOf(path), path, what));
  }

  /** "line 12 (workers[0].id)": points at an earlier place in the job file. */
  where(path: KeyPathStep[]): string {
    return `line ${this.lineOf(path)} (${formatKeyPath(path)})`;
  }

  throwIfAny(): void {
    if (this.issues.length > 0) {
      const sorted = this.issues.map((x, i) => ({ x, i }))
        .sort((a, b) => (a.x.file === b.x.file ? 0 : a.x.file === this.shown ? -1 : 1) || a.x.line - b.x.line || a.i - b.i)
        .map((o) => o.x);
      throw new JobValidationError(sorted);
    }
  }

  /**
   * Check that a path written at `path` is an existing file other than the job file; return its
   * absolute path, or null (with an issue) when it is not usable.
   */
  inputFile(written: string, path: KeyPathStep[]): string | null {
    const abs = resolve(this.baseDir, written);
    let st;
    try { st = statSync(abs); } catch {
      this.issue(path, jobMsg.fileMissing(written));
      return null;
    }
    if (st.isDirectory()) { this.issue(path, jobMsg.fileIsFolder(written)); return null; }
    if (!st.isFile()) { this.issue(path, jobMsg.fileMissing(written)); return null; }
    if (realpathSync(abs) === this.jobReal) { this.issue(path, jobMsg.fileIsJob(written)); return null; }
    return abs;
  }

  /** Header facts of a file (each file described once); null with an issue when unreadable. */
  async describe(abs: string, written: string, path: KeyPathStep[], rate_hz: number | null): Promise<RecordingDescription | null> {
    const key = `${abs}\u0000${rate_hz ?? ''}`;
    let p = this.described.get(key);
    if (!p) {
      p = this.describeFn(abs, rate_hz === null ? {} : { rate_hz }).catch((e: unknown) => (e instanceof Error ? e : new Error(String(e))));
      this.described.set(key, p);
    }
    const d = await p;
    if (d instanceof Error) {
      if (!(d instanceof InputError)) throw d;
      // The reader names the absolute path; the user wrote a relative one.
      const reason = d.message.split(`${abs}: `).join('').split(abs).join(written);
      this.issue(path, jobMsg.cannotDescribe(written, reason));
      return null;
    }
    return d;
  }
}
