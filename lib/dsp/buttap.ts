// Analog Butterworth low-pass prototype (cut-off 1 rad/s), as scipy.signal.buttap.
import { cexpi, cscale } from './complex.js';
import type { Zpk } from './zpk.js';

/**
 * Poles of the order-N analog Butterworth prototype: p_m = −exp(iπm/(2N)), m = −N+1, −N+3, …, N−1;
 * no zeros; gain 1.
 * @param order filter order N (≥ 1)
 * @example buttap(2).p // two poles at −0.7071 ± 0.7071i
 * Source: Butterworth S (1930), "On the theory of filter amplifiers"; ordering as scipy.signal.buttap.
 */
export function buttap(order: number): Zpk {
  const p = [];
  for (let m = -order + 1; m < order; m += 2) p.push(cscale(cexpi((Math.PI * m) / (2 * order)), -1));
  return { z: [], p, k: 1 };
}
