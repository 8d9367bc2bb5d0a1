import { describe, expect, it } from 'vitest';
import { snrFinding } from '../../lib/quality/snr-finding.js';

describe('snrFinding(envelope_uv, noise_uv, where)', () => {
  it('constant 10 µV envelope over 5 µV noise: task power 75 µV², SNR 10·log10(3) = 4.77 dB < 6 dB → low-snr', () => {
    // expected: 10·log10((10² − 5²)/5²) (definition, computed by hand)
    const r = snrFinding(new Float64Array(100).fill(10), 5, { worker: 'W', signal: 'EMG R' });
    expect(r.snr_db).toBeCloseTo(10 * Math.log10(3), 12);
    expect(r.task_uv).toBeCloseTo(Math.sqrt(75), 12);
    expect(r.finding).toMatchObject({ code: 'low-snr', severity: 'warning', where: { worker: 'W', signal: 'EMG R' } });
    expect(r.finding!.message).toContain('4.8 dB (limit 6 dB)');
  });
  it('a strong task signal gives no finding; NaN samples are skipped', () => {
    const env = Float64Array.from([40, NaN, 40, 40]);
    const r = snrFinding(env, 2, { signal: 'S' });
    expect(r.snr_db).toBeCloseTo(10 * Math.log10((1600 - 4) / 4), 12);
    expect(r.finding).toBeNull();
  });
  it('an envelope at the noise level gives −Infinity dB and a finding; the limit is configurable', () => {
    expect(snrFinding(new Float64Array(5).fill(3), 3, {}).snr_db).toBe(-Infinity);
    expect(snrFinding(new Float64Array(5).fill(10), 5, {}, 3).finding).toBeNull();
  });
});
