// Parse a decimal number straight from bytes (CSV cells) without making a string. Fast path for
// plain numbers whose digits fit 2^53 and whose scale is ≤ 10^22: one exact integer divided or
// multiplied by an exact power of ten is correctly rounded, so the result equals Number(text).
// Everything else (long mantissas, large exponents) falls back to Number() on the text.

const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);

/**
 * The number in bytes [a, b) of `buf`, or NaN if the bytes are not a plain decimal number
 * (sign, digits, one decimal separator, optional exponent). Leading/trailing spaces are allowed.
 *
 * @param decimalComma accept ',' as well as '.' as the decimal separator (one separator per number;
 *   used with ';' and tab delimiters, where a ',' cannot be a delimiter)
 * @example parseDecimal(Buffer.from('-12,5'), 0, 5, true) // -12.5
 */
export function parseDecimal(buf: Buffer, a: number, b: number, decimalComma: boolean): number {
  while (a < b && buf[a] === 0x20) a++;
  while (b > a && buf[b - 1] === 0x20) b--;
  if (a >= b) return NaN;
  const sep = decimalComma ? 0x2c : 0x2e;
  let i = a;
  let neg = false;
  if (buf[i] === 0x2d) { neg = true; i++; } else if (buf[i] === 0x2b) i++;
  let mant = 0;
  let digits = 0;
  let frac = 0;
  let sawSep = false;
  let sig = 0;
  for (; i < b; i++) {
    const c = buf[i];
    if (c >= 0x30 && c <= 0x39) {
      digits++;
      if (mant !== 0 || c !== 0x30) sig++;
      mant = mant * 10 + (c - 0x30);
      if (sawSep) frac++;
    } else if ((c === sep || c === 0x2e) && !sawSep) {
      sawSep = true;
    } else break;
  }
  if (digits === 0) return NaN;
  let exp = 0;
  if (i < b && (buf[i] === 0x65 || buf[i] === 0x45)) {
    i++;
    let eneg = false;
    if (i < b && (buf[i] === 0x2d || buf[i] === 0x2b)) { eneg = buf[i] === 0x2d; i++; }
    let ed = 0;
    for (; i < b && buf[i] >= 0x30 && buf[i] <= 0x39; i++) { exp = exp * 10 + (buf[i] - 0x30); ed++; }
    if (ed === 0) return NaN;
    if (eneg) exp = -exp;
  }
  if (i !== b) return NaN;
  const scale = exp - frac;
  let v: number;
  if (sig <= 15 && scale >= -22 && scale <= 22) {
    v = scale < 0 ? mant / POW10[-scale] : mant * POW10[scale];
  } else {
    // text already validated as a plain number above, so Number() cannot accept anything more
    const s = buf.toString('latin1', a, b);
    return Number(decimalComma ? s.replace(',', '.') : s);
  }
  return neg ? -v : v;
}
