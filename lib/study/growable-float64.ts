// An append-only Float64Array that grows by doubling: holds one channel's envelope (tens of Hz,
// so an 8-hour channel is about half a million values) while a recording streams past.

export class GrowableFloat64 {
  private buf: Float64Array;
  private n = 0;

  constructor(initialCapacity = 4096) {
    this.buf = new Float64Array(Math.max(1, initialCapacity));
  }

  get length(): number {
    return this.n;
  }

  /** Append all values of `x`. */
  append(x: Float64Array): void {
    this.reserve(this.n + x.length);
    this.buf.set(x, this.n);
    this.n += x.length;
  }

  /** Append `count` copies of `value` (e.g. NaN for time that has no data). */
  fill(value: number, count: number): void {
    if (count <= 0) return;
    this.reserve(this.n + count);
    this.buf.fill(value, this.n, this.n + count);
    this.n += count;
  }

  /** A copy trimmed to the current length. */
  toArray(): Float64Array {
    return this.buf.slice(0, this.n);
  }

  /**
   * The values as a view of the buffer, without a copy (for a buffer sized right up front, so
   * little capacity is left unused). Appending afterwards never changes the values seen through
   * the view (append-only); once the view's buffer is transferred to another thread, the
   * GrowableFloat64 must not be used again.
   */
  take(): Float64Array {
    return this.buf.subarray(0, this.n);
  }

  private reserve(needed: number): void {
    if (needed <= this.buf.length) return;
    let cap = this.buf.length;
    while (cap < needed) cap *= 2;
    const next = new Float64Array(cap);
    next.set(this.buf.subarray(0, this.n));
    this.buf = next;
  }
}
