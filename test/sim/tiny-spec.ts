// A small simulation spec for tests: 2 workers, 2 conditions, 2 muscles, 90 s at 500 Hz.
export const TINY_SPEC = `
format: shiftload-simulation/1
title: tiny test study
site: nowhere (invented)
seed: 5
sampling_rate_hz: 500
design_rate_hz: 20
noise_band_hz: [20, 200]
start: "2026-01-05T09:00:00"
output_format: csv
muscles:
  - { id: a, signal: "EMG A", muscle: "muscle a" }
  - { id: b, signal: "EMG B", muscle: "muscle b" }
reference: { trials: 2, lead_s: 2, ramp_s: 1, hold_s: 3, release_s: 1, between_s: 4 }
rest_duration_s: 10
variants:
  short: { duration_s: 90 }
  long: { duration_s: 180, cycle_scale: 2 }
conditions:
  - id: c1
    cycle: [{ task: work, duration_s: 30 }, { task: pause, duration_s: 15 }]
    tasks:
      work: { a: { level_pct: 10, spread_pct: 3, gaps_per_min: 2 }, b: { level_pct: 20, spread_pct: 5 } }
      pause: { a: { level_pct: 2, gaps_per_min: 8, gap_separation_s: 1 }, b: { level_pct: 3, gaps_per_min: 4 } }
  - id: c2
    cycle: [{ task: work, duration_s: 45 }]
    tasks:
      work: { a: { level_pct: 6, spread_pct: 2, gaps_per_min: 4 }, b: { level_pct: 18, spread_pct: 5 } }
workers:
  - id: W1
    muscles: { a: { mve_uv: 400, noise_uv: 1 }, b: { mve_uv: 250, noise_uv: 0.6 } }
  - id: W2
    muscles: { a: { mve_uv: 350, noise_uv: 0.8, load: 1.2 }, b: { mve_uv: 200, noise_uv: 0.5 } }
    artifacts: { c1: { a: { dropout: [{ start_s: 10, duration_s: 2 }] } } }
job:
  settings: { band_hz: [30, 200], percentiles: [10, 50, 90], gap_threshold_pct: 0.5, gap_min_s: 0.2 }
`;
