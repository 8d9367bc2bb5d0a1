// Fast seeded 32-bit generator for bulk simulation: xoshiro128** (Blackman & Vigna 2018,
// "Scrambled linear pseudorandom number generators", arXiv:1805.01407; reference C code
// xoshiro128starstar.c), seeded from SplitMix64 as its authors recommend, with Marsaglia's polar
// method for normals (Marsaglia & Bray 1964, SIAM Review 6(3):260–264). State arithmetic is plain
// 32-bit integer work (Math.imul, >>>), so the sequence is the same on every platform; the normal
// transform uses Math.log/Math.sqrt (bit-identical within one JavaScript engine version).
import { SplitMix64 } from './splitmix64.js';

const TWO_POW_M31 = 1 / 2147483648;
const TWO_POW_M32 = 1 / 4294967296;

/** A seeded xoshiro128** generator: ~10x faster than the BigInt SplitMix64 for bulk normals. */
export class Xoshiro128 {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spare = 0;
  private hasSpare = false;

  /**
   * @param seed any integer; the 128-bit state is the first two SplitMix64(seed) outputs
   *   (high word first), so nearby seeds give unrelated streams.
   * @example const g = new Xoshiro128(42); g.fillNormal(new Float64Array(1000));
   */
  constructor(seed: number | bigint) {
    const sm = new SplitMix64(seed);
    const a = sm.nextBigInt();
    const b = sm.nextBigInt();
    this.s0 = Number(a >> 32n) >>> 0;
    this.s1 = Number(a & 0xffffffffn) >>> 0;
    this.s2 = Number(b >> 32n) >>> 0;
    this.s3 = Number(b & 0xffffffffn) >>> 0;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1; // the one forbidden state
  }

  /** Next raw output as an unsigned 32-bit integer. */
  nextUint32(): number {
    const s1 = this.s1;
    const r = Math.imul(s1, 5);
    const result = Math.imul((r << 7) | (r >>> 25), 9) >>> 0;
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= s1;
    this.s1 = s1 ^ this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = (this.s3 << 11) | (this.s3 >>> 21);
    return result;
  }

  /** Uniform double in [0, 1) with 32 random bits. */
  random(): number {
    return this.nextUint32() * TWO_POW_M32;
  }

  /** Uniform double in [lo, hi). */
  uniform(lo: number, hi: number): number {
    return lo + (hi - lo) * this.random();
  }

  /** Uniform integer in [0, n). */
  int(n: number): number {
    return Math.floor(this.random() * n);
  }

  /** Standard normal N(0, 1) (Marsaglia polar method; the second value of each pair is kept). */
  normal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = (this.nextUint32() | 0) * TWO_POW_M31;
      v = (this.nextUint32() | 0) * TWO_POW_M31;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * f;
    this.hasSpare = true;
    return u * f;
  }

  /**
   * Fill `out[start..end)` with N(0, 1) values, both values of every polar pair used. The state
   * (including a pending spare value) carries over, so filling one array in pieces gives the
   * same numbers as filling it at once.
   * @returns `out`
   */
  fillNormal(out: Float64Array, start = 0, end = out.length): Float64Array {
    let i = start;
    if (i < end && this.hasSpare) {
      out[i++] = this.spare;
      this.hasSpare = false;
    }
    let s0 = this.s0, s1 = this.s1, s2 = this.s2, s3 = this.s3;
    while (i < end) {
      let u: number, v: number, s: number;
      do {
        // inlined nextUint32() twice (hot loop: no calls)
        let r = Math.imul(s1, 5);
        let t = s1 << 9;
        u = (Math.imul((r << 7) | (r >>> 25), 9) | 0) * TWO_POW_M31;
        s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t; s3 = (s3 << 11) | (s3 >>> 21);
        r = Math.imul(s1, 5);
        t = s1 << 9;
        v = (Math.imul((r << 7) | (r >>> 25), 9) | 0) * TWO_POW_M31;
        s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t; s3 = (s3 << 11) | (s3 >>> 21);
        s = u * u + v * v;
      } while (s >= 1 || s === 0);
      const f = Math.sqrt((-2 * Math.log(s)) / s);
      out[i++] = u * f;
      if (i < end) out[i++] = v * f;
      else { this.spare = v * f; this.hasSpare = true; }
    }
    this.s0 = s0 >>> 0; this.s1 = s1 >>> 0; this.s2 = s2 >>> 0; this.s3 = s3 >>> 0;
    return out;
  }
}
