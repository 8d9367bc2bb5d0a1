// Zeros/poles/gain → second-order sections, ported from scipy.signal.zpk2sos (pairing 'nearest',
// digital). Same pairing and ordering as scipy, so the rows can be compared with scipy's one to one:
// poles closest to the unit circle go to the LAST section, each pole pair takes the nearest zeros,
// and the overall gain goes into section 0's b.
import { cabs, cconj, cmul, cadd, cx, type Complex } from './complex.js';
import type { Sos } from './sos.js';
import type { Zpk } from './zpk.js';

const isReal = (v: Complex): boolean => v.im === 0;

/** scipy's _cplxreal: keep one of each conjugate pair (the one with im > 0, averaged with its
 * partner) followed by the real values; sorted like scipy (by real part, then |imag|). */
function cplxreal(list: Complex[]): Complex[] {
  if (list.length === 0) return [];
  const tol = 100 * Number.EPSILON;
  const z = list.slice().sort((a, b) => (a.re - b.re) || (Math.abs(a.im) - Math.abs(b.im)));
  const reals: Complex[] = [], pos: Complex[] = [], negs: Complex[] = [];
  for (const v of z) {
    if (Math.abs(v.im) <= tol * cabs(v)) reals.push(cx(v.re));
    else if (v.im > 0) pos.push(v);
    else negs.push(v);
  }
  if (pos.length !== negs.length) throw new Error('zpk2sos: complex values are not in conjugate pairs');
  // runs of (nearly) equal real part are sorted by |imag|, as scipy does
  const sortRuns = (arr: Complex[]): void => {
    let i = 0;
    while (i < arr.length) {
      let j = i;
      while (j + 1 < arr.length && arr[j + 1].re - arr[j].re <= tol * cabs(arr[j])) j++;
      if (j > i) {
        const run = arr.slice(i, j + 1).sort((a, b) => Math.abs(a.im) - Math.abs(b.im));
        for (let m = 0; m < run.length; m++) arr[i + m] = run[m];
      }
      i = j + 1;
    }
  };
  // scipy decides the runs on the positive halves and sorts both halves by the same rule
  sortRuns(pos);
  sortRuns(negs);
  const out: Complex[] = [];
  for (let i = 0; i < pos.length; i++) {
    const a = pos[i], b = cconj(negs[i]);
    if (cabs({ re: a.re - b.re, im: a.im - b.im }) > tol * cabs(negs[i])) {
      throw new Error('zpk2sos: complex values are not in conjugate pairs');
    }
    out.push({ re: (a.re + b.re) / 2, im: (a.im + b.im) / 2 });
  }
  return out.concat(reals);
}

/** Index of the value nearest to `to` among `from`, restricted to real/complex ones. */
function nearestIdx(from: Complex[], to: Complex, which: 'any' | 'real' | 'complex'): number {
  const order = from.map((_, i) => i).sort((i, j) =>
    (cabs({ re: from[i].re - to.re, im: from[i].im - to.im }) - cabs({ re: from[j].re - to.re, im: from[j].im - to.im })) || i - j);
  if (which === 'any') return order[0];
  for (const i of order) if (isReal(from[i]) === (which === 'real')) return i;
  throw new Error('zpk2sos: no zero of the required kind left');
}

function worstIdx(list: Complex[]): number {
  let best = 0, bestD = Infinity;
  for (let i = 0; i < list.length; i++) {
    const d = Math.abs(1 - cabs(list[i]));
    if (d < bestD) { bestD = d; best = i; }
  }
  return best;
}

/** Coefficients of Π(x − r) for up to two roots, highest power first (numpy.poly, real part). */
function poly(roots: Complex[]): number[] {
  let c: Complex[] = [cx(1)];
  for (const r of roots) {
    const next: Complex[] = [];
    for (let i = 0; i <= c.length; i++) {
      const a = i < c.length ? c[i] : cx(0);
      const b = i > 0 ? cmul(c[i - 1], { re: -r.re, im: -r.im }) : cx(0);
      next.push(cadd(a, b));
    }
    c = next;
  }
  return c.map((v) => v.re);
}

function section(sos: Float64Array, si: number, z: Complex[], p: Complex[]): void {
  const b = poly(z), a = poly(p);
  for (let i = 0; i < b.length; i++) sos[si * 6 + 3 - b.length + i] = b[i];
  for (let i = 0; i < a.length; i++) sos[si * 6 + 6 - a.length + i] = a[i];
}

/**
 * Second-order sections from zeros, poles and gain of a digital filter (scipy.signal.zpk2sos with
 * pairing='nearest').
 * @returns Sos rows `[b0, b1, b2, 1, a1, a2]`; gain in section 0's b
 * @example zpk2sos(bilinearZpk(lp2lpZpk(buttap(2), 4 * Math.tan(Math.PI * 0.1)), 2))
 * Source: scipy.signal.zpk2sos (SciPy 1.17, BSD-3-Clause), ported.
 */
export function zpk2sos(zpk: Zpk): Sos {
  let z = zpk.z.slice(), p = zpk.p.slice();
  const k = zpk.k;
  if (z.length === 0 && p.length === 0) return Float64Array.of(k, 0, 0, 1, 0, 0);
  while (p.length < z.length) p.push(cx(0));
  while (z.length < p.length) z.push(cx(0));
  const nSections = (Math.max(p.length, z.length) + 1) >> 1;
  if (p.length % 2 === 1) { p.push(cx(0)); z.push(cx(0)); }
  z = cplxreal(z);
  p = cplxreal(p);
  const sos = new Float64Array(nSections * 6);
  const take = (arr: Complex[], i: number): Complex => arr.splice(i, 1)[0];
  for (let si = nSections - 1; si >= 0; si--) {
    const p1 = take(p, worstIdx(p));
    const nRealP = p.filter(isReal).length;
    if (isReal(p1) && nRealP === 0) {
      const z1 = take(z, nearestIdx(z, p1, 'real'));
      section(sos, si, [z1, cx(0)], [p1, cx(0)]);
    } else if (p.length + 1 === z.length && !isReal(p1) && nRealP === 1 && z.filter(isReal).length === 1) {
      const z1 = take(z, nearestIdx(z, p1, 'complex'));
      section(sos, si, [z1, cconj(z1)], [p1, cconj(p1)]);
    } else {
      let p2: Complex;
      if (isReal(p1)) {
        const realIdx = p.map((v, i) => (isReal(v) ? i : -1)).filter((i) => i >= 0);
        p2 = take(p, realIdx[worstIdx(realIdx.map((i) => p[i]))]);
      } else {
        p2 = cconj(p1);
      }
      if (z.length > 0) {
        const z1 = take(z, nearestIdx(z, p1, 'any'));
        if (!isReal(z1)) {
          section(sos, si, [z1, cconj(z1)], [p1, p2]);
        } else if (z.length > 0) {
          const z2 = take(z, nearestIdx(z, p1, 'real'));
          section(sos, si, [z1, z2], [p1, p2]);
        } else {
          section(sos, si, [z1], [p1, p2]);
        }
      } else {
        section(sos, si, [], [p1, p2]);
      }
    }
  }
  sos[0] *= k; sos[1] *= k; sos[2] *= k;
  return sos;
}
