import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { HANDBOOK_STEELS_PROVENANCE, HANDBOOK_STEELS_SOURCE, handbookSteels } from '@loopwise/material';

// The source table: N. E. Dowling, Mechanical Behavior of Materials, Pearson, Table 14.1, as held
// in the shared reference file (resolved from this test file: ../shared/... from the repository).
const path = fileURLToPath(new URL('../../../../shared/reference/strain-life-table-14-1.json', import.meta.url));
const present = existsSync(path);
if (!present) console.warn(`handbookSteels tests skipped: reference table not found at ${path}`);

describe.skipIf(!present)('handbookSteels (against ../shared/reference/strain-life-table-14-1.json)', () => {
  const table = present
    ? (JSON.parse(readFileSync(path, 'utf8')) as { source: string; provenance: string; rows: Record<string, number | string>[] })
    : { source: '', provenance: '', rows: [] };

  it('has exactly the six rows of the source table, in its order', () => {
    expect(handbookSteels.map((m) => m.name)).toEqual(table.rows.map((r) => r.name));
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
