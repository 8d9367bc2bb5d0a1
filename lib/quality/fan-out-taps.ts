// Several observers on one channel: readEnvelopes takes one tap per channel, so the analysis joins
// its tap lists (spectral epochs, quality screening) channel by channel. Generic; it lives here
// until lib/study wants it.
import type { ChannelTap } from '../study/read-envelopes.js';

/**
 * Join per-channel tap lists: channel c gets a tap that calls every list's tap c in list order.
 * Null lists, and null entries, are skipped; a channel with one tap gets that tap itself.
 * @returns one tap (or null) per channel; undefined when every list is null (no taps at all)
 * @example readEnvelopes({ ..., taps: fanOutTaps(fatigueTaps(job.fatigue), qualityTaps) })
 */
export function fanOutTaps(...lists: (readonly (ChannelTap | null)[] | null | undefined)[]): (ChannelTap | null)[] | undefined {
  const present = lists.filter((l): l is readonly (ChannelTap | null)[] => Array.isArray(l));
  if (present.length === 0) return undefined;
  const n = Math.max(...present.map((l) => l.length));
  const out: (ChannelTap | null)[] = [];
  for (let c = 0; c < n; c++) {
    const taps = present.map((l) => l[c] ?? null).filter((t): t is ChannelTap => t !== null);
    if (taps.length <= 1) { out.push(taps[0] ?? null); continue; }
    const raws = taps.filter((t) => t.raw), filts = taps.filter((t) => t.filtered), rests = taps.filter((t) => t.restart);
    out.push({
      raw: (x, first) => { for (const t of raws) t.raw!(x, first); },
      filtered: (y) => { for (const t of filts) t.filtered!(y); },
      restart: (o) => { for (const t of rests) t.restart!(o); },
    });
  }
  return out;
}
