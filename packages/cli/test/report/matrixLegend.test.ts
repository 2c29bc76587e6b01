import { describe, expect, test } from 'vitest';
import type { HtmlChannel } from '../../src/report/HtmlReportInput';
import { matrixPlot } from '../../src/report/matrixPlot';

// The colour bar of the matrix plot labels its smallest and largest count and the powers of ten
// between them that do not crowd those two (issue 11: "the colour-bar maximum overprints a tick").
// Counts INVENTED for the test.
function legendLabels(counts: number[]): { text: string; y: number }[] {
  const channel = {
    name: 'x',
    matrix: { rowEdges: Float64Array.of(0, 1, 2), columnEdges: Float64Array.of(0, 1), counts: Float64Array.from(counts), rowLabel: 'range', columnLabel: 'mean' },
  } as unknown as HtmlChannel;
  const svg = matrixPlot(channel, 'm');
  const legend = /<g class="legend">.*?<\/g>/s.exec(svg)![0];
  return [...legend.matchAll(/<text class="tick-label" x="[^"]+" y="([^"]+)"[^>]*>([^<]+)<\/text>/g)].map((m) => ({ text: m[2], y: Number(m[1]) }));
}

describe('matrix colour bar', () => {
  test('a largest count just above a power of ten drops that power: labels stay at least 14 px apart', () => {
    const labels = legendLabels([1, 1100]);
    expect(labels.map((l) => l.text)).toEqual(['1', '10', '100', '1100']);
    const ys = labels.map((l) => l.y).sort((a, b) => a - b);
    for (let k = 1; k < ys.length; k++) expect(ys[k] - ys[k - 1]).toBeGreaterThanOrEqual(14);
  });

  test('well apart, every power of ten between the ends is labelled', () => {
    expect(legendLabels([2, 50000]).map((l) => l.text)).toEqual(['2', '10', '100', '1000', '10000', '50000']);
  });
});

