// SHA-256 of a file, streamed (for the reproducibility block: which exact inputs were analyzed).
import { createHash } from 'node:crypto';
import { open } from 'node:fs/promises';

/** Bytes per read; one buffer is reused for the whole file (no allocation per piece). */
const PIECE = 4 << 20;

/** Hex SHA-256 of the file's bytes, read in 4 MiB pieces into one reused buffer. */
export async function sha256File(path: string): Promise<string> {
  const h = createHash('sha256');
  const fh = await open(path, 'r');
  try {
    const buf = Buffer.allocUnsafe(PIECE);
    let pos = 0;
    for (;;) {
      const { bytesRead } = await fh.read(buf, 0, PIECE, pos);
      if (bytesRead === 0) break;
      h.update(buf.subarray(0, bytesRead));
      pos += bytesRead;
    }
  } finally {
    await fh.close();
  }
  return h.digest('hex');
}
