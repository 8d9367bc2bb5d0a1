import { describe, expect, it } from 'vitest';
import { rowsToCsv } from '../../lib/study/rows-csv.js';
import type { ResultRow } from '../../lib/study/results.js';

const row = (over: Partial<ResultRow>): ResultRow => ({
  worker: 'W1', condition: 'a', muscle: 'upper trapezius, right', signal: 'EMG R', recording: 'w1.edf',
  segment: 'packing', start_s: 0, end_s: 60, valid_s: 60, unit: '%MVE', reference_uv: 400, noise_uv: 3,
  p10: 1.9, p50: 5.5, p90: 9.1, gap_threshold: 0.5, gaps: 3, gaps_per_min: 3, rest_pct: 6.333333333333333,
  longest_without_gap_s: 20, sustained_pct: 0, ...over,
} as ResultRow);

describe('rowsToCsv(rows)', () => {
  it('quotes fields with commas (RFC 4180) and writes one line per row plus a header', () => {
    const text = rowsToCsv([row({}), row({ worker: 'W2', p50: null })]);
    const lines = text.trimEnd().split('\n');
    expect(lines).toHaveLength(3);
    expect(lines[0].split(',').slice(0, 3)).toEqual(['worker', 'condition', 'muscle']);
    expect(lines[1]).toContain('"upper trapezius, right"');
    expect(lines[1]).toContain(',6.333333333,');
  });

  it('writes null as an empty cell', () => {
    const text = rowsToCsv([row({ p50: null })]);
    const header = text.split('\n')[0].split(',');
    const idx = header.indexOf('p50');
    // split respecting the one quoted field
    const cells = text.split('\n')[1].replace('"upper trapezius, right"', 'X').split(',');
    expect(cells[idx]).toBe('');
  });
});
