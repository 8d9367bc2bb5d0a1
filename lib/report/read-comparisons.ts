// Read the optional `comparisons` array of results (added to the contract by the comparison step)
// into the shape the report draws. Tolerant: the report must work with and without it.
import type { StudyResults } from '../study/results.js';
import type { PairedPoint } from './charts/paired-chart.js';

export interface ReportComparison {
  segment: string;
  muscle: string;
  measure: string;
  unit: string;
  condition_a: string;
  condition_b: string;
  paired: boolean;
  n: number;
  median_difference: number | null;
  ci_low: number | null;
  ci_high: number | null;
  p_value: number | null;
  statement: string;
  descriptive_only: boolean;
  per_worker: PairedPoint[];
}

const numOrNull = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const str = (v: unknown): string => (typeof v === 'string' ? v : v === undefined || v === null ? '' : String(v));

/**
 * The comparisons in `results`, or [] when absent. per_worker entries are read as
 * { worker, a, b } (also accepted: value_a/value_b, or keys named after the two conditions).
 */
export function readComparisons(results: StudyResults): ReportComparison[] {
  const raw = (results as unknown as { comparisons?: unknown }).comparisons;
  if (!Array.isArray(raw)) return [];
  return raw.filter((c) => c && typeof c === 'object').map((c: Record<string, unknown>) => {
    const a = str(c.condition_a), b = str(c.condition_b);
    const pw = Array.isArray(c.per_worker) ? c.per_worker : [];
    return {
      segment: str(c.segment), muscle: str(c.muscle), measure: str(c.measure), unit: str(c.unit), condition_a: a, condition_b: b,
      paired: c.paired !== false, n: numOrNull(c.n) ?? pw.length, median_difference: numOrNull(c.median_difference),
      ci_low: numOrNull(c.ci_low), ci_high: numOrNull(c.ci_high), p_value: numOrNull(c.p_value), statement: str(c.statement),
      descriptive_only: c.descriptive_only === true,
      per_worker: pw.filter((p) => p && typeof p === 'object').map((p: Record<string, unknown>) => ({
        worker: str(p.worker),
        a: numOrNull(p.a ?? p.value_a ?? p[a]),
        b: numOrNull(p.b ?? p.value_b ?? p[b]),
      })),
    };
  });
}
