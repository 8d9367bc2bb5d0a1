// Parameter checks shared by the exposure measures (rates, durations, thresholds, class edges).

import { UsageError } from '../errors.js';
import { exposureMsg, msg } from '../messages.js';

/** Throws UsageError unless rate_hz is a finite number > 0. */
export function checkRate(rate_hz: number): void {
  if (!(Number.isFinite(rate_hz) && rate_hz > 0)) throw new UsageError(msg.parameter('rate_hz', 'a finite number > 0 Hz', rate_hz));
}

/** Throws UsageError unless `value` is a finite number ≥ 0 (a duration or count). */
export function checkNonNegative(name: string, value: number): void {
  if (!(Number.isFinite(value) && value >= 0)) throw new UsageError(msg.parameter(name, 'a finite number ≥ 0', value));
}

/** Throws UsageError unless `value` is finite (a threshold in the envelope's unit). */
export function checkFinite(name: string, value: number): void {
  if (!Number.isFinite(value)) throw new UsageError(msg.parameter(name, 'a finite number', value));
}

/** Throws UsageError unless the edges are finite and strictly increasing (at least one edge). */
export function checkEdges(name: string, edges: readonly number[]): void {
  let ok = edges.length > 0;
  for (let i = 0; ok && i < edges.length; i++) {
    if (!Number.isFinite(edges[i]!) || (i > 0 && !(edges[i]! > edges[i - 1]!))) ok = false;
  }
  if (!ok) throw new UsageError(exposureMsg.edgesNotIncreasing(name, edges));
}
