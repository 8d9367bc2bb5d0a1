// EDF+ time-stamped annotation lists (TALs) of one data record:
//   +onset[\x15duration]\x14text\x14[text\x14…]\x00   (Kemp & Olivan 2003, EDF+ spec §2.2)
// The first TAL of each record is the time-keeping TAL (empty first text) giving the record start.
import type { Annotation } from './recording.js';
import { InputError } from '../errors.js';
import { ioMsg } from '../messages.js';

const ONSET_RE = /^[+-]\d+(\.\d*)?$/;
const DURATION_RE = /^\d+(\.\d*)?$/;

/**
 * Parse the annotation bytes of one data record (all annotation signals, in file order).
 *
 * @param bytes buffer holding the bytes
 * @param start first byte of this record's annotation bytes in `bytes`
 * @param end end (exclusive)
 * @param fileOffset byte offset of `start` in the file (for messages)
 * @param out annotations found are appended here (onset as written, relative to the file start time)
 * @param timekeeping true for the first annotation signal of a record, whose first TAL keeps time
 * @returns the record's start time in s from its time-keeping TAL (NaN when `timekeeping` is false)
 * @throws InputError naming the record and byte on a syntax error or a missing time-keeping TAL
 */
export function parseTals(file: string, record: number, bytes: Uint8Array, start: number, end: number, fileOffset: number, out: Annotation[], timekeeping = true): number {
  let pos = start;
  let recordStart = NaN;
  let first = timekeeping;
  const fail = (at: number, what: string): never => {
    throw new InputError(ioMsg.talSyntax(file, record, fileOffset + (at - start), what), { file });
  };
  while (pos < end) {
    if (bytes[pos] === 0) { pos++; continue; }
    let talEnd = pos;
    while (talEnd < end && bytes[talEnd] !== 0) talEnd++;
    if (talEnd >= end) fail(pos, 'TAL not terminated by a 0x00 byte');
    // onset
    let p = pos;
    while (p < talEnd && bytes[p] !== 0x15 && bytes[p] !== 0x14) p++;
    const onsetText = latin1(bytes, pos, p);
    if (!ONSET_RE.test(onsetText)) fail(pos, `onset '${onsetText}' is not a signed number of seconds`);
    const onset = Number(onsetText);
    let duration: number | null = null;
    if (bytes[p] === 0x15) {
      const d0 = p + 1;
      p = d0;
      while (p < talEnd && bytes[p] !== 0x14) p++;
      const durText = latin1(bytes, d0, p);
      if (durText.length > 0) {
        if (!DURATION_RE.test(durText)) fail(d0, `duration '${durText}' is not a number of seconds`);
        duration = Number(durText);
      }
    }
    if (p >= talEnd || bytes[p] !== 0x14) fail(p, 'expected 0x14 after the onset');
    if (bytes[talEnd - 1] !== 0x14) fail(talEnd - 1, 'TAL must end with 0x14 before 0x00');
    // texts between 0x14 separators
    let t0 = p + 1;
    let textIndex = 0;
    for (let q = t0; q < talEnd; q++) {
      if (bytes[q] !== 0x14) continue;
      if (first && textIndex === 0) {
        if (q !== t0) fail(t0, 'the first TAL of a record must be a time-keeping TAL with empty text');
        recordStart = onset;
      } else if (q > t0) {
        out.push({ onset_s: onset, duration_s: duration, text: Buffer.from(bytes.buffer, bytes.byteOffset + t0, q - t0).toString('utf8') });
      }
      textIndex++;
      t0 = q + 1;
    }
    first = false;
    pos = talEnd + 1;
  }
  if (timekeeping && Number.isNaN(recordStart)) throw new InputError(ioMsg.noTimekeeping(file, record, fileOffset), { file });
  return recordStart;
}

function latin1(bytes: Uint8Array, a: number, b: number): string {
  let s = '';
  for (let i = a; i < b; i++) s += String.fromCharCode(bytes[i]);
  return s;
}
