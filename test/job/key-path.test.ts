import { describe, expect, it } from 'vitest';
import { formatKeyPath } from '../../lib/job/key-path.js';

describe('formatKeyPath(path)', () => {
  it('formatKeyPath() joins keys with dots and indices in brackets', () => {
    expect(formatKeyPath(['workers', 0, 'recordings', 1, 'channels', 0, 'signal'])).toBe('workers[0].recordings[1].channels[0].signal');
  });
  it('formatKeyPath() quotes keys that are not plain words', () => {
    expect(formatKeyPath(['settings', 'a b'])).toBe('settings["a b"]');
  });
  it('formatKeyPath([]) names the top level', () => {
    expect(formatKeyPath([])).toBe('(top level)');
  });
});
