import { describe, expect, it } from 'vitest';
import { envelopeSampleCount, RmsEnvelope, rmsEnvelope } from '../../lib/dsp/rms-envelope.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { loadDspFixture, maxAbs, randomSplits } from './load-fixture.js';

interface MovingRms { window: number; x: number[]; valid: number[]; centered_same_zero_padded: number[];
  centered_same_shrinking: number[]; trailing_shrinking: number[] }
// expected: shared/fixtures/dsp/moving_rms.json (numpy.convolve, numpy 2.4.6); tolerance rel ≤ 1e-12
const fx = loadDspFixture<MovingRms>('moving_rms.json');
const W = fx.window;
const N = fx.x.length;
// with fs = 1000 Hz, window_s = W/fs gives W samples; rate_hz = fs gives hop 1 (c_k = k)
const fs = 1000;
const relClose = (got: ArrayLike<number>, ref: number[], tol = 1e-12) => {
  expect(got.length).toBe(ref.length);
  ref.forEach((v, i) => expect(Math.abs(got[i] - v)).toBeLessThanOrEqual(tol * Math.abs(v)));
};

describe('rmsEnvelope(x, { fs, window_s, rate_hz }) against moving_rms.json', () => {
  it('hop 1 equals centered_same_shrinking (window [i−⌊W/2⌋, i−⌊W/2⌋+W) clipped, ÷ count)', () => {
    relClose(rmsEnvelope(fx.x, { fs, window_s: W / fs, rate_hz: fs }), fx.centered_same_shrinking);
  });
  it('hop 1, centres ⌊W/2⌋…N−W+⌊W/2⌋ equal valid (window starting at k)', () => {
    const env = rmsEnvelope(fx.x, { fs, window_s: W / fs, rate_hz: fs });
    const h = Math.floor(W / 2);
    relClose(env.slice(h, h + fx.valid.length), fx.valid);
  });
  it('hop 1 on x padded with ⌊W/2⌋ zeros before and W−⌊W/2⌋ after equals centered_same_zero_padded', () => {
    const h = Math.floor(W / 2);
    const padded = new Float64Array(N + W);
    padded.set(fx.x, h);
    const env = rmsEnvelope(padded, { fs, window_s: W / fs, rate_hz: fs });
    relClose(env.slice(h, h + N), fx.centered_same_zero_padded);
  });
  it('hop 1, centre i − (W−1) + ⌊W/2⌋ equals trailing_shrinking for i ≥ W−1 (full windows)', () => {
    const env = rmsEnvelope(fx.x, { fs, window_s: W / fs, rate_hz: fs });
    const shift = W - 1 - Math.floor(W / 2);
    relClose(env.slice(W - 1 - shift, N - shift), fx.trailing_shrinking.slice(W - 1));
  });
  it('hop 10 (rate fs/10) equals every 10th value of centered_same_shrinking', () => {
    const env = rmsEnvelope(fx.x, { fs, window_s: W / fs, rate_hz: fs / 10 });
    relClose(env, fx.centered_same_shrinking.filter((_, i) => i % 10 === 0));
  });
  it('RmsEnvelope.push over random chunk splits equals the batch result', () => {
    for (const rate of [fs, fs / 7, 20]) {
      const opts = { fs, window_s: W / fs, rate_hz: rate };
      const whole = Array.from(rmsEnvelope(fx.x, opts));
      for (const seed of [11, 12]) {
        const e = new RmsEnvelope(opts);
        const got: number[] = [];
        let at = 0;
        for (const len of randomSplits(N, seed, 300)) { got.push(...e.push(fx.x.slice(at, at + len))); at += len; }
        got.push(...e.flush());
        expect(got).toEqual(whole);
      }
    }
  });
});

describe('RmsEnvelope timing and edge rules', () => {
  it('envelopeSampleCount(n, fs, rate) = number of k with round(k·fs/rate) < n', () => {
    for (const [n, f, r] of [[2000, 1000, 20], [1, 1000, 20], [51, 1000, 20], [50, 1000, 20], [12345, 2048, 30], [999, 800, 25]]) {
      let k = 0;
      while (Math.round((k * f) / r) < n) k++;
      expect(envelopeSampleCount(n, f, r)).toBe(k);
      expect(rmsEnvelope(new Float64Array(n).fill(1), { fs: f, window_s: 0.1, rate_hz: r }).length).toBe(k);
    }
  });
  it('an envelope sample whose window holds a NaN is NaN; the others are finite', () => {
    const x = new Float64Array(1000).fill(2);
    x[500] = NaN;
    const env = rmsEnvelope(x, { fs: 1000, window_s: 0.1, rate_hz: 20 }); // centres every 50 samples, windows [c−50, c+50)
    env.forEach((v, k) => {
      const c = k * 50;
      if (500 >= c - 50 && 500 < c + 50) expect(v).toBeNaN();
      else expect(v).toBeCloseTo(2, 14);
    });
  });
  it('RMS of A·sin over whole periods is A/√2', () => {
    // textbook fact, METHODS.md §10 (RMS of A·sin = A/√2); 50 Hz at 2 kHz, 0.1 s window = 5 periods
    const fsHz = 2000, A = 2;
    const x = Float64Array.from({ length: 20000 }, (_, i) => A * Math.sin(2 * Math.PI * 50 * i / fsHz + 0.3));
    const env = rmsEnvelope(x, { fs: fsHz, window_s: 0.1, rate_hz: 20 });
    for (let k = 1; k < env.length - 1; k++) expect(env[k]).toBeCloseTo(A / Math.SQRT2, 12);
  });
  it('running sums stay exact over a long signal with a large DC offset (vs direct summation)', () => {
    // 2 M samples of 1e4 + N(0,1): sums of squares ~1e8 per sample; a plain running sum would drift
    const rng = new SplitMix64(42);
    const n = 2_000_000, fsHz = 2000;
    const x = new Float64Array(n);
    for (let i = 0; i < n; i++) x[i] = 1e4 + rng.normal();
    const opts = { fs: fsHz, window_s: 0.1, rate_hz: 200 }; // W = 200, hop 10: heavy overlap
    const env = rmsEnvelope(x, opts);
    let worst = 0;
    for (let k = 0; k < env.length; k += 97) {
      const c = Math.round((k * fsHz) / 200);
      const a = Math.max(0, c - 100), b = Math.min(n, c + 100);
      let s = 0;
      for (let i = a; i < b; i++) s += x[i] * x[i];
      worst = Math.max(worst, Math.abs(env[k] - Math.sqrt(s / (b - a))) / Math.sqrt(s / (b - a)));
    }
    expect(worst).toBeLessThan(1e-12);
    expect(maxAbs(env)).toBeGreaterThan(1e4);
  });
  it('rejects a window under one sample and a rate above fs', () => {
    expect(() => new RmsEnvelope({ fs: 1000, window_s: 0.0001, rate_hz: 20 })).toThrow('RMS window must cover at least one sample');
    expect(() => new RmsEnvelope({ fs: 1000, window_s: 0.1, rate_hz: 2000 })).toThrow('envelope rate must be above 0 and at most fs (fs=1000 Hz), got 2000');
  });
});
