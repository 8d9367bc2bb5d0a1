// Atomic file output: write a temporary file beside the target, fsync, then rename over it, so a
// killed run leaves either the previous file or the complete new one — never half a file.
import { closeSync, fsyncSync, openSync, readdirSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/** Temporary path beside `target` (same folder, so rename stays on one file system). */
export function tempPathFor(target: string): string {
  return join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
}

/**
 * Write `data` to `target` atomically.
 * @example writeAtomic('out/results.json', JSON.stringify(results))
 */
export function writeAtomic(target: string, data: string | Uint8Array): void {
  const tmp = tempPathFor(target);
  const fd = openSync(tmp, 'w');
  try {
    const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
    let off = 0;
    while (off < bytes.length) off += writeSync(fd, bytes, off, bytes.length - off);
    fsyncSync(fd);
  } catch (e) {
    closeSync(fd);
    try { unlinkSync(tmp); } catch { /* already gone */ }
    throw e;
  }
  closeSync(fd);
  try {
    renameSync(tmp, target);
  } catch (e) {
    try { unlinkSync(tmp); } catch { /* already gone */ }
    throw e;
  }
}

/** True when a process with this id is running (signal 0 probes without sending anything). */
function processAlive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Remove temporary files that a killed run left beside the outputs `names` in `dir`
 * (".name.PID.tmp" whose process no longer runs). Returns the names removed.
 * @example removeStaleTemps('out', ['results.json', 'segments.csv'])
 */
export function removeStaleTemps(dir: string, names: readonly string[]): string[] {
  const removed: string[] = [];
  let entries: string[];
  try { entries = readdirSync(dir); } catch { return removed; }
  for (const e of entries) {
    const m = /^\.(.+)\.(\d+)\.tmp$/.exec(e);
    if (!m || !names.includes(m[1]) || processAlive(Number(m[2]))) continue;
    try { unlinkSync(join(dir, e)); removed.push(e); } catch { /* gone or not ours */ }
  }
  return removed;
}

/**
 * A large output written in pieces, made visible only by `commit()` (rename); `abort()` removes
 * the temporary file. Use for outputs too big to hold in memory (converted recordings).
 */
export class AtomicFile {
  private readonly tmp: string;
  private fd: number | null;
  constructor(readonly target: string) {
    this.tmp = tempPathFor(target);
    this.fd = openSync(this.tmp, 'w');
  }

  write(bytes: Uint8Array): void {
    if (this.fd === null) throw new Error('AtomicFile: write after commit/abort');
    let off = 0;
    while (off < bytes.length) off += writeSync(this.fd, bytes, off, bytes.length - off);
  }

  /** Write `bytes` at an absolute position (e.g. to patch a header once the record count is known). */
  writeAt(bytes: Uint8Array, position: number): void {
    if (this.fd === null) throw new Error('AtomicFile: write after commit/abort');
    let off = 0;
    while (off < bytes.length) off += writeSync(this.fd, bytes, off, bytes.length - off, position + off);
  }

  commit(): void {
    if (this.fd === null) return;
    fsyncSync(this.fd);
    closeSync(this.fd);
    this.fd = null;
    try {
      renameSync(this.tmp, this.target);
    } catch (e) {
      try { unlinkSync(this.tmp); } catch { /* already gone */ }
      throw e;
    }
  }

  abort(): void {
    if (this.fd === null) return;
    closeSync(this.fd);
    this.fd = null;
    try { unlinkSync(this.tmp); } catch { /* already gone */ }
  }
}
