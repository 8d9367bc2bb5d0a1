// The text form of a recording's quality screening for `shiftload inspect --quality`: one table
// row per signal, then every finding on its own line.
import type { RecordingQuality } from './screen-recording.js';

/**
 * Format the screening of a recording as a table plus the findings (plain text, ends with a newline).
 * @example process.stdout.write(formatQuality(await screenRecording('shift.edf')))
 */
export function formatQuality(q: RecordingQuality): string {
  const head = ['#', 'label', 'screened s', 'excluded s', 'clipped', 'flat s', 'lost s', 'mains s', 'motion s', 'ECG s', 'heart rate', 'noise floor µV'];
  const n = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(1));
  const rows = q.signals.map((s) => [
    String(s.index), s.label, n(s.screened_s), n(s.excluded_s),
    s.clipped_low === null || s.clipped_high === null ? '-' : String(s.clipped_low + s.clipped_high),
    n(s.flat_s), n(s.lost_s), n(s.mains_s), n(s.motion_s), n(s.ecg_s),
    s.ecg_rate_bpm === null ? '-' : `${s.ecg_rate_bpm.toFixed(0)}/min`,
    s.noise_floor_uv === null ? '-' : `${s.noise_floor_uv.toPrecision(3)}${s.noise_floor_source === 'estimated' ? ' (est.)' : ''}`,
  ]);
  const w = head.map((h, i) => Math.max([...h].length, ...rows.map((r) => [...r[i]!].length)));
  const left = new Set([1]);
  const line = (cells: string[]) => cells.map((c, i) => (left.has(i) ? c + ' '.repeat(w[i]! - [...c].length) : ' '.repeat(w[i]! - [...c].length) + c)).join('  ').trimEnd();
  const out = ['signal quality (screening windows: amplitude 1 s, spectrum 2 s, ECG 10 s unless set otherwise)', line(head), ...rows.map(line), ''];
  if (q.findings.length === 0) out.push('quality findings: none');
  else {
    out.push(`quality findings (${q.findings.length})`);
    for (const f of q.findings) out.push(`  ${f.severity.padEnd(7)} ${f.code.padEnd(11)} ${f.message}`);
  }
  return out.join('\n') + '\n';
}
