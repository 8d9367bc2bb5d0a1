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

/** Reader and writer messages (EDF/EDF+/BDF/BDF+, CSV/TSV). Each names the file and the field/byte/line. */
export const ioMsg = {
  unknownFormat: (file: string) => `${file}: unknown recording format (expected EDF/BDF by header, or .csv/.tsv/.txt)`,
  headerTooShort: (file: string, size: number, need: number) => `${file}: header truncated: file has ${size} bytes, the EDF header needs ${need}`,
  headerNotAscii: (file: string, field: string, offset: number, byte: number) =>
    `${file}: header field ${field} (byte ${offset}) holds byte 0x${byte.toString(16).padStart(2, '0')}, expected printable ASCII (0x20-0x7E)`,
  headerNumber: (file: string, field: string, offset: number, text: string, expected: string) =>
    `${file}: header field ${field} (byte ${offset}): expected ${expected}, got '${text}'`,
  headerBytes: (file: string, said: number, ns: number) =>
    `${file}: header field number of bytes in header (byte 184) says ${said}, expected 256 x (${ns} signals + 1) = ${256 * (ns + 1)}`,
  headerLongerThanFile: (file: string, need: number, size: number, ns: number) =>
    `${file}: header of ${ns} signals needs ${need} bytes, file holds only ${size} (truncated or wrong number of signals at byte 252)`,
  digitalRange: (file: string, signal: string, offset: number, dmin: number, dmax: number) =>
    `${file}: signal ${signal}: digital minimum ${dmin} must be below digital maximum ${dmax} (byte ${offset})`,
  digitalLimits: (file: string, signal: string, offset: number, value: number, lo: number, hi: number) =>
    `${file}: signal ${signal}: digital limit ${value} (byte ${offset}) is outside ${lo}..${hi} for this format`,
  physicalRange: (file: string, signal: string, offset: number, v: number) =>
    `${file}: signal ${signal}: physical minimum equals physical maximum (${v}, byte ${offset})`,
  recordCount: (file: string, said: number, holds: number) =>
    `${file}: header says ${said} data records (byte 236), file holds ${holds}${holds < said ? ' (truncated?)' : ' (extra data after the last record)'}`,
  partialRecord: (file: string, records: number, extra: number, recordSize: number) =>
    `${file}: file ends inside data record ${records + 1}: ${extra} of ${recordSize} bytes present (truncated?)`,
  noDataRecords: (file: string) => `${file}: header field number of data records (byte 236) is 0; the file holds no data`,
  talSyntax: (file: string, record: number, offset: number, what: string) =>
    `${file}: annotation in data record ${record + 1} (byte ${offset}): ${what}`,
  noTimekeeping: (file: string, record: number, offset: number) =>
    `${file}: data record ${record + 1} (byte ${offset}) has no time-keeping annotation (EDF+ requires one per record)`,
  notContinuous: (file: string, record: number, offset: number, t: number, expected: number) =>
    `${file}: data record ${record + 1} (byte ${offset}) starts at ${t} s by its time-keeping annotation, expected ${expected} s in a continuous (EDF+C/BDF+C) file`,
  writerDigital: (label: string, lo: number, hi: number, min: number, max: number) =>
    `EDF writer: signal '${label}': digital range ${lo}..${hi} must lie within ${min}..${max} with minimum below maximum`,
  writerStart: (start: string) => `EDF writer: start '${start}' must be YYYY-MM-DDTHH:MM:SS`,
  writerSubsecond: (x: number) => `EDF writer: start_subsecond_s must be in [0, 1), got ${x}`,
  writerNoSignals: () => 'EDF writer: at least one signal is needed',
  unknownSignal: (file: string, index: number, count: number) => `${file}: no signal with index ${index} (file has ${count})`,
  // CSV / TSV
  csvNoHeader: (file: string) => `${file}:1: expected a header row with channel names`,
  csvNoData: (file: string) => `${file}: no data rows after the header`,
  csvNoRate: (file: string) => `${file}: no time column (time, time_s, t, "time [s]") and no sampling rate given (--rate)`,
  csvNotNumber: (file: string, line: number, column: string, text: string) =>
    `${file}:${line} column ${column}: expected a number, got '${text}'`,
  csvRagged: (file: string, line: number, got: number, expected: number) =>
    `${file}:${line}: row has ${got} cells, the header has ${expected}`,
  csvTimeOrder: (file: string, line: number, prev: number, t: number) =>
    `${file}:${line}: time ${t} s does not increase (previous row ${prev} s); time stamps must be strictly increasing`,
  csvTimeUneven: (file: string, line: number, dt: number, median: number) =>
    `${file}:${line}: time step ${dt} s differs from the median step ${median} s by more than 1%; resample to a uniform rate first`,
  csvTimeMissing: (file: string, line: number) => `${file}:${line}: the time cell is empty`,
  // writer
  writerLabel: (label: string) => `EDF writer: signal label '${label}' must be printable ASCII`,
  writerRate: (rates: string, duration: number) =>
    `EDF writer: sampling rates ${rates} Hz give no whole number of samples per ${duration} s data record`,
  writerNumber: (what: string, value: number) => `EDF writer: ${what} ${value} does not fit in an 8-character EDF header field`,
  writerPhysRange: (label: string, lo: number, hi: number) => `EDF writer: signal '${label}': physical minimum ${lo} must be below maximum ${hi}`,
  // convert
  convertMixedRates: (rates: string) =>
    `convert --format csv: the selected signals have different sampling rates (${rates} Hz); select signals of one rate with --signals`,
  convertUnknownSignal: (name: string, labels: string) => `--signals: no signal named '${name}' (signals: ${labels})`,
  convertSpan: (start: number, end: number, duration: number) =>
    `--start ${start} / --end ${end}: expected 0 <= start < end <= ${duration} s (recording duration)`,
};

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
