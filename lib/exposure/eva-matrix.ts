// Exposure variation analysis (EVA): % of valid time per amplitude class × duration class of
// uninterrupted periods (Mathiassen & Winkel 1991, Ergonomics 34(12):1455–1468, FOUND; the
// procedure details and class edges are FROM MEMORY and configurable).

import { checkEdges, checkRate } from './check-parameters.js';
import { DEFAULTS } from './defaults.js';

export interface EvaMatrixOptions {
  /** Envelope rate in Hz (required). */
  rate_hz: number;
  /** Amplitude class edges in the envelope's unit, [lo, hi), last open above. @default [0, 1, 5, 10, 20, 30] */
  amplitude_edges?: readonly number[];
  /** Duration class edges in s, [lo, hi), last open above. @default [0, 1, 3, 7, 15, 31, 63] */
  duration_edges_s?: readonly number[];
}

export interface EvaMatrixResult {
  amplitude_edges: number[];
  duration_edges_s: number[];
  /** percent_time[a][d]: % of valid time in amplitude class a within periods of duration class d. */
  percent_time: number[][];
  /** periods[a][d]: number of periods in each cell. */
  periods: number[][];
  valid_s: number;
}

/**
 * EVA matrix of an envelope slice.
 *
 * Rules: classes are half-open [lo, hi) and the last class is open above; values below the first
 * amplitude edge go into the first class (and periods shorter than the first duration edge into
 * the first duration class), so the cells always sum to 100 % of valid time. A period is an
 * uninterrupted run of valid samples in one amplitude class; NaN breaks periods and is not
 * counted; a period cut by the slice ends is truncated there; the shortest period is one sample.
 * Duration = samples / rate_hz, compared with the edges with a 1e-9 s tolerance.
 *
 * @param envelope normalized envelope (e.g. %MVE); NaN = invalid
 * @throws UsageError for a bad rate or edges that are not strictly increasing
 * @example evaMatrix(env, { rate_hz: 10 }).percent_time[1][2] // % time at 1–5 %MVE in 3–7 s periods
 */
export function evaMatrix(envelope: ArrayLike<number>, options: EvaMatrixOptions): EvaMatrixResult {
  const rate = options.rate_hz;
  checkRate(rate);
  const aEdges = [...(options.amplitude_edges ?? DEFAULTS.eva_amplitude_edges)];
  const dEdges = [...(options.duration_edges_s ?? DEFAULTS.eva_duration_edges_s)];
  checkEdges('amplitude_edges', aEdges);
  checkEdges('duration_edges_s', dEdges);
  const na = aEdges.length;
  const nd = dEdges.length;
  const tol = DEFAULTS.duration_tolerance_s;
  const cells = new Float64Array(na * nd);
  const count = new Float64Array(na * nd);

  const n = envelope.length;
  let valid = 0;
  let cls = -1; // amplitude class of the current period, -1 = none
  let run = 0;
  for (let i = 0; i <= n; i++) {
    const v = i < n ? envelope[i]! : NaN;
    let c = -1;
    if (v === v) {
      valid++;
      c = 0;
      while (c + 1 < na && v >= aEdges[c + 1]!) c++;
    }
    if (c === cls && c >= 0) { run++; continue; }
    if (cls >= 0 && run > 0) {
      const dur = run / rate;
      let d = 0;
      while (d + 1 < nd && dur >= dEdges[d + 1]! - tol) d++;
      cells[cls * nd + d] = cells[cls * nd + d]! + run;
      count[cls * nd + d] = count[cls * nd + d]! + 1;
    }
    cls = c;
    run = c >= 0 ? 1 : 0;
  }
  const percent_time: number[][] = [];
  const periods: number[][] = [];
  for (let a = 0; a < na; a++) {
    const row: number[] = [];
    const prow: number[] = [];
    for (let d = 0; d < nd; d++) {
      row.push(valid > 0 ? (100 * cells[a * nd + d]!) / valid : 0);
      prow.push(count[a * nd + d]!);
    }
    percent_time.push(row);
    periods.push(prow);
  }
  return { amplitude_edges: aEdges, duration_edges_s: dEdges, percent_time, periods, valid_s: valid / rate };
}
