// The IIR hot loop for two channels at once, in WebAssembly SIMD: each 128-bit lane of an f64x2
// carries one channel through the same cascade of second-order sections (transposed direct
// form II), so one instruction does the work of two. The scalar kernel (sosfilt-in-place.ts) is
// already at the machine's scalar floating-point limit, so two lanes per instruction is where
// the remaining speed is. The arithmetic is the scalar kernel's, operation by operation
// (y = b0·x + z1; z1 = (b1·x − a1·y) + z2; z2 = b2·x − a2·y; no fused multiply-add in WebAssembly),
// so results are bit-identical to it (test/dsp/sos-pair-kernel.test.ts).
//
// The module is generated here for the number of sections (every section fused into one pass
// over the samples, coefficients and states held in locals), about 1 kB; it is compiled once per
// cascade length. The samples stay in the kernel's own memory: callers allocate their block
// buffers there (array()), so the passes need no copying in and out. Where WebAssembly SIMD is
// missing, sosPairKernel returns null and callers use the scalar kernel.
import { Body, compiledModules, functionNames, name, OP, SIMD, section, T_I32, T_V128, uleb, vec, wasmModule } from '../wasm/module-writer.js';
import type { Sos } from './sos.js';

// Memory layout (bytes): coefficients b0 b1 b2 a1 a2 per section (f64), states z1 z2 per
// section (f64x2: lane 0 = channel A, lane 1 = channel B), then the callers' arrays from DATA on.
const COEF = 0;
const STATE = 2048;
const DATA = 4096;
/** Longest cascade the layout holds (coefficients and states must fit below DATA). */
const MAX_SECTIONS = 48;

/**
 * The module for a cascade of ns sections: fwd(srcA, srcB, dstA, dstB, n) and rev(…) filter n
 * samples of both channels (byte addresses; src may equal dst), forwards or from the last sample
 * to the first, starting from and updating the states in memory (JS writes coefficients and
 * states). The memory is imported (env.memory), sized by the caller.
 */
function moduleBytes(ns: number): Uint8Array<ArrayBuffer> {
  // locals: params 0–4 (srcA, srcB, dstA, dstB, n), 5 = p (byte position), 6 = x, 7 = y, then
  // 5 coefficients and 2 states per section
  const SA = 0, SB = 1, DA = 2, DB = 3, N = 4, P = 5, X = 6, Y = 7;
  const coef = (s: number, k: number) => 8 + 7 * s + k; // k: 0 b0, 1 b1, 2 b2, 3 a1, 4 a2
  const z1 = (s: number) => 8 + 7 * s + 5;
  const z2 = (s: number) => 8 + 7 * s + 6;
  const fn = (reverse: boolean): number[] => {
    const b = new Body();
    for (let s = 0; s < ns; s++) {
      for (let k = 0; k < 5; k++) b.i32(0).simd(SIMD.load64Splat, ...b.mem(3, COEF + 8 * (5 * s + k))).set(coef(s, k));
      b.i32(0).simd(SIMD.load, ...b.mem(4, STATE + 32 * s)).set(z1(s));
      b.i32(0).simd(SIMD.load, ...b.mem(4, STATE + 32 * s + 16)).set(z2(s));
    }
    // p runs over byte positions 0, 8, … (n − 1)·8, or backwards
    if (reverse) b.get(N).i32(3).op(OP.i32Shl).i32(8).op(OP.i32Sub).set(P);
    else b.i32(0).set(P);
    b.op(OP.block, 0x40, OP.loop, 0x40);
    if (reverse) b.get(P).i32(0).op(OP.i32LtS).op(OP.brIf, 1);
    else b.get(P).get(N).i32(3).op(OP.i32Shl).op(OP.i32GeS).op(OP.brIf, 1);
    // x = (A[p], B[p]): splat A's sample, then put B's into lane 1 (operands: address, vector)
    b.get(SA).get(P).op(OP.i32Add).simd(SIMD.load64Splat, ...b.mem(3, 0)).set(X);
    b.get(SB).get(P).op(OP.i32Add).get(X).simd(SIMD.load64Lane, ...b.mem(3, 0), 1).set(X);
    for (let s = 0; s < ns; s++) {
      // y = b0·x + z1
      b.get(coef(s, 0)).get(X).simd(SIMD.mul).get(z1(s)).simd(SIMD.add).set(Y);
      // z1 = (b1·x − a1·y) + z2
      b.get(coef(s, 1)).get(X).simd(SIMD.mul).get(coef(s, 3)).get(Y).simd(SIMD.mul).simd(SIMD.sub).get(z2(s)).simd(SIMD.add).set(z1(s));
      // z2 = b2·x − a2·y
      b.get(coef(s, 2)).get(X).simd(SIMD.mul).get(coef(s, 4)).get(Y).simd(SIMD.mul).simd(SIMD.sub).set(z2(s));
      // next section's input
      b.get(Y).set(X);
    }
    b.get(DA).get(P).op(OP.i32Add).get(X).simd(SIMD.store64Lane, ...b.mem(3, 0), 0);
    b.get(DB).get(P).op(OP.i32Add).get(X).simd(SIMD.store64Lane, ...b.mem(3, 0), 1);
    b.get(P).i32(reverse ? -8 : 8).op(OP.i32Add).set(P);
    b.op(OP.br, 0, OP.end, OP.end);
    for (let s = 0; s < ns; s++) {
      b.i32(0).get(z1(s)).simd(SIMD.store, ...b.mem(4, STATE + 32 * s));
      b.i32(0).get(z2(s)).simd(SIMD.store, ...b.mem(4, STATE + 32 * s + 16));
    }
    b.op(OP.end);
    return b.finish([[1, T_I32], [2 + 7 * ns, T_V128]]);
  };
  const i32x5 = vec([[T_I32], [T_I32], [T_I32], [T_I32], [T_I32]]);
  return wasmModule([
    ...section(1, vec([[0x60, ...i32x5, ...vec([])]])), // type 0: (i32 ×5) -> ()
    ...section(2, vec([[...name('env'), ...name('memory'), 0x02, 0x00, ...uleb(1)]])), // imported memory, ≥ 1 page
    ...section(3, vec([[0], [0]])), // two functions of type 0
    ...section(7, vec([[...name('fwd'), 0x00, 0], [...name('rev'), 0x00, 1]])),
    ...section(10, vec([fn(false), fn(true)])),
    ...functionNames(['sosPairForward', 'sosPairBackward']),
  ]);
}

/** Two channels filtered together through one cascade; see sosPairKernel. */
export interface SosPairKernel {
  /**
   * A zeroed Float64Array of n values in the kernel's memory. Every array given to run() as a
   * destination must come from here; the capacity is fixed when the kernel is made.
   */
  array(n: number): Float64Array;
  /**
   * Filter a[start..end) and b[start..end) in place (forwards, or backwards with reverse), from
   * and into the states sa and sb (scipy's zi layout, 2 values per section) — the same as
   * sosfiltInPlace on each channel. With `srcA`/`srcB`, the samples are read from there (at
   * srcStart…; copied in first when they are not in the kernel's memory) and written to a and b.
   */
  run(sa: Float64Array, a: Float64Array, sb: Float64Array, b: Float64Array, start: number, end: number, reverse: boolean,
    srcA?: Float64Array, srcB?: Float64Array, srcStart?: number): void;
}

/** The module per cascade length (null without WebAssembly SIMD: the scalar kernel is used). */
const compiled = compiledModules(moduleBytes);

/**
 * A two-channel kernel for this cascade with room for `capacity` samples of caller arrays in its
 * memory, or null where WebAssembly SIMD is not available or the cascade is longer than
 * MAX_SECTIONS. Assumes a0 = 1 in every section (checked by the public entry points, as the
 * scalar kernel).
 * @example const k = sosPairKernel(sos, 2 * n); const a = k.array(n), b = k.array(n); k.run(sa, a, sb, b, 0, n, false)
 */
export function sosPairKernel(sos: Sos, capacity: number): SosPairKernel | null {
  const ns = (sos.length / 6) | 0;
  if (ns < 1 || ns > MAX_SECTIONS) return null;
  const mod = compiled(ns);
  if (mod === null) return null;
  const bytes = DATA + 8 * capacity;
  if (bytes > 1 << 30) return null; // far beyond any block this project uses
  const memory = new WebAssembly.Memory({ initial: Math.ceil(bytes / 65536) });
  const inst = new WebAssembly.Instance(mod, { env: { memory } });
  type Fn = (srcA: number, srcB: number, dstA: number, dstB: number, n: number) => void;
  const ex = inst.exports as { fwd: Fn; rev: Fn };
  const heap = memory.buffer as ArrayBuffer;
  const f = new Float64Array(heap);
  for (let s = 0; s < ns; s++) {
    const o = 6 * s;
    f[COEF / 8 + 5 * s] = sos[o]!; f[COEF / 8 + 5 * s + 1] = sos[o + 1]!; f[COEF / 8 + 5 * s + 2] = sos[o + 2]!;
    f[COEF / 8 + 5 * s + 3] = sos[o + 4]!; f[COEF / 8 + 5 * s + 4] = sos[o + 5]!;
  }
  const st = STATE / 8;
  let next = DATA;
  const inside = (x: Float64Array) => x.buffer === heap;
  /** Byte address of the source samples in memory (copied into dst at start first when outside). */
  const address = (src: Float64Array, dst: Float64Array, srcStart: number, start: number, n: number): number => {
    if (src === dst) return dst.byteOffset + 8 * start;
    if (inside(src)) return src.byteOffset + 8 * srcStart;
    dst.set(src.subarray(srcStart, srcStart + n), start);
    return dst.byteOffset + 8 * start;
  };
  return {
    array(n) {
      if (next + 8 * n > bytes) throw new RangeError(`sosPairKernel: capacity of ${capacity} samples exceeded`);
      const a = new Float64Array(heap, next, n);
      next += 8 * n;
      return a;
    },
    run(sa, a, sb, b, start, end, reverse, srcA = a, srcB = b, srcStart = start) {
      if (!inside(a) || !inside(b)) throw new RangeError('sosPairKernel: destination arrays must come from array()');
      const n = end - start;
      if (n <= 0) return;
      const pa = address(srcA, a, srcStart, start, n), pb = address(srcB, b, srcStart, start, n);
      for (let s = 0; s < ns; s++) {
        f[st + 4 * s] = sa[2 * s]!; f[st + 4 * s + 1] = sb[2 * s]!;
        f[st + 4 * s + 2] = sa[2 * s + 1]!; f[st + 4 * s + 3] = sb[2 * s + 1]!;
      }
      (reverse ? ex.rev : ex.fwd)(pa, pb, a.byteOffset + 8 * start, b.byteOffset + 8 * start, n);
      for (let s = 0; s < ns; s++) {
        sa[2 * s] = f[st + 4 * s]!; sb[2 * s] = f[st + 4 * s + 1]!;
        sa[2 * s + 1] = f[st + 4 * s + 2]!; sb[2 * s + 1] = f[st + 4 * s + 3]!;
      }
    },
  };
}
