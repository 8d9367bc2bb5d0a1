// Streaming EDF+C writer (16-bit; BDF+C 24-bit when the path ends in .bdf), written through
// AtomicFile so the target appears only when complete. Physical→digital as EDFlib does it:
// digital = round(physical / bitvalue − offset), clipped to the digital limits.
// Sources: Kemp et al. 1992 (EDF); Kemp & Olivan 2003 (EDF+ header subfields, TALs).
import { endianness } from 'node:os';
import { extname } from 'node:path';
import { UsageError } from '../errors.js';
import { ioMsg } from '../messages.js';
import type { Annotation } from './recording.js';
import { AtomicFile } from './write-atomic.js';

export interface EdfWriterSignal {
  label: string;
  unit: string;
  /** Sampling rate in Hz; rate · record duration must be a whole number. */
  rate_hz: number;
  physical_min: number;
  physical_max: number;
  /** @default -32768 (EDF) / -8388608 (BDF) */
  digital_min?: number;
  /** @default 32767 (EDF) / 8388607 (BDF) */
  digital_max?: number;
  prefilter?: string;
  transducer?: string;
}

export interface EdfWriterOptions {
  /**
   * Data record duration in s. @default the longest duration ≤ 1 s that makes every
   * rate · duration a whole number (see chooseDuration)
   */
  record_duration_s?: number;
  /** Start date-time 'YYYY-MM-DDTHH:MM:SS'. @default unknown (01.01.85 00.00.00, "Startdate X") */
  start?: string;
  /** Patient name subfield (spaces become '_'); other patient subfields are 'X'. */
  patient?: string;
  /** Free text after the EDF+ recording subfields (spaces become '_'). */
  recording?: string;
  /** All annotations, known up front (onsets in s from the start). */
  annotations?: Annotation[];
  /**
   * Fraction of a second (0 ≤ x < 1) by which the data start after `start`; written into the
   * time-keeping TALs (EDF+ subsecond start), so readers report onsets relative to the data.
   * @default 0
   */
  start_subsecond_s?: number;
}

const MONTHS = ['JAN', 'FEB', 'MAR', 'APR', 'MAY', 'JUN', 'JUL', 'AUG', 'SEP', 'OCT', 'NOV', 'DEC'];
/** Bytes reserved for the time-keeping TAL of each record ("+" + up to 18 digits + 0x14 0x14 0x00). */
const TIMEKEEPING_BYTES = 24;
const OUT_BUFFER_BYTES = 1 << 20;
/** Largest data record the writer accepts, bytes (keeps the per-signal queues allocatable). */
const MAX_RECORD_BYTES = 1 << 26;

/**
 * Write an EDF+C (or BDF+C) file from streamed physical values.
 *
 * `write()` takes any number of samples per signal per call; overall, the lengths must stay
 * proportional to the rates (at most a few records apart) because whole records are assembled from
 * what every signal has delivered. `close()` pads the last partial record of each signal by
 * repeating that signal's last value (0 if it never received one), writes the record count into the
 * header and renames the file into place; `abort()` removes the temporary file.
 * Annotations whose onset lies beyond the data are kept: records repeating the last values are
 * appended to hold them. NaN is written as the digital value of physical 0 (clipped); values outside the physical range
 * are clipped to the digital limits, as EDFlib does. Labels and other header texts are cut to their
 * field widths.
 *
 * @throws UsageError for a rate that does not fit the record duration, a physical range that does
 *   not fit an 8-character field, or non-ASCII header text
 * @example
 *   const w = new EdfWriter('out.edf', [{ label: 'EMG R', unit: 'uV', rate_hz: 1000, physical_min: -5000, physical_max: 5000 }]);
 *   w.write([samples]); w.close();
 */
export class EdfWriter {
  private readonly file: AtomicFile;
  private readonly bps: 2 | 3;
  private readonly spr: number[];
  private readonly bitvalue: Float64Array;
  private readonly offset: Float64Array;
  private readonly dmin: Int32Array;
  private readonly dmax: Int32Array;
  /** Per-signal queue of digital values not yet written. */
  private readonly queue: Int32Array[];
  private readonly qLen: Int32Array;
  private readonly lastDigital: Int32Array;
  private readonly annBytes: number;
  private readonly recordSize: number;
  private readonly out: Buffer;
  /** Little-endian 16-bit view of `out` (null on big-endian hosts). */
  private readonly out16: Int16Array | null;
  private outLen = 0;
  private records = 0;
  private readonly pending: { record: number; bytes: Buffer }[];
  private pendingAt = 0;
  private closed = false;
  private readonly subsecond: number;
  readonly record_duration_s: number;

  constructor(path: string, signals: EdfWriterSignal[], options: EdfWriterOptions = {}) {
    const bdf = extname(path).toLowerCase() === '.bdf';
    this.bps = bdf ? 3 : 2;
    const [dLo, dHi] = bdf ? [-8388608, 8388607] : [-32768, 32767];
    if (signals.length === 0) throw new UsageError(ioMsg.writerNoSignals());
    const d = options.record_duration_s ?? chooseDuration(signals.map((s) => s.rate_hz));
    this.subsecond = options.start_subsecond_s ?? 0;
    if (!(this.subsecond >= 0 && this.subsecond < 1)) throw new UsageError(ioMsg.writerSubsecond(this.subsecond));
    this.record_duration_s = d;
    this.spr = signals.map((s) => Math.round(s.rate_hz * d));
    signals.forEach((s, i) => {
      if (!(s.rate_hz > 0) || Math.abs(this.spr[i] - s.rate_hz * d) > 1e-9 * this.spr[i] || this.spr[i] < 1) {
        throw new UsageError(ioMsg.writerRate(signals.map((x) => x.rate_hz).join(', '), d));
      }
    });
    const n = signals.length;
    this.bitvalue = new Float64Array(n);
    this.offset = new Float64Array(n);
    this.dmin = new Int32Array(n);
    this.dmax = new Int32Array(n);
    const pminText: string[] = [];
    const pmaxText: string[] = [];
    signals.forEach((s, i) => {
      if (!(s.physical_min < s.physical_max)) throw new UsageError(ioMsg.writerPhysRange(s.label, s.physical_min, s.physical_max));
      pminText.push(formatEdfNumber(s.physical_min, 'down'));
      pmaxText.push(formatEdfNumber(s.physical_max, 'up'));
      const pmin = Number(pminText[i]);
      const pmax = Number(pmaxText[i]);
      const dmin = s.digital_min ?? dLo;
      const dmax = s.digital_max ?? dHi;
      if (!(Number.isInteger(dmin) && Number.isInteger(dmax) && dLo <= dmin && dmin < dmax && dmax <= dHi)) {
        throw new UsageError(ioMsg.writerDigital(s.label, dmin, dmax, dLo, dHi));
      }
      this.dmin[i] = dmin;
      this.dmax[i] = dmax;
      this.bitvalue[i] = (pmax - pmin) / (dmax - dmin);
      this.offset[i] = pmax / this.bitvalue[i] - dmax;
    });

    // Annotations: each goes into the record holding its onset (or a later one when that record is
    // full); the annotation signal is sized for the largest per-record need.
    const tals = (options.annotations ?? []).slice().sort((a, b) => a.onset_s - b.onset_s)
      .map((a) => ({ record: Math.max(0, Math.floor(a.onset_s / d + 1e-9)), bytes: talBytes(a, this.subsecond) }));
    const perRecord = new Map<number, number>();
    let largest = 0;
    for (const t of tals) {
      perRecord.set(t.record, (perRecord.get(t.record) ?? 0) + t.bytes.length);
      largest = Math.max(largest, t.bytes.length);
    }
    const need = TIMEKEEPING_BYTES + Math.max(largest, ...perRecord.values(), 0);
    this.annBytes = Math.ceil(need / this.bps) * this.bps;
    this.pending = tals;
    this.recordSize = this.spr.reduce((a, b) => a + b, 0) * this.bps + this.annBytes;
    if (this.recordSize > MAX_RECORD_BYTES) throw new UsageError(ioMsg.writerRecordSize(this.recordSize, MAX_RECORD_BYTES));

    this.queue = this.spr.map((k) => new Int32Array(Math.max(4 * k, 1024)));
    this.qLen = new Int32Array(n);
    this.lastDigital = new Int32Array(n);
    for (let i = 0; i < n; i++) this.lastDigital[i] = clampRound(-this.offset[i], this.dmin[i], this.dmax[i]);
    this.out = Buffer.alloc(Math.max(OUT_BUFFER_BYTES, this.recordSize));
    this.out16 = endianness() === 'LE' && this.out.byteOffset % 2 === 0 ? new Int16Array(this.out.buffer, this.out.byteOffset, this.out.length >> 1) : null;

    const header = buildHeader({
      bdf, signals, spr: this.spr, annSamples: this.annBytes / this.bps, duration: d, pminText, pmaxText,
      dmin: this.dmin, dmax: this.dmax, options,
    });
    this.file = new AtomicFile(path);
    try {
      this.file.write(header);
    } catch (e) {
      this.file.abort();
      throw e;
    }
  }

  /** Append physical values, one array per signal (any lengths). Inputs are not modified. */
  write(data: Float64Array[]): void {
    if (this.closed) throw new Error('EdfWriter: write after close/abort');
    if (data.length !== this.spr.length) throw new Error(`EdfWriter.write: expected ${this.spr.length} arrays, got ${data.length}`);
    for (let i = 0; i < data.length; i++) this.enqueue(i, data[i]);
    this.flushRecords(false);
  }

  /** Pad the last partial record, write the record count, and move the file into place. */
  close(): void {
    if (this.closed) return;
    try {
      this.flushRecords(true);
      while (this.pendingAt < this.pending.length) this.emitRecord(true);
      this.flushOut();
      const count = Buffer.from(String(this.records).padEnd(8, ' '), 'latin1');
      this.file.writeAt(count, 236);
      this.file.commit();
    } catch (e) {
      this.file.abort();
      throw e;
    } finally {
      this.closed = true;
    }
  }

  /** Give up: remove the temporary file; the target is left as it was. */
  abort(): void {
    this.closed = true;
    this.file.abort();
  }

  private enqueue(i: number, x: Float64Array): void {
    let q = this.queue[i];
    const len = this.qLen[i];
    if (len + x.length > q.length) {
      const grown = new Int32Array(Math.max(q.length * 2, len + x.length));
      grown.set(q.subarray(0, len));
      this.queue[i] = grown;
      q = grown;
    }
    const bv = this.bitvalue[i];
    const off = this.offset[i];
    const lo = this.dmin[i];
    const hi = this.dmax[i];
    for (let k = 0; k < x.length; k++) {
      const v = x[k];
      const y = v === v ? v / bv - off : -off;
      q[len + k] = clampRound(y, lo, hi);
    }
    this.qLen[i] = len + x.length;
    if (x.length > 0) this.lastDigital[i] = q[len + x.length - 1];
  }

  private flushRecords(final: boolean): void {
    const n = this.spr.length;
    let full = Infinity;
    let any = false;
    for (let i = 0; i < n; i++) {
      full = Math.min(full, Math.floor(this.qLen[i] / this.spr[i]));
      if (this.qLen[i] > 0) any = true;
    }
    for (let r = 0; r < full; r++) this.emitRecord(false, r);
    // drop the consumed samples from the queues
    for (let i = 0; i < n; i++) {
      const used = full * this.spr[i];
      if (used > 0) {
        this.queue[i].copyWithin(0, used, this.qLen[i]);
        this.qLen[i] -= used;
      }
    }
    if (final && any) {
      let left = false;
      for (let i = 0; i < n; i++) if (this.qLen[i] > 0) left = true;
      if (left) {
        for (let i = 0; i < n; i++) {
          const q = this.queue[i];
          for (let k = this.qLen[i]; k < this.spr[i]; k++) q[k] = this.lastDigital[i];
          this.qLen[i] = this.spr[i];
        }
        this.emitRecord(false, 0);
        this.qLen.fill(0);
      }
    }
  }

  /** Write one record from the queues (record `r` of the queued ones) or a padding record. */
  private emitRecord(padding: boolean, r = 0): void {
    if (this.outLen + this.recordSize > this.out.length) this.flushOut();
    const out = this.out;
    let p = this.outLen;
    for (let i = 0; i < this.spr.length; i++) {
      const k = this.spr[i];
      const q = this.queue[i];
      const base = r * k;
      const last = this.lastDigital[i];
      if (this.bps === 2 && this.out16 !== null) {
        const o16 = this.out16;
        const i0 = p >> 1;
        if (padding) o16.fill(last, i0, i0 + k);
        else for (let s = 0; s < k; s++) o16[i0 + s] = q[base + s];
        p += 2 * k;
      } else if (this.bps === 2) {
        for (let s = 0; s < k; s++) {
          const v = padding ? last : q[base + s];
          out[p] = v & 0xff;
          out[p + 1] = (v >> 8) & 0xff;
          p += 2;
        }
      } else {
        for (let s = 0; s < k; s++) {
          const v = padding ? last : q[base + s];
          out[p] = v & 0xff;
          out[p + 1] = (v >> 8) & 0xff;
          out[p + 2] = (v >> 16) & 0xff;
          p += 3;
        }
      }
    }
    // annotation signal: time-keeping TAL, then the annotations due in this record that fit
    const annEnd = p + this.annBytes;
    const tk = Buffer.from(`+${formatSeconds(this.subsecond + this.records * this.record_duration_s)}\x14\x14\x00`, 'latin1');
    tk.copy(out, p);
    p += tk.length;
    while (this.pendingAt < this.pending.length) {
      const t = this.pending[this.pendingAt];
      if (!padding && t.record > this.records) break;
      if (p + t.bytes.length > annEnd) break;
      t.bytes.copy(out, p);
      p += t.bytes.length;
      this.pendingAt++;
    }
    out.fill(0, p, annEnd);
    this.outLen = annEnd;
    this.records++;
  }

  private flushOut(): void {
    if (this.outLen === 0) return;
    this.file.write(this.out.subarray(0, this.outLen));
    this.outLen = 0;
  }
}

/** Round half away from zero (as EDFlib) and clip to [lo, hi]. */
function clampRound(y: number, lo: number, hi: number): number {
  const r = y < 0 ? Math.ceil(y - 0.5) : Math.floor(y + 0.5);
  return r < lo ? lo : r > hi ? hi : r;
}

/**
 * Default record duration: the longest duration ≤ 1 s that makes every rate · duration a whole
 * number (1 s for integer rates). The shortest such duration is d0 = lcm(q_i) / gcd(p_i) for rates
 * p_i/q_i; the result is the largest multiple of d0 not above 1 s that has at most 6 decimals (so
 * it is exact in the header), or d0 itself when d0 > 1 s.
 * @throws UsageError for a rate that is not a ratio of integers up to 10^6
 * @example chooseDuration([2000, 500]) // 1 ; chooseDuration([512.5]) // 0.8
 */
export function chooseDuration(rates: number[]): number {
  let num = 0; // gcd of the numerators
  let den = 1; // lcm of the denominators
  for (const r of rates) {
    const f = r > 0 ? toFraction(r) : null;
    if (f === null) throw new UsageError(ioMsg.writerRate(rates.join(', '), 1));
    num = gcd(num, f[0]);
    den = (den / gcd(den, f[1])) * f[1];
  }
  const d0 = den / num;
  // Prefer a duration with few decimals (exact in the 8-character header field).
  for (let k = Math.floor(num / den + 1e-9); k >= 1; k--) {
    const d = (k * den) / num;
    if (Math.abs(d * 1e6 - Math.round(d * 1e6)) < 1e-6) return Math.round(d * 1e6) / 1e6;
  }
  if (d0 > 1 && Math.abs(d0 * 1e6 - Math.round(d0 * 1e6)) < 1e-6) return Math.round(d0 * 1e6) / 1e6;
  throw new UsageError(ioMsg.writerRate(rates.join(', '), d0));
}

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/** [p, q] with p/q = x within 1e-9 relative and q ≤ 10^6 (continued fractions), or null. */
function toFraction(x: number): [number, number] | null {
  let h0 = 1, h1 = 0, k0 = 0, k1 = 1;
  let y = x;
  for (let it = 0; it < 40; it++) {
    const a = Math.floor(y);
    [h0, h1] = [a * h0 + h1, h0];
    [k0, k1] = [a * k0 + k1, k0];
    if (k0 > 1e6) return null;
    if (Math.abs(h0 / k0 - x) <= 1e-9 * x) return [h0, k0];
    y = 1 / (y - a);
    if (!Number.isFinite(y)) break;
  }
  return Math.abs(h0 / k0 - x) <= 1e-9 * x ? [h0, k0] : null;
}

/**
 * Format a number for an 8-character EDF header field, rounding outward (`down` for a minimum,
 * `up` for a maximum) when digits must be dropped, so the physical range never shrinks.
 * @throws UsageError when even the integer part does not fit
 */
export function formatEdfNumber(x: number, direction: 'up' | 'down'): string {
  if (Number.isInteger(x) && String(x).length <= 8) return String(x);
  for (let dec = 7; dec >= 0; dec--) {
    const f = 10 ** dec;
    const scaled = x * f;
    // snap float noise (e.g. 0.1·10) before rounding outward
    const near = Math.round(scaled);
    const v = Math.abs(scaled - near) < 1e-9 * Math.max(1, Math.abs(scaled)) ? near : direction === 'up' ? Math.ceil(scaled) : Math.floor(scaled);
    let s = (v / f).toFixed(dec);
    if (s.includes('.')) s = s.replace(/0+$/, '').replace(/\.$/, '');
    if (s === '-0') s = '0';
    if (s.length <= 8) return s;
  }
  throw new UsageError(ioMsg.writerNumber(direction === 'up' ? 'physical maximum' : 'physical minimum', x));
}

/** Seconds as a plain decimal (no exponent), at most 7 decimals, trailing zeros removed. */
function formatSeconds(t: number): string {
  let s = t.toFixed(7);
  if (s.includes('.')) s = s.replace(/0+$/, '').replace(/\.$/, '');
  return s === '-0' ? '0' : s;
}

/** One annotation as a TAL: +onset[\x15duration]\x14text\x14\x00 (text UTF-8; 0x00/0x14/0x15 replaced). */
function talBytes(a: Annotation, shift: number): Buffer {
  const t = a.onset_s + shift;
  const onset = t < 0 ? `-${formatSeconds(-t)}` : `+${formatSeconds(t)}`;
  const dur = a.duration_s === null || a.duration_s === undefined ? '' : `\x15${formatSeconds(a.duration_s)}`;
  const text = a.text.replace(/[\x00\x14\x15]/g, ' ');
  return Buffer.concat([Buffer.from(`${onset}${dur}\x14`, 'latin1'), Buffer.from(text, 'utf8'), Buffer.from('\x14\x00', 'latin1')]);
}

/**
 * Space-padded ASCII header field. Header texts must be printable ASCII: 'µ'/'μ' become 'u' (so
 * "µV" is written "uV") and any other character outside 0x20–0x7E becomes '_'. Cut to the width.
 */
function field(text: string, width: number): string {
  const t = text.replace(/[µμ]/g, 'u').replace(/[^\x20-\x7e]/g, '_');
  return t.length > width ? t.slice(0, width) : t.padEnd(width, ' ');
}

function subfield(text: string | undefined): string {
  const t = (text ?? '').trim().replace(/\s+/g, '_');
  return t === '' ? 'X' : t;
}

function buildHeader(p: {
  bdf: boolean; signals: EdfWriterSignal[]; spr: number[]; annSamples: number; duration: number;
  pminText: string[]; pmaxText: string[]; dmin: Int32Array; dmax: Int32Array; options: EdfWriterOptions;
}): Buffer {
  const ns = p.signals.length + 1;
  let date = '01.01.85';
  let time = '00.00.00';
  let startdate = 'X';
  if (p.options.start !== undefined) {
    const m = /^(\d{4})-(\d\d)-(\d\d)T(\d\d):(\d\d):(\d\d)$/.exec(p.options.start);
    if (!m) throw new UsageError(ioMsg.writerStart(p.options.start));
    date = `${m[3]}.${m[2]}.${m[1].slice(2)}`;
    time = `${m[4]}.${m[5]}.${m[6]}`;
    startdate = `${m[3]}-${MONTHS[Number(m[2]) - 1]}-${m[1]}`;
  }
  const patient = `X X X ${subfield(p.options.patient)}`;
  const recording = `Startdate ${startdate} X X X${p.options.recording ? ' ' + subfield(p.options.recording) : ''}`;
  const recordDuration = formatSeconds(p.duration);
  if (recordDuration.length > 8) throw new UsageError(ioMsg.writerNumber('record duration', p.duration));
  const annLabel = p.bdf ? 'BDF Annotations' : 'EDF Annotations';
  const [aLo, aHi] = p.bdf ? ['-8388608', '8388607'] : ['-32768', '32767'];
  let h = '';
  h += p.bdf ? ' BIOSEMI' : '0       '; // BDF: first byte replaced by 0xFF below
  h += field(patient, 80);
  h += field(recording, 80);
  h += date + time;
  h += field(String(256 * (ns + 1)), 8);
  h += field(p.bdf ? 'BDF+C' : 'EDF+C', 44);
  h += field('-1', 8);
  h += field(recordDuration, 8);
  h += field(String(ns), 4);
  const all = [...p.signals.map((s, i) => ({
    label: s.label, transducer: s.transducer ?? '', unit: s.unit, pmin: p.pminText[i], pmax: p.pmaxText[i],
    dmin: String(p.dmin[i]), dmax: String(p.dmax[i]), prefilter: s.prefilter ?? '', spr: String(p.spr[i]),
  })), { label: annLabel, transducer: '', unit: '', pmin: '-1', pmax: '1', dmin: aLo, dmax: aHi, prefilter: '', spr: String(p.annSamples) }];
  for (const s of all) h += field(s.label, 16);
  for (const s of all) h += field(s.transducer, 80);
  for (const s of all) h += field(s.unit, 8);
  for (const s of all) h += field(s.pmin, 8);
  for (const s of all) h += field(s.pmax, 8);
  for (const s of all) h += field(s.dmin, 8);
  for (const s of all) h += field(s.dmax, 8);
  for (const s of all) h += field(s.prefilter, 80);
  for (const s of all) h += field(s.spr, 8);
  for (let i = 0; i < all.length; i++) h += ' '.repeat(32);
  const buf = Buffer.from(h, 'latin1');
  if (p.bdf) buf[0] = 0xff;
  return buf;
}
