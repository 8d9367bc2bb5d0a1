// Band powers of a window's averaged spectrum for the quality screening: power below the motion
// limit, power in the EMG band, and for each mains frequency the power of its multiples above the
// local spectral background (so broadband EMG at 50 Hz is not mistaken for hum). Segments are
// averaged first (Welch) and the powers taken from the average, so the background estimate is
// not biased by the spread of single-segment periodograms.
import { PairedPowerSpectra } from '../dsp/paired-power-spectra.js';

/** Fixed layout of the output of SegmentBandPowers.compute (indices into `out`). */
export const BAND = { low: 0, band: 1, mains0: 2 } as const;

export interface SegmentBandPowersOptions {
  fs: number;
  /** Segment length, samples (power of two). */
  nperseg: number;
  /** Low-frequency limit, Hz: bins 1…below it count as low-frequency power. */
  motion_hz: number;
  /** EMG band [low, high], Hz (high capped at 0.9·fs/2). */
  band_hz: readonly [number, number];
  mains_hz: readonly number[];
  mains_harmonics: number;
}

/**
 * Band powers of averaged segment spectra (units: mean |X|² of the Hann-windowed segments; only
 * ratios are used). Each segment: mean removed, Hann window, its power spectrum (two segments per
 * SIMD transform, PairedPowerSpectra); all buffers are allocated once.
 * @example const p = new SegmentBandPowers({ fs: 1000, nperseg: 512, motion_hz: 20, band_hz: [20, 450], mains_hz: [50, 60], mains_harmonics: 5 });
 *   p.add(segment); p.add(next); p.compute(out); p.reset() // out[BAND.low], out[BAND.band], out[BAND.mains0 + i]
 */
export class SegmentBandPowers {
  private readonly n: number;
  private readonly win: Float64Array;
  private readonly spectra: PairedPowerSpectra;
  private readonly pow: Float64Array;
  private readonly acc: Float64Array;
  private readonly accLo: number;
  private readonly accHi: number;
  /** Segments added since the last reset. */
  count = 0;
  private absLow = 0;
  private absBand = 0;
  private readonly lowEnd: number;
  private readonly bandLo: number;
  private readonly bandHi: number;
  /** Per mains frequency: the centre bins of the multiples checked. */
  private readonly centres: Int32Array[];
  /** Number of output values: low, band, then one per mains frequency. */
  readonly width: number;

  constructor(o: SegmentBandPowersOptions) {
    const n = o.nperseg;
    this.n = n;
    this.win = new Float64Array(n);
    for (let i = 0; i < n; i++) this.win[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / n);
    this.spectra = new PairedPowerSpectra(n);
    this.pow = new Float64Array(n / 2 + 1);
    this.acc = new Float64Array(n / 2 + 1);
    const df = o.fs / n;
    const hiHz = Math.min(o.band_hz[1], 0.9 * (o.fs / 2));
    this.lowEnd = Math.max(1, Math.ceil(o.motion_hz / df)); // bins 1 … lowEnd−1
    this.bandLo = Math.ceil(o.band_hz[0] / df);
    this.bandHi = Math.floor(hiHz / df);
    this.centres = o.mains_hz.map((f) => {
      const c: number[] = [];
      for (let h = 1; h <= o.mains_harmonics; h++) {
        const k = Math.round((h * f) / df);
        if (h * f >= o.band_hz[0] && h * f <= hiHz && k - 12 >= 1 && k + 12 <= n / 2) c.push(k);
      }
      return Int32Array.from(c);
    });
    this.width = 2 + o.mains_hz.length;
    // bins that compute() reads from the normalized average: the band and 12 bins beyond
    this.accLo = Math.max(0, this.bandLo - 12);
    this.accHi = Math.min(n / 2 + 1, this.bandHi + 13);
  }

  /** Add the periodogram of segment x[0..nperseg) (not modified); a segment holding NaN is skipped. */
  add(x: Float64Array): void {
    const n = this.n, win = this.win;
    let m0 = 0, m1 = 0; // two lanes: independent additions (n is even)
    for (let i = 0; i < n; i += 2) { m0 += x[i]; m1 += x[i + 1]; }
    let mean = m0 + m1;
    if (mean !== mean) return;
    mean /= n;
    const w = this.spectra.input();
    for (let i = 0; i < n; i++) w[i] = (x[i] - mean) * win[i];
    this.count++;
    this.spectra.submit(this.accumulate); // transformed two segments at a time (SIMD)
  }

  /** One segment's periodogram into the sums (called in the order the segments were added). */
  private readonly accumulate = (p: Float64Array): void => {
    const acc = this.acc;
    let band = 0, low = 0;
    const lowEnd = this.lowEnd, bandLo = this.bandLo, bandHi = this.bandHi;
    for (let k = 1; k < lowEnd; k++) low += p[k];
    for (let k = bandLo; k <= bandHi; k++) band += p[k];
    this.absLow += low;
    this.absBand += band;
    // the mains test uses the average of band-normalized periodograms: every segment counts
    // equally, so a loud burst in one segment does not leave the average with few degrees of freedom
    if (band > 0) {
      const inv = 1 / band;
      for (let k = this.accLo; k < this.accHi; k++) acc[k] += p[k] * inv;
    }
  };

  /** Forget the segments added so far. */
  reset(): void {
    this.spectra.flush(); // a segment waiting for its pair belongs to what is forgotten
    this.acc.fill(0);
    this.count = 0;
    this.absLow = 0;
    this.absBand = 0;
  }

  /**
   * Into out[0..width): mean low-frequency power and mean EMG-band power per segment (|X|²), and
   * for each mains frequency its power above the local background relative to the EMG-band power
   * without the hum (a ratio), from the mean band-normalized periodogram.
   */
  compute(out: Float64Array): void {
    this.spectra.flush(); // every added segment in the sums
    const p = this.pow, c = Math.max(1, this.count);
    for (let k = this.accLo; k < this.accHi; k++) p[k] = this.acc[k] / c;
    let band = 0;
    for (let k = this.bandLo; k <= this.bandHi; k++) band += p[k];
    out[BAND.low] = this.absLow / c;
    out[BAND.band] = this.absBand / c;
    for (let m = 0; m < this.centres.length; m++) {
      const cs = this.centres[m];
      // power of the 3 bins nearest each multiple above the mean of bins 4…12 away on both sides
      // (18 bins, outside the Hann main lobe); summed over the multiples before clipping at 0, so
      // the random spread of the bins does not add up to a spurious excess
      let excess = 0;
      for (let j = 0; j < cs.length; j++) {
        const k = cs[j];
        let bg = 0;
        for (let d = 4; d <= 12; d++) bg += p[k - d] + p[k + d];
        excess += p[k - 1] + p[k] + p[k + 1] - (3 * bg) / 18;
      }
      if (excess < 0) excess = 0;
      out[BAND.mains0 + m] = excess;
    }
    let total = 0;
    for (let m = 0; m < this.centres.length; m++) total += out[BAND.mains0 + m];
    const emg = Math.max(band - total, 1e-300);
    for (let m = 0; m < this.centres.length; m++) out[BAND.mains0 + m] /= emg;
  }
}
