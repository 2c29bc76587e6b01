import type { MaterialIssue } from './MaterialError';

/** Smallest cyclic strain-hardening exponent n' that validation accepts. */
export const N_MIN = 0.01;
/** Largest cyclic strain-hardening exponent n' that validation accepts. */
export const N_MAX = 0.5;

type Rule = readonly [field: string, test: (v: number) => boolean, rule: string];

const REQUIRED: readonly Rule[] = [
  ['E', (v) => v > 0, 'must be a finite number > 0'],
  ['sigmaF', (v) => v > 0, 'must be a finite number > 0'],
  ['b', (v) => v < 0, 'must be a finite number < 0'],
  ['epsilonF', (v) => v > 0, 'must be a finite number > 0'],
  ['c', (v) => v < 0, 'must be a finite number < 0'],
  ['K', (v) => v > 0, 'must be a finite number > 0'],
  [
    'n',
    (v) => v >= N_MIN && v <= N_MAX,
    `must be a finite number with ${N_MIN} <= n <= ${N_MAX} (metals have about 0.05 to 0.35; below ${N_MIN} the cyclic ` +
      'curve is nearly a step, elastic-perfectly plastic, that double precision cannot solve; above ' +
      `${N_MAX} the plastic strain would exceed the elastic one far below any strength of the material)`,
  ],
];

const OPTIONAL_NUMBERS: readonly Rule[] = [
  ['Su', (v) => v > 0, 'must be a finite number > 0 when given'],
  ['hardnessHB', (v) => v > 0, 'must be a finite number > 0 when given'],
];

const OPTIONAL_STRINGS = ['name', 'source', 'note'] as const;
const KNOWN = new Set<string>([
  ...REQUIRED.map((r) => r[0]),
  ...OPTIONAL_NUMBERS.map((r) => r[0]),
  ...OPTIONAL_STRINGS,
  'warnings',
]);

/**
 * Every rule a material input breaks, in field order; empty when the input is valid. This is
 * what {@link defineMaterial} throws as one {@link MaterialError}; use it directly to show all
 * problems in a form without catching.
 *
 * Rules: E, σf', εf', K' finite and > 0; b and c finite and < 0; 0.01 <= n' <= 0.5 (metals
 * have about 0.05 to 0.35; the rule says why outside is rejected); Su and HB finite
 * and > 0 when given; name, source, note strings when given; no unknown fields (a typo such as
 * `sigmaf` is reported, not ignored). The field `warnings` of an existing material is accepted
 * and recomputed.
 *
 * @example
 * materialIssues({ E: 0, sigmaF: 900, b: -0.09, epsilonF: 0.5, c: -0.6, K: 1000, n: 1.2 })
 * // returns [{ field: 'E', value: 0, rule: 'must be a finite number > 0' },
 * //          { field: 'n', value: 1.2, rule: 'must be a finite number with 0.01 <= n <= 0.5 (metals …)' }]
 */
export function materialIssues(input: unknown): MaterialIssue[] {
  if (input === null || typeof input !== 'object') {
    return [{ field: '(material)', value: input, rule: 'must be an object' }];
  }
  const record = input as Record<string, unknown>;
  const issues: MaterialIssue[] = [];
  for (const [field, test, rule] of REQUIRED) {
    const v = record[field];
    if (typeof v !== 'number' || !Number.isFinite(v) || !test(v)) issues.push({ field, value: v, rule });
  }
  for (const [field, test, rule] of OPTIONAL_NUMBERS) {
    const v = record[field];
    if (v === undefined) continue;
    if (typeof v !== 'number' || !Number.isFinite(v) || !test(v)) issues.push({ field, value: v, rule });
  }
  for (const field of OPTIONAL_STRINGS) {
    const v = record[field];
    if (v !== undefined && typeof v !== 'string') {
      issues.push({ field, value: v, rule: 'must be a string when given' });
    }
  }
  for (const field of Object.keys(record)) {
    if (!KNOWN.has(field)) issues.push({ field, value: record[field], rule: 'is not a material field' });
  }
  return issues;
}
