// A minimal WebAssembly binary writer: just what shiftload's generated kernels need (one type
// section, imported memory, exported functions, code with locals, and the optional "name" section
// so CPU profiles show the functions). Kernels build their instructions with `Body`; the
// engine's validator (WebAssembly.validate) checks every module before it is used.

/** Unsigned LEB128. */
export function uleb(v: number): number[] {
  const out: number[] = [];
  do {
    let b = v & 0x7f;
    v >>>= 7;
    if (v !== 0) b |= 0x80;
    out.push(b);
  } while (v !== 0);
  return out;
}

/** Signed LEB128. */
export function sleb(v: number): number[] {
  const out: number[] = [];
  for (;;) {
    const b = v & 0x7f;
    v >>= 7;
    if ((v === 0 && (b & 0x40) === 0) || (v === -1 && (b & 0x40) !== 0)) { out.push(b); return out; }
    out.push(b | 0x80);
  }
}

/** A section: id, byte length, body. */
export function section(id: number, body: number[]): number[] {
  return [id, ...uleb(body.length), ...body];
}

/** A vector: count, then the items. */
export function vec(items: number[][]): number[] {
  return [...uleb(items.length), ...items.flat()];
}

/** A name (ASCII). */
export function name(s: string): number[] {
  return vec([...s].map((c) => [c.charCodeAt(0)]));
}

/** The custom "name" section giving function i the name names[i]. */
export function functionNames(names: readonly string[]): number[] {
  const map = vec(names.map((n, i) => [...uleb(i), ...name(n)]));
  return section(0, [...name('name'), 1, ...uleb(map.length), ...map]);
}

/** The module: magic, version, then the sections. */
export function wasmModule(sections: number[]): Uint8Array<ArrayBuffer> {
  return new Uint8Array([0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, ...sections]);
}

/** Core opcodes used. */
export const OP = {
  block: 0x02, loop: 0x03, br: 0x0c, brIf: 0x0d, end: 0x0b,
  localGet: 0x20, localSet: 0x21, localTee: 0x22,
  i32Load: 0x28, i32Store: 0x36,
  i32Const: 0x41, f64Const: 0x44, i32LtS: 0x48, i32GeS: 0x4e, i32Add: 0x6a, i32Sub: 0x6b, i32Mul: 0x6c, i32And: 0x71, i32Shl: 0x74, i32ShrU: 0x76,
  simd: 0xfd,
} as const;

/** SIMD opcodes used (after the 0xfd prefix). */
export const SIMD = {
  load: 0x00, load64Splat: 0x0a, store: 0x0b, shuffle: 0x0d,
  i16x8Splat: 0x10, f64x2Splat: 0x14, i32x4ExtractLane: 0x1b,
  i16x8LeS: 0x33, i16x8GeS: 0x35,
  load64Lane: 0x57, store64Lane: 0x5b,
  i32x4ExtaddPairwiseI16x8S: 0x7e, i16x8Sub: 0x91,
  i32x4ExtendLowI16x8S: 0xa7, i32x4ExtendHighI16x8S: 0xa8,
  add: 0xf0, sub: 0xf1, mul: 0xf2, f64x2ConvertLowI32x4S: 0xfe,
} as const;

export const T_I32 = 0x7f;
export const T_F64 = 0x7c;
export const T_V128 = 0x7b;

/** Code of one function body with a small assembler. */
export class Body {
  readonly code: number[] = [];
  get(l: number): this { this.code.push(OP.localGet, ...uleb(l)); return this; }
  set(l: number): this { this.code.push(OP.localSet, ...uleb(l)); return this; }
  tee(l: number): this { this.code.push(OP.localTee, ...uleb(l)); return this; }
  i32(v: number): this { this.code.push(OP.i32Const, ...sleb(v)); return this; }
  f64(v: number): this {
    const d = new DataView(new ArrayBuffer(8));
    d.setFloat64(0, v, true); // little-endian, as the binary format
    this.code.push(OP.f64Const, ...new Uint8Array(d.buffer));
    return this;
  }
  op(...b: number[]): this { this.code.push(...b); return this; }
  simd(op: number, ...imm: number[]): this { this.code.push(OP.simd, ...uleb(op), ...imm); return this; }
  /** A memory argument: alignment (log2 bytes) and offset. */
  mem(align: number, offset: number): number[] { return [...uleb(align), ...uleb(offset)]; }
  /** The finished body: local declarations ([count, type] runs) and the code, with its size. */
  finish(locals: [number, number][]): number[] {
    const body = [...vec(locals.map(([n, t]) => [...uleb(n), t])), ...this.code];
    return [...uleb(body.length), ...body];
  }
}

/**
 * A compiler of generated modules with one compiled module per key, or null for every key where
 * the engine refuses the module (no WebAssembly SIMD): callers then use their scalar code.
 * @example const moduleFor = compiledModules((n: number) => moduleBytes(n)); const m = moduleFor(2048);
 */
export function compiledModules<K>(make: (key: K) => Uint8Array<ArrayBuffer>): (key: K) => WebAssembly.Module | null {
  const cache = new Map<K, WebAssembly.Module | null>();
  return (key) => {
    if (!cache.has(key)) {
      let m: WebAssembly.Module | null = null;
      try {
        const bytes = make(key);
        if (WebAssembly.validate(bytes)) m = new WebAssembly.Module(bytes);
      } catch {
        m = null;
      }
      cache.set(key, m);
    }
    return cache.get(key)!;
  };
}
