import type { Material } from './Material';
import { MaterialError } from './MaterialError';
import { materialIssues, N_MAX, N_MIN } from './materialIssues';

/**
 * Throws {@link MaterialError} listing every bad field unless `material` satisfies the rules of
 * {@link materialIssues} for the seven strain-life constants. Cheap (seven comparisons) on a
 * valid material, so every public function of the loopwise packages calls it once per call,
 * which also protects callers that build plain objects instead of using {@link defineMaterial}.
 *
 * @example
 * assertMaterial({ E: 2e5, sigmaF: 900, b: -0.09, epsilonF: 0.5, c: -0.6, K: 1200, n: 0.15, warnings: [] })
 * // returns undefined (no throw)
 */
export function assertMaterial(material: Material): void {
  const m = material as Partial<Material> | null | undefined;
  if (
    m != null &&
    m.E! > 0 && m.E! < Infinity &&
    m.sigmaF! > 0 && m.sigmaF! < Infinity &&
    m.b! < 0 && m.b! > -Infinity &&
    m.epsilonF! > 0 && m.epsilonF! < Infinity &&
    m.c! < 0 && m.c! > -Infinity &&
    m.K! > 0 && m.K! < Infinity &&
    m.n! >= N_MIN && m.n! <= N_MAX
  ) {
    return;
  }
  const issues = materialIssues(material).filter((i) =>
    ['(material)', 'E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n'].includes(i.field),
  );
  throw new MaterialError(issues.length > 0 ? issues : [{ field: '(material)', value: material, rule: 'must be a material' }]);
}
