// A progress line on stderr, drawn only when stderr is a terminal (silent in pipes, files and CI),
// throttled to 10 Hz, cleared on stop.
import type { CliIO } from './cli-io.js';

export class ProgressBar {
  private last = 0;
  private active = false;

  constructor(private readonly io: CliIO, private readonly label: string) {}

  /** Show `done` of `total` (any unit) and a short note (e.g. the file being read). */
  update(done: number, total: number, note = ''): void {
    if (!this.io.errIsTTY) return;
    const now = Date.now();
    if (now - this.last < 100 && done < total) return;
    this.last = now;
    this.active = true;
    const cols = Math.max(40, (process.stderr.columns || 80) - 1);
    const frac = total > 0 ? Math.min(1, Math.max(0, done / total)) : 0;
    const pct = `${(frac * 100).toFixed(0).padStart(3)} %`;
    const width = Math.max(10, Math.min(30, cols - this.label.length - pct.length - 10));
    const filled = Math.round(frac * width);
    let line = `${this.label} [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${pct} ${note}`;
    if (line.length > cols) line = line.slice(0, cols);
    this.io.err(`\r\x1b[2K${line}`);
  }

  stop(): void {
    if (this.active) this.io.err('\r\x1b[2K');
    this.active = false;
  }
}
