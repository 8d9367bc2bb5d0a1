// A scratch folder for robustness runs: on /dev/shm (memory-backed, so the fsync of every atomic
// write costs nothing) when it exists, else in the system temporary folder.
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** Make a new empty scratch folder named `prefix…`; the caller removes it. */
export function scratchDir(prefix: string): string {
  const base = existsSync('/dev/shm') ? '/dev/shm' : tmpdir();
  try {
    return mkdtempSync(join(base, prefix));
  } catch {
    return mkdtempSync(join(tmpdir(), prefix));
  }
}
