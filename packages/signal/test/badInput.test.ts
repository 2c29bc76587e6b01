// Every public entry point on NaN, ±Infinity, empty, one sample and a constant history: a clear
// error naming the sample index, or a defined result.
import { describe, expect, it } from 'vitest';
import { conditionSignal, decimatePeaks, excludeRanges, removeOffset, removeSpikes, scanSignal, splitAtDropouts, zeroPhaseLowPass, FindingTable, SignalError } from '@loopwise/signal';
import { LoopwiseError } from '@loopwise/base';

const entries: [string, (x: number[]) => unknown][] = [
  ['scanSignal', (x) => scanSignal(x)],
  ['removeSpikes', (x) => removeSpikes(x, [])],
  ['excludeRanges', (x) => excludeRanges(x, [])],
  ['splitAtDropouts', (x) => splitAtDropouts(x, new FindingTable())],
  ['removeOffset', (x) => removeOffset(x)],
  ['zeroPhaseLowPass', (x) => zeroPhaseLowPass(x, { cutoff: 1, sampleRate: 10 })],
  ['decimatePeaks', (x) => decimatePeaks(x)],
  ['conditionSignal', (x) => conditionSignal(x, { lowPass: { cutoff: 1, sampleRate: 10 } })],
];

describe('bad input at every entry point', () => {
  for (const [name, call] of entries) {
    it(`${name} rejects NaN, Infinity and -Infinity naming the sample index`, () => {
      for (const bad of [NaN, Infinity, -Infinity])
        for (const at of [0, 3, 9]) {
          const x = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
          x[at] = bad;
          let error: unknown;
          try {
            call(x);
          } catch (e) {
            error = e;
          }
          expect(error).toBeInstanceOf(SignalError);
          expect(error).toBeInstanceOf(LoopwiseError);
          expect(error).toEqual(expect.objectContaining({ code: 'non-finite-sample', index: at, field: 'history' }));
        }
    });

    it(`${name} gives a defined result for empty, one-sample and constant histories`, () => {
      for (const x of [[], [4], [4, 4, 4, 4, 4]]) expect(() => call(x)).not.toThrow();
    });
  }

  it('rejects a history that is not array-like', () => {
    for (const [, call] of entries) expect(() => call(42 as never)).toThrow(SignalError);
  });
});
