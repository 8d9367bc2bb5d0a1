// Seeded fuzzing of CSV/TSV, segment CSV and job YAML inputs through inspect, convert, check and
// analyze (lib/robust/fuzz.ts).
import { fuzzSuite } from './fuzz-suite.js';

fuzzSuite('CSV/TSV, segment CSV and job YAML', 202, ['csv-inspect', 'csv-convert', 'yaml-check', 'yaml-analyze', 'segments-check']);
