import { rangeSpectrum, type RangeMeanMatrix } from '@loopwise/rainflow';

/**
 * The range-exceedance spectrum of a range-mean matrix, by rows: for the lower edge of each row
 * that holds cycles, how many cycles lie in that row or above (rainflow's `rangeSpectrum` on the
 * rows' edges and counts). Largest range first. Cycles outside the bins are not in it.
 */
export function matrixExceedance(m: RangeMeanMatrix): { range: number[]; cycles: number[] } {
  const edges = m.rowEdges;
  const C = m.columns;
  const range: number[] = [];
  const count: number[] = [];
  for (let i = 0; i < m.rows; i++) {
    let s = 0;
    for (let j = 0; j < C; j++) s += m.counts[i * C + j];
    if (s > 0) {
      range.push(edges[i]);
      count.push(s);
    }
  }
  const spectrum = rangeSpectrum({ range: Float64Array.from(range), count: Float64Array.from(count) });
  return { range: Array.from(spectrum.range), cycles: Array.from(spectrum.exceedances) };
}
