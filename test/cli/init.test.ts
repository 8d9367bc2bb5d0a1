import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { jobTemplateText } from '../../lib/cli/init.js';
import { main } from '../../lib/cli/main.js';
import { DEFAULTS } from '../../lib/job/defaults.js';
import { loadJob } from '../../lib/job/load-job.js';
import { parseYamlWithLines } from '../../lib/job/parse-yaml-lines.js';
import { fakeDescribe, FAKE_RECORDINGS } from '../job/fake-recordings.js';

const freshDir = () => mkdtempSync(join(tmpdir(), 'shiftload-init-'));

describe('shiftload init [dir]', () => {
  it('main(["init", dir]) writes the template job.yaml and says what to edit next', async () => {
    const dir = join(freshDir(), 'study');
    const io = bufferIO();
    expect(await main(['init', dir], io)).toBe(0);
    expect(readFileSync(join(dir, 'job.yaml'), 'utf8')).toBe(jobTemplateText());
    expect(io.stdout).toMatch(/wrote .*job\.yaml/);
    expect(io.stdout).toContain('shiftload check');
  });

  it('main(["init", dir]) refuses to overwrite an existing job.yaml without --force (exit 2, file untouched)', async () => {
    const dir = freshDir();
    writeFileSync(join(dir, 'job.yaml'), 'mine\n');
    const io = bufferIO();
    expect(await main(['init', dir], io)).toBe(2);
    expect(io.stderr).toBe(`shiftload: ${join(dir, 'job.yaml')}: already exists; use --force to overwrite it\n`);
    expect(readFileSync(join(dir, 'job.yaml'), 'utf8')).toBe('mine\n');
    expect(await main(['init', dir, '--force'], bufferIO())).toBe(0);
    expect(readFileSync(join(dir, 'job.yaml'), 'utf8')).toBe(jobTemplateText());
  });

  it('main(["init", file]) refuses a path that is a file', async () => {
    const dir = freshDir();
    writeFileSync(join(dir, 'x'), '');
    const io = bufferIO();
    expect(await main(['init', join(dir, 'x')], io)).toBe(2);
    expect(io.stderr).toContain('exists and is not a folder');
  });

  it('the written template loads and validates (fake recordings of the same names)', async () => {
    const dir = freshDir();
    await main(['init', dir], bufferIO());
    for (const name of Object.keys(FAKE_RECORDINGS)) writeFileSync(join(dir, name), '');
    const study = await loadJob(join(dir, 'job.yaml'), { describeRecording: fakeDescribe });
    expect(study.workers).toHaveLength(1);
    expect(study.workers[0].recordings.map((r) => r.segments.map((s) => s.label))).toEqual([['sorting', 'packing'], ['sorting', 'packing']]);
  });

  it('the template shows every setting with its default value', () => {
    const parsed = parseYamlWithLines(jobTemplateText(), 'job-template.yaml').value as { settings: unknown };
    expect(parsed.settings).toEqual(JSON.parse(JSON.stringify(DEFAULTS)));
  });
});

describe('shiftload init, then check, on real EDF+ files', () => {
  it('the template checks out against EDF+ recordings written with the names it uses', async () => {
    const { EdfWriter } = await import('../../lib/io/edf-writer.js');
    const dir = freshDir();
    await main(['init', dir], bufferIO());
    const signals = ['EMG R trapezius', 'EMG L trapezius'].map((label) => ({ label, unit: 'uV', rate_hz: 1000, physical_min: -1000, physical_max: 1000 }));
    // invented recordings: zeros, only the header facts matter here
    const write = (name: string, seconds: number, annotations: { onset_s: number; duration_s: number | null; text: string }[] = []) => {
      const w = new EdfWriter(join(dir, name), signals, { record_duration_s: 1, annotations });
      const block = new Float64Array(60_000);
      for (let s = 0; s < seconds; s += 60) w.write([block, block]);
      w.close();
    };
    write('w1-ref.edf', 120);
    write('w1-bench-a.edf', 3600);
    write('w1-bench-b.edf', 3600, [{ onset_s: 0, duration_s: 1200, text: 'task: sorting' }, { onset_s: 1200, duration_s: 1500, text: 'task: packing' }]);
    const io = bufferIO();
    expect(await main(['check', join(dir, 'job.yaml')], io)).toBe(0);
    expect(io.stdout).toContain('1 worker(s), 2 recording(s), 4 channel(s), 4 segment(s)');
    expect(io.stdout).toContain('recorded 2.00 h, in segments 1.75 h');
    rmSync(dir, { recursive: true, force: true });
  });
});
