// `npm run bench:report`: the report of the 6-worker sample study — render time (target < 3 s),
// and, when poppler's pdftoppm is installed (Debian: poppler-utils), a rasterization of every page
// checked to be non-blank, so the PDF is known to open in a standard renderer. Not part of npm test.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { bufferIO } from '../cli/cli-io.js';
import { main } from '../cli/main.js';
import { renderReportInfo } from '../report/render-report.js';
import type { StudyResults } from '../study/results.js';

async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'shiftload-report-bench-'));
  const io = bufferIO();
  if (await main(['demo', '--out', dir, '--no-report'], io) !== 0) throw new Error(`demo failed: ${io.stderr}`);
  const results = JSON.parse(readFileSync(join(dir, 'results', 'results.json'), 'utf8')) as StudyResults;
  const workers = new Set(results.rows.map((r) => r.worker)).size;
  const times: number[] = [];
  let pages = 0;
  let bytes = 0;
  for (let i = 0; i < 3; i++) {
    const t = process.hrtime.bigint();
    const r = await renderReportInfo(results);
    times.push(Number(process.hrtime.bigint() - t) / 1e9);
    pages = r.pageCount;
    bytes = r.bytes.length;
  }
  const first = times[0]!;
  const best = Math.min(...times);
  process.stdout.write(`report of a ${workers}-worker study: ${pages} pages, ${(bytes / 1e6).toFixed(2)} MB; render ${first.toFixed(2)} s (first, incl. font loading), best ${best.toFixed(2)} s; peak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB\n`);

  const pdf = join(dir, 'report.pdf');
  await main(['report', join(dir, 'results', 'results.json'), '-o', pdf], bufferIO());
  const probe = spawnSync('pdftoppm', ['-v'], { encoding: 'utf8' });
  if (probe.error) {
    process.stdout.write('pdftoppm not found (apt-get install poppler-utils): page rasterization skipped\n');
    return;
  }
  const t = process.hrtime.bigint();
  const r = spawnSync('pdftoppm', ['-r', '50', '-gray', pdf, join(dir, 'page')], { encoding: 'utf8' });
  const secs = Number(process.hrtime.bigint() - t) / 1e9;
  const pngs = readdirSync(dir).filter((f) => f.startsWith('page') && f.endsWith('.pgm')).sort();
  // A page counts as drawn when some pixel of its grey image is dark (text or lines).
  const blank = pngs.filter((f) => statSync(join(dir, f)).size < 1000 || !readFileSync(join(dir, f)).subarray(20).some((v) => v < 128));
  process.stdout.write(`pdftoppm: ${pngs.length} of ${pages} pages rasterized in ${secs.toFixed(2)} s (exit ${r.status}${r.stderr ? `, stderr: ${r.stderr.trim().split('\n')[0]}` : ''}); blank pages: ${blank.length ? blank.join(', ') : 'none'}\n`);
  if (r.status !== 0 || pngs.length !== pages || blank.length) process.exitCode = 1;
}

run().catch((e) => { process.stderr.write(`${(e as Error).stack}\n`); process.exitCode = 1; });
