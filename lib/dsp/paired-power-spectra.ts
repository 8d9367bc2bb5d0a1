// Power spectra of a stream of equal-length segments, computed two at a time by the SIMD kernel
// (power-spectrum-pair.ts): a segment submitted alone waits for the next one (or flush()), and
// each segment's callback runs in submission order. Without WebAssembly SIMD every segment is
// transformed at once by fft.js.
import { cachedFft } from './cached-fft.js';
import { powerSpectrumPair, type PowerSpectrumPair } from './power-spectrum-pair.js';

/** Receives |X_k|², k = 0 … n/2 (a view valid only during the call). */
export type PowerSink = (power: Float64Array) => void;

/**
 * Usage: fill input() with the next segment (length n; entries never written stay 0, so a shorter
 * segment is zero-padded), then submit(sink); call flush() before reading anything the sinks
 * produce (at the end, and before a result that must include every segment).
 * @example const q = new PairedPowerSpectra(2048); windowInto(q.input()); q.submit((p) => use(p)); q.flush();
 */
export class PairedPowerSpectra {
  readonly n: number;
  private readonly kernel: PowerSpectrumPair | null;
  private pending: PowerSink | null = null;
  // fft.js fallback
  private readonly work: Float64Array;
  private readonly spec: Float64Array;
  private readonly power: Float64Array;

  /**
   * @param n transform length, a power of two ≥ 8
   * @param options.simd use the SIMD kernel where available (false: fft.js only, for tests) @default true
   */
  constructor(n: number, options: { simd?: boolean } = {}) {
    this.n = n;
    this.kernel = options.simd === false ? null : powerSpectrumPair(n);
    const fallback = this.kernel === null;
    this.work = new Float64Array(fallback ? n : 0);
    this.spec = new Float64Array(fallback ? 2 * n : 0);
    this.power = new Float64Array(fallback ? n / 2 + 1 : 0);
  }

  /** The buffer to fill with the next segment (valid until submit). */
  input(): Float64Array {
    if (this.kernel === null) return this.work;
    return this.pending === null ? this.kernel.inA : this.kernel.inB;
  }

  /** The filled segment: `sink` gets its power spectrum, now or with the next submit/flush. */
  submit(sink: PowerSink): void {
    const k = this.kernel;
    if (k === null) {
      cachedFft(this.n).realTransform(this.spec, this.work);
      const s = this.spec, p = this.power;
      for (let i = 0; i <= this.n / 2; i++) p[i] = s[2 * i]! * s[2 * i]! + s[2 * i + 1]! * s[2 * i + 1]!;
      sink(p);
      return;
    }
    if (this.pending === null) { this.pending = sink; return; }
    const first = this.pending;
    this.pending = null;
    k.run();
    first(k.powA);
    sink(k.powB);
  }

  /** Transform a segment still waiting for its pair. */
  flush(): void {
    if (this.pending === null || this.kernel === null) return;
    const first = this.pending;
    this.pending = null;
    this.kernel.run(); // lane B holds an earlier segment; its spectrum is ignored
    first(this.kernel.powA);
  }
}
