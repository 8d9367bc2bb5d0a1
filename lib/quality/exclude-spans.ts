// Excluded time in the envelope: samples inside spans judged unusable become NaN, which every
// measure treats as excluded time (valid_s drops, the report says why).

/**
 * `envelope` with NaN at every sample whose time lies in one of the spans: a copy when a span
 * covers any sample, else the envelope itself (an 8-hour channel is 4.6 MB; most have no span).
 * Sample k is at k / rate_hz s (times relative to the envelope's first sample, the same origin as
 * the spans); a sample is excluded when start_s − pad_s ≤ k / rate_hz < end_s + pad_s.
 * Spans may overlap and come in any order. The input is not modified.
 * @param envelope envelope values (any unit)
 * @param rate_hz envelope rate, Hz (> 0)
 * @param spans [start_s, end_s) spans, s
 * @param pad_s widen each span by this much on both sides, s (e.g. half the RMS window, so no
 *   window that overlaps the span survives) @default 0
 * @returns a new Float64Array, or `envelope` when nothing is excluded
 * @example excludeSpans(Float64Array.of(1, 2, 3, 4), 1, [{ start_s: 1, end_s: 3 }]) // [1, NaN, NaN, 4]
 */
export function excludeSpans(envelope: Float64Array, rate_hz: number, spans: readonly { start_s: number; end_s: number }[], pad_s = 0): Float64Array {
  const n = envelope.length;
  let out: Float64Array | null = null;
  for (const sp of spans) {
    // first k with k/rate ≥ start − pad; first k with k/rate ≥ end + pad (exclusive)
    const k0 = Math.max(0, Math.ceil((sp.start_s - pad_s) * rate_hz - 1e-9));
    const k1 = Math.min(n, Math.ceil((sp.end_s + pad_s) * rate_hz - 1e-9));
    if (k1 > k0) (out ??= envelope.slice()).fill(NaN, k0, k1);
  }
  return out ?? envelope;
}
