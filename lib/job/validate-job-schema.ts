// Schema validation of a parsed job file with ajv (draft-07, all errors), turned into messages that
// name the YAML line and key path, unknown keys with a did-you-mean, sorted by line.
import { Ajv, type ErrorObject, type ValidateFunction } from 'ajv';
import { jobMsg } from '../messages.js';
import { didYouMean } from './did-you-mean.js';
import { jobIssue, type JobIssue } from './job-validation-error.js';
import { jobSchema } from './job-schema.js';
import type { KeyPathStep } from './key-path.js';

let compiled: ValidateFunction | null = null;

/** The compiled validator for the shipped schema (compiled once). */
export function jobSchemaValidator(): ValidateFunction {
  if (compiled === null) {
    const ajv = new Ajv({ allErrors: true, verbose: true, strict: true, strictTypes: false });
    compiled = ajv.compile(jobSchema);
  }
  return compiled;
}

/**
 * Validate a parsed job document against the shipped schema.
 * @param value the parsed YAML value
 * @param file the job file as the user named it
 * @param lineOf line of a key path (from parseYamlWithLines)
 * @returns every problem, sorted by line (empty when valid)
 */
export function validateJobSchema(value: unknown, file: string, lineOf: (p: readonly KeyPathStep[]) => number): JobIssue[] {
  const validate = jobSchemaValidator();
  if (validate(value)) return [];
  const errors = pruneAnyOf(validate.errors ?? []);
  const issues: JobIssue[] = [];
  const seen = new Set<string>();
  for (const e of errors) {
    const base = pointerToPath(e.instancePath, value);
    let path = base;
    let what: string;
    switch (e.keyword) {
      case 'additionalProperties': {
        const key = (e.params as { additionalProperty: string }).additionalProperty;
        const allowed = Object.keys((e.parentSchema as { properties?: object }).properties ?? {});
        path = [...base, key];
        what = jobMsg.unknownKey(didYouMean(key, allowed), allowed);
        break;
      }
      case 'required': {
        const key = (e.params as { missingProperty: string }).missingProperty;
        what = jobMsg.missingKey(key);
        break;
      }
      case 'type':
        what = jobMsg.wrongType(typeWords((e.params as { type: string | string[] }).type), e.data);
        break;
      case 'enum':
        what = jobMsg.notOneOf((e.params as { allowedValues: unknown[] }).allowedValues, e.data);
        break;
      case 'const':
        what = jobMsg.wrongFormat(String((e.params as { allowedValue: unknown }).allowedValue), e.data);
        break;
      case 'minimum': case 'maximum': case 'exclusiveMinimum': case 'exclusiveMaximum': {
        const p = e.params as { comparison: string; limit: number };
        what = jobMsg.outOfRange(`${p.comparison} ${p.limit}`, e.data);
        break;
      }
      case 'minItems': {
        const n = (e.params as { limit: number }).limit;
        what = jobMsg.tooFew(n, n === 1 ? 'item' : 'items');
        break;
      }
      case 'maxItems':
        what = jobMsg.tooMany((e.params as { limit: number }).limit, 'items');
        break;
      case 'minLength':
        what = jobMsg.emptyText();
        break;
      case 'anyOf': {
        const branches = (e.schema as { title?: string }[]).map((b) => b.title ?? 'another shape');
        what = jobMsg.expectedOneOfShapes(branches, e.data);
        break;
      }
      default:
        what = e.message ?? e.keyword;
    }
    const issue = jobIssue(file, lineOf(path), path, what);
    if (!seen.has(issue.message)) {
      seen.add(issue.message);
      issues.push(issue);
    }
  }
  return issues.map((x, i) => ({ x, i })).sort((a, b) => a.x.line - b.x.line || a.i - b.i).map((o) => o.x);
}

/**
 * ajv reports every failing branch of an anyOf. Keep the errors of the branches whose type fits the
 * data (the shape the user meant); when no branch fits, keep only the anyOf error itself, which
 * lists the accepted shapes.
 */
function pruneAnyOf(errors: ErrorObject[]): ErrorObject[] {
  const drop = new Set<ErrorObject>();
  for (const a of errors) {
    if (a.keyword !== 'anyOf') continue;
    const prefix = a.schemaPath + '/';
    const inside = errors.filter((e) => e.schemaPath.startsWith(prefix)
      && (e.instancePath === a.instancePath || e.instancePath.startsWith(a.instancePath + '/')));
    const branchOf = (e: ErrorObject) => Number(e.schemaPath.slice(prefix.length).split('/')[0]);
    const misfit = new Set<number>();
    for (const e of inside) {
      if (e.instancePath === a.instancePath && (e.keyword === 'type' || e.keyword === 'enum')
        && e.schemaPath.slice(prefix.length).split('/').length === 2) misfit.add(branchOf(e));
    }
    const fitting = [...new Set(inside.map(branchOf))].filter((b) => !misfit.has(b));
    if (fitting.length > 0) {
      const keep = fitting[0];
      for (const e of inside) if (branchOf(e) !== keep) drop.add(e);
      drop.add(a);
    } else {
      for (const e of inside) drop.add(e);
    }
  }
  return errors.filter((e) => !drop.has(e));
}

/** JSON pointer → key path, with list indices as numbers. */
function pointerToPath(pointer: string, root: unknown): KeyPathStep[] {
  if (pointer === '') return [];
  const out: KeyPathStep[] = [];
  let node: unknown = root;
  for (const raw of pointer.slice(1).split('/')) {
    const key = raw.replace(/~1/g, '/').replace(/~0/g, '~');
    if (Array.isArray(node)) {
      const i = Number(key);
      out.push(i);
      node = node[i];
    } else {
      out.push(key);
      node = node !== null && typeof node === 'object' ? (node as Record<string, unknown>)[key] : undefined;
    }
  }
  return out;
}

function typeWords(t: string | string[]): string {
  const words: Record<string, string> = {
    string: 'text', number: 'a number', integer: 'a whole number', boolean: 'true or false',
    array: 'a list', object: 'a mapping', null: 'null',
  };
  const ts = Array.isArray(t) ? t : t.split(',');
  return ts.map((x) => words[x] ?? x).join(' or ');
}
