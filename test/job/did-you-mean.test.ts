import { describe, expect, it } from 'vitest';
import { didYouMean, editDistance } from '../../lib/job/did-you-mean.js';

describe('editDistance(a, b)', () => {
  it('editDistance() of textbook pairs', () => {
    // Levenshtein's textbook example: kitten → sitting = 3 (common practice, no single source)
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('abc', 'abc')).toBe(0);
    expect(editDistance('flaw', 'lawn')).toBe(2);
  });
});

describe('didYouMean(word, candidates)', () => {
  const keys = ['rms_window_s', 'reference_window_s', 'noise_window_s', 'band_hz', 'mains_hz'];
  it('didYouMean() finds a one-letter typo', () => {
    expect(didYouMean('rms_windw_s', keys)).toBe('rms_window_s');
    expect(didYouMean('band_Hz', keys)).toBe('band_hz');
  });
  it('didYouMean() returns null when nothing is close', () => {
    expect(didYouMean('colour', keys)).toBeNull();
  });
});
