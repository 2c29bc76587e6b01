import type { LifeReport } from '@loopwise/engine';
import { recognizeUnit, type IngestReport } from '@loopwise/ingest';
import { formatNumber } from '../report/formatNumber.js';

/** Time of sample i: start + i · step, in seconds. */
export interface TimeBase {
  start: number;
  step: number;
}

/**
 * The time base of a file as a uniform step: a sample rate always; a time column when its steps
 * agree to 1e-6 of their mean (logger clocks written with rounded decimals do), else null: a
 * time at a sample index would then need the column itself, which a streamed file does not keep.
 */
export function timeBaseOf(source: IngestReport, secondsPerUnit?: number): TimeBase | null {
  const t = source.time;
  if (t === null || t === undefined || t.kind === 'none') return null;
  if (t.kind === 'sample-rate') return { start: 0, step: t.timeStep };
  if (!(t.samples >= 2) || t.nonIncreasingSteps > 0) return null;
  if (!(t.meanStep > 0) || t.maxStep - t.minStep > 1e-6 * t.meanStep) return null;
  const k = secondsPerUnit ?? secondsPerUnitOfUnit(source.dialect?.units?.[t.column - 1]) ?? secondsPerUnitOfName(t.name);
  return { start: t.first * k, step: t.meanStep * k };
}

/** Seconds per unit of a time column by the unit the file gives it (units row or bracketed header unit), or undefined when it gives none or no time unit. */
function secondsPerUnitOfUnit(unit: string | undefined): number | undefined {
  if (unit === undefined || unit.trim() === '') return undefined;
  const r = recognizeUnit(unit);
  return r !== null && r.quantity === 'time' ? r.secondsPerUnit : undefined;
}

/**
 * The sample rate of an even time step in seconds, rounded to 12 significant digits: 1 / 0.01
 * is 100.00000000000001 in binary, and a cut-off at exactly half the rate must be refused as it is
 * with `--sample-rate 100`.
 */
export function rateOfStep(step: number): number {
  return Number((1 / step).toPrecision(12));
}

/**
 * Seconds per unit of a time column by its name: a unit in brackets or after the last `_`, space
 * or `-` (`t [ms]`, `time_min`, `Zeit_s`); 1 (seconds) when the name gives none.
 */
export function secondsPerUnitOfName(name: string): number {
  const m = /[[(]([^\])]+)[\])]\s*$/.exec(name) ?? /[_\s-]([A-Za-z]+)\s*$/.exec(name);
  const r = m ? recognizeUnit(m[1]) : null;
  return r !== null && r.quantity === 'time' ? r.secondsPerUnit : 1;
}

/** The time of a sample index for people, e.g. `41.74 s`. */
export function timeText(base: TimeBase, index: number): string {
  return `${formatNumber(base.start + index * base.step)} s`;
}

/**
 * The service per repeat from the time base, in hours: one repeat of a repeating history lasts
 * its samples × the step (the step back from the last sample to the first closes the repeat).
 * Used when the user gave no service; `note` says so for the summary.
 */
export function serviceFromTime(samples: number, base: TimeBase): { perRepeat: number; note: string } {
  const seconds = samples * base.step;
  const perRepeat = seconds / 3600;
  return {
    perRepeat,
    note: `service per repeat: ${formatNumber(perRepeat)} h (${formatNumber(seconds)} s: ${samples} samples × ${formatNumber(base.step)} s) from the time base (give --service to change it)`,
  };
}

/** A life with its service in hours, `perRepeat` h per repeat. */
export function withHours(life: LifeReport['life'], perRepeat: number): LifeReport['life'] {
  return { ...life, unit: 'h', perRepeat, service: life.repeats * perRepeat, designService: life.designRepeats * perRepeat };
}
