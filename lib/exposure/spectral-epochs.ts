// Spectral epochs: the filtered EMG cut into short, quasi-stationary epochs, each summarized by its
// RMS amplitude and its mean and median power frequency. A ChannelTap of readEnvelopes, so it runs
// in the one streaming pass over a recording and keeps only per-epoch summaries (an 8-h shift at
// 1-s epochs is 28,800 epochs ≈ 0.9 MB per channel).
import { PairedPowerSpectra } from '../dsp/paired-power-spectra.js';
import { meanFrequency } from '../dsp/mean-frequency.js';
import { medianFrequency } from '../dsp/median-frequency.js';
import { checkSamplingRate } from '../dsp/butter.js';
import { UsageError } from '../errors.js';
import { fatigueMsg } from '../messages.js';
import type { ChannelTap } from '../study/read-envelopes.js';
import { GrowableFloat64 } from '../study/growable-float64.js';

export interface SpectralEpochsOptions {
  /** Sampling rate of the channel, Hz. */
  fs: number;
  /** Epoch length, s (0.5–1 s are quasi-stationary; METHODS.md §7). @default 1 */
  epoch_s?: number;
  /** Band [low, high] over which MNF and MDF are computed, Hz (inclusive bins). */
  band_hz: readonly [number, number];
  /** Time of the first sample pushed, s from the recording start (the read span's start). @default 0 */
  start_s?: number;
  /** Width of the bins of the mean raw spectrum, Hz (widened to the FFT resolution when coarser). @default 2 */
  spectrum_bin_hz?: number;
}

/** Defaults of the spectral epochs. */
export const SPECTRAL_EPOCH_DEFAULTS = {
  /** Epoch length, s. METHODS.md §7: 0.5–1 s epochs are quasi-stationary (CEDE glossary, FOUND). */
  epoch_s: 1,
  /** Bin width of the mean raw spectrum, Hz: 2 Hz keeps results.json small (≤ 251 bins at 1000 Hz) and still resolves a mains line. */
  spectrum_bin_hz: 2,
};

/**
 * Mean power spectrum of the raw (unfiltered) signal over all whole epochs, on a coarse grid:
 * bin j is centred on j·bin_hz (j = 0 … floor((fs/2)/bin_hz)) and averages the density of the
 * epoch periodogram bins whose frequency lies in [j·bin_hz − bin_hz/2, j·bin_hz + bin_hz/2).
 */
export interface MeanSpectrum {
  /** Bin centres, Hz (0, bin_hz, 2·bin_hz, …; equally spaced from 0). */
  f_hz: Float64Array;
  /** One-sided power spectral density, µV²/Hz (Welch scaling: |X|² / (fs·Σw²), doubled off DC/Nyquist). NaN when no epoch was seen. */
  psd: Float64Array;
  /** Epochs averaged (epochs holding NaN are left out). */
  epochs: number;
  bin_hz: number;
}

/** Per-epoch summaries of one channel (all arrays have one value per whole epoch). */
export interface SpectralEpochSeries {
  /** Epoch centre, s from the recording start. */
  t_s: Float64Array;
  /** RMS of the filtered signal over the epoch, µV (not noise-corrected). */
  rms_uv: Float64Array;
  /** Mean power frequency over the band, Hz; NaN when the band holds no power or the epoch has NaN. */
  mnf_hz: Float64Array;
  /** Median frequency over the band (interpolated convention of medianFrequency), Hz. */
  mdf_hz: Float64Array;
  /** Epoch length actually used, s (whole samples: n / fs). */
  epoch_s: number;
  /** Samples per epoch. */
  n: number;
  /** FFT length (next power of two ≥ n; the windowed epoch is zero-padded). */
  nfft: number;
  fs: number;
  band_hz: [number, number];
  /** Mean raw spectrum over all whole epochs (see MeanSpectrum). */
  spectrum: MeanSpectrum;
}

/**
 * Streaming spectral epochs (a ChannelTap: feed it the filtered signal with `filtered(y)`, and
 * `restart(offset_s)` at discontinuities). Epochs tile each continuous piece from its first
 * sample: n = round(epoch_s·fs) samples each; the incomplete epoch at the end of a piece is
 * dropped. Per epoch: RMS of the n samples; then the samples minus their mean, times a periodic
 * Hann window of length n (0.5 − 0.5·cos(2πi/n)), zero-padded to nfft = next power of two ≥ n,
 * one real FFT (cached fft.js instance), power |X_k|² on bins f_k = k·fs/nfft; MNF =
 * meanFrequency and MDF = medianFrequency over bins inside band_hz. Zero-padding samples the same
 * windowed periodogram more finely; it does not change the spectrum's shape. Any chunk split gives
 * the same epochs as one push of the whole signal.
 *
 * Alongside, the tap accumulates the mean power spectrum of the raw (unfiltered) samples (the
 * `raw` hook of readEnvelopes), over all whole epochs of the same length and tiling, each with its
 * mean removed and the same Hann window; no activity rule is applied (every epoch counts, rest
 * included), so it shows what the band-pass and notch have to deal with. Raw rather than
 * filtered: the filtered spectrum only mirrors the chosen band and notch, so a band suggested
 * from it would confirm the settings rather than test them. Epochs holding NaN are left out.
 * @throws UsageError for a bad sampling rate, epoch shorter than 16 samples, or a band outside 0…fs/2
 * @example const tap = new SpectralEpochs({ fs: 1000, band_hz: [30, 400] }); tap.filtered(y); tap.result();
 * Source: MNF/MDF definitions, Phinyomark et al. 2012 (METHODS.md §7); epoch length, CEDE glossary.
 */
/** Every how many raw epochs one enters the mean raw spectrum. */
const RAW_STRIDE = 4;

export class SpectralEpochs implements ChannelTap {
  readonly fs: number;
  readonly n: number;
  readonly nfft: number;
  readonly band_hz: [number, number];
  private readonly startS: number;
  private readonly window: Float64Array;
  private readonly buf: Float64Array;
  /** Power spectra of the filtered and of the raw epochs, two at a time. */
  private readonly spectra: PairedPowerSpectra;
  private readonly rawSpectra: PairedPowerSpectra;
  private readonly freq: Float64Array;
  private fill = 0;
  /** Offset of the current piece, s from the read start, and whole epochs done in it. */
  private pieceOffsetS = 0;
  private pieceEpochs = 0;
  private readonly t = new GrowableFloat64(1024);
  private readonly rms = new GrowableFloat64(1024);
  private readonly mnf = new GrowableFloat64(1024);
  private readonly mdf = new GrowableFloat64(1024);
  /** Raw-spectrum accumulation: epoch buffer, fill, sum of |X|² per fine bin, epochs summed. */
  private readonly rawBuf: Float64Array;
  private rawFill = 0;
  private readonly rawSum: Float64Array;
  private rawEpochs = 0;
  /** Raw epochs seen; only every RAW_STRIDE-th is transformed (see pushRaw). */
  private rawIndex = 0;
  private readonly binHz: number;

  constructor(options: SpectralEpochsOptions) {
    checkSamplingRate(options.fs);
    const epoch = options.epoch_s ?? SPECTRAL_EPOCH_DEFAULTS.epoch_s;
    const n = Math.round(epoch * options.fs);
    if (!(Number.isFinite(epoch) && n >= 16)) throw new UsageError(fatigueMsg.epochTooShort(epoch, options.fs));
    const [lo, hi] = options.band_hz;
    if (!(lo >= 0 && hi > lo && hi <= options.fs / 2)) throw new UsageError(fatigueMsg.band(lo, hi, options.fs));
    this.fs = options.fs;
    this.n = n;
    let nfft = 16;
    while (nfft < n) nfft *= 2;
    this.nfft = nfft;
    this.band_hz = [lo, hi];
    this.startS = options.start_s ?? 0;
    this.window = new Float64Array(n);
    for (let i = 0; i < n; i++) this.window[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / n);
    this.buf = new Float64Array(n);
    this.spectra = new PairedPowerSpectra(nfft);
    this.rawSpectra = new PairedPowerSpectra(nfft);
    this.freq = new Float64Array(nfft / 2 + 1);
    for (let k = 0; k <= nfft / 2; k++) this.freq[k] = (k * this.fs) / nfft;
    this.rawBuf = new Float64Array(n);
    this.rawSum = new Float64Array(nfft / 2 + 1);
    const bin = options.spectrum_bin_hz ?? SPECTRAL_EPOCH_DEFAULTS.spectrum_bin_hz;
    if (!(bin > 0 && Number.isFinite(bin))) throw new UsageError(fatigueMsg.spectrumBin(bin));
    this.binHz = Math.max(bin, Math.ceil(this.fs / nfft)); // every coarse bin holds ≥ 1 FFT bin
  }

  /** Feed raw samples (µV) of the current continuous piece (not modified); readEnvelopes' `raw` hook. */
  raw(x: Float64Array): void {
    this.pushRaw(x);
  }

  /**
   * Feed raw samples (batch use and tests; same as `raw`). The mean raw spectrum averages every
   * RAW_STRIDE-th epoch (the first, then every fourth): over a shift that is still hundreds of
   * epochs spread evenly in time, at a quarter of the transforms.
   */
  pushRaw(x: ArrayLike<number>): void {
    const n = this.n, buf = this.rawBuf;
    let i = 0;
    while (i < x.length) {
      const m = Math.min(n - this.rawFill, x.length - i);
      if (this.rawIndex % RAW_STRIDE === 0) {
        if (x instanceof Float64Array) buf.set(x.subarray(i, i + m), this.rawFill);
        else for (let j = 0; j < m; j++) buf[this.rawFill + j] = x[i + j]!;
      }
      this.rawFill += m;
      i += m;
      if (this.rawFill === n) {
        if (this.rawIndex % RAW_STRIDE === 0) this.rawEpoch();
        this.rawIndex++;
        this.rawFill = 0;
      }
    }
  }

  private rawEpoch(): void {
    const n = this.n, buf = this.rawBuf, win = this.window;
    let sum = 0;
    for (let i = 0; i < n; i++) sum += buf[i]!;
    if (!Number.isFinite(sum)) return;
    const mean = sum / n;
    const work = this.rawSpectra.input(); // work[n…nfft) stays 0 (zero padding)
    for (let i = 0; i < n; i++) work[i] = (buf[i]! - mean) * win[i]!;
    this.rawSpectra.submit(this.addRaw);
  }

  /** One raw epoch's power into the mean spectrum's sum (in epoch order). */
  private readonly addRaw = (power: Float64Array): void => {
    const half = this.nfft / 2, acc = this.rawSum;
    for (let k = 0; k <= half; k++) acc[k] = acc[k]! + power[k]!;
    this.rawEpochs++;
  };

  /** The mean raw spectrum so far on the coarse grid (new arrays). */
  meanSpectrum(): MeanSpectrum {
    this.rawSpectra.flush();
    const half = this.nfft / 2, bin = this.binHz;
    let s2 = 0;
    for (let i = 0; i < this.n; i++) s2 += this.window[i]! * this.window[i]!;
    const scale = 1 / (this.fs * s2 * Math.max(1, this.rawEpochs));
    const nb = Math.floor(this.fs / 2 / bin) + 1;
    const f = new Float64Array(nb), psd = new Float64Array(nb), cnt = new Float64Array(nb);
    for (let j = 0; j < nb; j++) f[j] = j * bin;
    for (let k = 0; k <= half; k++) {
      const j = Math.floor(this.freq[k]! / bin + 0.5);
      if (j >= nb) continue;
      const one = k === 0 || k === half ? 1 : 2;
      psd[j] = psd[j]! + one * this.rawSum[k]! * scale;
      cnt[j] = cnt[j]! + 1;
    }
    for (let j = 0; j < nb; j++) psd[j] = this.rawEpochs > 0 && cnt[j]! > 0 ? psd[j]! / cnt[j]! : NaN;
    return { f_hz: f, psd, epochs: this.rawEpochs, bin_hz: bin };
  }

  /** Feed filtered samples (µV) of the current continuous piece (not modified). */
  filtered(y: Float64Array): void {
    this.push(y);
  }

  /** Feed samples (batch use and tests; same as `filtered`). */
  push(y: ArrayLike<number>): void {
    const n = this.n, buf = this.buf;
    let i = 0;
    while (i < y.length) {
      const m = Math.min(n - this.fill, y.length - i);
      if (y instanceof Float64Array) buf.set(y.subarray(i, i + m), this.fill);
      else for (let j = 0; j < m; j++) buf[this.fill + j] = y[i + j]!;
      this.fill += m;
      i += m;
      if (this.fill === n) {
        this.epoch();
        this.fill = 0;
      }
    }
  }

  /** A discontinuity: drop the incomplete epoch; the next piece starts at `offset_s` from the read start. */
  restart(offset_s: number): void {
    this.spectra.flush(); // epochs of the previous piece first
    this.fill = 0;
    this.rawFill = 0;
    this.pieceOffsetS = offset_s;
    this.pieceEpochs = 0;
  }

  private epoch(): void {
    const n = this.n, buf = this.buf, win = this.window;
    let sum = 0, sum2 = 0;
    for (let i = 0; i < n; i++) { const v = buf[i]!; sum += v; sum2 += v * v; }
    const mean = sum / n;
    const work = this.spectra.input(); // work[n…nfft) stays 0 (zero padding); it is never written
    for (let i = 0; i < n; i++) work[i] = (buf[i]! - mean) * win[i]!;
    const t = this.startS + this.pieceOffsetS + (this.pieceEpochs * n + n / 2) / this.fs;
    const rms = Math.sqrt(sum2 / n), finite = Number.isFinite(sum2);
    this.pieceEpochs++;
    // transformed two epochs at a time (SIMD): the epoch's row is appended when its spectrum is in
    this.spectra.submit((power) => {
      const range = { fminHz: this.band_hz[0], fmaxHz: this.band_hz[1] };
      this.t.fill(t, 1);
      this.rms.fill(rms, 1);
      this.mnf.fill(finite ? meanFrequency(this.freq, power, range) : NaN, 1);
      this.mdf.fill(finite ? medianFrequency(this.freq, power, range) : NaN, 1);
    });
  }

  /** Number of whole epochs so far. */
  get epochs(): number {
    this.spectra.flush();
    return this.t.length;
  }

  /** The epochs so far (views of the tap's append-only arrays: later epochs do not change them; no copies). */
  result(): SpectralEpochSeries {
    this.spectra.flush();
    return {
      t_s: this.t.take(), rms_uv: this.rms.take(), mnf_hz: this.mnf.take(), mdf_hz: this.mdf.take(),
      epoch_s: this.n / this.fs, n: this.n, nfft: this.nfft, fs: this.fs, band_hz: [this.band_hz[0], this.band_hz[1]],
      spectrum: this.meanSpectrum(),
    };
  }
}

/**
 * Spectral epochs of a whole (continuous) signal: batch form of SpectralEpochs.
 * @param raw the unfiltered signal for the mean spectrum (optional; without it the spectrum is NaN with 0 epochs)
 * @example spectralEpochs(y, { fs: 1000, band_hz: [30, 400] }).mnf_hz
 */
export function spectralEpochs(y: ArrayLike<number>, options: SpectralEpochsOptions, raw?: ArrayLike<number>): SpectralEpochSeries {
  const s = new SpectralEpochs(options);
  s.push(y);
  if (raw) s.pushRaw(raw);
  return s.result();
}
