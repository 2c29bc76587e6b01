import { LifeSession, type LifeJob } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { describe, expect, test } from 'vitest';
import { LoopSpool } from '../../src/cli/LoopSpool';
import { MemorySpool } from '../../src/cli/MemorySpool';
import { SpoolFile } from '../../src/cli/SpoolFile';
import type { SpoolStore } from '../../src/cli/SpoolStore';
import { mulberry32 } from '../../../../fixtures/generate.mjs';

// LoopSpool keeps the loops of --cycles-out on disk (the command) or in memory (the browser page)
// as a LifeSession hands them over (onLoops);
// the rows it copies out must equal the loop table of a LifeSession with keepLoops, row for row,
// on every route (repeating, one-off with residue half cycles, gate, offset, initial value).
// Histories invented for the test (seeded generator).
/**
 * Local values come from the tracker's solves, converged to 1e-10 relative (its default
 * tolerance, DEFAULT_TRACKER_TOLERANCE); which rows are tracked again in the second pass depends
 * on whether the loops were taken as they closed (the stream, like the engine's running totals)
 * or kept in the table, so their last digits may differ within that tolerance. Lives follow
 * Nf ∝ parameter^(1/b) (|1/b| about 11 for this steel, 1/(2b) for SWT), and a loop in the
 * elastic range adds the solve's own 1e-10: measured here up to 2.1e-9 relative on a loop of
 * 1.5e18 cycles; LIFE_TOLERANCE allows 100 times the local tolerance. Indices, events and
 * counts must agree exactly.
 */
const LOCAL_TOLERANCE = 1e-10;
const LIFE_TOLERANCE = 100 * LOCAL_TOLERANCE;
const steel = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;


function history(n: number, seed: number, scale: number): Float64Array {
  const next = mulberry32(seed);
  const out = new Float64Array(n);
  let x = 0;
  for (let i = 0; i < n; i++) {
    x = 0.9 * x + (next() - 0.5) * scale;
    out[i] = x + 0.3 * scale * Math.sin(i / 50);
  }
  return out;
}

function tableRows(job: LifeJob, h: Float64Array, chunk: number): string {
  const s = new LifeSession(job, { keepLoops: true });
  for (let i = 0; i < h.length; i += chunk) s.push(h.subarray(i, i + chunk));
  const need = s.endFirstPass();
  for (let i = 0; i < need; i += chunk) s.pushSecondPass(h.subarray(i, Math.min(need, i + chunk)));
  const l = s.finish().loops;
  const ev = (e: number) => (e >= 0 ? 'history' : '');
  const lines: string[] = [];
  for (let i = 0; i < l.count.length; i++)
    lines.push(
      `ch,${l.startIndex[i]},${l.turnIndex[i]},${l.closeIndex[i]},${ev(l.startEvent[i])},${ev(l.turnEvent[i])},${l.count[i]},${l.stressMax[i]},${l.stressMin[i]},${l.strainMax[i]},${l.strainMin[i]},${l.parameter[i]},${l.cyclesToFailure[i]},${l.damage[i]}\n`,
    );
  return lines.join('');
}

async function streamRows(job: LifeJob, h: Float64Array, chunk: number, store: SpoolStore): Promise<string> {
  const spool = new LoopSpool(store);
  try {
    const s = new LifeSession(job, { onLoops: spool.sink });
    for (let i = 0; i < h.length; i += chunk) s.push(h.subarray(i, i + chunk));
    const need = s.endFirstPass();
    for (let i = 0; i < need; i += chunk) s.pushSecondPass(h.subarray(i, Math.min(need, i + chunk)));
    s.finish();
    spool.finish(s.reportedLoopRows);
    let text = '';
    await spool.copyTo({ write: async (t: string) => void (text += t) }, 'ch,');
    return text;
  } finally {
    spool.remove();
  }
}

const cases: [string, LifeJob, number][] = [
  ['strain gauge, repeating', { material: steel, input: 'local-strain' }, 0.004],
  ['strain gauge, one-off', { material: steel, input: 'local-strain', repeating: false }, 0.004],
  ['nominal stress with Kt, gate, Morrow', { material: steel, notch: { Kt: 2.2 }, gate: 20, meanStress: 'morrow' }, 300],
  ['nominal stress, Walker, cut-off, offset', { material: steel, notch: { Kt: 1.8 }, meanStress: 'walker', cutoffCycles: 1e6, offset: 40 }, 250],
  ['nominal stress, initial value, one-off, modified Morrow', { material: steel, notch: { Kt: 2 }, initial: -50, repeating: false, meanStress: 'modifiedMorrow' }, 250],
];

const stores: [string, () => SpoolStore][] = [
  ['on disk', () => new SpoolFile('the test loops')],
  ['in memory', () => new MemorySpool()],
];

describe('LoopSpool rows equal the LifeSession loop table (keepLoops)', () => {
  for (const [name, job, scale] of cases) for (const [where, store] of stores) {
    test(`${name}, ${where}`, async () => {
      for (const [seed, n, chunk] of [[1, 20000, 4096], [2, 5000, 333], [3, 70000, 65536]] as const) {
        const h = history(n, seed, scale);
        const want = tableRows(job, h, chunk);
        expect(want.length).toBeGreaterThan(0);
        const got = (await streamRows(job, h, chunk, store())).split('\n');
        const rows = want.split('\n');
        expect(got.length).toBe(rows.length);
        got.forEach((line, i) => {
          const a = line.split(',');
          const b = rows[i].split(',');
          // indices, events and counts exactly; local values and lives within the solves' tolerance
          expect(a.slice(0, 7).join(), `row ${i}`).toBe(b.slice(0, 7).join());
          for (let f = 7; f < 14; f++) {
            if (a[f] === b[f]) continue;
            const x = Number(a[f]);
            const y = Number(b[f]);
            // local values relative to the loop's largest |stress| or |strain| (the solve's scale)
            const scale = f < 9 ? Math.max(Math.abs(Number(b[7])), Math.abs(Number(b[8]))) : f < 11 ? Math.max(Math.abs(Number(b[9])), Math.abs(Number(b[10]))) : Math.abs(y);
            const tolerance = f < 11 ? LOCAL_TOLERANCE : LIFE_TOLERANCE;
            expect(Math.abs(x - y), `row ${i} field ${f}: ${a[f]} vs ${b[f]}`).toBeLessThanOrEqual(tolerance * scale);
          }
        });
      }
    });
  }
});

describe('MemorySpool', () => {
  test('copyRangeTo(sink, start, end) gives the bytes [start, end) of the text across blocks and characters', async () => {
    // Arrange: text with characters of 1 to 4 bytes in UTF-8 (14 bytes a piece), longer than a block of 1 MiB
    const piece = 'a,σ,€,😀\n';
    const store = new MemorySpool();
    const parts: string[] = [];
    for (let i = 0; i < 90000; i++) {
      store.append(piece);
      parts.push(piece);
    }
    const bytes = new TextEncoder().encode(parts.join(''));
    expect(bytes.length).toBeGreaterThan(1 << 20);
    // Act and Assert: ranges that start and end on character boundaries, inside and across blocks
    for (const [start, end] of [[0, bytes.length], [14, 28], [(1 << 20) - 14 * 3, (1 << 20) + 14 * 5]]) {
      const s = Math.floor(start / 14) * 14;
      const e = Math.floor(end / 14) * 14;
      let got = '';
      await store.copyRangeTo({ write: async (t) => void (got += t) }, s, e);
      expect(got).toBe(new TextDecoder().decode(bytes.subarray(s, e)));
    }
  });
});
