// Canonical JSON (object keys sorted, no spaces) and its SHA-256: the settings hash printed in the
// report's reproducibility block.
import { createHash } from 'node:crypto';

/**
 * JSON text with object keys sorted at every level and no whitespace; undefined members dropped.
 * @example canonicalJson({ b: 1, a: [2, { d: 1, c: 0 }] }) // '{"a":[2,{"c":0,"d":1}],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return '[' + value.map((v) => (v === undefined ? 'null' : canonicalJson(v))).join(',') + ']';
  const obj = value as Record<string, unknown>;
  const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
  return '{' + keys.map((k) => JSON.stringify(k) + ':' + canonicalJson(obj[k])).join(',') + '}';
}

/** SHA-256 (hex) of canonicalJson(value). */
export function settingsHash(value: unknown): string {
  return createHash('sha256').update(canonicalJson(value), 'utf8').digest('hex');
}
