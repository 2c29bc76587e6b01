import { handbookSteels, type Material } from '@loopwise/material';

/** SAE 1045 (hot rolled and normalized): Dowling, Mechanical Behavior of Materials, Table 14.1 (via handbookSteels). */
export const sae1045: Material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
/** AISI 4340 (aircraft quality): Dowling, Table 14.1 (via handbookSteels). */
export const aisi4340: Material = handbookSteels.find((m) => m.name === 'AISI 4340 (aircraft quality)')!;

/** Root of a monotone function on [lo, hi] by plain bisection (independent of the package solvers). */
export function bisect(f: (x: number) => number, lo: number, hi: number, iterations = 300): number {
  let flo = f(lo);
  for (let i = 0; i < iterations; i++) {
    const mid = 0.5 * (lo + hi);
    const fm = f(mid);
    if (fm === 0) return mid;
    if (fm > 0 === flo > 0) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Bisection in log space for a positive root spanning many decades. */
export function bisectLog(f: (x: number) => number, lo: number, hi: number): number {
  return Math.exp(bisect((y) => f(Math.exp(y)), Math.log(lo), Math.log(hi)));
}

/** Local stress range of a Masing branch under Neuber's rule for a pseudo-elastic range, by bisection. */
export function neuberRangeByBisection(m: Material, pseudoRange: number): { stressRange: number; strainRange: number } {
  const strainOf = (ds: number) => ds / m.E + 2 * Math.pow(ds / (2 * m.K), 1 / m.n);
  const target = (pseudoRange * pseudoRange) / m.E;
  const ds = bisect((x) => x * strainOf(x) - target, 0, pseudoRange);
  return { stressRange: ds, strainRange: strainOf(ds) };
}

/** Reversals to failure from the strain-life equation with a given elastic coefficient, by bisection. */
export function reversalsByBisection(m: Material, strainAmplitude: number, sigmaF = m.sigmaF): number {
  return bisectLog((r) => (sigmaF / m.E) * Math.pow(r, m.b) + m.epsilonF * Math.pow(r, m.c) - strainAmplitude, 1e-3, 1e30);
}
