import { describe, expect, it } from 'vitest';
import { InputError } from '../../lib/errors.js';
import { loadSimulationSpec, parseSimulationSpec } from '../../lib/sim/load-simulation-spec.js';
import { SAMPLE_STUDY_SPEC } from '../../lib/sim/generate-sample-study.js';
import { TINY_SPEC } from './tiny-spec.js';

function errorOf(text: string): string {
  try { parseSimulationSpec(text, 'sim.yaml'); } catch (e) { expect(e).toBeInstanceOf(InputError); return (e as Error).message; }
  throw new Error('no error');
}

describe('parseSimulationSpec(text, file)', () => {
  it('reads a spec and fills defaults', () => {
    const s = parseSimulationSpec(TINY_SPEC, 'sim.yaml');
    expect(s.workers.map((w) => w.id)).toEqual(['W1', 'W2']);
    expect(s.workers[0].muscles.a.load).toBe(1);
    expect(s.conditions[0].tasks.work.a.step_s).toEqual([2, 8]);
    expect(s.reference.hold_pct).toBe(100);
    expect(s.noise_order).toBe(4);
  });

  it('names the key path of a missing or bad field', () => {
    expect(errorOf(TINY_SPEC.replace('mve_uv: 400', 'mve_uv: -4'))).toBe('sim.yaml: workers[0].muscles.a.mve_uv: expected a number in [1, 100000], got -4');
    expect(errorOf(TINY_SPEC.replace('format: shiftload-simulation/1', 'format: x'))).toBe('sim.yaml: format: expected "shiftload-simulation/1", got "x"');
    expect(errorOf(TINY_SPEC.replace('{ task: pause, duration_s: 15 }', '{ task: nap, duration_s: 15 }'))).toBe('sim.yaml: conditions[0].cycle[1].task: unknown task "nap" (valid: work, pause)');
    expect(errorOf(TINY_SPEC.replace('b: { level_pct: 18, spread_pct: 5 }', 'c: { level_pct: 18 }'))).toBe('sim.yaml: conditions[1].tasks.work.b: expected a task design for every muscle, got nothing');
    expect(errorOf(TINY_SPEC.replace('noise_band_hz: [20, 200]', 'noise_band_hz: [20, 300]'))).toBe('sim.yaml: noise_band_hz: expected an upper edge below the Nyquist frequency 250 Hz, got 300');
    expect(errorOf(TINY_SPEC.replace('dropout:', 'dropouts:'))).toMatch(/^sim\.yaml: workers\[1\]\.artifacts\.c1\.a\.dropouts: unknown artifact "dropouts"/);
    expect(errorOf(TINY_SPEC.replace('signal: "EMG A"', 'signal: "EMG right forearm ext"'))).toBe('sim.yaml: muscles[0].signal: expected at most 16 printable ASCII characters (EDF label), got "EMG right forearm ext"');
    expect(errorOf('format: [')).toMatch(/^sim\.yaml: line 1: not valid YAML/);
  });

  it('loadSimulationSpec(file) reports a missing file', () => {
    expect(() => loadSimulationSpec('/nonexistent/sim.yaml')).toThrow('/nonexistent/sim.yaml: file not found');
  });

  it('the bundled parcel-packing spec loads: 6 workers, 2 conditions, 2 muscles, short and full variants', () => {
    const s = loadSimulationSpec(SAMPLE_STUDY_SPEC);
    expect(s.workers.map((w) => w.id)).toEqual(['W1', 'W2', 'W3', 'W4', 'W5', 'W6']);
    expect(s.conditions.map((c) => c.id)).toEqual(['bench-fixed', 'bench-adjustable']);
    expect(s.muscles.length).toBe(2);
    expect(s.variants.full.duration_s).toBe(8 * 3600);
  });
});
