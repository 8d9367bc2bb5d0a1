// One channel's mean raw spectrum as written to results.json: the spectrum on its coarse grid,
// the band and notch that suggestBand reads from it, and its mean and median power frequency.
import { meanFrequency } from '../dsp/mean-frequency.js';
import { medianFrequency } from '../dsp/median-frequency.js';
import { suggestBand } from '../dsp/suggest-band.js';
import type { MeanSpectrum } from '../exposure/spectral-epochs.js';
import type { SpectrumResult } from './results.js';

export interface RecordingSpectrumWhere {
  worker: string;
  condition: string;
  muscle: string;
  signal: string;
  recording: string;
}

/** Four significant digits: enough for a chart and a band suggestion, and keeps results.json small. */
const sig = (v: number) => (Number.isFinite(v) ? Number(v.toPrecision(4)) : 0);

/**
 * The SpectrumResult of one channel, or null when the spectrum holds no epoch or too few bins.
 * The suggestion is made on the full-precision spectrum; MNF/MDF over `band_hz` (the band of the
 * fatigue analysis), with the definitions of lib/dsp/mean-frequency.ts and median-frequency.ts.
 * @param spectrum mean raw spectrum from SpectralEpochs (µV²/Hz)
 * @param band_hz band for MNF and MDF, Hz
 * @param mainsHz the job's mains frequency (the notch looked for), or null to look for 50 and 60 Hz
 * @param epoch_s epoch length, s (for the record)
 * @example recordingSpectrum(series.spectrum, where, [20, 450], 50, 1)?.suggested_band_hz
 */
export function recordingSpectrum(spectrum: MeanSpectrum, where: RecordingSpectrumWhere, band_hz: readonly [number, number], mainsHz: 50 | 60 | null, epoch_s: number): SpectrumResult | null {
  const { f_hz: f, psd } = spectrum;
  if (spectrum.epochs === 0 || f.length < 8) return null;
  for (let k = 0; k < psd.length; k++) if (!Number.isFinite(psd[k]!)) return null;
  const s = suggestBand(f, psd, { mainsHz });
  const range = { fminHz: band_hz[0], fmaxHz: band_hz[1] };
  const mnf = meanFrequency(f, psd, range), mdf = medianFrequency(f, psd, range);
  return {
    worker: where.worker, condition: where.condition, muscle: where.muscle, recording: where.recording, signal: where.signal,
    bin_hz: spectrum.bin_hz, epochs: spectrum.epochs, epoch_s,
    freq_hz: Array.from(f, (v) => Number(v.toFixed(6))),
    psd: Array.from(psd, sig),
    suggested_band_hz: [s.band_hz[0], s.band_hz[1]],
    suggested_notch_hz: s.notch_hz,
    suggestion_reasons: s.reasons,
    mnf_hz: Number.isFinite(mnf) ? Number(mnf.toFixed(2)) : null,
    mdf_hz: Number.isFinite(mdf) ? Number(mdf.toFixed(2)) : null,
    mnf_band_hz: [band_hz[0], band_hz[1]],
  };
}
