// Streaming reader for CSV/TSV exports: a header row of channel names (optionally `name [unit]`),
// then one row per sample. Two passes over the bytes, each in blocks with bounded memory: the
// header phase validates every cell, counts rows and empty cells and finds the sampling rate (time
// column or option); `read()` parses the rows again into chunk buffers. Each pass has two row
// paths: rows of plain numbers (nearly every row of an export) are parsed straight from the bytes
// in one sweep (parseNumberRow, in tight loops outside the async loops); any other row — header,
// blank, empty/NaN/quoted/spaced cells, errors, rare number forms — goes through the general path
// (splitRow + parseDecimal), which decides alone on values and messages. Both give identical values.
// Conventions (common practice, no single source): delimiter ',' ';' or tab, detected from the
// header row; with ';' or tab a ',' in a number is a decimal comma (a '.' is accepted too); surrounding double quotes are
// removed from cells (quoted delimiters are not supported); blank lines are skipped.
import type { FileHandle } from 'node:fs/promises';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { InputError, UsageError } from '../errors.js';
import { inputMsg, ioMsg, msg } from '../messages.js';
import { lineBatches } from './line-batches.js';
import { IO_DEFAULTS, type OpenOptions } from './open-options.js';
import { parseDecimal } from './parse-decimal.js';
import { parseNumberRow } from './parse-number-row.js';
import type { ReadOptions, Recording, RecordingInfo, SignalChunk, SignalInfo } from './recording.js';

const TIME_NAMES = new Set(['time', 'time_s', 't']);
/** Steps kept to find the median time step (the rest are only checked against it). */
const MEDIAN_STEPS = 10001;

/** Layout found in the header row. */
interface CsvLayout {
  delimiter: number;
  decimalComma: boolean;
  /** Column of the time stamps, or -1. */
  timeColumn: number;
  /** Column index of each data signal. */
  columns: number[];
  names: string[];
  units: string[];
  ncols: number;
  headerLine: number;
}

/**
 * Open a CSV/TSV recording already opened as `fh` (the reader takes ownership and closes it).
 * SignalInfo.nan_count gives the number of empty (or "NaN") cells per signal, read as NaN;
 * physical_min/max are the smallest/largest finite values; digital limits are NaN.
 * @throws InputError naming file:line and column for a text cell, a ragged row, time stamps that
 *   do not increase or are uneven by more than 1 % of the median step
 */
export async function openCsv(file: string, fh: FileHandle, _size: number, options: OpenOptions = {}): Promise<Recording> {
  const blockBytes = options.chunk_bytes ?? IO_DEFAULTS.chunk_bytes;
  let layout: CsvLayout | null = null;
  let nan: Float64Array = new Float64Array(0);
  let mins: Float64Array = new Float64Array(0);
  let maxs: Float64Array = new Float64Array(0);
  const time = new TimeSteps(file);
  const st: RowState = { p: 0, line: 1, rows: 0, fill: 0 };
  let rate: number;
  try {
    if (options.rate_hz !== undefined && !(options.rate_hz > 0)) throw new UsageError(msg.badOption('rate', 'a rate in Hz > 0', String(options.rate_hz)));
    let vals = new Float64Array(0);
    let cols = new Int32Array(0);
    const tooLong = (limit: number): never => { throw new InputError(inputMsg.csvLineTooLong(file, st.line, limit), { file, where: `line ${st.line}` }); };
    for await (const b of lineBatches(fh, blockBytes, tooLong)) {
      const buf = b.buf;
      st.p = b.start;
      while (st.p < b.end) {
        // fast path: rows of plain numbers
        if (layout !== null && scanPlainRows(buf, b.end, layout, cols, vals, mins, maxs, layout.timeColumn >= 0 ? time : null, st)) break;
        // general path: one line, bytes [s, e) without \r\n
        const line = st.line++;
        const s = st.p;
        let e = buf.indexOf(0x0a, s);
        st.p = e + 1;
        if (e > s && buf[e - 1] === 0x0d) e--;
        if (isBlank(buf, s, e)) continue;
        if (layout === null) {
          layout = parseHeader(file, buf.toString('utf8', s, e), line, options.unit ?? IO_DEFAULTS.csv_unit);
          nan = new Float64Array(layout.columns.length);
          mins = new Float64Array(layout.columns.length).fill(Infinity);
          maxs = new Float64Array(layout.columns.length).fill(-Infinity);
          vals = new Float64Array(layout.ncols);
          cols = Int32Array.from(layout.columns);
          continue;
        }
        const t = scanRow(file, buf, s, e, line, layout, nan, mins, maxs);
        if (layout.timeColumn >= 0) {
          if (Number.isNaN(t)) throw new InputError(ioMsg.csvTimeMissing(file, line), { file, where: `line ${line}` });
          time.push(t, line);
        }
        st.rows++;
      }
    }
    const rows = st.rows;
    const lastLine = st.line - 1; // the last line of the file
    if (layout === null) throw new InputError(ioMsg.csvNoHeader(file), { file, where: 'line 1' });
    if (rows === 0) throw new InputError(ioMsg.csvNoData(file), { file, where: `line ${lastLine}` });
    if (layout.timeColumn >= 0 && rows >= 2) {
      const med = time.fixMedian();
      rate = snapRate(1 / med, (rows - 1) / (time.last - time.first));
      // steps like 1e308 (or 5e-324) overflow the rate or the duration
      if (!(Number.isFinite(rate) && rate > 0 && Number.isFinite(rows / rate))) throw new InputError(inputMsg.csvTimeRate(file, med), { file, where: 'time column' });
    } else if (options.rate_hz !== undefined) {
      rate = options.rate_hz;
    } else {
      throw new InputError(ioMsg.csvNoRate(file), { file });
    }
  } catch (e) {
    await fh.close();
    throw e;
  }
  const rows = st.rows;
  const L: CsvLayout = layout;
  const signals: SignalInfo[] = L.names.map((name, j) => ({
    index: j,
    label: name,
    unit: L.units[j],
    rate_hz: rate,
    physical_min: Number.isFinite(mins[j]) ? mins[j] : 0,
    physical_max: Number.isFinite(maxs[j]) ? maxs[j] : 0,
    digital_min: NaN,
    digital_max: NaN,
    prefilter: '',
    transducer: '',
    samples: rows,
    nan_count: nan[j],
  }));
  const info: RecordingInfo = {
    file,
    format: 'CSV',
    start: null,
    duration_s: rows / rate,
    signals,
    annotations: [],
    record_duration_s: null,
  };
  return {
    info,
    read: (ro: ReadOptions) => readRows(file, fh, L, info, blockBytes, ro),
    close: () => fh.close(),
  };
}

/**
 * Checks of the time column, row by row: time stamps strictly increasing, each step within
 * csv_time_tolerance of the median step. The median is taken over the first MEDIAN_STEPS steps
 * (checked once it is known), or over all steps of a shorter file.
 */
class TimeSteps {
  first = NaN;
  last = NaN;
  /** Median step, s; NaN until fixed. */
  median = NaN;
  private rows = 0;
  private readonly steps: number[] = [];
  private readonly lines: number[] = [];

  constructor(private readonly file: string) {}

  /** The time stamp `t` (s) of the next data row, on 1-based `line`. */
  push(t: number, line: number): void {
    if (this.rows++ === 0) this.first = t;
    else {
      const dt = t - this.last;
      if (!(dt > 0)) throw new InputError(ioMsg.csvTimeOrder(this.file, line, this.last, t), { file: this.file, where: `line ${line}` });
      if (Number.isNaN(this.median)) {
        this.steps.push(dt);
        this.lines.push(line);
        if (this.steps.length === MEDIAN_STEPS) this.fixMedian();
      } else this.check(line, dt);
    }
    this.last = t;
  }

  /** Fix the median from the steps so far (if not yet fixed) and check them; returns it. */
  fixMedian(): number {
    if (Number.isNaN(this.median)) {
      this.median = median(this.steps);
      for (let i = 0; i < this.steps.length; i++) this.check(this.lines[i], this.steps[i]);
    }
    return this.median;
  }

  private check(line: number, dt: number): void {
    const med = this.median;
    if (Math.abs(dt - med) > IO_DEFAULTS.csv_time_tolerance * med) throw new InputError(ioMsg.csvTimeUneven(this.file, line, dt, med), { file: this.file, where: `line ${line}` });
  }
}

/** 1/median step, replaced by the whole-file mean rate when they agree, and snapped to an integer within 1e-6. */
function snapRate(fromMedian: number, fromMean: number): number {
  let r = Math.abs(fromMean - fromMedian) <= 1e-3 * fromMedian ? fromMean : fromMedian;
  const near = Math.round(r);
  if (Math.abs(r - near) <= 1e-6 * r) r = near;
  return r;
}

function median(v: number[]): number {
  const s = v.slice().sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

function isBlank(buf: Buffer, s: number, e: number): boolean {
  for (let i = s; i < e; i++) if (buf[i] !== 0x20 && buf[i] !== 0x09) return false;
  return true;
}

function unquote(s: string): string {
  const t = s.trim();
  return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1).trim() : t;
}

function parseHeader(file: string, text: string, line: number, defaultUnit: string): CsvLayout {
  const count = (ch: string) => text.split(ch).length - 1;
  const tabs = count('\t');
  const semis = count(';');
  const commas = count(',');
  const delimiter = tabs > 0 && tabs >= semis && tabs >= commas ? '\t' : semis > 0 && semis >= commas ? ';' : ',';
  const cells = text.split(delimiter).map(unquote);
  let timeColumn = -1;
  const columns: number[] = [];
  const names: string[] = [];
  const units: string[] = [];
  cells.forEach((c, i) => {
    const m = /^(.*?)\s*\[([^\]]*)\]$/.exec(c);
    const name = m ? m[1] : c;
    const unit = m ? m[2].trim() : '';
    const isTime = timeColumn < 0 && ((m === null && TIME_NAMES.has(name.toLowerCase())) || (name.toLowerCase() === 'time' && unit === 's'));
    if (isTime) timeColumn = i;
    else {
      columns.push(i);
      names.push(name === '' ? `column ${i + 1}` : name);
      units.push(unit === '' ? defaultUnit : unit);
    }
  });
  if (columns.length === 0 || cells.every((c) => /^[+-]?[\d.,eE]+$/.test(c))) throw new InputError(ioMsg.csvNoHeader(file), { file, where: `line ${line}` });
  return { delimiter: delimiter.charCodeAt(0), decimalComma: delimiter !== ',', timeColumn, columns, names, units, ncols: cells.length, headerLine: line };
}

/** Cell boundaries of one row into `cs`/`ce`; returns the number of cells. */
function splitRow(buf: Buffer, s: number, e: number, delim: number, cs: Int32Array, ce: Int32Array): number {
  let n = 0;
  let a = s;
  for (let i = s; i <= e; i++) {
    if (i === e || buf[i] === delim) {
      if (n < cs.length) {
        let x = a;
        let y = i;
        while (x < y && (buf[x] === 0x20 || buf[x] === 0x09)) x++;
        while (y > x && (buf[y - 1] === 0x20 || buf[y - 1] === 0x09)) y--;
        if (y - x >= 2 && buf[x] === 0x22 && buf[y - 1] === 0x22) { x++; y--; }
        cs[n] = x;
        ce[n] = y;
      }
      n++;
      a = i + 1;
    }
  }
  return n;
}

/** True for a cell meaning "no value": empty, NaN, nan. */
function isMissing(buf: Buffer, a: number, b: number): boolean {
  if (a === b) return true;
  return b - a === 3 && (buf[a] | 0x20) === 0x6e && (buf[a + 1] | 0x20) === 0x61 && (buf[a + 2] | 0x20) === 0x6e;
}

let cellStart = new Int32Array(64);
let cellEnd = new Int32Array(64);

function ensureCells(n: number): void {
  if (cellStart.length < n + 1) {
    cellStart = new Int32Array(n + 1);
    cellEnd = new Int32Array(n + 1);
  }
}

/** Where a pass is: next byte, next line (1-based), data rows so far, values in the chunk buffers. */
interface RowState {
  p: number;
  line: number;
  rows: number;
  fill: number;
}

/**
 * Pass 1, fast path: consume rows of plain numbers from `st.p` (before `end`), tracking ranges and
 * time steps. Stops at the first row the general path must judge; returns true at `end`.
 */
function scanPlainRows(buf: Buffer, end: number, L: CsvLayout, cols: Int32Array, vals: Float64Array, mins: Float64Array, maxs: Float64Array, time: TimeSteps | null, st: RowState): boolean {
  const { delimiter, decimalComma, ncols, timeColumn } = L;
  const nc = cols.length;
  let p = st.p;
  while (p < end) {
    const q = parseNumberRow(buf, p, delimiter, decimalComma, ncols, vals);
    if (q < 0) break;
    for (let j = 0; j < nc; j++) {
      const v = vals[cols[j]];
      if (v < mins[j]) mins[j] = v;
      if (v > maxs[j]) maxs[j] = v;
    }
    if (time !== null) time.push(vals[timeColumn], st.line);
    st.line++;
    st.rows++;
    p = q;
  }
  st.p = p;
  return p >= end;
}

/**
 * Read pass, fast path: copy rows of plain numbers from `st.p` (before `end`) into `out[j][st.fill]`,
 * skipping data rows before `s0`, stopping before row `e0`, at a full chunk (`R` rows) or at the
 * first row the general path must read; returns true at `end`.
 */
function readPlainRows(buf: Buffer, end: number, L: CsvLayout, sel: Int32Array, vals: Float64Array, out: Float64Array[], R: number, s0: number, e0: number, st: RowState): boolean {
  const { delimiter, decimalComma, ncols } = L;
  const m = sel.length;
  let p = st.p;
  let fill = st.fill;
  let r = st.rows - 1; // index of the last data row read
  while (p < end && fill < R && r + 1 < e0) {
    const q = parseNumberRow(buf, p, delimiter, decimalComma, ncols, vals);
    if (q < 0) break;
    p = q;
    r++;
    st.line++;
    if (r < s0) continue;
    for (let j = 0; j < m; j++) out[j][fill] = vals[sel[j]];
    fill++;
  }
  st.p = p;
  st.fill = fill;
  st.rows = r + 1;
  return p >= end;
}

/** Pass 1: validate one row, count missing cells, track ranges; returns the time stamp (or NaN). */
function scanRow(file: string, buf: Buffer, s: number, e: number, line: number, L: CsvLayout, nan: Float64Array, mins: Float64Array, maxs: Float64Array): number {
  ensureCells(L.ncols);
  const n = splitRow(buf, s, e, L.delimiter, cellStart, cellEnd);
  if (n !== L.ncols) throw new InputError(ioMsg.csvRagged(file, line, n, L.ncols), { file, where: `line ${line}` });
  for (let j = 0; j < L.columns.length; j++) {
    const c = L.columns[j];
    const a = cellStart[c];
    const b = cellEnd[c];
    if (isMissing(buf, a, b)) { nan[j]++; continue; }
    const v = parseDecimal(buf, a, b, L.decimalComma);
    if (!Number.isFinite(v)) throw new InputError(ioMsg.csvNotNumber(file, line, L.names[j], buf.toString('utf8', a, b)), { file, where: `line ${line}` });
    if (v < mins[j]) mins[j] = v;
    if (v > maxs[j]) maxs[j] = v;
  }
  if (L.timeColumn < 0) return NaN;
  const a = cellStart[L.timeColumn];
  const b = cellEnd[L.timeColumn];
  if (isMissing(buf, a, b)) return NaN;
  const t = parseDecimal(buf, a, b, L.decimalComma);
  if (!Number.isFinite(t)) throw new InputError(ioMsg.csvNotNumber(file, line, 'time', buf.toString('utf8', a, b)), { file, where: `line ${line}` });
  return t;
}

async function* readRows(file: string, fh: FileHandle, L: CsvLayout, info: RecordingInfo, blockBytes: number, ro: ReadOptions): AsyncGenerator<SignalChunk> {
  const n = info.signals.length;
  const sel = ro.signals.map((i) => {
    if (!Number.isInteger(i) || i < 0 || i >= n) throw new InputError(ioMsg.unknownSignal(file, i, n), { file });
    return L.columns[i];
  });
  const m = sel.length;
  const rate = info.signals[0].rate_hz;
  const rows = info.signals[0].samples;
  const s0 = Math.max(0, Math.min(rows, secondsToSamples(ro.start_s ?? 0, rate)));
  const e0 = Math.max(0, Math.min(rows, secondsToSamples(ro.end_s ?? info.duration_s, rate)));
  if (e0 <= s0) return;
  const R = Math.max(1, Math.floor(blockBytes / (8 * Math.max(1, m))));
  const out = sel.map(() => new Float64Array(R));
  const zeros = new Int32Array(m);
  ensureCells(L.ncols);
  const vals = new Float64Array(L.ncols);
  const cols = Int32Array.from(sel);
  let header = true;
  let chunkRow = s0;
  let done = false;
  const st: RowState = { p: 0, line: 1, rows: 0, fill: 0 }; // rows: data rows passed so far
  const tooLong = (limit: number): never => { throw new InputError(inputMsg.csvLineTooLong(file, st.line, limit), { file, where: `line ${st.line}` }); };
  for await (const b of lineBatches(fh, blockBytes, tooLong)) {
    const buf = b.buf;
    st.p = b.start;
    while (st.p < b.end) {
      // fast path: rows of plain numbers (never the header: it has a non-numeric cell)
      const atEnd = !header && readPlainRows(buf, b.end, L, cols, vals, out, R, s0, e0, st);
      if (st.fill === R) {
        yield { start_s: chunkRow / rate, gap_before: false, data: out.map((o) => o.subarray(0, R)), clipped_low: zeros, clipped_high: zeros };
        chunkRow += R;
        st.fill = 0;
        continue;
      }
      if (st.rows >= e0) { done = true; break; }
      if (atEnd) break;
      // general path: one line, bytes [s, e) without \r\n
      st.line++;
      const s = st.p;
      let e = buf.indexOf(0x0a, s);
      st.p = e + 1;
      if (e > s && buf[e - 1] === 0x0d) e--;
      if (isBlank(buf, s, e)) continue;
      if (header) { header = false; continue; }
      const r = st.rows++;
      if (r < s0) continue;
      splitRow(buf, s, e, L.delimiter, cellStart, cellEnd);
      for (let j = 0; j < m; j++) {
        const a = cellStart[sel[j]];
        const z = cellEnd[sel[j]];
        out[j][st.fill] = isMissing(buf, a, z) ? NaN : parseDecimal(buf, a, z, L.decimalComma);
      }
      st.fill++;
    }
    if (done) break;
  }
  const fill = st.fill;
  if (fill > 0) yield { start_s: chunkRow / rate, gap_before: false, data: out.map((o) => o.subarray(0, fill)), clipped_low: zeros, clipped_high: zeros };
}
