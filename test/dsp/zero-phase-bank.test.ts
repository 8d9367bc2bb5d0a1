import { describe, expect, it } from 'vitest';
import { BandFilter, BandFilterBank } from '../../lib/dsp/band-filter.js';
import { butter } from '../../lib/dsp/butter.js';
import { mainsNotch } from '../../lib/dsp/mains-notch.js';
import { sosConcat } from '../../lib/dsp/sos.js';
import { sosPairKernel } from '../../lib/dsp/sos-pair-kernel.js';
import { sosfiltInPlace, sosfiltReverseInPlace } from '../../lib/dsp/sosfilt-in-place.js';
import { ZeroPhaseBank } from '../../lib/dsp/zero-phase-bank.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { loadDspFixture, maxAbs, maxAbsDiff, randomSplits } from './load-fixture.js';

function noise(seed: number, n: number): Float64Array {
  const r = new SplitMix64(seed);
  return Float64Array.from({ length: n }, () => (r.random() - 0.5) * 200);
}

/** Count of positions in [from, to) where a and b differ in any bit (NaN equals NaN). */
function differing(a: Float64Array, b: Float64Array, from: number, to: number): number {
  let d = 0;
  for (let i = from; i < to; i++) if (!Object.is(a[i], b[i])) d++;
  return d;
}

/** Stream every channel through the bank in the given splits; outputs joined per channel. */
function bankRun(bank: ZeroPhaseBank, xs: Float64Array[], splits: number[]): Float64Array[] {
  const parts: Float64Array[][] = xs.map(() => []);
  const sink = (c: number, y: Float64Array) => parts[c]!.push(y.slice());
  let at = 0;
  for (const len of splits) { bank.pushTo(xs.map((x) => x.subarray(at, at + len)), sink); at += len; }
  bank.flushTo(sink);
  return parts.map((p) => {
    const out = new Float64Array(p.reduce((n, q) => n + q.length, 0));
    let o = 0;
    for (const q of p) { out.set(q, o); o += q.length; }
    return out;
  });
}

describe('sosPairKernel(sos, capacity)', () => {
  it('run() on two channels is bit-identical to sosfiltInPlace / sosfiltReverseInPlace on each (forward, backward, out of place)', () => {
    const k0 = sosPairKernel(butter(4, [30, 400], { btype: 'bandpass', fs: 2000 }), 8);
    if (k0 === null) return; // no WebAssembly SIMD on this engine: the scalar kernel is used everywhere
    for (const sos of [butter(4, [30, 400], { btype: 'bandpass', fs: 2000 }), sosConcat(mainsNotch(50, 2000, { harmonics: 3, Q: 30 }), butter(2, [20, 450], { btype: 'bandpass', fs: 2000 })), butter(3, 100, { btype: 'lowpass', fs: 1000 })]) {
      const n = 5000, ns = sos.length / 6;
      const a = noise(1, n), b = noise(2, n);
      const k = sosPairKernel(sos, 4 * n)!;
      const ka = k.array(n), kb = k.array(n), ra = k.array(n), rb = k.array(n);
      const sa = new Float64Array(2 * ns).fill(0.25), sb = new Float64Array(2 * ns).fill(-1);
      const ta = sa.slice(), tb = sb.slice();
      const ea = new Float64Array(n), eb = new Float64Array(n), fa = new Float64Array(n), fb = new Float64Array(n);
      sosfiltInPlace(sos, ta, ea, 0, n, a, 0); sosfiltInPlace(sos, tb, eb, 0, n, b, 0);
      k.run(sa, ka, sb, kb, 0, n, false, a, b, 0);
      sosfiltReverseInPlace(sos, ta, fa, 17, n - 3, ea, 17); sosfiltReverseInPlace(sos, tb, fb, 17, n - 3, eb, 17);
      k.run(sa, ra, sb, rb, 17, n - 3, true, ka, kb, 17);
      expect(differing(ka, ea, 0, n) + differing(kb, eb, 0, n)).toBe(0);
      expect(differing(ra, fa, 17, n - 3) + differing(rb, fb, 17, n - 3)).toBe(0);
      expect(Array.from(sa)).toEqual(Array.from(ta));
      expect(Array.from(sb)).toEqual(Array.from(tb));
    }
  });

  it('array() refuses to go beyond the capacity, run() refuses destinations outside the kernel memory', () => {
    const k = sosPairKernel(butter(2, 50, { btype: 'highpass', fs: 1000 }), 10);
    if (k === null) return;
    k.array(6);
    expect(() => k.array(5)).toThrow(RangeError);
    expect(() => k.run(new Float64Array(4), new Float64Array(3), new Float64Array(4), new Float64Array(3), 0, 3, false)).toThrow(RangeError);
  });
});

describe('ZeroPhaseBank(sos, channels)', () => {
  // expected: shared/fixtures/dsp/butter_bandpass.json, scipy 1.17.1 sosfiltfilt (default padding)
  const data = loadDspFixture<{ input: { x: number[] }; cases: { sos: number[][]; sosfiltfilt_default: number[]; btype: string; order: number; fs: number }[] }>('butter_bandpass.json');
  const x = Float64Array.from(data.input.x);
  for (const c of data.cases) {
    it(`every channel of a 3-channel bank (a SIMD pair + one scalar) equals scipy sosfiltfilt within 1e-10·max|x|: ${c.btype} ${c.order} fs ${c.fs}`, () => {
      const sos = Float64Array.from(c.sos.flat());
      const scaled = [x, Float64Array.from(x, (v) => -2 * v), Float64Array.from(x, (v) => 0.5 * v + 3)];
      const want = [c.sosfiltfilt_default.map((v) => v), c.sosfiltfilt_default.map((v) => -2 * v), null];
      const ys = bankRun(new ZeroPhaseBank(sos, 3, { blockSize: 1 }), scaled, randomSplits(x.length, 9, 400));
      expect(maxAbsDiff(ys[0]!, want[0]!)).toBeLessThanOrEqual(1e-10 * maxAbs(x));
      expect(maxAbsDiff(ys[1]!, want[1]!)).toBeLessThanOrEqual(2e-10 * maxAbs(x));
    });
  }

  it('channels filtered in SIMD pairs are bit-identical to the scalar path, for 1–5 channels and any chunking', () => {
    const sos = butter(4, [30, 400], { btype: 'bandpass', fs: 2000 });
    const n = 40000;
    for (const C of [1, 2, 3, 5]) {
      const xs = Array.from({ length: C }, (_, c) => noise(10 + c, n));
      const splits = randomSplits(n, C, 3000);
      const simd = bankRun(new ZeroPhaseBank(sos, C, { blockSize: 4096 }), xs, splits);
      const scalar = bankRun(new ZeroPhaseBank(sos, C, { blockSize: 4096, simd: false }), xs, randomSplits(n, C + 7, 5000));
      for (let c = 0; c < C; c++) expect(differing(simd[c]!, scalar[c]!, 0, n)).toBe(0);
    }
  });

  it('pushTo refuses chunks of unequal length or the wrong count', () => {
    const bank = new ZeroPhaseBank(butter(2, 50, { btype: 'highpass', fs: 1000 }), 2);
    expect(() => bank.pushTo([new Float64Array(3), new Float64Array(4)], null)).toThrow(RangeError);
    expect(() => bank.pushTo([new Float64Array(3)], null)).toThrow(RangeError);
  });
});

describe('BandFilterBank(options, channels)', () => {
  it('each channel equals a BandFilter of its own, NaN runs included (NaN in, NaN out at the same samples)', () => {
    const n = 30000, C = 3;
    const xs = Array.from({ length: C }, (_, c) => noise(30 + c, n));
    for (let i = 1000; i < 1200; i++) xs[1]![i] = NaN;
    xs[2]![n - 1] = NaN;
    const opts = { fs: 2000, band_hz: [30, 400] as [number, number], mains_hz: 50 as const };
    const bank = new BandFilterBank(opts, C);
    const got: Float64Array[][] = xs.map(() => []);
    const sink = (c: number, y: Float64Array) => got[c]!.push(y.slice());
    let at = 0;
    for (const len of randomSplits(n, 3, 4000)) { bank.pushTo(xs.map((x) => x.subarray(at, at + len)), sink); at += len; }
    bank.flushTo(sink);
    for (let c = 0; c < C; c++) {
      const one = new BandFilter(opts);
      const a = one.push(xs[c]!), b = one.flush();
      const want = new Float64Array(n);
      want.set(a); want.set(b, a.length);
      const have = new Float64Array(n);
      let o = 0;
      for (const p of got[c]!) { have.set(p, o); o += p.length; }
      expect(differing(have, want, 0, n)).toBe(0);
    }
  });
});
