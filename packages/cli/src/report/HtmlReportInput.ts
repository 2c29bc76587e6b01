import type { CorrectionResult, LifeReport } from '@loopwise/engine';

/** A display copy of a history: sample indices and values, already thinned by the caller. */
export interface HtmlHistory {
  /** Sample index of each displayed point (ascending). */
  index: Float64Array;
  /** Value of each displayed point, in the channel's unit. */
  value: Float64Array;
}

/** A rainflow range-mean matrix for the heat map (rows: range bins, columns: mean bins). */
export interface HtmlMatrix {
  /** Row (range) bin edges, one more than the rows. */
  rowEdges: Float64Array;
  /** Column (mean) bin edges, one more than the columns. */
  columnEdges: Float64Array;
  /** Cycle counts, row-major (`counts[row * columns + column]`). */
  counts: Float64Array;
  /** Axis label of the rows with its unit, e.g. `'range (µε)'`. */
  rowLabel: string;
  /** Axis label of the columns with its unit, e.g. `'mean (µε)'`. */
  columnLabel: string;
}

/** One channel of the report: its assessment and what to draw of it. */
export interface HtmlChannel {
  /** Channel name (any text; it is escaped). */
  name: string;
  /** Unit label of the history, e.g. `'MPa'`, `'µε'`, `'kN'`. */
  unit: string;
  /** The assessment of the channel. */
  report: LifeReport;
  /**
   * A display copy of the history (at most a few thousand points, e.g. min/max per pixel bucket,
   * see `displayHistory`) with its sample indices; `null` leaves the history plot empty.
   */
  history: HtmlHistory | null;
  /** The rainflow range-mean matrix of the history; `null` leaves the matrix plot empty. */
  matrix: HtmlMatrix | null;
  /**
   * Loops per repeat (the sum of counts) and loop rows, when the loops were kept apart from the
   * report (`--cycles-out`); default: counted from `report.loops`.
   */
  loopTotals?: { cycles: number; rows: number } | null;
  /**
   * Warnings about the measured signal of this channel (spikes, flat runs, clipping, offset, the
   * time column), shown beside the assessment's warnings; default none.
   */
  signalWarnings?: readonly { kind: string; message: string }[];
  /**
   * The corrections applied to the signal before counting (spikes interpolated, ranges cut out,
   * offset subtracted, low-pass), in the order applied: kind and one line each; absent or empty:
   * the samples as measured (the report says so).
   */
  signalCorrections?: readonly { kind: string; summary: string }[];
  /**
   * The counted cycles of a stress-life report as equivalent stress on the curve and count per
   * repeat (for the S-N plot's spectrum); absent or null: the plot shows the curve and the worst cycles.
   */
  spectrum?: { stress: Float64Array; count: Float64Array } | null;
  /**
   * Every mean-stress correction side by side (`--mean-stress all`): one row each in the results
   * table, the report's own correction marked; absent or null: the report's correction only.
   */
  corrections?: readonly CorrectionResult[] | null;
  /** Time of sample i = start + i · step (s): the history plot's axis is then time; absent or null: sample index. */
  timeBase?: { start: number; step: number } | null;
  /** Where each event of a duty cycle starts (sample index): drawn as boundaries on the history plot. */
  eventStarts?: readonly { name: string; index: number }[];
  /**
   * The places cut out of the file, flat [first, length] in the file's sample numbers (see
   * report/cutNumbering.ts): the worst loops table then gives the file's sample numbers beside
   * those of the joined history. Absent or empty: no cut.
   */
  cutOut?: ArrayLike<number>;
}

/** Everything {@link renderHtmlReport} draws. */
export interface HtmlReportInput {
  /** Title of the report, e.g. `'Trailer axle, shoulder fillet (invented demo data)'`. */
  title: string;
  /** Program and version, e.g. `'loopwise 0.2.0'`. No dates: the output is deterministic. */
  generatedBy: string;
  /** One or more channels: one section each, and one row each in the results table. */
  channels: HtmlChannel[];
  /** Unit of local stress (the material's stress unit); default `'MPa'`. */
  stressUnit?: string;
}
