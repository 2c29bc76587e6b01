// conditionSignal against its definition: the separate steps scanSignal → removeSpikesInto →
// zeroPhaseLowPassInto, compared exactly (same findings, records and every output bit). The
// histories are generated (invented data, seeded).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { conditionSignal, conditionSignalInto, removeSpikesInto, scanSignal, zeroPhaseLowPassInto, type SignalScanOptions, type ZeroPhaseLowPassOptions } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

/** The separate steps, as a caller writes them. */
function separately(x: ArrayLike<number>, checks: SignalScanOptions | undefined, lowPass: ZeroPhaseLowPassOptions) {
  const scan = scanSignal(x, checks);
  const values = new Float64Array(x.length);
  const spikes = removeSpikesInto(x, scan.findings, values);
  const { design, correction } = zeroPhaseLowPassInto(values, values, lowPass);
  return { scan, spikes, design, lowPass: correction, values };
}

/** A generated history: a sine and seeded noise, with spikes (single, adjacent, at the ends), a dropout and a stuck run. */
function history(n: number, seed: number, spikeAt: number[], height: number): Float64Array {
  let s = seed >>> 0;
  const rnd = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32) - 0.5;
  const x = Float64Array.from({ length: n }, (_, i) => 50 * Math.sin(i / 37) + 5 * rnd());
  for (const a of spikeAt) x[a % n] += (a % 2 ? 1 : -1) * height;
  if (n > 900) x.fill(0, 500, 640);
  if (n > 1400) x.fill(x[1200], 1200, 1320);
  return x;
}

const expectSame = (got: ReturnType<typeof conditionSignal>, want: ReturnType<typeof separately>) => {
  expect(got.scan.findings.toArray()).toEqual(want.scan.findings.toArray());
  expect({ ...got.scan, findings: undefined }).toEqual({ ...want.scan, findings: undefined });
  expect(got.spikes).toEqual(want.spikes);
  expect(got.design).toEqual(want.design);
  expect(got.lowPass).toEqual(want.lowPass);
  // exactly, sample by sample (Object.is: the same double, -0 included)
  for (let i = 0; i < want.values.length; i++) if (!Object.is(got.values[i], want.values[i])) expect([i, got.values[i]]).toEqual([i, want.values[i]]);
};

describe('conditionSignal(history, { checks, lowPass })', () => {
  it('equals scanSignal, removeSpikesInto and zeroPhaseLowPassInto in turn, to the last bit (property)', () => {
    checkProperty(
      'conditionSignal = the separate steps',
      fc.property(
        fc.integer({ min: 0, max: 6000 }),
        fc.integer(),
        fc.array(fc.nat(), { maxLength: 12 }),
        fc.record({ order: fc.integer({ min: 1, max: 5 }), cutoff: fc.integer({ min: 1, max: 400 }), padLength: fc.option(fc.integer({ min: 0, max: 700 }), { nil: undefined }) }),
        fc.constantFrom<SignalScanOptions | undefined>(undefined, { clipping: false, offset: false, drift: false }, { spikes: { blockLength: 256 } }, { spikes: false }),
        (n, seed, picks, f, checks) => {
          // Arrange: spikes where picked, and at both ends; two or three of the same sign two samples apart make a run of three or five (the sample between is flagged too)
          const at = picks.flatMap((p) => (p % 3 === 0 ? [p] : p % 3 === 1 ? [p, p + 2] : [p, p + 2, p + 4])).concat([1, n - 2]);
          const x = history(n, seed, at, 4000);
          const lowPass = { cutoff: f.cutoff, sampleRate: 1000, order: f.order, ...(f.padLength === undefined ? {} : { padLength: f.padLength }) };
          // Act
          const want = separately(x, checks, lowPass);
          const got = conditionSignal(x, { checks, lowPass });
          // Assert
          expectSame(got, want);
        },
      ),
      { seed: 42, numRuns: 150 },
    );
  });

  it('finds and removes the spikes the scan finds: the record names them', () => {
    const x = history(20000, 7, [3001, 9000, 9002, 15555], 5000);
    const c = conditionSignal(x, { checks: { spikes: {}, stuckRuns: {}, clipping: false, offset: false, drift: false }, lowPass: { cutoff: 100, sampleRate: 1000 } });
    expect(Array.from(c.scan.findings.select('spike').columns().index)).toEqual([3001, 9000, 9001, 9002, 15555]);
    expect(Array.from(c.spikes.first)).toEqual([3001, 9000, 15555]);
    expect(Array.from(c.spikes.length)).toEqual([1, 3, 1]);
    expect(c.scan.findings.select('zero-run', 'stuck-run').toArray().map((r) => [r.code, r.index, r.length])).toEqual([
      ['zero-run', 500, 140],
      ['stuck-run', 1200, 120],
    ]);
    for (const i of [3001, 9000, 9001, 9002, 15555]) expect(Math.abs(c.values[i] - 50 * Math.sin(i / 37))).toBeLessThan(10);
  });

  it('conditionSignalInto(history, history, options) corrects in place with the same result', () => {
    const x = history(5001, 3, [100, 2500, 2501, 4999], 3000);
    const want = separately(x, undefined, { cutoff: 30, sampleRate: 1000, order: 3 });
    const got = conditionSignalInto(x, x, { lowPass: { cutoff: 30, sampleRate: 1000, order: 3 } });
    expectSame({ ...got, values: x }, want);
  });

  it('works on plain arrays, empty, one-sample and constant histories', () => {
    const lowPass = { cutoff: 1, sampleRate: 10 };
    for (const x of [[], [4], [4, 4, 4, 4, 4], [0, 1, 50, 3, 4, 5, 6, 7, 8, 9]]) expectSame(conditionSignal(x, { lowPass }), separately(x, undefined, lowPass));
  });

  it('rejects NaN and ±Infinity naming the sample index, before `out` is written', () => {
    for (const bad of [NaN, Infinity, -Infinity])
      for (const at of [0, 3, 9]) {
        const x = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
        x[at] = bad;
        const out = new Float64Array(10).fill(-1);
        expect(() => conditionSignalInto(x, out, { lowPass: { cutoff: 1, sampleRate: 10 } })).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: at, field: 'history' }));
        expect(out.every((v) => v === -1)).toBe(true);
      }
  });

  it('rejects a missing low-pass, unknown options, bad filter options and a wrong `out`', () => {
    expect(() => conditionSignal([1, 2, 3], {} as never)).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'lowPass' }));
    expect(() => conditionSignal([1, 2, 3], { lowPass: { cutoff: 1, sampleRate: 10 }, filter: {} } as never)).toThrow(expect.objectContaining({ code: 'unknown-option', field: 'options.filter' }));
    expect(() => conditionSignal([1, 2, 3], { lowPass: { cutoff: 6, sampleRate: 10 } })).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'cutoff' }));
    expect(() => conditionSignal([1, 2, 3], { checks: { spikes: { factor: -1 } }, lowPass: { cutoff: 1, sampleRate: 10 } })).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'spikes.factor' }));
    expect(() => conditionSignalInto([1, 2, 3], new Float64Array(2), { lowPass: { cutoff: 1, sampleRate: 10 } })).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'out' }));
    expect(() => conditionSignal(42 as never, { lowPass: { cutoff: 1, sampleRate: 10 } })).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'history' }));
  });

  it('refuses bad low-pass options before it reads a sample (no scan is wasted on them)', () => {
    // a history that counts its reads: every index access goes through the getter
    let reads = 0;
    const n = 1000;
    const counted = new Proxy({ length: n } as ArrayLike<number>, {
      get: (t, k) => {
        if (k === 'length') return n;
        if (typeof k === 'string' && /^[0-9]+$/.test(k)) reads++;
        return typeof k === 'string' && /^[0-9]+$/.test(k) ? Math.sin(Number(k)) : Reflect.get(t, k);
      },
    });
    const out = new Float64Array(n);
    for (const lowPass of [{ cutoff: 6, sampleRate: 10 }, { cutoff: 1, sampleRate: 10, order: 0 }, { cutoff: 1, sampleRate: 10, padLength: -1 }, { cutoff: 1, sampleRate: 10, ripple: 1 }]) {
      expect(() => conditionSignalInto(counted, out, { lowPass } as never)).toThrow(expect.objectContaining({ code: expect.stringMatching(/invalid-option|unknown-option/) }));
    }
    expect(reads).toBe(0);
    // with good options the same history is read (the counter works)
    conditionSignalInto(counted, out, { lowPass: { cutoff: 1, sampleRate: 10 } });
    expect(reads).toBeGreaterThan(0);
  });
});
