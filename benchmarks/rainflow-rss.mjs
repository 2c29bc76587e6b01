// Child process of the rainflow suite: counts 10^8 samples of the reference signal, generated
// chunk by chunk and never held whole, into a range-mean matrix, and prints its peak RSS.
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { RainflowCounter, RangeMeanMatrix } from '@loopwise/rainflow';
import { referenceStream } from '../fixtures/generate.mjs';

const SAMPLES = Number(process.env.RSS_SAMPLES ?? 1e8);
const CHUNK = 65536;
const source = referenceStream();
const chunk = new Float64Array(CHUNK);
const matrix = new RangeMeanMatrix({ range: { count: 64, min: 0, max: 1600 }, mean: { count: 64, min: -800, max: 800 } });
const counter = new RainflowCounter({ residue: 'half', sink: matrix });
const t0 = performance.now();
for (let done = 0; done < SAMPLES; done += CHUNK) {
  const n = Math.min(CHUNK, SAMPLES - done);
  source.fill(n === CHUNK ? chunk : chunk.subarray(0, n));
  counter.push(n === CHUNK ? chunk : chunk.subarray(0, n));
}
const result = counter.finish();
const seconds = (performance.now() - t0) / 1000;
// the matrix received every count: (turning points - 1) ranges, each half a cycle
const checked = matrix.totalCount() === (result.turningPointCount - 1) / 2 && result.sampleCount === SAMPLES;
console.log(
  JSON.stringify({
    samples: SAMPLES,
    chunk: CHUNK,
    turningPoints: result.turningPointCount,
    residueLength: result.residue.values.length,
    maxRssMB: peakRssMB(),
    maxRssSource: existsProc() ? '/proc/self/status VmHWM' : 'process.resourceUsage().maxRSS',
    seconds,
    checked,
  }),
);

/**
 * Peak resident set size of this process in MB. On Linux, VmHWM of /proc/self/status: getrusage's
 * maxRSS of a spawned child can carry the parent's high-water mark from before exec.
 */
function peakRssMB() {
  try {
    const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (m) return Number(m[1]) / 1024;
  } catch {
    // not Linux
  }
  return process.resourceUsage().maxRSS / 1024;
}

function existsProc() {
  try {
    return /VmHWM/.test(readFileSync('/proc/self/status', 'utf8'));
  } catch {
    return false;
  }
}
