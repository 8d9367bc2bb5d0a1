// Streaming causal IIR filter: sosfilt over a stream of chunks with the state carried between them.
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import { checkSos } from './check-sos.js';
import type { Sos } from './sos.js';
import { sosfiltInPlace } from './sosfilt-in-place.js';

/**
 * A causal second-order-section filter for streams. Pushing the chunks of a signal one after the
 * other gives exactly `sosfilt(sos, wholeSignal, zi)`.
 * @example const f = new SosFilter(butter(4, 30, { btype: 'highpass', fs: 2000 }));
 *          for (const chunk of chunks) use(f.push(chunk));
 */
export class SosFilter {
  readonly sos: Sos;
  /** Current state, 2 values per section ([z1, z2], scipy's zi layout). */
  readonly state: Float64Array;

  /** @param zi initial state (default zeros), 2 values per section; copied */
  constructor(sos: Sos, zi?: ArrayLike<number>) {
    const n = checkSos(sos);
    this.sos = Float64Array.from(sos);
    this.state = new Float64Array(2 * n);
    if (zi) {
      if (zi.length !== 2 * n) throw new UsageError(dspMsg.ziLength(2 * n, zi.length));
      this.state.set(zi);
    }
  }

  /**
   * Filter the next chunk.
   * @param x input chunk (not modified)
   * @param out optional output buffer of length ≥ x.length (may be x itself to filter in place)
   * @returns the filtered chunk (`out` trimmed to x.length, or a new array)
   */
  push(x: ArrayLike<number>, out?: Float64Array): Float64Array {
    let y: Float64Array;
    if (out) {
      if (out.length < x.length) throw new UsageError(dspMsg.outputBuffer(x.length, out.length));
      y = out.length === x.length ? out : out.subarray(0, x.length);
      if (y !== x) y.set(x);
    } else {
      y = Float64Array.from(x);
    }
    sosfiltInPlace(this.sos, this.state, y, 0, y.length);
    return y;
  }

  /** Set the state back to zeros (or to `zi`). */
  reset(zi?: ArrayLike<number>): void {
    this.state.fill(0);
    if (zi) this.state.set(zi);
  }
}
