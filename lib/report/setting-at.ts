// Read one effective setting from results.settings by dotted path, trying alternatives in order,
// so the methods text survives small differences in how the analysis names its settings.

/**
 * The first value found at any of `paths` (dotted, e.g. "filter.order"); undefined when none.
 * @example settingAt({ filter: { order: 4 } }, ['bandpass.order', 'filter.order']) // 4
 */
export function settingAt(settings: Record<string, unknown>, paths: readonly string[]): unknown {
  for (const p of paths) {
    let cur: unknown = settings;
    for (const key of p.split('.')) {
      if (cur === null || typeof cur !== 'object' || Array.isArray(cur)) { cur = undefined; break; }
      cur = (cur as Record<string, unknown>)[key];
    }
    if (cur !== undefined && cur !== null) return cur;
  }
  return undefined;
}

/** Flatten settings into [dotted key, printable value] pairs, keys sorted (for the settings table). */
export function flattenSettings(settings: Record<string, unknown>, prefix = ''): [string, string][] {
  const out: [string, string][] = [];
  for (const key of Object.keys(settings).sort()) {
    const v = settings[key];
    const name = prefix ? `${prefix}.${key}` : key;
    if (v !== null && typeof v === 'object' && !Array.isArray(v)) out.push(...flattenSettings(v as Record<string, unknown>, name));
    else out.push([name, Array.isArray(v) ? v.map((x) => (typeof x === 'object' ? JSON.stringify(x) : String(x))).join(', ') : String(v)]);
  }
  return out;
}
