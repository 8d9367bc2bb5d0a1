// The CSV fast path against ECMAScript number parsing: every value parseNumberRow gives must be
// bit-identical to Number(text) (ECMA-262 StringToNumber, as implemented by the running engine),
// with a decimal comma read as '.'. Cells it declines (-1) go to the general path, parseDecimal,
// which must equal Number(text) too. Texts are generated from a seeded SplitMix64.
import { describe, expect, it } from 'vitest';
import { parseDecimal } from '../../lib/io/parse-decimal.js';
import { parseNumberRow } from '../../lib/io/parse-number-row.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

const out = new Float64Array(8);

/** Parse `text` + '\n' as a one-cell row; the value, or null when the fast path declines. */
function fast(text: string, decimalComma: boolean): number | null {
  const b = Buffer.from(text + '\n', 'latin1');
  const q = parseNumberRow(b, 0, decimalComma ? 0x3b : 0x2c, decimalComma, 1, out);
  if (q < 0) return null;
  if (q !== b.length) throw new Error(`${text}: row end ${q}, expected ${b.length}`);
  return out[0];
}

/** Significant digits of a plain decimal text (leading zeros dropped, trailing zeros kept). */
function mantissaDigits(text: string): string {
  const m = /^[+-]?([\d]*)[.,]?([\d]*)/.exec(text)!;
  return (m[1] + m[2]).replace(/^0+/, '');
}

/** A seeded random numeric text of the forms CSV exports contain, and the awkward ones. */
function numericText(rng: SplitMix64): string {
  const int = (n: number) => Math.floor(rng.random() * n);
  const digits = (n: number) => Array.from({ length: n }, () => String(int(10))).join('');
  const sign = ['', '', '-', '+'][int(4)];
  const form = int(8);
  let s: string;
  if (form === 0) s = `${digits(1 + int(6))}.${digits(int(7))}`; // plain fixed
  else if (form === 1) s = `${'0'.repeat(1 + int(5))}${digits(int(4))}.${digits(1 + int(5))}`; // leading zeros
  else if (form === 2) s = `${digits(1 + int(3))}.${digits(int(4))}${['e', 'E'][int(2)]}${['', '+', '-'][int(3)]}${int(40)}`; // exponents
  else if (form === 3) s = `${digits(1 + int(12))}.${digits(1 + int(12))}`; // long mantissas (some beyond 2^53)
  else if (form === 4) {
    // integers around 2^53 = 9007199254740992, with a decimal point moved in
    const n = String(9007199254740992 + int(21) - 10);
    const at = int(n.length + 1);
    s = `${n.slice(0, at)}.${n.slice(at)}`;
  } else if (form === 5) s = (rng.random() * 10 ** (int(30) - 15)).toPrecision(1 + int(21)); // engine-formatted
  else if (form === 6) s = int(2) ? `.${digits(1 + int(3))}` : `${digits(1 + int(3))}.`; // '.5', '5.'
  else s = `${digits(1 + int(17))}e-${int(30)}`; // many digits, negative scale
  return sign + s;
}

describe('parseNumberRow(buf, p, delim, decimalComma, ncols, out)', () => {
  it('equals Number(text) bit for bit for 100 000 seeded numeric texts, decimal point and decimal comma', () => {
    const rng = new SplitMix64(20261202);
    const wrong: string[] = [];
    const missed: string[] = [];
    let taken = 0;
    let inDomain = 0;
    for (let i = 0; i < 100_000; i++) {
      const text = numericText(rng);
      const ref = Number(text); // expected: ECMAScript Number(text)
      const comma = text.replace('.', ',');
      for (const [t, dc] of [[text, false], [text, true], [comma, true]] as const) {
        const v = fast(t, dc);
        if (!Object.is(parseDecimal(Buffer.from(t, 'latin1'), 0, t.length, dc), ref)) wrong.push(`general ${t}`);
        if (v !== null) {
          taken++;
          if (!Object.is(v, ref)) wrong.push(`fast ${t}`);
        }
      }
      // the fast path must take every text inside its exact domain (≤ 15 significant digits, scale ≤ 22)
      const e = /[eE]([+-]?\d+)$/.exec(text);
      const frac = (/[.,](\d*)/.exec(text)?.[1] ?? '').length;
      const scale = (e ? Number(e[1]) : 0) - frac;
      if (mantissaDigits(text).length <= 15 && Math.abs(scale) <= 22) {
        inDomain++;
        if (fast(text, false) === null) missed.push(text);
      }
    }
    expect(wrong).toEqual([]);
    expect(missed).toEqual([]);
    expect(inDomain).toBeGreaterThan(50_000);
    expect(taken).toBeGreaterThanOrEqual(3 * inDomain);
  });

  it('edge cases: -0, 2^53 ± 1, 1e22 and 1e23 scales, leading zeros, signs, exponent forms', () => {
    const cases = ['0', '-0', '+0', '-0.000', '0.0e5', '9007199254740991', '9007199254740992', '9007199254740993', '900719925474099.1', '90071992547409.93',
      '1e22', '1e23', '1e-22', '1e-23', '123e20', '0000000000000000000001.5', '0.000000000000000000000015', '-.5', '+5.', '1.E3', '2.5e+007',
      '4.9e-324', '1.7976931348623157e308', '0.1', '0.2', '0.30000000000000004', '1234567890.1234567', '123456789012345678901234567890'];
    for (const c of cases) {
      const v = fast(c, false);
      if (v !== null) expect(Object.is(v, Number(c)), c).toBe(true);
      expect(Object.is(parseDecimal(Buffer.from(c), 0, c.length, false), Number(c)), c).toBe(true);
    }
    expect(Object.is(fast('-0', false), -0)).toBe(true);
    expect(fast('9007199254740991', false)).toBe(9007199254740991);
    expect(fast('9007199254740993', false)).toBeNull(); // above 2^53: general path
  });

  it('parses a whole row: cells, delimiter, decimal comma, \\r\\n; returns the position after the \\n', () => {
    const row = Buffer.from('0,0005;-12,5;3.25;1e3\r\nnext');
    const o = new Float64Array(4);
    expect(parseNumberRow(row, 0, 0x3b, true, 4, o)).toBe(23);
    expect(Array.from(o)).toEqual([0.0005, -12.5, 3.25, 1000]);
    const tab = Buffer.from('x\n1\t2\n');
    expect(parseNumberRow(tab, 2, 0x09, true, 2, o)).toBe(6);
    expect(Array.from(o.subarray(0, 2))).toEqual([1, 2]);
  });

  it('declines (-1) every row the general path must judge: blanks, missing or quoted cells, spaces, wrong cell count, text, a lone \\r', () => {
    const declined = ['\n', ' \n', '1,\n', ',1\n', '1,2,3\n', '1\n', '"1",2\n', ' 1,2\n', '1 ,2\n', '1,NaN\n', '1,nan\n', '1,abc\n', '1.2.3,4\n',
      '1e,2\n', '1e+,2\n', '.,2\n', '-,2\n', '1,2\r\r\n', '1,2\r3\n', '1,2;\n', '1;2\n', '1,5,2\n', '0x10,1\n', 'Infinity,1\n', '1_0,2\n'];
    for (const r of declined) expect(parseNumberRow(Buffer.from(r), 0, 0x2c, false, 2, out), JSON.stringify(r)).toBe(-1);
    // with ';' a ',' is a decimal separator, one per number
    expect(parseNumberRow(Buffer.from('1,5;2\n'), 0, 0x3b, true, 2, out)).toBe(6);
    expect(parseNumberRow(Buffer.from('1,5,2;2\n'), 0, 0x3b, true, 2, out)).toBe(-1);
    expect(parseNumberRow(Buffer.from('1,5.2;2\n'), 0, 0x3b, true, 2, out)).toBe(-1);
  });
});
