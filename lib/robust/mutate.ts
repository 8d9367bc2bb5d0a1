// Seeded mutators for robustness fuzzing: byte-level edits of EDF/BDF files (bit flips, header
// fields replaced by hostile numbers or text, field swaps, truncation, record splices) and
// text-level edits of CSV and YAML (line edits, number swaps, NaN/Inf, invalid UTF-8). Every
// mutation is a pure function of the input and the generator, so (seed, case) reproduces it.
import type { SplitMix64 } from '../stats/splitmix64.js';

/** A mutated input and the names of the edits made (printed with a failing case). */
export interface Mutant {
  bytes: Buffer;
  edits: string[];
}

/** Values that break parsers: signs, extremes, non-numbers, separators, non-ASCII. */
export const HOSTILE_NUMBERS = [
  '0', '-0', '-1', '1', '-99999999', '99999999', '1e308', '1e-308', '-1e308', '1e999', 'NaN', 'nan', 'Inf',
  'Infinity', '-Infinity', '', ' ', '1,5', '0x10', '1.5.5', '+', '-', '.', 'e5', '2147483648', '4294967296',
  '9007199254740993', '0.0000001', '3.5', '1 2', '\u00e9', '\u0000', '007',
] as const;

/** EDF/BDF main header fields: [offset, width, name]. */
const MAIN_FIELDS: [number, number, string][] = [
  [0, 8, 'version'], [8, 80, 'patient'], [88, 80, 'recording'], [168, 8, 'startdate'], [176, 8, 'starttime'],
  [184, 8, 'header bytes'], [192, 44, 'reserved'], [236, 8, 'records'], [244, 8, 'duration'], [252, 4, 'signals'],
];
/** Per-signal fields in order: [width, name]. */
const SIGNAL_FIELDS: [number, string][] = [
  [16, 'label'], [80, 'transducer'], [8, 'unit'], [8, 'physical min'], [8, 'physical max'],
  [8, 'digital min'], [8, 'digital max'], [80, 'prefilter'], [8, 'samples per record'], [32, 'reserved'],
];

interface Field { offset: number; width: number; name: string }

/** Header fields of an EDF/BDF file as laid out by its own signal count (all fields for 0…ns-1). */
export function edfFields(b: Buffer): Field[] {
  const fields: Field[] = MAIN_FIELDS.map(([offset, width, name]) => ({ offset, width, name }));
  const ns = b.length >= 256 ? Number.parseInt(b.toString('latin1', 252, 256).trim(), 10) : 0;
  if (!(ns > 0 && ns < 64 && b.length >= 256 + ns * 256)) return fields;
  let off = 256;
  for (const [width, name] of SIGNAL_FIELDS) {
    for (let s = 0; s < ns; s++) fields.push({ offset: off + s * width, width, name: `${name}[${s}]` });
    off += ns * width;
  }
  return fields;
}

function pick<T>(rng: SplitMix64, xs: readonly T[]): T {
  return xs[rng.int(xs.length)];
}

function writeField(b: Buffer, f: Field, text: string): void {
  const t = Buffer.from(text, 'latin1').subarray(0, f.width);
  b.fill(0x20, f.offset, f.offset + f.width);
  t.copy(b, f.offset);
}

/** A random byte offset, biased towards the header (where most checks live). */
function offsetIn(b: Buffer, rng: SplitMix64, headerBytes: number): number {
  if (b.length === 0) return 0;
  return rng.random() < 0.6 ? rng.int(Math.min(b.length, headerBytes)) : rng.int(b.length);
}

/**
 * Mutate an EDF/BDF file: 1–3 edits drawn from bit flips, hostile header fields, field swaps,
 * truncation, appended garbage, record duplication/removal and annotation-byte edits.
 */
export function mutateEdf(input: Buffer, rng: SplitMix64): Mutant {
  let b = Buffer.from(input);
  const edits: string[] = [];
  const headerBytes = Number.parseInt(b.toString('latin1', 184, 192).trim(), 10) || 256;
  const n = 1 + rng.int(3);
  for (let k = 0; k < n; k++) {
    const fields = edfFields(b);
    const kind = rng.int(9);
    if (kind === 0) {
      const flips = 1 + rng.int(8);
      for (let i = 0; i < flips && b.length > 0; i++) {
        const o = offsetIn(b, rng, headerBytes);
        b[o] ^= 1 << rng.int(8);
      }
      edits.push(`flip ${flips} bits`);
    } else if (kind <= 2) {
      const f = pick(rng, fields);
      if (f.offset + f.width > b.length) continue;
      const v = rng.random() < 0.8 ? pick(rng, HOSTILE_NUMBERS) : String(Math.floor((rng.random() - 0.5) * 10 ** rng.int(12)));
      writeField(b, f, v);
      edits.push(`${f.name}='${v}'`);
    } else if (kind === 3) {
      const f = pick(rng, fields);
      const same = fields.filter((g) => g.width === f.width && g !== f && g.offset + g.width <= b.length);
      if (same.length === 0 || f.offset + f.width > b.length) continue;
      const g = pick(rng, same);
      const tf = Buffer.from(b.subarray(f.offset, f.offset + f.width));
      b.copy(b, f.offset, g.offset, g.offset + g.width);
      tf.copy(b, g.offset);
      edits.push(`swap ${f.name}<->${g.name}`);
    } else if (kind === 4) {
      const cut = rng.random() < 0.5 ? rng.int(Math.min(b.length, headerBytes + 1)) : rng.int(b.length);
      b = b.subarray(0, cut);
      edits.push(`truncate to ${cut}`);
    } else if (kind === 5) {
      const extra = Buffer.alloc(1 + rng.int(600));
      for (let i = 0; i < extra.length; i++) extra[i] = rng.int(256);
      b = Buffer.concat([b, extra]);
      edits.push(`append ${extra.length}`);
    } else if (kind === 6) {
      // duplicate or remove a slice of the data area (shifts every later record)
      if (b.length <= headerBytes + 2) continue;
      const at = headerBytes + rng.int(b.length - headerBytes);
      const len = 1 + rng.int(Math.min(4096, b.length - at));
      b = rng.random() < 0.5
        ? Buffer.concat([b.subarray(0, at), b.subarray(at + len)])
        : Buffer.concat([b.subarray(0, at + len), b.subarray(at, at + len), b.subarray(at + len)]);
      edits.push(`splice ${len} at ${at}`);
    } else if (kind === 7) {
      // TAL-like bytes in the data area ('+', '-', 0x14, 0x15, 0x00, digits)
      const pool = [0x2b, 0x2d, 0x14, 0x15, 0x00, 0x30, 0x39, 0x2e, 0xc3, 0xff];
      const m = 1 + rng.int(12);
      for (let i = 0; i < m && b.length > headerBytes; i++) b[headerBytes + rng.int(b.length - headerBytes)] = pick(rng, pool);
      edits.push(`TAL bytes x${m}`);
    } else {
      // a number field set to a huge or negative integer
      const f = pick(rng, fields.filter((x) => /records|samples|signals|header bytes|digital|physical|duration/.test(x.name)));
      if (!f || f.offset + f.width > b.length) continue;
      const v = pick(rng, ['-1', '-2', '0', '99999999', '65536', '16777216', '2', '1000000', '-32769', '32768', '8388608']);
      writeField(b, f, v);
      edits.push(`${f.name}=${v}`);
    }
  }
  return { bytes: b, edits };
}

const INVALID_UTF8 = [Buffer.from([0xff]), Buffer.from([0xc3]), Buffer.from([0xed, 0xa0, 0x80]), Buffer.from([0xf8, 0x88, 0x80, 0x80, 0x80]), Buffer.from([0xc0, 0xaf])];
const TEXT_TOKENS = ['NaN', 'Inf', '-Infinity', '1e400', '-1', '0', '', 'abc', '"', ',', ';', '\t', '\r', '\u0000', '\ufeff', '9'.repeat(40), '\u00e9', '#', '  '];

/** Replace one number in `s` (chosen by the generator) by `v`; null when `s` has none. */
function replaceNumber(s: string, rng: SplitMix64, v: string): string | null {
  const re = /-?\d+(?:[.,]\d+)?(?:e-?\d+)?/g;
  const hits = [...s.matchAll(re)];
  if (hits.length === 0) return null;
  const h = pick(rng, hits);
  return s.slice(0, h.index) + v + s.slice((h.index ?? 0) + h[0].length);
}

/**
 * Mutate a CSV/TSV text: 1–3 edits drawn from line deletion/duplication/swap, a number replaced by
 * a hostile value, a cell or delimiter inserted or removed, truncation, invalid UTF-8 bytes and
 * bit flips.
 */
export function mutateCsv(input: Buffer, rng: SplitMix64): Mutant {
  return mutateText(input, rng, []);
}

/** YAML values that stress the job loader's types, limits and semantic checks. */
const YAML_VALUES = [
  '-1', '0', '1e400', '.nan', '.inf', '-.inf', 'null', '~', '[]', '{}', '""', 'true', 'x', '99999999999', '1e-300',
  '[1, 2, 3]', '{ a: 1 }', '"../"', '"."', '"/"', 'tiny-job.yaml', '/dev/null', 'nope.edf', '&a x', '*a', '!!binary aGVsbG8=',
  '!!js/function "x"', '2026-01-05', '0x1F', '0o17', '+12', "'EMG R'", '"EMG\\u0000R"', "'\u00e9'", 'annotations', '[20, 20]', '[200, 20]',
];

/**
 * Mutate a job YAML: the text edits of `mutateCsv` plus scalar values replaced by hostile YAML
 * values (types, NaN/Inf, huge, paths to itself/a folder/nothing, tags, anchors), keys renamed or
 * duplicated and indentation shifted.
 */
export function mutateYaml(input: Buffer, rng: SplitMix64): Mutant {
  return mutateText(input, rng, YAML_VALUES);
}

function mutateText(input: Buffer, rng: SplitMix64, yamlValues: readonly string[]): Mutant {
  let s = input.toString('utf8');
  let raw: Buffer | null = null;
  const edits: string[] = [];
  const n = 1 + rng.int(3);
  for (let k = 0; k < n; k++) {
    const lines = s.split('\n');
    const kind = rng.int(yamlValues.length > 0 ? 13 : 9);
    const li = rng.int(lines.length);
    if (kind === 0) { lines.splice(li, 1); edits.push(`delete line ${li + 1}`); }
    else if (kind === 1) { lines.splice(li, 0, lines[li]); edits.push(`duplicate line ${li + 1}`); }
    else if (kind === 2) { const lj = rng.int(lines.length); [lines[li], lines[lj]] = [lines[lj], lines[li]]; edits.push(`swap lines ${li + 1},${lj + 1}`); }
    else if (kind === 3) {
      const v = pick(rng, [...TEXT_TOKENS, ...HOSTILE_NUMBERS]);
      const r = replaceNumber(lines[li], rng, v);
      if (r === null) continue;
      lines[li] = r; edits.push(`line ${li + 1} number->'${v}'`);
    } else if (kind === 4) {
      const at = rng.int(lines[li].length + 1);
      const v = pick(rng, TEXT_TOKENS);
      lines[li] = lines[li].slice(0, at) + v + lines[li].slice(at); edits.push(`insert '${v}' line ${li + 1}`);
    } else if (kind === 5) {
      const at = rng.int(lines[li].length + 1);
      lines[li] = lines[li].slice(0, at) + lines[li].slice(at + 1 + rng.int(4)); edits.push(`cut chars line ${li + 1}`);
    } else if (kind === 6) {
      const cut = rng.int(s.length + 1);
      s = s.slice(0, cut); edits.push(`truncate to char ${cut}`); continue;
    } else if (kind === 7) {
      const b = Buffer.from(s, 'utf8');
      const at = rng.int(b.length + 1);
      raw = Buffer.concat([b.subarray(0, at), pick(rng, INVALID_UTF8), b.subarray(at)]);
      edits.push(`invalid UTF-8 at byte ${at}`);
      break; // further text edits would re-decode it
    } else if (kind === 8) {
      const b = Buffer.from(s, 'utf8');
      if (b.length === 0) continue;
      const flips = 1 + rng.int(4);
      for (let i = 0; i < flips; i++) b[rng.int(b.length)] ^= 1 << rng.int(8);
      raw = b; edits.push(`flip ${flips} bits`);
      break;
    } else if (kind === 9 || kind === 10) {
      // YAML: replace the value after "key:" (or a list item) by a hostile value
      const m = /^(\s*(?:-\s+)?[\w ]+:\s*)(.+)$/.exec(lines[li]) ?? /^(.*?\{\s*\w+:\s*)([^,}]+)/.exec(lines[li]);
      if (!m) continue;
      const v = pick(rng, yamlValues);
      lines[li] = m[1] + v + lines[li].slice(m[0].length); edits.push(`line ${li + 1} value->'${v}'`);
    } else if (kind === 12) {
      // YAML: an alias bomb (width^depth values after expansion) as a new key or a value
      const width = 2 + rng.int(11);
      const depth = 2 + rng.int(8);
      const bomb = [`bomb0: &b0 [${Array(width).fill('x').join(', ')}]`];
      for (let d = 1; d < depth; d++) bomb.push(`bomb${d}: &b${d} [${Array(width).fill(`*b${d - 1}`).join(', ')}]`);
      lines.splice(rng.int(2) === 0 ? 0 : lines.length, 0, ...bomb);
      edits.push(`alias bomb ${width}^${depth}`);
    } else {
      // YAML: rename a key, or shift indentation
      const m = /^(\s*(?:-\s+)?)(\w+)(:.*)$/.exec(lines[li]);
      if (!m) continue;
      if (rng.random() < 0.5) { lines[li] = m[1] + m[2] + pick(rng, ['x', 's', '_', '']) + m[3]; edits.push(`rename key line ${li + 1}`); }
      else { lines[li] = (rng.random() < 0.5 ? '  ' : '') + lines[li].replace(/^ {1,2}/, ''); edits.push(`indent line ${li + 1}`); }
    }
    s = lines.join('\n');
  }
  return { bytes: raw ?? Buffer.from(s, 'utf8'), edits };
}
