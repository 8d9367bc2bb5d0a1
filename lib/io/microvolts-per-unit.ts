// Physical units of EMG signals → microvolts, so every amplitude in the analysis is in µV whatever
// unit the recorder wrote (EDF physical dimension, CSV `name [unit]`).

/**
 * Microvolts per one unit of `unit` (uV/µV → 1, mV → 1000, V → 1e6, nV → 0.001); null when the
 * unit is not a voltage shiftload knows.
 * @example microvoltsPerUnit('mV') // 1000
 */
export function microvoltsPerUnit(unit: string): number | null {
  const u = unit.trim().replace(/\u03bc/g, '\u00b5');
  switch (u) {
    case 'uV': case 'µV': case 'UV': case 'microV': case 'microvolt': case 'microvolts': return 1;
    case 'mV': case 'MV': case 'millivolt': case 'millivolts': return 1e3;
    case 'V': case 'volt': case 'volts': return 1e6;
    case 'nV': return 1e-3;
    default: return null;
  }
}
