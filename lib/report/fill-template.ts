// Fill "{name}" placeholders in report wording from templates/report. A sentence whose value is
// missing is dropped (null), so the report never prints "undefined" or an empty slot.

/** Values for placeholders; null/undefined means "not known". */
export type TemplateVars = Record<string, string | number | null | undefined>;

/**
 * Replace every `{name}` in `template` with `vars[name]`.
 * @returns the filled text, or null when any placeholder has no value.
 * @example fillTemplate('median {p50} %', { p50: '8.1' }) // 'median 8.1 %'
 */
export function fillTemplate(template: string, vars: TemplateVars): string | null {
  let missing = false;
  const out = template.replace(/\{([A-Za-z0-9_]+)\}/g, (_m, name: string) => {
    const v = vars[name];
    if (v === null || v === undefined) { missing = true; return ''; }
    return String(v);
  });
  return missing ? null : out;
}

/** Like fillTemplate but throws when a value is missing (for texts that must always print). */
export function fillRequired(template: string, vars: TemplateVars): string {
  const s = fillTemplate(template, vars);
  if (s === null) throw new Error(`report template needs a value: ${template}`);
  return s;
}
