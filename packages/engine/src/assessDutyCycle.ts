import { resolveLifeJob, type LifeJob } from './LifeJob';
import type { LifeReport } from './LifeReport';
import { reportEvents, reportFromTracked, stressReportFromCounted } from './reportAssembly';
import { countSchedule } from './stressLifeRoute';
import { checkEvents, type DutyEvent } from './schedule';
import { trackDutyCycle } from './trackHistory';

export type { DutyEvent } from './schedule';

/**
 * Assesses the fatigue life of a notched part under a duty cycle: an ordered list of events,
 * each run `repeats` times in a row, the whole schedule repeating. Loops that span events or
 * repeats are counted as if the schedule were one long history, without materialising the
 * repeats (cost grows with the events' lengths, not their repeat counts).
 *
 * Pipeline: turning points (with the gate) → memory-aware notch tracker (first pass and
 * stabilised pass) → damage parameter per closed loop → cycles to failure → Palmgren-Miner sum
 * with the cut-off → life in repeats of the schedule and in service units, with the attribution
 * of damage to events, to sample-index bins and to the worst loops, and the warnings.
 *
 * With `job.stressLife`, the stress-life route: four-point rainflow over the schedule (repeats
 * counted once the counter's state repeats; the residue closed as the schedule repeats, or half
 * cycles of a one-off schedule) → Kf and the stress factor → the amplitude correction → cycles to
 * failure on the S-N curve → the same Palmgren-Miner sum, attribution and report shape.
 *
 * @example
 * const report = assessDutyCycle(
 *   [
 *     { name: 'rough track', history: rough, repeats: 20, duration: 0.05 },
 *     { name: 'yard', history: yard, repeats: 3, duration: 0.1 },
 *   ],
 *   { material, notch: { Kt: 2.1 }, unit: { label: 'h' } },
 * );
 * report.life.service; // hours to the predicted crack initiation (mean estimate)
 */
export function assessDutyCycle(events: DutyEvent[], job: LifeJob): LifeReport {
  const resolved = resolveLifeJob(job);
  checkEvents(events);
  if (resolved.route === 'stress-life') return stressReportFromCounted(countSchedule(events, resolved), reportEvents(events), resolved, true);
  return reportFromTracked(trackDutyCycle(events, resolved), reportEvents(events), resolved);
}
