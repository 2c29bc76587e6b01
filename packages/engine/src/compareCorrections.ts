import { damageParameters, type DamageParameterName } from '@loopwise/mean-stress';
import type { LifeEstimate } from '@loopwise/miner';
import type { AmplitudeCorrection } from '@loopwise/stress-life';
import { resolveLifeJob, type LifeJob, type ResolvedJob } from './LifeJob';
import type { CorrectionName, LifeReport } from './LifeReport';
import { reportEvents, reportFromTracked, stressReportFromCounted, type ReportEvent } from './reportAssembly';
import { checkEvents, type DutyEvent } from './schedule';
import { countSchedule, type CountedSchedule } from './stressLifeRoute';
import { trackDutyCycle } from './trackHistory';

/** One mean-stress correction's result, side by side with the others. */
export interface CorrectionResult {
  /** The damage parameter (strain-life route) or the amplitude correction (stress-life route). */
  meanStress: CorrectionName;
  /** Damage per repeat (stabilised pass). */
  damagePerRepeat: number;
  /** Damage of the first pass. */
  firstPassDamage: number;
  life: LifeEstimate;
  /** Codes of the report's warnings under this correction. */
  warnings: string[];
}

/**
 * Life of the same duty cycle (or single history, as one event) under every mean-stress
 * correction, side by side. The local stress-strain path does not depend on the correction, so
 * the history is tracked once and only the damage stage runs per correction.
 *
 * Corrections: `none`, `morrow`, `modifiedMorrow`, `smithWatsonTopper`, `walker` (γ from the job
 * or estimated from Su; skipped with a note when the material has no Su and no γ is given).
 *
 * On the stress-life route the cycles are counted once and the amplitude corrections compared:
 * `none`, `goodman` and `gerber` (with the job's ultimate strength, or the material's Su),
 * `morrow` (the job's σf', or the material's), `smithWatsonTopper`, `walker` (the job's γ) and
 * `iiw` (the job's category); a correction whose constant is not known is left out.
 *
 * @example
 * compareCorrections([{ name: 'history', history, repeats: 1 }], { material, notch: { Kt: 2 } })
 *   .map((r) => [r.meanStress, r.life.repeats]);
 */
export function compareCorrections(events: DutyEvent[], job: LifeJob): CorrectionResult[] {
  const resolved = resolveLifeJob(job);
  if (resolved.route === 'stress-life') return compareStressCorrections(countSchedule(checkEvents(events), resolved), reportEvents(events), resolved);
  const tracked = trackDutyCycle(checkEvents(events), resolved);
  const reported = reportEvents(events);
  const out: CorrectionResult[] = [];
  for (const correction of Object.keys(damageParameters) as DamageParameterName[]) {
    if (correction === 'walker' && resolved.walkerGamma === undefined && resolved.material?.Su === undefined) continue;
    // the tracked history serves every correction: the report columns are copies
    const r: LifeReport = reportFromTracked(tracked, reported, { ...resolved, meanStress: correction }, false);
    out.push({
      meanStress: correction,
      damagePerRepeat: r.damage.perRepeat,
      firstPassDamage: r.damage.firstPass,
      life: r.life,
      warnings: r.warnings.map((w) => w.code),
    });
  }
  return out;
}

/** The amplitude corrections whose constants the job or its material gives (stress-life route). */
function stressCorrections(job: ResolvedJob): AmplitudeCorrection[] {
  const own = (job.stressLife as NonNullable<ResolvedJob['stressLife']>).meanStress;
  const su = own.method === 'goodman' || own.method === 'gerber' ? own.ultimateStrength : job.material?.Su;
  const sigmaF = own.method === 'morrow' ? own.sigmaF : job.material?.sigmaF;
  const out: AmplitudeCorrection[] = [{ method: 'none' }];
  if (su !== undefined) {
    const compressiveMean = own.method === 'goodman' || own.method === 'gerber' ? own.compressiveMean : undefined;
    out.push({ method: 'goodman', ultimateStrength: su, ...(compressiveMean ? { compressiveMean } : {}) });
    out.push({ method: 'gerber', ultimateStrength: su, ...(compressiveMean ? { compressiveMean } : {}) });
  }
  if (sigmaF !== undefined) out.push({ method: 'morrow', sigmaF });
  out.push({ method: 'smithWatsonTopper' });
  if (own.method === 'walker') out.push(own);
  if (own.method === 'iiw') out.push(own);
  return out;
}

function compareStressCorrections(counted: CountedSchedule, reported: ReportEvent[], job: ResolvedJob): CorrectionResult[] {
  const s = job.stressLife as NonNullable<ResolvedJob['stressLife']>;
  return stressCorrections(job).map((meanStress) => {
    const r = stressReportFromCounted(counted, reported, { ...job, stressLife: { ...s, meanStress } });
    return { meanStress: meanStress.method, damagePerRepeat: r.damage.perRepeat, firstPassDamage: r.damage.firstPass, life: r.life, warnings: r.warnings.map((w) => w.code) };
  });
}
