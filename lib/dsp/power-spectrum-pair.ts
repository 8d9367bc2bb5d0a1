// Power spectra |X_k|² of two real signals of length n at once, in WebAssembly SIMD: each
// 128-bit lane carries one signal through the same transform. Used for the short spectra of the
// quality screening and the fatigue epochs (one or two per channel-second), which were a quarter
// of the default analysis' time with fft.js.
//
// Method (textbook): the n real samples form n/2 complex values z_m = x_2m + i·x_2m+1, whose DFT
// Z (radix-2, decimation in time, bit-reversed input) gives the even and odd half-spectra
// E_k = (Z_k + conj Z_{n/2−k})/2 and O_k = (Z_k − conj Z_{n/2−k})/(2i), and X_k = E_k + W^k·O_k
// with W = e^{−2πi/n}, for k = 0 … n/2 (the unnormalized forward DFT, as fft.js and numpy).
// Checked against the DFT's definition and fft.js (test/dsp/power-spectrum-pair.test.ts).
import { Body, compiledModules, functionNames, name, OP, SIMD, section, T_I32, T_V128, uleb, vec, wasmModule } from '../wasm/module-writer.js';

/** Memory layout (bytes) for transform length n (M = n/2 complex points). */
function layout(n: number) {
  const M = n / 2;
  const TW = 0; // M/2 twiddles e^{−2πij/M}: (cos, −sin) f64 pairs
  const PT = TW + 16 * (M / 2); // M+1 post twiddles e^{−2πik/n}
  const REV = PT + 16 * (M + 1); // M bit-reversed indices (i32)
  const IN_A = align(REV + 4 * M), IN_B = IN_A + 8 * n; // the two inputs
  const ZR = IN_B + 8 * n, ZI = ZR + 16 * M; // complex work arrays, f64x2 lanes (A, B)
  const PA = ZI + 16 * M, PB = PA + 8 * (M + 1); // the two power spectra
  return { M, TW, PT, REV, IN_A, IN_B, ZR, ZI, PA, PB, end: PB + 8 * (M + 1) };
}

function align(v: number): number {
  return Math.ceil(v / 16) * 16;
}

function moduleBytes(n: number): Uint8Array<ArrayBuffer> {
  const L = layout(n), M = L.M;
  // locals: 0 p, 1 j, 2 half, 3 i, 4 tstep, 5 a, 6 b (i32); 7 vre, 8 vim, 9 wr, 10 wi, 11 br, 12 bi, 13 tr, 14 ti, 15 ar, 16 ai (v128)
  const P = 0, J = 1, HALF = 2, I = 3, TSTEP = 4, A = 5, B = 6;
  const VRE = 7, VIM = 8, WR = 9, WI = 10, BR = 11, BI = 12, TR = 13, TI = 14, AR = 15, AI = 16;
  const b = new Body();
  const mem3 = (off: number) => b.mem(3, off);
  const mem4 = (off: number) => b.mem(0, off);
  /** for (local = from; local < limit; local += step) body — limit and step as emitters. */
  const loop = (local: number, from: () => void, limit: () => void, step: () => void, body: () => void) => {
    from(); b.set(local);
    b.op(OP.block, 0x40, OP.loop, 0x40);
    b.get(local); limit(); b.op(OP.i32GeS, OP.brIf, 1);
    body();
    b.get(local); step(); b.op(OP.i32Add); b.set(local);
    b.op(OP.br, 0, OP.end, OP.end);
  };
  // 1. bit-reversed load: z[rev p] = (x[2p], x[2p+1]) for both signals
  loop(P, () => b.i32(0), () => b.i32(M), () => b.i32(1), () => {
    b.get(P).i32(2).op(OP.i32Shl).op(OP.i32Load, ...b.mem(2, L.REV)).i32(4).op(OP.i32Shl).set(J); // j = 16·rev[p]
    b.get(P).i32(4).op(OP.i32Shl).set(A); // 16p = byte offset of x[2p]
    b.get(A).simd(SIMD.load64Splat, ...mem3(L.IN_A)).set(VRE);
    b.get(A).get(VRE).simd(SIMD.load64Lane, ...mem3(L.IN_B), 1).set(VRE);
    b.get(A).simd(SIMD.load64Splat, ...mem3(L.IN_A + 8)).set(VIM);
    b.get(A).get(VIM).simd(SIMD.load64Lane, ...mem3(L.IN_B + 8), 1).set(VIM);
    b.get(J).get(VRE).simd(SIMD.store, ...mem4(L.ZR));
    b.get(J).get(VIM).simd(SIMD.store, ...mem4(L.ZI));
  });
  // 2. radix-2 stages: half = 1, 2, … M/2; twiddle step M/(2·half)
  b.i32(M / 2).set(TSTEP);
  loop(HALF, () => b.i32(1), () => b.i32(M), () => b.get(HALF), () => {
    loop(I, () => b.i32(0), () => b.i32(M), () => b.get(HALF).i32(1).op(OP.i32Shl), () => {
      loop(J, () => b.i32(0), () => b.get(HALF), () => b.i32(1), () => {
        // w = tw[j·tstep]
        b.get(J).get(TSTEP).op(OP.i32Mul).i32(4).op(OP.i32Shl).set(P);
        b.get(P).simd(SIMD.load64Splat, ...mem3(L.TW)).set(WR);
        b.get(P).simd(SIMD.load64Splat, ...mem3(L.TW + 8)).set(WI);
        b.get(I).get(J).op(OP.i32Add).i32(4).op(OP.i32Shl).set(A);
        b.get(A).get(HALF).i32(4).op(OP.i32Shl).op(OP.i32Add).set(B);
        b.get(B).simd(SIMD.load, ...mem4(L.ZR)).set(BR);
        b.get(B).simd(SIMD.load, ...mem4(L.ZI)).set(BI);
        // t = w·z_b
        b.get(WR).get(BR).simd(SIMD.mul).get(WI).get(BI).simd(SIMD.mul).simd(SIMD.sub).set(TR);
        b.get(WR).get(BI).simd(SIMD.mul).get(WI).get(BR).simd(SIMD.mul).simd(SIMD.add).set(TI);
        b.get(A).simd(SIMD.load, ...mem4(L.ZR)).set(AR);
        b.get(A).simd(SIMD.load, ...mem4(L.ZI)).set(AI);
        b.get(B).get(AR).get(TR).simd(SIMD.sub).simd(SIMD.store, ...mem4(L.ZR));
        b.get(B).get(AI).get(TI).simd(SIMD.sub).simd(SIMD.store, ...mem4(L.ZI));
        b.get(A).get(AR).get(TR).simd(SIMD.add).simd(SIMD.store, ...mem4(L.ZR));
        b.get(A).get(AI).get(TI).simd(SIMD.add).simd(SIMD.store, ...mem4(L.ZI));
      });
    });
    b.get(TSTEP).i32(1).op(OP.i32ShrU).set(TSTEP);
  });
  // 3. spectra: k = 0 and k = M from z_0; 1 ≤ k < M from z_k and z_{M−k}
  const storePower = (re: number, im: number, kBytes8: () => void) => {
    b.get(re).get(re).simd(SIMD.mul).get(im).get(im).simd(SIMD.mul).simd(SIMD.add).set(TR);
    kBytes8(); b.get(TR).simd(SIMD.store64Lane, ...mem3(L.PA), 0);
    kBytes8(); b.get(TR).simd(SIMD.store64Lane, ...mem3(L.PB), 1);
  };
  b.i32(0).simd(SIMD.load, ...mem4(L.ZR)).set(AR);
  b.i32(0).simd(SIMD.load, ...mem4(L.ZI)).set(AI);
  b.get(AR).get(AI).simd(SIMD.add).set(BR);
  b.get(AR).get(AI).simd(SIMD.sub).set(BI);
  b.get(BR).get(BR).simd(SIMD.mul).set(TR);
  b.i32(0).get(TR).simd(SIMD.store64Lane, ...mem3(L.PA), 0);
  b.i32(0).get(TR).simd(SIMD.store64Lane, ...mem3(L.PB), 1);
  b.get(BI).get(BI).simd(SIMD.mul).set(TR);
  b.i32(8 * M).get(TR).simd(SIMD.store64Lane, ...mem3(L.PA), 0);
  b.i32(8 * M).get(TR).simd(SIMD.store64Lane, ...mem3(L.PB), 1);
  b.f64(0.5).simd(SIMD.f64x2Splat).set(WI); // 0.5 in both lanes (WI reused as a constant)
  loop(P, () => b.i32(1), () => b.i32(M), () => b.i32(1), () => {
    b.get(P).i32(4).op(OP.i32Shl).set(A); // 16k
    b.i32(M).get(P).op(OP.i32Sub).i32(4).op(OP.i32Shl).set(B); // 16(M−k)
    b.get(A).simd(SIMD.load, ...mem4(L.ZR)).set(AR);
    b.get(A).simd(SIMD.load, ...mem4(L.ZI)).set(AI);
    b.get(B).simd(SIMD.load, ...mem4(L.ZR)).set(BR);
    b.get(B).simd(SIMD.load, ...mem4(L.ZI)).set(BI);
    // E = ((ar + br)/2, (ai − bi)/2); O = ((ai + bi)/2, (br − ar)/2)
    b.get(WI).get(AR).get(BR).simd(SIMD.add).simd(SIMD.mul).set(VRE); // Er
    b.get(WI).get(AI).get(BI).simd(SIMD.sub).simd(SIMD.mul).set(VIM); // Ei
    b.get(WI).get(AI).get(BI).simd(SIMD.add).simd(SIMD.mul).set(TR); // Or
    b.get(WI).get(BR).get(AR).simd(SIMD.sub).simd(SIMD.mul).set(TI); // Oi
    // w = post twiddle k
    b.get(A).simd(SIMD.load64Splat, ...mem3(L.PT)).set(WR);
    b.get(A).simd(SIMD.load64Splat, ...mem3(L.PT + 8)).set(AR); // wi (AR reused)
    // X = E + w·O
    b.get(VRE).get(WR).get(TR).simd(SIMD.mul).get(AR).get(TI).simd(SIMD.mul).simd(SIMD.sub).simd(SIMD.add).set(BR);
    b.get(VIM).get(WR).get(TI).simd(SIMD.mul).get(AR).get(TR).simd(SIMD.mul).simd(SIMD.add).simd(SIMD.add).set(BI);
    storePower(BR, BI, () => b.get(P).i32(3).op(OP.i32Shl));
  });
  b.op(OP.end);
  const fn = b.finish([[7, T_I32], [10, T_V128]]);
  return wasmModule([
    ...section(1, vec([[0x60, ...vec([]), ...vec([])]])),
    ...section(2, vec([[...name('env'), ...name('memory'), 0x02, 0x00, ...uleb(1)]])),
    ...section(3, vec([[0]])),
    ...section(7, vec([[...name('run'), 0x00, 0]])),
    ...section(10, vec([fn])),
    ...functionNames(['powerSpectrumPair']),
  ]);
}

/** The module per transform length (null without WebAssembly SIMD). */
const compiled = compiledModules(moduleBytes);

/** Two power spectra at once; write the inputs, call run(), read the spectra. */
export interface PowerSpectrumPair {
  readonly n: number;
  /** The two input signals (length n; write them before run()). */
  readonly inA: Float64Array;
  readonly inB: Float64Array;
  /** |X_k|², k = 0 … n/2, of each input after run(). */
  readonly powA: Float64Array;
  readonly powB: Float64Array;
  run(): void;
}

/**
 * A two-signal power-spectrum kernel for length n (a power of two, 8 … 2^20), or null where
 * WebAssembly SIMD is not available (callers then use fft.js).
 * @example const k = powerSpectrumPair(2048)!; k.inA.set(a); k.inB.set(b); k.run(); use(k.powA, k.powB);
 */
export function powerSpectrumPair(n: number): PowerSpectrumPair | null {
  if (!(Number.isInteger(n) && n >= 8 && n <= 1 << 20 && (n & (n - 1)) === 0)) return null;
  const mod = compiled(n);
  if (mod === null) return null;
  const L = layout(n), M = L.M;
  const memory = new WebAssembly.Memory({ initial: Math.ceil(L.end / 65536) });
  const run = (new WebAssembly.Instance(mod, { env: { memory } }).exports as { run: () => void }).run;
  const heap = memory.buffer as ArrayBuffer;
  const f = new Float64Array(heap);
  for (let j = 0; j < M / 2; j++) { f[L.TW / 8 + 2 * j] = Math.cos((2 * Math.PI * j) / M); f[L.TW / 8 + 2 * j + 1] = -Math.sin((2 * Math.PI * j) / M); }
  for (let k = 0; k <= M; k++) { f[L.PT / 8 + 2 * k] = Math.cos((2 * Math.PI * k) / n); f[L.PT / 8 + 2 * k + 1] = -Math.sin((2 * Math.PI * k) / n); }
  const rev = new Int32Array(heap, L.REV, M);
  const bits = Math.log2(M);
  for (let p = 0; p < M; p++) {
    let r = 0;
    for (let t = 0; t < bits; t++) r |= ((p >> t) & 1) << (bits - 1 - t);
    rev[p] = r;
  }
  return {
    n,
    inA: new Float64Array(heap, L.IN_A, n), inB: new Float64Array(heap, L.IN_B, n),
    powA: new Float64Array(heap, L.PA, M + 1), powB: new Float64Array(heap, L.PB, M + 1),
    run,
  };
}
