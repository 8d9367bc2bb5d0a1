// JASA: joint analysis of EMG spectrum and amplitude. The sign pair of the amplitude trend and
// the spectral (MNF) trend tells a change in force from a change caused by fatigue.

/** JASA category of a block, plus the two non-classifications. */
export type JasaCategory = 'force-increase' | 'force-decrease' | 'fatigue' | 'recovery' | 'no-clear-change' | 'insufficient-data';

/** A confidence interval of a trend (slope), any unit. */
export interface TrendInterval {
  low: number;
  high: number;
}

/**
 * JASA category from the confidence intervals of the amplitude trend and the MNF trend:
 * amplitude ↑ and MNF ↓ → 'fatigue'; amplitude ↓ and MNF ↑ → 'recovery'; both ↑ →
 * 'force-increase'; both ↓ → 'force-decrease'. A trend counts as ↑ or ↓ only when its whole
 * interval lies above or below 0; when either interval includes 0 the result is
 * 'no-clear-change' (tool design choice, METHODS.md §6). A NaN bound gives 'insufficient-data'.
 * @example jasaCategory({ low: 0.4, high: 0.6 }, { low: -0.9, high: -0.7 }) // 'fatigue'
 * Source: Luttmann A, Jäger M, Laurig W (2000) Int J Ind Ergon 25(6):645–660 (JASA and its four
 * categories, FOUND); the quadrant mapping is FROM MEMORY (METHODS.md §6 table).
 */
export function jasaCategory(amplitude: TrendInterval, spectrum: TrendInterval): JasaCategory {
  if ([amplitude.low, amplitude.high, spectrum.low, spectrum.high].some((v) => Number.isNaN(v))) return 'insufficient-data';
  const a = amplitude.low > 0 ? 1 : amplitude.high < 0 ? -1 : 0;
  const f = spectrum.low > 0 ? 1 : spectrum.high < 0 ? -1 : 0;
  if (a === 0 || f === 0) return 'no-clear-change';
  if (a > 0) return f < 0 ? 'fatigue' : 'force-increase';
  return f > 0 ? 'recovery' : 'force-decrease';
}
