// The spectral-epoch taps of one field recording: one SpectralEpochs per channel, handed to
// readEnvelopes so the fatigue analysis rides on the single streaming pass. The taps are described
// by plain data (FatigueTapSpec), so a recording job can carry them to a worker thread.
import type { FatigueSettings } from './fatigue-settings.js';
import { SpectralEpochs, type SpectralEpochSeries } from './spectral-epochs.js';

/** Plain description of a recording's spectral taps (structured-clone safe). */
export interface FatigueTapSpec {
  /** Sampling rate of each channel read, Hz (same order as the signals). */
  rates_hz: number[];
  /** Epoch length, s. */
  epoch_s: number;
  /** MNF/MDF band, Hz (cut to fs/2 per channel). */
  band_hz: [number, number];
}

/**
 * The tap description of one recording, or null when the fatigue analysis is off. The MNF band is
 * settings.band_hz, or the analysis band-pass when that is null.
 * @param channels the recording's channels with their sampling rates (Hz)
 * @param filterBand the band-pass of the analysis [low, high], Hz
 * @example fatigueTapSpec(rec.channels, resolveFatigueSettings(s.fatigue), s.band_hz)
 */
export function fatigueTapSpec(channels: readonly { rate_hz: number }[], settings: FatigueSettings, filterBand: readonly [number, number]): FatigueTapSpec | null {
  if (!settings.enabled) return null;
  const band = settings.band_hz ?? filterBand;
  return { rates_hz: channels.map((ch) => ch.rate_hz), epoch_s: settings.epoch_s, band_hz: [band[0], band[1]] };
}

/**
 * One SpectralEpochs tap per channel (same order), or null for no spec. The band's high edge is cut
 * to fs/2 for a channel whose Nyquist frequency lies below it (a study may mix rates).
 * @throws UsageError when the band does not fit a channel's sampling rate or the epoch is under 16 samples
 * @example readEnvelopes({ …, taps: fatigueTaps(job.fatigue) ?? undefined })
 */
export function fatigueTaps(spec: FatigueTapSpec | null | undefined): SpectralEpochs[] | null {
  if (!spec) return null;
  return spec.rates_hz.map((fs) => new SpectralEpochs({ fs, epoch_s: spec.epoch_s, band_hz: [spec.band_hz[0], Math.min(spec.band_hz[1], fs / 2)] }));
}

/** The ArrayBuffers of spectral epoch series, to transfer (not copy) them between threads. */
export function spectralEpochBuffers(series: readonly SpectralEpochSeries[] | null | undefined): ArrayBuffer[] {
  const out: ArrayBuffer[] = [];
  for (const e of series ?? []) out.push(e.t_s.buffer as ArrayBuffer, e.rms_uv.buffer as ArrayBuffer, e.mnf_hz.buffer as ArrayBuffer, e.mdf_hz.buffer as ArrayBuffer,
    e.spectrum.f_hz.buffer as ArrayBuffer, e.spectrum.psd.buffer as ArrayBuffer);
  return out;
}
