import { ConvergenceError, cyclicStress, type Material } from '@loopwise/material';
import { solveEnergyEquation } from './solveEnergyEquation';

/** The start table splits each binade of the amplitude into 2^CELL_BITS cells. */
const CELL_BITS = 6;
/** Doubles per cell: left end, 1 / width, four cubic coefficients. */
const STRIDE = 6;
/**
 * Cells per binade of the answer tables, tried in this order: the first whose verified error
 * meets the tolerance with the margin below is used.
 */
const ANSWER_BITS = [8, 9];
/** An answer table serves a tolerance at least this many times its verified worst error. */
const ANSWER_MARGIN = 10;
/** Doubles per answer cell: left end, 1 / width, four cubic coefficients of σ, four of ε. */
const ANSWER_STRIDE = 10;
/** Cells per binade of the strain's curve tables (the cyclic-curve inverse for `local-strain` and `linear`). */
const CURVE_BITS = 8;
/** Doubles per curve cell: left end, 1 / width, four cubic coefficients of σ. */
const CURVE_STRIDE = 6;
/**
 * Cyclic-curve solves a solver does before it builds (or fetches) the curve table: building
 * costs about as much as this many solves (nodes plus the check at three points per cell), so
 * a call with few reversals never pays for a table and a long one pays at most twice.
 */
const CURVE_AFTER = 1 << 15;
/**
 * Neuber and Glinka solves a solver does by the plain log-space Newton before it takes its
 * start and answer tables (built once per material and rule, then shared): building them costs
 * about as many solves as this, so a short call (a few hundred reversals) never pays for them
 * and a long one pays at most twice. Counted per solver, like CURVE_AFTER, so a result depends on
 * the solver's own solves only.
 */
const TABLES_AFTER = 1 << 15;
/** Index of the 32-bit word of a binary64 that holds its sign, exponent and leading bits. */
const HI_WORD = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;

/** Which local relation a {@link BranchSolver} solves. */
export type BranchKind = 'neuber' | 'glinka' | 'linear' | 'local-strain';

/**
 * The first-loading local response as a function of the pseudo-elastic amplitude a >= 0 (for
 * `local-strain`, of the local strain amplitude), fast enough for the tracker's hot path. A
 * Masing branch of range Δ is 2× the response at Δ/2. Internal; not exported from the package.
 *
 * Short calls build no table: Neuber and Glinka solve by the pure rules' plain log-space Newton
 * (to 1e-15, elastic exactly where the plastic term is below 1.1e-16 of the elastic one) until
 * the solver has done TABLES_AFTER (2^15) solves of its own; only then does it take the start
 * and answer tables below (built on the first request for a material and rule, then shared).
 * Counting per solver keeps every result independent of the calls that ran before.
 *
 * Neuber and Glinka: a cubic Hermite table of s = ln σ against a gives a start accurate to
 * about 4e-8 relative, then Newton steps on G(σ) = σ² + w·E·σ·(σ/K')^(1/n') − a² (w = 1 Neuber,
 * 2/(1 + n') Glinka) until the estimated remaining relative error C·δ² is below the tolerance:
 * one step at tolerances down to 1e-10, at most two at 1e-15 (tested). The table's cells split
 * every binade of a into 2^CELL_BITS equal parts, so a cell is found from the leading bits of
 * a's binary64 encoding, without a logarithm; nodes are solved exactly, slopes come from the
 * implicit derivative ds/dt = 2/F'(s) (t = ln a).
 * Below the table (nearly elastic) the start is σ = a, above it the full log-space solve runs.
 *
 * At looser tolerances an answer table skips the Newton step: cubic Hermite pieces of σ(a) and
 * ε(a) themselves (nodes solved to 1e-15, slopes from the implicit derivative), 2^8 or 2^9
 * cells per binade from where the plastic term is 1e-17 of the elastic one (below, σ = a and
 * ε = a/E hold to rounding) up to the start table's end. When the table is built, its error
 * is measured against the exact solve at three points in every cell (a quarter, half and
 * three quarters across, where a cubic Hermite piece errs most); the solver uses it only when
 * the tolerance is at least ANSWER_MARGIN × that worst error (in practice tolerances from
 * about 2e-11 up). Answer tables are built once per material and rule and shared.
 * Linear rule and local strain solve the cyclic-curve inverse σ(ε) (ε = a/E for the linear
 * rule): by `cyclicStress` of @loopwise/material (to about 1e-15) until the solver has done
 * CURVE_AFTER solves (its own, so a result never depends on earlier calls), then from a curve
 * table when one serves the tolerance: cubic Hermite
 * pieces of σ(ε), 2^8 cells per binade of ε from where the plastic strain is 1e-17 of the
 * elastic one (below, σ = E·ε to rounding) to e^12 times the strain where the two are equal,
 * nodes from `cyclicStress`, slopes dσ/dε = 1 / (1/E + (ε − σ/E)/(n'·σ)); its error is measured
 * against `cyclicStress` at three points in every cell, and it is used when the tolerance is
 * at least ANSWER_MARGIN × that worst error (the strain itself stays exact). Beyond the table
 * the exact inverse runs. Curve tables are built once per material and shared by both kinds.
 */
export class BranchSolver {
  /** Input of {@link solve}: the pseudo-elastic (or strain) amplitude. */
  amplitude = 0;
  /** Result of the last {@link solve}: local stress. */
  stress = 0;
  /** Result of the last {@link solve}: local strain. */
  strain = 0;
  // Numbers at declaration keep the fields untagged doubles (see NotchTracker).
  private readonly E: number = 0;
  private readonly m: number = 0;
  private readonly lnK: number = 0;
  private readonly w: number = 0;
  private readonly wE: number = 0;
  /** Cell key (leading 12 + CELL_BITS bits of the encoding) of the start table's first cell. */
  private keyLo = 0;
  /** Cells of the start table (0 until the solver takes its tables). */
  private cells = 0;
  /** Per cell: left end, 1 / width, then the cubic's coefficients in the cell fraction. */
  private tab: Float64Array = new Float64Array(0);
  /** Amplitudes up to this are elastic to rounding (plastic term below 1.1e-16 of the elastic one). */
  private readonly aElastic: number = 0;
  /** Neuber or Glinka solves done by plain Newton so far; -1 once the tables were taken. */
  private tableSolves = 0;
  /** Solves after which the tables are taken (TABLES_AFTER; tests of the tables pass 0). */
  private readonly tablesAfter: number = 0;
  /** Scratch for reading the encoding of an amplitude (the high word holds exponent and leading bits). */
  private readonly bits = new Float64Array(1);
  private readonly bitsHi = new Uint32Array(this.bits.buffer, HI_WORD * 4, 1);
  private readonly tol: number = 0;
  private readonly maxIterations: number = 0;
  /** The answer table in use (empty when the tolerance needs Newton steps), its first cell key, cells and cell bits. */
  private ans: Float64Array = new Float64Array(0);
  private ansKeyLo = 0;
  private ansCells = 0;
  private ansShift = 0;
  /** The curve table in use (empty until built or when none serves), its first cell key and cells. */
  private curve: Float64Array = new Float64Array(0);
  private curveKeyLo = 0;
  private curveCells = 0;
  /** Cyclic-curve solves done so far by `cyclicStress`; -1 once the curve table was asked for. */
  private curveSolves = 0;

  constructor(
    private readonly material: Material,
    readonly kind: BranchKind,
    tolerance: number,
    maxIterations: number,
    tablesAfter: number = TABLES_AFTER,
  ) {
    this.E = material.E;
    this.m = 1 / material.n;
    this.lnK = Math.log(material.K);
    this.w = kind === 'glinka' ? 2 / (1 + material.n) : 1;
    this.wE = this.w * this.E;
    this.tol = tolerance;
    this.maxIterations = maxIterations;
    const m = this.m;
    // ln a where the plastic term w·E·(a/K')^m / a is 1.1e-16 of the elastic one (as the pure rules)
    this.aElastic = Math.exp((Math.log(1.1e-16) - Math.log(this.w) - Math.log(this.E) + m * this.lnK) / (m - 1));
    this.tablesAfter = tablesAfter;
    if (kind !== 'neuber' && kind !== 'glinka') this.tableSolves = -1;
    else if (tablesAfter <= 0) this.useTables();
    // The start and answer tables come later: after TABLES_AFTER solves of this solver's own.
    // No shortcut to a curve table another solver already built: a solver switches after its
    // own CURVE_AFTER solves, so its results depend on its own solves only, never on which
    // calls ran before in the process (the cache only saves the build).
  }

  /** Takes the material's start table and, if one serves the tolerance, its answer table. */
  private useTables(): void {
    this.tableSolves = -1;
    const start = startTableFor(this.material, this.kind);
    this.tab = start.tab;
    this.keyLo = start.keyLo;
    this.cells = start.cells;
    const answers = answerTableFor(this.material, this.kind, this.tol);
    if (answers !== null) {
      this.ans = answers.tab;
      this.ansKeyLo = answers.keyLo;
      this.ansCells = answers.cells;
      this.ansShift = 20 - answers.bits;
    }
  }

  /** Plain log-space Newton of the energy equation (the rule functions' method) into stress, strain. */
  private solvePlain(a: number): void {
    if (a <= this.aElastic) {
      this.stress = a;
      this.strain = a / this.E;
      return;
    }
    const m = this.m;
    const lnK = this.lnK;
    const lnE = Math.log(this.E);
    // to rounding (1e-15), whatever the tolerance: a short call gets the pure rule's answer
    const s = solveEnergyEquation(2, -lnE, 1 + m, Math.log(this.w) - m * lnK, 2 * Math.log(a) - lnE, 1e-15, this.maxIterations, 'BranchSolver');
    const sigma = Math.exp(s);
    this.stress = sigma;
    this.strain = sigma / this.E + Math.exp(m * (s - lnK));
  }

  /** Takes `table` as the curve table if it serves this solver's tolerance; asks only once. */
  private useCurve(table: AnswerTable | null): void {
    this.curveSolves = -1;
    if (table === null || !(this.tol >= ANSWER_MARGIN * table.worst)) return;
    this.curve = table.tab;
    this.curveKeyLo = table.keyLo;
    this.curveCells = table.cells;
  }

  /** σ(ε) on the cyclic curve for ε >= 0: the curve table where it serves, else `cyclicStress`. */
  private curveStress(e: number): number {
    if (this.curveCells > 0) {
      this.bits[0] = e;
      const i = (this.bitsHi[0] >>> (20 - CURVE_BITS)) - this.curveKeyLo;
      if (i < 0) return this.E * e; // the plastic strain is below 1e-17 of the elastic one
      if (i < this.curveCells) {
        const t = this.curve;
        const k = CURVE_STRIDE * i;
        const f = (e - t[k]) * t[k + 1];
        return t[k + 2] + f * (t[k + 3] + f * (t[k + 4] + f * t[k + 5]));
      }
    } else if (this.curveSolves >= 0 && ++this.curveSolves >= CURVE_AFTER) {
      this.useCurve(curveTableFor(this.material));
    }
    return cyclicStress(this.material, e);
  }

  /**
   * Solves for `amplitude` (finite, >= 0) and leaves the result in `stress` and `strain`. Input
   * and output are fields, not an argument and a return value: a double passed to or returned
   * from a call that is not inlined is boxed, one heap allocation per solve.
   */
  solve(): void {
    const a = this.amplitude;
    const kind = this.kind;
    if (kind === 'local-strain') {
      this.strain = a;
      this.stress = this.curveStress(a);
      return;
    }
    if (kind === 'linear') {
      const e = a / this.E;
      this.strain = e;
      // a strain that overflows leaves Infinity for the tracker to report with its sample
      this.stress = e < Infinity ? this.curveStress(e) : e;
      return;
    }
    if (a === 0) {
      this.stress = a;
      this.strain = a / this.E;
      return;
    }
    if (this.tableSolves >= 0) {
      if (++this.tableSolves < this.tablesAfter) {
        this.solvePlain(a);
        return;
      }
      this.useTables();
    }
    this.bits[0] = a;
    if (this.ansCells > 0) {
      const i = (this.bitsHi[0] >>> this.ansShift) - this.ansKeyLo;
      if (i < 0) {
        this.stress = a; // the plastic term is below 1e-17 of the elastic one
        this.strain = a / this.E;
        return;
      }
      if (i < this.ansCells) {
        const t = this.ans;
        const k = ANSWER_STRIDE * i;
        const f = (a - t[k]) * t[k + 1];
        this.stress = t[k + 2] + f * (t[k + 3] + f * (t[k + 4] + f * t[k + 5]));
        this.strain = t[k + 6] + f * (t[k + 7] + f * (t[k + 8] + f * t[k + 9]));
        return;
      }
    }
    const m = this.m;
    const lnK = this.lnK;
    // The cell from the exponent and leading mantissa bits: no logarithm needed to find it.
    const j = (this.bitsHi[0] >>> (20 - CELL_BITS)) - this.keyLo;
    let sigma: number;
    let s: number;
    if (j < 0) {
      sigma = a;
      s = Math.log(a);
    } else if (j < this.cells) {
      const tab = this.tab;
      const k = STRIDE * j;
      const f = (a - tab[k]) * tab[k + 1];
      s = tab[k + 2] + f * (tab[k + 3] + f * (tab[k + 4] + f * tab[k + 5]));
      sigma = Math.exp(s);
    } else {
      const lnE = Math.log(this.E);
      s = solveEnergyEquation(2, -lnE, 1 + m, Math.log(this.w) - m * lnK, 2 * Math.log(a) - lnE, this.tol, this.maxIterations, 'BranchSolver');
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
      // delta = 0 is the root itself; it also stops the subnormal amplitudes, where gp·σ
      // underflows and err is 0/0
      if (delta === 0 || ((err < 0 ? -err : err) <= tol && e2 <= tol)) {
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

/** An answer table of σ(a) and ε(a) (see {@link BranchSolver}) with its verified worst relative error. */
interface AnswerTable {
  bits: number;
  keyLo: number;
  cells: number;
  tab: Float64Array;
  worst: number;
}

/** Answer tables by material, then by rule and cell bits (null: the table could not be built). */
const answerTables = new WeakMap<Material, Map<string, AnswerTable | null>>();

/** The coarsest answer table that serves `tolerance` for this material and rule, or null. */
function answerTableFor(material: Material, kind: BranchKind, tolerance: number): AnswerTable | null {
  let byKey = answerTables.get(material);
  if (byKey === undefined) {
    byKey = new Map();
    answerTables.set(material, byKey);
  }
  for (const bits of ANSWER_BITS) {
    const key = `${kind}/${bits}`;
    let t = byKey.get(key);
    if (t === undefined) {
      t = buildAnswerTable(material, kind, bits);
      byKey.set(key, t);
    }
    if (t !== null && tolerance >= ANSWER_MARGIN * t.worst) return t;
    // a finer table is only worth building when this one came close
    if (t === null || tolerance < t.worst) return null;
  }
  return null;
}

/** Builds and verifies an answer table with 2^bits cells per binade (null if the range is unusable). */
/** Constants of the energy equation σ² + w·E·σ·(σ/K')^m = a² (m = 1/n') of a material and rule, for the tables. */
interface EnergyConstants {
  E: number;
  m: number;
  lnK: number;
  lnE: number;
  lnW: number;
  /** t* = ln a where the elastic and plastic terms are equal. */
  tStar: number;
}

function energyConstants(material: Material, kind: BranchKind): EnergyConstants {
  const E = material.E;
  const m = 1 / material.n;
  const lnK = Math.log(material.K);
  const lnE = Math.log(E);
  const lnW = Math.log(kind === 'glinka' ? 2 / (1 + material.n) : 1);
  return { E, m, lnK, lnE, lnW, tStar: (m * lnK - lnW - lnE) / (m - 1) };
}

/** s = ln σ at amplitude a, solved to 1e-15, and ds/dt (t = ln a) = 2(1 + q)/(2 + (1 + m)q), q the plastic-to-elastic ratio. */
function energyRoot(c: EnergyConstants, a: number): { s: number; slope: number } {
  const s = solveEnergyEquation(2, -c.lnE, 1 + c.m, c.lnW - c.m * c.lnK, 2 * Math.log(a) - c.lnE, 1e-15, 100, 'BranchSolver');
  const q = Math.exp((c.m - 1) * s + c.lnW - c.m * c.lnK + c.lnE);
  return { s, slope: (2 * (1 + q)) / (2 + (1 + c.m) * q) };
}

function buildAnswerTable(material: Material, kind: BranchKind, bits: number): AnswerTable | null {
  const c = energyConstants(material, kind);
  const { E, m, lnK, tStar } = c;
  const binLo = Math.floor((tStar + Math.log(1e-17) / (m - 1)) / Math.LN2);
  const binHi = Math.ceil((tStar + 12) / Math.LN2);
  // exact σ, ε at amplitude a, then their slopes in a
  return hermiteTable(binLo, binHi, bits, 2, (a, out) => {
    const { s, slope } = energyRoot(c, a);
    const sg = Math.exp(s);
    const plastic = Math.exp(m * (s - lnK));
    const dsg = (sg * slope) / a; // dσ/da from ds/dt, t = ln a
    out[0] = sg;
    out[1] = sg / E + plastic;
    out[2] = dsg;
    out[3] = (1 / E + (m * plastic) / sg) * dsg;
  });
}

/** Key of the curve table in {@link answerTables} (one per material: both kinds invert the same curve). */
const CURVE_KEY = `curve/${CURVE_BITS}`;

/** The material's curve table (built on first request and shared), or null if its range is unusable. */
function curveTableFor(material: Material): AnswerTable | null {
  let byKey = answerTables.get(material);
  if (byKey === undefined) {
    byKey = new Map();
    answerTables.set(material, byKey);
  }
  let t = byKey.get(CURVE_KEY);
  if (t === undefined) {
    t = buildCurveTable(material);
    byKey.set(CURVE_KEY, t);
  }
  return t;
}

/** Builds and verifies the curve table σ(ε) of a material (see {@link BranchSolver}). */
function buildCurveTable(material: Material): AnswerTable | null {
  const E = material.E;
  const m = 1 / material.n;
  const lnK = Math.log(material.K);
  const lnE = Math.log(E);
  // ln σ* where the elastic and plastic strains are equal; the strain there is 2σ*/E
  const lnSigmaStar = (m * lnK - lnE) / (m - 1);
  const lnEpsStar = lnSigmaStar - lnE + Math.LN2;
  const binLo = Math.floor((lnSigmaStar - lnE + Math.log(1e-17) / (m - 1)) / Math.LN2);
  const binHi = Math.ceil((lnEpsStar + 12) / Math.LN2);
  // exact σ at strain e, then dσ/dε = 1 / (1/E + εp/(n'·σ))
  return hermiteTable(binLo, binHi, CURVE_BITS, 1, (e, out) => {
    const sigma = cyclicStress(material, e);
    out[0] = sigma;
    out[1] = 1 / (1 / E + (e - sigma / E) / (material.n * sigma));
  });
}

/**
 * Cubic Hermite pieces of `width` functions of x over the binades [2^binLo, 2^binHi), 2^bits
 * equal cells per binade; per cell: left end, 1 / width of the cell, then four coefficients in
 * the cell fraction per function. `exact(x, out)` writes the functions' values to out[0..width)
 * and their slopes in x to out[width..2·width). The table's worst relative error is measured
 * against `exact` a quarter, half and three quarters across every cell, where a cubic Hermite
 * piece errs most. Null when the range is unusable or an error is NaN or infinite.
 */
function hermiteTable(binLo: number, binHi: number, bits: number, width: number, exact: (x: number, out: Float64Array) => void): AnswerTable | null {
  if (!(binLo >= -1020 && binHi <= 1020 && binHi > binLo)) return null;
  const stride = 2 + 4 * width;
  const perBinade = 1 << bits;
  const cells = (binHi - binLo) << bits;
  const tab = new Float64Array(stride * cells);
  const left = new Float64Array(2 * width);
  const right = new Float64Array(2 * width);
  let xL = 0;
  for (let j = 0; j <= cells; j++) {
    const x = Math.pow(2, binLo + (j >> bits)) * (1 + (j & (perBinade - 1)) / perBinade); // exact
    exact(x, right);
    if (j > 0) {
      const h = x - xL;
      const k = stride * (j - 1);
      tab[k] = xL;
      tab[k + 1] = 1 / h;
      for (let c = 0; c < width; c++) hermite(tab, k + 2 + 4 * c, left[c], right[c], left[width + c] * h, right[width + c] * h);
    }
    xL = x;
    left.set(right);
  }
  let worst = 0;
  for (let j = 0; j < cells; j++) {
    const k = stride * j;
    for (let q = 1; q <= 3; q++) {
      const f = q / 4;
      exact(tab[k] + f / tab[k + 1], right);
      for (let c = 0; c < width; c++) {
        const o = k + 2 + 4 * c;
        const got = tab[o] + f * (tab[o + 1] + f * (tab[o + 2] + f * tab[o + 3]));
        const err = Math.abs(got / right[c] - 1);
        if (!(err < Infinity)) return null; // NaN or overflow: no table
        if (err > worst) worst = err;
      }
    }
  }
  return { bits, keyLo: (binLo + 1023) << bits, cells, tab, worst };
}

/** Cubic Hermite coefficients in the cell fraction f from end values y0, y1 and slopes d0, d1 (per unit f). */
function hermite(tab: Float64Array, k: number, y0: number, y1: number, d0: number, d1: number): void {
  tab[k] = y0;
  tab[k + 1] = d0;
  tab[k + 2] = 3 * (y1 - y0) - 2 * d0 - d1;
  tab[k + 3] = 2 * (y0 - y1) + d0 + d1;
}

/** A start table of s = ln σ against the amplitude (see {@link BranchSolver}). */
interface StartTable {
  keyLo: number;
  cells: number;
  tab: Float64Array;
}

/** Start tables by material and rule (built on first request, then shared). */
const startTables = new WeakMap<Material, Map<BranchKind, StartTable>>();

/** The start table of a material and rule, built on first request and shared. */
function startTableFor(material: Material, kind: BranchKind): StartTable {
  let byKind = startTables.get(material);
  if (byKind === undefined) {
    byKind = new Map();
    startTables.set(material, byKind);
  }
  let t = byKind.get(kind);
  if (t === undefined) {
    t = buildStartTable(material, kind);
    byKind.set(kind, t);
  }
  return t;
}

/**
 * Cubic Hermite table of s = ln σ against the amplitude a, 2^CELL_BITS cells per binade, from
 * where the plastic term is 1e-6 of the elastic one to e^12 above the amplitude where the two
 * are equal; nodes solved to 1e-15, slopes ds/dt = 2/F'(s) (t = ln a).
 */
function buildStartTable(material: Material, kind: BranchKind): StartTable {
  const c = energyConstants(material, kind);
  // the table spans from where the plastic term is 1e-6 of the elastic one to e^12 above t*,
  // whole binades of a.
  const { m, tStar } = c;
  const tLo = tStar + Math.log(1e-6) / (m - 1);
  const tHi = tStar + 12;
  const binLo = Math.max(-1020, Math.min(1020, Math.floor(tLo / Math.LN2)));
  const binHi = Math.max(binLo, Math.min(1020, Math.ceil(tHi / Math.LN2)));
  const cells = (binHi - binLo) << CELL_BITS;
  const tab = new Float64Array(STRIDE * cells);
  const perBinade = 1 << CELL_BITS;
  let aL = 0;
  let sL = 0;
  let dL = 0;
  for (let j = 0; j <= cells; j++) {
    const a = Math.pow(2, binLo + (j >> CELL_BITS)) * (1 + (j & (perBinade - 1)) / perBinade); // exact
    const { s: sj, slope: dj } = energyRoot(c, a); // ds/dt at the node, t = ln a
    if (j > 0) {
      // Cubic Hermite on cell j − 1 = [aL, a] in its fraction f = (a' − aL) / width, with
      // ds/df = ds/dt · width / a' at either end.
      const width = a - aL;
      const d0 = (dL * width) / aL;
      const d1 = (dj * width) / a;
      const k = STRIDE * (j - 1);
      tab[k] = aL;
      tab[k + 1] = 1 / width;
      tab[k + 2] = sL;
      tab[k + 3] = d0;
      tab[k + 4] = 3 * (sj - sL) - 2 * d0 - d1;
      tab[k + 5] = 2 * (sL - sj) + d0 + d1;
    }
    aL = a;
    sL = sj;
    dL = dj;
  }
  return { keyLo: (binLo + 1023) << CELL_BITS, cells, tab };
}
