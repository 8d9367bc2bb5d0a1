import { describe, expect, it } from 'vitest';
import { convert16Kernel } from '../../lib/io/convert16-kernel.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

// Reference: EDF's scaling physical = bitvalue · (offset + digital) (EDF spec; EDFlib computes it
// the same way), evaluated here sample by sample in plain JavaScript, with the clipping counts of
// the reader's scalar loop. The SIMD kernel must give the same bits.
describe('convert16Kernel(capacity)', () => {
  it('convert() equals the scalar formula bit for bit, with the same counts at the digital limits (any length, offset, limits)', () => {
    const k = convert16Kernel(1 << 20);
    if (k === null) return; // no WebAssembly SIMD: the reader keeps its scalar loop
    const r = new SplitMix64(11);
    const n = 20000;
    const buf = k.bytes(2 * n);
    const src = new Int16Array(buf.buffer, buf.byteOffset, n);
    const dst = k.array(n);
    const counts = new Int32Array(2);
    for (const [dmin, dmax, bv, off] of [[-32768, 32767, 0.152590218966964, 0.5], [-2048, 2047, 0.48840048840048839, -0.5], [-100, 100, -3.3, 7.25], [0, 1, 1e-7, 12345.678]]) {
      for (let i = 0; i < n; i++) src[i] = Math.max(-32768, Math.min(32767, Math.round((r.random() - 0.5) * 2.2 * Math.max(Math.abs(dmin), dmax))));
      for (const [i0, m] of [[0, n], [1, 7], [3, 8], [5, 1999], [17, 16001], [0, 0]]) {
        dst.fill(NaN);
        k.convert(src, i0, m, dst, i0, dmin, dmax, bv, off, counts);
        let lo = 0, hi = 0, bad = 0;
        for (let i = 0; i < m; i++) {
          const d = src[i0 + i]!;
          if (d <= dmin) lo++; else if (d >= dmax) hi++;
          if (!Object.is(dst[i0 + i], bv * (off + d))) bad++;
        }
        expect(bad).toBe(0);
        expect([counts[0], counts[1]]).toEqual([lo, hi]);
      }
    }
  });

  it('refuses buffers from elsewhere and allocations beyond its capacity', () => {
    const k = convert16Kernel(4096);
    if (k === null) return;
    const buf = k.bytes(1024);
    const src = new Int16Array(buf.buffer, buf.byteOffset, 512);
    expect(() => k.convert(src, 0, 8, new Float64Array(8), 0, -1, 1, 1, 0, new Int32Array(2))).toThrow(RangeError);
    expect(() => k.array(10_000)).toThrow(RangeError);
  });
});
