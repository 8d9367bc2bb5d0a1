import { describe, expect, it } from 'vitest';
import { butter, type BType } from '../../lib/dsp/butter.js';
import { SosFilter } from '../../lib/dsp/sos-filter.js';
import { sosfilt } from '../../lib/dsp/sosfilt.js';
import { sosfiltZi } from '../../lib/dsp/sosfilt-zi.js';
import { sosfiltfilt } from '../../lib/dsp/sosfiltfilt.js';
import { loadDspFixture, maxAbs, maxAbsDiff, randomSplits } from './load-fixture.js';

interface Design { btype: BType; fs: number; order: number; low_hz?: number; high_hz?: number; cutoff_hz?: number; sos: number[][];
  sosfilt: number[]; sosfiltfilt_default: number[]; sosfiltfilt_default_padlen: number; sosfiltfilt_padtype_none: number[]; sosfilt_zi: number[][] }
interface FilterFile { input: { x: number[] }; cases: Design[] }

const files = ['butter_bandpass.json', 'butter_lowpass_highpass.json'].map((f) => [f, loadDspFixture<FilterFile>(f)] as const);

describe('sosfilt / sosfiltZi / sosfiltfilt against scipy', () => {
  // expected: shared/fixtures/dsp/butter_*.json, scipy 1.17.1; sos taken from the fixture so that
  // filtering is tested on its own; tolerances from the fixtures README
  for (const [file, data] of files) {
    const x = data.input.x;
    const scale = maxAbs(x);
    for (const c of data.cases) {
      const name = `${c.btype} order ${c.order} fs ${c.fs} (${file})`;
      const sos = Float64Array.from(c.sos.flat());
      it(`sosfilt(sos, x) equals scipy.signal.sosfilt within 1e-12·max|x|: ${name}`, () => {
        expect(maxAbsDiff(sosfilt(sos, x), c.sosfilt)).toBeLessThanOrEqual(1e-12 * scale);
      });
      it(`sosfiltZi(sos) equals scipy.signal.sosfilt_zi: ${name}`, () => {
        const zi = sosfiltZi(sos);
        const ref = c.sosfilt_zi.flat();
        ref.forEach((v, i) => expect(Math.abs(zi[i] - v)).toBeLessThanOrEqual(1e-10 * Math.max(1, Math.abs(v))));
      });
      it(`sosfiltfilt(sos, x) (padtype odd, default padlen) equals scipy within 1e-10·max|x|: ${name}`, () => {
        expect(maxAbsDiff(sosfiltfilt(sos, x), c.sosfiltfilt_default)).toBeLessThanOrEqual(1e-10 * scale);
      });
      it(`sosfiltfilt(sos, x, { padtype: 'none' }) equals scipy padtype=None within 1e-10·max|x|: ${name}`, () => {
        expect(maxAbsDiff(sosfiltfilt(sos, x, { padtype: 'none' }), c.sosfiltfilt_padtype_none)).toBeLessThanOrEqual(1e-10 * scale);
      });
      it(`sosfiltfilt(sos, x, { padlen }) with the fixture's padlen equals the default: ${name}`, () => {
        expect(maxAbsDiff(sosfiltfilt(sos, x, { padlen: c.sosfiltfilt_default_padlen }), c.sosfiltfilt_default)).toBeLessThanOrEqual(1e-10 * scale);
      });
      it(`SosFilter.push over random chunk splits equals sosfilt on the whole signal: ${name}`, () => {
        const whole = sosfilt(sos, x);
        for (const seed of [1, 2, 3]) {
          const f = new SosFilter(sos);
          const got: number[] = [];
          let at = 0;
          for (const len of randomSplits(x.length, seed, 400)) {
            got.push(...f.push(x.slice(at, at + len)));
            at += len;
          }
          expect(got).toEqual(Array.from(whole));
        }
      });
    }
  }

  it('sosfilt(sos, x) does not modify x; SosFilter.push(x, x) filters in place', () => {
    const sos = butter(2, 50, { fs: 1000 });
    const x = Float64Array.from({ length: 100 }, (_, i) => Math.sin(i));
    const copy = x.slice();
    const y = sosfilt(sos, x);
    expect(x).toEqual(copy);
    const f = new SosFilter(sos);
    const same = f.push(x, x);
    expect(same).toBe(x);
    expect(Array.from(x)).toEqual(Array.from(y));
  });

  it('sosfilt with sosfiltZi·x0 starts a constant input in steady state (no transient)', () => {
    const sos = butter(4, 30, { fs: 1000 });
    const zi = sosfiltZi(sos).map((v) => v * 3);
    const y = sosfilt(sos, new Float64Array(50).fill(3), zi);
    for (const v of y) expect(v).toBeCloseTo(3, 12);
  });

  it('sosfiltfilt throws when the signal is not longer than padlen', () => {
    const sos = butter(4, [30, 300], { btype: 'bandpass', fs: 1000 });
    expect(() => sosfiltfilt(sos, new Float64Array(27))).toThrow('longer than padlen (27 samples)');
  });
});
