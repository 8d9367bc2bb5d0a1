// Atomic file output: write a temporary file beside the target, fsync, then rename over it, so a
// killed run leaves either the previous file or the complete new one — never half a file.
import { closeSync, fsyncSync, openSync, readdirSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { UsageError } from '../errors.js';
import { outputMsg } from '../messages.js';

/** File-system failures that mean "this output path cannot be written here" (exit 2, not a bug). */
const USER_FS_ERRORS = new Set(['EACCES', 'EPERM', 'EROFS', 'ENOSPC', 'EDQUOT', 'ENOENT', 'ENOTDIR', 'EISDIR', 'ENAMETOOLONG', 'ENOTEMPTY', 'EEXIST', 'EBUSY']);

/**
 * Refuse output paths that an atomic rename would mishandle: an existing folder, a device, pipe or
 * socket (the rename would replace it with a regular file), or a folder that does not exist.
 * @throws UsageError naming the path
 */
export function checkOutputPath(target: string): void {
  let st;
  try { st = statSync(target); } catch { st = null; }
  if (st) {
    if (st.isDirectory()) throw new UsageError(outputMsg.isFolder(target));
    if (!st.isFile()) throw new UsageError(outputMsg.notRegular(target));
    return;
  }
  let dir;
  try { dir = statSync(dirname(target)); } catch { dir = null; }
  if (!dir || !dir.isDirectory()) throw new UsageError(outputMsg.noFolder(target));
}

/** A file-system error on `target` as a one-line user error when it is one, else unchanged. */
function asUserError(e: unknown, target: string): unknown {
  const code = (e as NodeJS.ErrnoException)?.code;
  return code !== undefined && USER_FS_ERRORS.has(code) ? new UsageError(outputMsg.cannotWrite(target, code)) : e;
}

/** Temporary path beside `target` (same folder, so rename stays on one file system). */
export function tempPathFor(target: string): string {
  return join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
}

/**
 * Write `data` to `target` atomically.
 * @example writeAtomic('out/results.json', JSON.stringify(results))
 */
export function writeAtomic(target: string, data: string | Uint8Array): void {
  checkOutputPath(target);
  const tmp = tempPathFor(target);
  let fd: number;
  try { fd = openSync(tmp, 'w'); } catch (e) { throw asUserError(e, target); }
  try {
    const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
    let off = 0;
    while (off < bytes.length) off += writeSync(fd, bytes, off, bytes.length - off);
    fsyncSync(fd);
  } catch (e) {
    closeSync(fd);
    try { unlinkSync(tmp); } catch { /* already gone */ }
    throw asUserError(e, target);
  }
  closeSync(fd);
  try {
    renameSync(tmp, target);
  } catch (e) {
    try { unlinkSync(tmp); } catch { /* already gone */ }
    throw asUserError(e, target);
  }
}

/**
 * Write several files as one step as far as a file system allows: every temporary file is written
 * and synced first, then all are renamed into place one right after the other. A failure before the
 * renames leaves every target untouched and removes the temporary files; a kill can only land
 * between two renames (microseconds), not while a file is being written.
 * @example writeAtomicSet([{ target: 'out/results.json', data: json }, { target: 'out/segments.csv', data: csv }])
 */
export function writeAtomicSet(files: readonly { target: string; data: string | Uint8Array }[]): void {
  for (const f of files) checkOutputPath(f.target);
  const written: string[] = [];
  try {
    for (const f of files) {
      const tmp = tempPathFor(f.target);
      const fd = openSync(tmp, 'w');
      written.push(tmp);
      try {
        const bytes = typeof f.data === 'string' ? Buffer.from(f.data, 'utf8') : f.data;
        let off = 0;
        while (off < bytes.length) off += writeSync(fd, bytes, off, bytes.length - off);
        fsyncSync(fd);
      } finally {
        closeSync(fd);
      }
    }
  } catch (e) {
    for (const t of written) { try { unlinkSync(t); } catch { /* already gone */ } }
    throw asUserError(e, files[written.length - 1]?.target ?? files[0].target);
  }
  files.forEach((f, i) => {
    try {
      renameSync(written[i], f.target);
    } catch (e) {
      for (const t of written.slice(i)) { try { unlinkSync(t); } catch { /* already gone */ } }
      throw asUserError(e, f.target);
    }
  });
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
    checkOutputPath(target);
    this.tmp = tempPathFor(target);
    try { this.fd = openSync(this.tmp, 'w'); } catch (e) { throw asUserError(e, target); }
  }

  write(bytes: Uint8Array): void {
    if (this.fd === null) throw new Error('AtomicFile: write after commit/abort');
    let off = 0;
    try {
      while (off < bytes.length) off += writeSync(this.fd, bytes, off, bytes.length - off);
    } catch (e) { throw asUserError(e, this.target); }
  }

  /** Write `bytes` at an absolute position (e.g. to patch a header once the record count is known). */
  writeAt(bytes: Uint8Array, position: number): void {
    if (this.fd === null) throw new Error('AtomicFile: write after commit/abort');
    let off = 0;
    try {
      while (off < bytes.length) off += writeSync(this.fd, bytes, off, bytes.length - off, position + off);
    } catch (e) { throw asUserError(e, this.target); }
  }

  commit(): void {
    if (this.fd === null) return;
    try { fsyncSync(this.fd); } catch (e) { this.abort(); throw asUserError(e, this.target); }
    closeSync(this.fd);
    this.fd = null;
    try {
      renameSync(this.tmp, this.target);
    } catch (e) {
      try { unlinkSync(this.tmp); } catch { /* already gone */ }
      throw asUserError(e, this.target);
    }
  }

  abort(): void {
    if (this.fd === null) return;
    closeSync(this.fd);
    this.fd = null;
    try { unlinkSync(this.tmp); } catch { /* already gone */ }
  }
}
