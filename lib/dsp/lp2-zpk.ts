// Analog frequency transformations of a low-pass prototype (scipy.signal.lp2lp_zpk, lp2hp_zpk,
// lp2bp_zpk, lp2bs_zpk): one concept, "move the prototype to the wanted band", four cases.
import { cadd, cdiv, cmul, cprod, cscale, csqrt, csub, cx, type Complex } from './complex.js';
import type { Zpk } from './zpk.js';

const neg = (a: Complex): Complex => ({ re: -a.re, im: -a.im });

/** Low-pass → low-pass with cut-off `wo` rad/s. */
export function lp2lpZpk({ z, p, k }: Zpk, wo: number): Zpk {
  const degree = p.length - z.length;
  return { z: z.map((v) => cscale(v, wo)), p: p.map((v) => cscale(v, wo)), k: k * wo ** degree };
}

/** Low-pass → high-pass with cut-off `wo` rad/s. */
export function lp2hpZpk({ z, p, k }: Zpk, wo: number): Zpk {
  const degree = p.length - z.length;
  const zh = z.map((v) => cdiv(cx(wo), v));
  const ph = p.map((v) => cdiv(cx(wo), v));
  for (let i = 0; i < degree; i++) zh.push(cx(0));
  const g = cdiv(cprod(z.map(neg)), cprod(p.map(neg))).re;
  return { z: zh, p: ph, k: k * g };
}

function splitBand(list: Complex[], wo: number): Complex[] {
  const plus: Complex[] = [], minus: Complex[] = [];
  for (const v of list) {
    const r = csqrt(csub(cmul(v, v), cx(wo * wo)));
    plus.push(cadd(v, r));
    minus.push(csub(v, r));
  }
  return plus.concat(minus);
}

/** Low-pass → band-pass with centre `wo` and width `bw` (rad/s). */
export function lp2bpZpk({ z, p, k }: Zpk, wo: number, bw: number): Zpk {
  const degree = p.length - z.length;
  const zb = splitBand(z.map((v) => cscale(v, bw / 2)), wo);
  const pb = splitBand(p.map((v) => cscale(v, bw / 2)), wo);
  for (let i = 0; i < degree; i++) zb.push(cx(0));
  return { z: zb, p: pb, k: k * bw ** degree };
}

/** Low-pass → band-stop with centre `wo` and width `bw` (rad/s). */
export function lp2bsZpk({ z, p, k }: Zpk, wo: number, bw: number): Zpk {
  const degree = p.length - z.length;
  const zb = splitBand(z.map((v) => cdiv(cx(bw / 2), v)), wo);
  const pb = splitBand(p.map((v) => cdiv(cx(bw / 2), v)), wo);
  for (let i = 0; i < degree; i++) zb.push(cx(0, wo));
  for (let i = 0; i < degree; i++) zb.push(cx(0, -wo));
  const g = cdiv(cprod(z.map(neg)), cprod(p.map(neg))).re;
  return { z: zb, p: pb, k: k * g };
}
