// The fuzz test body shared by the fuzz test files (one file per input family, so vitest runs them
// in parallel): every case ends with exit 0 or exit 2 and one stderr line, never an internal
// error, an exception, a hang or an output left under its final name. A failing case prints its
// seed and number; rerun it with `npm run fuzz -- --seed SEED --first CASE --cases 1 --verbose`.
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { describeCase, runFuzz, type FuzzKind } from '../../lib/robust/fuzz.js';
import { scratchDir } from '../../lib/robust/scratch-dir.js';

export function fuzzSuite(title: string, seed: number, kinds: FuzzKind[], cases = 1000): void {
  const dir = scratchDir(`shiftload-fuzz-${seed}-`);
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  describe(`fuzz (${title})`, () => {
    it(`runFuzz({seed: ${seed}, cases: ${cases}}) ends every case with exit 0 or a one-line exit 2`, async () => {
      const s = await runFuzz({ seed, cases, dir, kinds, timeoutMs: 5000, mainEvery: 10 });
      expect(s.cases).toBe(cases);
      expect(s.failures.map(describeCase)).toEqual([]);
      // the mutations must reach both outcomes, or the run tests only one path
      expect(s.exit0).toBeGreaterThan(cases / 20);
      expect(s.exit2).toBeGreaterThan(cases / 4);
    }, 60_000);
  });
}
