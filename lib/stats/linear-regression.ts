// Ordinary least-squares line y = intercept + slope·x with the t-based confidence interval of the
// slope (same quantities as scipy.stats.linregress: slope, intercept, rvalue, stderr).
import { studentTQuantile } from './student-t-quantile.js';

export interface LinearRegressionOptions {
  /** Two-sided confidence level of the slope interval, as a fraction. @default 0.95 */
  confidence?: number;
}

export interface LinearRegression {
  /** Number of (x, y) pairs used (pairs with a NaN or infinite value are skipped). */
  n: number;
  /** Slope, unit of y per unit of x; NaN when n < 2 or all x are equal. */
  slope: number;
  intercept: number;
  /** Pearson correlation r; NaN when x or y is constant. */
  r: number;
  /** Standard error of the slope, sqrt(Σres² / (n−2) / Sxx); NaN when n < 3. */
  slope_stderr: number;
  /** Degrees of freedom of the interval, n − 2. */
  df: number;
  /** t quantile used, t_{(1+confidence)/2, n−2}. */
  t: number;
  /** Confidence interval of the slope, slope ∓ t·stderr; NaN when n < 3. */
  slope_ci_low: number;
  slope_ci_high: number;
  /** Mean of the y values used. */
  mean_y: number;
}

/**
 * Least-squares slope with its confidence interval (t distribution with n − 2 degrees of freedom).
 * Two-pass (centred) sums for numerical stability. Inputs are not modified.
 * @param x abscissae (e.g. time in min)
 * @param y ordinates (same length as x)
 * @throws RangeError when x and y differ in length or confidence is not in (0, 1)
 * @example linearRegression([0, 1, 2, 3], [1, 3, 5, 7]).slope // 2
 * Source: textbook OLS (e.g. Draper & Smith, Applied Regression Analysis; from memory); checked
 * against SciPy 1.17 stats.linregress and t.ppf (test/stats/fixtures/linear_regression.json).
 */
export function linearRegression(x: ArrayLike<number>, y: ArrayLike<number>, options: LinearRegressionOptions = {}): LinearRegression {
  if (x.length !== y.length) throw new RangeError(`linearRegression: x has ${x.length} values, y has ${y.length}`);
  const conf = options.confidence ?? 0.95;
  if (!(conf > 0 && conf < 1)) throw new RangeError(`linearRegression: confidence must be in (0, 1), got ${conf}`);
  let n = 0, sx = 0, sy = 0;
  for (let i = 0; i < x.length; i++) {
    const xi = x[i]!, yi = y[i]!;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) continue;
    n++; sx += xi; sy += yi;
  }
  const mx = n > 0 ? sx / n : NaN, my = n > 0 ? sy / n : NaN;
  let sxx = 0, syy = 0, sxy = 0;
  for (let i = 0; i < x.length; i++) {
    const xi = x[i]!, yi = y[i]!;
    if (!Number.isFinite(xi) || !Number.isFinite(yi)) continue;
    const dx = xi - mx, dy = yi - my;
    sxx += dx * dx; syy += dy * dy; sxy += dx * dy;
  }
  const slope = n >= 2 && sxx > 0 ? sxy / sxx : NaN;
  const intercept = my - slope * mx;
  const r = sxx > 0 && syy > 0 ? Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy))) : NaN;
  const df = n - 2;
  let stderr = NaN, t = NaN;
  if (df >= 1 && sxx > 0) {
    const ssRes = Math.max(0, syy - slope * sxy);
    stderr = Math.sqrt(ssRes / df / sxx);
    t = studentTQuantile(0.5 + conf / 2, df);
  }
  return {
    n, slope, intercept, r, slope_stderr: stderr, df: Math.max(df, 0), t,
    slope_ci_low: slope - t * stderr, slope_ci_high: slope + t * stderr, mean_y: my,
  };
}
