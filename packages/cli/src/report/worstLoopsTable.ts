import type { WorstLoop } from '@loopwise/engine';
import { formatCount, formatInteger, formatNumber, formatPercent } from './formatNumber.js';
import { htmlTable, num } from './htmlTable.js';
import { loopInFile } from './cutNumbering.js';
import { loopPlaceText } from './loopPlace.js';

function indexText(i: number): string {
  return i < 0 ? 'initial state' : formatInteger(i);
}

/**
 * The table of the most damaging loops, by rank (the ranks marked in the plots). Indices are of
 * the schedule (the events one after the other); with `events` of a duty cycle the last column
 * also gives each event's own sample.
 */
export function worstLoopsTable(loops: WorstLoop[], stressUnit: string, events: readonly { name: string; samples: number }[] = [], cutOut: ArrayLike<number> = []): string {
  if (loops.length === 0) return '<p class="none">No damaging loops.</p>';
  const stressRoute = loops[0].strainMax === null;
  // after a cut: the file's sample numbers too (the indices are of the history joined across the cuts)
  const cut = cutOut.length > 0;
  const inFile = (l: WorstLoop) => {
    const f = loopInFile(l, cutOut);
    return `${indexText(f.startIndex)} – ${indexText(f.turnIndex)}${f.acrossCut ? ' (across a cut)' : ''}`;
  };
  return htmlTable(
    'worst-loops',
    (stressRoute ? 'Most damaging cycles (stresses as entered on the S-N curve, Kf and the stress factor applied; no local strain on this route; damage per repeat)' : 'Most damaging loops (local stress and strain at the notch root; damage per repeat)') +
      (cut ? '. Start and turn index count the samples kept (the history joined across the cuts); the file samples column gives them in the file' : ''),
    ['rank', 'share of damage', 'damage', 'count', `σmax (${stressUnit})`, `σmin (${stressUnit})`, 'εmax (µε)', 'εmin (µε)', 'cycles to failure Nf', 'start index', 'turn index', ...(cut ? ['file samples (start – turn)'] : []), 'events (start → turn)'],
    loops.map((l, k) => [
      num(String(k + 1)),
      num(formatPercent(l.share)),
      num(formatNumber(l.damage)),
      num(formatCount(l.count)),
      num(formatNumber(l.stressMax)),
      num(formatNumber(l.stressMin)),
      num(l.strainMax === null ? '—' : formatNumber(l.strainMax * 1e6)),
      num(l.strainMin === null ? '—' : formatNumber(l.strainMin * 1e6)),
      num(formatNumber(l.cyclesToFailure)),
      num(indexText(l.startIndex)),
      num(indexText(l.turnIndex)),
      ...(cut ? [num(inFile(l))] : []),
      events.length > 1 ? loopPlaceText(l, events) : `${l.startEvent ?? 'initial state'} → ${l.turnEvent ?? 'initial state'}`,
    ]),
  );
}
