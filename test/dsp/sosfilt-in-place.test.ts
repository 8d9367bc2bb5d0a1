import { describe, expect, it } from 'vitest';
import { butter } from '../../lib/dsp/butter.js';
import { mainsNotch } from '../../lib/dsp/mains-notch.js';
import { sosConcat } from '../../lib/dsp/sos.js';
import { sosfiltInPlace, sosfiltReverseInPlace } from '../../lib/dsp/sosfilt-in-place.js';
import { SplitMix64 } from '../../lib/stats/splitmix64.js';

/** Reference: scipy's _sosfilt loop order (sample by sample, sections inside), written plainly. */
function naive(sos: Float64Array, zi: Float64Array, x: Float64Array, reverse: boolean): Float64Array {
  const z = zi.slice(), y = x.slice(), ns = sos.length / 6;
  for (let t = 0; t < x.length; t++) {
    const i = reverse ? x.length - 1 - t : t;
    let v = y[i];
    for (let s = 0; s < ns; s++) {
      const o = 6 * s;
      const out = sos[o] * v + z[2 * s];
      z[2 * s] = sos[o + 1] * v - sos[o + 4] * out + z[2 * s + 1];
      z[2 * s + 1] = sos[o + 2] * v - sos[o + 5] * out;
      v = out;
    }
    y[i] = v;
  }
  return y;
}

describe('sosfiltInPlace / sosfiltReverseInPlace (fused sections)', () => {
  it('are bit-identical to the sample-by-sample cascade for 1…9 sections, forwards and backwards, with a start state', () => {
    const rng = new SplitMix64(4);
    const x = Float64Array.from({ length: 3000 }, () => rng.normal());
    const pool = sosConcat(butter(5, [20, 300], { btype: 'bandpass', fs: 1000 }), mainsNotch(50, 1000, { harmonics: 4 }));
    for (let ns = 1; ns <= 9; ns++) {
      const sos = pool.slice(0, 6 * ns);
      const zi = Float64Array.from({ length: 2 * ns }, () => rng.normal());
      for (const reverse of [false, true]) {
        const y = x.slice(), st = zi.slice();
        (reverse ? sosfiltReverseInPlace : sosfiltInPlace)(sos, st, y, 0, y.length);
        expect(Array.from(y)).toEqual(Array.from(naive(sos, zi, x, reverse)));
      }
    }
  });
});
