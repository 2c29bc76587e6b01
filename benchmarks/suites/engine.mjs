// The life pipeline: the reference history (10^7 samples) through turning points, the Neuber
// notch tracker in repeating mode, Smith-Watson-Topper and the Palmgren-Miner sum, as a ratio
// to the min/max scan and to the compute-bound baseline (10^7 Math.exp calls); and a duty cycle
// of one 10^5-sample event repeated 10^6 times, as a ratio to one pass of the pipeline over the
// event. The job sets no solve tolerance: the figures measure the engine's default, what a user
// gets. Results are checked: the pipeline on a leading subset against a slow path assembled from
// the lower packages' plain functions, and the duty cycle against 10^6 × the damage of the
// event's stabilised pass. A history in which every sample is a turning point (the flight
// spectrum of fixtures/generate.mjs) is timed per turning point against the reference history;
// see everySampleReverses below.
import { assessDutyCycle, assessLife } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { smithWatsonTopper } from '@loopwise/mean-stress';
import { trackNotchRepeating } from '@loopwise/notch';
import { turningPoints } from '@loopwise/rainflow';
import { FLIGHT_SPECTRUM_UNITS, flightSpectrum, referenceHistory } from '../../fixtures/generate.mjs';

const N = 1e7;
const SUBSET = 20000;
// SAE 1045 of the handbook table (Dowling, Table 14.1); the reference history read as nominal MPa
const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)');
const job = Object.freeze({ material, notch: { Kt: 2, rule: 'neuber' }, meanStress: 'smithWatsonTopper', worstLoopCount: 10 });

/** Slow path: the notch package's repeating tracker, the scalar SWT solve per loop, a plain sum. */
function slowDamage(history, units = {}) {
  const r = trackNotchRepeating(history, { material, Kt: 2, rule: 'neuber', ...units });
  const loops = r.stabilised.loops.toRows();
  let d = 0;
  for (const l of loops) {
    const { reversals } = smithWatsonTopper.reversalsToFailure(material, {
      stressMax: l.stressMax,
      stressMin: l.stressMin,
      strainMax: l.strainMax,
      strainMin: l.strainMin,
    });
    d += l.count / (reversals / 2);
  }
  return d;
}

export async function run(h) {
  const rows = [];
  const ref = referenceHistory(N);
  const sub = ref.slice(0, SUBSET);
  const fast = assessLife(sub, job).damage.perRepeat;
  const slow = slowDamage(sub);
  h.check(Math.abs(fast - slow) <= 1e-9 * slow, `engine subset damage ${fast} differs from the slow path ${slow}`);

  const scan = h.scanSeconds(ref);
  const t = h.measure(() => assessLife(ref, job), { warmup: 1, runs: 3 });
  const report = assessLife(ref, job);
  h.check(report.damage.perRepeat > 0 && Number.isFinite(report.damage.perRepeat), 'engine damage is not a positive finite number');
  const reversals = report.gate.removedReversals + report.loops.count.length * 2;
  rows.push({
    figure: 'engine/assessLife reference history (Neuber, SWT, Miner, repeating)',
    ratio: t / scan,
    baseline: 'minmax-scan',
    baselineSeconds: scan,
    seconds: t,
    sizes: { samples: N, loops: report.loops.count.length },
    nsPerSample: (t / N) * 1e9,
    nsPerReversal: (t / reversals) * 1e9,
    target: 12,
  });
  rows.push(againstExp(h, rows[0]));
  rows.push(everySampleReverses(h, { seconds: t, turningPoints: turningPoints(ref).values.length }));

  const event = ref.slice(0, 1e5);
  const onePass = h.measure(() => assessLife(event, { ...job, repeating: false }), { warmup: 1, runs: 5 });
  const duty = h.measure(() => assessDutyCycle([{ name: 'event', history: event, repeats: 1e6 }], job), { warmup: 1, runs: 5 });
  const dutyReport = assessDutyCycle([{ name: 'event', history: event, repeats: 1e6 }], job);
  const stabilisedEvent = assessLife(event, job).damage.perRepeat;
  h.check(
    Math.abs(dutyReport.damage.perRepeat - 1e6 * stabilisedEvent) <= 1e-9 * dutyReport.damage.perRepeat,
    'duty cycle damage differs from 10^6 × the stabilised damage of the event',
  );
  rows.push({
    figure: 'engine/duty cycle, 1e5-sample event × 1e6 repeats vs one pass over the event',
    ratio: duty / onePass,
    baseline: 'assessLife one pass over the event',
    baselineSeconds: onePass,
    seconds: duty,
    sizes: { eventSamples: 1e5, repeats: 1e6 },
    nsPerSample: (duty / 1e5) * 1e9,
    nsPerReversal: null,
    target: 3,
  });
  return rows;
}

/** The pipeline figure as a ratio to the compute-bound baseline (harness.mjs), measured now. */
function againstExp(h, row) {
  const exp = h.expSeconds(h.expArguments());
  return { ...row, figure: `${row.figure} vs Math.exp`, ratio: row.seconds / exp, baseline: 'math-exp', baselineSeconds: exp, target: null };
}

/** Samples of the flight spectrum, every one a turning point. */
const SPECTRUM_SAMPLES = 7e6;
/** Target: at most 1.5 × the pipeline's ns per turning point on the reference history. */
const SPECTRUM_TARGET = 1.5;

/**
 * A history where every sample is a turning point: the flight spectrum of fixtures/generate.mjs
 * (30 integer levels, 7·10^6 samples, consecutive values alternate in direction), through the
 * same pipeline (assessLife, repeating, default options, SWT), in ns per turning point, as a
 * ratio to the pipeline's ns per turning point on the reference history (`reference`, measured
 * in this run). Per-sample work is then per-reversal work (a branch solve, a memory push, a loop
 * closed about every second sample); the figure shows what a turning point costs once nothing
 * between turning points dilutes it. Checked: every sample is a turning point, and the damage of
 * a leading subset equals the slow path's.
 */
function everySampleReverses(h, reference) {
  const x = flightSpectrum(SPECTRUM_SAMPLES);
  const points = turningPoints(x).values.length;
  h.check(points === x.length, `flight spectrum: ${points} turning points in ${x.length} samples`);
  const spectrumJob = { ...job, ...FLIGHT_SPECTRUM_UNITS };
  const sub = x.slice(0, SUBSET);
  const fast = assessLife(sub, spectrumJob).damage.perRepeat;
  const slow = slowDamage(sub, FLIGHT_SPECTRUM_UNITS);
  h.check(fast > 0 && Math.abs(fast - slow) <= 1e-9 * slow, `flight spectrum subset damage ${fast} differs from the slow path ${slow}`);
  const seconds = h.measure(() => assessLife(x, spectrumJob), { warmup: 1, runs: 3 });
  const report = assessLife(x, spectrumJob);
  h.check(report.damage.perRepeat > 0 && Number.isFinite(report.damage.perRepeat), 'flight spectrum damage is not a positive finite number');
  const perPoint = seconds / points;
  const referencePerPoint = reference.seconds / reference.turningPoints;
  return {
    figure: 'engine/assessLife flight spectrum, every sample a turning point: ns per turning point vs the reference history',
    ratio: perPoint / referencePerPoint,
    baseline: 'assessLife reference history, per turning point',
    baselineSeconds: reference.seconds,
    seconds,
    sizes: { samples: x.length, turningPoints: points, loops: report.loops.count.length, referenceTurningPoints: reference.turningPoints },
    nsPerSample: (seconds / x.length) * 1e9,
    nsPerReversal: perPoint * 1e9,
    referenceNsPerTurningPoint: referencePerPoint * 1e9,
    target: SPECTRUM_TARGET,
  };
}
