// Worker-thread entry: runs the pool's tasks (lib/study/worker-pool.ts): field recordings
// (processRecording) and input-file hashes.
import { parentPort } from 'node:worker_threads';
import { isUserError } from '../errors.js';
import { transferablesOf } from './process-recording.js';
import { runTask, type PoolTask } from './worker-pool.js';

interface Request { id: number; task: PoolTask }

parentPort!.on('message', (req: Request) => {
  runTask(req.task, (done_s) => parentPort!.postMessage({ id: req.id, progress: done_s })).then(
    (result) => parentPort!.postMessage({ id: req.id, result }, typeof result === 'string' ? [] : transferablesOf(result)),
    (e: unknown) => {
      const err = e as Error;
      parentPort!.postMessage({ id: req.id, error: { message: err?.message ?? String(e), user: isUserError(e), kind: err?.name, file: (e as { file?: string }).file } });
    },
  );
});
