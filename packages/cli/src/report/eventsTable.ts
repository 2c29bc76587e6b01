import type { EventDamage } from '@loopwise/engine';
import { formatInteger, formatNumber, formatPercent } from './formatNumber.js';
import { htmlTable, num } from './htmlTable.js';

/** The table of damage by event of the schedule. */
export function eventsTable(events: EventDamage[]): string {
  return htmlTable(
    'events',
    'Damage by event (per repeat of the schedule; half of each loop to each of its reversals)',
    ['event', 'repeats', 'samples', 'damage', 'share'],
    events.map((e) => [e.name, num(formatInteger(e.repeats)), num(formatInteger(e.samples)), num(formatNumber(e.damage)), num(formatPercent(e.share))]),
  );
}
