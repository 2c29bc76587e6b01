import { detectDialect, splitFields, type Dialect, type DialectOverride } from './detectDialect.js';
import { parseDecimalText } from './parseDecimal.js';
import { utf8Decoder } from './textDecoding.js';

/** What a unit written in a file stands for. */
export type UnitReading =
  | { readonly quantity: 'strain'; readonly unit: 'strain' | 'microstrain' }
  | { readonly quantity: 'stress'; readonly unit: 'MPa' | 'ksi' }
  /** A force, moment, pressure or voltage: a load channel, which needs a factor to nominal stress. */
  | { readonly quantity: 'load'; readonly unit: string }
  /** A time column's unit and the seconds in one of it. */
  | { readonly quantity: 'time'; readonly unit: string; readonly secondsPerUnit: number };

const MICROSTRAIN = ['µε', 'με', 'µe', 'ue', 'uε', 'um/m', 'µm/m', 'μm/m', 'microstrain', 'ustrain', 'µstrain', 'μstrain', 'micro-strain'];
const STRAIN = ['strain', 'm/m', 'mm/mm', 'in/in', 'ε'];
const MPA = ['mpa', 'n/mm²', 'n/mm2', 'n/mm^2'];
const LOAD = ['n', 'kn', 'mn', 'lbf', 'kip', 'nm', 'n·m', 'n.m', 'knm', 'kn·m', 'v', 'mv', 'bar', 'kpa', 'pa', 'psi', 'gpa', 'g'];
const TIME: Record<string, number> = { s: 1, sec: 1, ms: 1e-3, 'µs': 1e-6, us: 1e-6, min: 60, h: 3600 };

/**
 * Reads a unit as a logger writes it (case is ignored except that `µ` and `μ` both mean micro):
 * microstrain (`µε`, `ue`, `um/m`, `microstrain`…), strain (`m/m`, `mm/mm`), stress (`MPa`,
 * `N/mm²`, `ksi`), loads and signals (`N`, `kN`, `lbf`, `Nm`, `V`, `mV`, `bar`, `kPa`, `psi`…),
 * time (`s`, `ms`, `min`, `h`). Returns null for anything else (an empty unit included).
 *
 * @example
 * recognizeUnit('[µε]'); // returns { quantity: 'strain', unit: 'microstrain' }
 */
export function recognizeUnit(text: string): UnitReading | null {
  const t = text.trim().replace(/^[[(](.*)[\])]$/, '$1').trim();
  const lower = t.toLowerCase();
  if (lower === '') return null;
  if (MICROSTRAIN.includes(lower)) return { quantity: 'strain', unit: 'microstrain' };
  if (STRAIN.includes(lower)) return { quantity: 'strain', unit: 'strain' };
  if (MPA.includes(lower)) return { quantity: 'stress', unit: 'MPa' };
  if (lower === 'ksi') return { quantity: 'stress', unit: 'ksi' };
  if (LOAD.includes(lower)) return { quantity: 'load', unit: t };
  if (lower in TIME) return { quantity: 'time', unit: t, secondsPerUnit: TIME[lower] };
  return null;
}

/** One column of a file as its first lines show it. */
export interface ColumnSurvey {
  /** 1-based field number. */
  readonly column: number;
  readonly name: string;
  /** The unit as written ('' when the file gives none) and what it stands for (null when unknown). */
  readonly unit: string;
  readonly reading: UnitReading | null;
  /** Every sampled data line has a number in this column. */
  readonly numeric: boolean;
  /** The sampled values (at least 3) increase strictly: a time or a sample counter, not a signal. */
  readonly increasing: boolean;
  /** The name or the unit says time (`t`, `time`, `zeit`, `temps`, `tiempo`…; `s`, `ms`…). */
  readonly timeLike: boolean;
}

/** Data lines looked at. */
const SURVEY_LINES = 50;
const TIME_NAMES = /^(t|time|zeit|temps|tiempo|tempo|tid|czas|timestamp)([\s_[(.-]|$)/i;

/**
 * The dialect of the first bytes of a file and, per column, its name, unit, whether it holds
 * numbers and whether it increases strictly over the first data lines: what a person (or the
 * command) needs to pick the channels and the time base before the file is read.
 *
 * @param sample - the first bytes of the file (cut after a line end)
 * @param override - dialect parts fixed by the caller
 * @param file - the file name for errors
 *
 * @example
 * const { columns } = surveyColumns(new TextEncoder().encode('t [s];SG1 [µε]\n0;5\n0,01;7\n0,02;3\n'));
 * columns.map((c) => [c.name, c.increasing, c.reading?.quantity]);
 * // returns [['t [s]', true, 'time'], ['SG1 [µε]', false, 'strain']]
 */
export function surveyColumns(sample: Uint8Array, override: DialectOverride = {}, file = '<input>'): { dialect: Dialect; columns: ColumnSurvey[] } {
  const dialect = detectDialect(sample, override, file);
  const text = UTF8.decode(sample).replace(/^\ufeff/, '');
  const data: string[][] = [];
  let lineNo = 0;
  for (const raw of text.split('\n')) {
    lineNo++;
    if (data.length >= SURVEY_LINES) break;
    if (lineNo <= dialect.skipLines || lineNo === dialect.headerLine || lineNo === dialect.unitsLine) continue;
    const t = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (t.trim() === '' || (dialect.commentPrefix !== '' && t.startsWith(dialect.commentPrefix))) continue;
    if (dialect.header && lineNo < dialect.headerLine) continue;
    data.push(splitFields(t, dialect.delimiter));
  }
  const columns = dialect.names.map((name, k): ColumnSurvey => {
    const values = data.map((f) => parseDecimalText(f[k] ?? '', dialect.decimalComma));
    const numeric = values.length > 0 && values.every((v) => Number.isFinite(v));
    let increasing = numeric && values.length >= 3;
    for (let i = 1; increasing && i < values.length; i++) if (!(values[i] > values[i - 1])) increasing = false;
    const unit = dialect.units[k] ?? '';
    const reading = recognizeUnit(unit);
    const timeLike = reading?.quantity === 'time' || (dialect.header && TIME_NAMES.test(name));
    return { column: k + 1, name, unit, reading, numeric, increasing, timeLike };
  });
  return { dialect, columns };
}

const UTF8 = utf8Decoder(false);
