// Logger layouts: a preamble of lines to skip, a units row under the header, units in header
// names, and the column survey that the command and the page use to pick channels and the time
// base. The files are invented examples of common logger layouts (demo data, no source).
import { describe, expect, it } from 'vitest';
import { DelimitedReader, IngestError, IngestOptionError, detectDialect, recognizeUnit, surveyColumns } from '../src/index.js';

const encode = (text: string) => new TextEncoder().encode(text);

const tabLogger = ['Logger export', 'Serial 4711; rate 500 Hz', '', 'Zeit\tSG1\tSG2', 's\tµε\tµε', '0,000\t12,5\t-3', '0,002\t14\t-2,5', '0,004\t11,5\t-4', '0,006\t13\t-3,5'].join('\r\n') + '\r\n';

describe('detectDialect with a preamble and a units row', () => {
  it('skips the given lines, finds the header and the units row below it', () => {
    const d = detectDialect(encode(tabLogger), { skipLines: 3 });
    expect(d.delimiter).toBe('tab');
    expect(d.decimalComma).toBe(true);
    expect(d.header).toBe(true);
    expect(d.headerLine).toBe(4);
    expect(d.unitsLine).toBe(5);
    expect(d.names).toEqual(['Zeit', 'SG1', 'SG2']);
    expect(d.units).toEqual(['s', 'µε', 'µε']);
    expect(d.unitsSource).toBe('row');
    expect(d.source.unitsRow).toBe('detected');
  });

  it('reads units from bracketed header names when there is no units row', () => {
    const d = detectDialect(encode('time (s),F [kN],SG1\n0,1,2\n0.1,2,3\n0.2,1,2\n'));
    expect(d.unitsLine).toBe(0);
    expect(d.units).toEqual(['s', 'kN', '']);
    expect(d.unitsSource).toBe('names');
  });

  it('takes the units row from the option, and refuses one without a header', () => {
    expect(detectDialect(encode('a,b\nx,y\n1,2\n'), { unitsRow: false }).unitsLine).toBe(0);
    expect(() => detectDialect(encode('1,2\n3,4\n'), { header: false, unitsRow: true })).toThrow(IngestOptionError);
    expect(() => detectDialect(encode('1,2\n'), { skipLines: -1 })).toThrow(IngestOptionError);
  });
});

describe('DelimitedReader over a logger layout', () => {
  it('reads the values below the units row, in any split, with errors on the right line', () => {
    const channels = [{ column: 'SG1', quantity: 'strain' as const, unit: 'microstrain' as const }];
    const whole: number[] = [];
    const r = new DelimitedReader({ channels, dialect: { skipLines: 3 }, checks: false, onChunk: (c) => whole.push(...c.channels[0]) });
    const bytes = encode(tabLogger);
    for (let i = 0; i < bytes.length; i += 7) r.push(bytes.subarray(i, i + 7));
    const report = r.finish();
    expect(whole).toEqual([12.5 / 1e6, 14 / 1e6, 11.5 / 1e6, 13 / 1e6]);
    expect(report.samples).toBe(4);
    const bad = encode(tabLogger.replace('14\t', 'x\t'));
    const r2 = new DelimitedReader({ channels, dialect: { skipLines: 3 }, checks: false });
    let caught: unknown;
    try {
      r2.push(bad);
      r2.finish();
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(IngestError);
    expect((caught as IngestError).message).toBe('<input>, line 7, column 2 ("SG1"): non-numeric cell "x"');
  });
});

describe('surveyColumns', () => {
  it('names each column, its unit, and which columns increase strictly', () => {
    const { columns } = surveyColumns(encode(tabLogger), { skipLines: 3 });
    expect(columns.map((c) => [c.column, c.name, c.unit, c.reading?.quantity ?? null, c.numeric, c.increasing, c.timeLike])).toEqual([
      [1, 'Zeit', 's', 'time', true, true, true],
      [2, 'SG1', 'µε', 'strain', true, false, false],
      [3, 'SG2', 'µε', 'strain', true, false, false],
    ]);
  });

  it('finds a sample counter without a unit as increasing but not time-like', () => {
    const { columns } = surveyColumns(encode('idx,load\n1,5\n2,7\n3,5\n4,6\n'));
    expect(columns[0].increasing).toBe(true);
    expect(columns[0].timeLike).toBe(false);
    expect(columns[1].increasing).toBe(false);
  });
});

describe('recognizeUnit', () => {
  it('reads the usual logger spellings', () => {
    expect(recognizeUnit('ue')).toEqual({ quantity: 'strain', unit: 'microstrain' });
    expect(recognizeUnit('[um/m]')).toEqual({ quantity: 'strain', unit: 'microstrain' });
    expect(recognizeUnit('N/mm²')).toEqual({ quantity: 'stress', unit: 'MPa' });
    expect(recognizeUnit('KSI')).toEqual({ quantity: 'stress', unit: 'ksi' });
    expect(recognizeUnit('kN')).toEqual({ quantity: 'load', unit: 'kN' });
    expect(recognizeUnit('ms')).toEqual({ quantity: 'time', unit: 'ms', secondsPerUnit: 1e-3 });
    expect(recognizeUnit('furlongs')).toBeNull();
    expect(recognizeUnit('')).toBeNull();
  });
});
