import { describe, expect, it } from 'vitest';
import { iirnotch } from '../../lib/dsp/iirnotch.js';
import { mainsNotch } from '../../lib/dsp/mains-notch.js';
import { sosfilt } from '../../lib/dsp/sosfilt.js';
import { sosfiltfilt } from '../../lib/dsp/sosfiltfilt.js';
import { sosfreqz } from '../../lib/dsp/sosfreqz.js';
import { loadDspFixture, maxAbs, maxAbsDiff } from './load-fixture.js';

interface NotchCase { fs: number; f0_hz: number; Q: number; b: number[]; a: number[];
  freq_response: { freqs_hz: number[]; magnitude: number[] }; lfilter: number[]; filtfilt_default: number[] }
const data = loadDspFixture<{ input: { x: number[] }; cases: NotchCase[] }>('iirnotch.json');
const x = data.input.x;
const scale = maxAbs(x);

describe('iirnotch(f0, Q, fs)', () => {
  // expected: shared/fixtures/dsp/iirnotch.json, scipy 1.17.1 iirnotch / freqz / lfilter / filtfilt
  for (const c of data.cases) {
    const name = `f0 ${c.f0_hz} Hz, Q ${c.Q}, fs ${c.fs}`;
    const sos = iirnotch(c.f0_hz, c.Q, c.fs);
    it(`${name}: b and a equal scipy (rel 1e-9)`, () => {
      c.b.forEach((v, i) => expect(Math.abs(sos[i] - v)).toBeLessThanOrEqual(1e-9 * Math.abs(v)));
      c.a.forEach((v, i) => expect(Math.abs(sos[3 + i] - v)).toBeLessThanOrEqual(1e-9 * Math.abs(v)));
    });
    it(`${name}: |H| equals scipy freqz; exactly at f0 below −100 dB`, () => {
      const m = sosfreqz(sos, c.freq_response.freqs_hz, c.fs);
      c.freq_response.freqs_hz.forEach((f, i) => {
        if (f === c.f0_hz) expect(20 * Math.log10(m[i] + 1e-300)).toBeLessThan(-100);
        else expect(Math.abs(m[i] - c.freq_response.magnitude[i])).toBeLessThanOrEqual(1e-9 * c.freq_response.magnitude[i]);
      });
    });
    it(`${name}: sosfilt equals lfilter (1e-12·max|x|), sosfiltfilt equals filtfilt (1e-10·max|x|)`, () => {
      expect(maxAbsDiff(sosfilt(sos, x), c.lfilter)).toBeLessThanOrEqual(1e-12 * scale);
      // filtfilt's padlen for a biquad = 3·max(len(a), len(b)) = 9 = sosfiltfilt's rule for one section
      expect(maxAbsDiff(sosfiltfilt(sos, x), c.filtfilt_default)).toBeLessThanOrEqual(1e-10 * scale);
    });
  }
  it('iirnotch rejects f0 at or above fs/2 and Q ≤ 0', () => {
    expect(() => iirnotch(500, 30, 1000)).toThrow('notch frequency must be between 0 and fs/2 (fs=1000 Hz → 500 Hz), got 500');
    expect(() => iirnotch(50, 0, 1000)).toThrow('Q must be a positive number, got 0');
  });
});

describe('mainsNotch(mainsHz, fs, { harmonics, Q })', () => {
  it('mainsNotch(50, 1000, { harmonics: 12 }) notches 50…450 Hz only (9 sections below fs/2)', () => {
    const sos = mainsNotch(50, 1000, { harmonics: 12 });
    expect(sos.length / 6).toBe(9);
    const m = sosfreqz(sos, [50, 100, 150, 450, 75], 1000);
    for (let i = 0; i < 4; i++) expect(m[i]).toBeLessThan(1e-6);
    expect(m[4]).toBeGreaterThan(0.9);
  });
  it('mainsNotch rejects a mains frequency other than 50 or 60', () => {
    expect(() => mainsNotch(55 as 50, 1000)).toThrow('mains frequency must be 50 or 60');
  });
});
