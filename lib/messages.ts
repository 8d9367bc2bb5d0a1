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

export const dspMsg = {
  samplingRate: (fs: number) => `sampling rate fs must be a positive number in Hz, got ${fs}`,
  filterOrder: (got: number) => `filter order must be an integer from 1 to 10, got ${got}`,
  btype: (got: string) => `btype must be one of lowpass, highpass, bandpass, bandstop, got ${got}`,
  cutoffCount: (btype: string, got: number) => `${btype} needs ${btype === 'lowpass' || btype === 'highpass' ? 'one cut-off' : 'two cut-offs [low, high]'} in Hz, got ${got} value(s)`,
  cutoffBelowNyquist: (which: string, fs: number, got: number) => `${which} must be below fs/2 (fs=${fs} Hz → ${fs / 2} Hz), got ${got}`,
  cutoffPositive: (which: string, got: number) => `${which} must be above 0 Hz, got ${got}`,
  cutoffOrder: (low: number, high: number) => `low cut-off must be below the high cut-off (${high} Hz), got ${low}`,
  notchFrequency: (fs: number, got: number) => `notch frequency must be between 0 and fs/2 (fs=${fs} Hz → ${fs / 2} Hz), got ${got}`,
  notchQ: (got: number) => `notch quality factor Q must be a positive number, got ${got}`,
  mainsHz: (got: unknown) => `mains frequency must be 50 or 60 Hz (or null for no notch), got ${String(got)}`,
  harmonics: (got: number) => `mains harmonics must be an integer from 1 to 20, got ${got}`,
  ziLength: (expected: number, got: number) => `initial state must have 2 values per section (${expected}), got ${got}`,
  sosShape: (got: number) => `sos must hold 6 numbers per section (length a multiple of 6, at least 6), got length ${got}`,
  padlen: (n: number, padlen: number) => `the signal must be longer than padlen (${padlen} samples) for odd padding, got ${n} samples`,
  padlenValue: (got: number) => `padlen must be a whole number of samples ≥ 0, got ${got}`,
  nperseg: (got: number) => `nperseg must be a power of two from 8 to 1048576 samples, got ${got}`,
  noverlap: (nperseg: number, got: number) => `noverlap must be a whole number from 0 to nperseg − 1 (nperseg=${nperseg} → ${nperseg - 1}), got ${got}`,
  rmsWindow: (windowS: number, fs: number) => `RMS window must cover at least one sample (window_s=${windowS} s at fs=${fs} Hz), got ${windowS}`,
  envelopeRate: (fs: number, got: number) => `envelope rate must be above 0 and at most fs (fs=${fs} Hz), got ${got}`,
  frequencyRange: (fmin: number, fmax: number) => `frequency range must have fminHz below fmaxHz, got ${fmin}…${fmax} Hz`,
  spectrumLength: (lf: number, lp: number) => `frequencies and PSD must have the same length, got ${lf} and ${lp}`,
  medianConvention: (got: string) => `median frequency convention must be one of bin, interp, got ${got}`,
};

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
// report
// ---------------------------------------------------------------------------------------------
