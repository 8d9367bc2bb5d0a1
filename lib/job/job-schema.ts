// The JSON Schema (draft-07) of a job file, shipped with the tool: `shiftload schema` prints it so
// editors can validate and complete job.yaml; the loader validates against the same object.
// Defaults shown here are read from DEFAULTS, so the two cannot drift apart.
import { DEFAULTS } from './defaults.js';
import { qualitySchema } from '../quality/quality-schema.js';

/** The value of `format` this version reads. */
export const JOB_FORMAT = 'shiftload-job/1';

const nonNegativeSeconds = (title: string, description: string) => ({
  type: 'number', minimum: 0, title, description,
});

/** A time span in a file, given by times or by annotation text. */
const span = {
  title: 'Time span',
  description: 'A stretch of a recording, given by times (start_s, end_s) or by annotation text (annotation). '
    + 'Paths are relative to the job file.',
  type: 'object',
  additionalProperties: false,
  properties: {
    file: { type: 'string', minLength: 1, title: 'File', description: 'Recording that holds the span (EDF, EDF+, BDF, BDF+ or CSV), relative to the job file. Optional inside a recording (that recording\'s file is meant); required at worker level.' },
    start_s: nonNegativeSeconds('Start', 'Start of the span, s from the start of the file.'),
    end_s: nonNegativeSeconds('End', 'End of the span, s from the start of the file (greater than start_s).'),
    annotation: { type: 'string', minLength: 1, title: 'Annotation text', description: 'EDF+ annotation text (exact match, case-sensitive). Every annotation with this text becomes one span (onset to onset + duration); several spans mean several trials.' },
    duration_s: { type: 'number', exclusiveMinimum: 0, title: 'Duration', description: 'With annotation: length of the span from the annotation onset, s. Needed when the annotation has no duration; overrides it otherwise.' },
    rate_hz: { type: 'number', exclusiveMinimum: 0, title: 'CSV sampling rate, Hz', description: 'Only for a CSV file without a time column: its sampling rate in Hz. Default: the enclosing recording\'s rate_hz when the file is the same.' },
  },
};

const spanOrList = (title: string, description: string) => ({
  title,
  description,
  anyOf: [
    { ...span, title: 'a span' },
    { type: 'array', minItems: 1, items: span, title: 'a list of spans' },
  ],
});

const segment = {
  title: 'Segment',
  description: 'A task segment of a recording.',
  type: 'object',
  additionalProperties: false,
  required: ['label', 'start_s', 'end_s'],
  properties: {
    label: { type: 'string', minLength: 1, title: 'Label', description: 'Task name; segments with the same label are pooled per recording in the summaries.' },
    start_s: nonNegativeSeconds('Start', 'Start of the segment, s from the start of the recording.'),
    end_s: nonNegativeSeconds('End', 'End of the segment, s from the start of the recording (greater than start_s).'),
  },
};

const channel = {
  title: 'Channel',
  description: 'One EMG signal of the recording to analyse.',
  type: 'object',
  additionalProperties: false,
  required: ['signal'],
  properties: {
    signal: { type: 'string', minLength: 1, title: 'Signal label', description: 'Signal label exactly as in the recording header (see `shiftload check`).' },
    muscle: { type: 'string', minLength: 1, title: 'Muscle', description: 'Muscle name; channels are paired across workers and conditions by this name. Default: the signal label.' },
  },
};

const segments = {
  title: 'Segments',
  description: 'Task segments: an inline list; the word `annotations` (every EDF+ annotation with a duration becomes a segment, '
    + 'except those used as reference/rest spans); { annotations: { include, prefix } } to pick annotations; or { csv: FILE } '
    + '(columns label,start_s,end_s with a header line).',
  anyOf: [
    { type: 'array', minItems: 1, items: segment, title: 'a list of segments' },
    { type: 'string', enum: ['annotations'], title: '\'annotations\'' },
    {
      type: 'object',
      title: '{ annotations: … } or { csv: FILE }',
      additionalProperties: false,
      properties: {
        annotations: {
          title: 'Segments from annotations',
          description: 'Which EDF+ annotations become segments (only annotations with a duration). Without include and prefix: all.',
          type: 'object',
          additionalProperties: false,
          properties: {
            include: { type: 'array', minItems: 1, items: { type: 'string', minLength: 1 }, title: 'Include', description: 'Annotation texts (exact) that become segments.' },
            prefix: { type: 'string', minLength: 1, title: 'Prefix', description: 'Annotations whose text starts with this prefix become segments; the label is the text after the prefix.' },
          },
        },
        csv: { type: 'string', minLength: 1, title: 'Segment file', description: 'CSV file with a header line label,start_s,end_s, relative to the job file.' },
      },
    },
  ],
};

const recording = {
  title: 'Recording',
  description: 'One field recording of a worker under one condition.',
  type: 'object',
  additionalProperties: false,
  required: ['file', 'condition', 'channels', 'segments'],
  properties: {
    file: { type: 'string', minLength: 1, title: 'File', description: 'Recording file (EDF, EDF+, BDF, BDF+ or CSV), relative to the job file.' },
    rate_hz: { type: 'number', exclusiveMinimum: 0, title: 'CSV sampling rate, Hz', description: 'Only for a CSV recording without a time column: its sampling rate in Hz (ignored when the file has a time column or is EDF/BDF).' },
    condition: { type: 'string', minLength: 1, title: 'Condition', description: 'Condition name (e.g. current workstation, redesign); conditions are compared across workers.' },
    notes: { type: 'string', title: 'Notes', description: 'Free text, printed in the report.' },
    channels: { type: 'array', minItems: 1, items: channel, title: 'Channels', description: 'The EMG signals to analyse.' },
    segments,
    reference: spanOrList('Reference contraction', 'Overrides the worker\'s reference for this recording.'),
    rest: spanOrList('Rest (noise) recording', 'Overrides the worker\'s rest for this recording.'),
    mve_reference: spanOrList('MVE reference', 'Overrides the worker\'s mve_reference for this recording.'),
  },
};

const worker = {
  title: 'Worker',
  description: 'One worker (participant) with reference, rest and field recordings.',
  type: 'object',
  additionalProperties: false,
  required: ['id', 'recordings'],
  properties: {
    id: { type: ['string', 'integer'], title: 'Worker id', description: 'Pseudonymous id, unique in the job (e.g. W1). Do not use names.' },
    notes: { type: 'string', title: 'Notes', description: 'Free text, printed in the report.' },
    reference: spanOrList('Reference contraction', 'MVC span(s) for normalize: mve (the MVE is the highest moving RMS over reference_window_s across all spans), '
      + 'or submaximal span(s) for normalize: rve (the RVE is the mean envelope over the spans). Required for mve and rve.'),
    rest: spanOrList('Rest (noise) recording', 'Relaxed span(s) for the noise level. Required when noise_correction is true.'),
    mve_reference: spanOrList('MVE reference', 'With normalize: rve, MVC span(s) used only to convert a %MVE gap threshold to %RVE for this worker (k = RVE / MVE).'),
    recordings: { type: 'array', minItems: 1, items: recording, title: 'Recordings', description: 'Field recordings of this worker.' },
  },
};

const numberPair = { type: 'array', minItems: 2, maxItems: 2, items: { type: 'number', exclusiveMinimum: 0 } };
const increasing = (title: string, description: string, dflt: readonly number[]) => ({
  type: 'array', minItems: 2, items: { type: 'number', minimum: 0 }, title, description, default: dflt,
});

const settings = {
  title: 'Settings',
  description: 'Analysis settings; every key is optional and has a documented default (empty means all defaults).',
  type: ['object', 'null'],
  additionalProperties: false,
  properties: {
    band_hz: { ...numberPair, title: 'Band-pass, Hz', description: `Butterworth band-pass edges [low, high] in Hz; high must be below half of every channel's sampling rate. Default ${JSON.stringify(DEFAULTS.band_hz)}.`, default: DEFAULTS.band_hz },
    filter_order: { type: 'integer', minimum: 1, maximum: 8, title: 'Filter order', description: `Butterworth order N (scipy.signal.butter), applied zero-phase. Default ${DEFAULTS.filter_order}.`, default: DEFAULTS.filter_order },
    mains_hz: { enum: [50, 60, 'none'], title: 'Mains notch, Hz', description: `Mains frequency to notch (50 or 60 Hz) or none. Default ${DEFAULTS.mains_hz}.`, default: DEFAULTS.mains_hz },
    mains_harmonics: { type: 'integer', minimum: 1, maximum: 20, title: 'Mains multiples', description: `Number of mains multiples notched (1 = fundamental only). Default ${DEFAULTS.mains_harmonics}.`, default: DEFAULTS.mains_harmonics },
    mains_q: { type: 'number', exclusiveMinimum: 0, title: 'Notch Q', description: `Quality factor of each notch (scipy.signal.iirnotch Q). Default ${DEFAULTS.mains_q}.`, default: DEFAULTS.mains_q },
    rms_window_s: { type: 'number', exclusiveMinimum: 0, maximum: 60, title: 'RMS window, s', description: `Moving RMS window length in s. Default ${DEFAULTS.rms_window_s}.`, default: DEFAULTS.rms_window_s },
    envelope_rate_hz: { type: 'number', exclusiveMinimum: 0, maximum: 1000, title: 'Envelope rate, Hz', description: `Envelope values per second. Default ${DEFAULTS.envelope_rate_hz}.`, default: DEFAULTS.envelope_rate_hz },
    normalize: { enum: ['mve', 'rve', 'task-peak', 'none'], title: 'Normalization', description: `mve (%MVE), rve (%RVE), task-peak (% of the worker's highest envelope of that muscle), none (µV). Default ${DEFAULTS.normalize}.`, default: DEFAULTS.normalize },
    reference_window_s: { type: 'number', exclusiveMinimum: 0, maximum: 60, title: 'Reference window, s', description: `MVE and task peak: highest moving RMS over windows of this length, s. Default ${DEFAULTS.reference_window_s}.`, default: DEFAULTS.reference_window_s },
    noise_correction: { type: 'boolean', title: 'Noise correction', description: `Subtract the rest level in a power sense; needs rest spans. Default ${DEFAULTS.noise_correction}.`, default: DEFAULTS.noise_correction },
    noise_window_s: { type: 'number', exclusiveMinimum: 0, maximum: 60, title: 'Noise window, s', description: `Noise level = lowest moving RMS over windows of this length in the rest span(s), s. Default ${DEFAULTS.noise_window_s}.`, default: DEFAULTS.noise_window_s },
    gap_threshold_pct: { type: 'number', exclusiveMinimum: 0, title: 'Gap threshold', description: `Gap and rest threshold in the unit set by gap_threshold_unit (%MVE, %RVE, %task-peak, or µV with normalize none). Default ${DEFAULTS.gap_threshold_pct}.`, default: DEFAULTS.gap_threshold_pct },
    gap_threshold_unit: { enum: ['auto', 'mve', 'as-normalized'], title: 'Gap threshold unit', description: `mve: %MVE (converted per worker via mve_reference with normalize rve); as-normalized: the envelope's own unit; auto: mve when possible, else as-normalized. Default ${DEFAULTS.gap_threshold_unit}.`, default: DEFAULTS.gap_threshold_unit },
    gap_min_s: { type: 'number', minimum: 0, title: 'Shortest gap, s', description: `Shortest below-threshold run counted as a gap, s (inclusive). Default ${DEFAULTS.gap_min_s}.`, default: DEFAULTS.gap_min_s },
    gap_max_s: { type: ['number', 'null'], exclusiveMinimum: 0, title: 'Longest gap, s', description: 'Longest run still counted as one gap, s; null for no limit. Default null.', default: DEFAULTS.gap_max_s },
    rest_counts: { enum: ['all', 'gaps-only'], title: 'Rest counts', description: `all: every below-threshold sample counts as rest; gaps-only: only samples inside gaps. Default ${DEFAULTS.rest_counts}.`, default: DEFAULTS.rest_counts },
    sustained_min_s: { type: 'number', exclusiveMinimum: 0, title: 'Sustained activity, s', description: `Uninterrupted activity above the gap threshold at least this long counts as sustained, s. Default ${DEFAULTS.sustained_min_s}.`, default: DEFAULTS.sustained_min_s },
    percentiles: { type: 'array', minItems: 1, items: { type: 'number', minimum: 0, maximum: 100 }, title: 'APDF percentiles, %', description: `Percentiles of the normalized envelope reported. Default ${JSON.stringify(DEFAULTS.percentiles)}.`, default: DEFAULTS.percentiles },
    eva: {
      title: 'Exposure variation analysis',
      description: 'Class edges of the EVA matrix (empty means the defaults).',
      type: ['object', 'null'],
      additionalProperties: false,
      properties: {
        amplitude_edges: increasing('Amplitude edges', `Increasing amplitude class edges in the normalized unit; the last class is open above. Default ${JSON.stringify(DEFAULTS.eva.amplitude_edges)}.`, DEFAULTS.eva.amplitude_edges),
        duration_edges_s: increasing('Duration edges, s', `Increasing duration class edges in s; the last class is open above. Default ${JSON.stringify(DEFAULTS.eva.duration_edges_s)}.`, DEFAULTS.eva.duration_edges_s),
      },
    },
    trace_step_s: { type: 'number', exclusiveMinimum: 0, title: 'Trace step, s', description: `Step of the decimated envelope traces in the report, s. Default ${DEFAULTS.trace_step_s}.`, default: DEFAULTS.trace_step_s },
    fatigue: {
      title: 'Fatigue over the shift',
      description: 'Spectral epochs, amplitude and mean-frequency trends per block and task segment, and JASA categories (empty means the defaults).',
      type: ['object', 'null'],
      additionalProperties: false,
      properties: {
        enabled: { type: 'boolean', title: 'Enabled', description: `Run the fatigue analysis. Default ${DEFAULTS.fatigue.enabled}.`, default: DEFAULTS.fatigue.enabled },
        epoch_s: { type: 'number', minimum: 0.05, maximum: 10, title: 'Epoch, s', description: `Epoch length for RMS, MNF and MDF, s (0.5–1 s are quasi-stationary). Default ${DEFAULTS.fatigue.epoch_s}.`, default: DEFAULTS.fatigue.epoch_s },
        block_s: { type: 'number', exclusiveMinimum: 0, title: 'Block, s', description: `Length of the time blocks whose trends are fitted, s. Default ${DEFAULTS.fatigue.block_s}.`, default: DEFAULTS.fatigue.block_s },
        active_threshold_pct: { type: 'number', minimum: 0, title: 'Active threshold', description: `Epochs below this noise-corrected amplitude (normalized unit) are left out of the trends. Default ${DEFAULTS.fatigue.active_threshold_pct}.`, default: DEFAULTS.fatigue.active_threshold_pct },
        active_noise_factor: { type: 'number', minimum: 0, title: 'Active noise factor', description: `Epochs whose RMS is below this many times the noise RMS are left out. Default ${DEFAULTS.fatigue.active_noise_factor}.`, default: DEFAULTS.fatigue.active_noise_factor },
        band_hz: { anyOf: [numberPair, { type: 'null' }], title: 'MNF band, Hz', description: 'Band [low, high] of the mean and median frequency, Hz; null = the band-pass of the analysis. Default null.', default: DEFAULTS.fatigue.band_hz },
        min_epochs: { type: 'integer', minimum: 3, title: 'Fewest epochs', description: `Fewest active epochs for a trend. Default ${DEFAULTS.fatigue.min_epochs}.`, default: DEFAULTS.fatigue.min_epochs },
        series_step_s: { type: 'number', exclusiveMinimum: 0, title: 'Series step, s', description: `Step of the MNF-over-time series in the report, s. Default ${DEFAULTS.fatigue.series_step_s}.`, default: DEFAULTS.fatigue.series_step_s },
      },
    },
    quality: qualitySchema,
  },
};

/** JSON Schema (draft-07) of a shiftload job file. */
export const jobSchema = {
  $schema: 'http://json-schema.org/draft-07/schema#',
  $id: 'https://shiftload.invalid/schema/shiftload-job-1.json',
  title: 'shiftload job file',
  description: 'A whole-shift surface-EMG study: workers, their reference, rest and field recordings, task segments and analysis settings. '
    + 'Times in s, rates in Hz; paths relative to the job file.',
  type: 'object',
  additionalProperties: false,
  required: ['format', 'title', 'workers'],
  properties: {
    format: { const: JOB_FORMAT, title: 'Format', description: `Job file format and version; must be ${JOB_FORMAT}.` },
    title: { type: 'string', minLength: 1, title: 'Title', description: 'Study title, printed on the report.' },
    site: { type: 'string', title: 'Site', description: 'Workplace or site (free text, printed in the report).' },
    date: { type: 'string', title: 'Date', description: 'Date of the measurements (free text, e.g. 2024-05-13).' },
    analyst: { type: 'string', title: 'Analyst', description: 'Who ran the analysis (free text).' },
    notes: { type: 'string', title: 'Notes', description: 'Free text, printed in the report.' },
    settings,
    workers: { type: 'array', minItems: 1, items: worker, title: 'Workers', description: 'The workers (participants) of the study.' },
  },
} as const;
