import { closeSync, openSync, readSync } from 'node:fs';
import { excerpt, surveyColumns, type ColumnSurvey, type Dialect, type DialectOverride, type TimeSource } from '@loopwise/ingest';
export { describeDialect } from '@loopwise/ingest';
import { UsageError } from './CliError';
import type { CliChannel } from './CliJob';

/** The options that fix parts of a file's layout instead of detecting them. */
export const LAYOUT_OPTIONS = {
  'skip-lines': { type: 'string' },
  delimiter: { type: 'string' },
  'decimal-mark': { type: 'string' },
  'header-row': { type: 'string' },
  'units-row': { type: 'string' },
  'comment-prefix': { type: 'string' },
} as const;

const DELIMITERS = ['comma', 'semicolon', 'tab', 'whitespace'] as const;

function yesNo(values: Record<string, unknown>, name: string): boolean | undefined {
  const v = values[name];
  if (v === undefined) return undefined;
  if (v === 'yes') return true;
  if (v === 'no') return false;
  throw new UsageError(`--${name}: yes or no, got "${String(v)}"`);
}

/** The dialect parts the layout options fix (undefined when none is given). */
export function dialectOf(values: Record<string, unknown>): DialectOverride | undefined {
  const out: DialectOverride = {};
  const skip = values['skip-lines'];
  if (skip !== undefined) {
    if (typeof skip !== 'string' || !/^\d+$/.test(skip)) throw new UsageError(`--skip-lines: a whole number of lines, got "${String(skip)}"`);
    out.skipLines = Number(skip);
  }
  const d = values.delimiter;
  if (d !== undefined) {
    if (!DELIMITERS.includes(d as (typeof DELIMITERS)[number])) throw new UsageError(`--delimiter: one of ${DELIMITERS.join(', ')}, got "${String(d)}"`);
    out.delimiter = d as (typeof DELIMITERS)[number];
  }
  const mark = values['decimal-mark'];
  if (mark !== undefined) {
    if (mark !== 'point' && mark !== 'comma') throw new UsageError(`--decimal-mark: point or comma, got "${String(mark)}"`);
    out.decimalComma = mark === 'comma';
  }
  const header = yesNo(values, 'header-row');
  if (header !== undefined) out.header = header;
  const units = yesNo(values, 'units-row');
  if (units !== undefined) out.unitsRow = units;
  const comment = values['comment-prefix'];
  if (comment !== undefined) {
    const c = comment === 'none' ? '' : String(comment);
    if (c.length > 1 || (c !== '' && c.charCodeAt(0) > 127)) throw new UsageError(`--comment-prefix: one ASCII character, or none, got "${String(comment)}"`);
    out.commentPrefix = c;
  }
  return Object.keys(out).length > 0 ? out : undefined;
}

/**
 * The column survey of a file's first 64 KiB, or null when they cannot be read or make no
 * table (a directory, an empty or binary file…): the reader then reports that problem itself,
 * with its file, line and column.
 */
export function surveyFile(path: string, dialect: DialectOverride | undefined, shown: string): { dialect: Dialect; columns: ColumnSurvey[] } | null {
  try {
    const fd = openSync(path, 'r');
    try {
      const head = Buffer.alloc(1 << 16);
      const n = readSync(fd, head, 0, head.length, 0);
      return n === 0 ? null : surveyColumns(head.subarray(0, n), dialect, shown);
    } finally {
      closeSync(fd);
    }
  } catch {
    return null;
  }
}

function label(c: ColumnSurvey): string {
  return `${c.column} ${excerpt(c.name)}${c.unit !== '' ? ` (${c.unit})` : ''}`;
}

function find(columns: readonly ColumnSurvey[], ref: string | number): ColumnSurvey | undefined {
  return typeof ref === 'number' ? columns[ref - 1] : columns.find((c) => c.name === ref);
}

/** What the command chose from the file itself, for the summary. */
export interface LayoutChoice {
  channels: CliChannel[];
  time: TimeSource | undefined;
  /** How the columns, units and time base were chosen (one line each). */
  notes: string[];
  /** Seconds per unit of the time column, when its units row says (`[ms]`: 0.001). */
  timeSecondsPerUnit?: number;
}

/**
 * The channels and time base of a command-line job, from the options and the file's first
 * lines. Without `--column`, the one numeric column that does not increase strictly and is not
 * named or measured as time is assessed; with more than one such column the user must choose
 * (the message lists them). A strictly increasing column is never assessed unless `--column`
 * names it; when its name or unit says time and no time base is given, it becomes the time base.
 * Without `--quantity` and `--unit`, a unit the file gives (units row or header name) is used; a
 * unit given against the file's is an error naming the column.
 */
export function chooseColumns(values: Record<string, unknown>, survey: { dialect: Dialect; columns: ColumnSurvey[] } | null, given: TimeSource | undefined, shown: string): LayoutChoice {
  const columns = survey?.columns ?? [];
  const notes: string[] = [];
  let time = given;
  const timeRef = time !== undefined && 'column' in time ? find(columns, time.column) : undefined;
  let refs: (string | number)[];
  const asked = values.column as string[] | undefined;
  if (asked !== undefined) refs = asked.map((c) => (/^\d+$/.test(c) ? Number(c) : c));
  else {
    const candidates = columns.filter((c) => c.numeric && !c.increasing && !c.timeLike && c !== timeRef);
    if (!columns.some((c) => c.numeric)) {
      // nothing numeric in the first lines: the reader names the problem (empty, header only, bad cell…)
      refs = [1];
    } else if (candidates.length === 0) {
      const numeric = columns.filter((c) => c.numeric);
      throw new UsageError(`--column: ${shown} has no column that could be the signal (its numeric columns increase strictly or are time: ${numeric.map(label).join(', ')}); name one with --column`);
    } else if (candidates.length > 1)
      throw new UsageError(`--column: ${shown} has ${candidates.length} columns that could be the signal: ${candidates.slice(0, 12).map(label).join(', ')}${candidates.length > 12 ? ', …' : ''}; choose with --column (repeat it for several)`);
    else {
      refs = [candidates[0].column];
      notes.push(`column ${label(candidates[0])} assessed: the only numeric column that is not a time base (give --column to choose another)`);
    }
  }
  const channels = refs.map((ref) => channelOf(values, ref, find(columns, ref), notes));
  for (const ref of refs) {
    const c = find(columns, ref);
    if (c?.increasing && asked !== undefined) notes.push(`column ${label(c)} increases strictly over the first lines (a time or a counter?); assessed because --column names it`);
  }
  if (time === undefined) {
    const chosen = new Set(refs.map((r) => find(columns, r)));
    const base = columns.find((c) => c.increasing && c.timeLike && !chosen.has(c));
    if (base) {
      time = { column: base.column };
      notes.push(`time base: column ${label(base)}, by its ${base.reading?.quantity === 'time' ? 'unit' : 'name'} (give --sample-rate or --time-column to change it)`);
    } else {
      const offer = columns.find((c) => c.increasing && !chosen.has(c));
      if (offer) notes.push(`column ${label(offer)} increases strictly: not assessed; --time-column ${offer.column} makes it the time base`);
    }
  }
  // the time column's unit from the units row (or a bracketed header unit), when it gives one
  const timeColumn = time !== undefined && 'column' in time ? find(columns, time.column) : undefined;
  const spu = timeColumn?.reading?.quantity === 'time' ? timeColumn.reading.secondsPerUnit : undefined;
  return { channels, time, notes, ...(spu !== undefined ? { timeSecondsPerUnit: spu } : {}) };
}

function channelOf(values: Record<string, unknown>, ref: string | number, survey: ColumnSurvey | undefined, notes: string[]): CliChannel {
  const quantity = values.quantity as string | undefined;
  const unit = values.unit as string | undefined;
  const reading = survey?.reading ?? null;
  const where = survey ? `column ${label(survey)}` : `column ${String(ref)}`;
  if (quantity === undefined && unit === undefined && values['mpa-per-unit'] === undefined) {
    if (reading?.quantity === 'strain' || reading?.quantity === 'stress') {
      notes.push(`${where}: ${reading.quantity} in ${reading.unit}, from the file's ${survey?.unit === '' ? '' : 'unit '}${JSON.stringify(survey?.unit)}`);
      return { column: ref, ...(reading.quantity === 'strain' ? { quantity: 'strain', unit: reading.unit } : { quantity: 'stress', unit: reading.unit }) } as CliChannel;
    }
    if (reading?.quantity === 'load') throw new UsageError(`--mpa-per-unit: ${where} is a load in ${reading.unit}; give its nominal stress in MPa per ${reading.unit} (and --quantity load)`);
    if (reading?.quantity === 'time') throw new UsageError(`--column: ${where} is a time (unit ${reading.unit}); choose the signal's column`);
    notes.push(`${where}: no unit in the file or the options; read as stress in MPa (give --quantity and --unit)`);
    return { column: ref, quantity: 'stress', unit: 'MPa' };
  }
  const q = quantity ?? (reading?.quantity === 'strain' || reading?.quantity === 'stress' ? reading.quantity : values['mpa-per-unit'] !== undefined ? 'load' : 'stress');
  if (q === 'stress' || q === 'strain') {
    const u = unit ?? (reading?.quantity === q ? reading.unit : q === 'stress' ? 'MPa' : 'strain');
    const allowed = q === 'stress' ? ['MPa', 'ksi'] : ['strain', 'microstrain'];
    if (!allowed.includes(u)) throw new UsageError(`--unit: ${q} is in ${allowed.join(' or ')}, got "${u}"`);
    if (reading !== null && (reading.quantity !== q || reading.unit !== u) && reading.quantity !== 'time')
      throw new UsageError(
        `--${unit !== undefined ? 'unit' : 'quantity'}: ${where} is in ${survey?.unit} by the file (${reading.quantity}${reading.quantity === 'strain' || reading.quantity === 'stress' ? ` in ${reading.unit}` : ''}), not ${q} in ${u}; fix the option, or give --units-row no when that row is not units`,
      );
    if (unit === undefined && reading?.quantity === q) notes.push(`${where}: unit ${u} from the file`);
    return { column: ref, quantity: q, unit: u } as CliChannel;
  }
  if (q === 'load') {
    const f = Number(values['mpa-per-unit']);
    if (values['mpa-per-unit'] === undefined) throw new UsageError('--mpa-per-unit: a load channel needs its nominal stress in MPa per unit of load');
    if (typeof values['mpa-per-unit'] !== 'string' || !Number.isFinite(f)) throw new UsageError(`--mpa-per-unit: expected a number, got "${String(values['mpa-per-unit'])}"`);
    if (unit !== undefined) throw new UsageError('--unit: a load channel has no unit option; its factor is --mpa-per-unit');
    return { column: ref, quantity: 'load', mpaPerUnit: f };
  }
  throw new UsageError(`--quantity: stress, strain or load, got "${q}"`);
}
