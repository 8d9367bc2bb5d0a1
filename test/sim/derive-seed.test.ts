import { describe, expect, it } from 'vitest';
import { deriveSeed } from '../../lib/sim/derive-seed.js';

describe('deriveSeed(seed, ...path)', () => {
  it('is FNV-1a 64 of the "/"-joined path XOR the seed', () => {
    // expected: FNV-1a 64 offset basis 0xcbf29ce484222325 (Fowler/Noll/Vo, published constants);
    // the empty string hashes to the offset basis, "a" to 0xaf63dc4c8601ec8c (published test vector)
    expect(deriveSeed(0)).toBe(0xcbf29ce484222325n);
    expect(deriveSeed(0, 'a')).toBe(0xaf63dc4c8601ec8cn);
    expect(deriveSeed(1, 'a')).toBe(0xaf63dc4c8601ec8dn);
  });

  it('different names give different streams; adding a name elsewhere does not change one', () => {
    const a = deriveSeed(7, 'W1', 'bench-fixed', 'trap', 'noise');
    expect(deriveSeed(7, 'W1', 'bench-fixed', 'ext', 'noise')).not.toBe(a);
    expect(deriveSeed(7, 'W2', 'bench-fixed', 'trap', 'noise')).not.toBe(a);
    expect(deriveSeed(7, 'W1', 'bench-fixed', 'trap', 'noise')).toBe(a);
  });
});
