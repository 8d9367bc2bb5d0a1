// Entry point for every recording: checks the path, detects the format (EDF/BDF by magic bytes,
// CSV/TSV by extension) and hands over to the matching reader.
import { open, stat } from 'node:fs/promises';
import { extname } from 'node:path';
import { InputError } from '../errors.js';
import { msg, ioMsg } from '../messages.js';
import { openCsv } from './csv-reader.js';
import { openEdf } from './edf-reader.js';
import type { OpenOptions } from './open-options.js';
import type { Recording } from './recording.js';

export type { OpenOptions } from './open-options.js';

/**
 * Open a recording for streaming. Reads the header (and, for EDF+/BDF+, every annotation) now;
 * samples are read later by `recording.read()`.
 *
 * Formats: EDF/EDF+ (version field "0       "), BDF/BDF+ (0xFF "BIOSEMI"), else CSV/TSV by the
 * extension .csv/.tsv/.txt.
 *
 * @param path the file as the user named it (used in every message)
 * @throws InputError for a missing file, a folder, an empty file, an unknown format and any defect
 *   the readers find (message names the file and the field/byte/line)
 * @example const rec = await openRecording('shift.edf'); console.log(rec.info.signals.length)
 */
export async function openRecording(path: string, options: OpenOptions = {}): Promise<Recording> {
  let size: number;
  try {
    const st = await stat(path);
    if (st.isDirectory()) throw new InputError(msg.notAFile(path), { file: path });
    size = st.size;
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT' || code === 'ENOTDIR') throw new InputError(msg.fileNotFound(path), { file: path });
    throw new InputError(msg.cannotRead(path, code ?? String(e)), { file: path });
  }
  if (size === 0) throw new InputError(msg.emptyFile(path), { file: path });
  let fh;
  try {
    fh = await open(path, 'r');
  } catch (e) {
    throw new InputError(msg.cannotRead(path, (e as NodeJS.ErrnoException).code ?? String(e)), { file: path });
  }
  const magic = Buffer.alloc(8);
  const { bytesRead } = await fh.read(magic, 0, 8, 0);
  const isEdf = bytesRead === 8 && magic.toString('latin1') === '0       ';
  const isBdf = bytesRead === 8 && magic[0] === 0xff && magic.toString('latin1', 1, 8) === 'BIOSEMI';
  if (isEdf || isBdf) return openEdf(path, fh, size, options);
  const ext = extname(path).toLowerCase();
  if (ext === '.csv' || ext === '.tsv' || ext === '.txt') return openCsv(path, fh, size, options);
  if (ext === '.edf' || ext === '.bdf') return openEdf(path, fh, size, options);
  await fh.close();
  throw new InputError(ioMsg.unknownFormat(path), { file: path });
}
