// The push reader: any split of the bytes gives the same values and report as one push; the
// quoted-field reader's errors; no Node API in the package's sources (it must run in browsers).
import { readdirSync, readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkProperty } from '../../../test/property.js';
import { DelimitedReader, IngestError, type ReaderOptions } from '../src/index.js';

const encode = (text: string) => new TextEncoder().encode(text);

function read(bytes: Uint8Array, cuts: number[], options: Omit<ReaderOptions, 'onChunk'>) {
  const values: number[][] = options.channels.map(() => []);
  const reader = new DelimitedReader({ ...options, onChunk: (c) => c.channels.forEach((v, k) => values[k].push(...v)) });
  let at = 0;
  for (const cut of [...cuts].sort((a, b) => a - b)) {
    reader.push(bytes.subarray(at, Math.max(at, cut)));
    at = Math.max(at, cut);
  }
  reader.push(bytes.subarray(at));
  return { values, report: reader.finish() };
}

function failure(text: string, options: Omit<ReaderOptions, 'onChunk'>): IngestError {
  try {
    read(encode(text), [], options);
  } catch (e) {
    if (e instanceof IngestError) return e;
    throw e;
  }
  throw new Error('no error');
}

const two = { channels: [{ column: 1, quantity: 'strain' as const, unit: 'strain' as const }, { column: 2, quantity: 'stress' as const, unit: 'MPa' as const }], checks: false as const };

describe('DelimitedReader: bytes in any split', () => {
  it('gives the values and report of one push, for plain and quoted text', () => {
    const lines = ['a;b'];
    for (let i = 0; i < 300; i++) lines.push(i === 200 ? `"${i},5";-${i}` : `${i},25;${(i * 7) % 13}`);
    const bytes = encode('\ufeff' + lines.join('\r\n') + '\r\n');
    const whole = read(bytes, [], two);
    expect(whole.values[0].length).toBe(300);
    expect(whole.values[0][200]).toBe(200.5);
    expect(whole.report.reader).toBe('fast, then quoted from line 202');
    checkProperty(
      'split pushes equal one push',
      fc.property(fc.array(fc.integer({ min: 0, max: bytes.length }), { maxLength: 40 }), fc.integer({ min: 48, max: 4096 }), (cuts, detectionBytes) => {
        const got = read(bytes, cuts, { ...two, detectionBytes });
        return JSON.stringify(got.values) === JSON.stringify(whole.values) && got.report.samples === 300 && got.report.dialect.decimalComma;
      }),
      { numRuns: 200 },
    );
  });

  it('stops once stopAfterSamples are delivered and ignores later bytes', () => {
    const text = Array.from({ length: 1000 }, (_, i) => `${i},${i}`).join('\n');
    const reader = new DelimitedReader({ ...two, chunkSamples: 100, stopAfterSamples: 250, detectionBytes: 64 });
    reader.push(encode(text));
    expect(reader.stopped).toBe(true);
    expect(reader.finish().samples).toBe(300);
  });
});

describe('QuotedRecordReader errors through DelimitedReader', () => {
  it('names line and column of broken quoting', () => {
    expect(failure('a,b\n"1",2\n"3"x,4\n', two).message).toBe('<input>, line 3, column 1: text after a closing quote (a field in quotes must end at the delimiter or the line end)');
    expect(failure('a,b\n"1",2\n3,4"\n', two).message).toBe('<input>, line 3, column 2: a quote inside a field that does not start with one');
    expect(failure('a,b\n"1",2\n"3,4\n', two).message).toBe('<input>, line 3, column 1: a quoted field is not closed before the end of the file');
    expect(failure('a,b\n"1",2\n"x",4\n', two).message).toBe('<input>, line 3, column 1 ("a"): non-numeric cell "x"');
  });

  it('reads a quoted field holding the delimiter in an unselected column', () => {
    const got = read(encode('t,note,s\n0,"a, b",1.5\n1,"say ""hi""",2\n'), [], { channels: [{ column: 's', quantity: 'stress', unit: 'MPa' }], checks: false });
    expect(got.values[0]).toEqual([1.5, 2]);
    expect(got.report.reader).toBe('quoted');
  });
});

describe('the package runs without Node', () => {
  it('its sources import no node: module and use no Buffer or process', () => {
    const dir = new URL('../src/', import.meta.url);
    const offenders = readdirSync(dir)
      .filter((f) => f.endsWith('.ts'))
      .filter((f) => /from 'node:|require\(|\bBuffer\.|\bprocess\./.test(readFileSync(new URL(f, dir), 'utf8')));
    expect(offenders).toEqual([]);
  });
});

describe('DelimitedReader: signal warnings in the file\'s unit', () => {
  it('gives the offset warning of a microstrain and a ksi channel in µε and ksi, to 4 significant digits', () => {
    // a constant 700.125 µε with a 0.5 µε ripple, and 40.0 ksi with a 0.1 ksi ripple (invented)
    const rows = Array.from({ length: 400 }, (_, i) => `${(700.125 + (i % 2) * 0.5).toFixed(3)},${(40 + (i % 2) * 0.1).toFixed(1)}`);
    const { report } = read(encode('ue,ksi\n' + rows.join('\n') + '\n'), [], {
      channels: [{ column: 1, quantity: 'strain', unit: 'microstrain' }, { column: 2, quantity: 'stress', unit: 'ksi' }],
    });
    const messages = report.warnings.filter((w) => w.kind === 'large-offset').map((w) => w.message);
    expect(messages).toEqual(['ue: mean 700.4 µε is more than 0.5 × the range 0.5 µε: an offset not zeroed?', 'ksi: mean 40.05 ksi is more than 0.5 × the range 0.1 ksi: an offset not zeroed?']);
  });
});
