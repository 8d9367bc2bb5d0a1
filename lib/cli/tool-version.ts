// The tool's own version, read from its package.json (not the consumer's).
import { readFileSync } from 'node:fs';

let cached: string | null = null;

export function toolVersion(): string {
  if (cached === null) {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    cached = pkg.version;
  }
  return cached;
}
