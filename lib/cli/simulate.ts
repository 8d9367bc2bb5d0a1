// `shiftload simulate SPEC --out DIR`: synthetic sEMG with known truth (recordings, job.yaml,
// truth.json) from a simulation spec.
import type { CommandModule } from 'yargs';
import { UsageError } from '../errors.js';
import { msg } from '../messages.js';
import { loadSimulationSpec } from '../sim/load-simulation-spec.js';
import { simulate } from '../sim/simulate.js';
import type { WithIO } from './cli-io.js';

interface SimulateArgs extends WithIO {
  spec: string;
  out: string;
  seed?: number;
  format?: string;
  variant?: string;
  force?: boolean;
}

export const simulateCommand: CommandModule<object, SimulateArgs> = {
  command: 'simulate <spec>',
  describe: 'Generate synthetic sEMG recordings with known truth, plus a job file, from a simulation spec',
  builder: (y) => y
    .positional('spec', { type: 'string', demandOption: true, describe: 'simulation spec (YAML, format shiftload-simulation/1)' })
    .option('out', { type: 'string', demandOption: true, describe: 'output folder (created; must be empty unless --force)' })
    .option('seed', { type: 'number', describe: 'random seed (overrides the spec); same seed → identical files' })
    .option('format', { type: 'string', choices: ['edf', 'csv'], describe: 'recording format (overrides the spec)' })
    .option('variant', { type: 'string', describe: 'variant of the spec, e.g. short or full (default: the first listed)' })
    .option('force', { type: 'boolean', default: false, describe: 'write into a folder that is not empty' })
    .example('$0 simulate sample-jobs/parcel-packing/simulation.yaml --out sim-out', 'the parcel-packing study, 25-minute recordings, EDF+')
    .example('$0 simulate sample-jobs/parcel-packing/simulation.yaml --out sim-full --variant full', '8-hour field recordings')
    .example('$0 simulate my-sim.yaml --out sim-csv --format csv --seed 7', 'CSV recordings with another seed') as never,
  handler: async (argv) => {
    if (argv.seed !== undefined && !(Number.isSafeInteger(argv.seed) && argv.seed >= 0)) {
      throw new UsageError(msg.badOption('seed', 'a whole number ≥ 0', String(argv.seed)));
    }
    const spec = loadSimulationSpec(argv.spec);
    const t0 = Date.now();
    const r = await simulate(spec, argv.out, {
      seed: argv.seed, format: argv.format as 'edf' | 'csv' | undefined, variant: argv.variant, force: argv.force, file: argv.spec,
      onRecording: (done, total, file) => { if (argv.io.errIsTTY) argv.io.err(`\r\x1b[2K${done}/${total} ${file}`); },
    });
    if (argv.io.errIsTTY) argv.io.err('\r\x1b[2K');
    const s = (Date.now() - t0) / 1000;
    argv.io.out(
      `${r.files.length} recordings (${r.plan.format}, variant ${r.plan.variant}, seed ${r.plan.seed}) in ${argv.out}\n` +
      `job file: ${r.jobPath}\ntruth:    ${r.truthPath}\n` +
      `${(r.samples / 1e6).toFixed(1)} M samples in ${s.toFixed(1)} s\n`,
    );
  },
};
