// A killed analysis never leaves half a report: `bin/shiftload.js analyze` is SIGKILLed while it
// writes (the moment a temporary output file appears) and while it computes; afterwards every
// output under its final name holds either the previous run's bytes or the complete new bytes.
// Outputs go to the system temporary folder (a disk, so fsync makes the write window visible).
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { ROBUST_FIXTURES_DIR, writeTinyRecording } from '../../lib/robust/seed-files.js';

const bin = fileURLToPath(new URL('../../bin/shiftload.js', import.meta.url));
const NAMES = ['results.json', 'segments.csv', 'report.pdf'];
const dir = mkdtempSync(join(tmpdir(), 'shiftload-kill-'));
const out = join(dir, 'out');
const job = join(dir, 'job.yaml');
const before = new Map<string, Buffer>();
const after = new Map<string, Buffer>();

function jobText(title: string): string {
  return readFileSync(join(ROBUST_FIXTURES_DIR, 'tiny-job.yaml'), 'utf8')
    .replaceAll('tiny.edf', 'long.edf')
    .replace('title: robustness seed', `title: ${title}`)
    .replace('start_s: 11, end_s: 12', 'start_s: 11, end_s: 900');
}

async function analyzeInProcess(o: string): Promise<void> {
  const io = bufferIO();
  const code = await main(['analyze', job, '-o', o, '--force'], io);
  if (code !== 0) throw new Error(io.stderr);
}

beforeAll(async () => {
  writeTinyRecording(dir, 'long.edf', 900); // 15 min, 2 signals at 500 Hz
  // the bytes a complete new run writes (title "second run") …
  writeFileSync(job, jobText('second run'));
  await analyzeInProcess(join(dir, 'new'));
  for (const f of NAMES) after.set(f, readFileSync(join(dir, 'new', f)));
  // … and the previous results in the output folder (title "first run")
  writeFileSync(job, jobText('first run'));
  await analyzeInProcess(out);
  for (const f of NAMES) before.set(f, readFileSync(join(out, f)));
  writeFileSync(job, jobText('second run'));
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function restorePrevious(): void {
  rmSync(out, { recursive: true, force: true });
  mkdirSync(out);
  for (const f of NAMES) writeFileSync(join(out, f), before.get(f)!);
}

/**
 * Start the analysis in a child process and SIGKILL it once `when()` says so (polled without
 * yielding, so the child cannot finish in between); returns whether the kill came before the end.
 */
async function killWhen(when: (entries: string[]) => boolean): Promise<{ killed: boolean; entries: string[] }> {
  const child = spawn(process.execPath, [bin, 'analyze', job, '-o', out, '--force'], { stdio: 'ignore' });
  const exited = new Promise<void>((res) => child.on('exit', () => res()));
  const finished = () => NAMES.every((f) => { try { return readFileSync(join(out, f)).equals(after.get(f)!); } catch { return false; } });
  const t0 = Date.now();
  let killed = false;
  while (Date.now() - t0 < 60_000) {
    const entries = readdirSync(out);
    if (when(entries)) { child.kill('SIGKILL'); killed = true; break; }
    if (finished()) break;
  }
  if (!killed) child.kill('SIGKILL');
  await exited;
  return { killed, entries: readdirSync(out) };
}

function expectWholeFiles(entries: string[]): void {
  for (const f of NAMES) {
    const b = readFileSync(join(out, f));
    const whole = b.equals(before.get(f)!) || b.equals(after.get(f)!);
    expect(whole, `${f} is neither the previous nor the new complete file (${b.length} bytes)`).toBe(true);
  }
  // nothing else is visible except temporary files beginning with '.'
  expect(entries.filter((e) => !NAMES.includes(e) && !e.startsWith('.'))).toEqual([]);
}

describe('analyze killed with SIGKILL', () => {
  it('the previous and the new run differ (otherwise the test could not tell them apart)', () => {
    for (const f of ['results.json']) expect(before.get(f)!.equals(after.get(f)!)).toBe(false);
  });

  it('killed while an output is being written (a temporary file exists): each output is the previous or the complete new file', async () => {
    let caught = 0;
    let left: string[] = [];
    // try until a kill verifiably landed inside the write window (temporary files left behind);
    // on a busy machine the child may finish its renames between the poll and the kill
    for (let attempt = 0; attempt < 8 && left.length === 0; attempt++) {
      restorePrevious();
      const r = await killWhen((entries) => entries.some((e) => e.startsWith('.') && e.endsWith('.tmp')));
      if (r.killed) caught++;
      expectWholeFiles(r.entries);
      left = r.entries.filter((e) => e.endsWith('.tmp'));
    }
    // the kill must have come before the end at least once, or this test proves nothing
    expect(caught).toBeGreaterThan(0);
    // SIGKILL leaves the temporary files (no handler can run); the next analyze removes them
    await analyzeInProcess(out);
    expect(readdirSync(out).filter((e) => e.endsWith('.tmp'))).toEqual([]);
    for (const f of NAMES) expect(readFileSync(join(out, f)).equals(after.get(f)!)).toBe(true);
  }, 180_000);

  it('killed while computing (before any output is written): the previous outputs are byte-identical', async () => {
    restorePrevious();
    let polls = 0;
    // kill as soon as the child has had a moment to start reading (a few thousand polls)
    const r = await killWhen(() => ++polls > 2000);
    expectWholeFiles(r.entries);
    if (r.killed && !r.entries.some((e) => e.endsWith('.tmp'))) {
      for (const f of NAMES) expect(readFileSync(join(out, f)).equals(before.get(f)!)).toBe(true);
    }
  }, 120_000);
});

describe('output folder after a kill', () => {
  it('a temporary file left by a killed run is removed by the next analyze, which needs no --force for it', async () => {
    const d = join(dir, 'stale');
    mkdirSync(d, { recursive: true });
    // a temp file of a process that no longer exists (pid 2^22 + 1 is above Linux's pid_max default)
    const stale = join(d, `.results.json.${(1 << 22) + 1}.tmp`);
    writeFileSync(stale, '{"half": ');
    const io = bufferIO();
    const code = await main(['analyze', job, '-o', d], io);
    expect(code, io.stderr).toBe(0);
    expect(existsSync(stale)).toBe(false);
    expect(readFileSync(join(d, 'results.json')).equals(after.get('results.json')!)).toBe(true);
  }, 60_000);
});
