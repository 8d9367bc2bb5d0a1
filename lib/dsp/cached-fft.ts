// One fft.js instance per transform size, shared by all callers (planning tables are per size).
// shiftload always passes Float64Array input and output buffers to fft.js: mixing plain Array and
// Float64Array outputs in one process slows fft.js down 2–3× (TOOLCHAIN.md §4).
import FFT from 'fft.js';

const cache = new Map<number, FFT>();

/** The shared fft.js instance for size n (a power of two > 1). */
export function cachedFft(n: number): FFT {
  let f = cache.get(n);
  if (!f) {
    f = new FFT(n);
    cache.set(n, f);
  }
  return f;
}
