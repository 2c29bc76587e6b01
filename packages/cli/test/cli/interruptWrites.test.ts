import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { mulberry32 } from '../../../../fixtures/generate.mjs';

// SIGINT and SIGTERM during the write phase (issue 16): the command is started on a file whose
// outputs take a while to write (every sample a reversal: a large cycles CSV), the folder is
// watched until the first temporary output appears, and the signal follows after a delay drawn
// from a seeded generator. Afterwards either the run finished (exit 0, every output complete)
// or it stopped (exit 130 or 143) and left nothing: no output, no temporary file beside the
// targets, nothing in its private TMPDIR. Data invented for the test (seeded noise).
const bin = new URL('../../dist/bin.js', import.meta.url).pathname;
const RUNS = 8;
const SEED = 16;
let root = '';


beforeAll(() => {
  expect(existsSync(bin), 'build the cli first (pnpm test does)').toBe(true);
  root = mkdtempSync(join(tmpdir(), 'loopwise-signal-'));
  const next = mulberry32(SEED);
  const rows = ['time,stress'];
  for (let i = 0; i < 120000; i++) rows.push(`${i},${((i % 2 ? 1 : -1) * (50 + 250 * next())).toFixed(3)}`);
  writeFileSync(join(root, 'noise.csv'), rows.join('\n') + '\n');
});

afterAll(() => rmSync(root, { recursive: true, force: true }));

const OUTPUTS = ['r.json', 'r.csv', 'r.html'];

function interrupted(k: number, signal: NodeJS.Signals, delayMs: number): Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string; folder: string; temp: string }> {
  const folder = join(root, `run-${k}`);
  const temp = join(root, `tmp-${k}`);
  mkdirSync(folder);
  mkdirSync(temp);
  const args = ['assess', join(root, 'noise.csv'), '--column', 'stress', '--material', 'SAE 1045', '--kt', '2', '--json-out', 'r.json', '--cycles-out', 'r.csv', '--html-out', 'r.html'];
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [bin, ...args], { cwd: folder, env: { ...process.env, TMPDIR: temp } });
    let stderr = '';
    child.stderr.on('data', (b) => (stderr += b));
    let sent = false;
    const watch = setInterval(() => {
      if (sent) return;
      if (readdirSync(folder).some((f) => f.endsWith('.loopwise-tmp'))) {
        sent = true;
        setTimeout(() => child.kill(signal), delayMs);
      }
    }, 1);
    child.on('exit', (code, signal) => {
      clearInterval(watch);
      resolve({ code, signal, stderr, folder, temp });
    });
  });
}

describe('a signal during the write phase leaves all outputs or none', () => {
  test(`${RUNS} runs, SIGINT and SIGTERM at seeded points of the write phase (seed ${SEED})`, async () => {
    const next = mulberry32(SEED);
    const outcomes: string[] = [];
    for (let k = 0; k < RUNS; k++) {
      const signal: NodeJS.Signals = k % 2 ? 'SIGTERM' : 'SIGINT';
      const delay = Math.floor(next() * 1200);
      const r = await interrupted(k, signal, delay);
      const left = readdirSync(r.folder).sort();
      const complete = () => {
        expect(left).toEqual([...OUTPUTS].sort());
        expect(JSON.parse(readFileSync(join(r.folder, 'r.json'), 'utf8')).format).toBe('loopwise-cli-report');
        expect(readFileSync(join(r.folder, 'r.html'), 'utf8')).toMatch(/<\/html>\s*$/);
      };
      if (r.code === 0) {
        complete(); // finished before the signal
        outcomes.push('finished');
      } else if (r.code === null) {
        // The signal came while Node was tearing down after the run had finished: its handler no
        // longer runs and the default action ends the process. The run was complete by then.
        expect(r.signal, r.stderr).toBe(signal);
        complete();
        outcomes.push('finished, killed at exit');
      } else {
        expect(r.code, r.stderr).toBe(signal === 'SIGINT' ? 130 : 143);
        if (/after its outputs were written/.test(r.stderr)) {
          complete(); // stopped after the renames: the outputs are complete
          outcomes.push('stopped after writing');
        } else {
          expect(r.stderr).toMatch(new RegExp(`stopped by ${signal}; no output was written`));
          expect(left).toEqual([]);
          outcomes.push('stopped');
        }
      }
      expect(readdirSync(r.temp)).toEqual([]);
    }
    // the delays reach into the write phase: most runs are stopped in it
    expect(outcomes.filter((o) => o === 'stopped').length).toBeGreaterThan(0);
  }, 120000);
});
