import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createServer, Socket } from 'node:net';

/** The redis-server binary on PATH, or null. */
export function redisServerBinary(): string | null {
  const r = spawnSync('sh', ['-c', 'command -v redis-server'], { encoding: 'utf8' });
  const path = r.status === 0 ? r.stdout.trim() : '';
  return path === '' ? null : path;
}

/** A free TCP port on 127.0.0.1 (the system picks it; closed again before it is returned). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

/** Answers PING on 127.0.0.1:port within `ms`, by plain RESP over a socket. */
function ping(port: number, ms: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = new Socket();
    const done = (ok: boolean) => {
      socket.destroy();
      resolve(ok);
    };
    socket.setTimeout(ms, () => done(false));
    socket.once('error', () => done(false));
    socket.connect(port, '127.0.0.1', () => socket.write('PING\r\n'));
    socket.once('data', (d) => done(d.toString().startsWith('+PONG')));
  });
}

/** A redis-server of the test's own, on 127.0.0.1 only, without persistence. */
export interface TestRedis {
  port: number;
  address: string;
  stop(): Promise<void>;
}

/**
 * Starts `redis-server --port N --bind 127.0.0.1 --save '' --appendonly no` on a free port and
 * waits (at most 10 s) until it answers; `stop()` ends it (SIGTERM, then SIGKILL after 5 s).
 */
export async function startRedis(binary: string): Promise<TestRedis> {
  const port = await freePort();
  const child: ChildProcess = spawn(binary, ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], { stdio: 'ignore' });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    child.kill('SIGTERM');
    const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
    await exited;
    clearTimeout(timer);
  };
  for (let t = 0; t < 100; t++) {
    if (await ping(port, 200)) return { port, address: `redis://127.0.0.1:${port}`, stop };
    await new Promise((r) => setTimeout(r, 100));
  }
  await stop();
  throw new Error(`redis-server did not answer on 127.0.0.1:${port} within 10 s`);
}
