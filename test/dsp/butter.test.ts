import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { butter, type BType } from '../../lib/dsp/butter.js';
import { sosfreqz } from '../../lib/dsp/sosfreqz.js';
import { UsageError } from '../../lib/errors.js';
import { loadDspFixture } from './load-fixture.js';

interface Design { btype: BType; fs: number; order: number; low_hz?: number; high_hz?: number; cutoff_hz?: number; sos: number[][];
  freq_response: { freqs_hz: number[]; magnitude: number[] } }

const sets = ['butter_bandpass.json', 'butter_lowpass_highpass.json'];
const designs: [string, Design][] = sets.flatMap((f) => loadDspFixture<{ cases: Design[] }>(f).cases.map((c) => [f, c] as [string, Design]));
const cutoffs = (c: Design) => (c.cutoff_hz !== undefined ? c.cutoff_hz : [c.low_hz!, c.high_hz!]);
const label = (c: Design) => `${c.btype} order ${c.order} ${JSON.stringify(cutoffs(c))} Hz fs ${c.fs}`;

function poleRadii(sos: Float64Array): number[] {
  const r: number[] = [];
  for (let s = 0; s < sos.length / 6; s++) {
    const a1 = sos[s * 6 + 4], a2 = sos[s * 6 + 5];
    const d = a1 * a1 - 4 * a2;
    if (d < 0) r.push(Math.sqrt(a2));
    else r.push(Math.abs((-a1 + Math.sqrt(d)) / 2), Math.abs((-a1 - Math.sqrt(d)) / 2));
  }
  return r;
}

describe('butter(order, cutoffsHz, { btype, fs })', () => {
  // expected: shared/fixtures/dsp/butter_*.json, scipy 1.17.1 butter(..., output='sos'); tolerance rel ≤ 1e-9 (fixtures README)
  for (const [file, c] of designs) {
    it(`${label(c)} gives scipy's SOS rows (${file})`, () => {
      const sos = butter(c.order, cutoffs(c), { btype: c.btype, fs: c.fs });
      expect(sos.length).toBe(c.sos.length * 6);
      const scale = Math.max(...c.sos.flat().map(Math.abs));
      c.sos.flat().forEach((v, i) => expect(Math.abs(sos[i] - v)).toBeLessThanOrEqual(1e-9 * Math.max(Math.abs(v), 1e-3 * scale)));
    });
    it(`${label(c)}: |H| at the listed frequencies equals scipy sosfreqz (${file})`, () => {
      const sos = butter(c.order, cutoffs(c), { btype: c.btype, fs: c.fs });
      const m = sosfreqz(sos, c.freq_response.freqs_hz, c.fs);
      c.freq_response.magnitude.forEach((v, i) => expect(Math.abs(m[i] - v)).toBeLessThanOrEqual(1e-9 * Math.max(v, 1e-12)));
    });
    it(`${label(c)}: poles inside the unit circle, |H| = 1/√2 at the cut-offs`, () => {
      const sos = butter(c.order, cutoffs(c), { btype: c.btype, fs: c.fs });
      for (const r of poleRadii(sos)) expect(r).toBeLessThan(1);
      // Butterworth −3.01 dB point: METHODS.md §10 (scipy.signal.butter docs)
      const cs = ([] as number[]).concat(cutoffs(c));
      for (const m of sosfreqz(sos, cs, c.fs)) expect(m).toBeCloseTo(Math.SQRT1_2, 9);
    });
  }

  it('butter(4, [20, 450], bandpass, fs 2000) has unity gain mid-band (geometric centre)', () => {
    const sos = butter(4, [20, 450], { btype: 'bandpass', fs: 2000 });
    // centre of the prewarped band; Butterworth passband is maximally flat there
    const f0 = (2000 / Math.PI) * Math.atan(Math.sqrt(Math.tan((Math.PI * 20) / 2000) * Math.tan((Math.PI * 450) / 2000)));
    expect(sosfreqz(sos, [f0], 2000)[0]).toBeCloseTo(1, 12);
  });

  it('butter(n, fc, lowpass) has unity DC gain for orders 1…10, and odd orders end with a first-order section', () => {
    for (let n = 1; n <= 10; n++) {
      const sos = butter(n, 100, { fs: 1000 });
      expect(sos.length).toBe(6 * Math.ceil(n / 2));
      expect(sosfreqz(sos, [0], 1000)[0]).toBeCloseTo(1, 12);
      if (n % 2 === 1) expect(sos.filter((_, i) => i % 6 === 2 || i % 6 === 5).filter((v) => v === 0).length).toBe(2);
    }
  });

  it('butter(n, [lo, hi], bandstop) rejects the centre and passes DC and Nyquist', () => {
    const sos = butter(3, [40, 60], { btype: 'bandstop', fs: 1000 });
    const m = sosfreqz(sos, [0, Math.sqrt(40 * 60), 499.999], 1000);
    expect(m[0]).toBeCloseTo(1, 9);
    expect(m[1]).toBeLessThan(0.01);
    expect(sosfreqz(sos, [40, 60], 1000)[0]).toBeCloseTo(Math.SQRT1_2, 9);
  });

  it('butter rejects bad parameters with a message naming parameter, range and value', () => {
    expect(() => butter(4, [20, 600], { btype: 'bandpass', fs: 1000 })).toThrow(UsageError);
    expect(() => butter(4, [20, 600], { btype: 'bandpass', fs: 1000 })).toThrow('high cut-off must be below fs/2 (fs=1000 Hz → 500 Hz), got 600');
    expect(() => butter(0, 10, { fs: 1000 })).toThrow('filter order must be an integer from 1 to 10, got 0');
    expect(() => butter(11, 10, { fs: 1000 })).toThrow('from 1 to 10');
    expect(() => butter(4, [300, 30], { btype: 'bandpass', fs: 1000 })).toThrow('low cut-off must be below the high cut-off (30 Hz), got 300');
    expect(() => butter(4, 10, { btype: 'bandpass', fs: 1000 })).toThrow('two cut-offs');
    expect(() => butter(4, 10, { fs: 0 })).toThrow('sampling rate fs must be a positive number in Hz, got 0');
    expect(() => butter(4, -1, { fs: 100 })).toThrow('cut-off must be above 0 Hz, got -1');
  });
});

describe('butter(order, cutoffs, { btype, fs }) over orders 1…10 and all btypes', () => {
  // expected: test/dsp/fixtures/butter_designs.json, generated by gen_butter_designs.py with scipy 1.17.1
  const gen = JSON.parse(readFileSync(new URL('./fixtures/butter_designs.json', import.meta.url), 'utf8')) as
    { cases: { fs: number; order: number; btype: BType; cutoffs_hz: number | number[]; sos: number[][] }[] };
  it(`reproduces all ${gen.cases.length} scipy designs row for row (rel 1e-9), or the same response where pole radii tie`, () => {
    const bad: string[] = [];
    for (const c of gen.cases) {
      const sos = butter(c.order, c.cutoffs_hz, { btype: c.btype, fs: c.fs });
      const ref = c.sos.flat();
      const scale = Math.max(...ref.map(Math.abs));
      const ok = sos.length === ref.length && ref.every((v, i) => Math.abs(sos[i] - v) <= 1e-9 * Math.max(Math.abs(v), 1e-6 * scale));
      if (!ok) bad.push(`${c.btype} ${c.order} ${JSON.stringify(c.cutoffs_hz)} fs ${c.fs}`);
      else continue;
      // A band symmetric about fs/4 gives pole pairs z and −z with radii equal up to the last
      // bit; scipy's "pole nearest the unit circle first" then decides by rounding noise. The
      // rows may be ordered differently, but the filter must be the same.
      const cut = c.cutoffs_hz as number[];
      expect(Math.abs(cut[0] + cut[1] - c.fs / 2)).toBeLessThan(1e-9);
      const freqs = Array.from({ length: 400 }, (_, i) => ((i + 0.5) / 400) * (c.fs / 2));
      const mine = sosfreqz(sos, freqs, c.fs), theirs = sosfreqz(Float64Array.from(ref), freqs, c.fs);
      mine.forEach((v, i) => expect(Math.abs(v - theirs[i])).toBeLessThanOrEqual(1e-9 * Math.max(theirs[i], 1e-12)));
    }
    // the cases that may differ in row order only: band-stop 100–300 Hz and band-pass 20–380 Hz at fs 800, high orders
    expect(bad.length).toBeLessThanOrEqual(8);
  });
});
