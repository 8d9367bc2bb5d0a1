// Minimal complex arithmetic for filter design (poles and zeros). Design runs once per filter,
// so clarity beats speed here; no complex numbers are ever used in per-sample loops.

/** A complex number re + i·im. */
export interface Complex { re: number; im: number }

export const cx = (re: number, im = 0): Complex => ({ re, im });
export const cadd = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const csub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const cmul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const cscale = (a: Complex, s: number): Complex => ({ re: a.re * s, im: a.im * s });
export const cconj = (a: Complex): Complex => ({ re: a.re, im: -a.im });
export const cabs = (a: Complex): number => Math.hypot(a.re, a.im);

/** a / b (Smith's algorithm, avoids overflow). */
export function cdiv(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re, d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im, d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

/** Principal square root (branch cut on the negative real axis, like numpy.sqrt on complex). */
export function csqrt(a: Complex): Complex {
  if (a.re === 0 && a.im === 0) return { re: 0, im: a.im };
  const m = cabs(a);
  const t = Math.sqrt((m + Math.abs(a.re)) / 2);
  if (a.re >= 0) return { re: t, im: a.im / (2 * t) };
  return { re: Math.abs(a.im) / (2 * t), im: (a.im < 0 || Object.is(a.im, -0)) ? -t : t };
}

/** exp(i·θ). */
export const cexpi = (theta: number): Complex => ({ re: Math.cos(theta), im: Math.sin(theta) });

/** Product of a list of complex numbers (1 for an empty list). */
export function cprod(list: Complex[]): Complex {
  let p = cx(1);
  for (const v of list) p = cmul(p, v);
  return p;
}
