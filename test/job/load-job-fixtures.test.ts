// loadJob with the real readers on the shared EDF fixtures. Expected labels, rates, durations and
// annotations are read from the truth files (shared/fixtures/edf/*.truth.json, produced by EDFlib
// 1.23 edfopen_file_readonly / edf_get_annotation), never typed in here.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadJob } from '../../lib/job/load-job.js';

const fixture = (name: string) => fileURLToPath(new URL(`../../../shared/fixtures/edf/${name}`, import.meta.url));

interface Truth {
  header: { file_duration_s: number };
  signals: { label: string; sample_rate_hz: number }[];
  annotations: { onset_s: number; duration_s: number | null; text: string }[];
}
const truth = (name: string) => JSON.parse(readFileSync(fixture(`${name}.truth.json`), 'utf8')) as Truth;

const EDF = fixture('emg_3sig.edf');
const T = truth('emg_3sig.edf');
const REF_TEXT = 'reference contraction';
const REST_TEXT = 'break';

function job(lines: string[]): string {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-jobfx-'));
  const path = join(dir, 'job.yaml');
  writeFileSync(path, lines.join('\n') + '\n');
  return path;
}

/** A job on emg_3sig.edf: reference and rest by annotation, the two trapezius channels. */
const base = (segments: string, channels = T.signals.slice(0, 2).map((s) => s.label), band = '[20, 300]') => [
  'format: shiftload-job/1',                                       // 1
  'title: fixture study',                                          // 2
  'settings:',                                                     // 3
  `  band_hz: ${band}`,                                            // 4
  'workers:',                                                      // 5
  '  - id: F1',                                                    // 6
  `    reference: { file: ${JSON.stringify(EDF)}, annotation: ${JSON.stringify(REF_TEXT)} }`, // 7
  `    rest: { file: ${JSON.stringify(EDF)}, annotation: ${JSON.stringify(REST_TEXT)} }`,     // 8
  '    recordings:',                                                // 9
  `      - file: ${JSON.stringify(EDF)}`,                            // 10
  '        condition: bench',                                       // 11
  '        channels:',                                              // 12
  ...channels.map((c) => `          - { signal: ${JSON.stringify(c)} }`), // 13…
  `        segments: ${segments}`,
];

describe('loadJob(path) on EDF+ fixtures (real readers)', () => {
  it('resolves signals, rates, duration, annotation spans and annotation segments from the file', async () => {
    const study = await loadJob(job(base('annotations')));
    const r = study.workers[0].recordings[0];
    expect(r.duration_s).toBeCloseTo(T.header.file_duration_s, 9);
    expect(r.channels.map((c) => [c.signal, c.signalIndex, c.rate_hz])).toEqual(T.signals.slice(0, 2).map((s, i) => [s.label, i, s.sample_rate_hz]));
    const ref = T.annotations.filter((a) => a.text === REF_TEXT);
    expect(r.reference.map((s) => [s.start_s, s.end_s])).toEqual(ref.map((a) => [a.onset_s, a.onset_s + (a.duration_s as number)]));
    const rest = T.annotations.filter((a) => a.text === REST_TEXT);
    expect(r.rest.map((s) => [s.start_s, s.end_s])).toEqual(rest.map((a) => [a.onset_s, a.onset_s + (a.duration_s as number)]));
    // rule: annotations with a duration, except those used as reference/rest spans in this file
    const expected = T.annotations
      .filter((a) => a.duration_s !== null && a.text !== REF_TEXT && a.text !== REST_TEXT)
      .map((a) => [a.text, a.onset_s, a.onset_s + (a.duration_s as number)]);
    expect(expected.length).toBeGreaterThan(0);
    expect(r.segments.map((s) => [s.label, s.start_s, s.end_s])).toEqual(expected);
  });

  it('a signal that is not in the file is refused with the file\'s own signal list', async () => {
    const path = job(base('annotations', ['EMG R trap']));
    await expect(loadJob(path)).rejects.toThrow(`${path}:13 workers[0].recordings[0].channels[0].signal: no signal 'EMG R trap' in ${EDF} (signals: ${T.signals.map((s) => s.label).join(', ')})`);
  });

  it('a band edge above half the rate of a slower channel is refused', async () => {
    const slow = T.signals.find((s) => s.sample_rate_hz < 800);
    expect(slow).toBeDefined();
    const path = job(base('annotations', [slow!.label], '[20, 400]'));
    await expect(loadJob(path)).rejects.toThrow(`${path}:4 settings.band_hz: high edge 400 Hz is not below half the sampling rate of '${slow!.label}' in ${EDF}`);
  });

  it('a segment past the end of the file is refused with the file\'s duration', async () => {
    const d = T.header.file_duration_s;
    const path = job(base(`[{ label: late, start_s: 1, end_s: ${d + 1} }]`));
    await expect(loadJob(path)).rejects.toThrow(`${path}:15 workers[0].recordings[0].segments[0]: 1–${d + 1} s lies outside ${EDF} (0–${d} s)`);
  });

  it('a reference file without the recording\'s signals is refused at the span', async () => {
    const other = fixture('emg_halfsec_records.edf');
    const otherLabels = truth('emg_halfsec_records.edf').signals.map((s) => s.label);
    const lines = base('annotations');
    lines[6] = `    reference: { file: ${JSON.stringify(other)}, start_s: 0, end_s: 1 }`;
    const path = job(lines);
    await expect(loadJob(path)).rejects.toThrow(`${path}:7 workers[0].reference.file: no signal '${T.signals[0].label}' in ${other}, needed by workers[0].recordings[0].channels[0] (signals: ${otherLabels.join(', ')})`);
  });

  it('a malformed recording is reported at its key with the reader\'s reason', async () => {
    const broken = fixture('broken/truncated_header.edf');
    const lines = base('annotations');
    lines[9] = `      - file: ${JSON.stringify(broken)}`;
    const path = job(lines);
    await expect(loadJob(path)).rejects.toThrow(new RegExp(`^${path.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:10 workers\\[0\\]\\.recordings\\[0\\]\\.file: cannot read '`));
  });
});
