/**
 * Independent slow reference for tests: bisection in ln x over [1, 1e30] on a residual that is
 * positive while the life is longer than x. 200 halvings: far below 1e-12 relative.
 */
export function bisect(residual: (x: number) => number): number {
  let lo = 0;
  let hi = Math.log(1e30);
  for (let k = 0; k < 200; k++) {
    const mid = (lo + hi) / 2;
    if (residual(Math.exp(mid)) > 0) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}
