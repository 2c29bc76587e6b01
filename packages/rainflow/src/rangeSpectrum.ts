import type { CycleColumns, CycleTable } from './CycleTable';

/** Cumulative range-exceedance spectrum. */
export interface RangeSpectrum {
  /** Distinct ranges, largest first. */
  range: Float64Array;
  /** Number of cycles (half cycles count 0.5) with a range >= range[i]. Non-decreasing. */
  exceedances: Float64Array;
}

/**
 * The cumulative spectrum of a cycle table: for each distinct range, how many cycles have that
 * range or more. Plotted with the count on a log axis it is the load spectrum of the history.
 *
 * @example
 * const { cycles } = rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2]);
 * rangeSpectrum(cycles).range;       // returns Float64Array [9, 8, 6, 4, 3]
 * rangeSpectrum(cycles).exceedances; // returns Float64Array [0.5, 1.5, 2, 3.5, 4]
 */
export function rangeSpectrum(cycles: CycleTable | Pick<CycleColumns, 'range' | 'count'>): RangeSpectrum {
  const cols = 'columns' in cycles ? cycles.columns() : cycles;
  const n = cols.range.length;
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => cols.range[b] - cols.range[a]);
  const range = new Float64Array(n);
  const exceedances = new Float64Array(n);
  let m = 0;
  let total = 0;
  for (let k = 0; k < n; k++) {
    const r = cols.range[order[k]];
    total += cols.count[order[k]];
    if (m > 0 && range[m - 1] === r) exceedances[m - 1] = total;
    else {
      range[m] = r;
      exceedances[m] = total;
      m++;
    }
  }
  return { range: range.slice(0, m), exceedances: exceedances.slice(0, m) };
}
