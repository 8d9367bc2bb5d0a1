// Conversion of thresholds between %MVE and %RVE with a worker's ratio k = RVE/MVE
// (METHODS.md §2.5 and §3.5: straightforward algebra, practice FROM MEMORY).

import { UsageError } from '../errors.js';
import { exposureMsg } from '../messages.js';

function checkK(k: number): void {
  if (!(Number.isFinite(k) && k > 0)) throw new UsageError(exposureMsg.ratioNotPositive(k));
}

/**
 * The ratio k = RVE amplitude / MVE amplitude of one worker (same electrodes, filters, window).
 *
 * @param rveUv RVE amplitude in µV (> 0)
 * @param mveUv MVE amplitude in µV (> 0)
 * @example rveOverMve(60, 400) // 0.15
 */
export function rveOverMve(rveUv: number, mveUv: number): number {
  if (!(Number.isFinite(mveUv) && mveUv > 0)) throw new UsageError(exposureMsg.referenceNotPositive(mveUv));
  if (!(Number.isFinite(rveUv) && rveUv > 0)) throw new UsageError(exposureMsg.referenceNotPositive(rveUv));
  return rveUv / mveUv;
}

/**
 * A threshold in %MVE expressed in %RVE: threshold / k.
 *
 * @param thresholdPctMve threshold in %MVE
 * @param kRveOverMve the worker's RVE/MVE ratio (> 0)
 * @returns threshold in %RVE
 * @throws UsageError when k is not a finite number > 0
 * @example thresholdToRve(0.5, 0.15) // 3.333…
 */
export function thresholdToRve(thresholdPctMve: number, kRveOverMve: number): number {
  checkK(kRveOverMve);
  return thresholdPctMve / kRveOverMve;
}

/**
 * A threshold in %RVE expressed in %MVE: threshold · k (inverse of thresholdToRve).
 *
 * @param thresholdPctRve threshold in %RVE
 * @param kRveOverMve the worker's RVE/MVE ratio (> 0)
 * @example thresholdToMve(33.333, 0.15) // 5.0
 */
export function thresholdToMve(thresholdPctRve: number, kRveOverMve: number): number {
  checkK(kRveOverMve);
  return thresholdPctRve * kRveOverMve;
}
