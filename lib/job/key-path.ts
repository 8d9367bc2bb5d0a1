// Key paths as users read them in messages: `workers[0].recordings[1].channels[0].signal`.

/** One step of a key path: a mapping key or a list index. */
export type KeyPathStep = string | number;

const PLAIN_KEY = /^[A-Za-z_][A-Za-z0-9_-]*$/;

/**
 * Format a key path for messages: keys joined with dots, list indices in brackets, odd keys quoted.
 * The empty path (the document itself) is "(top level)".
 * @example formatKeyPath(['workers', 0, 'id']) // 'workers[0].id'
 */
export function formatKeyPath(path: readonly KeyPathStep[]): string {
  let out = '';
  for (const step of path) {
    if (typeof step === 'number') out += `[${step}]`;
    else if (PLAIN_KEY.test(step)) out += out === '' ? step : `.${step}`;
    else out += `[${JSON.stringify(step)}]`;
  }
  return out === '' ? '(top level)' : out;
}
