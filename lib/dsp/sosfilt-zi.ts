// Steady-state initial conditions of a section cascade for a unit step (scipy.signal.sosfilt_zi).
import { checkSos } from './check-sos.js';
import type { Sos } from './sos.js';

/**
 * Initial state (2 values per section, [z1, z2]) such that filtering a constant input 1 starts
 * in steady state; multiply by the first sample to start without a transient. For each section
 * lfilter_zi solves (I − Aᵀ)·zi = b[1:] − a[1:]·b0, scaled by the DC gain of the sections before it.
 * @returns Float64Array of length 2·sections
 * @example sosfiltZi(butter(4, 10, { fs: 1000 }))
 * Source: SciPy 1.17 sosfilt_zi / lfilter_zi (Gustafsson's initial-state method, IEEE TSP 1996).
 */
export function sosfiltZi(sos: Sos): Float64Array {
  const n = checkSos(sos);
  const zi = new Float64Array(2 * n);
  let scale = 1;
  for (let s = 0; s < n; s++) {
    const o = s * 6;
    const b0 = sos[o], b1 = sos[o + 1], b2 = sos[o + 2], a1 = sos[o + 4], a2 = sos[o + 5];
    const B0 = b1 - a1 * b0, B1 = b2 - a2 * b0;
    // (I − companion(a)ᵀ) = [[1 + a1, −1], [a2, 1]]
    const z0 = (B0 + B1) / (1 + a1 + a2);
    zi[2 * s] = scale * z0;
    zi[2 * s + 1] = scale * (B1 - a2 * z0);
    scale *= (b0 + b1 + b2) / (1 + a1 + a2);
  }
  return zi;
}
