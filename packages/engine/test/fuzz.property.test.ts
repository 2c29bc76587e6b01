import { appendFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import { assessDutyCycle, assessLife, LifeSession, type LifeJob, type LifeReport } from '@loopwise/engine';
import { defineMaterial, handbookSteels, type Material } from '@loopwise/material';
import { NotchTracker, RepeatingNotchTracker } from '@loopwise/notch';
import { rainflow, RainflowCounter } from '@loopwise/rainflow';

// Seeded fuzz over the whole engine (issue 15): random histories with ties, plateaus, spikes,
// offsets and magnitudes from subnormal to near overflow; handbook materials and materials at
// the edges of the domain defineMaterial accepts; every rule, input and correction; chunked
// streams. Invented data, for robustness only. Checks: only documented errors (a LoopwiseError
// with a code), no NaN or undefined in any report field, damage >= 0, lives > 0, design lives
// > 0, the same JSON from a second call, and the streamed session and counters equal the batch
// results. The run collects every
// failure by kind and fails with the first example of each, so the counts are in the output.
// LOOPWISE_FUZZ_RUNS sets the number of cases (default 3000, about 6 s on two shared cores).
const RUNS = Number(process.env.LOOPWISE_FUZZ_RUNS ?? 3000);

const sae1045 = handbookSteels.find((m) => m.name!.startsWith('SAE 1045'))!;
const { warnings: _w, ...saeInput } = sae1045;

const logUniform = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((e) => 10 ** e);
const edgeMaterial: fc.Arbitrary<Material> = fc
  .record({
    E: logUniform(-3, 12),
    sigmaF: logUniform(-3, 12),
    b: fc.oneof(logUniform(-6, 0.2), fc.constantFrom(1e-300, 1e-9)).map((v) => -v),
    epsilonF: logUniform(-6, 3),
    c: fc.oneof(logUniform(-6, 0.3), fc.constantFrom(1e-300, 1e-9)).map((v) => -v),
    K: logUniform(-3, 12),
    n: fc.oneof(fc.double({ min: 0.01, max: 0.5, noNaN: true }), fc.constantFrom(0.01, 0.5)),
    Su: fc.option(logUniform(1, 4), { nil: undefined }),
  })
  .map((m) => defineMaterial(m.Su === undefined ? { ...m, Su: undefined } : m));
const nearHandbook: fc.Arbitrary<Material> = fc
  .record({ n: fc.constantFrom(0.01, 0.05, 0.3, 0.5), K: logUniform(2, 4) })
  .map((v) => defineMaterial({ ...saeInput, ...v }));
const material = fc.oneof(fc.constantFrom(...handbookSteels), edgeMaterial, nearHandbook);

const shape = fc.constantFrom('random', 'ties', 'plateaus', 'spike', 'steps');
const history = fc
  .tuple(
    shape,
    fc.oneof(
      { weight: 9, arbitrary: fc.array(fc.integer({ min: -50, max: 50 }), { minLength: 1, maxLength: 60 }) },
      // long enough for the tables of the life solves (256 loops and more)
      { weight: 1, arbitrary: fc.array(fc.integer({ min: -50, max: 50 }), { minLength: 600, maxLength: 1200 }) },
    ),
    fc.oneof(logUniform(-320, -300), logUniform(-200, 200), logUniform(300, 307.5), fc.constantFrom(1, 100, 300)),
    fc.oneof(fc.constant(0), fc.integer({ min: -40, max: 40 })),
  )
  .map(([kind, base, scale, offset]) => {
    let h = base;
    if (kind === 'ties') h = base.map((_x, i) => (i % 2 === 0 ? Math.abs(base[0]) : -Math.abs(base[0])));
    else if (kind === 'plateaus') h = base.flatMap((x) => [x, x, x]);
    else if (kind === 'spike') h = base.map((x, i) => (i === base.length >> 1 ? x * 40 : x));
    else if (kind === 'steps') h = base.map((x) => Math.sign(x) * 10);
    return h.map((x) => (x + offset) * (scale / 50));
  })
  .filter((h) => h.every((x) => Number.isFinite(x)));

const job = fc.record({
  input: fc.constantFrom('nominal', 'nominal', 'pseudo-elastic', 'local-strain'),
  Kt: fc.double({ min: 1, max: 3, noNaN: true }),
  rule: fc.constantFrom('neuber', 'glinka', 'linear'),
  meanStress: fc.constantFrom('none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker'),
  walkerGamma: fc.option(fc.double({ min: 0.05, max: 1, noNaN: true }), { nil: undefined }),
  repeating: fc.boolean(),
  gate: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: undefined }),
  criticalDamage: fc.option(fc.oneof(fc.constant(1e-300), fc.double({ min: 0.1, max: 3, noNaN: true })), { nil: undefined }),
  scatterFactor: fc.option(fc.oneof(fc.constant(1e300), fc.double({ min: 1, max: 20, noNaN: true })), { nil: undefined }),
  cutoffCycles: fc.option(fc.oneof(fc.constant(1), fc.double({ min: 1e3, max: 1e9, noNaN: true })), { nil: undefined }),
  offsetShare: fc.option(fc.double({ min: -1, max: 1, noNaN: true }), { nil: undefined }),
  loadToStress: fc.option(fc.oneof(fc.constant(1e-300), fc.double({ min: 0.01, max: 100, noNaN: true })), { nil: undefined }),
  repeats: fc.integer({ min: 1, max: 5 }),
});

type Kind = string;
const failures = new Map<Kind, { count: number; example: string }>();
function fail(kind: Kind, example: unknown): void {
  const f = failures.get(kind);
  if (f) f.count++;
  else {
    const text = JSON.stringify(example, exampleValue);
    failures.set(kind, { count: 1, example: text.slice(0, 3000) });
    // LOOPWISE_FUZZ_DUMP=<file> appends the first whole example of each kind (to replay it)
    if (process.env.LOOPWISE_FUZZ_DUMP) appendFileSync(process.env.LOOPWISE_FUZZ_DUMP, `${JSON.stringify({ kind, example: JSON.parse(text) })}\n`);
  }
}

/** A failing case for the message: the job without the material (given once, its numbers only), non-finite numbers as text. */
function exampleValue(key: string, v: unknown): unknown {
  if (key === 'material') return undefined;
  if (key === 'm' && v !== null && typeof v === 'object') {
    const { E, sigmaF, b, epsilonF, c, K, n, Su } = v as Material;
    return { E, sigmaF, b, epsilonF, c, K, n, Su };
  }
  if (typeof v === 'number' && !Number.isFinite(v)) return String(v);
  if (typeof v === 'bigint') return String(v);
  return v;
}

/**
 * Every leaf of a report: no NaN, no undefined (typed arrays read through). The echo of the
 * job's optional fields in `report.inputs` (Kf beside Kt, walkerGamma, the material's name)
 * may be undefined: absent, as JSON writes it.
 */
function badLeaf(value: unknown, path = 'report'): string | undefined {
  if (value === undefined) return path.startsWith('report.inputs.') ? undefined : `${path} is undefined`;
  if (typeof value === 'number') return value !== value ? `${path} is NaN` : undefined;
  if (ArrayBuffer.isView(value)) {
    const a = value as unknown as ArrayLike<number>;
    for (let i = 0; i < a.length; i++) if (a[i] !== a[i]) return `${path}[${i}] is NaN`;
    return undefined;
  }
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const bad = badLeaf(v, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return undefined;
}

const plain = (r: LifeReport) => JSON.stringify(r, (_k, v) => (ArrayBuffer.isView(v) ? Array.from(v as Float64Array) : typeof v === 'number' && !Number.isFinite(v) ? String(v) : v));

function errorKind(e: unknown, where: string): Kind | undefined {
  if (e instanceof LoopwiseError && typeof e.code === 'string' && e.code !== 'not-converged') return undefined;
  const name = e instanceof Error ? `${e.name}: ${e.message.replace(/[-\d.e+]+/g, '#').slice(0, 80)}` : String(e);
  return `${where}: undocumented error ${name}`;
}

/** The first path at which two JSON values differ, with both values there. */
function firstDifference(a: unknown, b: unknown, path = ''): string {
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    for (const k of new Set([...Object.keys(a), ...Object.keys(b)])) {
      const x = (a as Record<string, unknown>)[k];
      const y = (b as Record<string, unknown>)[k];
      if (JSON.stringify(x) !== JSON.stringify(y)) return firstDifference(x, y, `${path}.${k}`);
    }
    return path;
  }
  return `${path}: stream ${JSON.stringify(a)}, batch ${JSON.stringify(b)}`;
}

function cutsOf(n: number, seed: number): number[] {
  const cuts: number[] = [];
  for (let at = (seed % 5) + 1; at < n; at += (seed % 7) + 1) cuts.push(at);
  return cuts;
}

function streamed(h: number[], cuts: number[], j: LifeJob): LifeReport {
  const s = new LifeSession(j);
  let at = 0;
  for (const c of [...cuts, h.length]) {
    s.push(h.slice(at, c));
    at = c;
  }
  let left = s.endFirstPass();
  for (let i = 0; left > 0; i += 3) {
    const part = h.slice(i, i + 3);
    s.pushSecondPass(part);
    left -= part.length;
  }
  return s.finish();
}

describe('fuzz over rainflow, the notch trackers, assessLife and LifeSession (issue 15)', () => {
  test(`${RUNS} seeded cases: only documented errors, no NaN or undefined, damage >= 0, lives > 0, stream = batch`, () => {
    failures.clear();
    let cases = 0;
    const documented = new Map<string, number>();
    let gateOffsetCases = 0;
    let gateOffsetDiffering = 0;
    fc.assert(
      fc.property(history, material, job, fc.nat(1000), (h, m, jo, seed) => {
        cases++;
        const cuts = cutsOf(h.length, seed);
        // rainflow, batch and counter in chunks
        let batchCycles: string | undefined;
        try {
          const r = rainflow(h, { residue: jo.repeating ? 'repeat' : 'half' });
          batchCycles = JSON.stringify(r.cycles!.toJSON());
        } catch (e) {
          const k = errorKind(e, 'rainflow');
          if (k) fail(k, { h });
        }
        try {
          const c = new RainflowCounter({ residue: jo.repeating ? 'repeat' : 'half' });
          let at = 0;
          for (const cut of [...cuts, h.length]) {
            c.push(h.slice(at, cut));
            at = cut;
          }
          const got = JSON.stringify(c.finish().cycles!.toJSON());
          if (batchCycles !== undefined && got !== batchCycles) fail('RainflowCounter in chunks differs from rainflow', { h, cuts });
        } catch (e) {
          const k = errorKind(e, 'RainflowCounter');
          if (k) fail(k, { h });
          else if (batchCycles !== undefined) fail('RainflowCounter threw where rainflow did not', { h, cuts, e: String(e) });
        }
        // the notch trackers
        const nominal = jo.input === 'nominal';
        const trackerOptions = { material: m, input: jo.input as 'nominal', rule: jo.rule as 'neuber', ...(nominal ? { Kt: jo.Kt } : {}) };
        try {
          const t = new NotchTracker(trackerOptions);
          t.push(h);
          const r = t.end();
          const bad = badLeaf(r.loops.columns(), 'loops');
          if (bad) fail(`NotchTracker: ${bad.replace(/\[\d+\]/, '[i]')}`, { h, m, jo });
          const rep = new RepeatingNotchTracker(trackerOptions);
          rep.push(h, Float64Array.from(h, (_x, i) => i), 0, h.length, 1);
        } catch (e) {
          const k = errorKind(e, 'notch tracker');
          if (k) fail(k, { h, m, jo });
        }
        // the engine, batch and stream
        const j: LifeJob = {
          material: m,
          input: jo.input as 'nominal',
          rule: jo.rule as 'neuber',
          ...(nominal ? { notch: { Kt: jo.Kt } } : {}),
          meanStress: jo.meanStress as 'none',
          repeating: jo.repeating,
          ...(jo.meanStress === 'walker' && jo.walkerGamma !== undefined ? { walkerGamma: jo.walkerGamma } : {}),
          ...(jo.gate !== undefined ? { gate: jo.gate * Math.max(...h.map(Math.abs)) } : {}),
          ...(jo.criticalDamage !== undefined ? { criticalDamage: jo.criticalDamage } : {}),
          ...(jo.scatterFactor !== undefined ? { scatterFactor: jo.scatterFactor } : {}),
          ...(jo.cutoffCycles !== undefined ? { cutoffCycles: jo.cutoffCycles } : {}),
          ...(jo.offsetShare !== undefined ? { offset: jo.offsetShare * Math.max(...h.map(Math.abs)), initial: jo.offsetShare * h[0] } : {}),
          ...(jo.loadToStress !== undefined && nominal ? { loadToStress: jo.loadToStress } : {}),
        };
        let batch: LifeReport | undefined;
        try {
          batch = assessLife(h, j);
        } catch (e) {
          const k = errorKind(e, 'assessLife');
          if (k) fail(k, { h, m, j });
          else {
            const code = (e as LoopwiseError).code;
            if (!documented.has(code) && process.env.LOOPWISE_FUZZ_DUMP) {
              appendFileSync(process.env.LOOPWISE_FUZZ_DUMP, `${JSON.stringify({ documented: code, message: (e as Error).message, example: JSON.parse(JSON.stringify({ h, m, j }, exampleValue)) })}\n`);
            }
            documented.set(code, (documented.get(code) ?? 0) + 1);
          }
        }
        if (batch !== undefined && seed % 10 === 0) {
          // the same call again gives the same JSON (no result depends on earlier calls)
          if (plain(assessLife(h, j)) !== plain(batch)) fail('assessLife twice: the JSON differs', { h, m, j });
        }
        if (batch !== undefined) {
          const bad = badLeaf(batch);
          if (bad) fail(`assessLife: ${bad.replace(/\[\d+\]/g, '[i]')}`, { h, m, j });
          if (!(batch.damage.perRepeat >= 0)) fail('assessLife: damage.perRepeat < 0', { h, m, j });
          if (!(batch.life.repeats > 0)) fail('assessLife: life.repeats not > 0', { h, m, j, life: batch.life });
          if (!(batch.life.designRepeats > 0)) fail('assessLife: life.designRepeats not > 0', { life: batch.life, h, m, j });
        }
        // a duty cycle of the history and its reverse, each repeated
        try {
          const d = assessDutyCycle([{ name: 'a', history: h, repeats: jo.repeats }, { name: 'b', history: h.slice().reverse(), repeats: 1 }], j);
          const bad = badLeaf(d);
          if (bad) fail(`assessDutyCycle: ${bad.replace(/\[\d+\]/g, '[i]')}`, { h, m, j });
          if (!(d.damage.perRepeat >= 0) || !(d.life.repeats > 0) || !(d.life.designRepeats > 0)) fail('assessDutyCycle: damage < 0 or a life not > 0', { life: d.life, h, m, j });
        } catch (e) {
          const k = errorKind(e, 'assessDutyCycle');
          if (k) fail(k, { h, m, j });
        }
        // With a gate, stream = batch failed in 6 of 20000 cases until the session's second read
        // went on until the gate had settled the largest |value| (LifeSession.settledThrough);
        // gated cases are counted and checked like the others now.
        const gated = j.gate !== undefined && j.gate > 0;
        if (gated) gateOffsetCases++;
        const knownGateOffset = false;
        // the session without kept loops: the same damage, life and warnings
        if (batch !== undefined && !knownGateOffset) {
          try {
            const s = new LifeSession(j, { keepLoops: false, timelineBinSize: 7 });
            s.push(h);
            if (s.endFirstPass() > 0) s.pushSecondPass(h);
            const r = s.finish();
            const same = (a: number, b: number) => a === b || Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));
            if (!same(r.damage.perRepeat, batch.damage.perRepeat) || !same(r.life.repeats, batch.life.repeats)) fail('LifeSession({ keepLoops: false }) damage or life differs', { h, m, j });
            // warnings by code: their numbers come from running totals, equal to rounding only
            if (JSON.stringify(r.warnings.map((w) => w.code)) !== JSON.stringify(batch.warnings.map((w) => w.code))) {
              fail('LifeSession({ keepLoops: false }) warnings differ', { stream: r.warnings, batch: batch.warnings, m, j, h });
            }
          } catch (e) {
            fail(`LifeSession({ keepLoops: false }) threw where assessLife did not: ${errorKind(e, '') ?? (e as LoopwiseError).code}`, { h, m, j });
          }
        }
        try {
          const s = streamed(h, cuts, j);
          if (batch === undefined) fail('LifeSession gave a report where assessLife threw', { h, cuts, m, j });
          else if (plain(s) !== plain(batch) && knownGateOffset) {
            gateOffsetDiffering++;
            if (process.env.LOOPWISE_FUZZ_DUMP) appendFileSync(process.env.LOOPWISE_FUZZ_DUMP, `${JSON.stringify({ kind: 'gate: stream differs from batch', example: JSON.parse(JSON.stringify({ h, cuts, m, j }, exampleValue)) })}\n`);
          }
          else if (plain(s) !== plain(batch)) {
            const a = JSON.parse(plain(s));
            const b = JSON.parse(plain(batch));
            const differing = Object.keys(b).filter((k) => JSON.stringify(a[k]) !== JSON.stringify(b[k]));
            fail(`LifeSession report differs from assessLife in ${differing.join(', ')}`, { first: firstDifference(a, b), m, j, cuts, h });
          }
        } catch (e) {
          const k = errorKind(e, 'LifeSession');
          if (k) fail(k, { h, cuts, m, j });
          else if (batch !== undefined) fail('LifeSession threw where assessLife did not', { h, cuts, m, j, e: String(e) });
        }
      }),
      { numRuns: RUNS },
    );
    const summary = [...failures.entries()].map(([k, v]) => `${v.count} × ${k}\n    e.g. ${v.example}`);
    const codes = [...documented.entries()].map(([c, n]) => `${n} ${c}`).join(', ');
    console.log(`fuzz: ${cases} cases; documented input errors from assessLife: ${codes || 'none'}; with a gate: ${gateOffsetCases} cases (stream = batch checked; ${gateOffsetDiffering} differ); ${summary.length} failure kinds${summary.length ? `:\n  ${summary.join('\n  ')}` : ''}`);
    expect(summary).toEqual([]);
  }, Math.max(60_000, RUNS * 5));
});

describe('regressions the fuzz found (issue 15)', () => {
  test('assessLife([0.24, 0.2]) on local strain with SWT and b = -1e-300 gives a report (solveTwoTermReversals stopped only at its cap: ConvergenceError)', () => {
    const m = defineMaterial({ E: 999999999999.9264, sigmaF: 1, b: -1e-300, epsilonF: 1, c: -1, K: 1, n: 0.18545695337427173, Su: 22.153010951940615 });
    const r = assessLife([0.24, 0.2], { material: m, input: 'local-strain', meanStress: 'smithWatsonTopper', repeating: false });
    expect(r.damage.perRepeat).toBeGreaterThanOrEqual(0);
  });

  test('assessLife with criticalDamage 1e-300 and scatterFactor 1e300 throws invalid-scatter-factor instead of designRepeats 0', () => {
    expect(() => assessLife([0, 300, -300, 300], { material: sae1045, notch: { Kt: 2 }, criticalDamage: 1e-300, scatterFactor: 1e300 })).toThrow(
      expect.objectContaining({ code: 'invalid-scatter-factor', field: 'scatterFactor' }),
    );
  });

  test('assessLife([1e-300]) and [0, x, -x, x] from 5e-324 to 1e150 give reports; 1e190 to 1.7e308 the outside-model error naming the sample', () => {
    expect(assessLife([1e-300], { material: sae1045 }).damage.perRepeat).toBe(0);
    for (const x of [5e-324, 1e-200, 1e-163, 1e-100, 1, 300, 1e150]) {
      const r = assessLife([0, x, -x, x], { material: sae1045, notch: { Kt: 2 } });
      expect(r.life.repeats).toBeGreaterThan(0);
    }
    for (const x of [1e190, 1e300, 1.7e308]) {
      expect(() => assessLife([0, x, -x, x], { material: sae1045, notch: { Kt: 2 } })).toThrow(expect.objectContaining({ code: 'outside-model' }));
    }
  });

  test('assessLife on a material with n\' = 1e-9 is refused by validation with the reason, not a ConvergenceError', () => {
    expect(() => assessLife([0, 300, -300, 300], { material: { ...saeInput, n: 1e-9 }, notch: { Kt: 2 } })).toThrow(expect.objectContaining({ code: 'invalid-material' }));
  });

  test('the gate bound of a history near the largest double is Infinity, not an error naming strain or pseudoStress (gateBoundAt)', () => {
    // found by the fuzz (seed 3): the bound's envelope point, largest |value| plus the gate, overflows
    const cases = [
      { h: [-6.541496568119417e+305, 5.606997058388072e+306, 3.6445480879522465e+306, 6.634946519092552e+306, 2.6165986272477668e+306, 9.700104911011364e+307, 5.606997058388072e+306, 8.130145734662704e+306, 4.765947499629861e+306, 1.6820991175164215e+306, 3.9248979408716505e+306], m: {"E": 1, "sigmaF": 999999999999.9795, "b": -1e-300, "epsilonF": 1, "c": -1e-300, "K": 1, "n": 0.5, "Su": 1312.3617652850967}, j: {"input": "local-strain", "rule": "neuber", "meanStress": "none", "repeating": false, "gate": 9.700104911011358e+307, "criticalDamage": 1e-300, "scatterFactor": 1e+300, "cutoffCycles": 21406912.877373904} },
      { h: [-6.282253065646541e+306, -3.926408166029088e+305, -6.020492521244602e+306, -2.617605444019392e+306, 1.8323238108135743e+306, 1.2564506131293082e+308, 6.020492521244602e+306, -5.235210888038784e+306, 5.627851704641692e+306, 3.533767349426179e+306], m: {"E": 1, "sigmaF": 1, "b": -1e-300, "epsilonF": 1.0000000000036702, "c": -1, "K": 999999999999.9346, "n": 0.01, "Su": 30.482067735641134}, j: {"input": "nominal", "rule": "linear", "notch": {"Kt": 1.7858114533195}, "meanStress": "none", "repeating": true, "gate": 1.2564506131293076e+308, "criticalDamage": 1e-300, "cutoffCycles": 47004683.63161949, "offset": -3.1038454182168093e-15, "initial": 1.5519227091084047e-16, "loadToStress": 1e-300} },
    ];
    for (const c of cases) {
      const r = assessLife(c.h, { ...c.j, material: defineMaterial(c.m) } as LifeJob);
      const w = r.warnings.find((x) => x.code === 'gate-removed-damage');
      expect(w?.details.damageBound).toBe(Infinity);
    }
  });
});
