// A job file over the EDFlib fixture recording emg_3sig.edf (shared/fixtures/edf): its annotation
// "reference contraction" serves as the reference span and "break" as the rest span; the other
// annotations are the task segments. Used by the analysis tests.

/** The fixture recording (EDFlib 1.23, see shared/fixtures/README.md). */
export const FIXTURE_EDF = new URL('../../../shared/fixtures/edf/emg_3sig.edf', import.meta.url).pathname;

export interface FixtureJobOptions {
  /** Extra settings lines, indented by two spaces (e.g. '  trace_step_s: 1'). */
  settings?: string;
  /** Channels as [signal, muscle]. @default trapezius only */
  channels?: [string, string][];
  /** The recording's file name in the job's folder. @default 'rec.edf' */
  file?: string;
  title?: string;
}

/** The YAML text of the fixture job (band 20–200 Hz: the forearm signal is sampled at 500 Hz). */
export function fixtureJobYaml(o: FixtureJobOptions = {}): string {
  const file = o.file ?? 'rec.edf';
  const channels = o.channels ?? [['EMG R trapezius', 'upper trapezius, right']];
  return `format: shiftload-job/1
title: ${o.title ?? 'fixture study'}
settings:
  band_hz: [20, 200]
${o.settings ? o.settings + '\n' : ''}workers:
  - id: W1
    reference: { file: ${file}, annotation: "reference contraction" }
    rest: { file: ${file}, annotation: "break" }
    recordings:
      - file: ${file}
        condition: a
        channels:
${channels.map(([s, m]) => `          - { signal: "${s}", muscle: "${m}" }`).join('\n')}
        segments: annotations
`;
}
