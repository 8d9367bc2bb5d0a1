// Bench: zero-phase band-pass + RMS envelope throughput on a long synthetic recording, streamed in
// chunks and generated on the fly (never held whole). Prints M samples/s and peak RSS.
// Run alone: node dist/bench/dsp-throughput.js [hours] [channels] [fs] [50]   (defaults 8 h, 4 ch,
// 2000 Hz, no notch; a 4th argument 50 adds 50 Hz notches at 50, 100, 150 Hz)
import { pathToFileURL } from 'node:url';
import { EnvelopePipeline } from '../dsp/envelope-pipeline.js';

export interface DspBenchResult {
  name: string;
  samples: number;
  /** wall-clock seconds */
  seconds: number;
  /** CPU seconds of this process (user + system): the fair measure when other work shares the cores */
  cpu_seconds: number;
  /** per wall-clock second */
  msamples_per_s: number;
  /** per CPU second */
  msamples_per_cpu_s: number;
  peak_rss_mb: number;
  envelope_samples: number;
}

/** Run the bench: `hours` of `channels` × fs Hz through EnvelopePipeline (20–450 Hz, 0.1 s at 20 Hz). */
export function runDspThroughput(hours = 8, channels = 4, fs = 2000, mainsHz: 50 | null = null): DspBenchResult {
  const chunk = 65536;
  const total = Math.round(hours * 3600 * fs);
  const pipes = Array.from({ length: channels }, () => new EnvelopePipeline({ fs, band_hz: [20, 450], mains_hz: mainsHz, rms_window_s: 0.1, rate_hz: 20 }));
  const buf = new Float64Array(chunk);
  // cheap deterministic test signal: xorshift noise with a DC offset and a slow amplitude change
  let s = 0x9e3779b9 | 0;
  let peak = process.memoryUsage().rss;
  let envCount = 0;
  const t0 = process.hrtime.bigint();
  const c0 = process.cpuUsage();
  for (let done = 0; done < total; done += chunk) {
    const n = Math.min(chunk, total - done);
    const x = n === chunk ? buf : buf.subarray(0, n);
    const amp = (30 + 20 * Math.sin(done * 1e-5)) / 2147483648; // amplitude changes slowly, chunk by chunk
    for (let c = 0; c < channels; c++) {
      for (let i = 0; i < n; i++) {
        s ^= s << 13; s ^= s >>> 17; s ^= s << 5;
        x[i] = 200 + s * amp;
      }
      envCount += pipes[c].push(x).length;
    }
    if ((done / chunk) % 64 === 0) peak = Math.max(peak, process.memoryUsage().rss);
  }
  for (const p of pipes) envCount += p.flush().length;
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  const cu = process.cpuUsage(c0);
  const cpuSeconds = (cu.user + cu.system) / 1e6;
  peak = Math.max(peak, process.memoryUsage().rss);
  const samples = total * channels;
  return {
    name: `dsp: ${hours} h × ${channels} ch × ${fs} Hz, zero-phase 20–450 Hz${mainsHz ? ` + ${mainsHz} Hz notches` : ''} + RMS envelope`,
    samples, seconds, cpu_seconds: cpuSeconds, msamples_per_s: samples / seconds / 1e6, msamples_per_cpu_s: samples / cpuSeconds / 1e6, peak_rss_mb: peak / 1048576, envelope_samples: envCount,
  };
}

// run when executed directly
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const [h, c, f, mains] = process.argv.slice(2).map(Number);
  const r = runDspThroughput(h || 8, c || 4, f || 2000, mains === 50 ? 50 : null);
  process.stdout.write(`${r.name}\n  ${(r.samples / 1e6).toFixed(1)} M samples in ${r.seconds.toFixed(2)} s wall / ${r.cpu_seconds.toFixed(2)} s CPU: ` +
    `${r.msamples_per_s.toFixed(1)} M samples/s wall, ${r.msamples_per_cpu_s.toFixed(1)} per CPU second (signal generation included), ` +
    `peak RSS ${r.peak_rss_mb.toFixed(0)} MB, ${r.envelope_samples} envelope samples\n`);
}
