#!/usr/bin/env node
// The one benchmark runner (`pnpm bench`). Runs every suite in SUITES in one process, prints a
// table, and writes benchmarks/results.json. Every figure is a ratio to a baseline measured in
// the same run (harness.mjs pins the baselines and their warm-up); targets come from the issues.
// Run one suite with `pnpm bench rainflow`; `pnpm bench --merge web` runs one suite and replaces
// only its rows in results.json (the file then says which suites were measured when).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { arch, cpus, platform } from 'node:os';
import { fileURLToPath } from 'node:url';
import * as harness from './harness.mjs';

/** Suites in run order; each is ./suites/<name>.mjs exporting `run(harness)` → rows. */
const SUITES = ['rainflow', 'signal', 'mean-stress', 'notch', 'stress-life', 'engine', 'small-calls', 'native', 'ingest', 'cli', 'cli-memory', 'fleet', 'web'];

const merge = process.argv.includes('--merge');
const only = process.argv.slice(2).filter((a) => a !== '--merge');
if (merge && only.length === 0) throw new Error('--merge: name the suites to measure again (pnpm bench --merge web)');
for (const name of only) if (!SUITES.includes(name)) throw new Error(`no suite "${name}"; suites: ${SUITES.join(', ')}`);
const rows = [];
for (const name of SUITES) {
  if (only.length && !only.includes(name)) continue;
  const suite = await import(`./suites/${name}.mjs`);
  const t0 = Date.now();
  const got = await suite.run(harness);
    // a ratio is a cost (lower is better) unless the row says it is a speed-up (higherIsBetter)
  for (const r of got) {
    // a figure without a ratio (skipped, with a note) neither passes nor fails
    const pass = r.target == null || r.ratio == null ? null : r.higherIsBetter ? r.ratio >= r.target : r.ratio <= r.target;
    rows.push({ suite: name, ...r, pass });
  }
  console.error(`suite ${name}: ${got.length} figures in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}

// Where a scan-ratio target is out of reach of native code on this machine: the same work in C
// (the native suite's like-for-like rows) divided by the same JS scan. A scan ratio is not
// portable between machine kinds (issue 10); the native rows are the portable limit. The row
// keeps its target and its pass; it gains the figure C reaches, so a reader can tell a slow
// stage from a machine on which the scan is unusually fast.
const NATIVE_OF = [
  ['rainflow/batch reference history (turning points + four-point, half residue)', 'native/rainflow batch reference history'],
  ['notch/Neuber, nominal input, Kt 2.5, repeating (first + stabilised pass), 1e7 samples', 'native/notch tracker, Neuber Kt 2.5, repeating (first + stabilised pass), JS ÷ native (answer'],
  ['engine/assessLife reference history (Neuber, SWT, Miner, repeating)', 'native/assessLife reference history (Neuber Kt 2, SWT, Miner, repeating), JS ÷ native (answer'],
  ['stress-life/engine assessLife, stress-life route, reference history (rainflow repeat residue, IIW FAT 90 Haibach, Goodman, the whole report)', 'native/assessLife stress-life route (the whole report)'],
];
for (const [jsName, nativePrefix] of NATIVE_OF) {
  const js = rows.find((r) => r.figure === jsName);
  const c = rows.find((r) => r.figure.startsWith(nativePrefix));
  if (!js || !c || js.ratio == null || c.ratio == null || js.target == null) continue;
  js.nativeScanRatio = js.ratio / c.ratio;
  // the engine rows' C side counts and sums the damage but builds no report (see suites/native.mjs)
  js.note = `the C reference (${c.figure.split(',')[0]}) costs ${js.nativeScanRatio.toFixed(2)}× this scan on this machine; target ${js.target}× ${js.nativeScanRatio > js.target ? 'is out of reach of native code here' : 'is within reach of native code here'}`;
}

const fmt = (x, d = 2) => (x == null ? '' : Number(x).toFixed(d));
const table = [['figure', 'ratio', 'target', 'pass', 'baseline', 'ns/sample', 'ns/reversal']];
for (const r of rows) {
  table.push([
    r.figure,
    fmt(r.ratio),
    r.target == null ? '' : `${r.higherIsBetter ? '>=' : '<='} ${r.target}`,
    r.pass == null ? '' : r.pass ? 'yes' : 'NO',
    r.baseline,
    fmt(r.nsPerSample),
    fmt(r.nsPerReversal ?? r.nsPerLoop),
  ]);
}
const widths = table[0].map((_, c) => Math.max(...table.map((row) => String(row[c]).length)));
for (const row of table) console.log(row.map((cell, c) => String(cell).padEnd(widths[c])).join('  '));
for (const r of rows) if (r.note) console.log(`note: ${r.figure}: ${r.note}`);

const out = {
  format: 'loopwise-benchmark-results',
  version: 1,
  date: new Date().toISOString(),
  machine: { node: process.version, platform: platform(), arch: arch(), cpu: cpus()[0]?.model ?? 'unknown', cores: cpus().length },
  warmupRuns: harness.WARMUP_RUNS,
  timedRuns: harness.TIMED_RUNS,
  figures: rows,
};
const resultsFile = fileURLToPath(new URL('./results.json', import.meta.url));
if (only.length === 0) {
  writeFileSync(resultsFile, JSON.stringify(out, null, 2) + '\n');
  console.error('wrote benchmarks/results.json');
} else if (merge) {
  // the other suites' rows stay as they were measured; `measuredApart` says which rows came later
  const old = existsSync(resultsFile) ? JSON.parse(readFileSync(resultsFile, 'utf8')) : { ...out, figures: [] };
  const kept = old.figures.filter((r) => !only.includes(r.suite));
  const apart = (old.measuredApart ?? []).filter((m) => !only.includes(m.suite));
  for (const suite of only) apart.push({ suite, date: out.date, machine: out.machine });
  const merged = { ...old, figures: SUITES.flatMap((s) => (only.includes(s) ? rows.filter((r) => r.suite === s) : kept.filter((r) => r.suite === s))), measuredApart: apart };
  writeFileSync(resultsFile, JSON.stringify(merged, null, 2) + '\n');
  console.error(`replaced the rows of ${only.join(', ')} in benchmarks/results.json`);
}
const failed = rows.filter((r) => r.pass === false);
if (failed.length) console.error(`${failed.length} figure(s) miss their target: ${failed.map((r) => r.figure).join('; ')}`);
