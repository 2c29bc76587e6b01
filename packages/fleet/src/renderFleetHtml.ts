import { ASSUMPTIONS, CAUTION, STRESS_LIFE_ASSUMPTIONS } from '@loopwise/engine';
import { FLEET_CAUTION } from './fleetReport';
import { matrixExceedance } from './matrixExceedance';
import type { FleetChannel, FleetResult } from './mergeFleet';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
/** Four significant digits, for tables and labels. */
const num = (x: number) => (Number.isFinite(x) ? (x === 0 ? '0' : Math.abs(x) >= 1e-3 && Math.abs(x) < 1e6 ? String(Number(x.toPrecision(4))) : x.toExponential(3)) : String(x));
const px = (x: number) => (Math.round(x * 10) / 10).toString();

const W = 560;
const H = 260;
const M = { left: 64, right: 16, top: 12, bottom: 40 };

/** The assets' damage per unit, sorted, as bars on a log axis, with the fleet's percentiles marked. */
function distributionPlot(c: FleetChannel, rows: { asset: string; damagePerUnit: number }[], unit: string): string {
  const vals = rows.filter((r) => r.damagePerUnit > 0).sort((a, b) => a.damagePerUnit - b.damagePerUnit);
  if (vals.length === 0) return '<p>No asset has damage on this channel.</p>';
  const lo = Math.floor(Math.log10(vals[0].damagePerUnit));
  const hi = Math.max(lo + 1, Math.ceil(Math.log10(vals[vals.length - 1].damagePerUnit)));
  const y = (v: number) => M.top + (H - M.top - M.bottom) * (1 - (Math.log10(v) - lo) / (hi - lo));
  const bw = (W - M.left - M.right) / vals.length;
  const bars = vals.map((r, i) => `<rect x="${px(M.left + i * bw + bw * 0.1)}" y="${px(y(r.damagePerUnit))}" width="${px(bw * 0.8)}" height="${px(H - M.bottom - y(r.damagePerUnit))}" fill="#4a78a8"><title>${esc(r.asset)}: ${num(r.damagePerUnit)} per ${esc(unit)}</title></rect>`);
  const ticks: string[] = [];
  for (let e = lo; e <= hi; e++) ticks.push(`<line x1="${M.left - 4}" x2="${M.left}" y1="${px(y(10 ** e))}" y2="${px(y(10 ** e))}" stroke="#333"/><text x="${M.left - 6}" y="${px(y(10 ** e) + 4)}" text-anchor="end" font-size="11">1e${e}</text>`);
  const marks = (['p50', 'p95'] as const)
    .filter((k) => c.distribution[k] > 0)
    .map((k) => `<line x1="${M.left}" x2="${W - M.right}" y1="${px(y(c.distribution[k]))}" y2="${px(y(c.distribution[k]))}" stroke="${k === 'p50' ? '#2a2' : '#c33'}" stroke-dasharray="5 3"/><text x="${W - M.right}" y="${px(y(c.distribution[k]) - 3)}" text-anchor="end" font-size="11">${k} ${num(c.distribution[k])}</text>`);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" role="img" aria-label="damage per ${esc(unit)} of each asset"><rect width="${W}" height="${H}" fill="#fff"/>${bars.join('')}${ticks.join('')}${marks.join('')}<line x1="${M.left}" x2="${M.left}" y1="${M.top}" y2="${H - M.bottom}" stroke="#333"/><line x1="${M.left}" x2="${W - M.right}" y1="${H - M.bottom}" y2="${H - M.bottom}" stroke="#333"/><text x="${(W + M.left) / 2}" y="${H - 12}" text-anchor="middle" font-size="12">assets, sorted by damage per ${esc(unit)} (${vals.length})</text></svg>`;
}

/** Range exceedance curves (cycles at or above a range, log axis): measured, linear at target, tail fit at target. */
function spectrumPlot(c: FleetChannel): string {
  const curves: { name: string; colour: string; s: { range: number[]; cycles: number[] } }[] = [{ name: 'measured', colour: '#333', s: matrixExceedance(c.rangeMean) }];
  if (c.extrapolation) {
    curves.push({ name: 'target, linear', colour: '#4a78a8', s: matrixExceedance(c.extrapolation.linear) });
    curves.push({ name: 'target, tail fit', colour: '#c33', s: matrixExceedance(c.extrapolation.tail.matrix) });
  }
  const all = curves.flatMap((k) => k.s.cycles).filter((x) => x > 0);
  const ranges = curves.flatMap((k) => k.s.range);
  if (all.length === 0) return '<p>No cycles inside the bins.</p>';
  const lo = Math.floor(Math.log10(Math.min(...all)));
  const hi = Math.max(lo + 1, Math.ceil(Math.log10(Math.max(...all))));
  const rMax = Math.max(...ranges, 1e-300) * 1.05;
  const x = (n: number) => M.left + (W - M.left - M.right) * ((Math.log10(n) - lo) / (hi - lo));
  const y = (r: number) => M.top + (H - M.top - M.bottom) * (1 - r / rMax);
  const paths = curves.map((k, i) => {
    const pts = k.s.range.map((r, j) => `${px(x(Math.max(k.s.cycles[j], 10 ** lo)))},${px(y(r))}`);
    return `<polyline fill="none" stroke="${k.colour}" stroke-width="1.6" points="${pts.join(' ')}"/><text x="${W - M.right}" y="${M.top + 14 + 14 * i}" text-anchor="end" font-size="11" fill="${k.colour}">${esc(k.name)}</text>`;
  });
  const ticks: string[] = [];
  for (let e = lo; e <= hi; e++) ticks.push(`<text x="${px(x(10 ** e))}" y="${H - M.bottom + 14}" text-anchor="middle" font-size="11">1e${e}</text>`);
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" role="img" aria-label="range exceedance spectrum"><rect width="${W}" height="${H}" fill="#fff"/>${paths.join('')}${ticks.join('')}<text x="${M.left - 6}" y="${M.top + 10}" text-anchor="end" font-size="11">${num(rMax)}</text><text x="${M.left - 6}" y="${H - M.bottom}" text-anchor="end" font-size="11">0</text><line x1="${M.left}" x2="${M.left}" y1="${M.top}" y2="${H - M.bottom}" stroke="#333"/><line x1="${M.left}" x2="${W - M.right}" y1="${H - M.bottom}" y2="${H - M.bottom}" stroke="#333"/><text x="${(W + M.left) / 2}" y="${H - 12}" text-anchor="middle" font-size="12">cycles with a range at or above (log)</text><text x="14" y="${(H - M.bottom) / 2}" font-size="12" transform="rotate(-90 14 ${(H - M.bottom) / 2})" text-anchor="middle">range</text></svg>`;
}

/** The assumptions of the routes the fleet's files took. */
function assumptionsOf(fleet: FleetResult): string {
  const routes = new Set(fleet.files.map((f) => f.route));
  const list = (title: string, items: readonly string[]) => `<p>${esc(title)}</p><ul>${items.map((a) => `<li>${esc(a)}</li>`).join('')}</ul>`;
  return (routes.has('strain-life') ? list('Assumptions of each file assessed on the strain-life route:', ASSUMPTIONS) : '') + (routes.has('stress-life') ? list('Assumptions of each file assessed on the stress-life route:', STRESS_LIFE_ASSUMPTIONS) : '');
}

function table(head: string[], rows: string[][]): string {
  return `<table><thead><tr>${head.map((h) => `<th>${esc(h)}</th>`).join('')}</tr></thead><tbody>${rows.map((r) => `<tr>${r.map((v) => `<td>${esc(v)}</td>`).join('')}</tr>`).join('')}</tbody></table>`;
}

/**
 * The fleet's HTML summary: one self-contained, deterministic file (inline SVG drawn here, no
 * script, no dates): the safety caution first, the failures, then per channel the fleet's
 * damage per unit with its spread (a bar per asset, p50 and p95 marked), the combined spectrum
 * and its extrapolation to the target service, and the per-asset sums.
 */
export function renderFleetHtml(fleet: FleetResult, tool: string): string {
  const u = fleet.settings.unit;
  const parts: string[] = [];
  parts.push(`<h1>Fleet summary</h1><p>${esc(tool)}: ${fleet.counts.rows} files listed, ${fleet.counts.assessed} assessed, ${fleet.counts.failed} failed. Service unit: ${esc(u)}${fleet.settings.targetService !== null ? `; target service ${num(fleet.settings.targetService)} ${esc(u)}` : ''}.</p>`);
  parts.push(`<section class="caution"><h2>Caution</h2><p>${esc(FLEET_CAUTION)}</p><p>${esc(CAUTION)}</p>${assumptionsOf(fleet)}</section>`);
  parts.push('<h2>Failures</h2>' + (fleet.failures.length === 0 ? '<p>None: every listed file was assessed.</p>' : `<ul>${fleet.failures.map((f) => `<li>${esc(f.message)}</li>`).join('')}</ul>`));
  for (const c of fleet.channels) {
    const d = c.distribution;
    parts.push(`<h2>Channel ${esc(c.channel)}</h2>`);
    parts.push(table(['figure', 'value'], [
      ['assets / files', `${c.assets} / ${c.files}`],
      [`usage (${u})`, num(c.usage)],
      [`fleet damage per ${u} (all damage ÷ all usage)`, num(c.damagePerUnit)],
      [`assets' damage per ${u}: min, p50, p90, p95, p99, max`, [d.min, d.p50, d.p90, d.p95, d.p99, d.max].map(num).join(', ')],
      ['severe asset (largest damage per unit)', d.severeAsset],
      ...(c.extrapolation
        ? [
            [`damage at the target ${num(c.extrapolation.targetService)} ${u} (fleet rate × target)`, num(c.extrapolation.damageLinear)],
            ['extrapolation tail', c.extrapolation.tail.fitted ? `threshold ${num(c.extrapolation.tail.threshold)}, mean excess ${num(c.extrapolation.tail.meanExcess)}, largest range at target ${num(c.extrapolation.tail.largestRange)} (measured up to ${num(c.extrapolation.tail.measuredLargestRange)})` : (c.extrapolation.tail.note ?? 'not fitted')],
          ]
        : []),
    ]));
    parts.push(`<h3>Damage per ${esc(u)} across the fleet</h3>`, distributionPlot(c, fleet.assets.filter((a) => a.channel === c.channel), u));
    parts.push('<h3>Combined spectrum and its extrapolation</h3>', spectrumPlot(c));
    parts.push('<h3>Assets</h3>', table(['asset', 'files', `usage (${u})`, 'damage', `damage per ${u}`, `life (${u})`], fleet.assets.filter((a) => a.channel === c.channel).map((a) => [a.asset, String(a.files), num(a.usage), num(a.damage), num(a.damagePerUnit), num(a.lifeService)])));
  }
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Fleet summary</title><style>body{font:14px/1.4 system-ui,sans-serif;max-width:960px;margin:2em auto;padding:0 1em;color:#222}table{border-collapse:collapse;margin:.5em 0}td,th{border:1px solid #ccc;padding:2px 8px;text-align:left}.caution{border:2px solid #c33;padding:0 1em;background:#fff6f6}</style></head><body>${parts.join('\n')}</body></html>\n`;
}
