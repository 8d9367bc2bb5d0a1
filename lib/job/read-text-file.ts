// Read a small text input (job file, segment CSV): must exist, be a file, fit the size limit and
// be UTF-8.
import { readFileSync, statSync } from 'node:fs';
import { InputError } from '../errors.js';
import { jobMsg, msg } from '../messages.js';

/**
 * Read a text file whole.
 * @param abs absolute path
 * @param shown the path as the user wrote it (messages)
 * @param maxBytes size limit, bytes
 * @throws InputError for a missing file, a folder, an empty or oversized file, or non-UTF-8 bytes
 */
export function readTextFile(abs: string, shown: string, maxBytes: number): string {
  let st;
  try { st = statSync(abs); } catch { throw new InputError(msg.fileNotFound(shown), { file: shown }); }
  if (st.isDirectory()) throw new InputError(msg.notAFile(shown), { file: shown });
  if (st.size > maxBytes) throw new InputError(jobMsg.tooLarge(shown, maxBytes), { file: shown });
  if (st.size === 0) throw new InputError(msg.emptyFile(shown), { file: shown });
  const bytes = readFileSync(abs);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new InputError(jobMsg.notUtf8(shown), { file: shown });
  }
}
