// One row of the results' quality accounting from a channel's screening result.
import type { QualityRow } from '../study/results.js';
import type { ChannelQuality } from './quality-tap.js';

/**
 * The QualityRow of one worker × recording × channel.
 * @param ids who/what the row is about
 * @param q the finished screening of that channel
 * @param snr_db task-to-noise ratio from snrFinding, or null
 * @example qualityRow({ worker: 'W1', condition: 'old', muscle: 'trapezius', signal: 'EMG R', recording: 'w1.edf' }, q, 12.3)
 */
export function qualityRow(ids: Pick<QualityRow, 'worker' | 'condition' | 'muscle' | 'signal' | 'recording'>, q: ChannelQuality, snr_db: number | null): QualityRow {
  const s = q.summary;
  return {
    ...ids,
    screened_s: s.screened_s,
    excluded_s: s.excluded_s,
    clipped_s: s.clipped_s, flat_s: s.flat_s, lost_s: s.lost_s, mains_s: s.mains_s, motion_s: s.motion_s, ecg_s: s.ecg_s,
    clipped_samples: s.clipped_low === null || s.clipped_high === null ? null : s.clipped_low + s.clipped_high,
    ecg_rate_bpm: s.ecg_rate_bpm,
    snr_db: snr_db !== null && Number.isFinite(snr_db) ? snr_db : null,
    excluded: q.excluded.map((e) => ({ start_s: e.start_s, end_s: e.end_s, reason: e.reason })),
  };
}
