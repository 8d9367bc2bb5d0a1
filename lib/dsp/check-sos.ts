// Validation of an Sos array at the public entry points (inner loops trust it afterwards).
import { UsageError } from '../errors.js';
import { dspMsg } from '../messages.js';
import type { Sos } from './sos.js';

/** Throw UsageError unless sos has n ≥ 1 rows of 6 with a0 = 1. Returns the number of sections. */
export function checkSos(sos: Sos): number {
  if (sos.length < 6 || sos.length % 6 !== 0) throw new UsageError(dspMsg.sosShape(sos.length));
  const n = sos.length / 6;
  for (let s = 0; s < n; s++) if (sos[s * 6 + 3] !== 1) throw new UsageError(dspMsg.sosA0(s, sos[s * 6 + 3]));
  return n;
}
