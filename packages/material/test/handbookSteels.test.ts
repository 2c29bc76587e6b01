import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { HANDBOOK_STEELS_PROVENANCE, HANDBOOK_STEELS_SOURCE, handbookSteels } from '@loopwise/material';

// The source table: N. E. Dowling, Mechanical Behavior of Materials, Pearson, Table 14.1, as held
// in fixtures/handbook/strain-life-table-14-1.json (its source, provenance and rows copied byte for
// byte from the shared reference file of the same name).
const fixture = JSON.parse(readFileSync(new URL('../../../fixtures/handbook/strain-life-table-14-1.json', import.meta.url), 'utf8')) as {
  input: string[];
  expected: { rows: Record<string, number | string>[] };
  source: string;
  provenance: string;
};
const table = { source: fixture.source, provenance: fixture.provenance, rows: fixture.expected.rows };

describe('handbookSteels (against fixtures/handbook/strain-life-table-14-1.json)', () => {
  it('has exactly the six rows of the source table, in its order', () => {
    expect(table.rows).toHaveLength(6);
    expect(table.rows.map((r) => r.name)).toEqual(fixture.input);
    expect(handbookSteels.map((m) => m.name)).toEqual(fixture.input);
  });

  it.each(table.rows.map((r) => [r.name, r] as const))('%s equals its source row in every constant', (name, row) => {
    const m = handbookSteels.find((s) => s.name === name)!;
    for (const field of ['Su', 'E', 'K', 'n', 'sigmaF', 'b', 'epsilonF', 'c'] as const) {
      expect(m[field], field).toBe(row[field]);
    }
  });

  it('every row carries the source string and the provenance, and SAE 1015 carries its from-memory note', () => {
    expect(HANDBOOK_STEELS_SOURCE).toBe(table.source);
    expect(HANDBOOK_STEELS_PROVENANCE).toBe(table.provenance);
    for (const m of handbookSteels) {
      expect(m.source).toBe(table.source);
      expect(m.note).toContain('not certified design data');
    }
    const sae1015 = handbookSteels.find((m) => m.name === 'SAE 1015 (normalized)')!;
    const row = table.rows.find((r) => r.name === 'SAE 1015 (normalized)')!;
    expect(sae1015.note).toContain(String(row.note));
    expect(sae1015.note).toContain('-0.513 from memory');
  });

  it('the rows are frozen, valid and compatible within tolerance (no warnings)', () => {
    expect(Object.isFrozen(handbookSteels)).toBe(true);
    for (const m of handbookSteels) {
      expect(Object.isFrozen(m)).toBe(true);
      expect(m.warnings).toEqual([]);
    }
  });
});
