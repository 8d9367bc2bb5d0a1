// EDF's 16-bit samples to physical values in WebAssembly SIMD, eight samples per step: the
// reader's hot loop (physical = bv · (offset + digital), counting samples at the digital limits).
// The scalar loop (edf-reader.ts convert16) runs at about 3 ns per sample in V8; this one at a
// fraction of that. Same operations in the same order, so the values are bit-identical
// (test/io/convert16-kernel.test.ts). The reader's read buffer and its output arrays live in the
// kernel's memory (bytes() / array()), so nothing is copied. Where WebAssembly SIMD is missing,
// convert16Kernel returns null and the reader keeps its scalar loop.
import { Body, compiledModules, functionNames, name, OP, SIMD, section, T_F64, T_I32, T_V128, uleb, vec, wasmModule } from '../wasm/module-writer.js';

/** Bytes at the start of memory kept for the kernel (the count at the digital maximum). */
const RESERVED = 64;
/** Samples per kernel call at most (each 16-bit lane counts up to 32 767 steps). */
const MAX_CALL = 8 * 32000;

/**
 * conv(src, dst, n, dmin, dmax, bv, off) → samples ≤ dmin (n a multiple of 8, byte addresses);
 * the count of samples ≥ dmax is stored at address 0.
 */
function moduleBytes(): Uint8Array<ArrayBuffer> {
  // params: 0 src, 1 dst, 2 n, 3 dmin, 4 dmax (i32), 5 bv, 6 off (f64); locals: 7 k (i32),
  // 8 vmin, 9 vmax, 10 accLo, 11 accHi, 12 vbv, 13 voff, 14 v, 15 a, 16 b (v128)
  const SRC = 0, DST = 1, N = 2, DMIN = 3, DMAX = 4, BV = 5, OFF = 6, K = 7;
  const VMIN = 8, VMAX = 9, ACC_LO = 10, ACC_HI = 11, VBV = 12, VOFF = 13, V = 14, A = 15, B = 16;
  const HIGH_HALF = [8, 9, 10, 11, 12, 13, 14, 15, 8, 9, 10, 11, 12, 13, 14, 15];
  const b = new Body();
  b.get(DMIN).simd(SIMD.i16x8Splat).set(VMIN);
  b.get(DMAX).simd(SIMD.i16x8Splat).set(VMAX);
  b.get(BV).simd(SIMD.f64x2Splat).set(VBV);
  b.get(OFF).simd(SIMD.f64x2Splat).set(VOFF);
  b.i32(0).set(K);
  b.op(OP.block, 0x40, OP.loop, 0x40);
  b.get(K).get(N).op(OP.i32GeS).op(OP.brIf, 1);
  // v = eight samples at src + 2k
  b.get(SRC).get(K).i32(1).op(OP.i32Shl).op(OP.i32Add).simd(SIMD.load, ...b.mem(0, 0)).set(V);
  // lane counts: a true comparison is −1, so subtracting it adds one
  b.get(ACC_LO).get(V).get(VMIN).simd(SIMD.i16x8LeS).simd(SIMD.i16x8Sub).set(ACC_LO);
  b.get(ACC_HI).get(V).get(VMAX).simd(SIMD.i16x8GeS).simd(SIMD.i16x8Sub).set(ACC_HI);
  b.get(V).simd(SIMD.i32x4ExtendLowI16x8S).set(A);
  b.get(V).simd(SIMD.i32x4ExtendHighI16x8S).set(B);
  // four stores of two values: bv · (off + d), d converted exactly
  const store = (src: number, high: boolean, at: number) => {
    b.get(DST).get(K).i32(3).op(OP.i32Shl).op(OP.i32Add);
    b.get(VBV).get(VOFF).get(src);
    if (high) b.get(src).simd(SIMD.shuffle, ...HIGH_HALF);
    b.simd(SIMD.f64x2ConvertLowI32x4S).simd(SIMD.add).simd(SIMD.mul);
    b.simd(SIMD.store, ...b.mem(0, at));
  };
  store(A, false, 0); store(A, true, 16); store(B, false, 32); store(B, true, 48);
  b.get(K).i32(8).op(OP.i32Add).set(K);
  b.op(OP.br, 0, OP.end, OP.end);
  // count at the maximum → memory[0]; count at the minimum → result
  const laneSum = (acc: number) => {
    b.get(acc).simd(SIMD.i32x4ExtaddPairwiseI16x8S).set(A);
    b.get(A).simd(SIMD.i32x4ExtractLane, 0).get(A).simd(SIMD.i32x4ExtractLane, 1).op(OP.i32Add);
    b.get(A).simd(SIMD.i32x4ExtractLane, 2).op(OP.i32Add).get(A).simd(SIMD.i32x4ExtractLane, 3).op(OP.i32Add);
  };
  b.i32(0);
  laneSum(ACC_HI);
  b.op(OP.i32Store, ...b.mem(2, 0));
  laneSum(ACC_LO);
  b.op(OP.end);
  const fn = b.finish([[1, T_I32], [9, T_V128]]);
  const params = vec([[T_I32], [T_I32], [T_I32], [T_I32], [T_I32], [T_F64], [T_F64]]);
  return wasmModule([
    ...section(1, vec([[0x60, ...params, ...vec([[T_I32]])]])),
    ...section(2, vec([[...name('env'), ...name('memory'), 0x02, 0x00, ...uleb(1)]])),
    ...section(3, vec([[0]])),
    ...section(7, vec([[...name('conv'), 0x00, 0]])),
    ...section(10, vec([fn])),
    ...functionNames(['convert16Simd']),
  ]);
}

/** The module (null without WebAssembly SIMD: the reader keeps its scalar loop). */
const compiled = compiledModules((_: 0) => moduleBytes());

/** The reader's 16-bit conversion in SIMD, with its buffers in the kernel's memory. */
export interface Convert16Kernel {
  /** A Buffer of n bytes in the kernel's memory (2-byte aligned), for the file reads. */
  bytes(n: number): Buffer;
  /** A zeroed Float64Array of n values in the kernel's memory, for the converted samples. */
  array(n: number): Float64Array;
  /**
   * dst[at…at + n) = bv · (off + src[i0…i0 + n)) for the Int16 samples of a bytes() buffer at
   * sample index i0 (dst from array()); returns [count ≤ dmin, count ≥ dmax] (counted as the
   * scalar loop: a sample at the minimum is not also checked against the maximum).
   */
  convert(src: Int16Array, i0: number, n: number, dst: Float64Array, at: number, dmin: number, dmax: number, bv: number, off: number, counts: Int32Array): void;
}

/**
 * A conversion kernel with room for `capacity` bytes of buffers, or null where WebAssembly SIMD
 * is not available.
 * @example const k = convert16Kernel(2 << 20); const buf = k.bytes(1 << 20); const out = k.array(4000);
 */
export function convert16Kernel(capacity: number): Convert16Kernel | null {
  const mod = compiled(0);
  if (mod === null) return null;
  const total = RESERVED + capacity + 64;
  if (total > 1 << 30) return null;
  const memory = new WebAssembly.Memory({ initial: Math.ceil(total / 65536) });
  const conv = (new WebAssembly.Instance(mod, { env: { memory } }).exports as { conv: (src: number, dst: number, n: number, dmin: number, dmax: number, bv: number, off: number) => number }).conv;
  const heap = memory.buffer as ArrayBuffer;
  const hi = new Int32Array(heap, 0, 1);
  let next = RESERVED;
  const take = (bytes: number, align: number) => {
    next = Math.ceil(next / align) * align;
    if (next + bytes > total) throw new RangeError(`convert16Kernel: capacity of ${capacity} bytes exceeded`);
    const at = next;
    next += bytes;
    return at;
  };
  return {
    bytes(n) {
      return Buffer.from(heap, take(n, 16), n);
    },
    array(n) {
      return new Float64Array(heap, take(8 * n, 16), n);
    },
    convert(src, i0, n, dst, at, dmin, dmax, bv, off, counts) {
      if (src.buffer !== heap || dst.buffer !== heap) throw new RangeError('convert16Kernel: buffers must come from bytes() and array()');
      let lo = 0, high = 0, done = 0;
      const whole = n - (n % 8);
      while (done < whole) {
        const m = Math.min(MAX_CALL, whole - done);
        lo += conv(src.byteOffset + 2 * (i0 + done), dst.byteOffset + 8 * (at + done), m, dmin, dmax, bv, off);
        high += hi[0]!;
        done += m;
      }
      for (let i = whole; i < n; i++) { // the last few samples, as the scalar loop
        const d = src[i0 + i]!;
        if (d <= dmin) lo++; else if (d >= dmax) high++;
        dst[at + i] = bv * (off + d);
      }
      counts[0] = lo;
      counts[1] = high;
    },
  };
}
