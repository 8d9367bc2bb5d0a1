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

// ---------------------------------------------------------------------------------------------
// exposure and findings
// ---------------------------------------------------------------------------------------------

export const exposureMsg = {
  percentileOutOfRange: (q: number) => `percentile q must be a number from 0 to 100, got ${q}`,
  edgesNotIncreasing: (name: string, got: readonly number[]) =>
    `${name} must be finite, strictly increasing numbers (at least one), got [${got.join(', ')}]`,
  referenceNotPositive: (got: number) => `reference amplitude must be a finite number > 0 µV, got ${got}`,
  ratioNotPositive: (got: number) => `RVE/MVE ratio k must be a finite number > 0, got ${got}`,
  emptySample: (name: string) => `${name}: needs at least one finite value, got none`,
  tooFewForStatistic: (name: string, need: number, got: number) =>
    `${name}: needs at least ${need} finite values, got ${got}`,
  unknownMeasure: (got: string, valid: readonly string[]) =>
    `compare measure must be one of ${valid.join(', ')} or p<q>, got ${got}`,
};

// ---------------------------------------------------------------------------------------------
// sim: simulation spec and `shiftload simulate`
// ---------------------------------------------------------------------------------------------

export const simMsg = {
  specNotMapping: (file: string) => `${file}: expected a YAML mapping at the top level (a shiftload-simulation/1 spec)`,
  specYaml: (file: string, line: number, reason: string) => `${file}: line ${line}: not valid YAML (${reason})`,
  specFormat: (file: string, got: string) => `${file}: format: expected "shiftload-simulation/1", got ${got}`,
  specField: (file: string, path: string, expected: string, got: string) => `${file}: ${path}: expected ${expected}, got ${got}`,
  specUnknownRef: (file: string, path: string, what: string, got: string, valid: string[]) =>
    `${file}: ${path}: unknown ${what} "${got}" (valid: ${valid.join(', ')})`,
  specUnknownVariant: (file: string, got: string, valid: string[]) => `${file}: variants: no variant "${got}" (valid: ${valid.join(', ')})`,
  specDuplicate: (file: string, path: string, got: string) => `${file}: ${path}: "${got}" appears twice`,
  gapDesign: (file: string, path: string, detail: string) => `${file}: ${path}: ${detail}`,
  outNotFolder: (dir: string) => `${dir}: is a file, expected an output folder`,
};

// ---------------------------------------------------------------------------------------------
// report
// ---------------------------------------------------------------------------------------------
