import { escapeHtml } from './escapeHtml.js';
import { formatNumber, formatPercent } from './formatNumber.js';
import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale } from './linearScale.js';
import { masingLoop } from './masingLoop.js';
import { niceTicks } from './niceTicks.js';
import { innerX, innerY, plotFrame } from './PlotFrame.js';
import { rankStyle } from './rankStyle.js';
import { readCyclicConstants } from './readCyclicConstants.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';

const MICRO = 1e6;

/**
 * Closure errors below this are the rounding of the branch sums (Math.pow is correct to about
 * one unit in the last place, and its last bit differs between JavaScript engines: Node and a
 * browser gave 6.5e-16 and 5.2e-16 for the same loop); they are written as 0, larger ones to
 * three significant digits, so the report is the same bytes on every engine.
 */
const CLOSURE_NOISE = 1e-12;

/** The closure error as the report writes it (see CLOSURE_NOISE). */
function closureErrorText(error: number): string {
  return error < CLOSURE_NOISE ? '0' : dataNumber(Number(error.toPrecision(3)));
}

/**
 * The hysteresis loops of the worst cycles in local stress against local strain (µε): one
 * `<path class="loop">` per worst loop with `data-rank` and its corners (`data-stress-max`,
 * `data-stress-min`, `data-strain-max`, `data-strain-min`, strain dimensionless) and the closure
 * error of the drawn curve (0 below 1e-12, else three significant digits: see CLOSURE_NOISE). The corners are the assessment's; the branches between them are
 * drawn from the material model (Masing branches of the cyclic curve in `report.inputs`).
 */
export function loopsPlot(channel: HtmlChannel, id: string, stressUnit: string): string {
  const f = plotFrame(520, 84, 300);
  const title = `Hysteresis loops of the worst cycles of ${channel.name} (local stress against local strain)`;
  // the stress-life route computes no local strain: no hysteresis loops to draw
  const loops = channel.report.worstLoops.filter((l): l is typeof l & { strainMax: number; strainMin: number } => l.strainMax !== null && l.strainMin !== null);
  const material = readCyclicConstants(channel.report.inputs);
  if (channel.report.worstLoops.length > 0 && loops.length === 0) return svgPlot('loops', id, title, f, svgEmptyNote(f, 'The stress-life route computes no local strain: no hysteresis loops.'));
  if (loops.length === 0) return svgPlot('loops', id, title, f, svgEmptyNote(f, 'No closed loops: no damage.'));
  if (material === null) return svgPlot('loops', id, title, f, svgEmptyNote(f, 'The report names no cyclic curve (E, K′, n′) to draw the loops with.'));
  let smin = Infinity;
  let smax = -Infinity;
  let emin = Infinity;
  let emax = -Infinity;
  for (const l of loops) {
    smin = Math.min(smin, l.stressMin);
    smax = Math.max(smax, l.stressMax);
    emin = Math.min(emin, l.strainMin * MICRO);
    emax = Math.max(emax, l.strainMax * MICRO);
  }
  const ps = (smax - smin || Math.abs(smax) || 1) * 0.06;
  const pe = (emax - emin || Math.abs(emax) || 1) * 0.06;
  const [xr0, xr1] = innerX(f);
  const [yr0, yr1] = innerY(f);
  const x = linearScale(emin - pe, emax + pe, xr0, xr1);
  const y = linearScale(smin - ps, smax + ps, yr0, yr1);
  const parts: string[] = [];
  parts.push(
    svgAxes(
      f,
      { scale: x, ticks: niceTicks(emin - pe, emax + pe, 8), label: 'local strain ε (µε)' },
      { scale: y, ticks: niceTicks(smin - ps, smax + ps, 8), label: `local stress σ (${stressUnit})` },
    ),
  );
  const paths: string[] = [];
  const legend: string[] = [];
  const lx = f.width - f.right + 20;
  loops.forEach((l, k) => {
    const rank = k + 1;
    const { colour, dash } = rankStyle(rank);
    const loop = masingLoop(material, l.stressMax, l.stressMin, l.strainMax, l.strainMin, 40);
    let d = '';
    for (let i = 0; i < loop.strain.length; i++) d += `${i === 0 ? 'M' : 'L'}${svgNumber(x(loop.strain[i] * MICRO))} ${svgNumber(y(loop.stress[i]))}`;
    const style = `stroke="${colour}"${dash ? ` stroke-dasharray="${dash}"` : ''}${rank === 1 ? ' stroke-width="2.5"' : ''}`;
    paths.push(
      `<path class="loop" d="${d}Z" ${style} data-rank="${rank}" data-stress-max="${dataNumber(l.stressMax)}" data-stress-min="${dataNumber(l.stressMin)}"` +
        ` data-strain-max="${dataNumber(l.strainMax)}" data-strain-min="${dataNumber(l.strainMin)}" data-damage="${dataNumber(l.damage)}" data-closure-error="${closureErrorText(loop.closureError)}"/>` +
        `<circle class="loop-corner" cx="${svgNumber(x(l.strainMax * MICRO))}" cy="${svgNumber(y(l.stressMax))}" r="3" fill="${colour}"/>` +
        `<circle class="loop-corner" cx="${svgNumber(x(l.strainMin * MICRO))}" cy="${svgNumber(y(l.stressMin))}" r="3" fill="${colour}"/>`,
    );
    const ly = f.top + 14 + k * 22;
    if (ly < f.height - f.bottom) {
      legend.push(
        `<line x1="${lx}" x2="${lx + 28}" y1="${ly}" y2="${ly}" ${style} stroke-width="${rank === 1 ? 3 : 2}"/>` +
          `<text x="${lx + 36}" y="${ly}" dy="0.35em">${rank}: Δσ ${escapeHtml(formatNumber(l.stressMax - l.stressMin))} ${escapeHtml(stressUnit)}, ${escapeHtml(formatPercent(l.share))} of damage</text>`,
      );
    }
  });
  // Worst loop drawn last, on top.
  parts.push(`<g class="loops" fill="none">${paths.reverse().join('')}</g>`);
  parts.push(`<g class="legend"><text class="legend-title" x="${lx}" y="${f.top}">rank: stress range, share</text>${legend.join('')}</g>`);
  // Nearly elastic loops are narrow by nature; say so rather than leave the reader guessing.
  const plasticWidth = loops.map((l) => Math.abs(l.strainMax - l.strainMin - (l.stressMax - l.stressMin) / material.E) / Math.max(1e-300, Math.abs(l.strainMax - l.strainMin)));
  const widest = Math.max(...plasticWidth);
  if (widest < 0.1) {
    parts.push(`<text class="plot-note" x="${lx}" y="${f.height - f.bottom - 30}">Nearly elastic: plastic strain range</text>`);
    parts.push(`<text class="plot-note" x="${lx}" y="${f.height - f.bottom - 14}">at most ${escapeHtml(formatPercent(widest))} of the strain range.</text>`);
  }
  parts.push(`<text class="plot-note" x="${lx}" y="${f.height - f.bottom + 18}">Corners from the assessment;</text>`);
  parts.push(`<text class="plot-note" x="${lx}" y="${f.height - f.bottom + 34}">branches drawn from the material model.</text>`);
  return svgPlot('loops', id, title, f, parts.join(''), ` data-loops="${loops.length}"`);
}
