import type { Material, MaterialInput } from './Material';
import { MaterialError } from './MaterialError';
import { materialIssues } from './materialIssues';
import { materialWarnings } from './materialWarnings';

/**
 * Validates a strain-life material and returns it frozen, with its `warnings`.
 *
 * Throws one {@link MaterialError} that lists every bad field, its value and the rule it broke
 * (see {@link materialIssues} for the rules). A legal but inconsistent material (K', n' far
 * from n' = b/c, K' = σf'/εf'^n') is accepted and carries warnings (see
 * {@link materialWarnings}); read `material.warnings` before trusting SWT or Walker results.
 *
 * Units: the caller's, consistent (E, σf', K', Su in one stress unit; strains dimensionless).
 *
 * @example
 * const m = defineMaterial({ E: 202000, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445, K: 1258, n: 0.208 });
 * Object.isFrozen(m) && m.warnings.length
 * // returns 0
 */
export function defineMaterial(input: MaterialInput): Material {
  const issues = materialIssues(input);
  if (issues.length > 0) throw new MaterialError(issues);
  const out: Record<string, unknown> = {};
  for (const key of ['name', 'E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n', 'Su', 'hardnessHB', 'source', 'note'] as const) {
    if (input[key] !== undefined) out[key] = input[key];
  }
  out.warnings = Object.freeze(materialWarnings(input).map((w) => Object.freeze(w)));
  return Object.freeze(out) as unknown as Material;
}
