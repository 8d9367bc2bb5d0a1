// Throughput of the quality screening (for `npm run bench` and the report to the team): a
// simulated channel is streamed through the analysis band-pass and a QualityTap; the time spent
// inside the tap is measured apart from the filter's. Not a test (no timing assertions anywhere).
// Run: node dist/quality/measure-tap-throughput.js [duration_s] [fs]  (also times the whole
// analysis pass on a temporary simulated EDF+ without and with the screening taps)
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { pathToFileURL } from 'node:url';
import { BandFilter } from '../dsp/band-filter.js';
import { butterShaper } from '../sim/butter-shaper.js';
import { RecordingSynthesizer } from '../sim/recording-synthesizer.js';
import { writeSimulatedEdf } from '../sim/write-simulated-edf.js';
import { readEnvelopes } from '../study/read-envelopes.js';
import { QualityTap } from './quality-tap.js';
import { createScreeningTaps, screeningWindows } from './screening-taps.js';
import { judgeScreening } from './judge-screening.js';

export interface TapThroughput {
  samples: number;
  fs: number;
  /** Seconds inside the tap (raw + filtered + finish). */
  tap_s: number;
  /** Seconds inside the band-pass filter (the analysis' own cost, for comparison). */
  filter_s: number;
  /** Samples per second through the tap. */
  tap_samples_per_s: number;
  filter_samples_per_s: number;
  findings: number;
}

/**
 * Stream a simulated channel of `duration_s` at `fs` Hz (low-level EMG with ECG) in 64 Ki-sample
 * chunks through BandFilter (30–400 Hz, order 4) and a QualityTap, timing each part.
 * @example const t = measureTapThroughput(3600, 2000); t.tap_samples_per_s
 */
export function measureTapThroughput(duration_s = 3600, fs = 2000): TapThroughput {
  const rate = 10;
  const envelope = new Float64Array(Math.round(duration_s * rate) + 1);
  for (let k = 0; k < envelope.length; k++) envelope[k] = 1 + 10 * (Math.floor(k / 50) % 3);
  const syn = new RecordingSynthesizer({
    file: 'bench', kind: 'field', worker: 'W', condition: 'c', sampling_rate_hz: fs, design_rate_hz: rate, duration_s,
    start: '2026-01-01T08:00:00', segments: [], annotations: [],
    channels: [{ muscle_id: 'm', signal: 'S', muscle: 'm', mve_uv: 400, noise_uv: 3, envelope, gaps: [], artifacts: { ecg: { amplitude_uv: 100, rate_bpm: 70 } }, physical_range_uv: 1e5, seed: 1n }],
  }, butterShaper([20, 450], 4, fs));
  const bf = new BandFilter({ fs, band_hz: [30, 400], order: 4, mains_hz: null });
  const tap = new QualityTap({ fs, limits: { physical_min: -1e5, physical_max: 1e5, digital_min: -32768, digital_max: 32767 }, where: { signal: 'S' } });
  let tapT = 0, filtT = 0, n = 0;
  while (syn.remaining > 0) {
    const x = syn.next(Math.min(65536, syn.remaining))[0]!;
    let t0 = performance.now();
    tap.raw(x, n);
    tapT += performance.now() - t0;
    t0 = performance.now();
    const y = bf.push(x);
    filtT += performance.now() - t0;
    t0 = performance.now();
    if (y.length > 0) tap.filtered(y);
    tapT += performance.now() - t0;
    n += x.length;
  }
  let t0 = performance.now();
  const y = bf.flush();
  filtT += performance.now() - t0;
  t0 = performance.now();
  if (y.length > 0) tap.filtered(y);
  const q = tap.finish();
  tapT += performance.now() - t0;
  return {
    samples: n, fs, tap_s: tapT / 1000, filter_s: filtT / 1000,
    tap_samples_per_s: n / (tapT / 1000), filter_samples_per_s: n / (filtT / 1000), findings: q.findings.length,
  };
}

export interface AnalysisOverhead {
  /** Best of `repeats` seconds for readEnvelopes alone, and with the screening taps (pass + judgment). */
  without_s: number;
  with_s: number;
  samples: number;
}

/**
 * The cost of screening inside the analysis' own pass: a simulated one-channel EDF+ of
 * `duration_s` at `fs` Hz is written to a temporary folder, then read by readEnvelopes (30–400 Hz
 * band-pass, 0.1 s RMS at 20 Hz) without and with the screening taps, alternately, best of
 * `repeats`. The file is removed afterwards.
 * @example const o = await measureAnalysisOverhead(3600, 2000); o.with_s / o.without_s
 */
export async function measureAnalysisOverhead(duration_s = 3600, fs = 2000, repeats = 3): Promise<AnalysisOverhead> {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-quality-bench-'));
  try {
    const file = join(dir, 'bench.edf');
    const envelope = new Float64Array(Math.round(duration_s * 10) + 1);
    for (let k = 0; k < envelope.length; k++) envelope[k] = 1 + 10 * (Math.floor(k / 50) % 3);
    writeSimulatedEdf({
      file: 'bench.edf', kind: 'field', worker: 'W', condition: 'c', sampling_rate_hz: fs, design_rate_hz: 10, duration_s,
      start: '2026-01-01T08:00:00', segments: [], annotations: [],
      channels: [{ muscle_id: 'm', signal: 'S', muscle: 'm', mve_uv: 400, noise_uv: 3, envelope, gaps: [], artifacts: {}, physical_range_uv: 5000, seed: 1n }],
    }, file, butterShaper([20, 450], 4, fs));
    const filter = { band_hz: [30, 400] as [number, number], order: 4, mains_hz: null, mains_harmonics: 1, mains_q: 30 };
    let without = Infinity, withTap = Infinity;
    for (let r = 0; r < repeats; r++) {
      for (const screen of [false, true]) {
        const t0 = performance.now();
        const taps = screen ? await createScreeningTaps(file, [0], {}) : undefined;
        await readEnvelopes({ file, signals: [0], start_s: 0, end_s: null, filter, envelope: { window_s: 0.1, rate_hz: 20 }, taps });
        if (taps) judgeScreening(screeningWindows(taps)[0]!, { noise_uv: 3, highpass_hz: 30 });
        const dt = (performance.now() - t0) / 1000;
        if (screen) withTap = Math.min(withTap, dt); else without = Math.min(without, dt);
      }
    }
    return { without_s: without, with_s: withTap, samples: Math.round(duration_s * fs) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const d = Number(process.argv[2] ?? 3600), fs = Number(process.argv[3] ?? 2000);
  const r = measureTapThroughput(d, fs);
  process.stdout.write(`quality tap: ${r.samples} samples (${d} s at ${fs} Hz): tap ${r.tap_s.toFixed(2)} s (${(r.tap_samples_per_s / 1e6).toFixed(1)} M samples/s), band-pass ${r.filter_s.toFixed(2)} s (${(r.filter_samples_per_s / 1e6).toFixed(1)} M samples/s), ${r.findings} findings\n`);
  const o = await measureAnalysisOverhead(d, fs);
  process.stdout.write(`analysis pass (readEnvelopes, EDF+): ${o.without_s.toFixed(2)} s without screening, ${o.with_s.toFixed(2)} s with (best of 3; ×${(o.with_s / o.without_s).toFixed(2)})\n`);
}
