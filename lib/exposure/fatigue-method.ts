// The fatigue analysis described once per study, for results.json and the report's methods section.
import { fatigueText } from '../messages.js';
import type { FatigueMethod } from '../study/results.js';
import type { FatigueSettings } from './fatigue-settings.js';

/**
 * The settings and plain-words description of the fatigue analysis.
 * @param settings effective fatigue settings
 * @param filterBand the analysis band-pass, Hz (used when settings.band_hz is null)
 * @param rates sampling rates of the analysed channels, Hz (for the FFT lengths named in the text)
 * @example fatigueMethod(resolveFatigueSettings({}), [30, 400], [1000]).description
 */
export function fatigueMethod(settings: FatigueSettings, filterBand: readonly [number, number], rates: readonly number[]): FatigueMethod {
  const band: [number, number] = settings.band_hz ? [settings.band_hz[0], settings.band_hz[1]] : [filterBand[0], filterBand[1]];
  const ffts = [...new Set(rates)].sort((a, b) => a - b).map((fs) => {
    const n = Math.round(settings.epoch_s * fs);
    let nfft = 16;
    while (nfft < n) nfft *= 2;
    return `${nfft}-point at ${fs} Hz`;
  });
  return {
    epoch_s: settings.epoch_s, block_s: settings.block_s, band_hz: band,
    active_threshold_pct: settings.active_threshold_pct, active_noise_factor: settings.active_noise_factor,
    min_epochs: settings.min_epochs, ci_level: 0.95,
    description: fatigueText.method(settings.epoch_s, ffts.length > 0 ? ffts.join(', ') : 'zero-padded to a power of two', band, settings.block_s),
  };
}
