import type { LifeReport } from '@loopwise/engine';
import { MICROSTRAIN_PER_STRAIN } from '@loopwise/ingest';
import type { SnCurve } from '@loopwise/stress-life';
import { correctionName } from './correctionName.js';
import { definitionList } from './definitionList.js';
import { formatCount, formatNumber } from './formatNumber.js';
import { designLifeText, repeatsText, unitLifeText } from './lifeText.js';

/** The stress-life inputs as the report echoes them. */
interface StressInputs {
  curve: SnCurve;
  kf: number;
  stressFactor: number;
}

/** An S-N curve in words: its reference point, slopes, knees and cut-off, and Kf and the stress factor. */
export function curveText(s: StressInputs): string {
  const c = s.curve;
  const knees = c.kneeCycles.length === 0 ? '' : `, knee${c.kneeCycles.length > 1 ? 's' : ''} at ${c.kneeCycles.map((n) => formatNumber(n)).join(', ')} cycles`;
  const cutoff = c.cutoffCycles < Infinity ? `, no damage below ${formatNumber(c.cutoffStress)} (cut-off at ${formatNumber(c.cutoffCycles)} cycles)` : ', no cut-off';
  const factors = `${s.kf !== 1 ? `, Kf ${formatNumber(s.kf)}` : ''}${s.stressFactor !== 1 ? `, stress factor ${formatNumber(s.stressFactor)}` : ''}`;
  return `S-N curve of ${c.measure === 'amplitude' ? 'amplitudes' : 'ranges'}, ${formatNumber(c.referenceStress)} at ${formatNumber(c.referenceCycles)} cycles, slope ${c.slopes.map((m) => formatNumber(m)).join(' then ')}${knees}${cutoff}${factors}`;
}

/** The summary numbers of one channel: damage, life, loops, gate. */
export function summaryList(report: LifeReport, totals?: { cycles: number; rows: number } | null, unit = ""): string {
  const loops = report.loops.count;
  let cycles = 0;
  for (let i = 0; i < loops.length; i++) cycles += loops[i];
  const loopText = totals ? `${formatCount(totals.cycles)} cycles in ${totals.rows} rows` : loops.length > 0 ? `${formatCount(cycles)} cycles in ${loops.length} rows` : 'folded into the totals as they closed (kept with --cycles-out)';
  return definitionList('summary', [
    ['damage per repeat', formatNumber(report.damage.perRepeat)],
    ['life', `${repeatsText(report.life)} repeats`],
    ['life in service', unitLifeText(report.life)],
    ['design life', designLifeText(report.life)],
    ['critical damage sum', formatNumber(report.life.criticalDamage)],
    ['damage of the first pass', formatNumber(report.damage.firstPass)],
    ['mean-stress correction', correctionName(report.damage.meanStress)],
    ...(report.damage.route === 'stress-life' ? ([['route', `stress-life: ${curveText(report.inputs.stressLife as StressInputs)}`]] as [string, string][]) : []),
    ['loops per repeat', loopText],
    ['gate', `range ${gateText(report.gate.range, unit)}, ${formatNumber(report.gate.removedReversals)} reversals removed`],
  ]);
}

/** The gate range in the channel's unit: µε for a microstrain channel (the engine's is strain). */
function gateText(range: number, unit: string): string {
  if (unit === 'µε') return `${formatNumber(range * MICROSTRAIN_PER_STRAIN)} µε`;
  return unit === 'strain' || unit.startsWith('MPa') ? `${formatNumber(range)} ${unit === 'strain' ? 'strain' : 'MPa'}` : `${formatNumber(range)} (assessed history units)`;
}
