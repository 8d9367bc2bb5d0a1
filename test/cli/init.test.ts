import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
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
