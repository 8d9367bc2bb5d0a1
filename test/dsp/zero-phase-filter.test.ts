import { describe, expect, it } from 'vitest';
import { butter } from '../../lib/dsp/butter.js';
import { mainsNotch } from '../../lib/dsp/mains-notch.js';
import { sosConcat } from '../../lib/dsp/sos.js';
import { sosfiltfilt } from '../../lib/dsp/sosfiltfilt.js';
import { ZeroPhaseFilter, zeroPhaseFilter } from '../../lib/dsp/zero-phase-filter.js';
import { zeroPhaseOverlap } from '../../lib/dsp/zero-phase-overlap.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';
import { loadDspFixture, maxAbs, maxAbsDiff, randomSplits } from './load-fixture.js';

function streamed(zp: ZeroPhaseFilter, x: Float64Array, splits: number[]): Float64Array {
  const parts: Float64Array[] = [];
  let at = 0;
  for (const len of splits) { parts.push(zp.push(x.subarray(at, at + len))); at += len; }
  parts.push(zp.flush());
  const out = new Float64Array(parts.reduce((n, p) => n + p.length, 0));
  let o = 0;
  for (const p of parts) { out.set(p, o); o += p.length; }
  return out;
}

describe('ZeroPhaseFilter(sos) against scipy sosfiltfilt', () => {
  // expected: shared/fixtures/dsp/butter_*.json and iirnotch.json, scipy 1.17.1 sosfiltfilt/filtfilt (default padding)
  const files = ['butter_bandpass.json', 'butter_lowpass_highpass.json'];
  for (const f of files) {
    const data = loadDspFixture<{ input: { x: number[] }; cases: { sos: number[][]; sosfiltfilt_default: number[]; sosfiltfilt_padtype_none: number[]; btype: string; order: number; fs: number }[] }>(f);
    const x = Float64Array.from(data.input.x);
    for (const c of data.cases) {
      it(`push in random chunks + flush equals scipy sosfiltfilt within 1e-10·max|x|, small blocks: ${c.btype} ${c.order} fs ${c.fs} (${f})`, () => {
        const sos = Float64Array.from(c.sos.flat());
        for (const seed of [5, 6]) {
          const y = streamed(new ZeroPhaseFilter(sos, { blockSize: 1 }), x, randomSplits(x.length, seed, 500));
          expect(maxAbsDiff(y, c.sosfiltfilt_default)).toBeLessThanOrEqual(1e-10 * maxAbs(x));
        }
        const yn = zeroPhaseFilter(sos, x, { padtype: 'none', blockSize: 1 });
        expect(maxAbsDiff(yn, c.sosfiltfilt_padtype_none)).toBeLessThanOrEqual(1e-10 * maxAbs(x));
      });
    }
  }
  const notch = loadDspFixture<{ input: { x: number[] }; cases: { as_sos: number[][]; filtfilt_default: number[]; fs: number }[] }>('iirnotch.json');
  for (const c of notch.cases) {
    it(`notch fs ${c.fs}: block filtering equals scipy filtfilt within 1e-10·max|x|`, () => {
      const y = zeroPhaseFilter(Float64Array.from(c.as_sos.flat()), notch.input.x, { blockSize: 1 });
      expect(maxAbsDiff(y, c.filtfilt_default)).toBeLessThanOrEqual(1e-10 * maxAbs(notch.input.x));
    });
  }
});

describe('ZeroPhaseFilter on a long signal', () => {
  it('10 min at 2 kHz, notch + band-pass, 64k blocks: equals whole-signal sosfiltfilt within 1e-9 of full scale', () => {
    const fs = 2000, n = 10 * 60 * fs;
    const rng = new SplitMix64(7);
    const x = new Float64Array(n);
    for (let i = 0; i < n; i++) x[i] = 300 + 50 * rng.normal() + 80 * Math.sin(2 * Math.PI * 50 * i / fs) + (i > n / 3 ? 200 : 0);
    const sos = sosConcat(mainsNotch(50, fs, { harmonics: 3 }), butter(4, [20, 450], { btype: 'bandpass', fs }));
    const ref = sosfiltfilt(sos, x);
    const y = streamed(new ZeroPhaseFilter(sos), x, randomSplits(n, 9, 40000));
    expect(y.length).toBe(n);
    expect(maxAbsDiff(y, ref)).toBeLessThanOrEqual(1e-9 * maxAbs(x));
  });
  it('the documented bound holds: with tolerance t the block error stays ≤ t·max|x| (t = 1e-4, 1e-7, 1e-10)', () => {
    const fs = 1000, n = 200_000;
    const rng = new SplitMix64(17);
    const x = new Float64Array(n);
    for (let i = 0; i < n; i++) x[i] = 100 + 20 * rng.normal() + 50 * Math.sin(i / 500);
    for (const sos of [butter(4, 10, { fs }), butter(4, [20, 300], { btype: 'bandpass', fs }), mainsNotch(50, fs)]) {
      const ref = sosfiltfilt(sos, x);
      for (const t of [1e-4, 1e-7, 1e-10]) {
        const zp = new ZeroPhaseFilter(sos, { tolerance: t, blockSize: 1 });
        const y = streamed(zp, x, randomSplits(n, 3, 5000));
        expect(n / zp.blockSize).toBeGreaterThan(3); // several blocks, so the bound is really exercised
        expect(maxAbsDiff(y, ref)).toBeLessThanOrEqual(t * maxAbs(x));
      }
    }
  });
  it('zeroPhaseOverlap grows with the slowest pole: notch (Q 30) needs more than the band-pass', () => {
    const bp = zeroPhaseOverlap(butter(4, [20, 450], { btype: 'bandpass', fs: 2000 }));
    const nt = zeroPhaseOverlap(mainsNotch(50, 2000));
    expect(bp).toBeGreaterThan(100);
    expect(nt).toBeGreaterThan(bp);
  });
  it('a stream shorter than padlen + 1 is filtered with padlen = N − 1; an empty stream gives nothing', () => {
    const sos = butter(4, [30, 300], { btype: 'bandpass', fs: 1000 });
    const x = Float64Array.from({ length: 10 }, (_, i) => Math.sin(i));
    expect(maxAbsDiff(zeroPhaseFilter(sos, x), sosfiltfilt(sos, x, { padlen: 9 }))).toBeLessThan(1e-12);
    expect(zeroPhaseFilter(sos, []).length).toBe(0);
  });
});
