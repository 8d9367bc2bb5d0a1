// `shiftload spectrum` through main(): the PSD in --json against scipy.signal.welch of the same
// signals decoded independently from the EDF bytes (test/dsp/fixtures/spectrum_edf.json, made by
// gen_spectrum_edf.py with numpy 2.4 / scipy 1.17.1); summary values against the library functions.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { meanFrequency } from '../../lib/dsp/mean-frequency.js';

interface Case { file: string; label: string; start_s: number; end_s: number; nperseg: number; overlap: number; noverlap: number; fs: number; f_hz: number[]; psd: number[] }
const ref = JSON.parse(readFileSync(new URL('../dsp/fixtures/spectrum_edf.json', import.meta.url), 'utf8')) as { cases: Case[] };
const edf = (name: string) => new URL(`../../../shared/fixtures/edf/${name}`, import.meta.url).pathname;

describe('shiftload spectrum FILE --json', () => {
  for (const c of ref.cases) {
    it(`spectrum ${c.file} --signal "${c.label}" --start ${c.start_s} --end ${c.end_s}: PSD equals scipy welch within 1e-10 of its maximum`, async () => {
      const io = bufferIO();
      const args = ['spectrum', edf(c.file), '--signal', c.label, '--start', String(c.start_s), '--end', String(c.end_s), '--overlap', String(c.overlap), '--json'];
      if (c.file !== 'emg_3sig.edf') args.push('--nperseg', String(c.nperseg)); // emg_3sig: the default (nearest power of two to 1 s)
      expect(await main(args, io)).toBe(0);
      const r = JSON.parse(io.stdout);
      expect(r.signals).toHaveLength(1);
      const s = r.signals[0];
      expect(s.label).toBe(c.label);
      expect([s.welch.nperseg, s.welch.noverlap]).toEqual([c.nperseg, c.noverlap]);
      expect(s.frequencies_hz).toHaveLength(c.f_hz.length);
      c.f_hz.forEach((f, k) => expect(s.frequencies_hz[k]).toBeCloseTo(f, 9));
      const max = Math.max(...c.psd);
      c.psd.forEach((v, k) => expect(Math.abs(s.psd[k] - v)).toBeLessThanOrEqual(1e-10 * max));
      expect(s.mnf_full_hz).toBeCloseTo(meanFrequency(c.f_hz, c.psd), 6);
      let total = 0;
      for (const v of c.psd) total += v * (c.fs / c.nperseg);
      expect(s.total_power).toBeCloseTo(total, 6);
      expect(s.suggestion.reasons.length).toBeGreaterThanOrEqual(3);
    });
  }

  it('without --signal every signal is analysed, each at its own rate', async () => {
    const io = bufferIO();
    expect(await main(['spectrum', edf('emg_3sig.edf'), '--json'], io)).toBe(0);
    const r = JSON.parse(io.stdout);
    expect(r.signals.map((s: { rate_hz: number }) => s.rate_hz)).toEqual([1000, 1000, 500]);
  });
});

describe('shiftload spectrum FILE (text)', () => {
  it('prints MNF, MDF, mains ratio, low-frequency share and the suggested band with reasons', async () => {
    const io = bufferIO();
    expect(await main(['spectrum', edf('emg_3sig.edf'), '--signal', 'EMG L trapezius'], io)).toBe(0);
    for (const word of ['mean frequency (MNF)', 'median frequency (MDF)', 'mains ratio', 'below 20 Hz', 'suggested band', 'why:']) {
      expect(io.stdout).toContain(word);
    }
  });
  it('usage errors give exit 2 and one line: unknown signal, bad span, bad overlap, span shorter than a segment', async () => {
    for (const [args, text] of [
      [['--signal', 'nope'], "--signal: no signal named 'nope'"],
      [['--start', '5', '--end', '50'], '--start 5 / --end 50: expected 0 <= start < end <= 10 s'],
      [['--overlap', '1'], '--overlap must be a fraction from 0 to below 1'],
      [['--start', '0', '--end', '0.5'], 'fewer than one segment (nperseg 1024)'],
      [['--nperseg', '1000'], 'nperseg must be a power of two'],
    ] as [string[], string][]) {
      const io = bufferIO();
      expect(await main(['spectrum', edf('emg_3sig.edf'), ...args], io)).toBe(2);
      expect(io.stderr.trim().split('\n')).toHaveLength(1);
      expect(io.stderr).toContain(text);
    }
  });
  it('a missing file is an input error (exit 2) naming the file', async () => {
    const io = bufferIO();
    expect(await main(['spectrum', '/nonexistent/x.edf'], io)).toBe(2);
    expect(io.stderr).toContain('/nonexistent/x.edf');
  });
});
