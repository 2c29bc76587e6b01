import type { LifeReport } from '@loopwise/engine';
import { correctionName } from './correctionName.js';
import { definitionList } from './definitionList.js';
import { formatNumber } from './formatNumber.js';
import { designLifeText, repeatsText, unitLifeText } from './lifeText.js';

/** The summary numbers of one channel: damage, life, loops, gate. */
export function summaryList(report: LifeReport, totals?: { cycles: number; rows: number } | null): string {
  const loops = report.loops.count;
  let cycles = 0;
  for (let i = 0; i < loops.length; i++) cycles += loops[i];
  const loopText = totals ? `${formatNumber(totals.cycles)} cycles in ${totals.rows} rows` : loops.length > 0 ? `${formatNumber(cycles)} cycles in ${loops.length} rows` : 'folded into the totals as they closed (kept with --cycles-out)';
  return definitionList('summary', [
    ['damage per repeat', formatNumber(report.damage.perRepeat)],
    ['life', `${repeatsText(report.life)} repeats`],
    ['life in service', unitLifeText(report.life)],
    ['design life', designLifeText(report.life)],
    ['critical damage sum', formatNumber(report.life.criticalDamage)],
    ['damage of the first pass', formatNumber(report.damage.firstPass)],
    ['mean-stress correction', correctionName(report.damage.meanStress)],
    ['loops per repeat', loopText],
    ['gate', `range ${formatNumber(report.gate.range)} (assessed history units), ${formatNumber(report.gate.removedReversals)} reversals removed`],
  ]);
}
