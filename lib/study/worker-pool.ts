// A fixed pool running processRecording on `size` threads: size − 1 worker threads plus this
// thread itself (which would otherwise only wait for results: one isolate fewer, about 30 MB,
// and no idle core). Jobs are queued and handed to the first free worker, this thread's slot
// last; results from workers come back as transferred buffers. Errors keep their kind (a user
// error stays an InputError, exit code 2). With size 0 or 1 every job simply runs inline.
import { Worker } from 'node:worker_threads';
import { InputError } from '../errors.js';
import { sha256File } from '../io/sha256-file.js';
import { processRecording, type RecordingJob, type RecordingJobResult } from './process-recording.js';

/** What a pool thread can be asked to do: one field recording, or the SHA-256 of an input file. */
export type PoolTask = { kind: 'recording'; job: RecordingJob } | { kind: 'hash'; file: string };

/** Run one task on this thread (the worker threads' entry does the same). */
export function runTask(task: PoolTask, onProgress?: (done_s: number) => void): Promise<RecordingJobResult | string> {
  return task.kind === 'hash' ? sha256File(task.file) : processRecording(task.job, onProgress);
}

interface Pending {
  id: number;
  task: PoolTask;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  resolve: (r: any) => void;
  reject: (e: Error) => void;
  onProgress?: (done_s: number) => void;
}

/** Where the compiled worker lives (tests run the TypeScript sources; the worker needs dist/). */
function workerUrl(): URL {
  return import.meta.url.endsWith('.ts')
    ? new URL('../../dist/study/recording-worker.js', import.meta.url)
    : new URL('./recording-worker.js', import.meta.url);
}

export class RecordingPool {
  private readonly workers: Worker[] = [];
  private readonly idle: Worker[] = [];
  private readonly queue: Pending[] = [];
  private readonly running = new Map<Worker, Pending>();
  private nextId = 1;
  /** True while this thread runs a queued job itself. */
  private inlineBusy = false;
  private closed = false;

  /** @param size threads working at once, this one included; 0 or 1 = run every job inline */
  constructor(readonly size: number) {
    for (let i = 0; i < size - 1; i++) {
      const w = new Worker(workerUrl());
      w.on('message', (m: { id: number; progress?: number; result?: RecordingJobResult | string; error?: { message: string; user: boolean; file?: string } }) => {
        const p = this.running.get(w);
        if (!p || p.id !== m.id) return;
        if (m.progress !== undefined) { p.onProgress?.(m.progress); return; }
        this.running.delete(w);
        this.idle.push(w);
        if (m.error) p.reject(m.error.user ? new InputError(m.error.message, { file: m.error.file }) : new Error(m.error.message));
        else p.resolve(m.result!);
        this.pump();
      });
      w.on('error', (e) => {
        const p = this.running.get(w);
        if (p) { this.running.delete(w); p.reject(e); }
      });
      this.workers.push(w);
      this.idle.push(w);
    }
  }

  /** Run one recording job (queued when every thread is busy). */
  run(job: RecordingJob, onProgress?: (done_s: number) => void): Promise<RecordingJobResult> {
    return this.submit({ kind: 'recording', job }, onProgress) as Promise<RecordingJobResult>;
  }

  /**
   * The hex SHA-256 of a file, computed by the first free thread (queued behind the recording
   * jobs submitted before it, so it fills a thread that would otherwise wait).
   */
  hash(file: string): Promise<string> {
    return this.submit({ kind: 'hash', file }) as Promise<string>;
  }

  private submit(task: PoolTask, onProgress?: (done_s: number) => void): Promise<RecordingJobResult | string> {
    if (this.size <= 1) return runTask(task, onProgress);
    if (this.closed) return Promise.reject(new Error('recording pool closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ id: this.nextId++, task, resolve, reject, onProgress });
      this.pump();
    });
  }

  private pump(): void {
    while (this.idle.length > 0 && this.queue.length > 0) {
      const w = this.idle.pop()!;
      const p = this.queue.shift()!;
      this.running.set(w, p);
      w.postMessage({ id: p.id, task: p.task });
    }
    if (!this.inlineBusy && this.queue.length > 0) {
      const p = this.queue.shift()!;
      this.inlineBusy = true;
      // started on the next turn, so every job queued now reaches a worker first
      setImmediate(() => {
        // after close() the job stops at its next chunk (as terminate() stops a worker)
        const progress = (d: number) => {
          if (this.closed) throw new Error('recording pool closed');
          p.onProgress?.(d);
        };
        (this.closed ? Promise.reject(new Error('recording pool closed')) : runTask(p.task, progress)).then(p.resolve, p.reject).finally(() => {
          this.inlineBusy = false;
          this.pump();
        });
      });
    }
  }

  /** Stop every worker (and a job this thread is running, at its next chunk). */
  async close(): Promise<void> {
    this.closed = true;
    const stopped = new Error('recording pool closed');
    for (const p of this.queue.splice(0)) p.reject(stopped);
    for (const p of this.running.values()) p.reject(stopped);
    this.running.clear();
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
