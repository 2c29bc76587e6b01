import type { CorrectionResult, LifeJob, LifeLoopColumns, LifeReport } from '@loopwise/engine';
import { channelConversion, MICROSTRAIN_PER_STRAIN } from '@loopwise/ingest';
import type { DamageParameterName } from '@loopwise/mean-stress';
import type { AmplitudeCorrection, IiwResidualCategory } from '@loopwise/stress-life';
import type { CliChannel, CliCorrection, CliJob, CliStressLife } from './CliJob';

/** The engine job of one channel of a CLI job, under one mean-stress correction. */
export function lifeJobOf(job: CliJob, channel: CliChannel, meanStress: CliCorrection): LifeJob {
  const s = job.stressLife;
  let out: LifeJob;
  if (s !== undefined) {
    out = { stressLife: { curve: s.curve, meanStress: amplitudeCorrection(job, meanStress) }, repeating: job.repeating, scatterFactor: job.scatterFactor };
    if (s.kf !== undefined) out.stressLife!.kf = s.kf;
    if (s.stressFactor !== undefined) out.stressLife!.stressFactor = s.stressFactor;
    if (job.material !== undefined) out.material = job.material;
  } else {
    const input = channel.input ?? (channel.quantity === 'strain' ? 'local-strain' : 'nominal');
    out = { material: job.material, input, meanStress: meanStress as DamageParameterName, repeating: job.repeating, scatterFactor: job.scatterFactor };
    if (input === 'nominal' && job.notch) out.notch = job.notch;
    if (input === 'pseudo-elastic' && job.notch?.rule) out.rule = job.notch.rule;
    if (job.walkerGamma !== undefined) out.walkerGamma = job.walkerGamma;
  }
  // the gate and the full scale are given in the channel's own unit (µε for a microstrain
  // channel): converted like its samples
  const toEngine = engineRangeOf(channel);
  if (job.gate !== undefined) out.gate = toEngine(job.gate);
  if (job.gateFraction !== undefined) out.gateFraction = job.gateFraction;
  if (job.fullScale !== undefined) out.fullScale = toEngine(job.fullScale);
  if (job.cutoffCycles !== undefined) out.cutoffCycles = job.cutoffCycles;
  if (job.criticalDamage !== undefined) out.criticalDamage = job.criticalDamage;
  if (job.initial !== undefined) out.initial = job.initial;
  if (job.offset !== undefined) out.offset = job.offset;
  if (job.service) out.unit = job.service.perRepeat === undefined ? { label: job.service.unit } : { label: job.service.unit, perRepeat: job.service.perRepeat };
  return out;
}

/** A range in the channel's own unit (the file's) as a range in engine units (MPa or strain), as its samples are converted. */
export function engineRangeOf(c: CliChannel): (x: number) => number {
  const k = channelConversion(c);
  return (x) => Math.abs((x * k.multiplier) / k.divisor);
}

/**
 * The display copy of a history in the channel's own unit where the engine unit differs only by
 * a power of ten (µε for a microstrain channel: the user's numbers stay the user's); stresses
 * and loads stay in MPa (a load channel is shown as the nominal stress it was converted to).
 */
export function inOwnUnit(c: CliChannel, h: { index: Float64Array; value: Float64Array } | null): { index: Float64Array; value: Float64Array } | null {
  if (h === null || !(c.quantity === 'strain' && c.unit === 'microstrain')) return h;
  return { index: h.index, value: h.value.map((v) => v * MICROSTRAIN_PER_STRAIN) };
}

export function unitLabel(c: CliChannel): string {
  if (c.quantity === 'load') return 'MPa nominal (from load)';
  if (c.quantity === 'strain') return c.unit === 'microstrain' ? 'µε' : 'strain';
  return 'MPa';
}

/**
 * The corrections of `--mean-stress all` for a job: on the strain-life route every damage
 * parameter (Walker needs γ or Su); on the stress-life route the amplitude corrections whose
 * constants the job or its material gives (as the engine's compareCorrections).
 */
export function correctionsOf(job: CliJob): CliCorrection[] {
  const s = job.stressLife;
  if (s === undefined) {
    const all: CliCorrection[] = ['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker'];
    return all.filter((c) => c !== 'walker' || job.walkerGamma !== undefined || job.material?.Su !== undefined);
  }
  const su = s.ultimateStrength ?? job.material?.Su;
  const sigmaF = s.sigmaF ?? job.material?.sigmaF;
  const out: CliCorrection[] = ['none'];
  if (su !== undefined) out.push('goodman', 'gerber');
  if (sigmaF !== undefined) out.push('morrow');
  out.push('smithWatsonTopper');
  if (job.walkerGamma !== undefined) out.push('walker');
  if (s.iiwCategory !== undefined) out.push('iiw');
  return out;
}

/** The main correction of a job: the one it names, or with `all` the route's usual one (SWT strain-life, none stress-life). */
export function mainCorrection(job: CliJob): CliCorrection {
  if (job.meanStress !== 'all') return job.meanStress;
  return job.stressLife === undefined ? 'smithWatsonTopper' : 'none';
}

/** An amplitude correction of the stress-life route by name, with the job's (or material's) constants (checkRoute ensured them). */
export function amplitudeCorrection(job: CliJob, name: CliCorrection): AmplitudeCorrection {
  const s = job.stressLife as CliStressLife;
  switch (name) {
    case 'goodman':
    case 'gerber':
      return { method: name, ultimateStrength: (s.ultimateStrength ?? job.material?.Su) as number };
    case 'morrow':
      return { method: 'morrow', sigmaF: (s.sigmaF ?? job.material?.sigmaF) as number };
    case 'walker':
      return { method: 'walker', gamma: job.walkerGamma as number };
    case 'iiw':
      return { method: 'iiw', category: s.iiwCategory as IiwResidualCategory };
    case 'smithWatsonTopper':
      return { method: 'smithWatsonTopper' };
    default:
      return { method: 'none' };
  }
}

/** The report without its loop table (the loops go to the loop table of the result). */
export function withoutLoops(report: LifeReport): LifeReport {
  const empty = Object.fromEntries(Object.entries(report.loops).map(([k, v]) => [k, (v as Float64Array).subarray(0, 0).slice()])) as unknown as LifeLoopColumns;
  return { ...report, loops: empty };
}

export function correctionOf(report: LifeReport): CorrectionResult {
  return {
    meanStress: report.damage.meanStress,
    damagePerRepeat: report.damage.perRepeat,
    firstPassDamage: report.damage.firstPass,
    life: report.life,
    warnings: report.warnings.map((w) => w.code),
  };
}

