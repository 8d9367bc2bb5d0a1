// `npm run fuzz -- [--cases N] [--seed S] [--first I] [--timeout MS] [--kind K] [--main-every N] [--verbose]`:
// the long robustness run for release checks (the test suite runs a bounded share of it).
// Exit 0 when every case ended with exit 0 or a one-line exit 2; 1 with the failing cases listed.
import { rmSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { scratchDir } from './scratch-dir.js';
import { describeCase, FUZZ_KINDS, runFuzz, type FuzzKind } from './fuzz.js';

const { values } = parseArgs({
  options: {
    cases: { type: 'string', default: '2000' },
    seed: { type: 'string', default: '1' },
    first: { type: 'string', default: '0' },
    timeout: { type: 'string', default: '10000' },
    kind: { type: 'string', multiple: true },
    verbose: { type: 'boolean', default: false },
    'main-every': { type: 'string', default: '1' },
  },
});
const kinds = (values.kind ?? [...FUZZ_KINDS]) as FuzzKind[];
for (const k of kinds) {
  if (!FUZZ_KINDS.includes(k)) { process.stderr.write(`fuzz: unknown --kind ${k} (one of ${FUZZ_KINDS.join(', ')})\n`); process.exit(2); }
}
const dir = scratchDir('shiftload-fuzz-');
const t0 = performance.now();
const cases = Number(values.cases);
const s = await runFuzz({
  seed: Number(values.seed), cases, first: Number(values.first), timeoutMs: Number(values.timeout), dir, kinds, mainEvery: Number(values['main-every']),
  onCase: (r) => {
    if (values.verbose || r.failure) process.stdout.write(describeCase(r) + '\n');
    else if ((r.case + 1) % 1000 === 0) process.stdout.write(`… ${r.case + 1 - Number(values.first)} / ${cases}\n`);
  },
});
rmSync(dir, { recursive: true, force: true });
process.stdout.write(`fuzz seed ${values.seed}: ${s.cases} cases in ${((performance.now() - t0) / 1000).toFixed(1)} s — exit 0: ${s.exit0}, exit 2: ${s.exit2}, failures: ${s.failures.length}; slowest case ${Math.round(s.slowestMs)} ms\n`);
for (const [k, v] of Object.entries(s.byKind)) process.stdout.write(`  ${k.padEnd(15)} ${String(v.cases).padStart(6)} cases  exit 0: ${v.exit0}  exit 2: ${v.exit2}\n`);
if (s.unnamed.length > 0) {
  process.stdout.write(`exit-2 lines naming no input file: ${s.unnamed.length} (first few below)\n`);
  for (const r of s.unnamed.slice(0, values.verbose ? s.unnamed.length : 8)) process.stdout.write(`  ${describeCase(r)}\n`);
}
process.exitCode = s.failures.length > 0 ? 1 : 0;
