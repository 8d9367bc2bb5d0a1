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

// ---------------------------------------------------------------------------------------------
// report
// ---------------------------------------------------------------------------------------------

export const reportMsg = {
  notJson: (file: string, reason: string) => `${file}: not valid JSON (${reason}); expected a shiftload results file`,
  badFormat: (file: string, got: string) => `${file}: format: expected "shiftload-results/1", got ${got}`,
  badField: (file: string, field: string, expected: string, got: string) => `${file}: ${field}: expected ${expected}, got ${got}`,
  noRows: (file: string) => `${file}: rows: expected at least one result row, got none`,
  wrote: (file: string, pages: number, ms: number) => `wrote ${file} (${pages} pages, ${ms} ms)\n`,
  wroteSvg: (dir: string, n: number) => `wrote ${n} SVG charts to ${dir}\n`,
};
