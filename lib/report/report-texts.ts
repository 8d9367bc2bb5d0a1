// Load the report's wording from templates/report: texts.json (headings, sentences, labels,
// captions), cautions.md (one bullet per caution) and references.md ("- [key] text").
import { readFileSync } from 'node:fs';

/** The parsed wording of templates/report/texts.json (shape checked loosely: strings by key). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type TextsJson = Record<string, any>;

export interface ReportTexts {
  t: TextsJson;
  cautions: string[];
  references: Map<string, string>;
}

/** Folder holding the report templates (works from lib/ under vitest and from dist/ when built). */
export const TEMPLATE_DIR = new URL('../../templates/report/', import.meta.url);

let cached: ReportTexts | null = null;

/** Read and cache the report wording. Throws a plain Error if a template file is missing (an install fault). */
export function loadReportTexts(): ReportTexts {
  if (cached) return cached;
  const t = JSON.parse(readFileSync(new URL('texts.json', TEMPLATE_DIR), 'utf8')) as TextsJson;
  const cautions = bulletLines(readFileSync(new URL('cautions.md', TEMPLATE_DIR), 'utf8'));
  const references = new Map<string, string>();
  for (const line of bulletLines(readFileSync(new URL('references.md', TEMPLATE_DIR), 'utf8'))) {
    const m = /^\[([a-z0-9]+)\]\s+(.*)$/.exec(line);
    if (m) references.set(m[1], m[2]);
  }
  cached = { t, cautions, references };
  return cached;
}

function bulletLines(md: string): string[] {
  return md.replace(/<!--[\s\S]*?-->/g, '').split('\n').filter((l) => l.startsWith('- ')).map((l) => l.slice(2).trim());
}

/** Every string in the templates (for the glyph-coverage test). */
export function allTemplateStrings(texts: ReportTexts = loadReportTexts()): string[] {
  const out: string[] = [];
  const walk = (v: unknown) => {
    if (typeof v === 'string') out.push(v);
    else if (Array.isArray(v)) v.forEach(walk);
    else if (v && typeof v === 'object') Object.values(v).forEach(walk);
  };
  walk(texts.t);
  out.push(...texts.cautions, ...texts.references.values());
  return out;
}
