// Designed envelope of a reference-contraction recording: quiet lead-in, then per trial a linear
// ramp to the hold level, a hold, a linear release and a rest — the usual MVC protocol shape
// (common practice, no single source). Each trial is annotated "MVC k" over ramp + hold + release.
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import type { ReferenceSpec } from './simulation-spec.js';

export interface ReferenceDesign {
  duration_s: number;
  /** %MVE on the grid k / rate_hz (length duration · rate + 1). */
  values: Float64Array;
  /** One per trial: "MVC 1", "MVC 2", …; hold_start_s/hold_end_s bound the plateau. */
  trials: { text: string; onset_s: number; duration_s: number; hold_start_s: number; hold_end_s: number }[];
}

/**
 * Design the %MVE envelope of a reference recording.
 * @param ref protocol (durations in s, hold level in %MVE)
 * @param rate_hz design grid rate, Hz
 * @example designReferenceEnvelope(SIM_DEFAULTS.reference, 20).trials.length // 3
 */
export function designReferenceEnvelope(ref: ReferenceSpec, rate_hz: number): ReferenceDesign {
  const trialLen = ref.ramp_s + ref.hold_s + ref.release_s;
  // whole seconds (whole EDF records): the last rest is stretched to the next full second
  const duration_s = Math.ceil(ref.lead_s + ref.trials * (trialLen + ref.between_s) - 1e-9);
  const n = secondsToSamples(duration_s, rate_hz) + 1;
  const values = new Float64Array(n);
  const trials: ReferenceDesign['trials'] = [];
  for (let j = 0; j < ref.trials; j++) {
    const t0 = ref.lead_s + j * (trialLen + ref.between_s);
    trials.push({ text: `MVC ${j + 1}`, onset_s: t0, duration_s: trialLen, hold_start_s: t0 + ref.ramp_s, hold_end_s: t0 + ref.ramp_s + ref.hold_s });
  }
  for (let k = 0; k < n; k++) {
    const t = k / rate_hz;
    let v = 0;
    for (const tr of trials) {
      if (t >= tr.onset_s && t < tr.hold_start_s) v = (ref.hold_pct * (t - tr.onset_s)) / ref.ramp_s;
      else if (t >= tr.hold_start_s && t <= tr.hold_end_s) v = ref.hold_pct;
      else if (t > tr.hold_end_s && t < tr.onset_s + tr.duration_s) v = ref.hold_pct * (1 - (t - tr.hold_end_s) / ref.release_s);
    }
    values[k] = v;
  }
  return { duration_s, values, trials };
}
