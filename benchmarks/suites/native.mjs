// Native reference: the JS packages against a plain C program (benchmarks/native/reference.c)
// doing the same work on the same reference history, in the same run. Every ratio here is JS
// seconds ÷ native seconds of one stage, like for like: the same input, the same result tables
// (struct-of-arrays doubles, allocated afresh per run), the same solve tolerance, and check
// values that must agree before a ratio is reported. It is the honest limit: how far the JS is
// from what this machine does with a straightforward compiled implementation.
//
//   scan      min/max scan (the pinned baseline): how far the JIT is from the compiler on pure
//             memory traffic; reported only (it is also why scan ratios do not carry over between
//             machine kinds)
//   exp       10^7 exp calls (the compute-bound baseline): Math.exp against the C library's exp
//   rainflow  rainflow(ref): turning points + four-point counting, half residue (target <= 2)
//   tracker   trackNotchRepeating(ref, { material, Kt: 2.5, rule: 'neuber' }), the notch suite's
//             Neuber case (target <= 2)
//   pipeline  assessLife(ref, job) with the engine suite's job (Neuber Kt 2, SWT, Miner,
//             repeating) (target <= 2.5); the C side does the tracker, the SWT life of every loop
//             of both passes and the Miner sums; the JS side also builds its report (timeline,
//             attribution to events, worst loops, index columns), which the C side does not
//   flight spectrum   the same pipeline on the engine suite's flight spectrum (every sample a
//             turning point), reported only
//   stress-life   the stress-life suite's route on the same history scaled to a largest |value| of
//             300 MPa: rainflow with the repeat residue (ASTM E1049-85 5.4.5), then every cycle on
//             IIW FAT 90 with Haibach's slope below the knee and Goodman's correction (Su 600 MPa),
//             and the Miner sum. Two rows: the JS route (rainflow + stressLifeDamage) like for
//             like, and assessLife with that job (the engine figure of issue 12, which also builds
//             its report: loop table, timeline, events, worst loops) against the same C route
//
// Two native solve modes, both at the JS tracker's default tolerance (read from the package):
//   Newton        Neuber: Newton in ln σ from the smaller one-term root, stopped by the error
//                 bound; SWT: Newton in ln 2Nf from the one-term bracket. The straightforward
//                 method (reported only: at their default tolerance the JS packages read answer
//                 tables, so against Newton the JS does less work and the ratio says little).
//   answer-table  Neuber: a verified cubic Hermite answer table of σ(a), ε(a), used only where
//                 its measured error is a tenth of the tolerance (Newton elsewhere); SWT: a
//                 cubic Hermite start, then the same Newton. The same kind of method as the JS
//                 packages use at their default tolerance, so these rows compare equal
//                 algorithms, like for like; the targets above apply to these rows.
// The JS packages' tables make their solves cheaper than plain Newton, so a Newton ratio can
// fall below 1: that means the JS does less work, not that the JIT beats the compiler.
//
// Agreement (checked; the suite fails otherwise): turning points, cycle and loop counts, sample
// indices, the largest-|value| index and the reuse of the first pass are equal; rainflow's sum of
// ranges is equal to the last bit (the same subtractions in the same order); Σ σmax, Σ εmax and
// the damage sums agree to 1e-9 relative (every local σ, ε converged to the solve tolerance 1e-10
// or better on both sides, every 2Nf to 1e-10 relative; the measured gaps are recorded).
//
// Without a C compiler (cc, gcc or clang on PATH) the figures are skipped with a note, never a
// failure. The program is built with plain -O3 (no fast-math) into benchmarks/native/build/
// (ignored by git) at every run.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { assessLife } from '@loopwise/engine';
import { defineMaterial, handbookSteels } from '@loopwise/material';
import { NotchTracker, trackNotchRepeating } from '@loopwise/notch';
import { rainflow } from '@loopwise/rainflow';
import { iiwFatCurve, stressLifeDamage } from '@loopwise/stress-life';
import { FLIGHT_SPECTRUM_UNITS, flightSpectrum, referenceHistory } from '../../fixtures/generate.mjs';

const N = 1e7;
const here = dirname(fileURLToPath(import.meta.url));
const SOURCE = join(here, '../native/reference.c');
const BUILD = join(here, '../native/build');
const GENERATED = join(here, '../../fixtures/generated');
const FLAGS = ['-O3', '-std=c11'];
/** Relative agreement asked of the sums that depend on the solves. */
const AGREE = 1e-9;
/** Targets of the issue, JS ÷ native. */
const TARGETS = { rainflow: 2, tracker: 2, pipeline: 2.5 };

// The notch suite's material and Neuber case; the engine suite's job (same constants: both are
// the SAE 1045 row of Dowling, Mechanical Behavior of Materials, Table 14.1).
const notchMaterial = defineMaterial({ E: 202000, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445, K: 1258, n: 0.208 });
const trackerOptions = Object.freeze({ material: notchMaterial, Kt: 2.5, rule: 'neuber' });
const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)');
const job = Object.freeze({ material, notch: { Kt: 2, rule: 'neuber' }, meanStress: 'smithWatsonTopper', worstLoopCount: 10 });

/** The first C compiler on PATH that answers `--version`, or null. */
function findCompiler() {
  for (const cc of ['cc', 'gcc', 'clang']) {
    try {
      const version = execFileSync(cc, ['--version'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
      return { cc, version: version.split('\n')[0].trim() };
    } catch {
      // not there; try the next
    }
  }
  return null;
}

/** Writes `x` to fixtures/generated/<name> unless the file already holds exactly these doubles. */
function historyFile(name, x) {
  const path = join(GENERATED, name);
  const bytes = Buffer.from(x.buffer, x.byteOffset, x.byteLength);
  if (!existsSync(path) || !readFileSync(path).equals(bytes)) {
    mkdirSync(GENERATED, { recursive: true });
    writeFileSync(path, bytes);
  }
  return path;
}

const rel = (a, b) => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)));

function sum(a) {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i];
  return s;
}

/** Rows that say why there are no native figures. */
function skipped(note) {
  return ['rainflow', 'tracker', 'pipeline'].map((stage) => ({
    figure: `native/${stage}, JS ÷ native`,
    ratio: null,
    baseline: 'native C reference',
    baselineSeconds: null,
    seconds: null,
    sizes: { samples: N },
    nsPerSample: null,
    nsPerReversal: null,
    target: TARGETS[stage],
    note,
  }));
}

export async function run(h) {
  const compiler = findCompiler();
  if (compiler === null) return skipped('skipped: no C compiler (cc, gcc or clang) on PATH');
  mkdirSync(BUILD, { recursive: true });
  const binary = join(BUILD, 'reference');
  try {
    execFileSync(compiler.cc, [...FLAGS, '-o', binary, SOURCE, '-lm'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (err) {
    return skipped(`skipped: ${compiler.cc} could not build benchmarks/native/reference.c: ${String(err.stderr ?? err.message).trim().split('\n')[0]}`);
  }
  const build = { compiler: compiler.version, flags: FLAGS.join(' ') };

  const ref = referenceHistory(N);
  const refPath = historyFile('reference-1e7.f64', ref);
  // Like for like: the native solves run at the tolerance the JS tracker uses by default.
  const tolerance = new NotchTracker(trackerOptions).options.tolerance;
  // The engine passes its own default to the tracker; say whether it is the same one (subset:
  // two different tolerances give different last bits of the damage).
  const sub = ref.subarray(0, 20000);
  const engineDefaultIsTrackerDefault = assessLife(sub, job).damage.perRepeat === assessLife(sub, { ...job, tolerance }).damage.perRepeat;
  for (const f of ['E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n']) h.check(material[f] === notchMaterial[f], `native: the suites' materials differ in ${f}`);
  const materialArgs = ['E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n'].flatMap((f) => [`--${f}`, String(material[f])]);
  const native = (stage, history, extra = [], solve = 'newton') => {
    const args = ['--history', history, '--stages', stage, '--solve', solve, ...materialArgs, '--tracker-kt', '2.5', '--pipeline-kt', '2', '--tolerance', String(tolerance)];
    args.push('--warmup', String(h.WARMUP_RUNS), '--runs', String(h.TIMED_RUNS), '--pipeline-warmup', '1', '--pipeline-runs', '3', ...extra);
    const out = JSON.parse(execFileSync(binary, args, { encoding: 'utf8', maxBuffer: 1 << 20 }));
    return { ...out.stages[stage], solve, answerTable: out.answerTable, answerTableWorst: out.answerTableWorst };
  };
  const rows = [];
  const row = (stage, figure, js, nat, sizes, agreement, target = null) => ({
    figure: `native/${figure}, JS ÷ native${nat.solve === 'table' ? ' (answer-table solves)' : stage === 'tracker' || stage === 'pipeline' ? ' (Newton solves)' : ''}`,
    ratio: js / nat.seconds,
    baseline: 'native C reference',
    baselineSeconds: nat.seconds,
    seconds: js,
    sizes,
    nsPerSample: (js / sizes.samples) * 1e9,
    nsPerReversal: sizes.turningPoints ? (js / sizes.turningPoints) * 1e9 : null,
    nativeNsPerSample: (nat.seconds / sizes.samples) * 1e9,
    target,
    agreement,
    build,
    tolerance,
    ...(stage === 'tracker' || stage === 'pipeline' ? { nativeSolve: nat.solve, nativeAnswerTable: nat.answerTable, nativeAnswerTableWorst: nat.answerTableWorst } : {}),
    ...(stage === 'pipeline' ? { engineDefaultIsTrackerDefault } : {}),
  });

  // Each stage: the native program first, then the JS side (between the two native solve modes
  // where there are two), so both see the same machine state.
  const nScan = native('scan', refPath);
  const jScan = h.scanSeconds(ref);
  h.check(nScan.range === h.minMaxScan(ref), 'native scan range differs');
  rows.push(row('scan', 'min/max scan of the reference history', jScan, nScan, { samples: N }, { range: 'equal' }));

  const nExp = native('exp', refPath, ['--exp-calls', String(h.EXP_CALLS)]);
  const args = h.expArguments();
  const jExp = h.expSeconds(args);
  const expGap = rel(nExp.sum, h.expCalls(args));
  h.check(expGap < 1e-12, `native exp sum differs by ${expGap}`);
  rows.push(row('exp', '10^7 exp calls (Math.exp vs the C library)', jExp, nExp, { samples: h.EXP_CALLS }, { sumRelative: expGap }));

  const nRain = native('rainflow', refPath);
  const jRain = h.measure(() => rainflow(ref));
  const r = rainflow(ref);
  const rc = r.cycles.columns();
  h.check(r.turningPointCount === nRain.turningPoints, `native turning points ${nRain.turningPoints} vs ${r.turningPointCount}`);
  h.check(rc.range.length === nRain.cycles, `native cycle rows ${nRain.cycles} vs ${rc.range.length}`);
  h.check(sum(rc.count) === nRain.totalCount, 'native rainflow total count differs');
  h.check(sum(rc.startIndex) === nRain.sumStartIndex && sum(rc.closeIndex) === nRain.sumCloseIndex, 'native rainflow indices differ');
  const rangeGap = rel(sum(rc.range), nRain.sumRange);
  h.check(rangeGap === 0, `native rainflow sum of ranges differs by ${rangeGap}`);
  rows.push(
    row('rainflow', 'rainflow batch reference history (turning points + four-point, half residue)', jRain, nRain,
      { samples: N, turningPoints: nRain.turningPoints, cycles: nRain.cycles },
      { turningPoints: 'equal', cycles: 'equal', totalCount: 'equal', indices: 'equal', sumRangeRelative: rangeGap }, TARGETS.rainflow),
  );

  // the stress-life route (issue 12): the history as MPa, scaled the same way on both sides
  const PEAK = 300;
  const SU = 600;
  let peak = 0;
  for (let i = 0; i < ref.length; i++) peak = Math.max(peak, Math.abs(ref[i]));
  const stress = ref.map((v) => (v * PEAK) / peak);
  const curve = iiwFatCurve(90);
  const meanStress = { method: 'goodman', ultimateStrength: SU };
  const slArgs = ['--stress-peak', String(PEAK), '--fat', '90', '--ultimate', String(SU)];
  const nStress = native('stresslife', refPath, slArgs);
  const slRoute = () => stressLifeDamage(curve, rainflow(stress, { residue: 'repeat' }).cycles.columns(), { meanStress }).damage;
  const jStressRoute = h.measure(slRoute);
  const slJob = { stressLife: { curve, meanStress } };
  const jStressEngine = h.measure(() => assessLife(stress, slJob), { warmup: 1, runs: 3 });
  const counted = rainflow(stress, { residue: 'repeat' });
  const sc = counted.cycles.columns();
  h.check(counted.turningPointCount === nStress.turningPoints, `native stress-life turning points ${nStress.turningPoints} vs ${counted.turningPointCount}`);
  h.check(sc.count.length === nStress.cycles && sum(sc.count) === nStress.totalCount, `native stress-life cycles ${nStress.cycles} vs ${sc.count.length}`);
  const slGap = rel(slRoute(), nStress.damage);
  const slReport = assessLife(stress, slJob);
  const slEngineGap = rel(slReport.damage.perRepeat, nStress.damage);
  h.check(slGap <= AGREE && slEngineGap <= AGREE, `native stress-life damage differs: route ${slGap}, engine ${slEngineGap}`);
  h.check(slReport.loops.count.length === nStress.cycles, `native stress-life cycles ${nStress.cycles} vs the report's ${slReport.loops.count.length}`);
  const slSizes = { samples: N, turningPoints: nStress.turningPoints, cycles: nStress.cycles, nativeCountSeconds: nStress.countSeconds };
  rows.push(
    row('stresslife', 'stress-life route reference history (rainflow repeat residue, IIW FAT 90 Haibach, Goodman, Miner sum)', jStressRoute, nStress, slSizes,
      { cycles: 'equal', totalCount: 'equal', damageRelative: slGap, damage: nStress.damage }),
    row('stresslife', 'assessLife stress-life route (the whole report) vs the C route (count and damage only)', jStressEngine, nStress, slSizes,
      { cycles: 'equal', damageRelative: slEngineGap, damage: slReport.damage.perRepeat }),
  );

  // the JS side between the two native solve modes
  const nTracks = [native('tracker', refPath, [], 'newton')];
  const jTrack = h.measure(() => trackNotchRepeating(ref, trackerOptions));
  nTracks.push(native('tracker', refPath, [], 'table'));
  const t = trackNotchRepeating(ref, trackerOptions);
  const st = t.stabilised.loops.columns();
  for (const nTrack of nTracks) {
    h.check(t.first.loops.length === nTrack.firstLoops && st.stressMax.length === nTrack.stabilisedLoops, 'native tracker loop counts differ');
    h.check(t.first.reversals.length === nTrack.firstReversals && t.stabilised.reversals.length === nTrack.stabilisedReversals, 'native tracker reversal counts differ');
    h.check(t.largestIndex === nTrack.largestIndex && t.reusedFirstPass === nTrack.reusedFirstPass, 'native tracker largest index or reuse differs');
    const stressGap = rel(sum(st.stressMax), nTrack.sumStressMax);
    const strainGap = rel(sum(st.strainMax), nTrack.sumStrainMax);
    h.check(stressGap <= AGREE && strainGap <= AGREE, `native tracker sums differ: σmax ${stressGap}, εmax ${strainGap}`);
    rows.push(
      row('tracker', 'notch tracker, Neuber Kt 2.5, repeating (first + stabilised pass)', jTrack, nTrack,
        { samples: N, turningPoints: r.turningPointCount, loopsStabilised: nTrack.stabilisedLoops, nativeMeanNewtonSteps: nTrack.meanNewtonSteps },
        { loops: 'equal', reversals: 'equal', largestIndex: 'equal', sumStressMaxRelative: stressGap, sumStrainMaxRelative: strainGap },
        nTrack.solve === 'table' ? TARGETS.tracker : null),
    );
  }

  const pipelineRows = (figure, x, path, jobOf, extra, turningPoints, target) => {
    const nats = [native('pipeline', path, extra, 'newton')];
    const js = h.measure(() => assessLife(x, jobOf), { warmup: 1, runs: 3 });
    nats.push(native('pipeline', path, extra, 'table'));
    const report = assessLife(x, jobOf);
    return nats.map((nat) => pipelineRow(figure, x, turningPoints, nat.solve === 'table' ? target : null, js, report, nat));
  };
  const pipelineRow = (figure, x, turningPoints, target, js, report, nat) => {
    h.check(report.loops.count.length === nat.loops, `native pipeline loop count ${nat.loops} vs ${report.loops.count.length}`);
    h.check(report.damage.reusedFirstPass === nat.reusedFirstPass, 'native pipeline reuse differs');
    const gaps = {
      sumStressMaxRelative: rel(sum(report.loops.stressMax), nat.sumStressMax),
      damageRelative: rel(report.damage.perRepeat, nat.damage),
      firstPassDamageRelative: rel(report.damage.firstPass, nat.firstPassDamage),
    };
    h.check(Object.values(gaps).every((g) => g <= AGREE), `native pipeline disagrees: ${JSON.stringify(gaps)}`);
    return row('pipeline', figure, js, nat,
      { samples: x.length, turningPoints, loops: nat.loops, nativeMeanNewtonSteps: nat.meanNewtonSteps },
      { loops: 'equal', ...gaps, damage: report.damage.perRepeat }, target);
  };
  rows.push(...pipelineRows('assessLife reference history (Neuber Kt 2, SWT, Miner, repeating)', ref, refPath, job, [], r.turningPointCount, TARGETS.pipeline));

  const spectrum = flightSpectrum(7e6);
  const spectrumPath = historyFile('flight-spectrum-7e6.f64', spectrum);
  rows.push(
    ...pipelineRows('assessLife flight spectrum (every sample a turning point)', spectrum, spectrumPath, { ...job, ...FLIGHT_SPECTRUM_UNITS },
      ['--offset', String(FLIGHT_SPECTRUM_UNITS.offset), '--load-to-stress', String(FLIGHT_SPECTRUM_UNITS.loadToStress)], spectrum.length, null),
  );
  return rows;
}
