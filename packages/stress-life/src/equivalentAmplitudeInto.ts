import type { AmplitudeCorrection } from './AmplitudeCorrection';
import { checkColumn, checkMean, checkPositive, checkStress } from './checks';
import { checkGerberMean, gerberCore } from './gerberAmplitude';
import { checkCompressive, goodmanCore } from './goodmanAmplitude';
import { checkCategory, iiwAmplitudeCore } from './iiwMeanStressFactor';
import { morrowCore } from './morrowAmplitude';
import { StressLifeError } from './StressLifeError';
import { swtCore } from './smithWatsonTopperAmplitude';
import { checkGamma, walkerCore } from './walkerAmplitude';

/**
 * Checks a correction and returns it with its defaults. Internal.
 */
export function resolveCorrection(correction: AmplitudeCorrection | undefined): AmplitudeCorrection {
  const c = correction ?? { method: 'none' as const };
  if (c === null || typeof c !== 'object') throw new StressLifeError('invalid-option', 'meanStress', c, 'must be { method, ... }');
  switch (c.method) {
    case 'none':
    case 'smithWatsonTopper':
      return c;
    case 'goodman':
    case 'gerber':
      checkPositive(c.ultimateStrength, 'meanStress.ultimateStrength');
      checkCompressive(c.compressiveMean ?? 'neutral');
      return { ...c, compressiveMean: c.compressiveMean ?? 'neutral' };
    case 'morrow':
      checkPositive(c.sigmaF, 'meanStress.sigmaF');
      return c;
    case 'walker':
      checkGamma(c.gamma);
      return c;
    case 'iiw':
      checkCategory(c.category);
      return c;
    default:
      throw new StressLifeError('invalid-option', 'meanStress.method', (c as { method: unknown }).method, "must be 'none', 'goodman', 'gerber', 'morrow', 'smithWatsonTopper', 'walker' or 'iiw'");
  }
}

/**
 * Kernel: the equivalent fully reversed amplitude σar of every cycle (amplitude σa, mean σm)
 * under one mean-stress correction, into caller-owned `out` (no allocation; `out` may be
 * `amplitudes`). Each method is the one of its scalar function (`goodmanAmplitude`,
 * `gerberAmplitude`, `morrowAmplitude`, `smithWatsonTopperAmplitude`, `walkerAmplitude`,
 * `iiwEnhancedAmplitude`); every input is checked before anything is written.
 *
 * @throws {StressLifeError} `invalid-stress` / `invalid-mean` naming the element index (also a
 *   mean at or beyond the strength a correction divides by); `invalid-option` for a bad
 *   correction; `invalid-argument` for columns of different lengths or a short `out`.
 * @example
 * Array.from(equivalentAmplitudeInto({ method: 'goodman', ultimateStrength: 400 }, [100, 100], [200, -200], new Float64Array(2)));
 * // returns [200, 100]
 */
export function equivalentAmplitudeInto(
  correction: AmplitudeCorrection,
  amplitudes: ArrayLike<number>,
  means: ArrayLike<number>,
  out: Float64Array,
): Float64Array {
  const c = resolveCorrection(correction);
  checkColumn(amplitudes, 'amplitudes');
  const n = amplitudes.length;
  checkColumn(means, 'means', n);
  checkColumn(out, 'out', n, false);
  checkCycles(c, amplitudes, means, 1);
  writeEquivalent(c, amplitudes, means, 1, 1, out);
  return out;
}

/** Checks amplitudes (values × half) and means against a resolved correction. Internal. */
export function checkCycles(c: AmplitudeCorrection, stresses: ArrayLike<number>, means: ArrayLike<number>, scale: number, field = 'amplitudes'): void {
  const n = stresses.length;
  for (let i = 0; i < n; i++) {
    checkStress(stresses[i], field, i);
    checkMean(means[i], 'means', i);
  }
  if (c.method === 'goodman' || c.method === 'morrow') {
    const limit = c.method === 'goodman' ? c.ultimateStrength : c.sigmaF;
    const what = c.method === 'goodman' ? 'ultimateStrength' : 'sigmaF';
    for (let i = 0; i < n; i++) {
      if (!(means[i] * scale < limit)) throw new StressLifeError('invalid-mean', 'means', means[i], `must be < ${what} ${limit} (after Kf and stress factor ${scale}) for ${c.method}`, i);
    }
  } else if (c.method === 'gerber') {
    const neutral = c.compressiveMean !== 'equation';
    for (let i = 0; i < n; i++) checkGerberMean(means[i] * scale, c.ultimateStrength, neutral, i);
  }
}

/**
 * σar of checked cycles into out: amplitude = stresses[i]·half·scale, mean = means[i]·scale.
 * One loop per method (a switch per cycle would cost more than the arithmetic). Internal.
 */
export function writeEquivalent(c: AmplitudeCorrection, stresses: ArrayLike<number>, means: ArrayLike<number>, half: number, scale: number, out: Float64Array): void {
  const n = stresses.length;
  const h = half * scale;
  switch (c.method) {
    case 'none':
      for (let i = 0; i < n; i++) out[i] = stresses[i] * h;
      return;
    case 'goodman': {
      const su = c.ultimateStrength;
      const neutral = c.compressiveMean !== 'equation';
      for (let i = 0; i < n; i++) out[i] = goodmanCore(stresses[i] * h, means[i] * scale, su, neutral);
      return;
    }
    case 'gerber': {
      const su = c.ultimateStrength;
      const neutral = c.compressiveMean !== 'equation';
      for (let i = 0; i < n; i++) out[i] = gerberCore(stresses[i] * h, means[i] * scale, su, neutral);
      return;
    }
    case 'morrow': {
      const sf = c.sigmaF;
      for (let i = 0; i < n; i++) out[i] = morrowCore(stresses[i] * h, means[i] * scale, sf);
      return;
    }
    case 'smithWatsonTopper':
      for (let i = 0; i < n; i++) out[i] = swtCore(stresses[i] * h, means[i] * scale);
      return;
    case 'walker': {
      const g = c.gamma;
      for (let i = 0; i < n; i++) out[i] = walkerCore(stresses[i] * h, means[i] * scale, g);
      return;
    }
    case 'iiw': {
      const cat = c.category;
      for (let i = 0; i < n; i++) out[i] = iiwAmplitudeCore(stresses[i] * h, means[i] * scale, cat);
      return;
    }
  }
}
