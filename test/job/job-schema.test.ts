import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';
import { DEFAULTS, SETTINGS_TABLE } from '../../lib/job/defaults.js';
import { JOB_FORMAT, jobSchema } from '../../lib/job/job-schema.js';
import { jobSchemaValidator } from '../../lib/job/validate-job-schema.js';

type Node = { properties?: Record<string, Node>; items?: Node; anyOf?: Node[]; title?: string; description?: string; default?: unknown };

function eachProperty(node: Node, path: string, visit: (path: string, n: Node) => void): void {
  for (const [k, v] of Object.entries(node.properties ?? {})) {
    visit(`${path}.${k}`, v);
    eachProperty(v, `${path}.${k}`, visit);
  }
  if (node.items) eachProperty(node.items, `${path}[]`, visit);
  for (const b of node.anyOf ?? []) eachProperty(b, path, visit);
}

describe('jobSchema', () => {
  it('jobSchema is a valid draft-07 schema (ajv validates it against the meta-schema and compiles it)', () => {
    const ajv = new Ajv({ strict: true, strictTypes: false });
    expect(ajv.validateSchema(jobSchema)).toBe(true);
    expect(() => ajv.compile(jobSchema)).not.toThrow();
  });

  it('every property has a title and a description', () => {
    const missing: string[] = [];
    eachProperty(jobSchema as unknown as Node, '', (p, n) => { if (!n.title || !n.description) missing.push(p); });
    expect(missing).toEqual([]);
  });

  it('every setting in DEFAULTS has a schema property whose default is the DEFAULTS value', () => {
    const settings = (jobSchema.properties.settings as unknown as Node).properties!;
    for (const [k, v] of Object.entries(DEFAULTS)) {
      if (k === 'eva' || k === 'fatigue') {
        for (const [ek, ev] of Object.entries(v as object)) expect(settings[k].properties![ek].default, `${k}.${ek}`).toEqual(ev);
      } else {
        expect(settings[k]?.default, k).toEqual(v);
      }
    }
    expect(Object.keys(settings).sort()).toEqual(Object.keys(DEFAULTS).sort());
  });

  it('SETTINGS_TABLE describes every setting once, with the DEFAULTS value', () => {
    const leafKeys = Object.entries(DEFAULTS).flatMap(([k, v]) => (k === 'eva' || k === 'fatigue' ? Object.keys(v as object).map((e) => `${k}.${e}`) : [k]));
    expect(SETTINGS_TABLE.map((r) => r.key).sort()).toEqual(leafKeys.sort());
    for (const row of SETTINGS_TABLE) {
      const [head, leaf] = row.key.split('.');
      const v = leaf !== undefined ? ((DEFAULTS as unknown as Record<string, Record<string, unknown>>)[head!]!)[leaf] : (DEFAULTS as unknown as Record<string, unknown>)[row.key];
      expect(row.value, row.key).toEqual(v);
      expect(row.meaning.length, row.key).toBeGreaterThan(10);
    }
  });

  it('a job whose settings are exactly DEFAULTS is valid', () => {
    const job = {
      format: JOB_FORMAT, title: 't', settings: DEFAULTS,
      workers: [{ id: 'W1', recordings: [{ file: 'a.edf', condition: 'c', channels: [{ signal: 's' }], segments: 'annotations' }] }],
    };
    const validate = jobSchemaValidator();
    expect(validate(JSON.parse(JSON.stringify(job))), JSON.stringify(validate.errors)).toBe(true);
  });

  it('DEFAULTS cannot be changed by accident (deeply frozen)', () => {
    expect(Object.isFrozen(DEFAULTS)).toBe(true);
    expect(Object.isFrozen(DEFAULTS.band_hz)).toBe(true);
    expect(Object.isFrozen(DEFAULTS.eva.amplitude_edges)).toBe(true);
  });
});
