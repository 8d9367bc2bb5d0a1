// Hodges–Lehmann location estimates (Hodges & Lehmann 1963, Ann Math Stat 34(2):598–611):
// the median of the Walsh averages (one sample / paired) and the median of all pairwise
// differences b − a (two samples).

import { median } from './median.js';

/**
 * One-sample (paired) Hodges–Lehmann estimate: median of (dᵢ + dⱼ)/2 over all i ≤ j.
 *
 * @param differences paired differences; NaN ignored
 * @returns the estimate; NaN for no finite value
 * @example hodgesLehmann([1, 2, 9]) // 3.5 (Walsh averages 1, 1.5, 2, 5, 5.5, 9)
 */
export function hodgesLehmann(differences: ArrayLike<number>): number {
  const d: number[] = [];
  for (let i = 0; i < differences.length; i++) if (differences[i]! === differences[i]!) d.push(differences[i]!);
  const w = new Float64Array((d.length * (d.length + 1)) / 2);
  let k = 0;
  for (let i = 0; i < d.length; i++) for (let j = i; j < d.length; j++) w[k++] = (d[i]! + d[j]!) / 2;
  return median(w);
}

/**
 * Two-sample Hodges–Lehmann shift: median of bⱼ − aᵢ over all pairs.
 *
 * @example hodgesLehmannShift([1, 2], [4, 6]) // 3.5 (differences 3, 5, 2, 4)
 */
export function hodgesLehmannShift(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const xa: number[] = [];
  const xb: number[] = [];
  for (let i = 0; i < a.length; i++) if (a[i]! === a[i]!) xa.push(a[i]!);
  for (let i = 0; i < b.length; i++) if (b[i]! === b[i]!) xb.push(b[i]!);
  const w = new Float64Array(xa.length * xb.length);
  let k = 0;
  for (const y of xb) for (const x of xa) w[k++] = y - x;
  return median(w);
}
