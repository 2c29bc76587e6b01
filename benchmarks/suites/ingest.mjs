// Ingestion: the fast reader (readDelimitedColumns from @loopwise/cli's ingestion, reading the
// file and producing the Float64Array column) against csv-parse on the same two-column file of
// 2e6 rows, in the same run. The file is written to a temp directory outside the timed region:
// values of the reference history (fixtures/generate.mjs) formatted like a data logger, time
// with 4 decimals and strain with 3. csv-parse runs with the pinned options below on the whole
// file read into memory, then Number() on each field of the second column into a Float64Array.
// Both must give identical numbers (bit-exact, every row) or the suite fails.
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { referenceHistory } from '../../fixtures/generate.mjs';

const ROWS = 2e6;
/** PINNED csv-parse options of the baseline (csv-parse 6.2.0, sync API, whole file in one call). */
export const CSV_PARSE_OPTIONS = Object.freeze({ delimiter: ',', from_line: 2, cast: false });

// csv-parse is a dependency of @loopwise/cli only: resolve it from there
const cliRequire = createRequire(new URL('../../packages/cli/package.json', import.meta.url));
const { parse } = await import(pathToFileURL(cliRequire.resolve('csv-parse/sync')).href);
const { readDelimitedColumns } = await import('@loopwise/cli');

function csvParseColumn(path) {
  const records = parse(readFileSync(path), CSV_PARSE_OPTIONS);
  const out = new Float64Array(records.length);
  for (let i = 0; i < records.length; i++) out[i] = Number(records[i][1]);
  return out;
}

const FAST_OPTIONS = Object.freeze({ channels: [{ column: 2, quantity: 'strain', unit: 'strain' }], checks: false });

async function measureAsync(h, fn) {
  for (let i = 0; i < h.WARMUP_RUNS; i++) h.consume(await fn());
  const times = [];
  for (let i = 0; i < h.TIMED_RUNS; i++) {
    const t0 = performance.now();
    h.consume(await fn());
    times.push((performance.now() - t0) / 1000);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

export async function run(h) {
  const dir = mkdtempSync(join(tmpdir(), 'loopwise-bench-ingest-'));
  try {
    const path = join(dir, 'reference-2e6.csv');
    const ref = referenceHistory(ROWS);
    const parts = ['time_s,strain_ue\n'];
    for (let i = 0; i < ROWS; i++) parts.push(`${(i / 1000).toFixed(4)},${ref[i].toFixed(3)}\n`);
    writeFileSync(path, parts.join(''));
    const bytes = statSync(path).size;

    // check: both readers give the same numbers on the whole file, bit for bit
    const fast = (await readDelimitedColumns(path, FAST_OPTIONS)).channels[0];
    const slow = csvParseColumn(path);
    h.check(fast.length === ROWS && slow.length === ROWS, 'row counts differ');
    for (let i = 0; i < ROWS; i++) if (!Object.is(fast[i], slow[i])) h.check(false, `row ${i + 2}: fast ${fast[i]} != csv-parse ${slow[i]}`);

    const csvParseSeconds = h.measure(() => csvParseColumn(path));
    const fastSeconds = await measureAsync(h, async () => (await readDelimitedColumns(path, FAST_OPTIONS)).channels[0]);
    return [
      {
        figure: 'ingest/fast reader vs csv-parse throughput',
        ratio: csvParseSeconds / fastSeconds,
        higherIsBetter: true,
        baseline: 'csv-parse',
        baselineSeconds: csvParseSeconds,
        seconds: fastSeconds,
        sizes: { rows: ROWS, bytes, csvParseOptions: CSV_PARSE_OPTIONS },
        fastMBPerSecond: bytes / 1e6 / fastSeconds,
        csvParseMBPerSecond: bytes / 1e6 / csvParseSeconds,
        nsPerRow: (fastSeconds / ROWS) * 1e9,
        nsPerSample: (fastSeconds / ROWS) * 1e9,
        target: 15,
      },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
