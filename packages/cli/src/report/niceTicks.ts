import { formatNumber, superscript } from './formatNumber.js';

/** Ticks of an axis: values, their labels, and a common factor for the axis label. */
export interface Ticks {
  /** Tick values inside [min, max], ascending. */
  values: number[];
  /** Labels of the ticks (divided by the common factor when there is one). */
  labels: string[];
  /** '' or a factor such as ' (× 10⁻⁶)' to append to the axis label. */
  factor: string;
}

/**
 * Round tick values (1, 2 or 5 × 10ᵏ steps) covering [min, max], about `target` of them. When
 * the step is below 10⁻³ or at least 10⁵, the labels are divided by a power of ten given in
 * `factor`, so they stay short.
 */
export function niceTicks(min: number, max: number, target = 6): Ticks {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { values: [], labels: [], factor: '' };
  if (min > max) [min, max] = [max, min];
  if (min === max) {
    return { values: [min], labels: [formatNumber(min)], factor: '' };
  }
  const raw = (max - min) / Math.max(1, target);
  const power = Math.floor(Math.log10(raw));
  const base = Math.pow(10, power);
  const m = raw / base;
  const mult = m < 1.5 ? 1 : m < 3 ? 2 : m < 7 ? 5 : 10;
  const step = mult * base;
  const stepPower = Math.floor(Math.log10(step) + 1e-9);
  const exponent = stepPower < -3 || stepPower >= 5 ? stepPower : 0;
  const scale = Math.pow(10, exponent);
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  const values: number[] = [];
  const labels: string[] = [];
  for (let k = first; k <= last; k++) {
    const v = k * step + 0; // + 0 turns -0 into 0
    values.push(v);
    // k * mult * 10^(power - exponent) is the label; round away binary noise.
    const label = Number(((k * step) / scale).toPrecision(12));
    labels.push(formatNumber(label, 6));
  }
  return { values, labels, factor: exponent === 0 ? '' : ` (× 10${superscript(exponent)})` };
}
