// Child process of the cli-memory suite: runs the loopwise command (its main(), as the binary
// does, parsing on its worker thread in this same process) with the arguments given, and prints
// the exit code, the time and the peak resident set size of the whole process
// (/proc/self/status VmHWM; the worker thread is part of it).
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { main } from '@loopwise/cli';

const args = process.argv.slice(2);
let stderr = '';
const t0 = performance.now();
const code = await main(args, { stdout: () => {}, stderr: (t) => (stderr += t), stderrIsTerminal: false, stdoutWrite: async () => {} });
const seconds = (performance.now() - t0) / 1000;
const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
console.log(JSON.stringify({ code, seconds, stderr, maxRssMB: m ? Number(m[1]) / 1024 : null }));
