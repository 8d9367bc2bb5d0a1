// The spectral-shaping stage of the simulator, kept injectable: white Gaussian noise goes in,
// EMG-like band-limited noise comes out. The gain that makes the output unit-RMS is computed
// exactly from the filter's impulse-response energy (for unit-variance white input the output
// variance is Σ h[k]², Parseval; textbook fact).

/** A running filter that works in place on x[0..n). */
export interface NoiseFilter {
  process(x: Float64Array, n: number): void;
}

/** A factory of identical running filters, plus a one-line description for headers and truth.json. */
export interface NoiseShaper {
  describe: string;
  create(): NoiseFilter;
}

/** Passes white noise through unchanged (for tests of the scaling only). */
export const whiteShaper: NoiseShaper = {
  describe: 'white Gaussian noise (no band-limiting)',
  create: () => ({ process: () => { /* identity */ } }),
};

/**
 * RMS gain of a shaper for unit-variance white input: sqrt(Σ h[k]²) over its impulse response.
 * @param shaper the filter factory
 * @param length impulse-response length in samples (long enough for the response to decay)
 * @example noiseGain(whiteShaper, 1000) // 1
 */
export function noiseGain(shaper: NoiseShaper, length: number): number {
  const f = shaper.create();
  const h = new Float64Array(length);
  h[0] = 1;
  f.process(h, length);
  let e = 0;
  for (let k = 0; k < length; k++) e += h[k] * h[k];
  return Math.sqrt(e);
}
