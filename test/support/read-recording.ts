// Whole-recording reads for the reader tests: every value of every signal, or the one-line
// refusal (an InputError) a bad file gets.
import { expect } from 'vitest';
import { InputError } from '../../lib/errors.js';
import { openRecording } from '../../lib/io/open-recording.js';
import type { OpenOptions } from '../../lib/io/open-options.js';
import type { RecordingInfo } from '../../lib/io/recording.js';

export interface ReadAllOptions {
  /** Span to read, s. @default the whole file */
  span?: { start_s?: number; end_s?: number };
  /** Ask for the signals in reverse order (the arrays come back in the order asked for). @default false */
  reversed?: boolean;
}

/** Every value per signal, in the order asked for, and each chunk's start time. */
export async function readAll(path: string, opts: OpenOptions = {}, o: ReadAllOptions = {}): Promise<{ info: RecordingInfo; data: number[][]; starts: number[] }> {
  const rec = await openRecording(path, opts);
  const data: number[][] = rec.info.signals.map(() => []);
  const starts: number[] = [];
  const order = rec.info.signals.map((s) => s.index);
  if (o.reversed) order.reverse();
  for await (const c of rec.read({ signals: order, ...o.span })) {
    starts.push(c.start_s);
    c.data.forEach((d, j) => data[j]!.push(...d));
  }
  await rec.close();
  return { info: rec.info, data, starts };
}

/** The message of the InputError that reading the file gives (fails the test when it reads fine). */
export async function refusal(path: string, opts: OpenOptions = {}): Promise<string> {
  try {
    await readAll(path, opts);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('accepted');
}
