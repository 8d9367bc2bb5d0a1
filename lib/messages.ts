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
  notResults: (file: string, what: string) => `${file}: not a shiftload results file: ${what}`,
  outputNotFolder: (dir: string) => `${dir}: output path exists and is not a folder`,
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
  writerRecordSize: (bytes: number, limit: number) =>
    `EDF writer: a data record would take ${bytes} bytes (limit ${limit}); the sampling rate is implausibly high for this writer`,
  writerPhysRange: (label: string, lo: number, hi: number) => `EDF writer: signal '${label}': physical minimum ${lo} must be below maximum ${hi}`,
  // convert
  convertProcessingGap: (file: string) => `${file}: the recording is discontinuous (EDF+D); filtering or an envelope needs continuous data — convert each continuous span with --start/--end`,
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
  sosA0: (row: number, got: number) => `sos row ${row}: a0 must be 1, got ${got}`,
  outputBuffer: (need: number, got: number) => `output buffer must hold at least ${need} samples, got ${got}`,
  spectrumBins: (got: number) => `spectrum must have at least 8 bins, got ${got}`,
  blockSize: (got: number) => `blockSize must be a whole number of samples ≥ 1, got ${got}`,
  pushAfterFlush: () => 'ZeroPhaseFilter: push() after flush(); create a new filter for a new stream',
  // spectrum command
  spectrumUnknownSignal: (name: string, labels: string) => `--signal: no signal named '${name}' (signals: ${labels})`,
  spectrumSpan: (start: number, end: number, duration: number) =>
    `--start ${start} / --end ${end}: expected 0 <= start < end <= ${duration} s (recording duration)`,
  spectrumOverlap: (got: number) => `--overlap must be a fraction from 0 to below 1 (e.g. 0.5), got ${got}`,
  spectrumTooShort: (file: string, label: string, samples: number, nperseg: number) =>
    `${file}: signal '${label}': the span holds ${samples} samples, fewer than one segment (nperseg ${nperseg}); use a longer span or a smaller --nperseg`,
};

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

/** Texts of findings raised by the analysis (lib/study/run-study.ts). */
export const findingText = {
  noiseUnavailable: (signal: string) => `no usable rest data for ${signal}; the envelope is not noise-corrected`,
  referenceZero: (signal: string, noise: number | null) => `reference amplitude of ${signal} is not above the noise level${noise === null ? '' : ` (${noise.toPrecision(3)} µV)`}; values cannot be normalized`,
  noReference: (signal: string, method: string) => `no ${method.toUpperCase()} reference value for ${signal}; its normalized values are left empty`,
  thresholdNotConverted: (signal: string) => `the %MVE gap threshold could not be converted to %RVE for ${signal} (no MVE reference); gap and rest figures are left empty`,
  clipping: (clipped: number, samples: number) => `${clipped} of ${samples} samples (${(100 * clipped / Math.max(1, samples)).toPrecision(2)} %) at the recorder's digital limits (clipping); amplitudes in those spans are underestimated`,
  segmentTooShort: (label: string, length: number, window: number) => `segment '${label}' lasts ${length.toPrecision(3)} s, shorter than the ${window} s RMS window; its figures rest on very few values`,
  excludedTime: (label: string, excluded: number, length: number) => `${excluded.toFixed(1)} s of ${length.toFixed(1)} s in segment '${label}' had no valid data (missing or NaN samples, or spans the quality screening judged unusable) and were left out`,
  referenceWeak: (signal: string, p90: number) => `${signal}: task values reach ${p90.toFixed(0)} %MVE (90th percentile above 100 %); the reference contraction was probably not maximal, so %MVE figures are overstated`,
  unitUnknown: (signal: string, unit: string) => `${signal}: unit '${unit}' is not a voltage shiftload knows (uV, µV, mV, V, nV); values are taken as µV`,
  discontinuous: (n: number) => `the recording has ${n} interruption(s) (EDF+D); filters restart after each and the time between records counts as no data`,
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

export const reportMsg = {
  notJson: (file: string, reason: string) => `${file}: not valid JSON (${reason}); expected a shiftload results file`,
  badFormat: (file: string, got: string) => `${file}: format: expected "shiftload-results/1", got ${got}`,
  badField: (file: string, field: string, expected: string, got: string) => `${file}: ${field}: expected ${expected}, got ${got}`,
  noRows: (file: string) => `${file}: rows: expected at least one result row, got none`,
  wrote: (file: string, pages: number, ms: number) => `wrote ${file} (${pages} pages, ${ms} ms)\n`,
  wroteSvg: (dir: string, n: number) => `wrote ${n} SVG charts to ${dir}\n`,
};

// ---------------------------------------------------------------------------------------------
// fatigue: spectral epochs, trends and JASA
// ---------------------------------------------------------------------------------------------

export const fatigueMsg = {
  epochTooShort: (epochS: number, fs: number) => `spectral epoch must hold at least 16 samples (epoch_s × fs; fs=${fs} Hz), got epoch_s=${epochS}`,
  band: (lo: number, hi: number, fs: number) => `spectral band must satisfy 0 ≤ low < high ≤ fs/2 (fs=${fs} Hz → ${fs / 2} Hz), got [${lo}, ${hi}] Hz`,
  spectrumBin: (binHz: number) => `mean-spectrum bin width must be a positive number of Hz, got ${binHz}`,
};

/** Texts written into the fatigue results (lib/exposure/fatigue-blocks.ts). */
export const fatigueText = {
  activeRule: (thresholdPct: number | null, unit: string, noiseFactor: number | null, noiseUv: number | null) => {
    const parts: string[] = [];
    if (thresholdPct !== null) parts.push(`noise-corrected RMS ≥ ${thresholdPct} ${unit}`);
    if (noiseFactor !== null && noiseUv !== null) parts.push(`RMS ≥ ${noiseFactor} × the noise RMS (${(noiseFactor * noiseUv).toPrecision(3)} µV)`);
    return parts.length === 0 ? 'every epoch with a non-zero RMS (no reference and no noise level to judge rest)' : `epochs with ${parts.join(' and ')}`;
  },
  method: (epochS: number, nfft: string, band: [number, number], blockS: number) =>
    `EMG cut into ${epochS}-s epochs; per epoch the RMS and, from one Hann-windowed FFT (${nfft}), the mean and median power frequency over ${band[0]}–${band[1]} Hz. `
    + `Over each ${blockS / 60}-min block and each task segment, amplitude and MNF are regressed on time (least squares, 95 % t intervals); `
    + 'a trend counts only when its interval excludes zero. JASA categories after Luttmann et al. 2000. '
    + 'The categories describe the EMG of the muscle, not an individual\'s fatigue state, injury risk or a diagnosis.',
};

// ---------------------------------------------------------------------------------------------
// quality: signal-quality screening (lib/quality)
// ---------------------------------------------------------------------------------------------

/** Seconds as "12.0–15.0 s (0:00:12–0:00:15)". */
function qSpan(t0: number, t1: number): string {
  const clk = (s: number) => {
    const t = Math.round(s);
    return `${Math.floor(t / 3600)}:${String(Math.floor((t % 3600) / 60)).padStart(2, '0')}:${String(t % 60).padStart(2, '0')}`;
  };
  return `${t0.toFixed(1)}–${t1.toFixed(1)} s (${clk(t0)}–${clk(t1)})`;
}
const qDb = (ratio: number) => (ratio > 0 ? `${(10 * Math.log10(ratio)).toFixed(1)} dB` : '−∞ dB');
const EXCLUDED = '; excluded from the statistics';

/** Texts of the quality findings: each names the measured value and the limit used. */
export const qualityMsg = {
  clipped: (signal: string, t0: number, t1: number, count: number, samples: number, excluded: boolean, excludeShare: number) =>
    `${signal}: ${count} of ${samples} samples (${(100 * count / Math.max(1, samples)).toPrecision(2)} %) at the recorder's digital limits in ${qSpan(t0, t1)}; amplitudes there are underestimated${excluded ? `${EXCLUDED} (limit: ${100 * excludeShare} % of a window)` : ` (exclusion from ${100 * excludeShare} % of a window)`}`,
  flatLine: (signal: string, t0: number, t1: number, std: number, limit: number) =>
    `${signal}: flat line in ${qSpan(t0, t1)}: raw standard deviation ${std.toPrecision(2)} µV, below the limit ${limit.toPrecision(2)} µV (electrode disconnected or recorder stalled)${EXCLUDED}`,
  signalLost: (signal: string, t0: number, t1: number, rms: number, floor: number, fraction: number, source: 'rest' | 'estimated') =>
    `${signal}: signal lost in ${qSpan(t0, t1)}: band-passed RMS ${rms.toPrecision(2)} µV, below ${fraction} × the noise floor ${floor.toPrecision(3)} µV (${source === 'rest' ? 'rest recording' : 'estimated from this recording'}); electrode off or cable loose${EXCLUDED}`,
  mains: (signal: string, t0: number, t1: number, hz: number, ratio: number, limit: number, notched: boolean) =>
    `${signal}: mains interference at ${hz} Hz in ${qSpan(t0, t1)}: hum power ${qDb(ratio)} relative to the EMG-band power (limit ${qDb(limit)})${notched ? '; the analysis notch removes it' : '; consider mains_hz in the job settings'}`,
  motion: (signal: string, t0: number, t1: number, ratio: number, limit: number, relative: number, excluded: boolean, excludeRatio: number) =>
    `${signal}: low-frequency artifact (movement, cable) in ${qSpan(t0, t1)}: power below the motion limit ${qDb(ratio)} relative to the EMG band (limit ${qDb(limit)}), ${relative.toFixed(0)} × the recording's usual level${excluded ? `${EXCLUDED} (limit ${qDb(excludeRatio)})` : ''}`,
  ecg: (signal: string, t0: number, t1: number, bpm: number, r: number, limitR: number, highpassHz: number | null) =>
    `${signal}: ECG-like spikes in ${qSpan(t0, t1)} at about ${bpm.toFixed(0)} beats/min (periodicity r = ${r.toFixed(2)}, limit ${limitR})${highpassHz !== null && highpassHz >= 30 ? `; the ${highpassHz} Hz high-pass reduces them, low-level values may still be raised` : '; a high-pass of 30 Hz or more reduces them (Drake & Callaghan 2006)'}`,
  moreSpans: (signal: string, code: string, spans: number, seconds: number) =>
    `${signal}: ${spans} further span(s) with '${code}', ${seconds.toFixed(1)} s in total (listed up to the max_spans limit)`,
  lowSnr: (signal: string, snrDb: number, limitDb: number, task: number, noise: number) =>
    `${signal}: low signal-to-noise ratio ${Number.isFinite(snrDb) ? snrDb.toFixed(1) : '−∞'} dB (limit ${limitDb} dB): task RMS ${task.toPrecision(3)} µV against a noise level of ${noise.toPrecision(3)} µV; low-level figures (rest, gaps, static load) are uncertain`,
  settingRange: (key: string, range: string, got: unknown) => `quality.${key} must be ${range}, got ${JSON.stringify(got)}`,
};

// ---------------------------------------------------------------------------------------------
// robust: input limits found by fuzzing; output paths (lib/io/write-atomic.ts)
// ---------------------------------------------------------------------------------------------

export const inputMsg = {
  spanUnit: (signal: string, spanFile: string, spanUnit: string, recFile: string, recUnit: string) =>
    `signal '${signal}' is in ${spanUnit} in ${spanFile} but in ${recUnit} in ${recFile}; only voltage units (µV, mV, V, nV) are converted — export both in the same unit`,
  csvLineTooLong: (file: string, line: number, limit: number) =>
    `${file}:${line}: line longer than ${limit} bytes; not a CSV/TSV text export (zero-filled or binary file?)`,
  csvTimeRate: (file: string, step: number) => `${file}: time column: a step of ${step} s gives no usable sampling rate or duration`,
};

export const outputMsg = {
  notRegular: (file: string) => `${file}: output path exists and is not a regular file (a device, pipe or socket); choose a file path`,
  isFolder: (file: string) => `${file}: output path is a folder; give a file name`,
  noFolder: (file: string) => `${file}: the folder for this output does not exist`,
  cannotWrite: (file: string, reason: string) => `${file}: cannot write (${reason})`,
};
