// Split a file into lines without reading it whole: blocks of bytes are read into one reused buffer
// and handed out as batches of complete lines; a line cut by a block edge is carried to the next
// block. Every line of a batch ends in \n — a last line without one gets a \n appended in the buffer
// — so a parser can run to the \n without bounds checks; the caller splits the batch at the \n
// bytes and drops a \r before them. A UTF-8 byte order mark at the start is skipped.
import type { FileHandle } from 'node:fs/promises';

/** A batch of complete lines: bytes [start, end) of `buf`, buf[end - 1] = \n. Valid until the next batch is requested. */
export interface LineBatch {
  buf: Buffer;
  start: number;
  end: number;
}

/** Longest line accepted, bytes: a text export never comes near it; a zero-filled or binary file does. */
export const MAX_LINE_BYTES = 1 << 24;

/**
 * Stream the lines of an open file in batches of whole lines.
 * @param blockBytes bytes per read (the buffer grows only for a single longer line)
 * @param tooLong called (and must throw) when a line exceeds `maxLineBytes`; the caller knows the
 *   line number (one more than the \n bytes it has seen). @default throws a plain Error
 * @param maxLineBytes @default MAX_LINE_BYTES (16 MiB)
 * @example for await (const b of lineBatches(fh, 1 << 20)) for (let p = b.start; p < b.end; p = b.buf.indexOf(10, p) + 1) { ... }
 */
export async function* lineBatches(
  fh: FileHandle, blockBytes: number,
  tooLong: (limit: number) => never = (limit) => { throw new Error(`a line is longer than ${limit} bytes`); },
  maxLineBytes = MAX_LINE_BYTES,
): AsyncGenerator<LineBatch> {
  let cap = Math.max(16, blockBytes); // bytes read per block; one spare byte for a final \n
  let buf = Buffer.alloc(cap + 1);
  let next = Buffer.alloc(cap + 1); // the block after `buf`, read while the caller parses `buf`
  let carry = 0; // bytes of an unfinished line at the start of buf
  let pos = 0; // file position of the next read
  let first = true;
  let pending: Promise<{ bytesRead: number }> | null = fh.read(buf, 0, cap, 0);
  try {
    for (;;) {
      const { bytesRead }: { bytesRead: number } = await pending!;
      pending = null;
      pos += bytesRead;
      let len: number = carry + bytesRead;
      const eof = bytesRead === 0;
      let ls = 0;
      if (first && len >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) ls = 3;
      if (first && (len >= 3 || eof)) first = false;
      if (eof) {
        // last line without a newline: give it one (the spare byte)
        if (ls < len) {
          if (buf[len - 1] !== 0x0a) buf[len++] = 0x0a;
          yield { buf, start: ls, end: len };
        }
        return;
      }
      const nl = len > ls ? buf.lastIndexOf(0x0a, len - 1) : -1;
      const rest = nl >= ls ? nl + 1 : ls; // start of the unfinished line
      // the unfinished line goes to the front of the next buffer, which is then filled from the file
      if (len - rest === cap) {
        if (cap >= maxLineBytes) tooLong(maxLineBytes);
        cap *= 2;
      }
      if (next.length < cap + 1) next = Buffer.alloc(cap + 1);
      buf.copy(next, 0, rest, len);
      carry = len - rest;
      pending = fh.read(next, carry, cap - carry, pos);
      if (nl >= ls) yield { buf, start: ls, end: nl + 1 };
      const t = buf;
      buf = next;
      next = t;
    }
  } finally {
    // a caller that stops early (break, error) must not leave a read running into the buffers
    if (pending) await pending.catch(() => undefined);
  }
}
