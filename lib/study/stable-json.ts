// Deterministic JSON for results files: keys in insertion order as built by the analysis (which is
// itself deterministic), numbers rounded to a fixed number of significant digits so results do not
// depend on float noise in the last bits, NaN/Infinity written as null.

/** Round to `digits` significant digits (default 10), keeping integers exact. */
export function roundSignificant(x: number, digits = 10): number {
  if (!Number.isFinite(x) || x === 0 || Number.isInteger(x)) return x;
  return Number(x.toPrecision(digits));
}

/** JSON text with numbers rounded and non-finite numbers as null; two-space indent. */
export function stableJson(value: unknown, digits = 10): string {
  return JSON.stringify(value, (_k, v) => {
    if (typeof v === 'number') return Number.isFinite(v) ? roundSignificant(v, digits) : null;
    if (v instanceof Float64Array || v instanceof Float32Array) return Array.from(v);
    return v;
  }, 2) + '\n';
}
