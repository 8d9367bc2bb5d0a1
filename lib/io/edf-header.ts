// EDF/EDF+/BDF/BDF+ header parsing by the specification's field widths (METHODS.md §11.2–11.3).
// Every field is checked (printable ASCII, numbers that parse, ranges) and every refusal names the
// file, the field and its byte offset. Sizes are checked against the file size before anything
// proportional to a header number is allocated.
// Sources: Kemp et al. 1992 (EDF); Kemp & Olivan 2003 (EDF+); BDF/BDF+ as implemented by EDFlib.
import type { FileHandle } from 'node:fs/promises';
import { InputError } from '../errors.js';
import { ioMsg } from '../messages.js';

/** Widths of the fixed header fields, in file order (offset = running sum). */
const FIXED_FIELDS: ReadonlyArray<readonly [key: string, name: string, width: number]> = [
  ['version', 'version', 8],
  ['patient', 'patient identification', 80],
  ['recording', 'recording identification', 80],
  ['startdate', 'start date', 8],
  ['starttime', 'start time', 8],
  ['header_bytes', 'number of bytes in header', 8],
  ['reserved', 'reserved', 44],
  ['number_of_data_records', 'number of data records', 8],
  ['data_record_duration', 'data record duration', 8],
  ['number_of_signals', 'number of signals', 4],
];

/** Per-signal fields: key, readable name, width. Stored field-major (all labels, then all transducers, …). */
const SIGNAL_FIELDS: ReadonlyArray<readonly [key: string, name: string, width: number]> = [
  ['label', 'label', 16],
  ['transducer', 'transducer', 80],
  ['physical_dimension', 'physical dimension', 8],
  ['physical_minimum', 'physical minimum', 8],
  ['physical_maximum', 'physical maximum', 8],
  ['digital_minimum', 'digital minimum', 8],
  ['digital_maximum', 'digital maximum', 8],
  ['prefiltering', 'prefiltering', 80],
  ['samples_per_record', 'number of samples per record', 8],
  ['reserved', 'reserved', 32],
];

/** One signal of the header (data or annotation signal). */
export interface EdfSignalHeader {
  /** Index among all signals of the file, annotation signals included. */
  file_index: number;
  label: string;
  transducer: string;
  unit: string;
  physical_min: number;
  physical_max: number;
  digital_min: number;
  digital_max: number;
  prefilter: string;
  samples_per_record: number;
  /** True for an EDF+/BDF+ annotation signal ("EDF Annotations" / "BDF Annotations"). */
  is_annotation: boolean;
  /** Byte offset of this signal's samples inside a data record. */
  offset_in_record: number;
  /** EDFlib's scaling: physical = bitvalue · (offset + digital). */
  bitvalue: number;
  offset: number;
}

export interface EdfHeader {
  kind: 'EDF' | 'BDF';
  /** EDF+/BDF+ continuity: 'C', 'D', or null for plain EDF/BDF. */
  plus: 'C' | 'D' | null;
  bytes_per_sample: 2 | 3;
  patient: string;
  recording: string;
  /** 'YYYY-MM-DDTHH:MM:SS' */
  start: string;
  header_bytes: number;
  /** Number of data records (resolved from the file size when the header says −1). */
  records: number;
  record_duration_s: number;
  signals: EdfSignalHeader[];
  /** Bytes per data record. */
  record_size: number;
  /** Header fields cut at the specification's widths, ISO-8859-1, trailing spaces removed. */
  raw: Record<string, string> & { signals: Record<string, string>[] };
}

const INT_RE = /^[+-]?\d+$/;
const NUM_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const MONTHS = ['JAN', 'FEB', 'MAR', 'APR', 'MAY', 'JUN', 'JUL', 'AUG', 'SEP', 'OCT', 'NOV', 'DEC'];

/** Read and validate the header of an EDF-family file. Throws InputError naming field and byte. */
export async function readEdfHeader(fh: FileHandle, file: string, fileSize: number): Promise<EdfHeader> {
  if (fileSize < 256) throw new InputError(ioMsg.headerTooShort(file, fileSize, 256), { file, where: 'byte 0' });
  const fixed = Buffer.alloc(256);
  await readFully(fh, fixed, 0);
  const kind: 'EDF' | 'BDF' = fixed[0] === 0xff ? 'BDF' : 'EDF';
  const raw: Record<string, string> = {};
  let off = 0;
  for (const [key, name, width] of FIXED_FIELDS) {
    checkAscii(file, fixed, off, width, name, kind === 'BDF' && key === 'version' ? 1 : 0);
    raw[key] = fixed.toString('latin1', off, off + width).replace(/ +$/, '');
    off += width;
  }
  if (kind === 'EDF' ? raw.version !== '0' : raw.version !== '\u00ffBIOSEMI') {
    throw new InputError(ioMsg.headerNumber(file, 'version', 0, raw.version, kind === 'EDF' ? "'0' (EDF)" : "0xFF 'BIOSEMI' (BDF)"), { file, where: 'byte 0' });
  }
  const ns = parseIntField(file, raw.number_of_signals, 'number of signals', 252);
  if (ns < 1) throw new InputError(ioMsg.headerNumber(file, 'number of signals', 252, raw.number_of_signals, 'a positive integer'), { file, where: 'byte 252' });
  const need = 256 * (ns + 1);
  if (need > fileSize) throw new InputError(ioMsg.headerLongerThanFile(file, need, fileSize, ns), { file, where: 'byte 252' });
  const headerBytes = parseIntField(file, raw.header_bytes, 'number of bytes in header', 184);
  if (headerBytes !== need) throw new InputError(ioMsg.headerBytes(file, headerBytes, ns), { file, where: 'byte 184' });

  const sh = Buffer.alloc(256 * ns);
  await readFully(fh, sh, 256);
  const rawSignals: Record<string, string>[] = Array.from({ length: ns }, () => ({}));
  let rel = 0;
  for (const [key, name, width] of SIGNAL_FIELDS) {
    for (let i = 0; i < ns; i++) {
      const o = rel * ns + i * width;
      checkAscii(file, sh, o, width, `${name} of signal ${i}`, 0, 256);
      rawSignals[i][key] = sh.toString('latin1', o, o + width).replace(/ +$/, '');
    }
    rel += width;
  }
  const fieldOffset = (key: string, i: number): number => {
    let r = 0;
    for (const [k, , w] of SIGNAL_FIELDS) {
      if (k === key) return 256 + r * ns + i * w;
      r += w;
    }
    return -1;
  };

  const reserved = raw.reserved;
  const plusTag = kind === 'EDF' ? 'EDF+' : 'BDF+';
  const plus: 'C' | 'D' | null = reserved.startsWith(`${plusTag}C`) ? 'C' : reserved.startsWith(`${plusTag}D`) ? 'D' : null;
  const annotationLabel = kind === 'EDF' ? 'EDF Annotations' : 'BDF Annotations';
  const bytesPerSample: 2 | 3 = kind === 'EDF' ? 2 : 3;
  const [dLo, dHi] = kind === 'EDF' ? [-32768, 32767] : [-8388608, 8388607];

  const signals: EdfSignalHeader[] = [];
  let recordSize = 0;
  for (let i = 0; i < ns; i++) {
    const r = rawSignals[i];
    const isAnnotation = plus !== null && r.label.trim() === annotationLabel;
    const spr = parseIntField(file, r.samples_per_record, `number of samples per record of signal ${i}`, fieldOffset('samples_per_record', i));
    if (spr < 1) {
      throw new InputError(ioMsg.headerNumber(file, `number of samples per record of signal ${i}`, fieldOffset('samples_per_record', i), r.samples_per_record, 'a positive integer'), { file });
    }
    const pmin = parseNumField(file, r.physical_minimum, `physical minimum of signal ${i}`, fieldOffset('physical_minimum', i));
    const pmax = parseNumField(file, r.physical_maximum, `physical maximum of signal ${i}`, fieldOffset('physical_maximum', i));
    const dmin = parseIntField(file, r.digital_minimum, `digital minimum of signal ${i}`, fieldOffset('digital_minimum', i));
    const dmax = parseIntField(file, r.digital_maximum, `digital maximum of signal ${i}`, fieldOffset('digital_maximum', i));
    const name = `${i} '${r.label}'`;
    if (!isAnnotation) {
      if (dmin < dLo || dmin > dHi) throw new InputError(ioMsg.digitalLimits(file, name, fieldOffset('digital_minimum', i), dmin, dLo, dHi), { file });
      if (dmax < dLo || dmax > dHi) throw new InputError(ioMsg.digitalLimits(file, name, fieldOffset('digital_maximum', i), dmax, dLo, dHi), { file });
      if (dmin >= dmax) throw new InputError(ioMsg.digitalRange(file, name, fieldOffset('digital_minimum', i), dmin, dmax), { file });
      if (pmin === pmax) throw new InputError(ioMsg.physicalRange(file, name, fieldOffset('physical_minimum', i), pmin), { file });
    }
    const bitvalue = dmax !== dmin ? (pmax - pmin) / (dmax - dmin) : 1;
    signals.push({
      file_index: i,
      label: r.label,
      transducer: r.transducer,
      unit: r.physical_dimension,
      physical_min: pmin,
      physical_max: pmax,
      digital_min: dmin,
      digital_max: dmax,
      prefilter: r.prefiltering,
      samples_per_record: spr,
      is_annotation: isAnnotation,
      offset_in_record: recordSize,
      bitvalue,
      offset: pmax / bitvalue - dmax,
    });
    recordSize += spr * bytesPerSample;
  }
  if (plus !== null && !signals.some((s) => s.is_annotation)) {
    throw new InputError(ioMsg.headerNumber(file, 'labels', 256, reserved, `an '${annotationLabel}' signal in an ${plusTag} file`), { file });
  }

  const duration = parseNumField(file, raw.data_record_duration, 'data record duration', 244);
  if (!(duration > 0)) throw new InputError(ioMsg.headerNumber(file, 'data record duration', 244, raw.data_record_duration, 'a positive number of seconds'), { file });

  const said = parseIntField(file, raw.number_of_data_records, 'number of data records', 236);
  const dataBytes = fileSize - need;
  const holds = Math.floor(dataBytes / recordSize);
  const extra = dataBytes - holds * recordSize;
  let records: number;
  if (said === -1) {
    if (extra !== 0) throw new InputError(ioMsg.partialRecord(file, holds, extra, recordSize), { file });
    records = holds;
  } else if (said < -1) {
    throw new InputError(ioMsg.headerNumber(file, 'number of data records', 236, raw.number_of_data_records, 'a count ≥ 0 or -1'), { file });
  } else {
    if (said !== holds) throw new InputError(ioMsg.recordCount(file, said, holds), { file, where: 'byte 236' });
    if (extra !== 0) throw new InputError(ioMsg.partialRecord(file, holds, extra, recordSize), { file });
    records = said;
  }
  if (records === 0) throw new InputError(ioMsg.noDataRecords(file), { file, where: 'byte 236' });

  const start = parseStart(file, raw.startdate, raw.starttime, plus !== null ? raw.recording : '');
  return {
    kind,
    plus,
    bytes_per_sample: bytesPerSample,
    patient: raw.patient,
    recording: raw.recording,
    start,
    header_bytes: need,
    records,
    record_duration_s: duration,
    signals,
    record_size: recordSize,
    raw: Object.assign(raw, { signals: rawSignals }),
  };
}

async function readFully(fh: FileHandle, buf: Buffer, position: number): Promise<void> {
  let got = 0;
  while (got < buf.length) {
    const { bytesRead } = await fh.read(buf, got, buf.length - got, position + got);
    if (bytesRead === 0) break;
    got += bytesRead;
  }
}

function checkAscii(file: string, buf: Buffer, off: number, width: number, field: string, skip: number, base = 0): void {
  for (let k = off + skip; k < off + width; k++) {
    const b = buf[k];
    if (b < 0x20 || b > 0x7e) throw new InputError(ioMsg.headerNotAscii(file, field, base + k, b), { file, where: `byte ${base + k}` });
  }
}

function parseIntField(file: string, text: string, field: string, offset: number): number {
  const t = text.trim();
  if (!INT_RE.test(t)) throw new InputError(ioMsg.headerNumber(file, field, offset, text, 'an integer'), { file, where: `byte ${offset}` });
  return Number(t);
}

function parseNumField(file: string, text: string, field: string, offset: number): number {
  const t = text.trim();
  // '1e999' matches the pattern but overflows to Infinity: refused like any other non-number
  if (!NUM_RE.test(t) || !Number.isFinite(Number(t))) throw new InputError(ioMsg.headerNumber(file, field, offset, text, 'a number'), { file, where: `byte ${offset}` });
  return Number(t);
}

/** Start date-time; two-digit years 85–99 → 19xx, else 20xx; an EDF+ "Startdate dd-MMM-yyyy" gives the full year. */
function parseStart(file: string, date: string, time: string, recording: string): string {
  const dm = /^(\d\d)\.(\d\d)\.(\d\d)$/.exec(date.trim());
  if (!dm) throw new InputError(ioMsg.headerNumber(file, 'start date', 168, date, 'dd.mm.yy'), { file, where: 'byte 168' });
  const tm = /^(\d\d)\.(\d\d)\.(\d\d)$/.exec(time.trim());
  if (!tm) throw new InputError(ioMsg.headerNumber(file, 'start time', 176, time, 'hh.mm.ss'), { file, where: 'byte 176' });
  const yy = Number(dm[3]);
  let year = yy >= 85 ? 1900 + yy : 2000 + yy;
  const rm = /^Startdate (\d\d)-([A-Z]{3})-(\d{4})/.exec(recording);
  if (rm && MONTHS.includes(rm[2]) && Number(rm[3]) % 100 === yy) year = Number(rm[3]);
  const mo = Number(dm[2]);
  const d = Number(dm[1]);
  // day checked against the month's length (31.02. is refused; 29.02. only in leap years)
  if (mo < 1 || mo > 12 || d < 1 || d > new Date(Date.UTC(year, mo, 0)).getUTCDate()) throw new InputError(ioMsg.headerNumber(file, 'start date', 168, date, 'a valid dd.mm.yy date'), { file });
  if (Number(tm[1]) > 23 || Number(tm[2]) > 59 || Number(tm[3]) > 60) {
    throw new InputError(ioMsg.headerNumber(file, 'start time', 176, time, 'a valid hh.mm.ss time'), { file });
  }
  return `${String(year).padStart(4, '0')}-${dm[2]}-${dm[1]}T${tm[1]}:${tm[2]}:${tm[3]}`;
}
