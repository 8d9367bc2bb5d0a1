// Seeded pseudo-random numbers for simulation and bootstrap: splitmix64 (Steele, Lea & Flood 2014,
// "Fast splittable pseudorandom number generators", OOPSLA), with Box–Muller normals.
// Deterministic across platforms: BigInt state arithmetic, doubles from the top 53 bits.

const MASK = (1n << 64n) - 1n;
const GAMMA = 0x9e3779b97f4a7c15n;

/** A seeded generator. Same seed → same sequence, on every machine. */
export class SplitMix64 {
  private state: bigint;
  private spare = NaN;

  /** @param seed any integer (negative values and values ≥ 2^64 are reduced modulo 2^64) */
  constructor(seed: number | bigint) {
    this.state = BigInt.asUintN(64, BigInt(seed));
  }

  /** Next raw 64-bit output. */
  nextBigInt(): bigint {
    this.state = (this.state + GAMMA) & MASK;
    let z = this.state;
    z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK;
    z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK;
    return z ^ (z >> 31n);
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  random(): number {
    return Number(this.nextBigInt() >> 11n) / 9007199254740992;
  }

  /** Uniform integer in [0, n). */
  int(n: number): number {
    return Math.floor(this.random() * n);
  }

  /** Standard normal N(0, 1) by the Box–Muller transform (pairs cached). */
  normal(): number {
    if (!Number.isNaN(this.spare)) {
      const s = this.spare;
      this.spare = NaN;
      return s;
    }
    let u1 = this.random();
    while (u1 <= 0) u1 = this.random();
    const u2 = this.random();
    const r = Math.sqrt(-2 * Math.log(u1));
    this.spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  }

  /** Fill `out` with N(0, 1) values (batch form for hot loops). */
  fillNormal(out: Float64Array): Float64Array {
    for (let i = 0; i < out.length; i++) out[i] = this.normal();
    return out;
  }
}
