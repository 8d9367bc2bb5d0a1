// Seeded fuzzing of EDF/BDF inputs through inspect, convert and analyze (lib/robust/fuzz.ts).
import { fuzzSuite } from './fuzz-suite.js';

fuzzSuite('EDF/BDF', 101, ['edf-inspect', 'edf-convert', 'edf-analyze']);
