// The spectral-epoch taps of one field recording: one SpectralEpochs per channel, handed to
// readEnvelopes so the fatigue analysis rides on the single streaming pass.
import type { FatigueSettings } from './fatigue-settings.js';
import { SpectralEpochs } from './spectral-epochs.js';

/**
 * One SpectralEpochs tap per channel (same order), or null when the fatigue analysis is off.
 * The MNF band is settings.band_hz, or the analysis band-pass when that is null; its high edge is
 * cut to fs/2 for a channel whose Nyquist frequency lies below it (a study may mix rates).
 * @param channels the recording's channels with their sampling rates (Hz)
 * @param filterBand the band-pass of the analysis [low, high], Hz
 * @throws UsageError when the band does not fit a channel's sampling rate or the epoch is under 16 samples
 * @example readEnvelopes({ …, taps: fatigueTaps(rec.channels, settings, s.band_hz) ?? undefined })
 */
export function fatigueTaps(channels: readonly { rate_hz: number }[], settings: FatigueSettings, filterBand: readonly [number, number]): SpectralEpochs[] | null {
  if (!settings.enabled) return null;
  const band = settings.band_hz ?? filterBand;
  return channels.map((ch) => new SpectralEpochs({ fs: ch.rate_hz, epoch_s: settings.epoch_s, band_hz: [band[0], Math.min(band[1], ch.rate_hz / 2)] }));
}
