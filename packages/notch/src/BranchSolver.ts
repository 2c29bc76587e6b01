import { ConvergenceError, cyclicStress, type Material } from '@loopwise/material';
import { solveEnergyEquation } from './solveEnergyEquation';

/** Which local relation a {@link BranchSolver} solves. */
export type BranchKind = 'neuber' | 'glinka' | 'linear' | 'local-strain';

/**
 * The first-loading local response as a function of the pseudo-elastic amplitude a >= 0 (for
 * `local-strain`, of the local strain amplitude), fast enough for the tracker's hot path. A
 * Masing branch of range Δ is 2× the response at Δ/2. Internal; not exported from the package.
 *
 * Neuber and Glinka: a cubic Hermite table of s = ln σ against t = ln a (nodes solved exactly,
 * slopes from the implicit derivative ds/dt = 2/F'(s)) gives a start accurate to about 1e-9,
 * then Newton steps on G(σ) = σ² + w·E·σ·(σ/K')^(1/n') − a² (w = 1 Neuber, 2/(1 + n') Glinka)
 * until the estimated remaining relative error C·δ² is below the tolerance; usually one step.
 * Below the table (nearly elastic) the start is σ = a, above it the full log-space solve runs.
 * Linear rule and local strain use the cyclic-curve inverse of @loopwise/material.
 */
export class BranchSolver {
  /** Result of the last {@link solve}: local stress. */
  stress = 0;
  /** Result of the last {@link solve}: local strain. */
  strain = 0;
  private readonly E: number;
  private readonly m: number;
  private readonly lnK: number;
  private readonly w: number;
  private readonly wE: number;
  private readonly t0: number;
  private readonly invH: number;
  private readonly h: number;
  private readonly cells: number;
  private readonly sTab: Float64Array;
  private readonly dTab: Float64Array;
  private readonly tol: number;
  private readonly maxIterations: number;

  constructor(
    private readonly material: Material,
    readonly kind: BranchKind,
    tolerance: number,
    maxIterations: number,
  ) {
    this.E = material.E;
    this.m = 1 / material.n;
    this.lnK = Math.log(material.K);
    this.w = kind === 'glinka' ? 2 / (1 + material.n) : 1;
    this.wE = this.w * this.E;
    this.tol = tolerance;
    this.maxIterations = maxIterations;
    const m = this.m;
    const lnE = Math.log(this.E);
    const lnW = Math.log(this.w);
    const tStar = (m * this.lnK - lnW - lnE) / (m - 1);
    this.t0 = tStar + Math.log(1e-6) / (m - 1);
    const tHi = tStar + 12;
    const cells = kind === 'neuber' || kind === 'glinka' ? Math.min(8192, Math.ceil((tHi - this.t0) * 32)) : 0;
    this.cells = cells;
    this.h = cells > 0 ? (tHi - this.t0) / cells : 1;
    this.invH = 1 / this.h;
    this.sTab = new Float64Array(cells + 1);
    this.dTab = new Float64Array(cells + 1);
    for (let j = 0; j <= cells; j++) {
      const t = this.t0 + j * this.h;
      const s = solveEnergyEquation(2, -lnE, 1 + m, lnW - m * this.lnK, 2 * t - lnE, 1e-15, 100, 'BranchSolver');
      const q = Math.exp((m - 1) * s + lnW - m * this.lnK + lnE);
      this.sTab[j] = s;
      this.dTab[j] = (2 * (1 + q)) / (2 + (1 + m) * q);
    }
  }

  /** Solves for amplitude a (finite, >= 0) and leaves the result in `stress` and `strain`. */
  solve(a: number): void {
    const kind = this.kind;
    if (kind === 'local-strain') {
      this.strain = a;
      this.stress = cyclicStress(this.material, a);
      return;
    }
    if (kind === 'linear') {
      const e = a / this.E;
      this.strain = e;
      this.stress = cyclicStress(this.material, e);
      return;
    }
    if (a === 0) {
      this.stress = a;
      this.strain = a / this.E;
      return;
    }
    const m = this.m;
    const lnK = this.lnK;
    const t = Math.log(a);
    const u = (t - this.t0) * this.invH;
    let sigma: number;
    let s: number;
    if (u < 0) {
      sigma = a;
      s = t;
    } else if (u < this.cells) {
      const j = u | 0;
      const f = u - j;
      const f2 = f * f;
      const f3 = f2 * f;
      const h = this.h;
      s =
        (2 * f3 - 3 * f2 + 1) * this.sTab[j] +
        (f3 - 2 * f2 + f) * h * this.dTab[j] +
        (3 * f2 - 2 * f3) * this.sTab[j + 1] +
        (f3 - f2) * h * this.dTab[j + 1];
      sigma = Math.exp(s);
    } else {
      const lnE = Math.log(this.E);
      s = solveEnergyEquation(2, -lnE, 1 + m, Math.log(this.w) - m * lnK, 2 * t - lnE, this.tol, this.maxIterations, 'BranchSolver');
      sigma = Math.exp(s);
      this.stress = sigma;
      this.strain = sigma / this.E + Math.exp(m * (s - lnK));
      return;
    }
    const wE = this.wE;
    const tol = this.tol;
    for (let k = 0; k < this.maxIterations; k++) {
      const p = Math.exp(m * (s - lnK));
      const wEp = wE * p;
      const g = (sigma - a) * (sigma + a) + sigma * wEp;
      const gp = 2 * sigma + (1 + m) * wEp;
      const delta = -g / gp;
      const r = delta / sigma;
      const gpp = 2 + ((1 + m) * m * wEp) / sigma;
      const err = (gpp * delta * delta) / (2 * gp * sigma);
      const next = sigma + delta;
      const e2 = m * m * r * r;
      if ((err < 0 ? -err : err) <= tol && e2 <= tol) {
        this.stress = next;
        this.strain = next / this.E + p * (1 + m * r);
        return;
      }
      sigma = next;
      s = Math.log(sigma);
    }
    throw new ConvergenceError('BranchSolver', this.maxIterations, sigma);
  }
}
