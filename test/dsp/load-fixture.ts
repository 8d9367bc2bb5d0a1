// Reads a reference-vector file of shared/fixtures/dsp (made with SciPy/NumPy, see its README).
import { readFileSync } from 'node:fs';

export function loadDspFixture<T = any>(name: string): T { // eslint-disable-line @typescript-eslint/no-explicit-any
  const url = new URL(`../../../shared/fixtures/dsp/${name}`, import.meta.url);
  return JSON.parse(readFileSync(url, 'utf8')) as T;
}

/** max |a − b| */
export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  if (a.length !== b.length) return Infinity;
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

export function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

/** Split [0, n) into random chunk lengths (seeded, deterministic). */
export function randomSplits(n: number, seed: number, maxChunk: number): number[] {
  let s = seed >>> 0;
  const out: number[] = [];
  let done = 0;
  while (done < n) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    const len = Math.min(n - done, s % (maxChunk + 1));
    out.push(len);
    done += len;
  }
  return out;
}
