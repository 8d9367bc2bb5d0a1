import { describe, expect, it } from 'vitest';
import { canonicalJson, settingsHash } from '../../lib/report/canonical-json.js';
import { fillTemplate } from '../../lib/report/fill-template.js';
import { formatNumber, formatSetting } from '../../lib/report/format-number.js';
import { medianRange } from '../../lib/report/median-range.js';
import { flattenSettings, settingAt } from '../../lib/report/setting-at.js';

describe('report helpers', () => {
  it('fillTemplate(template, vars) fills placeholders and returns null when one has no value', () => {
    expect(fillTemplate('median {p50} {unit}', { p50: '8.1', unit: '%MVE' })).toBe('median 8.1 %MVE');
    expect(fillTemplate('median {p50} {unit}', { p50: null, unit: '%MVE' })).toBeNull();
    expect(fillTemplate('a{x}b', { x: '' })).toBe('ab');
  });

  it('formatNumber(x) uses 2 decimals below 1, 1 below 100, none above, and a true minus sign', () => {
    expect([0.123, 8.16, 123.4, -0.5, null, NaN].map((x) => formatNumber(x))).toEqual(['0.12', '8.2', '123', '−0.50', '–', '–']);
    expect(formatSetting(0.1)).toBe('0.1');
    expect(formatSetting(240)).toBe('240');
  });

  it('medianRange(values) is the middle value (mean of the two middle for even n), ignoring null', () => {
    expect(medianRange([3, null, 1, 2])).toEqual({ median: 2, min: 1, max: 3, n: 3 });
    expect(medianRange([4, 1, 3, 2])!.median).toBe(2.5);
    expect(medianRange([null])).toBeNull();
  });

  it('canonicalJson(value) sorts keys at every level; settingsHash is its SHA-256', () => {
    expect(canonicalJson({ b: 1, a: [2, { d: 1, c: 0 }], u: undefined })).toBe('{"a":[2,{"c":0,"d":1}],"b":1}');
    // expected: sha256 of the UTF-8 bytes '{"a":1}' (printf '{"a":1}' | sha256sum)
    expect(settingsHash({ a: 1 })).toBe('015abd7f5cc57a2dd94b7590f04ad8084273905ee33ec5cebeae62276a97f862');
  });

  it('settingAt(settings, paths) returns the first path that has a value; flattenSettings lists dotted keys', () => {
    const s = { filter: { order: 4, band_hz: [20, 450] }, x: null };
    expect(settingAt(s, ['bandpass.order', 'filter.order'])).toBe(4);
    expect(settingAt(s, ['x', 'nope.deeper'])).toBeUndefined();
    expect(flattenSettings(s)).toEqual([['filter.band_hz', '20, 450'], ['filter.order', '4'], ['x', 'null']]);
  });
});
