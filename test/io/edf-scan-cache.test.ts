import { copyFileSync, mkdtempSync, readFileSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cachedScan, primeScans, scanEntryFor, scanKey, settled } from '../../lib/io/edf-scan-cache.js';
import { openRecording } from '../../lib/io/open-recording.js';

// Input: shared/fixtures/edf/emg_3sig.edf (EDFlib 1.23, 5 annotations; truth in its .truth.json).
const fixture = new URL('../../../shared/fixtures/edf/emg_3sig.edf', import.meta.url);
const truth = JSON.parse(readFileSync(new URL('../../../shared/fixtures/edf/emg_3sig.edf.truth.json', import.meta.url), 'utf8')) as { annotations: { text: string }[] };
const dir = mkdtempSync(join(tmpdir(), 'shiftload-scan-cache-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function texts(file: string): Promise<string[]> {
  const rec = await openRecording(file);
  const t = rec.info.annotations.map((a) => a.text);
  await rec.close();
  return t;
}

/** A copy of the fixture whose time stamps lie well in the past (a settled file, which may be remembered). */
function settledCopy(name: string): string {
  const f = join(dir, name);
  copyFileSync(fixture, f);
  const past = new Date(Date.now() - 60_000);
  utimesSync(f, past, past);
  return f;
}

describe('EDF+ annotation scans remembered per file identity', () => {
  it('a second open gives the same annotations (EDFlib truth), as copies the caller may change', async () => {
    const f = settledCopy('a.edf');
    const want = truth.annotations.map((a) => a.text);
    expect(await texts(f)).toEqual(want);
    const rec = await openRecording(f);
    rec.info.annotations[0]!.text = 'changed by the caller';
    await rec.close();
    expect(await texts(f)).toEqual(want);
  });

  it('a file changed in place (same size) is scanned again: after a new time stamp, and when fresh even with its old one', async () => {
    const f = settledCopy('b.edf');
    const before = await texts(f);
    const bytes = readFileSync(f);
    const first = truth.annotations[0]!.text;
    const at = bytes.indexOf(Buffer.from(first, 'utf8'));
    expect(at).toBeGreaterThan(0);
    const swapped = Buffer.from(first.split('').reverse().join(''), 'utf8');
    swapped.copy(bytes, at); // same length: the size does not change
    writeFileSync(f, bytes);
    const after = await texts(f); // rewritten just now: never taken from the cache
    expect(after[0]).toBe(first.split('').reverse().join(''));
    expect(after.slice(1)).toEqual(before.slice(1));
    expect(settled(Date.now())).toBe(false);
    expect(settled(Date.now() - 10_000)).toBe(true);
    // settled again with another old time stamp: a new identity, so the new content is read
    Buffer.from(first, 'utf8').copy(bytes, at);
    writeFileSync(f, bytes);
    const older = new Date(Date.now() - 120_000);
    utimesSync(f, older, older);
    expect(await texts(f)).toEqual(before);
  });

  it('scanEntryFor hands the scan to another thread: primeScans makes it known there; unknown files give null', async () => {
    const f = settledCopy('c.edf');
    expect(scanEntryFor(join(dir, 'missing.edf'))).toBeNull();
    await texts(f);
    const entry = scanEntryFor(f)!;
    expect(entry[0]).toBe(scanKey((await import('node:fs')).statSync(f)));
    primeScans([[entry[0] + ':other', entry[1]]]);
    expect(cachedScan(entry[0] + ':other')!.annotations.map((a) => a.text)).toEqual(truth.annotations.map((a) => a.text));
  });
});
