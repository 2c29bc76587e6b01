import { unknownField } from '@loopwise/base';
import { turningPoints } from '@loopwise/rainflow';
import { EngineError } from './EngineError';
import { resolveLifeJob, type LifeJob, type ResolvedJob } from './LifeJob';
import { reportEvents, reportFromTracked, stressReportFromCounted } from './reportAssembly';
import { countSchedule } from './stressLifeRoute';
import { checkEvents, type DutyEvent } from './schedule';
import { trackDutyCycle } from './trackHistory';

/** Options of {@link findLoadMargin}. */
export interface MarginOptions {
  /** Target life in repeats of the schedule (mean estimate, before the scatter factor). */
  targetRepeats: number;
  /** Smallest load factor scanned; default 0.05. */
  minFactor?: number;
  /** Largest load factor scanned; default 20. */
  maxFactor?: number;
  /** Scan points, log-spaced from minFactor to maxFactor; default 48, at most 10 000 (each is one assessment). */
  scanPoints?: number;
  /** Relative tolerance of the factor after bracketing; default 1e-6. */
  tolerance?: number;
  /**
   * Called after each assessment with the assessments done and the most the search takes
   * (the scan points plus the bisection steps the tolerance needs), for a progress display.
   */
  onProgress?: (done: number, most: number) => void;
}

/** What {@link findLoadMargin} returns. */
export interface MarginResult {
  /**
   * The smallest load factor f (on the scan, refined by bisection) at which the life is at most
   * the target; Infinity when even `maxFactor` lives longer, and `minFactor` or less when the
   * smallest scanned factor already fails (then `belowScan` is true).
   */
  factor: number;
  /** Life in repeats at `factor`. */
  repeats: number;
  /** The bracket [lower, upper] the bisection ended with: life(lower) > target >= life(upper). */
  bracket: [number, number];
  /** True when damage was seen to decrease with a growing factor somewhere on the scan. */
  nonMonotone: boolean;
  belowScan: boolean;
  /** The scan: factors and lives in repeats. */
  scan: { factor: number; repeats: number }[];
}

/**
 * The load factor at which the life equals a target: every sample of every event (and the
 * initial value and offset) is multiplied by f, the assessment is repeated, and the smallest f
 * whose life is at most the target is found.
 *
 * With local mean stresses damage need not grow with the load factor (a larger tensile overload
 * can lower the local mean stress of later loops), so nothing assumes it does: the factors are
 * first scanned on a log grid from `minFactor` to `maxFactor`; the first grid interval where the
 * life falls to the target is then bisected to the relative `tolerance`. A crossing narrower than
 * one grid interval, with the life rising again inside it, can be missed; `nonMonotone` reports
 * whether the scan saw damage fall anywhere, and `scan` shows the whole curve.
 */
/** The most scan points a margin search takes (each is one assessment of the whole schedule). */
const MAX_SCAN_POINTS = 10000;

export function findLoadMargin(events: DutyEvent[], job: LifeJob, options: MarginOptions): MarginResult {
  const resolved = resolveLifeJob(job);
  checkEvents(events);
  if (options === null || typeof options !== 'object') throw new EngineError('invalid-margin', 'options', String(options), 'must be { targetRepeats, minFactor, maxFactor, scanPoints, tolerance }');
  const unknown = unknownField(options, ['targetRepeats', 'minFactor', 'maxFactor', 'scanPoints', 'tolerance', 'onProgress'], 'the margin options');
  if (unknown !== undefined) throw new EngineError('invalid-margin', unknown.field, unknown.value, unknown.rule);
  const target = options.targetRepeats;
  if (!(typeof target === 'number' && target > 0 && target < Infinity)) {
    throw new EngineError('invalid-margin', 'targetRepeats', target, 'must be a finite number > 0');
  }
  const minFactor = options.minFactor ?? 0.05;
  const maxFactor = options.maxFactor ?? 20;
  if (!(minFactor > 0 && maxFactor > minFactor && maxFactor < Infinity)) {
    throw new EngineError('invalid-margin', 'minFactor', [minFactor, maxFactor], 'needs 0 < minFactor < maxFactor < Infinity');
  }
  const points = options.scanPoints ?? 48;
  if (!Number.isInteger(points) || points < 2 || points > MAX_SCAN_POINTS) throw new EngineError('invalid-margin', 'scanPoints', points, `must be an integer from 2 to ${MAX_SCAN_POINTS} (each point is one assessment of the whole schedule)`);
  const tolerance = options.tolerance ?? 1e-6;
  if (!(tolerance > 0 && tolerance < 0.1)) throw new EngineError('invalid-margin', 'tolerance', tolerance, 'must be in (0, 0.1)');

  if (options.onProgress !== undefined && typeof options.onProgress !== 'function') throw new EngineError('invalid-margin', 'onProgress', String(options.onProgress), 'must be a function (done, most) => void');
  // A factor f > 0 scales every sample, so the turning points of the scaled history are the
  // scaled turning points, and a gate scaled with it keeps the same ones: each event is reduced
  // to its turning points once, and every assessment runs on those (the same loops, the same
  // damage; the test compares with assessments of the scaled samples).
  const reduced = events.map((e) => ({ ...e, history: turningPoints(e.history).values }));
  // bisection steps: the first interval is one grid step, halved (in log) until within the tolerance
  const gridStep = Math.log(maxFactor / minFactor) / (points - 1);
  const most = points + Math.max(0, Math.ceil(Math.log2(gridStep / -Math.log1p(-tolerance))));
  let done = 0;
  const lifeAt = (f: number) => {
    const life = repeatsAt(reduced, resolved, f);
    done++;
    options.onProgress?.(done, Math.max(done, most));
    return life;
  };
  const scan: { factor: number; repeats: number }[] = [];
  let nonMonotone = false;
  for (let k = 0; k < points; k++) {
    const f = minFactor * Math.pow(maxFactor / minFactor, k / (points - 1));
    const repeats = lifeAt(f);
    if (scan.length > 0 && repeats > scan[scan.length - 1].repeats) nonMonotone = true;
    scan.push({ factor: f, repeats });
  }
  const hit = scan.findIndex((s) => s.repeats <= target);
  if (hit < 0) return { factor: Infinity, repeats: scan[points - 1].repeats, bracket: [maxFactor, Infinity], nonMonotone, belowScan: false, scan };
  if (hit === 0) return { factor: minFactor, repeats: scan[0].repeats, bracket: [0, minFactor], nonMonotone, belowScan: true, scan };
  let lo = scan[hit - 1].factor;
  let hi = scan[hit].factor;
  let hiLife = scan[hit].repeats;
  for (let i = 0; i < 200 && hi - lo > tolerance * hi; i++) {
    const mid = Math.sqrt(lo * hi);
    const life = lifeAt(mid);
    if (life <= target) {
      hi = mid;
      hiLife = life;
    } else lo = mid;
  }
  return { factor: hi, repeats: hiLife, bracket: [lo, hi], nonMonotone, belowScan: false, scan };
}

/** Life in repeats with every load scaled by f (internal). */
function repeatsAt(events: DutyEvent[], job: ResolvedJob, f: number): number {
  const scaled = events.map((e) => ({ ...e, history: Float64Array.from(e.history, (x) => x * f) }));
  const j: ResolvedJob = {
    ...job,
    initial: job.initial * f,
    offset: job.offset * f,
    gate: job.gate === undefined ? undefined : job.gate * f,
    fullScale: job.fullScale === undefined ? undefined : job.fullScale * f,
    worstLoopCount: 0,
  };
  if (j.route === 'stress-life') return stressReportFromCounted(countSchedule(scaled, j), reportEvents(scaled), j, true).life.repeats;
  return reportFromTracked(trackDutyCycle(scaled, j), reportEvents(scaled), j).life.repeats;
}
