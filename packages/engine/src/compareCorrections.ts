import { damageParameters, type DamageParameterName } from '@loopwise/mean-stress';
import type { LifeEstimate } from '@loopwise/miner';
import { resolveLifeJob, type LifeJob } from './LifeJob';
import type { LifeReport } from './LifeReport';
import { reportEvents, reportFromTracked } from './reportAssembly';
import { checkEvents, type DutyEvent } from './schedule';
import { trackDutyCycle } from './trackHistory';

/** One mean-stress correction's result, side by side with the others. */
export interface CorrectionResult {
  meanStress: DamageParameterName;
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
 * @example
 * compareCorrections([{ name: 'history', history, repeats: 1 }], { material, notch: { Kt: 2 } })
 *   .map((r) => [r.meanStress, r.life.repeats]);
 */
export function compareCorrections(events: DutyEvent[], job: LifeJob): CorrectionResult[] {
  const resolved = resolveLifeJob(job);
  const tracked = trackDutyCycle(checkEvents(events), resolved);
  const reported = reportEvents(events);
  const out: CorrectionResult[] = [];
  for (const correction of Object.keys(damageParameters) as DamageParameterName[]) {
    if (correction === 'walker' && resolved.walkerGamma === undefined && resolved.material.Su === undefined) continue;
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
