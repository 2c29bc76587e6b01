// Peak resident memory of the loopwise command on every route and output (issue 16): each
// combination runs the command's main() in a child process (benchmarks/cli-rss.mjs, VmHWM of
// /proc/self/status, the parsing worker included) on files of the reference history (two
// columns, time and strain in microstrain, written outside the measured processes). Routes:
// repeating (the default: two reads), --one-off (one read), --mean-stress all (five sessions),
// --gate-fraction without --full-scale (a first read finds the range). Outputs: none, each of
// --json-out, --cycles-out, --html-out, and all three. Every run must succeed (exit 0) and
// report damage; the target is the 256 MB. The sizes are 10^6 and 10^7 rows by default
// (10^7 rows: 175 MB of text); CLI_RSS_ROWS=1e8 adds 10^8 rows (1.76 GB on disk, minutes per
// combination). The flatness rows give the 10^7 figure over the 10^6 figure of the same
// combination: near 1 when memory does not grow with the file.
import { execFileSync } from 'node:child_process';
import { createWriteStream, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { referenceStream } from '../../fixtures/generate.mjs';

const child = fileURLToPath(new URL('../cli-rss.mjs', import.meta.url));

/** Writes `rows` rows of the reference signal as microstrain (×4, into plasticity), chunk by chunk. */
async function writeReference(path, rows) {
  const out = createWriteStream(path);
  out.write('time_s,strain_ue\n');
  const source = referenceStream();
  const chunk = new Float64Array(100000);
  for (let done = 0; done < rows; done += chunk.length) {
    const n = Math.min(chunk.length, rows - done);
    source.fill(chunk);
    const lines = new Array(n);
    for (let k = 0; k < n; k++) lines[k] = `${((done + k) / 500).toFixed(4)},${(4 * chunk[k]).toFixed(2)}`;
    if (!out.write(lines.join('\n') + '\n')) await new Promise((r) => out.once('drain', r));
  }
  await new Promise((r) => out.end(r));
}

export const ROUTES = [
  ['repeating', []],
  ['one-off', ['--one-off']],
  ['mean-stress all', ['--mean-stress', 'all']],
  ['gate fraction, range found by a first read', ['--gate-fraction', '0.01']],
];
export const OUTPUTS = [
  ['no output file', []],
  ['--json-out', ['--json-out', 'r.json']],
  ['--cycles-out', ['--cycles-out', 'r.csv']],
  ['--html-out', ['--html-out', 'r.html']],
  ['all three', ['--json-out', 'r.json', '--cycles-out', 'r.csv', '--html-out', 'r.html']],
];

/** One measured run; checks that it succeeded and wrote what it was asked to. */
function measure(h, file, dir, route, outputs) {
  const args = ['assess', file, '--column', 'strain_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--quiet', '--memory-limit', '4096', ...route, ...outputs];
  const got = JSON.parse(execFileSync(process.execPath, [child, ...args], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 }));
  h.check(got.code === 0, `loopwise ${args.join(' ')} failed: ${got.stderr}`);
  if (outputs.includes('r.json')) {
    const report = JSON.parse(readFileSync(join(dir, 'r.json'), 'utf8'));
    h.check(report.results[0].damagePerRepeat > 0, 'the JSON report has no damage');
  }
  for (const f of ['r.json', 'r.csv', 'r.html']) rmSync(join(dir, f), { force: true });
  return got;
}

export async function run(h) {
  const sizes = [1e6, 1e7, ...(process.env.CLI_RSS_ROWS ? [Number(process.env.CLI_RSS_ROWS)] : [])];
  const dir = mkdtempSync(join(tmpdir(), 'loopwise-bench-cli-rss-'));
  const rows = [];
  try {
    const at = new Map();
    for (const n of sizes) {
      const file = join(dir, `reference-${n}.csv`);
      await writeReference(file, n);
      for (const [routeName, route] of ROUTES) {
        for (const [outName, outputs] of OUTPUTS) {
          const got = measure(h, file, dir, route, outputs);
          at.set(`${n}|${routeName}|${outName}`, got.maxRssMB);
          rows.push({
            figure: `cli/peak RSS, ${n.toExponential(0).replace('e+', 'e')} rows, ${routeName}, ${outName} (MB)`,
            ratio: got.maxRssMB,
            baseline: 'absolute (MB, /proc/self/status VmHWM)',
            baselineSeconds: null,
            seconds: got.seconds,
            sizes: { rows: n },
            nsPerSample: (got.seconds / n) * 1e9,
            nsPerReversal: null,
            target: 256,
          });
        }
      }
      rmSync(file, { force: true });
    }
    for (const [routeName] of ROUTES) {
      for (const [outName] of OUTPUTS) {
        const a = at.get(`1000000|${routeName}|${outName}`);
        const b = at.get(`10000000|${routeName}|${outName}`);
        rows.push({
          figure: `cli/peak RSS growth 1e6 → 1e7 rows, ${routeName}, ${outName}`,
          ratio: b / a,
          baseline: 'the same combination at 1e6 rows',
          baselineSeconds: null,
          seconds: null,
          sizes: { rows: [1e6, 1e7] },
          nsPerSample: null,
          nsPerReversal: null,
          target: null,
        });
      }
    }
    return rows;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
