// Streaming reader for EDF, EDF+ (C and D), BDF and BDF+. The header phase parses the header and
// makes one pass over the annotation signal bytes only (annotations and EDF+D record times); data
// is then read in groups of whole records into one reused buffer and converted in typed-array loops.
// Scaling as EDFlib: physical = bitvalue · (offset + digital) (edflib.h, EDFlib 1.23).
import { readSync } from 'node:fs';
import type { FileHandle } from 'node:fs/promises';
import { endianness } from 'node:os';
import { secondsToSamples } from '../dsp/seconds-to-samples.js';
import { InputError } from '../errors.js';
import { ioMsg } from '../messages.js';
import { type EdfHeader, type EdfSignalHeader, readEdfHeader } from './edf-header.js';
import { IO_DEFAULTS, type OpenOptions } from './open-options.js';
import { convert16Kernel } from './convert16-kernel.js';
import { cachedScan, rememberScan, scanKey, settled, type EdfScan } from './edf-scan-cache.js';
import { parseTals } from './parse-tals.js';
import type { Annotation, ReadOptions, Recording, RecordingFormat, RecordingInfo, SignalChunk, SignalInfo } from './recording.js';

const LITTLE_ENDIAN = endianness() === 'LE';

/** An open EDF-family recording; `header` gives the raw and parsed header for format tools and tests. */
export interface EdfRecording extends Recording {
  readonly header: EdfHeader;
}

/**
 * Open an EDF/EDF+/BDF/BDF+ file already opened as `fh` (the reader takes ownership and closes it).
 * @throws InputError naming the file and the field/byte for every header or annotation defect
 */
export async function openEdf(file: string, fh: FileHandle, fileSize: number, options: OpenOptions = {}): Promise<EdfRecording> {
  let header: EdfHeader;
  let scan: EdfScan;
  try {
    header = await readEdfHeader(fh, file, fileSize);
    // one annotation pass per file and process (edf-scan-cache.ts); an unchanged file is not scanned again
    const st = await fh.stat();
    const key = scanKey(st);
    const known = settled(st.mtimeMs) ? cachedScan(key) : null;
    if (known !== null) scan = known;
    else {
      scan = await scanAnnotations(file, fh, header, options.chunk_bytes ?? IO_DEFAULTS.chunk_bytes);
      if (settled(st.mtimeMs)) rememberScan(key, scan);
    }
  } catch (e) {
    await fh.close();
    throw e;
  }
  const data = header.signals.filter((s) => !s.is_annotation);
  const dur = header.record_duration_s;
  const signals: SignalInfo[] = data.map((s, index) => ({
    index,
    label: s.label,
    unit: s.unit,
    rate_hz: s.samples_per_record / dur,
    physical_min: s.physical_min,
    physical_max: s.physical_max,
    digital_min: s.digital_min,
    digital_max: s.digital_max,
    prefilter: s.prefilter,
    transducer: s.transducer,
    samples: s.samples_per_record * header.records,
  }));
  const format = (header.plus === null ? header.kind : `${header.kind}+${header.plus}`) as RecordingFormat;
  const info: RecordingInfo = {
    file,
    format,
    start: header.start,
    ...(scan.subsecond !== 0 ? { start_subsecond_s: scan.subsecond } : {}),
    duration_s: header.records * dur,
    ...(scan.recordStarts !== null ? { end_s: scan.recordStarts[header.records - 1] + dur } : {}),
    signals,
    annotations: scan.annotations,
    record_duration_s: dur,
  };
  const chunkBytes = options.chunk_bytes ?? IO_DEFAULTS.chunk_bytes;
  return {
    info,
    header,
    read: (ro: ReadOptions) => readRecords(file, fh, header, info, data, scan.recordStarts, chunkBytes, ro),
    close: () => fh.close(),
  };
}

/** One pass over the annotation bytes: all annotations, and the record start times for EDF+D. */
async function scanAnnotations(file: string, fh: FileHandle, h: EdfHeader, chunkBytes: number): Promise<EdfScan> {
  const annotations: Annotation[] = [];
  const ann = h.signals.filter((s) => s.is_annotation);
  if (ann.length === 0) return { annotations, recordStarts: null, subsecond: 0 };
  const bps = h.bytes_per_sample;
  const aLo = ann[0].offset_in_record;
  const last = ann[ann.length - 1];
  const aHi = last.offset_in_record + last.samples_per_record * bps;
  // Record start times are kept only for EDF+D (8 bytes per record); EDF+C is checked on the fly.
  const recordStarts = h.plus === 'D' ? new Float64Array(h.records) : null;
  let t0 = NaN;
  const tol = IO_DEFAULTS.continuous_tolerance_s;
  // Annotation bytes are usually a small tail of each record: read only them, one read per record,
  // unless records are small enough that reading whole groups of records is cheaper.
  const perRecord = h.record_size > 16384 && (aHi - aLo) * 8 < h.record_size;
  const span = perRecord ? aHi - aLo : h.record_size;
  const group = perRecord ? 1 : Math.max(1, Math.floor(chunkBytes / h.record_size));
  const buf = Buffer.alloc(span * group);
  for (let r0 = 0; r0 < h.records; r0 += group) {
    const n = Math.min(group, h.records - r0);
    const pos = h.header_bytes + r0 * h.record_size + (perRecord ? aLo : 0);
    await readExactly(fh, buf, perRecord ? span : n * h.record_size, pos);
    for (let k = 0; k < n; k++) {
      const r = r0 + k;
      const base = perRecord ? -aLo : k * h.record_size;
      for (let a = 0; a < ann.length; a++) {
        const s = ann[a];
        const st = base + s.offset_in_record;
        const en = st + s.samples_per_record * bps;
        const fileOff = h.header_bytes + r * h.record_size + s.offset_in_record;
        const t = parseTals(file, r, buf, st, en, fileOff, annotations, a === 0);
        if (a !== 0) continue;
        if (r === 0) t0 = t;
        if (recordStarts !== null) recordStarts[r] = t;
        else if (Math.abs(t - (t0 + r * h.record_duration_s)) > tol) {
          // A continuous file whose records jump would give wrong times: refuse it, as EDFlib does.
          throw new InputError(ioMsg.notContinuous(file, r, fileOff, t, t0 + r * h.record_duration_s), { file });
        }
      }
    }
  }
  // Onsets and record times relative to the file start (the first record's time-keeping TAL).
  if (t0 !== 0) {
    for (const x of annotations) x.onset_s -= t0;
    if (recordStarts !== null) for (let r = 0; r < recordStarts.length; r++) recordStarts[r] -= t0;
  }
  return { annotations, recordStarts, subsecond: t0 };
}

/**
 * Read exactly `length` bytes at `position`. Synchronously on the file descriptor: the data
 * comes from the page cache in a fraction of a millisecond per MiB, and a thread-pool round trip
 * per chunk only left the analysis waiting (on two cores, for tenths of a second per hour read).
 */
async function readExactly(fh: FileHandle, buf: Buffer, length: number, position: number): Promise<void> {
  let got = 0;
  while (got < length) {
    const bytesRead = readSync(fh.fd, buf, got, length - got, position + got);
    if (bytesRead === 0) throw new Error(`unexpected end of file at byte ${position + got}`);
    got += bytesRead;
  }
}

async function* readRecords(
  file: string, fh: FileHandle, h: EdfHeader, info: RecordingInfo, data: EdfSignalHeader[],
  recordStarts: Float64Array | null, chunkBytes: number, ro: ReadOptions,
): AsyncGenerator<SignalChunk> {
  const sel = ro.signals.map((i) => {
    if (!Number.isInteger(i) || i < 0 || i >= data.length) throw new InputError(ioMsg.unknownSignal(file, i, data.length), { file });
    return data[i];
  });
  const m = sel.length;
  const dur = h.record_duration_s;
  const startS = ro.start_s ?? 0;
  // EDF+D: the default end is the end of the last record by its own clock time
  const endS = ro.end_s ?? info.end_s ?? info.duration_s;
  const digital = ro.digital === true;
  // integers times a finite scale plus a finite offset are never NaN
  const nanFree = digital || sel.every((s) => Number.isFinite(s.bitvalue) && Number.isFinite(s.offset));
  const spr = sel.map((s) => s.samples_per_record);
  const rate = spr.map((n) => n / dur);
  const K = Math.max(1, Math.floor(chunkBytes / h.record_size));
  // 16-bit physical values: the SIMD kernel, with the read buffer and the outputs in its memory
  const kernel = h.bytes_per_sample === 2 && LITTLE_ENDIAN && !digital
    ? convert16Kernel(K * h.record_size + spr.reduce((a, n) => a + 8 * n * K + 16, 16)) : null;
  const buf = kernel ? kernel.bytes(K * h.record_size) : Buffer.alloc(K * h.record_size);
  const i16 = h.bytes_per_sample === 2 && LITTLE_ENDIAN && buf.byteOffset % 2 === 0
    ? new Int16Array(buf.buffer, buf.byteOffset, buf.length >> 1) : null;
  const dv = new DataView(buf.buffer, buf.byteOffset, buf.length);
  const out = spr.map((n) => (kernel ? kernel.array(n * K) : new Float64Array(n * K)));
  const counts = new Int32Array(2);
  const clippedLow = new Int32Array(m);
  const clippedHigh = new Int32Array(m);
  const lo = new Int32Array(m);
  const hi = new Int32Array(m);
  const fill = new Int32Array(m);

  // Global sample span per signal (EDF/EDF+C); EDF+D trims per record by its own start time.
  const s0 = rate.map((r, j) => clamp(secondsToSamples(startS, r), 0, spr[j] * h.records));
  const e0 = rate.map((r, j) => clamp(secondsToSamples(endS, r), 0, spr[j] * h.records));
  const recordSpan = (r: number): boolean => {
    let any = false;
    for (let j = 0; j < m; j++) {
      if (recordStarts === null) {
        lo[j] = clamp(s0[j] - r * spr[j], 0, spr[j]);
        hi[j] = clamp(e0[j] - r * spr[j], 0, spr[j]);
      } else {
        const t = recordStarts[r];
        lo[j] = clamp(secondsToSamples(startS - t, rate[j]), 0, spr[j]);
        hi[j] = clamp(secondsToSamples(endS - t, rate[j]), 0, spr[j]);
      }
      if (hi[j] > lo[j]) any = true;
    }
    return any;
  };
  let rFirst = 0;
  let rEnd = h.records;
  if (recordStarts === null) {
    rFirst = h.records;
    rEnd = 0;
    for (let j = 0; j < m; j++) {
      if (e0[j] <= s0[j]) continue;
      rFirst = Math.min(rFirst, Math.floor(s0[j] / spr[j]));
      rEnd = Math.max(rEnd, Math.ceil(e0[j] / spr[j]));
    }
  }
  const tol = IO_DEFAULTS.contiguity_tolerance_s;
  let prevRecord = -1;
  let r = rFirst;
  while (r < rEnd) {
    if (!recordSpan(r)) { r++; continue; }
    // group of consecutive, contiguous records with data in the span
    let n = 1;
    while (n < K && r + n < rEnd) {
      if (recordStarts !== null && Math.abs(recordStarts[r + n] - recordStarts[r + n - 1] - dur) > tol) break;
      if (!recordSpan(r + n)) break;
      n++;
    }
    await readExactly(fh, buf, n * h.record_size, h.header_bytes + r * h.record_size);
    fill.fill(0);
    clippedLow.fill(0);
    clippedHigh.fill(0);
    let chunkStart = NaN;
    for (let k = 0; k < n; k++) {
      recordSpan(r + k);
      const recBase = k * h.record_size;
      for (let j = 0; j < m; j++) {
        const a = lo[j];
        const b = hi[j];
        if (b <= a) continue;
        if (j === 0 && k === 0) chunkStart = (recordStarts === null ? r * dur : recordStarts[r]) + a / rate[0];
        const s = sel[j];
        const byteStart = recBase + s.offset_in_record + a * h.bytes_per_sample;
        const dst = out[j];
        const at = fill[j];
        if (kernel !== null) {
          kernel.convert(i16!, byteStart >> 1, b - a, dst, at, s.digital_min, s.digital_max, s.bitvalue, s.offset, counts);
          clippedLow[j] += counts[0]!;
          clippedHigh[j] += counts[1]!;
        } else if (i16 !== null) clippedLow[j] += convert16(i16, byteStart >> 1, b - a, dst, at, s, digital, clippedHigh, j);
        else if (h.bytes_per_sample === 2) clippedLow[j] += convert16dv(dv, byteStart, b - a, dst, at, s, digital, clippedHigh, j);
        else clippedLow[j] += convert24(buf, byteStart, b - a, dst, at, s, digital, clippedHigh, j);
        fill[j] = at + (b - a);
      }
    }
    if (Number.isNaN(chunkStart)) {
      // the first requested signal has no samples in this group: time from the first signal that has
      for (let j = 0; j < m && Number.isNaN(chunkStart); j++) {
        recordSpan(r);
        if (hi[j] > lo[j]) chunkStart = (recordStarts === null ? r * dur : recordStarts[r]) + lo[j] / rate[j];
      }
    }
    const gap = recordStarts !== null && prevRecord >= 0 && Math.abs(recordStarts[r] - recordStarts[prevRecord] - dur) > tol;
    prevRecord = r + n - 1;
    yield {
      start_s: chunkStart,
      gap_before: gap,
      data: out.map((o, j) => o.subarray(0, fill[j])),
      clipped_low: clippedLow,
      clipped_high: clippedHigh,
      nan_free: nanFree,
    };
    r += n;
  }
}

function clamp(x: number, a: number, b: number): number {
  return x < a ? a : x > b ? b : x;
}

// The three conversion loops below are the hot path: no allocation, no closures. Each returns the
// count of samples at the digital minimum and adds the count at the maximum to `high[j]`.

function convert16(src: Int16Array, i0: number, n: number, dst: Float64Array, at: number, s: EdfSignalHeader, digital: boolean, high: Int32Array, j: number): number {
  const dmin = s.digital_min;
  const dmax = s.digital_max;
  const bv = s.bitvalue;
  const off = s.offset;
  let cl = 0;
  let ch = 0;
  if (digital) {
    for (let i = 0; i < n; i++) {
      const d = src[i0 + i];
      if (d <= dmin) cl++; else if (d >= dmax) ch++;
      dst[at + i] = d;
    }
  } else {
    for (let i = 0; i < n; i++) {
      const d = src[i0 + i];
      if (d <= dmin) cl++; else if (d >= dmax) ch++;
      dst[at + i] = bv * (off + d);
    }
  }
  high[j] += ch;
  return cl;
}

function convert16dv(src: DataView, b0: number, n: number, dst: Float64Array, at: number, s: EdfSignalHeader, digital: boolean, high: Int32Array, j: number): number {
  const dmin = s.digital_min;
  const dmax = s.digital_max;
  const bv = s.bitvalue;
  const off = s.offset;
  let cl = 0;
  let ch = 0;
  for (let i = 0; i < n; i++) {
    const d = src.getInt16(b0 + 2 * i, true);
    if (d <= dmin) cl++; else if (d >= dmax) ch++;
    dst[at + i] = digital ? d : bv * (off + d);
  }
  high[j] += ch;
  return cl;
}

function convert24(src: Uint8Array, b0: number, n: number, dst: Float64Array, at: number, s: EdfSignalHeader, digital: boolean, high: Int32Array, j: number): number {
  const dmin = s.digital_min;
  const dmax = s.digital_max;
  const bv = s.bitvalue;
  const off = s.offset;
  let cl = 0;
  let ch = 0;
  let p = b0;
  for (let i = 0; i < n; i++) {
    // 24-bit little-endian two's complement: shift the top byte into the sign bit and back
    const d = ((src[p] | (src[p + 1] << 8) | (src[p + 2] << 16)) << 8) >> 8;
    p += 3;
    if (d <= dmin) cl++; else if (d >= dmax) ch++;
    dst[at + i] = digital ? d : bv * (off + d);
  }
  high[j] += ch;
  return cl;
}
