import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openRecording } from '../../lib/io/open-recording.js';
import { parseSimulationSpec } from '../../lib/sim/load-simulation-spec.js';
import { whiteShaper } from '../../lib/sim/noise-shaper.js';
import { planStudy } from '../../lib/sim/plan-study.js';
import { RecordingSynthesizer } from '../../lib/sim/recording-synthesizer.js';
import { simulate } from '../../lib/sim/simulate.js';
import { TINY_SPEC } from './tiny-spec.js';

const tmp = mkdtempSync(join(tmpdir(), 'shiftload-simedf-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));
const spec = parseSimulationSpec(TINY_SPEC, 'tiny.yaml');
const sha = (f: string) => createHash('sha256').update(readFileSync(f)).digest('hex');

describe('writeSimulatedEdf(design, path, shaper) through simulate(..., { format: "edf" })', () => {
  it('writes EDF+ that the reader opens: labels, rate, range, annotations and samples within one quantization step', async () => {
    const out = join(tmp, 'a');
    await simulate(spec, out, { shaper: whiteShaper, format: 'edf', seed: 3 });
    const plan = planStudy(spec, { format: 'edf', seed: 3 });
    const design = plan.recordings.find((r) => r.file === 'w2-c1.edf')!;
    const rec = await openRecording(join(out, 'w2-c1.edf'));
    try {
      expect(rec.info.format).toBe('EDF+C');
      expect(rec.info.start).toBe('2026-01-05T09:00:00');
      expect(rec.info.duration_s).toBe(90);
      expect(rec.info.signals.map((s) => [s.label, s.unit, s.rate_hz])).toEqual([['EMG A', 'uV', 500], ['EMG B', 'uV', 500]]);
      expect(rec.info.signals[0].physical_max).toBe(design.channels[0].physical_range_uv);
      expect(rec.info.annotations.map((a) => [a.onset_s, a.duration_s, a.text])).toEqual([[0, 30, 'work'], [30, 15, 'pause'], [45, 30, 'work'], [75, 15, 'pause']]);
      const syn = new RecordingSynthesizer(design, whiteShaper);
      const want = syn.next(syn.totalSamples).map((a) => Float64Array.from(a));
      const got = [new Float64Array(syn.totalSamples), new Float64Array(syn.totalSamples)];
      let pos = 0;
      for await (const ch of rec.read({ signals: [0, 1] })) { got[0].set(ch.data[0], pos); got[1].set(ch.data[1], pos); pos += ch.data[0].length; }
      expect(pos).toBe(syn.totalSamples);
      for (let c = 0; c < 2; c++) {
        const step = (2 * design.channels[c].physical_range_uv) / 65535;
        let worst = 0;
        for (let i = 0; i < pos; i++) worst = Math.max(worst, Math.abs(got[c][i] - want[c][i]));
        expect(worst).toBeLessThanOrEqual(step);
      }
      // the drop-out designed for W2 c1 muscle a (10–12 s) is flat in the file
      const flat = got[0].subarray(10 * 500, 12 * 500);
      expect(Math.max(...flat) - Math.min(...flat)).toBe(0);
    } finally {
      await rec.close();
    }
  });

  it('reference recordings carry "MVC 1".."MVC k" and rest recordings "rest"', async () => {
    const out = join(tmp, 'b');
    await simulate(spec, out, { shaper: whiteShaper, format: 'edf' });
    const ref = await openRecording(join(out, 'w1-ref.edf'));
    const rest = await openRecording(join(out, 'w1-rest.edf'));
    expect(ref.info.annotations.map((a) => a.text)).toEqual(['MVC 1', 'MVC 2']);
    expect(ref.info.annotations[1].onset_s).toBe(2 + 9);
    expect(rest.info.annotations.map((a) => [a.onset_s, a.duration_s, a.text])).toEqual([[0, 10, 'rest']]);
    await ref.close(); await rest.close();
  });

  it('the same seed gives byte-identical EDF files (SHA-256)', async () => {
    await simulate(spec, join(tmp, 'c1'), { shaper: whiteShaper, format: 'edf', seed: 8 });
    await simulate(spec, join(tmp, 'c2'), { shaper: whiteShaper, format: 'edf', seed: 8 });
    for (const f of ['w1-c1.edf', 'w2-c2.edf', 'w1-ref.edf', 'truth.json', 'job.yaml']) expect(sha(join(tmp, 'c2', f))).toBe(sha(join(tmp, 'c1', f)));
  });
});
