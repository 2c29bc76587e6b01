// The public reader against the reference: csv-parse 6 on the whole text (sync API, options
// below) plus Number() on each selected field (decimal comma replaced by a point), on generated
// files with headers, BOM, CRLF, comments, blank lines, quoted fields and decimal commas,
// read in random chunk sizes down to one byte.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import fc from 'fast-check';
import { describe, it } from 'vitest';
import { checkProperty } from '../../../../test/property.js';
import { readDelimitedColumns } from '../../src/ingest/readDelimited.js';

const dir = mkdtempSync(join(tmpdir(), 'loopwise-agree-'));
let n = 0;

const numberText = fc.oneof(
  fc.integer({ min: -1e6, max: 1e6 }).map(String),
  fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }).map(String),
  fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e4, max: 1e4 }), fc.integer({ min: 0, max: 6 })).map(([x, d]) => x.toFixed(d)),
  fc.tuple(fc.integer({ min: -99999, max: 99999 }), fc.integer({ min: -30, max: 30 })).map(([m, e]) => `${m}e${e}`),
  fc.constantFrom('-0', '+1.5', '0.000', '123456789012345678901', '.5', '7.'),
);

const fileSpec = fc.record({
  delimiter: fc.constantFrom<'comma' | 'semicolon' | 'tab'>('comma', 'semicolon', 'tab'),
  decimalComma: fc.boolean(),
  header: fc.boolean(),
  bom: fc.boolean(),
  crlf: fc.boolean(),
  width: fc.integer({ min: 2, max: 4 }),
  rows: fc.array(fc.tuple(fc.array(numberText, { minLength: 4, maxLength: 4 }), fc.array(fc.boolean(), { minLength: 4, maxLength: 4 })), { minLength: 1, maxLength: 40 }),
  extras: fc.array(fc.tuple(fc.nat(), fc.constantFrom('# comment, with; delimiters', '', '#')), { maxLength: 4 }),
  chunkBytes: fc.integer({ min: 1, max: 200 }),
});

type Spec = typeof fileSpec extends fc.Arbitrary<infer T> ? T : never;

function build(spec: Spec): { text: string; dialect: { delimiter: Spec['delimiter']; decimalComma: boolean; header: boolean } } {
  const d = { comma: ',', semicolon: ';', tab: '\t' }[spec.delimiter];
  const comma = spec.decimalComma && spec.delimiter !== 'comma';
  const eol = spec.crlf ? '\r\n' : '\n';
  const lines: string[] = [];
  if (spec.header) lines.push(Array.from({ length: spec.width }, (_, k) => (k === 1 ? `"ch ${k}${d}x"` : `c${k}`)).join(d));
  for (const [cells, quote] of spec.rows)
    lines.push(
      cells
        .slice(0, spec.width)
        .map((c, k) => {
          const t = comma ? c.replace('.', ',') : c;
          return quote[k] ? `"${t}"` : t;
        })
        .join(d),
    );
  for (const [at, extra] of spec.extras) lines.splice(spec.header ? 1 + (at % lines.length) : at % (lines.length + 1), 0, extra);
  return { text: (spec.bom ? '\ufeff' : '') + lines.join(eol) + eol, dialect: { delimiter: spec.delimiter, decimalComma: comma, header: spec.header } };
}

function reference(text: string, dialect: { delimiter: string; decimalComma: boolean; header: boolean }, columns: number[]): number[][] {
  const records: string[][] = parse(text, {
    delimiter: { comma: ',', semicolon: ';', tab: '\t' }[dialect.delimiter],
    bom: true,
    comment: '#',
    comment_no_infix: true,
    skip_empty_lines: true,
    record_delimiter: ['\r\n', '\n'],
    from_line: 1,
  });
  const data = dialect.header ? records.slice(1) : records;
  return columns.map((c) => data.map((r) => Number(dialect.decimalComma ? r[c - 1].replace(',', '.') : r[c - 1])));
}

describe('readDelimited(path, options) against csv-parse + Number()', () => {
  it('agrees bit for bit on generated files with quoting, CRLF, BOM, comments, headers and decimal commas', async () => {
    // checkProperty (test/property.ts) runs synchronous properties only; the reader is async,
    // so this property runs through fc.assert with its own run count (the seed is the run's, from
    // test/setup.ts: pinned unless FC_SEED says otherwise).
    await fc.assert(
      fc.asyncProperty(fileSpec, async (spec) => {
        // Arrange
        const { text, dialect } = build(spec);
        const path = join(dir, `a${n++}.csv`);
        writeFileSync(path, text);
        const columns = Array.from({ length: spec.width }, (_, k) => k + 1);
        // Act
        const got = await readDelimitedColumns(path, {
          channels: columns.map((c) => ({ column: c, quantity: 'strain' as const, unit: 'strain' as const })),
          dialect,
          chunkBytes: spec.chunkBytes,
          checks: false,
        });
        // Assert
        const want = reference(text, dialect, columns);
        for (let k = 0; k < columns.length; k++) {
          const g = Array.from(got.channels[k]);
          if (g.length !== want[k].length) return false;
          for (let i = 0; i < g.length; i++) if (!Object.is(g[i], want[k][i])) return false;
        }
        return true;
      }),
      { numRuns: 300 },
    );
  });

  it('the generator quotes some fields, so the csv-parse path is exercised', () => {
    checkProperty(
      'quoted files are generated',
      fc.property(fc.array(fileSpec, { minLength: 30, maxLength: 30 }), (specs) => specs.some((s) => build(s).text.includes('"'))),
      { numRuns: 20 },
    );
  });
});
