// Notch tracker on the reference history (10^7 samples, about 15 % reversals): nominal input,
// Neuber, repeating mode (first and stabilised pass); Glinka and local-strain input reported
// too. No solve tolerance is set: every figure measures the package's default, what a user gets.
// Each timed result is checked: the loops of a leading subset equal those of a slow path (one
// pure-function branch solve per sample, loops closed in the history's value with the same
// memory rules), and the stabilised pass holds one reversal per turning point of the block and
// closes every loop. The Neuber figure is also given against the compute-bound baseline (10^7
// Math.exp calls), since the tracker's reversals are bound by their branch solves.
import { defineMaterial } from '@loopwise/material';
import { branchResponse, trackNotch, trackNotchRepeating } from '@loopwise/notch';
import { referenceHistory } from '../../fixtures/generate.mjs';

const N = 1e7;
const SUBSET = 20000;
// SAE 1045, N. E. Dowling, Mechanical Behavior of Materials, Table 14.1 (via @loopwise/material's handbookSteels).
const material = defineMaterial({ E: 202000, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445, K: 1258, n: 0.208 });

/** Slow path: the same memory model written naively, each reversal solved by the pure rule functions. */
function slowLoops(h, options) {
  const stack = [];
  let dir = 0;
  let ext = 0;
  let extIndex = -1;
  const loops = [];
  const at = (v) => branchResponse(options, stack.length ? stack[stack.length - 1] : null, v);
  const thr = () => (stack.length >= 2 ? stack[stack.length - 2].value : stack.length === 1 ? -stack[0].value : dir * Infinity);
  const closeAll = (x, i) => {
    for (;;) {
      const t = thr();
      if (!(dir > 0 ? x >= t : x <= t)) return;
      if (stack.length >= 2) {
        const b = stack.pop();
        const a = stack.pop();
        loops.push({ start: a.index, turn: b.index, close: i, smax: Math.max(a.stress, b.stress) });
      } else if (stack.length === 1 && x !== t) stack.pop();
      else return;
    }
  };
  for (let i = 0; i < h.length; i++) {
    const x = h[i];
    if (dir === 0) {
      if (x !== ext) {
        dir = x > ext ? 1 : -1;
        ext = x;
        extIndex = i;
      }
      continue;
    }
    if (dir * (x - ext) > 0) {
      ext = x;
      extIndex = i;
      closeAll(x, i);
    } else if (x !== ext) {
      const p = at(ext);
      stack.push({ value: ext, index: extIndex, stress: p.stress, strain: p.strain });
      dir = -dir;
      ext = x;
      extIndex = i;
      closeAll(x, i);
    }
  }
  return loops;
}

function checkSubset(h, check, options, label) {
  const sub = h.subarray(0, SUBSET);
  const fast = trackNotch(sub, options).loops.columns();
  const slow = slowLoops(sub, options);
  check(fast.count.length === slow.length, `${label}: loop count differs from the slow path`);
  for (let i = 0; i < slow.length; i++) {
    const s = slow[i];
    check(fast.startIndex[i] === s.start && fast.turnIndex[i] === s.turn && fast.closeIndex[i] === s.close, `${label}: loop ${i} indices`);
    check(Math.abs(fast.stressMax[i] - s.smax) <= 1e-9 * Math.abs(s.smax) + 1e-9, `${label}: loop ${i} stress ${fast.stressMax[i]} vs ${s.smax}`);
  }
}

export async function run(h) {
  const x = referenceHistory(N);
  const base = h.scanSeconds(x);
  const rows = [];
  const cases = [
    { name: 'Neuber, nominal input, Kt 2.5, repeating (first + stabilised pass)', options: { material, Kt: 2.5, rule: 'neuber' }, target: 8, data: x },
    { name: 'Glinka, nominal input, Kt 2.5, repeating', options: { material, Kt: 2.5, rule: 'glinka' }, target: null, data: x },
    { name: 'local-strain input (history × 1e-5), repeating', options: { material, input: 'local-strain' }, target: null, data: x.map((v) => v * 1e-5) },
  ];
  for (const c of cases) {
    checkSubset(c.data, h.check, c.options, c.name);
    let result;
    const seconds = h.measure(() => (result = trackNotchRepeating(c.data, c.options)));
    const st = result.stabilised;
    h.check(st.residue.length >= 1 && st.loops.length > 0, `${c.name}: no loops`);
    // Every reversal of the block closes in the stabilised pass: two reversals per loop.
    h.check(2 * st.loops.length === st.reversals.length, `${c.name}: reversal and loop counts do not add up`);
    const reversals = result.first.reversals.length + st.reversals.length;
    rows.push({
      figure: `notch/${c.name}, 1e7 samples`,
      ratio: seconds / base,
      baseline: 'minmax-scan',
      baselineSeconds: base,
      seconds,
      sizes: { samples: N, reversalsFirstPass: result.first.reversals.length, loopsStabilised: st.loops.length, largestIndex: result.largestIndex, reusedFirstPass: result.reusedFirstPass },
      nsPerSample: (seconds / N) * 1e9,
      nsPerReversal: (seconds / reversals) * 1e9,
      target: c.target,
    });
  }
  rows.push(againstExp(h, rows[0]));
  return rows;
}

/** The Neuber figure as a ratio to the compute-bound baseline (harness.mjs), measured now. */
function againstExp(h, row) {
  const exp = h.expSeconds(h.expArguments());
  return { ...row, figure: `${row.figure} vs Math.exp`, ratio: row.seconds / exp, baseline: 'math-exp', baselineSeconds: exp, target: null };
}
