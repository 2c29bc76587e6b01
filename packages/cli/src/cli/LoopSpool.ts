import type { LifeLoopColumns, RowRange } from '@loopwise/engine';
import { cyclesCsvRow } from './cyclesCsvRow';
import type { OutputSink } from './OutputSet';
import { utf8Length, type SpoolStore } from './SpoolStore';

/** A sink that begins every line with `prefix`. */
function prefixed(sink: OutputSink, prefix: string): OutputSink {
  if (prefix === '') return sink;
  let atStart = true;
  return {
    write: (text: string) => {
      const out = (atStart ? prefix : '') + text.replace(/\n(?=.)/gs, `\n${prefix}`);
      atStart = text.endsWith('\n');
      return sink.write(out);
    },
  };
}

/** Rows between two noted byte offsets of the spool (memory: 8 bytes per this many loops). */
const CHECKPOINT = 256;

/** A sink that passes on only the lines `[from, to)`, counting lines from row `first`. */
function rowsOf(sink: OutputSink, first: number, from: number, to: number): OutputSink {
  let row = first;
  let carry = '';
  return {
    write: async (text: string) => {
      const lines = (carry + text).split('\n');
      carry = lines.pop() as string;
      const keep: string[] = [];
      for (const line of lines) {
        if (row >= from && row < to) keep.push(line + '\n');
        row++;
      }
      if (keep.length > 0) await sink.write(keep.join(''));
    },
  };
}

/** The event field of the one streamed history. */
const EVENTS = ['history'];

/**
 * The loops of one channel for `--cycles-out`, written to a spool as they close (on disk for the
 * command, a {@link SpoolFile}, so the loop table never sits in memory, issue 16; in memory for
 * the browser page, a {@link MemorySpool}: the same rows, byte for byte). The engine's `LifeSession` evaluates the loops and
 * hands them to {@link LoopSpool.sink} (its `onLoops` option): every row of both passes goes to
 * the spool with the byte offset of every CHECKPOINT-th row noted. At the end the session says
 * which rows make its report's loop table (`reportedLoopRows`: the stabilised pass, or a one-off
 * history's first pass and its residue half cycles), and only those are copied into the output.
 */
export class LoopSpool {
  /** @param spool - where the rows are kept */
  constructor(private readonly spool: SpoolStore) {}

  /** Byte offset in the spool of every CHECKPOINT-th row (row k·CHECKPOINT at index k). */
  private offsets = new Float64Array(1024);
  private rows = 0;
  private bytes = 0;
  private ranges: RowRange[] = [];

  /** The session's `onLoops`: appends evaluated rows (numbered from `firstRow`) to the spool. */
  readonly sink = (cols: LifeLoopColumns, firstRow: number): void => {
    if (firstRow !== this.rows) throw new Error(`internal: loop rows out of order (row ${firstRow}, expected ${this.rows})`);
    const n = cols.count.length;
    const need = Math.floor((this.rows + n) / CHECKPOINT) + 2;
    if (need > this.offsets.length) {
      const bigger = new Float64Array(Math.max(2 * this.offsets.length, need));
      bigger.set(this.offsets);
      this.offsets = bigger;
    }
    for (let i = 0; i < n; i++) {
      const line = cyclesCsvRow(cols, i, EVENTS) + '\n';
      if (this.rows % CHECKPOINT === 0) this.offsets[this.rows / CHECKPOINT] = this.bytes;
      this.rows++;
      this.bytes += utf8Length(line);
      this.spool.append(line);
    }
  };

  /** Ends the writing: `ranges` are the rows of the output, in order (the session's `reportedLoopRows`). */
  finish(ranges: RowRange[]): this {
    for (const r of ranges) {
      if (!(r.from >= 0 && r.from <= r.to && r.to <= this.rows)) throw new Error(`internal: rows ${r.from}–${r.to} of ${this.rows} spooled`);
    }
    this.ranges = ranges;
    this.spool.close();
    return this;
  }

  /**
   * Copies the rows of the output into `sink`, each line begun with `prefix` (the channel's
   * CSV field and its comma; the spool holds the rows without it).
   */
  async copyTo(sink: OutputSink, prefix = ''): Promise<void> {
    const lines = prefixed(sink, prefix);
    for (const { from, to } of this.ranges) await this.copyRows(lines, from, to);
  }

  /** Copies spooled rows `[from, to)`: from the checkpoint at or before `from` to the one at or after `to`, lines filtered. */
  private async copyRows(sink: OutputSink, from: number, to: number): Promise<void> {
    if (to <= from) return;
    const a = Math.floor(from / CHECKPOINT);
    const b = Math.ceil(to / CHECKPOINT);
    const end = b * CHECKPOINT >= this.rows ? this.bytes : this.offsets[b];
    await this.spool.copyRangeTo(rowsOf(sink, a * CHECKPOINT, from, to), this.offsets[a], end);
  }

  /**
   * Calls `each(strainRange, meanStress, count)` for every loop of the output, read back from
   * the spool (for the HTML's loop matrix and loop count); rows without strain (the stress-life
   * route) give the stress range instead.
   */
  async forEachLoop(each: (strainRange: number, meanStress: number, count: number, parameter: number) => void): Promise<void> {
    let carry = '';
    await this.copyTo({
      write: async (text: string) => {
        const lines = (carry + text).split('\n');
        carry = lines.pop() as string;
        for (const line of lines) {
          // start_sample … close_sample, start_event, turn_event, count, stress_max, stress_min, strain_max, strain_min, …
          const f = line.split(',');
          const range = f[8] === '' ? Number(f[6]) - Number(f[7]) : Number(f[8]) - Number(f[9]);
          each(range, (Number(f[6]) + Number(f[7])) / 2, Number(f[5]), Number(f[10]));
        }
      },
    });
  }

  /** Removes the spool. */
  remove(): void {
    this.spool.remove();
  }
}
