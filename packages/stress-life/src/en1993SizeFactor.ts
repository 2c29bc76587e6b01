import { StressLifeError } from './StressLifeError';

/**
 * Size reduction factor ks of EN 1993-1-9 for the details whose table says so (mm):
 *
 *     plate thickness (e.g. transverse butt welds, cruciform joints): ks = (25/t)^0.2  for t > 25 mm, else 1
 *     bolts in tension (nominal diameter d):                         ks = (30/d)^0.25 for d > 30 mm, else 1
 *
 * Δσc,red = ks·Δσc (7.2.2); pass it as `sizeFactor` of {@link en1993DetailCurve}. Which
 * details carry a size effect is stated in Tables 8.1-8.10 of the standard.
 *
 * Reference: EN 1993-1-9:2005, 7.2.2 and Tables 8.1 (bolts) and 8.3 (transverse butt welds)
 * (exponents and reference sizes value from memory).
 *
 * @param sizeMm plate thickness t or bolt diameter d in mm (finite, > 0)
 * @param kind `'plate'` (default) or `'bolt'`
 * @throws {StressLifeError} `invalid-option` for a bad size or kind.
 * @example
 * en1993SizeFactor(50).toFixed(4);
 * // returns '0.8706'
 */
export function en1993SizeFactor(sizeMm: number, kind: 'plate' | 'bolt' = 'plate'): number {
  if (!(sizeMm > 0 && sizeMm < Infinity)) throw new StressLifeError('invalid-option', 'sizeMm', sizeMm, 'must be a finite number > 0 (mm)');
  if (kind === 'plate') return sizeMm > 25 ? Math.pow(25 / sizeMm, 0.2) : 1;
  if (kind === 'bolt') return sizeMm > 30 ? Math.pow(30 / sizeMm, 0.25) : 1;
  throw new StressLifeError('invalid-option', 'kind', kind, "must be 'plate' or 'bolt'");
}
