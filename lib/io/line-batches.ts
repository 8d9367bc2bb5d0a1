// Split a file into lines without reading it whole: blocks of bytes are read into one reused buffer
// and handed out as batches of line boundaries; a line cut by a block edge is carried to the next
// block. Lines end at \n; a trailing \r is dropped. A UTF-8 byte order mark at the start is skipped.
import type { FileHandle } from 'node:fs/promises';

/** A batch of complete lines inside `buf`. Valid until the next batch is requested. */
export interface LineBatch {
  buf: Buffer;
  /** start[i]..end[i] (exclusive) are the bytes of line i, without \r\n. */
  start: Int32Array;
  end: Int32Array;
  count: number;
  /** 1-based line number of line 0 of this batch. */
  firstLine: number;
}

/** Longest line accepted, bytes: a text export never comes near it; a zero-filled or binary file does. */
export const MAX_LINE_BYTES = 1 << 24;

/**
 * Stream the lines of an open file in batches.
 * @param blockBytes bytes per read (the buffer grows only for a single longer line)
 * @param tooLong called (and must throw) when a line exceeds `maxLineBytes`; it gets the 1-based
 *   line number. @default throws a plain Error
 * @param maxLineBytes @default MAX_LINE_BYTES (16 MiB)
 */
export async function* lineBatches(
  fh: FileHandle, blockBytes: number,
  tooLong: (line: number, limit: number) => never = (l, limit) => { throw new Error(`line ${l} is longer than ${limit} bytes`); },
  maxLineBytes = MAX_LINE_BYTES,
): AsyncGenerator<LineBatch> {
  let buf = Buffer.alloc(Math.max(16, blockBytes));
  let cap = 1024;
  let start = new Int32Array(cap);
  let end = new Int32Array(cap);
  let carry = 0; // bytes of an unfinished line at the start of buf
  let pos = 0; // file position of the next read
  let line = 1;
  let first = true;
  for (;;) {
    if (carry === buf.length) {
      if (carry >= maxLineBytes) tooLong(line, maxLineBytes);
      const bigger = Buffer.alloc(buf.length * 2);
      buf.copy(bigger, 0, 0, carry);
      buf = bigger;
    }
    const { bytesRead } = await fh.read(buf, carry, buf.length - carry, pos);
    pos += bytesRead;
    const len = carry + bytesRead;
    const eof = bytesRead === 0;
    let ls = 0;
    if (first && len >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) ls = 3;
    if (first && (len >= 3 || eof)) first = false;
    let n = 0;
    for (let i = ls; i < len; i++) {
      if (buf[i] !== 0x0a) continue;
      if (n === cap) {
        cap *= 2;
        const s2 = new Int32Array(cap); s2.set(start); start = s2;
        const e2 = new Int32Array(cap); e2.set(end); end = e2;
      }
      start[n] = ls;
      end[n] = i > ls && buf[i - 1] === 0x0d ? i - 1 : i;
      n++;
      ls = i + 1;
    }
    if (eof && ls < len) {
      // last line without a newline
      if (n === cap) {
        cap *= 2;
        const s2 = new Int32Array(cap); s2.set(start); start = s2;
        const e2 = new Int32Array(cap); e2.set(end); end = e2;
      }
      start[n] = ls;
      end[n] = len > ls && buf[len - 1] === 0x0d ? len - 1 : len;
      n++;
      ls = len;
    }
    if (n > 0) {
      yield { buf, start, end, count: n, firstLine: line };
      line += n;
    }
    if (eof) return;
    // move the unfinished line to the front
    buf.copy(buf, 0, ls, len);
    carry = len - ls;
  }
}
