import { stressAtCycles, type SnCurve } from '@loopwise/stress-life';
import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale } from './linearScale.js';
import { innerX, innerY, plotFrame } from './PlotFrame.js';
import { superscript } from './formatNumber.js';
import type { Ticks } from './niceTicks.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';

/** Ticks at the powers of ten of [lo, hi] (log10 values), labelled 10ᵏ. */
function decadeTicks(lo: number, hi: number): Ticks {
  const values: number[] = [];
  for (let k = Math.ceil(lo); k <= Math.floor(hi); k++) values.push(k);
  return { values, labels: values.map((k) => `10${superscript(k)}`), factor: '' };
}

/**
 * The S-N curve of a stress-life report on log-log axes (`<path class="sn-curve">`, cut-off
 * dashed), the worst cycles at their lives on it (`<circle class="sn-cycle">` with `data-rank`,
 * `data-cycles`, `data-stress`), and, when the counted cycles are given, the counted spectrum
 * drawn to the predicted life (`<path class="sn-spectrum">`): the cycles of one repeat at or above
 * each equivalent stress, times the life in repeats. By Miner's rule the spectrum so drawn lies
 * where the curve would be met by a constant-amplitude test of the same damage.
 */
export function snCurvePlot(channel: HtmlChannel, id: string, stressUnit: string): string {
  const f = plotFrame(380);
  const r = channel.report;
  const title = `S-N curve of ${channel.name} with the counted spectrum (equivalent stress against cycles)`;
  const curve = (r.inputs.stressLife as { curve?: SnCurve } | null)?.curve;
  if (curve === undefined) return svgPlot('sn', id, title, f, svgEmptyNote(f, 'The report names no S-N curve.'));
  const measure = curve.measure === 'amplitude' ? 'amplitude' : 'range';
  // the spectrum: equivalent stress S per counted cycle, largest first, cumulative counts × life
  const spectrum = channel.spectrum ?? null;
  const life = r.life.repeats;
  const steps: [number, number][] = [];
  if (spectrum !== null && Number.isFinite(life) && life > 0) {
    const order = Array.from(spectrum.stress.keys()).filter((i) => spectrum.stress[i] > 0).sort((a, b) => spectrum.stress[b] - spectrum.stress[a]);
    let n = 0;
    for (const i of order) {
      n += spectrum.count[i];
      steps.push([n * life, spectrum.stress[i]]);
    }
  }
  const worst = r.worstLoops.filter((w) => Number.isFinite(w.cyclesToFailure) && w.cyclesToFailure > 0);
  const nLo = Math.floor(Math.log10(Math.min(1e4, ...worst.map((w) => w.cyclesToFailure), ...steps.map((s) => s[0]))));
  const nHi = Math.ceil(Math.log10(Math.max(curve.cutoffCycles < Infinity ? 10 * curve.cutoffCycles : 1e9, ...steps.map((s) => s[0]))));
  const at = (logN: number) => stressAtCycles(curve, Math.pow(10, logN));
  const samples: [number, number][] = [];
  for (let k = 0; k <= 200; k++) {
    const logN = nLo + ((nHi - nLo) * k) / 200;
    const s = at(logN);
    if (s > 0 && Number.isFinite(s)) samples.push([logN, Math.log10(s)]);
  }
  // the stress axis spans the curve over the plotted lives and at most two decades below it:
  // the spectrum's smallest cycles (a large count of tiny ones) would otherwise flatten it
  const curveLogs = samples.map((p) => p[1]);
  const sHi = Math.ceil(Math.max(...curveLogs, ...steps.map((s) => Math.log10(s[1]))) + 0.05);
  const sLo = Math.floor(Math.min(...curveLogs) - 0.05) - 1;
  while (steps.length > 0 && Math.log10(steps[steps.length - 1][1]) < sLo) steps.pop();
  const [xr0, xr1] = innerX(f);
  const [yr0, yr1] = innerY(f);
  const x = linearScale(nLo, nHi, xr0, xr1);
  const y = linearScale(sLo, sHi, yr0, yr1);
  const parts: string[] = [];
  parts.push(svgAxes(f, { scale: x, ticks: decadeTicks(nLo, nHi), label: 'cycles N' }, { scale: y, ticks: decadeTicks(sLo, sHi), label: `equivalent stress ${measure} (${stressUnit})` }));
  const path = samples.map((p, k) => `${k === 0 ? 'M' : 'L'}${svgNumber(x(p[0]))} ${svgNumber(y(p[1]))}`).join('');
  parts.push(`<path class="sn-curve" d="${path}" fill="none" stroke="#1f4e79" stroke-width="2"/>`);
  if (steps.length > 0) {
    const d: string[] = [];
    let prevN = nLo;
    steps.forEach(([n, s], k) => {
      const ly = svgNumber(y(Math.log10(s)));
      d.push(`${k === 0 ? 'M' : 'L'}${svgNumber(x(prevN))} ${ly}L${svgNumber(x(Math.log10(n)))} ${ly}`);
      prevN = Math.log10(n);
    });
    parts.push(`<path class="sn-spectrum" d="${d.join('')}" fill="none" stroke="#b35900" stroke-width="1.5" stroke-dasharray="5 3"/>`);
  }
  worst.forEach((w, k) => {
    const stress = stressAtCycles(curve, w.cyclesToFailure);
    if (!(stress > 0)) return;
    parts.push(
      `<circle class="sn-cycle" cx="${svgNumber(x(Math.log10(w.cyclesToFailure)))}" cy="${svgNumber(y(Math.log10(stress)))}" r="4" fill="#b30000" data-rank="${k + 1}" data-cycles="${dataNumber(w.cyclesToFailure)}" data-stress="${dataNumber(stress)}"/>`,
    );
  });
  return svgPlot('sn', id, title, f, parts.join(''), ` data-measure="${measure}" data-spectrum-steps="${steps.length}"`);
}
