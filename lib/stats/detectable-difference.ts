// Planning aids for a paired comparison across workers: the smallest difference a study of n
// workers can detect, and the number of workers needed for a given difference. Normal
// approximation to the paired t-test: n = ((z₁₋α/₂ + z₁₋β) · σ_d / δ)² (e.g. Chow, Shao & Wang
// 2008, Sample Size Calculations in Clinical Research, §3.1; from memory).

import { UsageError } from '../errors.js';
import { msg } from '../messages.js';
import { DEFAULTS } from './defaults.js';
import { normalQuantile } from './normal-cdf.js';

export interface PlanningOptions {
  /** Two-sided significance level. @default 0.05 */
  alpha?: number;
  /** Power, 1 − β. @default 0.8 */
  power?: number;
}

const METHOD = 'normal approximation to the two-sided paired t-test: n = ((z(1−α/2) + z(power))·SD/δ)²; assumes '
  + 'independent workers, roughly normal per-worker differences with a known SD; it underestimates n by about '
  + '1–2 workers for small n, and a rank test needs about 5 % more';

function zSum(o: PlanningOptions): { alpha: number; power: number; z: number } {
  const alpha = o.alpha ?? DEFAULTS.alpha;
  const power = o.power ?? DEFAULTS.power;
  if (!(alpha > 0 && alpha < 1)) throw new UsageError(msg.parameter('alpha', 'a fraction between 0 and 1', alpha));
  if (!(power > 0 && power < 1)) throw new UsageError(msg.parameter('power', 'a fraction between 0 and 1', power));
  return { alpha, power, z: normalQuantile(1 - alpha / 2) + normalQuantile(power) };
}

/** Sample standard deviation (n − 1) of the finite values. */
function sampleSd(x: ArrayLike<number>): number {
  let n = 0; let s = 0; let s2 = 0;
  for (let i = 0; i < x.length; i++) { const v = x[i]!; if (v === v) { n++; s += v; } }
  const m = s / n;
  for (let i = 0; i < x.length; i++) { const v = x[i]!; if (v === v) s2 += (v - m) * (v - m); }
  return n > 1 ? Math.sqrt(s2 / (n - 1)) : NaN;
}

export interface DetectableDifference {
  /** Smallest true mean difference detectable with the given power, in the measure's unit. */
  difference: number;
  /** SD of per-worker differences used. */
  sd: number;
  n: number;
  alpha: number;
  power: number;
  method: string;
}

/**
 * Smallest mean paired difference detectable by n workers: δ = (z(1−α/2) + z(power)) · SD / √n.
 *
 * @param spread per-worker differences (their sample SD is used) or the SD itself
 * @param options n workers (required), alpha (@default 0.05), power (@default 0.8)
 * @throws UsageError for n < 2, an SD that is not a finite number ≥ 0, or bad alpha/power
 * @example detectableDifference(1.5, { n: 10 }).difference // 1.329 (= 2.8016 · 1.5 / √10)
 */
export function detectableDifference(spread: ArrayLike<number> | number, options: PlanningOptions & { n: number }): DetectableDifference {
  const sd = typeof spread === 'number' ? spread : sampleSd(spread);
  if (!(Number.isFinite(sd) && sd >= 0)) throw new UsageError(msg.parameter('sd of the differences', 'a finite number ≥ 0 (need at least 2 differences)', sd));
  const n = options.n;
  if (!(Number.isInteger(n) && n >= 2)) throw new UsageError(msg.parameter('n', 'a whole number ≥ 2', n));
  const { alpha, power, z } = zSum(options);
  return { difference: (z * sd) / Math.sqrt(n), sd, n, alpha, power, method: METHOD };
}

export interface WorkersNeeded {
  /** Workers needed (rounded up, at least 2). */
  n: number;
  /** The unrounded value of the formula. */
  n_exact: number;
  difference: number;
  sd: number;
  alpha: number;
  power: number;
  method: string;
}

/**
 * Workers needed to detect a mean paired difference δ with SD σ of per-worker differences:
 * n = ⌈((z(1−α/2) + z(power)) · σ / δ)²⌉, at least 2.
 *
 * @param difference the difference to detect (same unit as sd, ≠ 0)
 * @param sd SD of per-worker differences (> 0)
 * @throws UsageError for a zero difference, a non-positive SD, or bad alpha/power
 * @example workersNeeded(1, 1).n // 8 (7.85 rounded up)
 */
export function workersNeeded(difference: number, sd: number, options: PlanningOptions = {}): WorkersNeeded {
  if (!(Number.isFinite(difference) && difference !== 0)) throw new UsageError(msg.parameter('difference', 'a finite number ≠ 0', difference));
  if (!(Number.isFinite(sd) && sd > 0)) throw new UsageError(msg.parameter('sd', 'a finite number > 0', sd));
  const { alpha, power, z } = zSum(options);
  const nExact = ((z * sd) / Math.abs(difference)) ** 2;
  return { n: Math.max(2, Math.ceil(nExact - 1e-9)), n_exact: nExact, difference, sd, alpha, power, method: METHOD };
}
