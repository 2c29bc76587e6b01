import fc from 'fast-check';
import { defineMaterial, type Material } from '@loopwise/material';

// Realistic generated materials (MPa): E 50-250 GPa, n' 0.05-0.3, K' 300-3000 MPa; common
// practice, no source (they bracket the handbook rows of @loopwise/material).
const range = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
export const realisticMaterial: fc.Arbitrary<Material> = fc
  .record({ E: range(50_000, 250_000), K: range(300, 3000), n: range(0.05, 0.3), sigmaF: range(300, 3000), epsilonF: range(0.05, 3) })
  .map((m) => defineMaterial({ ...m, b: -0.09, c: -0.6 }));

/** Integer-grid histories (many ties) scaled into plasticity by the caller. */
export const gridHistory = (maxLength = 40): fc.Arbitrary<number[]> => fc.array(fc.integer({ min: -8, max: 8 }), { minLength: 1, maxLength });

// SAE 1045 constants, N. E. Dowling, Mechanical Behavior of Materials, Table 14.1 (handbookSteels).
export const sae1045 = defineMaterial({ E: 202000, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445, K: 1258, n: 0.208 });

/** Bisection on a monotone increasing f for f(x) = 0 in [lo, hi] (independent check). */
export function bisect(f: (x: number) => number, lo: number, hi: number): number {
  for (let k = 0; k < 200; k++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (f(mid) > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/** Cyclic curve written out directly (independent of @loopwise/material). */
export const curveStrain = (m: Material, s: number) => s / m.E + Math.sign(s) * Math.pow(Math.abs(s) / m.K, 1 / m.n);
