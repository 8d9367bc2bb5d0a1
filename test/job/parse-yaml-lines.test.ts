import { describe, expect, it } from 'vitest';
import { InputError } from '../../lib/errors.js';
import { parseYamlWithLines } from '../../lib/job/parse-yaml-lines.js';

const TEXT = [
  'a:',              // 1
  '  b: 1',          // 2
  '  list:',         // 3
  '    - x',         // 4
  '    - { y: 2,',   // 5
  '        z: 3 }',  // 6
  'c: [1,',          // 7
  '  2]',            // 8
].join('\n') + '\n';

describe('parseYamlWithLines(text, file)', () => {
  it('parseYamlWithLines() returns the value of the document', () => {
    expect(parseYamlWithLines(TEXT, 'j.yaml').value).toEqual({ a: { b: 1, list: ['x', { y: 2, z: 3 }] }, c: [1, 2] });
  });

  it('lineOf(path) gives the line of keys, list items and flow entries', () => {
    const p = parseYamlWithLines(TEXT, 'j.yaml');
    expect(p.lineOf(['a'])).toBe(1);
    expect(p.lineOf(['a', 'b'])).toBe(2);
    expect(p.lineOf(['a', 'list'])).toBe(3);
    expect(p.lineOf(['a', 'list', 0])).toBe(4);
    expect(p.lineOf(['a', 'list', 1])).toBe(5);
    expect(p.lineOf(['a', 'list', 1, 'z'])).toBe(6);
    expect(p.lineOf(['c', 1])).toBe(8);
  });

  it('lineOf(path) falls back to the nearest written ancestor', () => {
    const p = parseYamlWithLines(TEXT, 'j.yaml');
    expect(p.lineOf(['a', 'list', 1, 'missing'])).toBe(5);
    expect(p.lineOf(['nowhere'])).toBe(1);
  });

  it('values reached through an alias point at the alias', () => {
    const p = parseYamlWithLines('x: &r { k: 1 }\ny:\n  z: *r\n', 'j.yaml');
    expect(p.value).toEqual({ x: { k: 1 }, y: { z: { k: 1 } } });
    expect(p.lineOf(['y', 'z', 'k'])).toBe(3);
  });

  it('a syntax error is an InputError naming file and line', () => {
    expect(() => parseYamlWithLines('a: 1\n  b: 2\n', 'j.yaml')).toThrow(InputError);
    expect(() => parseYamlWithLines('a: 1\n  b: 2\n', 'j.yaml')).toThrow(/^j\.yaml:2: YAML syntax error: /);
  });

  it('duplicate keys are refused', () => {
    expect(() => parseYamlWithLines('a: 1\na: 2\n', 'j.yaml')).toThrow(/^j\.yaml:2: YAML syntax error: duplicated mapping key/);
  });

  it('non-core tags are refused (safe schema only)', () => {
    expect(() => parseYamlWithLines('a: !!js/function "x"\n', 'j.yaml')).toThrow(/unknown scalar tag/);
  });

  it('too many aliases are refused', () => {
    const text = 'a: &a [1]\n' + Array.from({ length: 60 }, (_, i) => `k${i}: *a`).join('\n') + '\n';
    expect(() => parseYamlWithLines(text, 'j.yaml')).toThrow(/maxAliases/);
  });

  it('alias expansion beyond the node limit is refused', () => {
    // nine levels of ten references each: 10^9 values once expanded
    const lines = ['l0: &l0 [0, 0, 0, 0, 0, 0, 0, 0, 0, 0]'];
    for (let i = 1; i < 9; i++) lines.push(`l${i}: &l${i} [${Array(10).fill(`*l${i - 1}`).join(', ')}]`);
    expect(() => parseYamlWithLines(lines.join('\n') + '\n', 'j.yaml', { maxBytes: 1 << 20, maxAliases: 100, maxNodes: 10000, maxDepth: 40 }))
      .toThrow(/more than 10000 values after expanding aliases/);
  });

  it('more than one document is refused', () => {
    expect(() => parseYamlWithLines('a: 1\n---\nb: 2\n', 'j.yaml')).toThrow('j.yaml: expected one YAML document, found 2');
  });
});
