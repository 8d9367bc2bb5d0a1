// Normalization of an RMS envelope to a reference amplitude (MVE, RVE or task peak), in percent.
// Terminology: Mathiassen, Winkel & Hägg 1995, J Electromyogr Kinesiol 5(4):197–226 (FOUND).

import { UsageError } from '../errors.js';
import { exposureMsg } from '../messages.js';

/**
 * Envelope in percent of a reference amplitude: 100 · env / referenceUv (new array).
 *
 * Apply the same filters and noise correction to the reference as to the field data first.
 *
 * @param env RMS envelope in µV (noise-corrected); NaN stays NaN
 * @param referenceUv reference amplitude in µV (> 0), e.g. MVE or RVE
 * @returns new Float64Array in %MVE / %RVE / %task-peak
 * @throws UsageError when referenceUv is not a finite number > 0
 * @example normalizeEnvelope(Float64Array.of(20), 400) // [5] (%MVE)
 */
export function normalizeEnvelope(env: ArrayLike<number>, referenceUv: number): Float64Array {
  if (!(Number.isFinite(referenceUv) && referenceUv > 0)) throw new UsageError(exposureMsg.referenceNotPositive(referenceUv));
  const n = env.length;
  const out = new Float64Array(n);
  const f = 100 / referenceUv;
  for (let i = 0; i < n; i++) out[i] = env[i]! * f;
  return out;
}
