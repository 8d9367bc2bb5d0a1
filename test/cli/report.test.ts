import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import { beforeAll, describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { inventedStudy } from '../report/fixtures/invented-study.js';

let dir: string;
let resultsFile: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'shiftload-report-'));
  resultsFile = join(dir, 'results.json');
  writeFileSync(resultsFile, JSON.stringify(inventedStudy(), null, 2)); // INVENTED TEST DATA
});

function variant(name: string, edit: (r: Record<string, unknown>) => void): string {
  const r = JSON.parse(readFileSync(resultsFile, 'utf8')) as Record<string, unknown>;
  edit(r);
  const f = join(dir, name);
  writeFileSync(f, JSON.stringify(r));
  return f;
}

describe('shiftload report', () => {
  it('main(["report", results, "-o", out, "--svg", dir]) writes a PDF and one SVG per chart, returns 0', async () => {
    const io = bufferIO();
    const out = join(dir, 'out.pdf');
    const svg = join(dir, 'charts');
    expect(await main(['report', resultsFile, '-o', out, '--svg', svg], io)).toBe(0);
    const bytes = readFileSync(out);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pages = (await PDFDocument.load(bytes)).getPageCount();
    expect(io.stderr).toContain(`wrote ${out} (${pages} pages`);
    const svgs = readdirSync(svg).filter((f) => f.endsWith('.svg'));
    expect(svgs.length).toBeGreaterThan(20);
    expect(io.stderr).toContain(`wrote ${svgs.length} SVG charts`);
    expect(readFileSync(join(svg, svgs[0]), 'utf8')).toMatch(/^<svg [^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(readdirSync(dir).some((f) => f.endsWith('.tmp'))).toBe(false);
  });

  it('main(["report", results]) writes report.pdf beside the results file by default', async () => {
    const io = bufferIO();
    expect(await main(['report', resultsFile], io)).toBe(0);
    expect(existsSync(join(dir, 'report.pdf'))).toBe(true);
  });

  it('main(["report", missing]) returns 2 with one line naming the file', async () => {
    const io = bufferIO();
    expect(await main(['report', join(dir, 'nope.json')], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
    expect(io.stderr).toContain('nope.json: file not found');
  });

  it('main(["report", not-json]) returns 2 naming the file and saying JSON', async () => {
    const f = join(dir, 'bad.json');
    writeFileSync(f, '{ "format": ');
    const io = bufferIO();
    expect(await main(['report', f], io)).toBe(2);
    expect(io.stderr).toMatch(/bad\.json: not valid JSON/);
  });

  it('main(["report", other-format]) returns 2 naming the file and the format field', async () => {
    const f = variant('other.json', (r) => { r.format = 'something-else/2'; });
    const io = bufferIO();
    expect(await main(['report', f], io)).toBe(2);
    expect(io.stderr.trim()).toBe(`shiftload: ${f}: format: expected "shiftload-results/1", got "something-else/2"`);
  });

  it('main(["report", results with a bad row field]) returns 2 naming rows[i].field and the value', async () => {
    const f = variant('badrow.json', (r) => { (r.rows as Record<string, unknown>[])[3].valid_s = 'long'; });
    const io = bufferIO();
    expect(await main(['report', f], io)).toBe(2);
    expect(io.stderr.trim()).toBe(`shiftload: ${f}: rows[3].valid_s: expected a number, got "long"`);
  });

  it('main(["report", results with a ragged EVA matrix]) returns 2 naming eva[i].percent_time[j]', async () => {
    const f = variant('badeva.json', (r) => { ((r.eva as Record<string, unknown>[])[0].percent_time as number[][])[2].pop(); });
    const io = bufferIO();
    expect(await main(['report', f], io)).toBe(2);
    expect(io.stderr).toContain('eva[0].percent_time[2]: expected 7 values');
  });

  it('main(["report", results, "-o", results]) refuses to overwrite the input', async () => {
    const io = bufferIO();
    expect(await main(['report', resultsFile, '-o', resultsFile], io)).toBe(2);
    expect(JSON.parse(readFileSync(resultsFile, 'utf8')).format).toBe('shiftload-results/1');
  });

  it('main(["report", "--help"]) shows examples', async () => {
    const io = bufferIO();
    expect(await main(['report', '--help'], io)).toBe(0);
    expect(io.stdout).toContain('Examples:');
    expect(io.stdout).toContain('--svg');
  });
});
