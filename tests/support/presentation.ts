/**
 * Checks an answer against the contract's rule for numbers (openapi.yaml, "Numbers in answers"), written
 * here from the rule's wording rather than from shared/present.ts: unit-named numbers (and the parts of
 * unit-named arrays and objects without a unit of their own) carry at most their unit's decimals, and text written by Isochron (messages, details, reasons) names no figure with
 * more than four decimals or in exponent form ("narrowed to 20.24184057376063 Hz", "2.25e-13 ms").
 */
const RULE: Array<[RegExp, number]> = [
  [/Ms(?=[A-Z]|$)/, 4],
  [/Us(?=[A-Z]|$)/, 1],
  [/Dbfs(?=[A-Z]|$)/, 2],
  [/Db(?=[A-Z]|$)/, 2],
  [/Hz(?=[A-Z]|$)/, 2],
  [/Samples(?=[A-Z]|$)/, 4],
];
const TEXT_KEYS = new Set(['message', 'detail', 'title', 'reasons', 'notice', 'note']);
// A number printed by JavaScript in exponent form always carries the exponent's sign ("2.25e-13",
// "1e+21"); without the sign, "0e0" is a caller's channel label quoted in a warning, not a figure.
const LONG_FIGURE = /\d\.\d{5,}|(?<![\w-])\d(?:\.\d+)?e[-+]\d/;

function decimalsOf(value: number): number {
  const text = String(value);
  if (/e/.test(text)) return Number.POSITIVE_INFINITY;
  return text.split('.')[1]?.length ?? 0;
}

function allowed(key: string): number | undefined {
  return RULE.find(([pattern]) => pattern.test(key))?.[1];
}

/** Every place in `body` that breaks the rule, as `path: what` (empty when the answer keeps it). */
export function presentationProblems(body: unknown): string[] {
  const problems: string[] = [];
  const walk = (value: unknown, path: string, key: string, decimals: number | undefined, text: boolean) => {
    if (typeof value === 'number' && decimals !== undefined && decimalsOf(value) > decimals) {
      problems.push(`${path}: ${value} has more than ${decimals} decimals`);
    } else if (typeof value === 'string' && text && LONG_FIGURE.test(value)) {
      problems.push(`${path}: "${value}" names a figure with more than 4 decimals`);
    } else if (Array.isArray(value)) {
      value.forEach((item, i) => walk(item, `${path}/${i}`, key, decimals, text));
    } else if (value !== null && typeof value === 'object') {
      for (const [k, child] of Object.entries(value)) {
        walk(child, `${path}/${k}`, k, allowed(k) ?? decimals, TEXT_KEYS.has(k));
      }
    }
  };
  walk(body, '', '', undefined, false);
  return problems;
}

/** Fails listing the first places where an answer breaks the rule for numbers. */
export function expectPresentable(body: unknown): void {
  const problems = presentationProblems(body);
  if (problems.length > 0) {
    throw new Error(`answer breaks the rule for numbers:\n${problems.slice(0, 10).join('\n')}`);
  }
}

const HALF_LAST_DECIMAL = { ms: 0.5e-4, db: 0.5e-2, hz: 0.5e-2, samples: 0.5e-4 } as const;

/**
 * An answered figure equals `expected` as the contract's rule rounds it: within half its last decimal
 * (ms and samples 4 decimals, dB and Hz 2), plus 1e-9 for the binary form of the decimal.
 */
export function expectAnswered(
  answered: number,
  expected: number,
  unit: keyof typeof HALF_LAST_DECIMAL,
): void {
  const off = Math.abs(answered - expected);
  if (!(off <= HALF_LAST_DECIMAL[unit] + 1e-9)) {
    throw new Error(
      `answered ${answered} ${unit}, expected ${expected} ${unit} to within ${HALF_LAST_DECIMAL[unit]} (off by ${off})`,
    );
  }
}
