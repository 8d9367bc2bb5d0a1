import { describe, expect, it } from 'vitest';
import { readSegmentsCsv } from '../../lib/job/read-segments-csv.js';

describe('readSegmentsCsv(text, file)', () => {
  it('readSegmentsCsv() reads rows with their line numbers, skipping blanks and # comments', () => {
    const text = '\uFEFFlabel,start_s,end_s\r\n# morning\r\nsorting,0,60.5\r\n\r\n"pack, ""A""",60.5,120\r\n';
    expect(readSegmentsCsv(text, 's.csv')).toEqual([
      { label: 'sorting', start_s: 0, end_s: 60.5, line: 3 },
      { label: 'pack, "A"', start_s: 60.5, end_s: 120, line: 5 },
    ]);
  });
  it('readSegmentsCsv() names line and column of a bad number', () => {
    expect(() => readSegmentsCsv('label,start_s,end_s\na,0,x\n', 's.csv')).toThrow("s.csv:2 end_s: expected a number of seconds, got 'x'");
  });
  it('readSegmentsCsv() refuses negative times, wrong field counts and open quotes', () => {
    expect(() => readSegmentsCsv('label,start_s,end_s\na,-1,5\n', 's.csv')).toThrow('s.csv:2 start_s: expected a value >= 0, got -1');
    expect(() => readSegmentsCsv('label,start_s,end_s\na,1\n', 's.csv')).toThrow('s.csv:2: expected 3 fields (label,start_s,end_s), got 2');
    expect(() => readSegmentsCsv('label,start_s,end_s\n"a,1,2\n', 's.csv')).toThrow('s.csv:2: unterminated quoted field');
  });
  it('readSegmentsCsv() needs the header line', () => {
    expect(() => readSegmentsCsv('a,0,1\n', 's.csv')).toThrow("s.csv:1: expected the header line label,start_s,end_s, got 'a,0,1'");
    expect(() => readSegmentsCsv('', 's.csv')).toThrow("s.csv:1: expected the header line label,start_s,end_s, got ''");
  });
});
