// Percentile bootstrap confidence intervals with a seeded SplitMix64 generator, for one sample
// (e.g. paired differences) and for the difference of a statistic between two samples.
// Efron B, Tibshirani RJ. 1993. An Introduction to the Bootstrap. Chapman & Hall, ch. 13
// (percentile interval; from memory).

import { UsageError } from '../errors.js';
import { exposureMsg, msg } from '../messages.js';
import { percentileSorted } from '../exposure/percentile.js';
import { DEFAULTS } from './defaults.js';
import { SplitMix64 } from './splitmix64.js';

export interface BootstrapOptions {
  /** Number of resamples. @default 10000 */
  resamples?: number;
  /** Confidence level, fraction in (0, 1). @default 0.95 */
  level?: number;
  /** Seed of the SplitMix64 generator. @default 1 */
  seed?: number;
}

export interface BootstrapCi {
  /** The statistic on the original data. */
  estimate: number;
  low: number;
  high: number;
  level: number;
  resamples: number;
  seed: number;
  method: string;
}

/** A statistic of a sample; it must not keep or change the array it is given. */
export type SampleStatistic = (sample: Float64Array) => number;

function finite(values: ArrayLike<number>): Float64Array {
  const out: number[] = [];
  for (let i = 0; i < values.length; i++) if (values[i]! === values[i]!) out.push(values[i]!);
  return Float64Array.from(out);
}

function settings(o: BootstrapOptions): { B: number; level: number; seed: number } {
  const B = o.resamples ?? DEFAULTS.resamples;
  const level = o.level ?? DEFAULTS.level;
  const seed = o.seed ?? DEFAULTS.seed;
  if (!(Number.isInteger(B) && B >= 1)) throw new UsageError(msg.parameter('resamples', 'a whole number ≥ 1', B));
  if (!(level > 0 && level < 1)) throw new UsageError(msg.parameter('level', 'a fraction between 0 and 1', level));
  if (!Number.isInteger(seed)) throw new UsageError(msg.parameter('seed', 'a whole number', seed));
  return { B, level, seed };
}

function interval(stats: Float64Array, level: number): [number, number] {
  let m = 0;
  for (let i = 0; i < stats.length; i++) if (stats[i]! === stats[i]!) stats[m++] = stats[i]!;
  const s = stats.subarray(0, m).sort();
  return [percentileSorted(s, (100 * (1 - level)) / 2), percentileSorted(s, (100 * (1 + level)) / 2)];
}

/** Fill `dst` with a resample (with replacement) of `src`. */
function resample(src: Float64Array, dst: Float64Array, g: SplitMix64): void {
  const n = src.length;
  for (let i = 0; i < n; i++) dst[i] = src[Math.floor(g.random() * n)]!;
}

/**
 * Percentile bootstrap interval of a one-sample statistic (e.g. the median paired difference).
 *
 * Draws `resamples` samples of the same size with replacement using SplitMix64(seed), computes the
 * statistic on each, and returns the (1−level)/2 and (1+level)/2 percentiles (type 7) of those
 * values. Deterministic for a given seed. NaN values in `values` are dropped first.
 *
 * @param values sample
 * @param statistic function of a sample, e.g. median
 * @param options resamples (@default 10000), level (@default 0.95), seed (@default 1)
 * @throws UsageError when no value is finite or an option is out of range
 * @example bootstrapCi(diffs, median, { seed: 7 }) // { estimate, low, high, … }
 */
export function bootstrapCi(values: ArrayLike<number>, statistic: SampleStatistic, options: BootstrapOptions = {}): BootstrapCi {
  const { B, level, seed } = settings(options);
  const x = finite(values);
  if (x.length === 0) throw new UsageError(exposureMsg.emptySample('bootstrapCi'));
  const g = new SplitMix64(seed);
  const buf = new Float64Array(x.length);
  const stats = new Float64Array(B);
  for (let b = 0; b < B; b++) { resample(x, buf, g); stats[b] = statistic(buf); }
  const [low, high] = interval(stats, level);
  return { estimate: statistic(Float64Array.from(x)), low, high, level, resamples: B, seed, method: `percentile bootstrap, ${B} resamples, SplitMix64 seed ${seed}` };
}

/**
 * Percentile bootstrap interval of statistic(b) − statistic(a) for two independent samples
 * (each resampled separately, with replacement, same sizes as observed).
 *
 * @param a sample of condition a
 * @param b sample of condition b
 * @param statistic function of a sample, e.g. median (→ interval of the difference of medians)
 * @param options resamples (@default 10000), level (@default 0.95), seed (@default 1)
 * @throws UsageError when a sample has no finite value or an option is out of range
 * @example bootstrapDifferenceCi(before, after, median, { seed: 7 })
 */
export function bootstrapDifferenceCi(a: ArrayLike<number>, b: ArrayLike<number>, statistic: SampleStatistic, options: BootstrapOptions = {}): BootstrapCi {
  const { B, level, seed } = settings(options);
  const xa = finite(a);
  const xb = finite(b);
  if (xa.length === 0) throw new UsageError(exposureMsg.emptySample('bootstrapDifferenceCi sample a'));
  if (xb.length === 0) throw new UsageError(exposureMsg.emptySample('bootstrapDifferenceCi sample b'));
  const g = new SplitMix64(seed);
  const ba = new Float64Array(xa.length);
  const bb = new Float64Array(xb.length);
  const stats = new Float64Array(B);
  for (let k = 0; k < B; k++) {
    resample(xa, ba, g);
    resample(xb, bb, g);
    stats[k] = statistic(bb) - statistic(ba);
  }
  const [low, high] = interval(stats, level);
  return {
    estimate: statistic(Float64Array.from(xb)) - statistic(Float64Array.from(xa)),
    low, high, level, resamples: B, seed,
    method: `percentile bootstrap of the difference (b − a), groups resampled separately, ${B} resamples, SplitMix64 seed ${seed}`,
  };
}
