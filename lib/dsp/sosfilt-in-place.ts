// The hot loop of every IIR filter in shiftload: a cascade of second-order sections in transposed
// direct form II, run in place over part of a Float64Array, forwards or backwards. Section by
// section over the block (same arithmetic as sample by sample, and as scipy's _sosfilt), with the
// coefficients and the state held in locals.
import type { Sos } from './sos.js';

/**
 * Filter buf[start..end) in place through the cascade, updating `state` (2 values per section,
 * scipy's zi layout [z1, z2]). Per section: y = b0·x + z1; z1 = b1·x − a1·y + z2; z2 = b2·x − a2·y.
 * Assumes a0 = 1 (checked once by the public entry points).
 */
export function sosfiltInPlace(sos: Sos, state: Float64Array, buf: Float64Array, start: number, end: number): void {
  const ns = (sos.length / 6) | 0;
  for (let s = 0; s < ns; s++) {
    const o = s * 6;
    const b0 = sos[o], b1 = sos[o + 1], b2 = sos[o + 2], a1 = sos[o + 4], a2 = sos[o + 5];
    let z1 = state[2 * s], z2 = state[2 * s + 1];
    for (let i = start; i < end; i++) {
      const x = buf[i];
      const y = b0 * x + z1;
      z1 = b1 * x - a1 * y + z2;
      z2 = b2 * x - a2 * y;
      buf[i] = y;
    }
    state[2 * s] = z1;
    state[2 * s + 1] = z2;
  }
}

/**
 * Same as sosfiltInPlace but in time-reversed order: buf[end−1] first, buf[start] last
 * (the backward pass of a forward–backward filter, without copying the block reversed).
 */
export function sosfiltReverseInPlace(sos: Sos, state: Float64Array, buf: Float64Array, start: number, end: number): void {
  const ns = (sos.length / 6) | 0;
  for (let s = 0; s < ns; s++) {
    const o = s * 6;
    const b0 = sos[o], b1 = sos[o + 1], b2 = sos[o + 2], a1 = sos[o + 4], a2 = sos[o + 5];
    let z1 = state[2 * s], z2 = state[2 * s + 1];
    for (let i = end - 1; i >= start; i--) {
      const x = buf[i];
      const y = b0 * x + z1;
      z1 = b1 * x - a1 * y + z2;
      z2 = b2 * x - a2 * y;
      buf[i] = y;
    }
    state[2 * s] = z1;
    state[2 * s + 1] = z2;
  }
}
