import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { IngestError, MPA_PER_KSI } from '@loopwise/ingest';
import { readDelimited, readDelimitedColumns, type IngestOptions } from '../../src/ingest/readDelimited.js';

const dir = mkdtempSync(join(tmpdir(), 'loopwise-ingest-'));
let fileNo = 0;
function file(content: string | Buffer, name?: string): string {
  const p = join(dir, name ?? `f${fileNo++}.csv`);
  writeFileSync(p, content);
  return p;
}
const plain = (column: string | number = 2) => ({ channels: [{ column, quantity: 'stress' as const, unit: 'MPa' as const }] });
async function values(path: string, options: Omit<IngestOptions, 'onChunk'> = plain()) {
  const r = await readDelimitedColumns(path, options);
  return { ...r, x: Array.from(r.channels[0]) };
}
async function failure(path: string, options: Omit<IngestOptions, 'onChunk'> = plain()): Promise<IngestError> {
  try {
    await readDelimitedColumns(path, options);
  } catch (e) {
    expect(e).toBeInstanceOf(IngestError);
    return e as IngestError;
  }
  throw new Error('expected an IngestError');
}

describe('readDelimited(path, options): dialects', () => {
  it('reads comma-delimited text with a header, by name and by 1-based index', async () => {
    const p = file('time,stress\n0,1.5\n0.01,-2.25\n0.02,3e1\n');
    expect((await values(p, plain('stress'))).x).toEqual([1.5, -2.25, 30]);
    const r = await values(p, plain(2));
    expect(r.x).toEqual([1.5, -2.25, 30]);
    expect(r.report.dialect).toMatchObject({ delimiter: 'comma', header: true, decimalComma: false, names: ['time', 'stress'], fieldCount: 2 });
    expect(r.report.reader).toBe('fast');
  });

  it('detects semicolon with decimal commas, tab with decimal commas, and whitespace', async () => {
    expect((await values(file('t;s\n0;1,5\n0,1;-2,5\n'))).report.dialect).toMatchObject({ delimiter: 'semicolon', decimalComma: true });
    expect((await values(file('t;s\n0;1,5\n0,1;-2,5\n'))).x).toEqual([1.5, -2.5]);
    expect((await values(file('t\ts\n0\t1,5\n1\t-2,5\n'))).x).toEqual([1.5, -2.5]);
    const ws = await values(file('  t   s\n  0   1.5\n 1\t\t-2.5  \n'));
    expect(ws.report.dialect.delimiter).toBe('whitespace');
    expect(ws.x).toEqual([1.5, -2.5]);
  });

  it('reads files without a header (detected) and says so', async () => {
    const r = await values(file('0,1\n1,2\n2,3\n'));
    expect(r.report.dialect.header).toBe(false);
    expect(r.x).toEqual([1, 2, 3]);
    expect(r.report.dialect.names).toEqual(['column 1', 'column 2']);
  });

  it('skips a BOM, CRLF line ends, blank and comment lines, and a last line without line feed', async () => {
    const r = await values(file('\ufeff# logger 7, channel 2\r\n\r\ntime,stress\r\n# a comment\r\n0,1\r\n\r\n1,2\r\n2,3'));
    expect(r.x).toEqual([1, 2, 3]);
    expect(r.report.dialect).toMatchObject({ bom: true, lineEnd: 'CRLF', header: true });
  });

  it('hands quoted fields to the quoted-field reader and reports where it switched', async () => {
    const quotedFromStart = await values(file('"time","stress"\n"0","1.5"\n1,"2"\n'));
    expect(quotedFromStart.x).toEqual([1.5, 2]);
    expect(quotedFromStart.report.reader).toBe('quoted');
    const lines = ['t,s'];
    for (let i = 0; i < 3000; i++) lines.push(`${i},${i / 4}`);
    lines.push('3000,"750"');
    const late = await values(file(lines.join('\n') + '\n'), { ...plain(), detectionBytes: 256 });
    expect(late.report.reader).toBe('fast, then quoted from line 3002');
    expect(late.x.length).toBe(3001);
    expect(late.x[3000]).toBe(750);
    const semicolon = await values(file('t;s\n0;"1,5"\n1;2,5\n'));
    expect(semicolon.x).toEqual([1.5, 2.5]);
  });

  it('takes dialect overrides and reports them as options', async () => {
    const r = await values(file('1;2\n3;4\n'), { ...plain(1), dialect: { delimiter: 'semicolon', header: false } });
    expect(r.x).toEqual([1, 3]);
    expect(r.report.dialect.source).toEqual({ delimiter: 'option', decimalComma: 'detected', header: 'option', unitsRow: 'detected' });
    expect((await values(file('% x\n1,2\n'), { ...plain(2), dialect: { commentPrefix: '%' } })).x).toEqual([2]);
  });

  it('reads with reader: "csv-parse" the same numbers as the fast reader', async () => {
    const p = file('t,s\n0,0.1\n1,-0\n2,1e-5\n');
    const fast = await values(p);
    const slow = await values(p, { ...plain(), reader: 'csv-parse' });
    expect(slow.report.reader).toBe('csv-parse');
    expect(slow.x).toEqual(fast.x);
    expect(Object.is(slow.x[1], -0)).toBe(true);
  });
});

describe('readDelimited(path, options): units and time', () => {
  it('converts ksi to MPa (NIST SP 811), microstrain to strain and load by its factor, and states it', async () => {
    const p = file('t,a,b,c\n0,1,1000,2\n1,-2,-250,4\n');
    const r = await readDelimitedColumns(p, {
      channels: [
        { column: 'a', quantity: 'stress', unit: 'ksi' },
        { column: 'b', quantity: 'strain', unit: 'microstrain' },
        { column: 'c', quantity: 'load', mpaPerUnit: 0.5 },
      ],
    });
    expect(Array.from(r.channels[0])).toEqual([MPA_PER_KSI, -2 * MPA_PER_KSI]);
    expect(Array.from(r.channels[1])).toEqual([1000 / 1e6, -250 / 1e6]);
    expect(Array.from(r.channels[2])).toEqual([1, 2]);
    expect(r.report.channels.map((c) => c.conversion.engineUnit)).toEqual(['MPa', 'strain', 'MPa']);
    expect(r.report.channels[0].conversion.statement).toContain('NIST SP 811');
  });

  it('returns time-column statistics and warns where time does not increase', async () => {
    const r = await readDelimitedColumns(file('t,s\n0,1\n0.5,2\n1.0,3\n1.0,4\n0.9,5\n2,6\n'), { ...plain(), time: { column: 't' } });
    expect(r.report.time).toMatchObject({ kind: 'column', column: 1, samples: 6, first: 0, last: 2, nonIncreasingSteps: 2 });
    expect(Array.from(r.time!)).toEqual([0, 0.5, 1, 1, 0.9, 2]);
    const w = r.report.warnings.find((x) => x.kind === 'time-not-increasing')!;
    expect(w.ranges).toEqual([
      { first: 2, last: 3 },
      { first: 3, last: 4 },
    ]);
  });

  it('returns the time step of a sample rate', async () => {
    const r = await readDelimited(file('1\n2\n'), { ...plain(1), time: { sampleRate: 500 } });
    expect(r.time).toEqual({ kind: 'sample-rate', sampleRate: 500, timeStep: 0.002 });
  });
});

describe('readDelimited(path, options): streaming', () => {
  const lines = ['time,stress'];
  for (let i = 0; i < 700; i++) lines.push(`${(i / 500).toFixed(4)},${(Math.sin(i) * 100).toFixed(3)}`);
  const text = lines.join('\r\n') + '\r\n';
  const p = file(text);
  const expected = lines.slice(1).map((l) => Number(l.split(',')[1]));

  for (const chunkBytes of [1, 2, 3, 7, 64, 1000, 1 << 20])
    it(`gives the same numbers for chunkBytes = ${chunkBytes}`, async () => {
      expect((await values(p, { ...plain(), chunkBytes })).x).toEqual(expected);
    });

  it('delivers chunks of chunkSamples with their first sample index', async () => {
    const seen: [number, number][] = [];
    await readDelimited(p, { ...plain(), chunkSamples: 256, onChunk: (c) => seen.push([c.firstSample, c.length]) });
    expect(seen).toEqual([
      [0, 256],
      [256, 256],
      [512, 188],
    ]);
  });
});

describe('readDelimited(path, options): bad input names file, line and column', () => {
  it('a non-numeric cell', async () => {
    const p = file('t,s\n0,1\n1,abc\n');
    const e = await failure(p);
    expect(e.code).toBe('LW_INGEST_NON_NUMERIC');
    expect([e.file, e.line, e.column]).toEqual([p, 3, 2]);
    expect(e.message).toBe(`${p}, line 3, column 2 ("s"): non-numeric cell "abc"`);
  });

  it('NaN and Infinity text, and an overflowing number', async () => {
    for (const bad of ['NaN', '-Infinity', 'inf']) {
      const p = file(`t,s\n0,1\n1,${bad}\n`);
      const e = await failure(p);
      expect(e.code).toBe('LW_INGEST_NON_FINITE');
      expect(e.message).toBe(`${p}, line 3, column 2 ("s"): "${bad}" is not a finite number (NaN and Infinity are not samples)`);
    }
    const p = file('t,s\n0,1e400\n');
    const e = await failure(p);
    expect(e.code).toBe('LW_INGEST_OVERFLOW');
    expect(e.message).toBe(`${p}, line 2, column 2 ("s"): overflow: the number "1e400" (5 characters) lies beyond a double's range (|value| > 1.8e308)`);
  });

  it('an empty cell', async () => {
    const p = file('t,s\n0,1\n1,\n');
    const e = await failure(p);
    expect(e.code).toBe('LW_INGEST_EMPTY_CELL');
    expect(e.message).toBe(`${p}, line 3, column 2 ("s"): empty cell where a number is expected`);
  });

  it('a ragged row (too few and too many fields)', async () => {
    let p = file('t,s\n0,1\n1\n');
    let e = await failure(p);
    expect(e.code).toBe('LW_INGEST_RAGGED_ROW');
    expect(e.message).toBe(`${p}, line 3, column 2: ragged row: 1 field where 2 are expected`);
    p = file('t,s\n0,1\n1,2,3\n');
    e = await failure(p);
    expect(e.message).toBe(`${p}, line 3, column 3: ragged row: 3 fields where 2 are expected`);
  });

  it('the wrong delimiter (one column where several are selected)', async () => {
    const p = file('t;s\n0;1\n');
    const e = await failure(p, { ...plain(2), time: { column: 1 }, dialect: { delimiter: 'comma' } });
    expect(e.code).toBe('LW_INGEST_WRONG_DELIMITER');
    expect(e.message).toBe(
      `${p}, line 1, column 1: wrong delimiter: one column found with comma (",") where several are selected; the line reads "t;s" (other delimiters: ";", "\\t", whitespace)`,
    );
    const q = file('0|1\n1|2\n');
    const f = await failure(q, { channels: [{ column: 1, quantity: 'stress', unit: 'MPa' }], time: { column: 2 } });
    expect(f.code).toBe('LW_INGEST_WRONG_DELIMITER');
    expect([f.line, f.column]).toEqual([1, 1]);
  });

  it('binary garbage: NUL bytes and invalid UTF-8', async () => {
    let p = file(Buffer.from('t,s\n0,1\n1,\u0000\u0001\n', 'latin1'));
    let e = await failure(p);
    expect(e.code).toBe('LW_INGEST_BINARY_DATA');
    expect(e.message).toBe(`${p}, line 3, column 2: binary data: byte 0x00 is not text (is this a delimited text file?)`);
    p = file(Buffer.concat([Buffer.from('t,s\n0,1\n1,'), Buffer.from([0xff, 0xfe]), Buffer.from('\n')]));
    e = await failure(p);
    expect(e.code).toBe('LW_INGEST_INVALID_UTF8');
    expect(e.message).toBe(`${p}, line 3, column 2: invalid UTF-8 text at byte 0xff (binary data, or a file in another encoding)`);
    // past the detection sample, the fast reader finds them itself
    const head = 't,s\n' + '0,1\n'.repeat(100);
    p = file(Buffer.concat([Buffer.from(head), Buffer.from('1,'), Buffer.from([0xc3, 0x28]), Buffer.from('\n')]));
    e = await failure(p, { ...plain(), detectionBytes: 64 });
    expect(e.message).toBe(`${p}, line 102, column 2 ("s"): invalid UTF-8 text (binary data, or a file in another encoding)`);
    p = file(Buffer.from(head + '1,2\u0000\n', 'latin1'));
    e = await failure(p, { ...plain(), detectionBytes: 64 });
    expect(e.message).toBe(`${p}, line 102, column 2 ("s"): binary data: byte 0x00 is not text`);
  });

  it('an unknown column name lists the available ones; an index beyond the columns says 1-based', async () => {
    const p = file('time,stress\n0,1\n');
    let e = await failure(p, plain('strain'));
    expect(e.code).toBe('LW_INGEST_UNKNOWN_COLUMN');
    expect(e.message).toBe(`${p}, line 1: unknown column "strain"; the columns are 1 "time", 2 "stress"`);
    e = await failure(p, plain(3));
    expect(e.message).toBe(`${p}, line 1: there is no column 3 (1-based): the file has 2 columns: 1 "time", 2 "stress"`);
  });

  it('a header only, an empty file, a comment-only file', async () => {
    let p = file('time,stress\r\n');
    let e = await failure(p);
    expect(e.code).toBe('LW_INGEST_HEADER_ONLY');
    expect(e.message).toBe(`${p}, line 1: header only: the file has column names but no data rows`);
    p = file('');
    e = await failure(p);
    expect(e.code).toBe('LW_INGEST_EMPTY_FILE');
    expect(e.message).toBe(`${p}: empty file: no data lines (only blank or comment lines, if any)`);
    p = file('\ufeff# nothing\n\n');
    expect((await failure(p)).code).toBe('LW_INGEST_EMPTY_FILE');
  });

  it('a missing file and a directory', async () => {
    const missing = join(dir, 'no-such.csv');
    let e = await failure(missing);
    expect(e.code).toBe('LW_INGEST_MISSING_FILE');
    expect(e.message).toBe(`${missing}: no such file`);
    const d = join(dir, 'a-directory');
    mkdirSync(d);
    e = await failure(d);
    expect(e.code).toBe('LW_INGEST_IS_DIRECTORY');
    expect(e.message).toBe(`${d}: is a directory, not a data file`);
  });

  it('a decimal comma where the dialect says point gets a hint', async () => {
    const p = file('t,s\n0,1\n');
    const q = file('t s\n0 1\n1 2,5\n');
    const e = await failure(q);
    expect(e.message).toBe(`${q}, line 3, column 2 ("s"): non-numeric cell "2,5" (a decimal comma? the dialect says the decimal point is ".")`);
    expect(p).toBeTruthy();
  });

  it('errors in the quoted-field path name line and column too', async () => {
    const p = file('"t","s"\n"0","1"\n"1","x"\n');
    const e = await failure(p);
    expect(e.message).toBe(`${p}, line 3, column 2 ("s"): non-numeric cell "x"`);
    const q = file('"t","s"\n"0","1"\n"1"\n');
    expect((await failure(q)).message).toBe(`${q}, line 3, column 2: ragged row: 1 field where 2 are expected`);
  });
});
