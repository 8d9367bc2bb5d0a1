// Worker-thread entry: runs processRecording for the pool (lib/study/worker-pool.ts).
import { parentPort } from 'node:worker_threads';
import { isUserError } from '../errors.js';
import { processRecording, transferablesOf, type RecordingJob } from './process-recording.js';

interface Request { id: number; job: RecordingJob }

parentPort!.on('message', (req: Request) => {
  processRecording(req.job, (done_s) => parentPort!.postMessage({ id: req.id, progress: done_s })).then(
    (result) => parentPort!.postMessage({ id: req.id, result }, transferablesOf(result)),
    (e: unknown) => {
      const err = e as Error;
      parentPort!.postMessage({ id: req.id, error: { message: err?.message ?? String(e), user: isUserError(e), kind: err?.name, file: (e as { file?: string }).file } });
    },
  );
});
