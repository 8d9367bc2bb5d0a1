// Header defects: every file in shared/fixtures/edf/broken (byte edits of base_for_broken.edf,
// described in each .note.json, EDFlib 1.23 verdict: error) and further edits made here, each
// refused with one InputError line naming the file and the field or byte.
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../lib/errors.js';
import { openRecording } from '../../lib/io/open-recording.js';
import { fixturesDir } from './edf-truth.js';

const brokenDir = join(fixturesDir, 'broken');
const tmp = mkdtempSync(join(tmpdir(), 'shiftload-hdr-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

async function refusal(path: string): Promise<InputError> {
  try {
    const r = await openRecording(path);
    await r.close();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error(`${path} was accepted`);
}

/** base_for_broken.edf with `text` written (space-padded to `width`) at `offset`. */
function edited(name: string, offset: number, text: string | Buffer, width?: number): string {
  const b = Buffer.from(readFileSync(join(fixturesDir, 'base_for_broken.edf')));
  const t = typeof text === 'string' ? Buffer.from(text.padEnd(width ?? text.length, ' '), 'latin1') : text;
  t.copy(b, offset);
  const p = join(tmp, name);
  writeFileSync(p, b);
  return p;
}

describe('openRecording(broken EDF)', () => {
  const broken = readdirSync(brokenDir).filter((f) => f.endsWith('.note.json'));
  it('finds the broken fixtures', () => expect(broken.length).toBeGreaterThan(0));
  for (const note of broken) {
    const file = note.replace(/\.note\.json$/, '');
    it(`openRecording(${file}) throws one InputError line naming the file`, async () => {
      const n = JSON.parse(readFileSync(join(brokenDir, note), 'utf8')) as { edits: { offset?: number }[] };
      const e = await refusal(join(brokenDir, file));
      expect(e.message).toContain(file);
      expect(e.message).not.toContain('\n');
      // when the note names the edited byte range, the message names a byte inside it or the field
      const off = n.edits[0]?.offset;
      if (off !== undefined) expect(e.message).toMatch(/byte \d+/);
    });
  }

  it('a non-ASCII byte in the patient field is named with its offset', async () => {
    const e = await refusal(edited('pat.edf', 8 + 5, Buffer.from([0xe9])));
    expect(e.message).toMatch(/patient identification \(byte 13\) holds byte 0xe9/);
  });
  it('a number that does not parse is named', async () => {
    const e = await refusal(edited('num.edf', 244, '1,0', 8));
    expect(e.message).toMatch(/data record duration \(byte 244\): expected a number, got '1,0'/);
  });
  it('a huge number of signals is checked against the file size before allocating', async () => {
    const e = await refusal(edited('ns.edf', 252, '9999', 4));
    expect(e.message).toMatch(/header of 9999 signals needs 2560000 bytes, file holds only/);
  });
  it('a huge samples-per-record count is refused by the size check', async () => {
    const e = await refusal(edited('spr.edf', 256 + 3 * 216, '99999999', 8));
    expect(e.message).toMatch(/header says 3 data records \(byte 236\), file holds 0/);
  });
  it('record count -1 is computed from the file size', async () => {
    const r = await openRecording(edited('minus1.edf', 236, '-1', 8));
    expect(r.info.duration_s).toBe(3 * r.info.record_duration_s!);
    await r.close();
  });
  it('a missing file, a folder and an empty file are refused', async () => {
    expect((await refusal(join(tmp, 'nope.edf'))).message).toMatch(/nope\.edf: file not found/);
    mkdirSync(join(tmp, 'folder.edf'));
    expect((await refusal(join(tmp, 'folder.edf'))).message).toMatch(/is a folder/);
    writeFileSync(join(tmp, 'empty.edf'), '');
    expect((await refusal(join(tmp, 'empty.edf'))).message).toMatch(/file is empty/);
  });
  it('a file of unknown format is refused', async () => {
    writeFileSync(join(tmp, 'x.dat'), 'hello');
    expect((await refusal(join(tmp, 'x.dat'))).message).toMatch(/unknown recording format/);
  });
});

describe('openRecording(EDF+ with a bad annotation)', () => {
  it('a TAL whose onset is not a number is refused naming the record and byte', async () => {
    const { EdfWriter } = await import('../../lib/io/edf-writer.js');
    const p = join(tmp, 'tal.edf');
    const w = new EdfWriter(p, [{ label: 'A', unit: 'uV', rate_hz: 10, physical_min: -1, physical_max: 1 }], { annotations: [{ onset_s: 1.5, duration_s: null, text: 'lift' }] });
    w.write([new Float64Array(30)]);
    w.close();
    const b = Buffer.from(readFileSync(p));
    const at = b.indexOf('+1.5\x14lift', 0, 'latin1');
    expect(at).toBeGreaterThan(0);
    b.write('x', at, 'latin1');
    writeFileSync(p, b);
    const e = await refusal(p);
    expect(e.message).toBe(`${p}: annotation in data record 2 (byte ${at}): onset 'x1.5' is not a signed number of seconds`);
  });
  it('a record without a time-keeping TAL is refused', async () => {
    const { EdfWriter } = await import('../../lib/io/edf-writer.js');
    const p = join(tmp, 'tk.edf');
    const w = new EdfWriter(p, [{ label: 'A', unit: 'uV', rate_hz: 10, physical_min: -1, physical_max: 1 }]);
    w.write([new Float64Array(30)]);
    w.close();
    const b = Buffer.from(readFileSync(p));
    const at = b.indexOf('+2\x14\x14\x00', 0, 'latin1');
    b.fill(0, at, at + 5);
    writeFileSync(p, b);
    expect((await refusal(p)).message).toMatch(/data record 3 \(byte \d+\) has no time-keeping annotation/);
  });
});

describe('openRecording(EDF+C whose records jump)', () => {
  it('is refused naming the record: a discontinuous file must say EDF+D', async () => {
    const { EdfWriter } = await import('../../lib/io/edf-writer.js');
    const p = join(tmp, 'jump.edf');
    const w = new EdfWriter(p, [{ label: 'A', unit: 'uV', rate_hz: 10, physical_min: -1, physical_max: 1 }]);
    w.write([new Float64Array(40)]);
    w.close();
    const b = Buffer.from(readFileSync(p));
    b.write('+5', b.indexOf('+2\x14\x14\x00', 0, 'latin1'), 'latin1');
    writeFileSync(p, b);
    expect((await refusal(p)).message).toMatch(/data record 3 \(byte \d+\) starts at 5 s by its time-keeping annotation, expected 2 s/);
  });
});
