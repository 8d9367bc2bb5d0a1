// Word wrapping with font metrics: greedy line filling at spaces; a word wider than the line is
// broken after a hyphen if it has one, else between characters. Common practice, no single source.
import type { Measure } from './charts/chart-marks.js';

/**
 * Split `text` into lines no wider than `width` pt at `size` pt. Explicit newlines are kept.
 * @example wrapText('a b c', 10, 9, measure) // ['a b', 'c'] for a narrow measure
 */
export function wrapText(text: string, width: number, size: number, measure: Measure, bold = false): string[] {
  const lines: string[] = [];
  for (const para of text.split('\n')) {
    const words = para.split(/ +/).filter((w) => w.length > 0);
    let line = '';
    for (let word of words) {
      const candidate = line ? line + ' ' + word : word;
      if (measure(candidate, size, bold) <= width) { line = candidate; continue; }
      if (line) { lines.push(line); line = ''; }
      while (measure(word, size, bold) > width) {
        let n = word.length - 1;
        while (n > 1 && measure(word.slice(0, n), size, bold) > width) n--;
        const hyphen = word.lastIndexOf('-', n - 1);
        if (hyphen > 0) n = hyphen + 1; // prefer a break after a hyphen
        lines.push(word.slice(0, n));
        word = word.slice(n);
      }
      line = word;
    }
    lines.push(line);
  }
  return lines;
}
