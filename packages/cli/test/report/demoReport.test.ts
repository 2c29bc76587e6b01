// The report of the invented demo history trailer-axle-fillet.csv (INVENTED DATA, see
// fixtures/make-demo-data.mjs; kept in packages/cli/demo, formerly fixtures/demo): a realistic size for the plots. With LOOPWISE_REPORT_OUT set,
// the page is also written there, to look at it in a browser.
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { assessLife } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { RangeMeanMatrix, rainflow } from '@loopwise/rainflow';
import { expect, it } from 'vitest';
import { displayHistory, renderHtmlReport } from '../../src/report/index.js';
import { elements, plots } from './htmlQuery.js';

const csvPath = ['../../demo/trailer-axle-fillet.csv', '../../../../fixtures/demo/trailer-axle-fillet.csv']
  .map((p) => fileURLToPath(new URL(p, import.meta.url)))
  .find((p) => existsSync(p))!;
const csv = readFileSync(csvPath, 'utf8');
const microstrain = Float64Array.from(
  csv
    .split('\n')
    .filter((line) => /^[0-9.]+,/.test(line))
    .map((line) => Number(line.split(',')[1])),
);

it('renderHtmlReport draws the demo trailer-axle history with every plot filled', () => {
  const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
  const strain = microstrain.map((v) => v * 1e-6);
  const report = assessLife(strain, { material, input: 'local-strain', unit: { label: 'h', perRepeat: 60 / 3600 }, scatterFactor: 5 });
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of microstrain) (lo = Math.min(lo, v)), (hi = Math.max(hi, v));
  // 32 range bins and 32 mean bins of a round width over the history's span
  const step = Math.ceil((hi - lo) / 32 / 10) * 10;
  const rows = Math.ceil((hi - lo) / step);
  const m = new RangeMeanMatrix({
    range: { count: rows, min: 0, max: rows * step },
    mean: { count: rows + 1, min: Math.floor(lo / step) * step, max: Math.floor(lo / step) * step + (rows + 1) * step },
  });
  rainflow(microstrain, { residue: 'repeat', sink: m });
  const html = renderHtmlReport({
    title: 'Trailer axle, shoulder fillet (invented demo data)',
    generatedBy: 'loopwise 0.1.0',
    channels: [
      {
        name: 'fillet_strain_ue',
        unit: 'µε',
        report,
        history: displayHistory(microstrain, 1000),
        matrix: { rowEdges: m.rowEdges, columnEdges: m.columnEdges, counts: m.counts, rowLabel: 'strain range (µε)', columnLabel: 'mean strain (µε)' },
      },
    ],
  });
  expect(microstrain.length).toBe(12000);
  expect(report.worstLoops).toHaveLength(10);
  expect(elements(plots(html, 'history')[0], 'g', 'loop-marker').length).toBeGreaterThanOrEqual(19);
  expect(elements(plots(html, 'matrix')[0], 'rect', 'cell').length).toBeGreaterThan(20);
  expect(elements(plots(html, 'loops')[0], 'path', 'loop')).toHaveLength(10);
  expect(html).not.toMatch(/NaN/);
  expect(html.length).toBeLessThan(400_000);
  const out = process.env.LOOPWISE_REPORT_OUT;
  if (out) writeFileSync(out, html);
});
