// `shiftload inspect FILE --quality` through main(): the quality block per signal, with clipped
// counts equal to the EDFlib truth files (shared/fixtures/edf/*.truth.json, EDFlib 1.23
// count_at_dig_max / count_at_dig_min).
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { truthFiles } from '../io/edf-truth.js';

describe('shiftload inspect FILE --quality', () => {
  for (const { name, path, truth } of truthFiles()) {
    it(`inspect ${name} --quality --json adds a quality object whose clipped counts match EDFlib`, async () => {
      const io = bufferIO();
      expect(await main(['inspect', path, '--quality', '--json'], io)).toBe(0);
      const r = JSON.parse(io.stdout);
      expect(r.quality.signals).toHaveLength(truth.signals.length);
      truth.signals.forEach((t, j) => {
        expect(r.quality.signals[j].label).toBe(t.label);
        expect(r.quality.signals[j].clipped_high).toBe(t.count_at_dig_max);
        expect(r.quality.signals[j].clipped_low).toBe(t.count_at_dig_min);
      });
      expect(Array.isArray(r.quality.findings)).toBe(true);
    });
  }
  it('inspect FILE --quality prints the quality table and the findings after the signal table', async () => {
    const { path, truth } = truthFiles().find((f) => f.truth.signals.some((s) => s.count_at_dig_max > 0))!;
    const io = bufferIO();
    expect(await main(['inspect', path, '--quality'], io)).toBe(0);
    expect(io.stdout).toContain('signal quality');
    const clippedSignal = truth.signals.find((s) => s.count_at_dig_max > 0)!;
    expect(io.stdout).toMatch(new RegExp(`${clippedSignal.label}: ${clippedSignal.count_at_dig_max + clippedSignal.count_at_dig_min} of \\d+ samples`));
  });
  it('inspect FILE without --quality prints no quality block', async () => {
    const io = bufferIO();
    expect(await main(['inspect', truthFiles()[0]!.path, '--json'], io)).toBe(0);
    expect(JSON.parse(io.stdout).quality).toBeUndefined();
  });
});
