import type { LifeLoopColumns } from '@loopwise/engine';

/**
 * Row `i` of the report's loop columns as a line of the cycles CSV, without the channel field
 * and the newline: `start_sample … damage_per_repeat` (the header is CYCLES_CSV_HEADER).
 * `events` are the CSV fields of the event names (an index of -1, the initial state, gives an
 * empty field); an infinite life is written `Infinity` (as the JSON's string). On the stress-life route (no local strain:
 * empty strain columns) the strain fields are empty.
 */
export function cyclesCsvRow(l: LifeLoopColumns, i: number, events: readonly string[]): string {
  const ev = (k: number) => (k >= 0 ? events[k] : '');
  const life = l.cyclesToFailure[i]; // an infinite life prints as Infinity, as in the JSON
  const strain = l.strainMax.length > 0 ? `${l.strainMax[i]},${l.strainMin[i]}` : ',';
  return (
    `${l.startIndex[i]},${l.turnIndex[i]},${l.closeIndex[i]},${ev(l.startEvent[i])},${ev(l.turnEvent[i])},` +
    `${l.count[i]},${l.stressMax[i]},${l.stressMin[i]},${strain},${l.parameter[i]},${life},${l.damage[i]}`
  );
}
