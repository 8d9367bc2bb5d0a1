// Every user-facing error and finding text, in one place, so wording stays consistent and tests
// can assert it. Functions return the full one-line message; callers wrap them in typed errors.
// Sections by area; keep each message on one line, naming the file and the field/line/byte.

// ---------------------------------------------------------------------------------------------
// general / cli
// ---------------------------------------------------------------------------------------------

export const msg = {
  fileNotFound: (file: string) => `${file}: file not found`,
  notAFile: (file: string) => `${file}: is a folder, expected a file`,
  emptyFile: (file: string) => `${file}: file is empty`,
  cannotRead: (file: string, reason: string) => `${file}: cannot read (${reason})`,
  outputIsInput: (file: string) => `${file}: output path is also an input; refusing to overwrite an input`,
  outputExists: (dir: string) => `${dir}: output folder exists and is not empty; use --force to reuse it`,
  badOption: (option: string, expected: string, got: string) => `--${option}: expected ${expected}, got ${got}`,
  parameter: (name: string, range: string, got: string | number) => `${name} must be ${range}, got ${got}`,
};

// ---------------------------------------------------------------------------------------------
// io: readers and writers (EDF family, CSV)
// ---------------------------------------------------------------------------------------------

// ---------------------------------------------------------------------------------------------
// dsp
// ---------------------------------------------------------------------------------------------

// ---------------------------------------------------------------------------------------------
// job file
// ---------------------------------------------------------------------------------------------

/** Quote a value for a message: text in single quotes, everything else as JSON. */
const shown = (v: unknown): string => (typeof v === 'string' ? `'${v}'` : JSON.stringify(v));
const listed = (xs: readonly string[], max = 12): string =>
  (xs.length === 0 ? 'none' : xs.slice(0, max).join(', ') + (xs.length > max ? `, … (${xs.length} in all)` : ''));

export const jobMsg = {
  /** The one-line form of every job-file problem: "job.yaml:14 workers[0].id: <what>". */
  at: (file: string, line: number, path: string, what: string) => `${file}:${line} ${path}: ${what}`,
  /** A problem at a line of a file without key paths (CSV segment files). */
  atLine: (file: string, line: number, what: string) => `${file}:${line}: ${what}`,
  yamlSyntax: (file: string, line: number, reason: string) => `${file}:${line}: YAML syntax error: ${reason}`,
  yamlDocuments: (file: string, n: number) => `${file}: expected one YAML document, found ${n}`,
  tooLarge: (file: string, limit: number) => `${file}: larger than ${limit} bytes; a job file is a short text file`,
  tooManyNodes: (file: string, limit: number) => `${file}: more than ${limit} values after expanding aliases; refusing to load`,
  notUtf8: (file: string) => `${file}: not UTF-8 text`,
  // schema-level (the "what" part)
  unknownKey: (suggestion: string | null, allowed: readonly string[]) =>
    (suggestion ? `unknown key; did you mean ${suggestion}?` : `unknown key; expected one of ${listed(allowed, 30)}`),
  missingKey: (key: string) => `missing required key '${key}'`,
  wrongType: (expected: string, got: unknown) => `expected ${expected}, got ${describeValue(got)}`,
  notOneOf: (allowed: readonly unknown[], got: unknown) => `expected one of ${allowed.map(shown).join(', ')}, got ${describeValue(got)}`,
  wrongFormat: (expected: string, got: unknown) => `expected ${shown(expected)} (this tool reads that job format), got ${describeValue(got)}`,
  outOfRange: (range: string, got: unknown) => `expected a value ${range}, got ${describeValue(got)}`,
  tooFew: (min: number, what: string) => (min === 1 ? `must not be empty` : `expected at least ${min} ${what}`),
  tooMany: (max: number, what: string) => `expected at most ${max} ${what}`,
  emptyText: () => 'must not be empty text',
  expectedOneOfShapes: (shapes: readonly string[], got: unknown) => `expected ${shapes.join(' or ')}, got ${describeValue(got)}`,
  // semantic
  fileMissing: (written: string) => `file '${written}' not found (paths are relative to the job file)`,
  fileIsFolder: (written: string) => `'${written}' is a folder, expected a file`,
  fileIsJob: (written: string) => `'${written}' is the job file itself, expected a recording`,
  cannotDescribe: (written: string, reason: string) => `cannot read '${written}': ${reason}`,
  noSignal: (signal: string, file: string, signals: readonly string[]) => `no signal '${signal}' in ${file} (signals: ${listed(signals)})`,
  noSignalForChannel: (signal: string, file: string, used: string, signals: readonly string[]) =>
    `no signal '${signal}' in ${file}, needed by ${used} (signals: ${listed(signals)})`,
  duplicateChannel: (signal: string, first: string) => `signal '${signal}' is already analysed at ${first}`,
  duplicateMuscle: (muscle: string, first: string) => `muscle '${muscle}' already named at ${first}; each channel of a recording needs its own muscle name`,
  duplicateWorker: (id: string, first: string) => `worker id '${id}' is already used at ${first}`,
  duplicateRecording: (file: string, first: string) => `file '${file}' is already listed for this worker at ${first}`,
  segmentOrder: (start: number, end: number) => `start_s (${start}) must be less than end_s (${end})`,
  segmentOutside: (start: number, end: number, duration: number, file: string) =>
    `${start}–${end} s lies outside ${file} (0–${duration} s)`,
  segmentsOverlap: (label: string, start: number, end: number, other: string, oStart: number, oEnd: number) =>
    `segment '${label}' (${start}–${end} s) overlaps '${other}' (${oStart}–${oEnd} s)`,
  noSegments: (how: string, file: string) => `no segments: ${how} in ${file}`,
  spanTimesOrAnnotation: () => 'give either start_s and end_s, or annotation (not both, not neither)',
  spanNoFile: () => "missing required key 'file' (a worker-level span must name its file)",
  durationWithoutAnnotation: () => 'duration_s is only used with annotation',
  noAnnotation: (text: string, file: string, available: readonly string[]) =>
    `no annotation '${text}' in ${file} (annotations: ${listed(available.map((a) => `'${a}'`))})`,
  annotationNoDuration: (text: string, onset: number) =>
    `annotation '${text}' at ${onset} s has no duration; add duration_s`,
  referenceNeeded: (normalize: string) => `no reference: normalize is ${normalize}, so each worker (or each recording) needs reference`,
  restNeeded: () => 'no rest: noise_correction is true, so each worker (or each recording) needs rest; or set settings.noise_correction: false',
  mveReferenceNeeded: () => 'no mve_reference: gap_threshold_unit is mve with normalize rve, so each worker needs mve_reference; or set settings.gap_threshold_unit: as-normalized',
  mveUnitImpossible: (normalize: string) => `gap_threshold_unit mve needs normalize mve or rve, but normalize is ${normalize}`,
  bandOrder: (low: number, high: number) => `low edge ${low} Hz must be below high edge ${high} Hz`,
  bandAboveNyquist: (high: number, signal: string, file: string, rate: number) =>
    `high edge ${high} Hz is not below half the sampling rate of '${signal}' in ${file} (${rate} Hz → ${rate / 2} Hz)`,
  notIncreasing: () => 'edges must increase strictly',
  gapMaxBelowMin: (max: number, min: number) => `gap_max_s (${max}) must be greater than gap_min_s (${min})`,
  segmentsBothSources: () => "give one of 'annotations' or 'csv', not both",
  segmentsNoSource: () => "give 'annotations' or 'csv'",
  csvHeader: (got: string) => `expected the header line label,start_s,end_s, got '${got}'`,
  csvColumns: (n: number) => `expected 3 fields (label,start_s,end_s), got ${n}`,
  csvQuote: () => 'unterminated quoted field',
  csvNumber: (got: string) => `expected a number of seconds, got '${got}'`,
  // init
  initExists: (file: string) => `${file}: already exists; use --force to overwrite it`,
  initNotFolder: (dir: string) => `${dir}: exists and is not a folder`,
};

/** A short description of a value for "got …" in messages. */
function describeValue(v: unknown): string {
  if (v === null || v === undefined) return 'nothing (null)';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'a mapping';
  if (typeof v === 'string') return `text '${v.length > 40 ? v.slice(0, 40) + '…' : v}'`;
  if (typeof v === 'boolean') return `${v}`;
  return `${v}`;
}

// ---------------------------------------------------------------------------------------------
// exposure and findings
// ---------------------------------------------------------------------------------------------

// ---------------------------------------------------------------------------------------------
// report
// ---------------------------------------------------------------------------------------------
