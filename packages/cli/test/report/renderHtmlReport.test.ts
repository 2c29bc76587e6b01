// Invented histories (for the tests only); material SAE 1045 from the handbook table of
// @loopwise/material. Plots are checked for their presence and data, not their pixels.
import { assessDutyCycle, assessLife, type LifeReport } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { RangeMeanMatrix, rainflow } from '@loopwise/rainflow';
import { describe, expect, it } from 'vitest';
import { displayHistory, renderHtmlReport, type HtmlChannel, type HtmlReportInput } from '../../src/report/index.js';
import { channelSections, elements, plots } from './htmlQuery.js';

const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
const KINDS = ['history', 'matrix', 'loops', 'timeline', 'events'];

/** An invented nominal-stress history (MPa): a sine with a slow swell and two overloads. */
function inventedHistory(n = 600): Float64Array {
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = 40 + 90 * Math.sin(i * 0.7) * (1 + 0.5 * Math.sin(i * 0.031)) + (i === 200 ? 160 : 0) + (i === 431 ? -150 : 0);
  return x;
}

function matrixOf(history: Float64Array): HtmlChannel['matrix'] {
  const m = new RangeMeanMatrix({ range: { count: 16, min: 0, max: 480 }, mean: { count: 12, min: -120, max: 240 } });
  rainflow(history, { residue: 'repeat', sink: m });
  return { rowEdges: m.rowEdges, columnEdges: m.columnEdges, counts: m.counts, rowLabel: 'range (MPa)', columnLabel: 'mean (MPa)' };
}

function channel(name: string, history: Float64Array, report: LifeReport): HtmlChannel {
  return { name, unit: 'MPa', report, history: displayHistory(history, 2000), matrix: matrixOf(history) };
}

const history = inventedHistory();
const report = assessLife(history, { material, notch: { Kt: 2.4 }, unit: { label: 'km', perRepeat: 1.5 }, scatterFactor: 5, worstLoopCount: 6 });
const duty = assessDutyCycle(
  [
    { name: 'cobbles', history: inventedHistory(300), repeats: 4, duration: 0.2 },
    { name: 'braking', history: Float64Array.from([0, 220, -60, 180, 0]), repeats: 2, duration: 0.05 },
  ],
  { material, notch: { Kt: 2.4 }, unit: { label: 'km' } },
);
const input: HtmlReportInput = {
  title: 'Test bracket <rig> (invented demo data)',
  generatedBy: 'loopwise 0.1.0',
  channels: [channel('<b>&"x"', history, report), { ...channel('duty & cycle', inventedHistory(300), duty), history: null }],
};
const html = renderHtmlReport(input);
const sections = channelSections(html);

describe('renderHtmlReport(input)', () => {
  it('draws every plot once per channel, each with a <title>', () => {
    expect(sections).toHaveLength(2);
    for (const section of sections) {
      for (const kind of KINDS) {
        const found = plots(section, kind);
        expect(found, kind).toHaveLength(1);
        expect(found[0]).toMatch(/<title id="[^"]+">[^<]+<\/title>/);
      }
    }
    expect(plots(html, 'history')).toHaveLength(2);
  });

  it('marks the start and turn sample indices of the worst loops on the history, by rank', () => {
    expect(report.worstLoops.length).toBeGreaterThan(2);
    const markers = elements(plots(sections[0], 'history')[0], 'g', 'loop-marker');
    report.worstLoops.forEach((loop, k) => {
      const mine = markers.filter((m) => m['data-rank'] === String(k + 1));
      const byRole = Object.fromEntries(mine.map((m) => [m['data-role'], Number(m['data-index'])]));
      if (loop.startIndex >= 0) expect(byRole.start).toBe(loop.startIndex);
      expect(byRole.turn).toBe(loop.turnIndex);
    });
    // the display copy keeps the value at a marked index (the history is short: kept whole)
    const first = markers.find((m) => m['data-rank'] === '1' && m['data-role'] === 'turn')!;
    expect(Number(first['data-value'])).toBe(history[report.worstLoops[0].turnIndex]);
  });

  it('draws one matrix cell per non-zero count, with the count in its data', () => {
    const m = input.channels[0].matrix!;
    const cells = elements(plots(sections[0], 'matrix')[0], 'rect', 'cell');
    const columns = m.columnEdges.length - 1;
    const expected = [...m.counts].map((c, i) => ({ c, i })).filter(({ c }) => c > 0);
    expect(expected.length).toBeGreaterThan(3);
    expect(cells).toHaveLength(expected.length);
    for (const { c, i } of expected) {
      const cell = cells.find((e) => Number(e['data-row']) * columns + Number(e['data-column']) === i)!;
      expect(Number(cell['data-count'])).toBe(c);
    }
    expect(plots(sections[0], 'matrix')[0]).toContain('class="legend"');
    expect(plots(sections[0], 'matrix')[0]).toContain('range (MPa)');
  });

  it('draws one hysteresis loop per worst loop, from the Masing branches that meet its corners', () => {
    const loops = elements(plots(sections[0], 'loops')[0], 'path', 'loop');
    expect(loops).toHaveLength(report.worstLoops.length);
    for (const l of loops) {
      const w = report.worstLoops[Number(l['data-rank']) - 1];
      expect(Number(l['data-stress-max'])).toBe(w.stressMax);
      expect(Number(l['data-strain-min'])).toBe(w.strainMin);
      // corners from the Neuber tracker, curve from the same cyclic curve: the branch ends at the corner
      expect(Number(l['data-closure-error'])).toBeLessThan(1e-6);
      expect(l.d.split('L').length).toBe(80);
    }
  });

  it('draws timeline bars that sum to the damage per repeat', () => {
    for (const [k, r] of [report, duty].entries()) {
      const bars = elements(plots(sections[k], 'timeline')[0], 'rect', 'bar');
      expect(bars).toHaveLength(r.timeline.damage.length);
      const sum = bars.reduce((s, b) => s + Number(b['data-damage']), 0);
      expect(Math.abs(sum - r.damage.perRepeat)).toBeLessThanOrEqual(1e-9 * r.damage.perRepeat);
      expect(Number(bars[bars.length - 1]['data-to'])).toBe(r.timeline.samples);
    }
  });

  it('draws one bar per event with its damage and share', () => {
    const bars = elements(plots(sections[1], 'events')[0], 'rect', 'event-bar');
    expect(bars.map((b) => b['data-event'])).toEqual(['cobbles', 'braking']);
    duty.events.forEach((e, k) => {
      expect(Number(bars[k]['data-damage'])).toBe(e.damage);
      expect(Number(bars[k]['data-share'])).toBe(e.share);
    });
    expect(elements(plots(sections[0], 'events')[0], 'rect', 'event-bar')).toHaveLength(1);
  });

  it('escapes names and titles', () => {
    expect(html).not.toContain('<b>&"x"');
    expect(html).toContain('&lt;b&gt;&amp;&quot;x&quot;');
    expect(html).not.toContain('<rig>');
    expect(html).toContain('duty &amp; cycle');
  });

  it('is deterministic: two renders are byte-identical', () => {
    expect(renderHtmlReport(input)).toBe(html);
  });

  it('never prints NaN, holds the caution, the assumptions, the invented-data note and the results of all channels', () => {
    expect(html).not.toMatch(/NaN/);
    expect(html).toContain(report.caution);
    for (const a of report.assumptions) expect(html).toContain(a.replace(/&/g, '&amp;').replace(/'/g, '&#39;').replace(/"/g, '&quot;'));
    expect(html).toContain('class="invented"');
    const rows = html.match(/<table class="results">[\s\S]*?<\/table>/)![0].match(/<tr>/g)!;
    expect(rows).toHaveLength(3);
    expect(html).toContain('Smith-Watson-Topper');
    expect(html).toMatch(/\(j = 5\)/);
  });

  it('needs no script and loads nothing from outside', () => {
    expect(html).not.toMatch(/<script|<link|src=|@import|url\((?!#)/);
  });

  it('renders a channel without damage: no loops, ∞ life, empty plots with a note, still no NaN', () => {
    const quiet = assessLife(Float64Array.from([0, 1, 0, 1, 0]), { material, notch: { Kt: 1 }, cutoffCycles: 1e7 });
    expect(quiet.damage.perRepeat).toBe(0);
    const out = renderHtmlReport({ title: 'Quiet', generatedBy: 'loopwise 0.1.0', channels: [{ name: 'q', unit: 'MPa', report: quiet, history: null, matrix: null }] });
    for (const kind of KINDS) expect(plots(out, kind)).toHaveLength(1);
    expect(out).not.toMatch(/NaN/);
    expect(out).toContain('∞');
    expect(out).not.toContain('class="invented"');
    expect(elements(out, 'path', 'loop')).toHaveLength(quiet.worstLoops.length);
  });
});
