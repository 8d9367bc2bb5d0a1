// Turn an EDF+C file written by EdfWriter (one-second records, the annotation signal last) into
// EDF+D by rewriting the reserved field and the time-keeping TALs of some records, as the EDF+
// spec (Kemp & Olivan 2003) allows for discontinuous recordings. Known truth for the tests.
import { readFileSync, writeFileSync } from 'node:fs';
import { expect } from 'vitest';

/**
 * @param file written by EdfWriter with `signals` data signals and `records` records
 * @param talOffset byte offset of the annotation signal inside a record
 * @param moves [record, new start time in whole seconds] for each record to move
 */
export function makeDiscontinuous(file: string, signals: number, records: number, talOffset: number, moves: [number, number][]): void {
  const b = Buffer.from(readFileSync(file));
  b.write('EDF+D', 192, 'latin1');
  const header = 256 * (signals + 2); // main header + data signals + the annotation signal
  const rec = (b.length - header) / records;
  for (const [r, t] of moves) {
    const at = header + r * rec + talOffset;
    expect(b.toString('latin1', at, at + 2)).toBe(`+${r}`);
    b.write(`+${t}`, at, 'latin1');
  }
  writeFileSync(file, b);
}
