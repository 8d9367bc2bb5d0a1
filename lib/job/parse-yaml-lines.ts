// Parse a YAML document safely and remember the line of every key path, so validation messages
// can point at "job.yaml:14 workers[0].recordings[1].channels[0].signal".
// One parse: js-yaml's event stream (parseEvents) is walked for lines and then turned into the
// value (constructFromEvents), with the core schema only (no custom tags, no merge keys).
import {
  CORE_SCHEMA, EVENT_ID, YAMLException, constructFromEvents, getScalarValue, parseEvents,
  type Event,
} from 'js-yaml';
import { InputError } from '../errors.js';
import { jobMsg } from '../messages.js';
import { formatKeyPath, type KeyPathStep } from './key-path.js';

/** Limits that keep a hostile or mistaken file from exhausting memory. */
export interface YamlLimits {
  /** Largest accepted file, bytes. @default 1048576 (1 MiB) */
  maxBytes: number;
  /** Largest number of aliases (`*name`) accepted. @default 50 */
  maxAliases: number;
  /** Largest number of values after alias expansion. @default 200000 */
  maxNodes: number;
  /** Deepest nesting. @default 40 */
  maxDepth: number;
}

export const YAML_LIMITS: Readonly<YamlLimits> = Object.freeze({
  maxBytes: 1 << 20, maxAliases: 50, maxNodes: 200_000, maxDepth: 40,
});

/** Where a key path is written in the file. Lines are 1-based. */
export interface PathLines {
  /** Line of the key (mapping entries) or of the item (list entries). */
  line: number;
  /** Line where the value starts. */
  valueLine: number;
}

export interface ParsedYaml {
  /** The document's value (plain objects, arrays, strings, numbers, booleans, null). */
  value: unknown;
  /**
   * The line of a key path, or of its nearest ancestor that is written in the file (values reached
   * through an alias point at the alias). 1 when nothing matches.
   */
  lineOf(path: readonly KeyPathStep[]): number;
}

interface Frame {
  kind: 'map' | 'seq' | 'skip';
  path: KeyPathStep[];
  index: number;
  expectKey: boolean;
  key: string;
}

/**
 * Parse YAML text into a value and a line map.
 * @param text file contents
 * @param file the file name as the user wrote it (used in messages)
 * @throws InputError on a syntax error ("job.yaml:3: …"), too many aliases, a file over the size
 *   limit, or more than one document.
 * @example parseYamlWithLines('a:\n  b: 1\n', 'job.yaml').lineOf(['a', 'b']) // 2
 */
export function parseYamlWithLines(text: string, file: string, limits: YamlLimits = YAML_LIMITS): ParsedYaml {
  if (Buffer.byteLength(text, 'utf8') > limits.maxBytes) {
    throw new InputError(jobMsg.tooLarge(file, limits.maxBytes), { file });
  }
  let events: Event[];
  let docs: unknown[];
  try {
    events = parseEvents(text, { filename: file, maxDepth: limits.maxDepth });
    docs = constructFromEvents(events, { source: text, filename: file, schema: CORE_SCHEMA, maxAliases: limits.maxAliases });
  } catch (e) {
    if (e instanceof YAMLException) {
      const line = e.mark ? e.mark.line + 1 : 1;
      throw new InputError(jobMsg.yamlSyntax(file, line, e.reason), { file, where: `line ${line}` });
    }
    throw e;
  }
  if (docs.length !== 1) throw new InputError(jobMsg.yamlDocuments(file, docs.length), { file });
  countNodes(docs[0], file, limits.maxNodes);

  const lineStarts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) lineStarts.push(i + 1);
  const lineAt = (offset: number): number => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid] <= offset) lo = mid; else hi = mid - 1;
    }
    return lo + 1;
  };

  const lines = new Map<string, PathLines>();
  const stack: Frame[] = [];
  const place = (offset: number): KeyPathStep[] | null => {
    // Where a node starting at `offset` sits; records its line. null inside an ignored subtree.
    const top = stack[stack.length - 1];
    if (!top) {
      lines.set(formatKeyPath([]), { line: lineAt(offset), valueLine: lineAt(offset) });
      return [];
    }
    if (top.kind === 'skip') return null;
    if (top.kind === 'seq') {
      const p = [...top.path, top.index++];
      lines.set(formatKeyPath(p), { line: lineAt(offset), valueLine: lineAt(offset) });
      return p;
    }
    if (top.expectKey) return null; // handled by the caller (keys)
    top.expectKey = true;
    const p = [...top.path, top.key];
    const k = formatKeyPath(p);
    const known = lines.get(k);
    lines.set(k, { line: known ? known.line : lineAt(offset), valueLine: lineAt(offset) });
    return p;
  };
  for (const ev of events) {
    const top = stack[stack.length - 1];
    const isKey = top !== undefined && top.kind === 'map' && top.expectKey;
    switch (ev.type) {
      case EVENT_ID.DOCUMENT:
        break;
      case EVENT_ID.POP:
        stack.pop();
        break;
      case EVENT_ID.SCALAR:
        if (isKey) {
          top.key = getScalarValue(text, ev);
          top.expectKey = false;
          lines.set(formatKeyPath([...top.path, top.key]), { line: lineAt(ev.valueStart), valueLine: lineAt(ev.valueStart) });
        } else {
          place(ev.valueStart);
        }
        break;
      case EVENT_ID.ALIAS:
        if (isKey) { top.key = '?'; top.expectKey = false; } else place(ev.anchorStart);
        break;
      case EVENT_ID.MAPPING:
      case EVENT_ID.SEQUENCE: {
        const kind = ev.type === EVENT_ID.MAPPING ? 'map' : 'seq';
        if (isKey) {
          // A collection used as a key: not part of any job file; skip its contents.
          top.key = '?';
          top.expectKey = false;
          stack.push({ kind: 'skip', path: [], index: 0, expectKey: false, key: '' });
          break;
        }
        const p = place(ev.start);
        stack.push(p === null
          ? { kind: 'skip', path: [], index: 0, expectKey: false, key: '' }
          : { kind, path: p, index: 0, expectKey: kind === 'map', key: '' });
        break;
      }
    }
  }

  return {
    value: docs[0],
    lineOf(path) {
      for (let n = path.length; n >= 0; n--) {
        const hit = lines.get(formatKeyPath(path.slice(0, n)));
        if (hit) return hit.line;
      }
      return 1;
    },
  };
}

/** Refuse documents whose alias expansion is huge (aliases share objects; walking them does not). */
function countNodes(root: unknown, file: string, max: number): void {
  let count = 0;
  const todo: unknown[] = [root];
  while (todo.length > 0) {
    const v = todo.pop();
    if (++count > max) throw new InputError(jobMsg.tooManyNodes(file, max), { file });
    if (Array.isArray(v)) for (const x of v) todo.push(x);
    else if (v !== null && typeof v === 'object') for (const x of Object.values(v)) todo.push(x);
  }
}
