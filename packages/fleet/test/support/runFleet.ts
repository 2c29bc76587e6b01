import { spawn, spawnSync, type ChildProcess } from 'node:child_process';

/** The built binary (pnpm test builds first). */
export const BIN = new URL('../../dist/bin.js', import.meta.url).pathname;

export interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Runs `loopwise-fleet` through the built binary, synchronously. */
export function runFleet(args: string[], cwd: string, timeout = 120000): Run {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Starts `loopwise-fleet` in the background (a worker or a run); its output is gathered into `out`. */
export function startFleet(args: string[], cwd: string): { child: ChildProcess; out: { stdout: string; stderr: string }; exited: Promise<number | null> } {
  const child = spawn(process.execPath, [BIN, ...args], { cwd, stdio: ['ignore', 'pipe', 'pipe'] });
  const out = { stdout: '', stderr: '' };
  child.stdout!.on('data', (d) => (out.stdout += d));
  child.stderr!.on('data', (d) => (out.stderr += d));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, out, exited };
}
