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

// ---------------------------------------------------------------------------------------------
// report
// ---------------------------------------------------------------------------------------------
