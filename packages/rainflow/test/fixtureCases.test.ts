import { readFileSync, readdirSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { rainflow, turningPoints } from '@loopwise/rainflow';

// Hand-made cases in fixtures/cases/, each { input, expected, source }; the source is in the file.
const dir = new URL('../../../fixtures/cases/', import.meta.url);

function rangeCounts(h: number[], residue: 'half' | 'repeat'): Record<string, number> {
  const c = rainflow(h, { residue }).cycles!.columns();
  const out: Record<string, number> = {};
  for (let i = 0; i < c.range.length; i++) out[String(c.range[i])] = (out[String(c.range[i])] ?? 0) + c.count[i];
  return out;
}

describe('fixtures/cases', () => {
  for (const file of readdirSync(dir).filter((f) => f.endsWith('.json'))) {
    const { input, expected, source } = JSON.parse(readFileSync(new URL(file, dir), 'utf8'));
    test(`${file}: ${source.slice(0, 60)}…`, () => {
      expect(source.length).toBeGreaterThan(0);
      if (expected.turningPointIndices) expect(Array.from(turningPoints(input).indices)).toEqual(expected.turningPointIndices);
      if (expected.half) expect(rangeCounts(input, 'half')).toEqual(expected.half.rangeCounts);
      if (expected.repeat) expect(rangeCounts(input, 'repeat')).toEqual(expected.repeat.rangeCounts);
    });
  }
});
