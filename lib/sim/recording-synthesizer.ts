// Streams the samples of a designed recording, channel by channel, chunk by chunk.
//
// Model (per channel, µV):  x(t) = sqrt((a(t)·MVE/100)² + noise²) · s(t) / g  + artifacts
//   s(t): zero-mean Gaussian white noise (xoshiro128**, polar method) band-limited by the injected
//         shaper (default: Butterworth band-pass 20–450 Hz, order 4, one forward pass — the common
//         sEMG band, common practice, no single source; De Luca et al. 2010 J Biomech 43:1573);
//   g:    the shaper's RMS gain from its impulse-response energy, so s/g has unit RMS;
//   a(t): the designed envelope (%MVE) on the design grid; the amplitude sqrt(a² + noise²) is
//         computed at the grid points and interpolated linearly to the sampling rate.
// EMG and the noise floor are independent processes of the same spectrum, so their powers add
// and the designed RMS is sqrt(a² + noise²) — the model behind noise correction. Filter start-up
// is hidden by running the filter on warmup_s of discarded noise first.
// Artifacts follow in this order: white amplifier noise, mains hum, motion bursts, ECG-like QRS
// complexes, drop-out (flat 0 µV), clipping at ±physical range.
import { Xoshiro128 } from '../stats/xoshiro128.js';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { noiseGain, type NoiseFilter, type NoiseShaper } from './noise-shaper.js';
import type { ChannelDesign, RecordingDesign } from './recording-design.js';
import { SIM_DEFAULTS } from './simulation-spec.js';

/** Options of the synthesizer. */
export interface SynthesizerOptions {
  /** Noise run through the filter before the first sample, s. @default 2 */
  warmup_s?: number;
}

interface ChannelState {
  design: ChannelDesign;
  rng: Xoshiro128;
  ampRng: Xoshiro128 | null;
  filter: NoiseFilter;
  /** sqrt((a·MVE/100)² + noise²) / g at each grid point, µV per unit noise. */
  amp: Float64Array;
  /** ECG beat centres, sample index (sorted). */
  beats: Int32Array;
  qrs: Float64Array;
  qrsHalf: number;
}

/**
 * A stream of a designed recording's samples. `next(n)` returns one Float64Array per channel
 * (µV) for the next n samples; the arrays are reused by the following call.
 * Same design + same shaper → identical numbers, whatever the chunk sizes.
 * @example
 *   const syn = new RecordingSynthesizer(design, butterShaper(1000));
 *   while (syn.remaining > 0) write(syn.next(Math.min(10_000, syn.remaining)));
 */
export class RecordingSynthesizer {
  readonly totalSamples: number;
  private pos = 0;
  private readonly fs: number;
  private readonly invGain: number;
  private readonly ratio: number;
  private readonly channels: ChannelState[];
  private bufs: Float64Array[] = [];
  private noise: Float64Array = new Float64Array(0);

  constructor(readonly design: RecordingDesign, shaper: NoiseShaper, options: SynthesizerOptions = {}) {
    this.fs = design.sampling_rate_hz;
    this.totalSamples = secondsToSamples(design.duration_s, this.fs);
    this.ratio = design.design_rate_hz / this.fs;
    this.invGain = 1 / noiseGain(shaper, Math.max(4096, secondsToSamples(5, this.fs)));
    const warm = secondsToSamples(options.warmup_s ?? SIM_DEFAULTS.warmup_s, this.fs);
    this.channels = design.channels.map((c) => {
      const rng = new Xoshiro128(c.seed);
      const filter = shaper.create();
      const w = new Float64Array(Math.max(warm, 1));
      if (warm > 0) { rng.fillNormal(w); filter.process(w, warm); }
      const ecg = c.artifacts.ecg;
      const { qrs, half } = qrsTemplate(this.fs, ecg?.amplitude_uv ?? 0);
      const amp = new Float64Array(c.envelope.length);
      for (let k = 0; k < amp.length; k++) amp[k] = Math.hypot((c.envelope[k] * c.mve_uv) / 100, c.noise_uv) * this.invGain;
      return {
        design: c, rng, filter, qrs, qrsHalf: half, amp,
        ampRng: c.artifacts.amplifier_uv ? new Xoshiro128(c.seed ^ 0x5bd1e995n) : null,
        beats: ecg ? beatTimes(ecg.rate_bpm, this.totalSamples, this.fs, new Xoshiro128(c.seed ^ 0x27d4eb2fn)) : new Int32Array(0),
      };
    });
  }

  /** Samples not yet produced. */
  get remaining(): number { return this.totalSamples - this.pos; }

  /** Index of the next sample to be produced. */
  get position(): number { return this.pos; }

  /** The next n samples (n ≤ remaining) of every channel, µV. */
  next(n: number): Float64Array[] {
    if (n > this.remaining || n < 0) throw new RangeError(`next(${n}): ${this.remaining} samples remain`);
    if (this.noise.length < n) {
      this.noise = new Float64Array(n);
      this.bufs = this.channels.map(() => new Float64Array(n));
    }
    const out = this.bufs.map((b) => (b.length === n ? b : b.subarray(0, n)));
    for (let c = 0; c < this.channels.length; c++) this.fillChannel(this.channels[c], out[c], n);
    this.pos += n;
    return out;
  }

  private fillChannel(st: ChannelState, x: Float64Array, n: number): void {
    const d = st.design;
    const i0 = this.pos;
    const fs = this.fs;
    st.rng.fillNormal(x, 0, n);
    st.filter.process(x, n);
    // envelope scaling (hot loop): amplitude sqrt(a² + noise²)/g precomputed on the grid,
    // interpolated linearly between grid points
    const amp = st.amp;
    const last = amp.length - 1;
    const ratio = this.ratio;
    for (let j = 0; j < n; j++) {
      const g = (i0 + j) * ratio;
      const k = g | 0;
      x[j] *= k >= last ? amp[last] : amp[k] + (g - k) * (amp[k + 1] - amp[k]);
    }
    const art = d.artifacts;
    if (st.ampRng && art.amplifier_uv) {
      const w = this.noise;
      st.ampRng.fillNormal(w, 0, n);
      const s = art.amplifier_uv;
      for (let j = 0; j < n; j++) x[j] += s * w[j];
    }
    if (art.hum && art.hum.amplitude_uv !== 0) {
      const A = art.hum.amplitude_uv, f = art.hum.freq_hz;
      for (let j = 0; j < n; j++) {
        const cyc = (f * (i0 + j)) / fs;
        x[j] += A * Math.sin(2 * Math.PI * (cyc - Math.floor(cyc)));
      }
    }
    for (const m of art.motion ?? []) {
      const a0 = secondsToSamples(m.start_s, fs);
      const len = secondsToSamples(m.duration_s, fs);
      const lo = Math.max(a0, i0), hi = Math.min(a0 + len, i0 + n);
      for (let i = lo; i < hi; i++) {
        const tau = (i - a0) / fs;
        const w = 0.5 * (1 - Math.cos((2 * Math.PI * (i - a0)) / len));
        x[i - i0] += m.amplitude_uv * w * Math.sin(2 * Math.PI * m.freq_hz * tau);
      }
    }
    if (st.beats.length > 0) addBeats(x, i0, n, st.beats, st.qrs, st.qrsHalf);
    for (const dr of art.dropout ?? []) {
      const a0 = secondsToSamples(dr.start_s, fs);
      const lo = Math.max(a0, i0), hi = Math.min(a0 + secondsToSamples(dr.duration_s, fs), i0 + n);
      if (hi > lo) x.fill(0, lo - i0, hi - i0);
    }
    const r = d.physical_range_uv;
    for (let j = 0; j < n; j++) {
      const v = x[j];
      if (v > r) x[j] = r; else if (v < -r) x[j] = -r;
    }
  }
}

/** QRS-like template: Q, R, S as Gaussian bumps (−0.15, 1, −0.25 of the R amplitude at −25, 0, +25 ms). */
function qrsTemplate(fs: number, amp: number): { qrs: Float64Array; half: number } {
  const half = Math.ceil(0.06 * fs);
  const qrs = new Float64Array(2 * half + 1);
  const g = (t: number, mu: number, sd: number) => Math.exp(-0.5 * ((t - mu) / sd) ** 2);
  for (let k = -half; k <= half; k++) {
    const t = k / fs;
    qrs[k + half] = amp * (-0.15 * g(t, -0.025, 0.008) + g(t, 0, 0.01) - 0.25 * g(t, 0.025, 0.008));
  }
  return { qrs, half };
}

function beatTimes(bpm: number, total: number, fs: number, rng: Xoshiro128): Int32Array {
  const period = (60 / bpm) * fs;
  const out: number[] = [];
  let t = period * rng.random();
  while (t < total + period) {
    out.push(Math.round(t));
    t += period * (1 + 0.03 * (2 * rng.random() - 1));
  }
  return Int32Array.from(out);
}

function addBeats(x: Float64Array, i0: number, n: number, beats: Int32Array, qrs: Float64Array, half: number): void {
  // beats are sorted: binary search the first one that can touch this chunk
  let lo = 0, hi = beats.length;
  while (lo < hi) { const m = (lo + hi) >> 1; if (beats[m] + half < i0) lo = m + 1; else hi = m; }
  for (let b = lo; b < beats.length && beats[b] - half < i0 + n; b++) {
    const c = beats[b];
    const a = Math.max(c - half, i0), e = Math.min(c + half + 1, i0 + n);
    for (let i = a; i < e; i++) x[i - i0] += qrs[i - c + half];
  }
}
