// The one conversion from a duration in seconds to a whole number of samples.

/**
 * Number of samples that a duration covers at a sampling rate.
 *
 * Rounding rule: round half away from zero of `seconds · fs`, after snapping values within
 * 1e-9 of an integer to it (so 0.1 s at 1000 Hz is exactly 100 samples despite float error).
 *
 * @param seconds duration in s (≥ 0)
 * @param fs sampling rate in Hz (> 0)
 * @returns whole number of samples
 * @example secondsToSamples(0.1, 2000) // 200
 */
export function secondsToSamples(seconds: number, fs: number): number {
  const x = seconds * fs;
  const r = Math.round(x);
  if (Math.abs(x - r) < 1e-9 * Math.max(1, Math.abs(x))) return r;
  return Math.sign(x) * Math.floor(Math.abs(x) + 0.5);
}
