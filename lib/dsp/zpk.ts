// Zeros, poles and gain of a filter (scipy's `z, p, k`), the form every design transform works on.
import type { Complex } from './complex.js';

/** A filter as zeros, poles and overall gain (analog: s-plane; digital: z-plane). */
export interface Zpk { z: Complex[]; p: Complex[]; k: number }
