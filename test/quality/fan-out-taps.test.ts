import { describe, expect, it } from 'vitest';
import { fanOutTaps } from '../../lib/quality/fan-out-taps.js';
import type { ChannelTap } from '../../lib/study/read-envelopes.js';

function recorder(log: string[], name: string, withRaw = true): ChannelTap {
  return {
    ...(withRaw ? { raw: (x: Float64Array, first: number) => { log.push(`${name}.raw(${x.length},${first})`); } } : {}),
    filtered: (y) => { log.push(`${name}.filtered(${y.length})`); },
    restart: (o) => { log.push(`${name}.restart(${o})`); },
  };
}

describe('fanOutTaps(...lists)', () => {
  it('fanOutTaps(a, b) calls both lists\' taps of a channel in list order', () => {
    const log: string[] = [];
    const taps = fanOutTaps([recorder(log, 'a0'), recorder(log, 'a1')], [recorder(log, 'b0', false), null])!;
    expect(taps).toHaveLength(2);
    taps[0]!.raw!(new Float64Array(3), 7);
    taps[0]!.filtered!(new Float64Array(2));
    taps[0]!.restart!(1.5);
    taps[1]!.filtered!(new Float64Array(4));
    expect(log).toEqual(['a0.raw(3,7)', 'a0.filtered(2)', 'b0.filtered(2)', 'a0.restart(1.5)', 'b0.restart(1.5)', 'a1.filtered(4)']);
  });
  it('fanOutTaps(null, null) is undefined; a single list passes its taps through unchanged', () => {
    expect(fanOutTaps(null, undefined)).toBeUndefined();
    const t = recorder([], 'x');
    expect(fanOutTaps(null, [t])![0]).toBe(t);
  });
});
