// Joining runs of samples (the batch forms of the streaming stages, and SOS cascades).

/**
 * The arrays one after the other in a new Float64Array.
 * @example concatFloat64([Float64Array.of(1, 2), Float64Array.of(3)]) // [1, 2, 3]
 */
export function concatFloat64(parts: readonly Float64Array[]): Float64Array {
  let n = 0;
  for (const p of parts) n += p.length;
  const out = new Float64Array(n);
  let at = 0;
  for (const p of parts) { out.set(p, at); at += p.length; }
  return out;
}
