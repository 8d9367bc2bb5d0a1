// SHA-256 of a file, streamed (for the reproducibility block: which exact inputs were analyzed).
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';

/** Hex SHA-256 of the file's bytes, read in 1 MiB pieces. */
export async function sha256File(path: string): Promise<string> {
  const h = createHash('sha256');
  for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 })) h.update(chunk as Buffer);
  return h.digest('hex');
}
