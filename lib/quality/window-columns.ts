// Per-window statistics of a streamed channel: named Float64Array columns indexed by window
// number, grown by doubling (an 8-hour channel has 28 800 one-second windows).

export class WindowColumns<K extends string> {
  private cols: Record<K, Float64Array>;
  private cap: number;
  /** One more than the highest window index written. */
  length = 0;

  constructor(readonly names: readonly K[], initialCapacity = 1024) {
    this.cap = Math.max(16, initialCapacity);
    this.cols = {} as Record<K, Float64Array>;
    for (const k of names) this.cols[k] = new Float64Array(this.cap);
  }

  /** The column array for `name`, valid until the next ensure() that grows the table. */
  col(name: K): Float64Array {
    return this.cols[name];
  }

  /** Make window index w writable (zero-filled) and count it in `length`. */
  ensure(w: number): void {
    if (w >= this.cap) {
      let cap = this.cap;
      while (cap <= w) cap *= 2;
      for (const k of this.names) {
        const next = new Float64Array(cap);
        next.set(this.cols[k]);
        this.cols[k] = next;
      }
      this.cap = cap;
    }
    if (w + 1 > this.length) this.length = w + 1;
  }
}
