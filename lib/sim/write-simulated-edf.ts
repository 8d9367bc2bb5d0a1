// Writes a designed recording as EDF+ (EDF+C, 16-bit, 1 s records) with its annotations (task
// segments, "MVC k", "rest"), samples generated and written 10 s at a time; atomic via EdfWriter.
import { EdfWriter } from '../io/edf-writer.js';
import type { NoiseShaper } from './noise-shaper.js';
import type { RecordingDesign } from './recording-design.js';
import { RecordingSynthesizer } from './recording-synthesizer.js';

/**
 * Generate and write one recording as EDF+ at `path`.
 * Physical range ±physical_range_uv per channel (digital −32768…32767), unit uV, prefilter and
 * transducer fields say the data are simulated.
 * @param chunk_s samples are generated this many seconds at a time
 * @example writeSimulatedEdf(design, 'out/w1-ref.edf', shaper)
 */
export function writeSimulatedEdf(design: RecordingDesign, path: string, shaper: NoiseShaper, chunk_s = 10): void {
  const syn = new RecordingSynthesizer(design, shaper);
  const w = new EdfWriter(path, design.channels.map((c) => ({
    label: c.signal, unit: 'uV', rate_hz: design.sampling_rate_hz,
    physical_min: -c.physical_range_uv, physical_max: c.physical_range_uv,
    prefilter: 'simulated', transducer: 'simulated sEMG (shiftload simulate)',
  })), {
    record_duration_s: 1,
    start: design.start,
    patient: design.worker,
    recording: `simulated ${design.kind}${design.condition ? ' ' + design.condition : ''}`,
    annotations: design.annotations,
  });
  try {
    const step = Math.max(1, Math.round(chunk_s * design.sampling_rate_hz));
    while (syn.remaining > 0) w.write(syn.next(Math.min(step, syn.remaining)));
    w.close();
  } catch (e) {
    w.abort();
    throw e;
  }
}
