// Noise correction of RMS amplitude in a power sense ("root difference of squares"): measured
// power = EMG power + independent noise power (METHODS.md §4; ML justification IEEE TNSRE
// 27(12):2328–2335, 2019, FOUND).

/**
 * Noise-corrected RMS: sqrt(max(rms² − noise², 0)).
 *
 * @param rms measured RMS amplitude (µV or any unit)
 * @param noise noise RMS in the same unit
 * @returns corrected RMS in the same unit; NaN stays NaN
 * @example noiseCorrect(5, 3) // 4
 * @example noiseCorrect(2, 3) // 0 (clamped)
 */
export function noiseCorrect(rms: number, noise: number): number {
  const d = rms * rms - noise * noise;
  return d > 0 ? Math.sqrt(d) : d === d ? 0 : NaN;
}

/**
 * Noise-corrected copy of an RMS envelope (the input is not changed).
 *
 * @param rms RMS envelope (µV); NaN stays NaN
 * @param noise noise RMS in µV
 * @param out optional output buffer of the same length (may not be `rms` itself)
 * @returns new Float64Array (or `out`) with sqrt(max(rms² − noise², 0))
 * @example noiseCorrectArray(Float64Array.of(5, 2, 10), 3) // [4, 0, √91]
 */
export function noiseCorrectArray(rms: ArrayLike<number>, noise: number, out?: Float64Array): Float64Array {
  const n = rms.length;
  const res = out ?? new Float64Array(n);
  if (res.length !== n) throw new RangeError(`noiseCorrectArray: output length ${res.length} differs from input length ${n}`);
  const n2 = noise * noise;
  for (let i = 0; i < n; i++) {
    const v = rms[i]!;
    const d = v * v - n2;
    res[i] = d > 0 ? Math.sqrt(d) : d === d ? 0 : NaN;
  }
  return res;
}
