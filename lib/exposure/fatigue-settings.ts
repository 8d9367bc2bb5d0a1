// Settings of the fatigue analysis (spectral epochs, trend blocks, JASA), their defaults and units.

export interface FatigueSettings {
  /** Run the fatigue analysis. @default true */
  enabled: boolean;
  /** Epoch length, s (0.5–1 s: quasi-stationary, METHODS.md §7). @default 1 */
  epoch_s: number;
  /** Length of the time blocks over which trends are fitted, s (the last block may be shorter). @default 600 */
  block_s: number;
  /**
   * An epoch is active when its noise-corrected RMS is at least this, in the normalized unit
   * (%MVE, %RVE, %task-peak); not applied without a reference (normalize none). @default 2
   */
  active_threshold_pct: number;
  /**
   * An epoch is active only when its RMS (µV, before noise correction) is at least this many times
   * the noise RMS; applied when a noise level is known. @default 3
   */
  active_noise_factor: number;
  /** Band [low, high] for MNF/MDF, Hz; null = the band-pass of the analysis. @default null */
  band_hz: [number, number] | null;
  /** Fewest active epochs for a trend; blocks with fewer are 'insufficient-data'. @default 30 */
  min_epochs: number;
  /** Step of the MNF-over-time series for the report chart, s. @default 60 */
  series_step_s: number;
}

/**
 * Defaults of the fatigue analysis. Epoch length: METHODS.md §7 (0.5–1 s, FOUND). Block length,
 * thresholds and minimum epochs: tool choices (a 10-min block at 1-s epochs holds up to 600
 * epochs; 2 % of the reference keeps rest, whose spectrum is noise, out of the trends).
 */
export const FATIGUE_DEFAULTS: Readonly<FatigueSettings> = Object.freeze({
  enabled: true,
  epoch_s: 1,
  block_s: 600,
  active_threshold_pct: 2,
  active_noise_factor: 3,
  band_hz: null,
  min_epochs: 30,
  series_step_s: 60,
});

/**
 * Fatigue settings with every key filled in (defaults for missing keys; a partial block is fine).
 * @example resolveFatigueSettings({ block_s: 300 }).epoch_s // 1
 */
export function resolveFatigueSettings(partial: Partial<FatigueSettings> | null | undefined): FatigueSettings {
  const s = { ...FATIGUE_DEFAULTS, ...(partial ?? {}) };
  return { ...s, band_hz: s.band_hz === null ? null : [s.band_hz[0], s.band_hz[1]] };
}
