import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale } from './linearScale.js';
import { niceTicks } from './niceTicks.js';
import { innerX, innerY, plotFrame } from './PlotFrame.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';

/**
 * The damage timeline: damage per repeat in bins of sample index, one `<rect class="bar">` per
 * bin (zero bins included, with no height) carrying `data-bin`, `data-from`, `data-to` (sample
 * indices, end exclusive) and `data-damage`; the bars sum to the damage per repeat.
 */
export function timelinePlot(channel: HtmlChannel, id: string): string {
  const f = plotFrame(300);
  const title = `Damage timeline of ${channel.name}: damage per repeat by sample-index bin`;
  const { binSize, samples, damage } = channel.report.timeline;
  if (damage.length === 0 || !(binSize > 0)) return svgPlot('timeline', id, title, f, svgEmptyNote(f, 'No timeline.'));
  let dmax = 0;
  let total = 0;
  for (let i = 0; i < damage.length; i++) {
    if (damage[i] > dmax) dmax = damage[i];
    total += damage[i];
  }
  const end = Math.max(samples, 1);
  const [xr0, xr1] = innerX(f);
  const [yr0, yr1] = innerY(f);
  const x = linearScale(0, end, xr0, xr1);
  const top = dmax > 0 ? dmax * 1.08 : 1;
  const y = linearScale(0, top, yr0, yr1);
  const parts: string[] = [];
  parts.push(svgAxes(f, { scale: x, ticks: niceTicks(0, end, 10), label: 'sample index' }, { scale: y, ticks: niceTicks(0, top, 5), label: 'damage per bin' }));
  const bars: string[] = [];
  for (let i = 0; i < damage.length; i++) {
    const from = i * binSize;
    const to = Math.min((i + 1) * binSize, end);
    const left = x(from);
    const width = Math.max(0.5, x(to) - left - (x(to) - left > 4 ? 1 : 0));
    const h = damage[i] > 0 ? Math.max(0.5, yr0 - y(damage[i])) : 0;
    bars.push(
      `<rect class="bar" x="${svgNumber(left)}" y="${svgNumber(yr0 - h)}" width="${svgNumber(width)}" height="${svgNumber(h)}" data-bin="${i}" data-from="${from}" data-to="${to}" data-damage="${dataNumber(damage[i])}"/>`,
    );
  }
  parts.push(`<g class="bars">${bars.join('')}</g>`);
  if (dmax === 0) parts.push(svgEmptyNote(f, 'No damage in any bin.'));
  return svgPlot('timeline', id, title, f, parts.join(''), ` data-bins="${damage.length}" data-bin-size="${dataNumber(binSize)}" data-total="${dataNumber(total)}"`);
}
