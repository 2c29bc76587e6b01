// The stress-life route on the reference history (10^7 samples, about 15 % reversals): turning
// points and four-point rainflow with the `repeat` residue (@loopwise/rainflow), then the
// Palmgren-Miner damage of every cycle on an S-N curve with Haibach's slope 2m − 1 below the
// knee and Goodman's mean-stress correction (@loopwise/stress-life), as a ratio to the min/max
// scan of the same Float64Array (target 5, issue 12). The history is read as MPa. Inputs are
// prepared outside the timed region; the timed damage is checked against a literal evaluation
// of the curve's equations on every cycle, and the counts of the repeat residue must add up
// (every range closes: twice the cycles equals the turning points of the block).
// The same route through the engine at the defaults a user gets (assessLife with stressLife:
// the report with its loop table, timeline, events, worst loops and warnings) is the figure the
// issue's target applies to; the package route is kept beside it as its lower part.
import { assessLife } from '@loopwise/engine';
import { rainflow, turningPoints } from '@loopwise/rainflow';
import { iiwFatCurve, stressLifeDamage } from '@loopwise/stress-life';
import { referenceHistory } from '../../fixtures/generate.mjs';

const N = 1e7;
const SU = 600; // MPa, Goodman's ultimate strength (invented for timing)
const PEAK = 300; // MPa: the history is scaled (outside the timed region) so that its largest |value| is this

/** Slow reference: FAT 90, m = 3 to 1e7 cycles, then 5 (IIW, Haibach), Goodman (neutral below zero mean). */
function referenceDamage(cols) {
  const kneeRange = 90 * Math.pow(2e6 / 1e7, 1 / 3);
  let d = 0;
  for (let i = 0; i < cols.range.length; i++) {
    const sa = cols.range[i] / 2;
    const sm = cols.mean[i];
    const sar = sm < 0 ? sa : sa / (1 - sm / SU);
    const s = 2 * sar;
    if (s === 0) continue;
    const n = s >= kneeRange ? 2e6 * Math.pow(90 / s, 3) : 1e7 * Math.pow(kneeRange / s, 5);
    d += cols.count[i] / n;
  }
  return d;
}

function route(history, curve, options) {
  const { cycles } = rainflow(history, { residue: 'repeat' });
  return stressLifeDamage(curve, cycles.columns(), options).damage;
}

export async function run(h) {
  const raw = referenceHistory(N);
  let peak = 0;
  for (let i = 0; i < raw.length; i++) peak = Math.max(peak, Math.abs(raw[i]));
  const ref = raw.map((v) => (v * PEAK) / peak);
  const curve = iiwFatCurve(90); // variable amplitude: Haibach, slope 5 below the knee at 1e7
  const options = { meanStress: { method: 'goodman', ultimateStrength: SU } };
  const turning = turningPoints(ref).values.length;

  // checks, outside the timed region
  const { cycles } = rainflow(ref, { residue: 'repeat' });
  const cols = cycles.columns();
  let units = 0;
  for (let i = 0; i < cols.count.length; i++) units += 2 * cols.count[i];
  h.check(Math.abs(units - (turning - 1)) <= 2, `repeat residue: 2·cycles ${units} vs turning points ${turning}`);
  const damage = route(ref, curve, options);
  const want = referenceDamage(cols);
  h.check(Math.abs(damage / want - 1) < 1e-9, `stress-life damage ${damage} differs from the literal equations ${want}`);

  const job = { stressLife: { curve, meanStress: options.meanStress } };
  const engineDamage = assessLife(ref, job).damage.perRepeat;
  h.check(Math.abs(engineDamage / want - 1) < 1e-9, `engine stress-life damage ${engineDamage} differs from the literal equations ${want}`);

  const scan = h.scanSeconds(ref);
  const tEngine = h.measure(() => assessLife(ref, job), { warmup: 1, runs: 3 });
  const t = h.measure(() => route(ref, curve, options));
  const tDamage = h.measure(() => stressLifeDamage(curve, cols, options).damage);
  const tRainflow = h.measure(() => rainflow(ref, { residue: 'repeat' }));
  const row = (figure, seconds, target) => ({
    figure,
    ratio: seconds / scan,
    baseline: 'minmax-scan',
    baselineSeconds: scan,
    seconds,
    sizes: { samples: N, reversals: turning, cycles: cols.range.length },
    nsPerSample: (seconds / N) * 1e9,
    nsPerReversal: (seconds / turning) * 1e9,
    target,
  });
  return [
    row('stress-life/engine assessLife, stress-life route, reference history (rainflow repeat residue, IIW FAT 90 Haibach, Goodman, the whole report)', tEngine, 5),
    row('stress-life/route reference history (turning points + rainflow repeat residue + Haibach + Goodman)', t, null),
    row('stress-life/rainflow with repeat residue alone (part of the route)', tRainflow, null),
    row('stress-life/damage of the counted cycles alone (Goodman, Haibach curve, Miner sum)', tDamage, null),
  ];
}
