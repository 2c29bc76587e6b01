// Rainflow counting: turning points plus four-point counting with the `half` residue on the
// reference history (10^7 samples, about 15 % reversals), streamed in 65,536-sample chunks,
// and on white noise; a size sweep; and the peak resident set size of counting 10^8 streamed
// samples into a range-mean matrix (run in a child process so that nothing else is resident).
// Every timed result is checked: its cycles must equal those of the literal ASTM E1049
// procedure on a leading subset, and its counts must add up on the whole.
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { RainflowCounter, rainflow, turningPoints } from '@loopwise/rainflow';
import { referenceHistory, whiteNoise } from '../../fixtures/generate.mjs';
import { astmRainflow, referenceTurningPoints } from '../../packages/rainflow/test/support/astmE1049.mjs';

const N = 1e7;
const CHUNK = 65536;
const SUBSET = 20000;

function key(c) {
  return `${c.from}|${c.to}|${c.count}|${c.startIndex}|${c.turnIndex}`;
}

/** The fast count of the first SUBSET samples equals the standard's literal procedure. */
function checkSubset(h, check) {
  const sub = h.subarray(0, SUBSET);
  const fast = rainflow(sub).cycles;
  const got = [];
  for (let i = 0; i < fast.length; i++) got.push(key(fast.row(i)));
  const want = astmRainflow(referenceTurningPoints(sub)).map(key);
  check(got.length === want.length && got.sort().join() === want.sort().join(), 'rainflow subset differs from ASTM E1049 5.4.4');
}

/** Counts add up: twice the full cycles plus the half cycles is the number of ranges. */
function checkCounts(result, check, label) {
  const c = result.cycles.columns().count;
  let units = 0;
  for (let i = 0; i < c.length; i++) units += c[i] === 1 ? 2 : 1;
  check(units === result.turningPointCount - 1, `${label}: count conservation`);
}

function streamed(h) {
  const counter = new RainflowCounter({ residue: 'half' });
  for (let s = 0; s < h.length; s += CHUNK) counter.push(h.subarray(s, Math.min(h.length, s + CHUNK)));
  return counter.finish();
}

export async function run(h) {
  const rows = [];
  // first, while this process holds little: the memory figure runs in a child of its own
  const child = fileURLToPath(new URL('../rainflow-rss.mjs', import.meta.url));
  const out = JSON.parse(execFileSync(process.execPath, [child], { encoding: 'utf8' }));
  h.check(out.checked === true, 'streamed histogram counts do not add up');
  rows.push({
    figure: 'rainflow/peak RSS, 1e8 streamed samples into a range-mean matrix (MB)',
    ratio: out.maxRssMB,
    baseline: `absolute (MB, ${out.maxRssSource})`,
    baselineSeconds: null,
    seconds: out.seconds,
    sizes: { samples: out.samples, chunk: out.chunk, reversals: out.turningPoints },
    nsPerSample: (out.seconds / out.samples) * 1e9,
    nsPerReversal: (out.seconds / out.turningPoints) * 1e9,
    target: 96,
  });
  const ref = referenceHistory(N);
  const noise = whiteNoise(N);
  checkSubset(ref, h.check);
  checkSubset(noise, h.check);
  const reversalsRef = turningPoints(ref).values.length;
  const reversalsNoise = turningPoints(noise).values.length;

  const scanRef = h.scanSeconds(ref);
  const batch = h.measure(() => rainflow(ref));
  const batchResult = rainflow(ref);
  checkCounts(batchResult, h.check, 'batch');
  rows.push({
    figure: 'rainflow/batch reference history (turning points + four-point, half residue)',
    ratio: batch / scanRef,
    baseline: 'minmax-scan',
    baselineSeconds: scanRef,
    seconds: batch,
    sizes: { samples: N, reversals: reversalsRef },
    nsPerSample: (batch / N) * 1e9,
    nsPerReversal: (batch / reversalsRef) * 1e9,
    target: 4,
  });

  const stream = h.measure(() => streamed(ref));
  const streamResult = streamed(ref);
  h.check(streamResult.cycles.length === batchResult.cycles.length, 'streaming and batch cycle counts differ');
  const a = streamResult.cycles.columns();
  const b = batchResult.cycles.columns();
  for (let i = 0; i < a.range.length; i += 997) h.check(a.range[i] === b.range[i] && a.startIndex[i] === b.startIndex[i], 'stream != batch');
  rows.push({
    figure: 'rainflow/streaming 65,536-sample chunks vs batch',
    ratio: stream / batch,
    baseline: 'rainflow batch',
    baselineSeconds: batch,
    seconds: stream,
    sizes: { samples: N, chunk: CHUNK, reversals: reversalsRef },
    nsPerSample: (stream / N) * 1e9,
    nsPerReversal: (stream / reversalsRef) * 1e9,
    target: 1.25,
  });
  rows.push({
    figure: 'rainflow/streaming 65,536-sample chunks (reference history)',
    ratio: stream / scanRef,
    baseline: 'minmax-scan',
    baselineSeconds: scanRef,
    seconds: stream,
    sizes: { samples: N, chunk: CHUNK, reversals: reversalsRef },
    nsPerSample: (stream / N) * 1e9,
    nsPerReversal: (stream / reversalsRef) * 1e9,
    target: null,
  });

  const scanNoise = h.scanSeconds(noise);
  const batchNoise = h.measure(() => rainflow(noise));
  checkCounts(rainflow(noise), h.check, 'white noise');
  rows.push({
    figure: 'rainflow/batch white noise',
    ratio: batchNoise / scanNoise,
    baseline: 'minmax-scan',
    baselineSeconds: scanNoise,
    seconds: batchNoise,
    sizes: { samples: N, reversals: reversalsNoise },
    nsPerSample: (batchNoise / N) * 1e9,
    nsPerReversal: (batchNoise / reversalsNoise) * 1e9,
    target: null,
  });

  for (const n of [1e3, 1e4, 1e5, 1e6]) {
    const x = ref.slice(0, n);
    const scan = h.scanSeconds(x);
    const t = h.measure(() => rainflow(x));
    const rev = turningPoints(x).values.length;
    rows.push({
      figure: `rainflow/batch reference history, size sweep n=${n}`,
      ratio: t / scan,
      baseline: 'minmax-scan',
      baselineSeconds: scan,
      seconds: t,
      sizes: { samples: n, reversals: rev },
      nsPerSample: (t / n) * 1e9,
      nsPerReversal: (t / rev) * 1e9,
      target: null,
    });
  }

  return rows;
}
