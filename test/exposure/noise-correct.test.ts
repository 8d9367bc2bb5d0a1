import { describe, expect, it } from 'vitest';
import { noiseCorrect, noiseCorrectArray } from '../../lib/exposure/noise-correct.js';

describe('noiseCorrect(rms, noise)', () => {
  it('noiseCorrect gives 4, 0, 10 for (5,3), (2,3), (10,0) (METHODS.md §4, COMPUTED)', () => {
    expect(noiseCorrect(5, 3)).toBe(4);
    expect(noiseCorrect(2, 3)).toBe(0);
    expect(noiseCorrect(10, 0)).toBe(10);
    expect(noiseCorrect(NaN, 3)).toBeNaN();
  });

  it('noiseCorrectArray returns a new array equal to the scalar version and leaves the input alone', () => {
    const rms = Float64Array.of(5, 2, 10, NaN, 3);
    const before = Float64Array.from(rms);
    const out = noiseCorrectArray(rms, 3);
    expect(out).not.toBe(rms);
    expect(rms).toEqual(before);
    expect(Array.from(out)).toEqual([4, 0, Math.sqrt(91), NaN, 0]);
    const buf = new Float64Array(5);
    expect(noiseCorrectArray(rms, 3, buf)).toBe(buf);
    expect(() => noiseCorrectArray(rms, 3, new Float64Array(2))).toThrow(RangeError);
  });
});
