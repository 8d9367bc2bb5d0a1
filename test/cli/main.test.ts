import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { main } from '../../lib/cli/main.js';
import { bufferIO } from '../../lib/cli/cli-io.js';

const bin = new URL('../../bin/shiftload.js', import.meta.url).pathname;
const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };

describe('main(args)', () => {
  it('main(["--version"]) prints the version from package.json and returns 0', async () => {
    const io = bufferIO();
    expect(await main(['--version'], io)).toBe(0);
    expect(io.stdout.trim()).toBe(pkg.version);
  });

  it('main(["--help"]) lists the commands and returns 0', async () => {
    const io = bufferIO();
    expect(await main(['--help'], io)).toBe(0);
    expect(io.stdout).toContain('shiftload <command>');
    expect(io.stdout).toContain('about');
  });

  it('main([]) without a command is a usage error: exit 2, one line', async () => {
    const io = bufferIO();
    expect(await main([], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('main(["nosuchcommand"]) returns 2 with one line and no stack trace', async () => {
    const io = bufferIO();
    expect(await main(['nosuchcommand'], io)).toBe(2);
    expect(io.stderr.trim().split('\n')).toHaveLength(1);
    expect(io.stderr).not.toMatch(/\bat .*\.js:\d+/);
  });
});

describe('bin/shiftload.js', () => {
  it('the launcher runs --help and exits 0', () => {
    const out = execFileSync(process.execPath, [bin, '--help'], { encoding: 'utf8' });
    expect(out).toContain('Commands:');
  });

  it('the launcher sets exit code 2 on a usage error', () => {
    const r = spawnSync(process.execPath, [bin, 'about', '--no-such-option'], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
