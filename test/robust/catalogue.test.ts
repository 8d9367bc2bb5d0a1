// The bad-input catalogue (DEVELOPERS.md, "Bad input and faults"), the classes not already covered elsewhere:
// each damaged input gives exit 2 and one stderr line naming the file and the field, line or byte —
// or, when the data can still be used, exit 0 with a finding in results.json. Classes covered by
// other tests are listed in that catalogue with the test file that covers them.
import { fixtureJobYaml } from '../support/fixture-job.js';
import { copyFileSync, mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { edfFields } from '../../lib/robust/mutate.js';
import { scratchDir } from '../../lib/robust/scratch-dir.js';
import { SHARED_EDF_DIR, writeSeedFiles } from '../../lib/robust/seed-files.js';
import type { StudyResults } from '../../lib/study/results.js';

const root = scratchDir('shiftload-catalogue-');
let seeds = '';
beforeAll(() => { seeds = writeSeedFiles(join(root, 'seeds')); });
afterAll(() => rmSync(root, { recursive: true, force: true }));

let n = 0;
/** A fresh folder holding the tiny recording and the seed job. */
function caseDir(): string {
  const d = join(root, `c${n++}`);
  mkdirSync(d);
  for (const f of ['tiny.edf', 'tiny-job.yaml', 'tiny-segments.csv']) copyFileSync(join(seeds, f), join(d, f));
  return d;
}

async function run(...args: string[]) {
  const io = bufferIO();
  const code = await main(args, io);
  return { code, out: io.stdout, err: io.stderr };
}

/** Exit 2, exactly one stderr line, naming `file` (its base name) and matching `what`. */
async function refused(args: string[], file: string, what: RegExp): Promise<string> {
  const r = await run(...args);
  const lines = r.err.split('\n').filter((l) => l !== '');
  expect(r.code, r.err).toBe(2);
  expect(lines).toHaveLength(1);
  expect(lines[0]).not.toMatch(/internal error|\bat .*\(.*:\d+:\d+\)/);
  expect(lines[0]).toContain(basename(file));
  expect(lines[0]).toMatch(what);
  return lines[0];
}

/** base_for_broken.edf (EDFlib 1.23, shared/fixtures/edf) with header field `name` set to `text`. */
function edfWithField(name: string, text: string): string {
  const b = Buffer.from(readFileSync(join(SHARED_EDF_DIR, 'base_for_broken.edf')));
  const f = edfFields(b).find((x) => x.name === name);
  if (!f) throw new Error(`no field ${name}`);
  b.fill(0x20, f.offset, f.offset + f.width);
  Buffer.from(text, 'latin1').copy(b, f.offset);
  const p = join(caseDir(), `${name.replace(/\W+/g, '_')}.edf`);
  writeFileSync(p, b);
  return p;
}

function put(name: string, content: string | Buffer): string {
  const p = join(caseDir(), name);
  writeFileSync(p, content);
  return p;
}

describe('catalogue: EDF/BDF headers and records (inspect)', () => {
  const cases: [string, string, string, RegExp][] = [
    ['record duration 0', 'duration', '0', /data record duration \(byte 244\).*positive/],
    ['negative record duration', 'duration', '-1', /data record duration \(byte 244\).*positive/],
    ['no signals', 'signals', '0', /number of signals \(byte 252\)/],
    ['physical maximum Infinity', 'physical max[0]', 'Infinity', /physical maximum of signal 0 \(byte \d+\).*'Infinity'/],
    ['physical minimum NaN', 'physical min[1]', 'NaN', /physical minimum of signal 1 \(byte \d+\).*'NaN'/],
    ['physical minimum that overflows (1e999)', 'physical min[1]', '1e999', /physical minimum of signal 1 \(byte \d+\).*'1e999'/],
    ['record duration that overflows (1e999)', 'duration', '1e999', /data record duration \(byte 244\)/],
    ['digital minimum above the maximum', 'digital min[0]', '32767', /digital minimum .* below digital maximum|digital/],
    ['digital limit outside 16 bits', 'digital max[0]', '99999', /digital limit 99999 \(byte \d+\) is outside/],
    ['impossible start date', 'startdate', '31.02.24', /start date \(byte 168\)/],
    ['impossible start time', 'starttime', '25.61.61', /start time \(byte 176\)/],
    ['header byte count that is not a number', 'header bytes', '12a4', /\(byte 184\)/],
    ['huge record count', 'records', '99999999', /data records \(byte 236\)/],
    ['samples per record 0', 'samples per record[0]', '0', /samples per record of signal 0 \(byte \d+\)/],
    ['non-ASCII label', 'label[0]', 'EMG \u00e9', /label of signal 0 \(byte \d+\) holds byte 0xe9/],
  ];
  for (const [what, field, text, pattern] of cases) {
    it(`inspect FILE with ${what} (${field}='${text}') exits 2 naming the field`, async () => {
      const p = edfWithField(field, text);
      await refused(['inspect', p], p, pattern);
    });
  }

  it('inspect FILE with physical minimum = maximum exits 2 naming the signal and byte', async () => {
    const b = Buffer.from(readFileSync(join(SHARED_EDF_DIR, 'base_for_broken.edf')));
    const f = edfFields(b);
    for (const name of ['physical min[0]', 'physical max[0]']) {
      const x = f.find((y) => y.name === name)!;
      b.fill(0x20, x.offset, x.offset + x.width);
      b.write('100', x.offset, 'latin1');
    }
    const p = put('peq.edf', b);
    await refused(['inspect', p], p, /physical minimum equals physical maximum \(100, byte \d+\)/);
  });

  it('inspect FILE with bytes after the last record exits 2 (record count and size disagree)', async () => {
    const p = put('extra.edf', Buffer.concat([readFileSync(join(SHARED_EDF_DIR, 'base_for_broken.edf')), Buffer.from('xyz')]));
    await refused(['inspect', p], p, /data record \d+|extra data|data records/);
  });

  it('inspect FILE.bdf cut inside the header or a record exits 2', async () => {
    const b = readFileSync(join(SHARED_EDF_DIR, 'emg_3sig.bdf'));
    const head = put('cut-head.bdf', b.subarray(0, 700));
    await refused(['inspect', head], head, /header/);
    const rec = put('cut-rec.bdf', b.subarray(0, b.length - 5));
    await refused(['inspect', rec], rec, /data record|truncated/);
  });

  it('an EDF+ file with an inverted physical range (reversed polarity) is accepted and converts to EDF+', async () => {
    const b = Buffer.from(readFileSync(join(seeds, 'tiny.edf')));
    const f = edfFields(b);
    const lo = f.find((x) => x.name === 'physical min[0]')!;
    const hi = f.find((x) => x.name === 'physical max[0]')!;
    const tl = Buffer.from(b.subarray(lo.offset, lo.offset + 8));
    b.copy(b, lo.offset, hi.offset, hi.offset + 8);
    tl.copy(b, hi.offset);
    const p = put('inverted.edf', b);
    expect((await run('inspect', p)).code).toBe(0);
    const r = await run('convert', p, '--format', 'edf', '-o', join(root, `inv${n}.edf`));
    expect(r.code, r.err).toBe(0);
  });
});

describe('catalogue: CSV/TSV recordings (inspect)', () => {
  it('a cell whose number overflows (1e400) exits 2 naming line and column', async () => {
    const p = put('inf.csv', 'time_s,A\n0,1\n0.001,1e400\n0.002,3\n');
    await refused(['inspect', p], p, /inf\.csv:3 column A: .*'1e400'/);
  });
  it('a time stamp that overflows exits 2 naming the line', async () => {
    const p = put('tinf.csv', 'time_s,A\n0,1\n1e999,2\n');
    await refused(['inspect', p], p, /tinf\.csv:3 column time/);
  });
  it('time steps that overflow the rate or the duration (1e308, 5e-324) exit 2 naming the time column', async () => {
    for (const step of ['1e308', '5e-324']) {
      const p = put(`step${step}.csv`, `time_s,A\n0,1\n${step},2\n`);
      await refused(['inspect', p], p, /time column: a step of .* no usable sampling rate/);
    }
  });
  it('a zero-filled .csv (a crashed logger) exits 2 at the line-length limit, without reading it into memory', async () => {
    const p = put('zeros.csv', Buffer.alloc((1 << 24) + 1024));
    await refused(['inspect', p], p, /zeros\.csv:1: line longer than 16777216 bytes/);
  });
  it("an 'Inf' cell exits 2 naming line and column", async () => {
    const p = put('inf2.csv', 'time_s,A\n0,1\n0.001,Inf\n');
    await refused(['inspect', p], p, /inf2\.csv:3 column A: expected a number, got 'Inf'/);
  });
  it('an empty time cell (missing time stamp) exits 2 naming the line', async () => {
    const p = put('miss.csv', 'time_s,A\n0,1\n,2\n0.002,3\n');
    await refused(['inspect', p], p, /miss\.csv:3: the time cell is empty/);
  });
  it('a TSV with decimal points is read (tab delimiter; "." and "," both accepted as decimal separator)', async () => {
    const p = put('dot.tsv', 'A\tB\n1.5\t-2,25\n2.25\t-1.5\n');
    const r = await run('inspect', p, '--rate', '100', '--json');
    expect(r.code, r.err).toBe(0);
    const s = JSON.parse(r.out).signals;
    expect([s[0].physical_min, s[0].physical_max, s[1].physical_min, s[1].physical_max]).toEqual([1.5, 2.25, -2.25, -1.5]);
  });
  it('an empty CSV file and a CSV holding only blank lines exit 2', async () => {
    const e = put('empty.csv', '');
    await refused(['inspect', e], e, /file is empty/);
    const b = put('blank.csv', '\n\n\n');
    await refused(['inspect', b], b, /blank\.csv/);
  });
  it('a bad --rate (0, negative) exits 2 naming the option', async () => {
    const p = join(seeds, 'no-time.tsv');
    for (const rate of ['0', '-5']) {
      const r = await run('inspect', p, '--rate', rate);
      expect(r.code).toBe(2);
      expect(r.err.trim().split('\n')).toHaveLength(1);
      expect(r.err).toMatch(/--rate/);
    }
  });
});

describe('catalogue: paths', () => {
  it('a recording that is a folder, a device or a job file exits 2 naming it', async () => {
    const d = caseDir();
    await refused(['inspect', d], d, /is a folder/);
    await refused(['inspect', '/dev/null'], '/dev/null', /empty|not a file|cannot read/);
    await refused(['inspect', join(d, 'tiny-job.yaml')], 'tiny-job.yaml', /unknown recording format/);
  });
  it('a job path that does not exist, is a folder or is /dev/null exits 2', async () => {
    const d = caseDir();
    await refused(['check', join(d, 'nope.yaml')], 'nope.yaml', /not found/);
    await refused(['check', d], basename(d), /folder/);
    await refused(['check', '/dev/null'], '/dev/null', /empty|not a file/);
  });
});

describe('catalogue: job YAML (check)', () => {
  const job = (d: string) => readFileSync(join(d, 'tiny-job.yaml'), 'utf8');
  it('billion laughs (aliases nested ten deep) exits 2 before expanding', async () => {
    const lines = ['a0: &a0 [x, x, x, x, x, x, x, x, x, x]'];
    for (let i = 1; i < 9; i++) lines.push(`a${i}: &a${i} [${Array(10).fill(`*a${i - 1}`).join(', ')}]`);
    const p = put('laughs.yaml', lines.join('\n') + '\n');
    await refused(['check', p], p, /aliases|nodes|alias/);
  });
  it('few aliases that expand to many values exit 2 at the node limit', async () => {
    // 6 anchors × 10 references each = 10^6 values after expansion, within the 50-alias limit
    const lines = ['a0: &a0 [x, x, x, x, x, x, x, x, x, x]'];
    for (let i = 1; i < 6; i++) lines.push(`a${i}: &a${i} [${Array(10).fill(`*a${i - 1}`).join(', ')}]`);
    const p = put('wide.yaml', lines.join('\n') + '\n');
    await refused(['check', p], p, /aliases|values|nodes/);
  });
  it('nesting deeper than the limit exits 2 naming the line', async () => {
    const p = put('deep.yaml', 'x: ' + '['.repeat(100) + ']'.repeat(100) + '\n');
    await refused(['check', p], p, /deep\.yaml:1: .*nesting/);
  });
  it('non-core tags (!!js/function, !!binary, custom) exit 2 (safe schema only)', async () => {
    for (const [i, tag] of ['!!js/function "x"', '!!binary aGVsbG8=', '!custom x'].entries()) {
      const d = caseDir();
      const p = join(d, `tag${i}.yaml`);
      writeFileSync(p, job(d).replace('title: robustness seed', `title: ${tag}`));
      await refused(['check', p], p, /tag|title|expected/);
    }
  });
  it('a job that is not UTF-8 exits 2', async () => {
    const p = put('latin1.yaml', Buffer.from('format: shiftload-job/1\ntitle: \xe9t\xe9\n', 'latin1'));
    await refused(['check', p], p, /not UTF-8/);
  });
  const values: [string, string, string, RegExp][] = [
    ['a NaN segment end', 'end_s: 11 }', 'end_s: .nan }', /segments\[0\]\.end_s/],
    ['an infinite segment end', 'end_s: 11 }', 'end_s: .inf }', /segments\[0\]\.end_s/],
    ['a negative segment start', 'start_s: 7,', 'start_s: -7,', /segments\[0\]\.start_s/],
    ['a huge band edge', 'band_hz: [20, 200]', 'band_hz: [20, 1e300]', /band_hz/],
    ['a NaN band edge', 'band_hz: [20, 200]', 'band_hz: [.nan, 200]', /band_hz/],
    ['a list where a mapping belongs', 'settings:\n  band_hz: [20, 200]', 'settings: [1, 2]', /settings/],
    ['a recording path that is the job itself', '- file: tiny.edf', '- file: tiny-job.yaml', /recordings\[0\]\.file/],
    ['a recording path that is a folder', '- file: tiny.edf', '- file: .', /recordings\[0\]\.file/],
    ['a recording path /dev/null', '- file: tiny.edf', '- file: /dev/null', /recordings\[0\]\.file/],
    ['a segment past the end of the recording', 'end_s: 12 }', 'end_s: 13 }', /segments\[1\].*12/],
    ['overlapping segments', 'start_s: 11, end_s: 12', 'start_s: 10, end_s: 12', /segments\[\d\]/],
  ];
  for (const [what, from, to, pattern] of values) {
    it(`check JOB with ${what} exits 2 naming job:line and the key`, async () => {
      const d = caseDir();
      const text = job(d);
      expect(text).toContain(from);
      const p = join(d, 'tiny-job.yaml');
      writeFileSync(p, text.replace(from, to));
      const line = await refused(['check', p], p, pattern);
      expect(line).toMatch(/tiny-job\.yaml:\d+/);
    });
  }
});

describe('catalogue: units of reference and rest files', () => {
  it('a reference file in mV for a recording in µV is converted (same results as µV); an unknown unit that differs exits 2 naming the signal, both files and units', async () => {
    const d = caseDir();
    const csv = join(d, 'tiny.csv');
    expect((await run('convert', join(d, 'tiny.edf'), '--format', 'csv', '-o', csv)).code).toBe(0);
    const text = readFileSync(csv, 'utf8');
    const lines = text.trimEnd().split('\n');
    // the same signals in mV: every value ÷ 1000 (EDF/CSV physical values; 1 mV = 1000 µV)
    const mv = ['time_s,EMG R [mV],EMG L [mV]', ...lines.slice(1).map((l) => l.split(',').map((v, i) => (i === 0 ? v : String(Number(v) / 1000))).join(','))];
    writeFileSync(join(d, 'ref-mv.csv'), mv.join('\n') + '\n');
    writeFileSync(join(d, 'ref-uv.csv'), text.replace(/^.*\n/, 'time_s,EMG R [\u00b5V],EMG L [UV]\n'));
    writeFileSync(join(d, 'ref-counts.csv'), text.replace(/^.*\n/, 'time_s,EMG R [counts],EMG L [counts]\n'));
    const job = (ref: string) => readFileSync(join(d, 'tiny-job.yaml'), 'utf8').replace('- file: tiny.edf', '- file: tiny.csv')
      .replace('reference: { file: tiny.edf, annotation: "reference contraction" }', `reference: { file: ${ref}, start_s: 1, end_s: 3 }`);
    const p = join(d, 'units.yaml');
    writeFileSync(p, job('ref-counts.csv'));
    await refused(['check', p], p, /units\.yaml:\d+ workers\[0\]\.reference\.file: signal 'EMG R' is in counts in ref-counts\.csv but in uV in tiny\.csv/);
    const levels = async (ref: string, out: string) => {
      writeFileSync(p, job(ref));
      const r = await run('analyze', p, '--no-report', '-o', join(d, out));
      expect(r.code, r.err).toBe(0);
      const res = JSON.parse(readFileSync(join(d, out, 'results.json'), 'utf8')) as StudyResults;
      return res.rows.map((row) => [row.reference_uv, (row as unknown as Record<string, number | null>).p50]);
    };
    const inUv = await levels('ref-uv.csv', 'o-uv'); // µV, UV and uV are one unit
    const inMv = await levels('ref-mv.csv', 'o-mv');
    expect(inMv.length).toBe(inUv.length);
    inMv.forEach((row, i) => row.forEach((v, j) => {
      const w = inUv[i]![j]!;
      if (typeof v !== 'number' || typeof w !== 'number') expect(v).toBe(w);
      else expect(Math.abs(v - w)).toBeLessThanOrEqual(1e-6 * Math.abs(w)); // CSV text rounding only
    }));
  });
});

describe('catalogue: usable data gives findings, not errors (analyze --no-report)', () => {
  async function analyze(d: string, jobText?: string): Promise<StudyResults> {
    const p = join(d, 'tiny-job.yaml');
    if (jobText !== undefined) writeFileSync(p, jobText);
    const r = await run('analyze', p, '--no-report', '-o', join(d, 'out'));
    expect(r.code, r.err).toBe(0);
    return JSON.parse(readFileSync(join(d, 'out', 'results.json'), 'utf8')) as StudyResults;
  }
  const codes = (r: StudyResults) => r.findings.map((f) => f.code);

  it('a reference weaker than the task (the rest span used as reference) gives a reference finding', async () => {
    const d = caseDir();
    const text = readFileSync(join(d, 'tiny-job.yaml'), 'utf8').replace('annotation: "reference contraction"', 'annotation: "break"')
      .replace('rest: { file: tiny.edf, annotation: "break" }', 'rest: { file: tiny.edf, start_s: 4.5, end_s: 5.5 }');
    const r = await analyze(d, text);
    expect(codes(r).some((c) => c === 'reference-weak' || c === 'reference-zero'), JSON.stringify(r.findings)).toBe(true);
  });
  it('a segment shorter than the RMS window gives a segment-too-short finding', async () => {
    const d = caseDir();
    const text = readFileSync(join(d, 'tiny-job.yaml'), 'utf8').replace('start_s: 11, end_s: 12', 'start_s: 11, end_s: 11.02');
    const r = await analyze(d, text);
    expect(codes(r)).toContain('segment-too-short');
  });
  it('clipped samples give a clipping finding (emg_3sig.edf, EDFlib: 16 samples at digital max)', async () => {
    const d = caseDir();
    copyFileSync(join(SHARED_EDF_DIR, 'emg_3sig.edf'), join(d, 'rec.edf'));
    const text = fixtureJobYaml({ title: 'clipping' });
    const r = await analyze(d, text);
    // 'clipped' from the quality screening (per span), 'clipping' from the analysis when screening is off
    expect(codes(r).some((c) => c === 'clipped' || c === 'clipping'), JSON.stringify(codes(r))).toBe(true);
  });
  it('empty cells (NaN) inside a CSV recording give an excluded-time finding', async () => {
    const d = caseDir();
    // tiny.edf as CSV, then a block of empty cells in the "lifting" segment
    const csv = join(d, 'tiny.csv');
    expect((await run('convert', join(d, 'tiny.edf'), '--format', 'csv', '-o', csv)).code).toBe(0);
    const lines = readFileSync(csv, 'utf8').split('\n');
    for (let i = 1 + 8 * 500; i < 1 + 8 * 500 + 400; i++) lines[i] = lines[i].replace(/,.*$/, ',,');
    writeFileSync(csv, lines.join('\n'));
    const text = readFileSync(join(d, 'tiny-job.yaml'), 'utf8').replace(/segments:\n(\s+- .*\n)+/, 'segments:\n          - { label: lifting, start_s: 7, end_s: 11 }\n')
      .replace('- file: tiny.edf', '- file: tiny.csv');
    const r = await analyze(d, text);
    expect(codes(r)).toContain('excluded-time');
  });
});

describe('catalogue: outputs', () => {
  it('analyze -o FILE (an existing file) exits 2 naming it', async () => {
    const d = caseDir();
    const f = join(d, 'tiny-segments.csv');
    await refused(['analyze', join(d, 'tiny-job.yaml'), '--no-report', '-o', f], f, /not a folder/);
  });
  it('analyze refuses an output that would overwrite an input (a recording named results.json), even with --force', async () => {
    const d = caseDir();
    renameSync(join(d, 'tiny.edf'), join(d, 'results.json'));
    const p = join(d, 'tiny-job.yaml');
    writeFileSync(p, readFileSync(p, 'utf8').replaceAll('tiny.edf', 'results.json'));
    const before = readFileSync(join(d, 'results.json'));
    await refused(['analyze', p, '--no-report', '-o', d, '--force'], 'results.json', /output path is also an input/);
    expect(readFileSync(join(d, 'results.json')).equals(before)).toBe(true);
  });
});

describe('catalogue: EDF start date', () => {
  it('29.02. is accepted in a leap year (24) and refused in another (23)', async () => {
    expect((await run('inspect', edfWithField('startdate', '29.02.24'))).code).toBe(0);
    const p = edfWithField('startdate', '29.02.23');
    await refused(['inspect', p], p, /start date \(byte 168\)/);
  });
});
