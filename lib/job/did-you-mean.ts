// Suggest the intended key for a misspelt one (unknown keys in a job file).

/**
 * The candidate closest to `word` by edit distance (Levenshtein: insertions, deletions,
 * substitutions, each 1), if it is close enough to be a plausible typo: distance ≤ max(1, ⌊len/3⌋)
 * (len = the longer of the two). Ties go to the earlier candidate. Case-insensitive.
 * @example didYouMean('rms_windw_s', ['rms_window_s', 'band_hz']) // 'rms_window_s'
 */
export function didYouMean(word: string, candidates: readonly string[]): string | null {
  let best: string | null = null;
  let bestD = Infinity;
  const w = word.toLowerCase();
  for (const c of candidates) {
    const d = editDistance(w, c.toLowerCase());
    const limit = Math.max(1, Math.floor(Math.max(w.length, c.length) / 3));
    if (d <= limit && d < bestD) {
      best = c;
      bestD = d;
    }
  }
  return best;
}

/** Levenshtein distance between two strings (two-row dynamic programming). */
export function editDistance(a: string, b: string): number {
  let prev = new Array<number>(b.length + 1);
  let cur = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    cur[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const sub = prev[j - 1] + (a.charCodeAt(i - 1) === b.charCodeAt(j - 1) ? 0 : 1);
      cur[j] = Math.min(sub, prev[j] + 1, cur[j - 1] + 1);
    }
    [prev, cur] = [cur, prev];
  }
  return prev[b.length];
}
