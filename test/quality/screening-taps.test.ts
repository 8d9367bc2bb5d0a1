// The screening inside the analysis' own streaming pass: readEnvelopes with the taps of
// createScreeningTaps on a simulated EDF+ file, the windows judged afterwards with the noise
// level (as the orchestrator does, possibly on another thread), then excludeSpans on the
// envelope; and the same file through screenRecording (inspect --quality).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { excludeSpans } from '../../lib/quality/exclude-spans.js';
import { judgeScreening } from '../../lib/quality/judge-screening.js';
import { qualityRow } from '../../lib/quality/quality-row.js';
import { screenRecording } from '../../lib/quality/screen-recording.js';
import { createScreeningTaps, screeningWindows } from '../../lib/quality/screening-taps.js';
import { screeningBuffers } from '../../lib/quality/screening-types.js';
import { butterShaper } from '../../lib/sim/butter-shaper.js';
import { writeSimulatedEdf } from '../../lib/sim/write-simulated-edf.js';
import { readEnvelopes } from '../../lib/study/read-envelopes.js';
import { makeDesign } from '../sim/make-design.js';
import { profile } from './simulated-channel.js';

const dir = mkdtempSync(join(tmpdir(), 'shiftload-quality-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('createScreeningTaps(file, signals, spec) in readEnvelopes, then judgeScreening', () => {
  const fs = 1000;
  const file = join(dir, 'w1.edf');
  writeSimulatedEdf(makeDesign({
    fs, duration_s: 90, envelope: profile(5, 90), rate_hz: 10, mve_uv: 400, noise_uv: 3, range_uv: 5000, seed: 77n,
    artifacts: { dropout: [{ start_s: 30, duration_s: 10 }], motion: [{ start_s: 60.2, duration_s: 2.5, amplitude_uv: 1500, freq_hz: 3 }] },
  }), file, butterShaper([20, 450], 4, fs));

  it('finds the drop-out and the motion burst in the single pass; excludeSpans turns exactly that time into NaN', async () => {
    const settings = { max_spans: 5 };
    const taps = await createScreeningTaps(file, [0], { settings });
    const rate = 20;
    const res = await readEnvelopes({
      file, signals: [0], start_s: 0, end_s: null,
      filter: { band_hz: [30, 400], order: 4, mains_hz: null, mains_harmonics: 1, mains_q: 30 },
      envelope: { window_s: 0.1, rate_hz: rate }, taps, open: { chunk_bytes: 3000 },
    });
    // the windows cross threads as plain data with transferable buffers
    const windows = structuredClone(screeningWindows(taps));
    expect(screeningBuffers(windows).length).toBe(7 + 3 + 2 + 2); // amp 7, spec 3 + 2 mains, ecg 2
    const where = { worker: 'W1', recording: 'w1.edf', signal: 'EMG test' };
    const q = judgeScreening(windows[0]!, { noise_uv: 3, mains_notched: false, highpass_hz: 30, where, settings });
    expect(q.findings.map((f) => f.code).sort()).toEqual(['flat-line', 'motion']);
    expect(q.findings.every((f) => f.where.worker === 'W1' && f.where.signal === 'EMG test')).toBe(true);
    expect(q.excluded.map((e) => [e.reason, e.start_s, e.end_s])).toEqual([['flat-line', 30, 40], ['motion', 60, 64]]);
    expect(q.summary.noise_floor_source).toBe('rest');
    expect(q.summary.clipped_high).toBe(res.channels[0]!.clipped_high); // same count as the reader's
    expect(q.summary.clipped_low).toBe(res.channels[0]!.clipped_low);
    const env = res.channels[0]!.envelope;
    const before = env.reduce((a, v) => a + (Number.isNaN(v) ? 1 : 0), 0);
    const out = excludeSpans(env, rate, q.excluded);
    const after = out.reduce((a, v) => a + (Number.isNaN(v) ? 1 : 0), 0);
    expect((after - before) / rate).toBeCloseTo(q.summary.excluded_s, 9); // 14 s
    expect(q.summary.excluded_s).toBe(14);
    const row = qualityRow({ worker: 'W1', condition: 'c', muscle: 'trap', signal: where.signal, recording: 'w1.edf' }, q, null);
    expect(row).toMatchObject({ excluded_s: 14, flat_s: 10, motion_s: 4, clipped_samples: 0 });
    // judging the same windows again gives the same result (no state kept)
    expect(judgeScreening(windows[0]!, { noise_uv: 3, highpass_hz: 30, where, settings })).toEqual(q);
  });

  it('screenRecording(file) reports the same spans for inspect', async () => {
    const r = await screenRecording(file);
    expect(r.signals).toHaveLength(1);
    expect(r.signals[0]!.excluded.map((e) => [e.reason, e.start_s, e.end_s])).toEqual([['flat-line', 30, 40], ['motion', 60, 64]]);
    expect(r.signals[0]!.band_hz).toEqual([30, 400]);
    expect(r.findings.every((f) => f.where.recording === file)).toBe(true);
  });
});
