// The fast path of the CSV reader: one row of plain numbers parsed straight from the bytes in a
// single pass, no strings, no per-cell boundaries. It accepts only the common case — every cell a
// plain decimal number with no spaces or quotes, exactly `ncols` cells, the row ended by \n or \r\n
// — and returns -1 for anything else, so the caller can hand that row to the general path
// (splitRow + parseDecimal), which decides on blanks, missing cells, errors and rare number forms.
//
// Numbers: the digits are accumulated as an integer mantissa M and the number is M · 10^s. When
// M < 2^53 and |s| ≤ 22, both M and 10^|s| are exact doubles, so the one multiplication or division
// is correctly rounded (IEEE 754) and equals the correctly rounded value of the decimal text, which
// is what Number(text) returns: ECMA-262 StringToNumber requires the correctly rounded double for
// texts of up to 20 significant digits (from memory of the spec's RoundMVResult; the property test
// test/io/parse-number-row.test.ts checks it against the engine). This is the exact "fast path" of
// Clinger 1990, "How to read floating point numbers accurately", PLDI. Other numbers return -1.

/** Exact powers of ten 10^0 … 10^22 (every one is a double without rounding). */
const POW10 = new Float64Array([1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22]);
/** 2^53: integers below it are exact doubles. */
const EXACT = 2 ** 53;

/**
 * Parse the row starting at `p` into `out[0..ncols)`. The row must be followed by a \n inside `buf`
 * (the line batches guarantee it), so the parse never reads past it.
 * @param delim delimiter byte (',' ';' or tab)
 * @param decimalComma accept ',' as well as '.' as the decimal separator (';' and tab files)
 * @returns the position after the row's \n, or -1 when the row is not plain numbers (nothing
 *   about the row may be assumed then; `out` may be partly written)
 * @example parseNumberRow(Buffer.from('0.5,-1.25\n'), 0, 0x2c, false, 2, out) // 10; out = [0.5, -1.25]
 */
export function parseNumberRow(buf: Uint8Array, p: number, delim: number, decimalComma: boolean, ncols: number, out: Float64Array): number {
  const comma = decimalComma ? 0x2c : 0x2e;
  for (let c = 0; c < ncols; c++) {
    let ch = buf[p];
    let neg = false;
    if (ch === 0x2d) { neg = true; ch = buf[++p]; } else if (ch === 0x2b) ch = buf[++p];
    let mant = 0;
    let digits = 0;
    while (ch >= 0x30 && ch <= 0x39) {
      mant = mant * 10 + (ch - 0x30);
      digits++;
      ch = buf[++p];
    }
    let scale = 0;
    if (ch === 0x2e || ch === comma) {
      ch = buf[++p];
      while (ch >= 0x30 && ch <= 0x39) {
        mant = mant * 10 + (ch - 0x30);
        scale--;
        ch = buf[++p];
      }
      digits -= scale;
    }
    if (digits === 0) return -1;
    if (ch === 0x65 || ch === 0x45) {
      // exponent (rare in exports): kept out of line so this function stays small enough to inline
      p = exponentEnd(buf, p + 1);
      if (p < 0) return -1;
      scale += exponent;
      ch = buf[p];
    }
    // mant is exact when below 2^53: every partial sum was smaller, hence exact too
    if (!(mant < EXACT) || scale < -22 || scale > 22) return -1;
    const v = scale < 0 ? mant / POW10[-scale] : mant * POW10[scale];
    out[c] = neg ? -v : v;
    if (c < ncols - 1) {
      if (ch !== delim) return -1;
      p++;
    } else if (ch === 0x0a) return p + 1;
    else if (ch === 0x0d && buf[p + 1] === 0x0a) return p + 2;
    else return -1;
  }
  return -1;
}

/** Value of the exponent parsed by the last exponentEnd call. */
let exponent = 0;

/**
 * The exponent digits after an 'e'/'E' at `p` ([+-]?digits): sets `exponent` (magnitudes above
 * 1000 are capped, which keeps them outside the exact range) and returns the position after them,
 * or -1 when there are no digits.
 */
function exponentEnd(buf: Uint8Array, p: number): number {
  let ch = buf[p];
  let neg = false;
  if (ch === 0x2d) { neg = true; ch = buf[++p]; } else if (ch === 0x2b) ch = buf[++p];
  const start = p;
  let e = 0;
  while (ch >= 0x30 && ch <= 0x39) {
    if (e < 1000) e = e * 10 + (ch - 0x30);
    ch = buf[++p];
  }
  if (p === start) return -1;
  exponent = neg ? -e : e;
  return p;
}
