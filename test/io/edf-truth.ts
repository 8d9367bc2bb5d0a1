// Shared helpers for the EDF reader tests: load the EDFlib truth files and stream a recording into
// per-signal statistics of the same kind the truth files hold.
import { readdirSync, readFileSync } from 'node:fs';
import type { Recording } from '../../lib/io/recording.js';

export const fixturesDir = new URL('../../../shared/fixtures/edf/', import.meta.url).pathname;

export interface TruthSignal {
  label: string; physical_dimension: string; prefilter: string; transducer: string;
  phys_min: number; phys_max: number; dig_min: number; dig_max: number;
  smp_in_datarecord: number; smp_in_file: number; sample_rate_hz: number;
  first20_physical: number[]; last20_physical: number[]; first20_digital: number[]; last20_digital: number[];
  spot_checks: { index: number; physical: number; digital: number }[];
  sum_physical: number; mean_physical: number; min_physical: number; max_physical: number; sum_digital: number;
  count_at_dig_max: number; count_at_dig_min: number;
}
export interface Truth {
  fixture: string;
  header: Record<string, unknown> & { filetype_name: string; edfsignals: number; file_duration_s: number; startdate: string; starttime: string; datarecord_duration_s: number; datarecords_in_file: number; annotations_in_file: number };
  raw_header: Record<string, unknown> & { signals: Record<string, string>[]; derived: Record<string, number> };
  signals: TruthSignal[];
  annotations: { onset_s: number; duration_s: number | null; text: string }[];
}

/** Every `*.truth.json` in the fixtures folder (other sets made by the same recipe work unchanged). */
export function truthFiles(): { name: string; path: string; truth: Truth }[] {
  return readdirSync(fixturesDir).filter((f) => f.endsWith('.truth.json')).sort().map((f) => ({
    name: f.replace(/\.truth\.json$/, ''),
    path: fixturesDir + f.replace(/\.truth\.json$/, ''),
    truth: JSON.parse(readFileSync(fixturesDir + f, 'utf8')) as Truth,
  }));
}

export interface Stats {
  n: number; first20: number[]; last20: number[]; spots: Map<number, number>;
  sum: number; min: number; max: number; clippedLow: number; clippedHigh: number;
}

/** Stream all listed signals and gather statistics; `spotIndices[j]` are sample indices to keep. */
export async function streamStats(rec: Recording, signals: number[], digital: boolean, spotIndices: number[][], span: { start_s?: number; end_s?: number } = {}): Promise<Stats[]> {
  const st: Stats[] = signals.map(() => ({ n: 0, first20: [], last20: [], spots: new Map(), sum: 0, min: Infinity, max: -Infinity, clippedLow: 0, clippedHigh: 0 }));
  for await (const c of rec.read({ signals, digital, ...span })) {
    c.data.forEach((d, j) => {
      const s = st[j];
      const want = new Set(spotIndices[j] ?? []);
      for (let i = 0; i < d.length; i++) {
        const v = d[i];
        if (s.first20.length < 20) s.first20.push(v);
        s.last20.push(v);
        if (s.last20.length > 20) s.last20.shift();
        if (want.has(s.n)) s.spots.set(s.n, v);
        s.sum += v;
        if (v < s.min) s.min = v;
        if (v > s.max) s.max = v;
        s.n++;
      }
      s.clippedLow += c.clipped_low[j];
      s.clippedHigh += c.clipped_high[j];
    });
  }
  return st;
}
