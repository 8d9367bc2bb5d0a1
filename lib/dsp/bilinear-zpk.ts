// Analog → digital by the bilinear transform, on zeros/poles/gain (scipy.signal.bilinear_zpk).
import { cadd, cdiv, cprod, csub, cx } from './complex.js';
import type { Zpk } from './zpk.js';

/**
 * Map s-plane zeros/poles to the z-plane with s = 2·fs·(z − 1)/(z + 1). Zeros at infinity land
 * at z = −1.
 * @param fs the bilinear sampling rate (scipy designs with fs = 2 after prewarping)
 */
export function bilinearZpk({ z, p, k }: Zpk, fs: number): Zpk {
  const degree = p.length - z.length;
  const fs2 = cx(2 * fs);
  const zz = z.map((v) => cdiv(cadd(fs2, v), csub(fs2, v)));
  const pz = p.map((v) => cdiv(cadd(fs2, v), csub(fs2, v)));
  for (let i = 0; i < degree; i++) zz.push(cx(-1));
  const g = cdiv(cprod(z.map((v) => csub(fs2, v))), cprod(p.map((v) => csub(fs2, v)))).re;
  return { z: zz, p: pz, k: k * g };
}
