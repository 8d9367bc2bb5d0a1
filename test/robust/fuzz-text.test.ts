// Seeded fuzzing of CSV/TSV, segment CSV and job YAML inputs through the CLI commands (lib/robust/fuzz.ts): every
// case ends with exit 0 or exit 2 and one stderr line, never an internal error, an exception, a
// hang or an output left under its final name. A failing case prints its seed and number; rerun it
// with `npm run fuzz -- --seed SEED --first CASE --cases 1 --verbose`.
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { describeCase, runFuzz, type FuzzKind } from '../../lib/robust/fuzz.js';
import { scratchDir } from '../../lib/robust/scratch-dir.js';

const SEED = 202;
const CASES = 1000;
const KINDS: FuzzKind[] = ['csv-inspect', 'csv-convert', 'yaml-check', 'yaml-analyze', 'segments-check'];
const dir = scratchDir('shiftload-fuzz-text-');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('fuzz (CSV/TSV, segment CSV and job YAML)', () => {
  it(`runFuzz({seed: ${SEED}, cases: ${CASES}}) ends every case with exit 0 or a one-line exit 2`, async () => {
    const s = await runFuzz({ seed: SEED, cases: CASES, dir, kinds: KINDS, timeoutMs: 5000, mainEvery: 10 });
    expect(s.cases).toBe(CASES);
    expect(s.failures.map(describeCase)).toEqual([]);
    // the mutations must reach both outcomes, or the run tests only one path
    expect(s.exit0).toBeGreaterThan(CASES / 20);
    expect(s.exit2).toBeGreaterThan(CASES / 4);
  }, 60_000);
});
