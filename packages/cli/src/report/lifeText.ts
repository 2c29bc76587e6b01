import type { LifeReport } from '@loopwise/engine';
import { formatNumber } from './formatNumber.js';

/** Life in repeats for people: '∞ (no damage)' when the damage is zero. */
export function repeatsText(life: LifeReport['life']): string {
  return life.repeats === Infinity ? '∞ (no damage)' : formatNumber(life.repeats);
}

/** Mean life in the service unit, e.g. '1234 h', or '—' when the job gave no amount per repeat. */
export function unitLifeText(life: LifeReport['life']): string {
  if (life.service === undefined || life.unit === undefined) return life.unit === undefined ? '— (no unit)' : `— (no ${life.unit} per repeat)`;
  return `${life.service === Infinity ? '∞' : formatNumber(life.service)} ${life.unit}`;
}

/** Design life (mean life / scatter factor) in the unit when there is one, else in repeats, with j. */
export function designLifeText(life: LifeReport['life']): string {
  const j = `j = ${formatNumber(life.scatterFactor)}`;
  if (life.designService !== undefined && life.unit !== undefined) return `${life.designService === Infinity ? '∞' : formatNumber(life.designService)} ${life.unit} (${j})`;
  return `${life.designRepeats === Infinity ? '∞' : formatNumber(life.designRepeats)} repeats (${j})`;
}
