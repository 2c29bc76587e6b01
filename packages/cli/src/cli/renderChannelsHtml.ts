import { binIndex } from '@loopwise/base';
import { binEdges } from '@loopwise/rainflow';
import { renderHtmlReport, type HtmlChannel } from '../report';
import type { ChannelResult } from './runAssessment';

const BINS = 20;

/**
 * The HTML report of a command's results: one section per channel with its plots. The matrix is
 * the range-mean matrix of the loops the engine counted at the notch root (local strain range
 * against local mean stress, loops per repeat), which is what the damage was computed from.
 */
export function renderChannelsHtml(results: ChannelResult[], title: string, generatedBy: string): string {
  const channels: HtmlChannel[] = results.map((r) => ({
    name: r.name,
    unit: r.unit,
    // the loop table, when it was kept, for the loop count and the matrix
    report: r.loops ? { ...r.report, loops: r.loops } : r.report,
    history: r.history,
    matrix: loopMatrix(r),
  }));
  return renderHtmlReport({ title, generatedBy, channels });
}

function loopMatrix(r: ChannelResult): HtmlChannel['matrix'] {
  const l = r.loops;
  if (l === null) return null;
  const n = l.count.length;
  if (n === 0) return null;
  let rangeMax = 0;
  let meanLo = Infinity;
  let meanHi = -Infinity;
  for (let i = 0; i < n; i++) {
    rangeMax = Math.max(rangeMax, l.strainMax[i] - l.strainMin[i]);
    const mean = (l.stressMax[i] + l.stressMin[i]) / 2;
    meanLo = Math.min(meanLo, mean);
    meanHi = Math.max(meanHi, mean);
  }
  if (!(rangeMax > 0)) return null;
  if (!(meanHi > meanLo)) {
    meanLo -= 1;
    meanHi += 1;
  }
  const rowEdges = binEdges({ count: BINS, min: 0, max: rangeMax }, 'range');
  const columnEdges = binEdges({ count: BINS, min: meanLo, max: meanHi }, 'mean');
  const counts = new Float64Array(BINS * BINS);
  for (let i = 0; i < n; i++) {
    // every loop lies within the edges (they are its own extremes), so none is lost
    const row = binIndex(rowEdges, l.strainMax[i] - l.strainMin[i]);
    const column = binIndex(columnEdges, (l.stressMax[i] + l.stressMin[i]) / 2);
    counts[row * BINS + column] += l.count[i];
  }
  return { rowEdges, columnEdges, counts, rowLabel: 'local strain range', columnLabel: 'local mean stress (MPa)' };
}
