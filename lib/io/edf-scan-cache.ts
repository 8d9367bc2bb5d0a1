// The result of an EDF+ annotation scan, kept per file identity for the life of the process. An
// EDF+ file's annotations (and, for EDF+D, its record times) sit in every data record, so opening
// one means one pass over the whole file: for an 8-hour recording, 460 MB. An analysis opens the
// same file several times (job check, reference and rest spans, every channel group, the input
// list); with the cache it is scanned once per process, and the main thread hands its scan to
// the worker threads with each job (scanEntryFor / primeScans). Only settled files are
// remembered (see SETTLED_MS), so a file rewritten in place is always read afresh.
import { statSync, type Stats } from 'node:fs';
import type { Annotation } from './recording.js';

/** What scanAnnotations finds: every annotation, record start times (EDF+D), sub-second start. */
export interface EdfScan {
  annotations: Annotation[];
  recordStarts: Float64Array | null;
  subsecond: number;
}

/** Files remembered at once (the oldest is dropped first). */
const MAX_FILES = 32;
const cache = new Map<string, EdfScan>();

/** Identity of a file's content as far as the file system tells: device, inode, size, modification time. */
export function scanKey(st: Pick<Stats, 'dev' | 'ino' | 'size' | 'mtimeMs'>): string {
  return `${st.dev}:${st.ino}:${st.size}:${st.mtimeMs}`;
}

/** The remembered scan for this identity (annotations copied, so callers may change them), or null. */
export function cachedScan(key: string): EdfScan | null {
  const s = cache.get(key);
  if (!s) return null;
  return { annotations: s.annotations.map((a) => ({ ...a })), recordStarts: s.recordStarts, subsecond: s.subsecond };
}

/**
 * Files modified less than this long before their scan are not remembered: a file rewritten
 * within one tick of the file system's clock could keep its size and time stamp ("racy"
 * entries), and recordings being analyzed are not that fresh.
 */
export const SETTLED_MS = 3000;

/** True when a file with this modification time may be remembered now. */
export function settled(mtimeMs: number, now = Date.now()): boolean {
  return now - mtimeMs > SETTLED_MS;
}

/** Remember a scan (its arrays must not be changed afterwards; cachedScan hands out copies). */
export function rememberScan(key: string, scan: EdfScan): void {
  cache.delete(key);
  cache.set(key, { annotations: scan.annotations.map((a) => ({ ...a })), recordStarts: scan.recordStarts, subsecond: scan.subsecond });
  while (cache.size > MAX_FILES) cache.delete(cache.keys().next().value!);
}

/** The remembered scan of a file as [key, scan] to send to another thread, or null (not scanned, or changed since). */
export function scanEntryFor(file: string): [string, EdfScan] | null {
  let key: string;
  try {
    key = scanKey(statSync(file));
  } catch {
    return null;
  }
  const s = cache.get(key);
  return s ? [key, s] : null;
}

/** Remember scans made by another thread (entries from scanEntryFor). */
export function primeScans(entries: readonly [string, EdfScan][]): void {
  for (const [key, scan] of entries) rememberScan(key, scan);
}
