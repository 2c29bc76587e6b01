// The fleet (issue 14): 20 files of 10^6 samples (the reference history as microstrain at a notch
// root, each file a different seed and scale; written to a temporary folder outside the timed
// region) assessed by the built `loopwise-fleet run` command. Two figures:
//  - throughput on 2 worker threads ÷ throughput on 1 (target >= 1.8; a speed-up, higher is better);
//  - the queue route's time per file ÷ the local pool's on the same files, both with 2 workers
//    (two `loopwise-fleet worker` processes on a redis-server started here on 127.0.0.1, against
//    the pool's two threads; target <= 1.10, i.e. at most 10 % overhead). Skipped with a note when
//    no redis-server binary is found.
// Every run writes into a fresh output folder (a reused folder would resume and do nothing), and
// every result is checked: all routes give the same fleet.json byte for byte.
// Both runs are at the defaults a user gets for that worker count: one worker on a 2-core machine
// parses on a thread of its own besides (readDelimitedParallel), so it already keeps more than one
// core busy; workers that fill every core parse on their own threads. The queue's two worker
// processes run at their default (no parse thread: one process per core).
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createWriteStream, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { referenceHistory } from '../../fixtures/generate.mjs';

const FILES = 20;
const SAMPLES = 1e6;
const ROUNDS = 3;
const BIN = fileURLToPath(new URL('../../packages/fleet/dist/bin.js', import.meta.url));
const SETTINGS = ['--unit', 'km', '--target-service', '100000', '--range-bins', '32:0:0.012', '--mean-bins', '16:-0.006:0.006', '--from-to-bins', '32:-0.008:0.008'];

async function writeFile(path, values, scale) {
  const out = createWriteStream(path);
  out.write('time_s,strain_ue\n');
  const lines = [];
  for (let i = 0; i < values.length; i++) {
    lines.push(`${(i / 500).toFixed(4)},${(scale * values[i]).toFixed(2)}`);
    if (lines.length === 100000) {
      if (!out.write(lines.join('\n') + '\n')) await new Promise((r) => out.once('drain', r));
      lines.length = 0;
    }
  }
  if (lines.length) out.write(lines.join('\n') + '\n');
  await new Promise((r) => out.end(r));
}

/**
 * Runs the command and returns its wall time, measured here, and the CPU time of the command and
 * its threads (user + system, from bash's \`time\`, which reports the waited-for child's usage).
 */
const timed = (args, cwd) => {
  const quoted = [process.execPath, BIN, ...args].map((a) => `'${a.replace(/'/g, "'\\''")}'`).join(' ');
  const t0 = process.hrtime.bigint();
  const r = spawnSync('bash', ['-c', `TIMEFORMAT='%U %S'; time ${quoted} >/dev/null`], { cwd, encoding: 'utf8', timeout: 600000 });
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  if (r.status !== 0) throw new Error(`loopwise-fleet ${args.join(' ')} exited ${r.status}: ${r.stderr}`);
  const [user, sys] = r.stderr.trim().split('\n').at(-1).split(' ').map(Number);
  return { wall, cpu: user + sys };
};
const seconds = (args, cwd) => timed(args, cwd).wall;

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

function redisBinary() {
  const r = spawnSync('sh', ['-c', 'command -v redis-server'], { encoding: 'utf8' });
  return r.status === 0 && r.stdout.trim() !== '' ? r.stdout.trim() : null;
}

const freePort = () =>
  new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = s.address().port;
      s.close(() => resolve(port));
    });
  });

export async function run(h) {
  const dir = mkdtempSync(join(tmpdir(), 'loopwise-bench-fleet-'));
  const children = [];
  try {
    const rows = ['file,asset,usage,job'];
    for (let k = 0; k < FILES; k++) {
      const values = referenceHistory(SAMPLES, 1000 + k);
      await writeFile(join(dir, `f${k}.csv`), values, 3.2 + 0.08 * k);
      rows.push(`f${k}.csv,asset-${k % 5},${(0.5 + 0.05 * k).toFixed(2)},job.json`);
    }
    writeFileSync(join(dir, 'fleet.csv'), rows.join('\n') + '\n');
    writeFileSync(
      join(dir, 'job.json'),
      JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', meanStress: 'smithWatsonTopper', channels: [{ name: 'strain', column: 'strain_ue', quantity: 'strain', unit: 'microstrain' }], file: 'f0.csv' }),
    );
    let n = 0;
    const runLocal = (workers) => {
      const out = join(dir, `out-${n++}`);
      const t = timed(['run', 'fleet.csv', '--out', out, ...SETTINGS, '--workers', String(workers), '--quiet'], dir);
      return { s: t.wall, cpu: t.cpu, json: readFileSync(join(out, 'fleet.json'), 'utf8') };
    };
    // one warm-up run (file cache, JIT of the command's start), then the rounds alternately
    const reference = runLocal(2).json;
    const one = [];
    const two = [];
    const busy = []; // cores one worker keeps busy: CPU time ÷ wall time
    const busyTwo = []; // the same with two workers
    for (let r = 0; r < ROUNDS; r++) {
      const a = runLocal(1);
      const b = runLocal(2);
      h.check(a.json === reference && b.json === reference, 'fleet: 1 and 2 workers give the same fleet.json');
      one.push(a.s);
      two.push(b.s);
      busy.push(a.cpu / a.s);
      busyTwo.push(b.cpu / b.s);
    }
    const t1 = median(one);
    const t2 = median(two);
    const out = [
      {
        figure: `fleet/throughput on 2 workers ÷ 1 worker, ${FILES} files of 10^6 samples (local pool)`,
        ratio: t1 / t2,
        baseline: 'the same fleet on 1 worker',
        baselineSeconds: t1,
        seconds: t2,
        sizes: [FILES, SAMPLES],
        nsPerSample: (t2 * 1e9) / (FILES * SAMPLES),
        target: 1.8,
        higherIsBetter: true,
        coresBusyOneWorker: median(busy),
        coresBusyTwoWorkers: median(busyTwo),
        note: `1 worker ${one.map((s) => s.toFixed(2)).join(', ')} s; 2 workers ${two.map((s) => s.toFixed(2)).join(', ')} s; cores busy (CPU ÷ wall): one worker ${median(busy).toFixed(2)} (its reader parses on a thread of its own besides), two workers ${median(busyTwo).toFixed(2)} (each parses on its own thread)`,
      },
    ];
    const binary = redisBinary();
    if (binary === null) {
      out.push({ figure: 'fleet/queue route time per file ÷ local pool, 2 workers, 10^6 samples', ratio: null, baseline: 'local pool, 2 threads', target: 1.1, note: 'skipped: no redis-server binary found (install the Debian package redis-server)' });
      return out;
    }
    const port = await freePort();
    const redis = spawn(binary, ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], { stdio: 'ignore' });
    children.push(redis);
    const address = `redis://127.0.0.1:${port}`;
    for (let t = 0; ; t++) {
      const r = spawnSync('redis-cli', ['-p', String(port), 'ping'], { encoding: 'utf8' });
      if (r.stdout?.trim() === 'PONG') break;
      if (t > 100) throw new Error('redis-server did not start');
      await new Promise((r) => setTimeout(r, 100));
    }
    for (let k = 0; k < 2; k++) {
      const w = spawn(process.execPath, [BIN, 'worker', '--queue', address, '--quiet'], { cwd: dir, stdio: 'ignore' });
      children.push(w);
    }
    await new Promise((r) => setTimeout(r, 1500)); // the workers connect before the clock starts
    const queued = [];
    const local = [];
    for (let r = 0; r < ROUNDS; r++) {
      // each round an empty Redis: results left in the queue's hash would be reused otherwise
      execFileSync('redis-cli', ['-p', String(port), 'flushall']);
      const outQ = join(dir, `out-${n++}`);
      queued.push(seconds(['run', 'fleet.csv', '--out', outQ, ...SETTINGS, '--queue', address, '--quiet'], dir));
      h.check(readFileSync(join(outQ, 'fleet.json'), 'utf8') === reference, 'fleet: the queue route gives the same fleet.json as the pool');
      local.push(runLocal(2).s);
    }
    const tq = median(queued);
    const tl = median(local);
    out.push({
      figure: 'fleet/queue route time per file ÷ local pool, 2 workers, 10^6 samples',
      ratio: tq / tl,
      baseline: 'local pool, 2 threads',
      baselineSeconds: tl / FILES,
      seconds: tq / FILES,
      sizes: [FILES, SAMPLES],
      nsPerSample: (tq * 1e9) / (FILES * SAMPLES),
      target: 1.1,
      note: `queue ${queued.map((s) => s.toFixed(2)).join(', ')} s; pool ${local.map((s) => s.toFixed(2)).join(', ')} s (two worker processes against two threads; redis-server on 127.0.0.1)`,
    });
    return out;
  } finally {
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(children.map((c) => (c.exitCode === null && c.signalCode === null ? new Promise((r) => c.once('exit', r)) : null)));
    rmSync(dir, { recursive: true, force: true });
  }
}
