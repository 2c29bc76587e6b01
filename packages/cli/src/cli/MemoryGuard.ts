import { closeSync, openSync, readSync, statSync } from 'node:fs';
import { UsageError } from './CliError';

/** Default limit of the resident memory of a run, MB (`--memory-limit`). */
export const DEFAULT_MEMORY_LIMIT_MB = 1024;

/**
 * Bytes per sample and channel that the in-memory routes (duty cycles, `margin`) hold: the
 * history (8), its turning points with their indices, the tracker's tables and the loop table
 * at the 15 % reversals of a typical measured history, with room (our own estimate, measured
 * on the reference history: about 30).
 */
const IN_MEMORY_BYTES_PER_SAMPLE = 48;

/** Least time between two reads of the resident set size by {@link MemoryGuard.check}, ms. */
const CHECK_INTERVAL_MS = 20;

/**
 * Keeps a run below its memory limit and says so before the process would run out of memory:
 * the in-memory routes are refused up front when their estimated need exceeds the limit, and
 * every route checks the resident set size as it reads (each chunk of samples); a run above the
 * limit stops with a coded input error (exit 2) instead of a crash of the JavaScript engine.
 */
export class MemoryGuard {
  constructor(readonly limitMB: number = DEFAULT_MEMORY_LIMIT_MB) {}

  /** When the resident set size was last read (ms, performance.now()). */
  private lastCheck = -Infinity;

  /**
   * Throws when the resident set size exceeds the limit; `where` says what was being done. Reads
   * it at most every CHECK_INTERVAL_MS (a read costs about 9 µs here, and chunks come thousands of
   * times a second); the streamed routes grow by far less than the limit's margin in that time.
   */
  check(where: () => string): void {
    const now = performance.now();
    if (now - this.lastCheck < CHECK_INTERVAL_MS) return;
    this.lastCheck = now;
    const rss = process.memoryUsage.rss();
    if (rss > this.limitMB * 1048576) {
      throw new MemoryLimitError(`the run reached ${Math.round(rss / 1048576)} MB of memory (limit ${this.limitMB} MB, --memory-limit) ${where()}; stopped before it could run out of memory`);
    }
  }

  /**
   * Refuses an in-memory route over `files` with `channels` channels when the estimate from the
   * files' sizes (samples from the bytes per line of each file's head) exceeds the limit.
   */
  checkInMemory(files: { path: string; shown: string }[], channels: number, route: string): void {
    let samples = 0;
    for (const f of files) samples += estimateRows(f.path);
    const needMB = (samples * channels * IN_MEMORY_BYTES_PER_SAMPLE) / 1048576;
    if (needMB > this.limitMB) {
      throw new MemoryLimitError(
        `${files.map((f) => f.shown).join(', ')}: ${route} holds every sample in memory: about ${formatMB(needMB)} MB for about ${samples.toPrecision(2)} samples, above the limit of ${this.limitMB} MB (--memory-limit); assess a single file (streamed), or raise the limit if the machine has the memory`,
      );
    }
  }

  /**
   * Refuses to hold a streamed file's channels in memory (the zero-phase low-pass, `why`) when
   * the estimate from the file's size exceeds half the limit (the other half for the rest of the
   * run): {@link HELD_BYTES_PER_SAMPLE} a sample and channel.
   */
  checkHeld(file: { path: string; shown: string }, channels: number, why: string): void {
    const samples = estimateRows(file.path);
    const needMB = (samples * channels * HELD_BYTES_PER_SAMPLE) / 1048576;
    if (needMB > this.limitMB / 2) {
      throw new MemoryLimitError(
        `${file.shown}: ${why} filters forwards and backwards, so it holds every sample of the file in memory: about ${formatMB(needMB)} MB for about ${samples.toPrecision(2)} samples × ${channels} column(s), above half the limit of ${this.limitMB} MB (--memory-limit); filter the file in parts, or raise the limit if the machine has the memory`,
      );
    }
  }
}

/**
 * Bytes per sample and column that the zero-phase low-pass of a streamed file holds: each
 * channel (and the time column) as a Float64Array (8), and as much again while it grows by doubling.
 */
export const HELD_BYTES_PER_SAMPLE = 16;

/** A run that would exceed its memory limit (exit 2: the input is too large for the route). */
export class MemoryLimitError extends UsageError {
  constructor(message: string) {
    super(message);
    this.name = 'MemoryLimitError';
  }
}

function formatMB(x: number): string {
  return x >= 100 ? String(Math.round(x)) : x.toPrecision(2);
}

/** Rows of a file, estimated from its size and the line feeds of its first 64 KiB (0 when unknown). */
export function estimateRows(path: string): number {
  try {
    const st = statSync(path);
    if (!st.isFile() || st.size === 0) return 0;
    const head = Buffer.alloc(Math.min(st.size, 65536));
    const fd = openSync(path, 'r');
    try {
      readSync(fd, head, 0, head.length, 0);
    } finally {
      closeSync(fd);
    }
    let lines = 0;
    for (const b of head) if (b === 10) lines++;
    return lines > 0 ? (st.size / head.length) * lines : 1;
  } catch {
    return 0;
  }
}
