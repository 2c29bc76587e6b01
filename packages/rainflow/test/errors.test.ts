import { describe, expect, test } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import {
  BinError,
  CounterStateError,
  InvalidOptionError,
  NonFiniteSampleError,
  RainflowCounter,
  RangeOverflowError,
  ReversalFilter,
  rainflow,
  turningPoints,
} from '@loopwise/rainflow';

/** The error a call throws (fails when it throws nothing). */
function thrown(f: () => unknown): LoopwiseError {
  try {
    f();
  } catch (e) {
    return e as LoopwiseError;
  }
  throw new Error('expected a throw');
}

describe('rainflow errors', () => {
  test('every rainflow error is a LoopwiseError of @loopwise/base, named after its class', () => {
    const cases: [LoopwiseError, string, string][] = [
      [new NonFiniteSampleError(3, NaN), 'NonFiniteSampleError', 'non-finite-sample'],
      [new InvalidOptionError('gate', -1, 'must be >= 0'), 'InvalidOptionError', 'invalid-option'],
      [new RangeOverflowError(1, 2, 1e308, -1e308), 'RangeOverflowError', 'range-overflow'],
      [new CounterStateError('counter', 'finished', 'finished'), 'CounterStateError', 'counter-state'],
      [new BinError('range', [], 'needs at least two edges'), 'BinError', 'invalid-bins'],
    ];
    for (const [e, name, code] of cases) {
      expect(e).toBeInstanceOf(LoopwiseError);
      expect(e).toBeInstanceOf(Error);
      expect([e.name, e.code]).toEqual([name, code]);
    }
  });

  test('NonFiniteSampleError names the field history, the sample and its index in the whole history', () => {
    const e = thrown(() => new RainflowCounter({ startIndex: 100 }).push([0, 1, -Infinity]));
    expect(e).toBeInstanceOf(NonFiniteSampleError);
    expect(e).toMatchObject({ code: 'non-finite-sample', field: 'history', value: -Infinity, index: 102 });
    expect(e.message).toBe('sample 102 is -Infinity: histories must hold finite numbers only');
    expect(thrown(() => turningPoints([0, NaN], { gateFraction: 0.5 }))).toMatchObject({ field: 'history', index: 1 });
  });

  test('InvalidOptionError names the option and the value, -0 and NaN written exactly', () => {
    const e = thrown(() => rainflow([0, 1], { gate: NaN }));
    expect(e).toMatchObject({ code: 'invalid-option', field: 'gate', index: undefined });
    expect(e.value).toBeNaN();
    expect(e.message).toBe('option gate = NaN is invalid: must be a finite number >= 0');
    expect(thrown(() => new ReversalFilter({ startIndex: -0.5 }))).toMatchObject({ field: 'startIndex', value: -0.5 });
    expect(thrown(() => new RainflowCounter({ residue: 'halves' as never })).message).toBe(
      `option residue = "halves" is invalid: must be 'half', 'repeat' or 'none'`,
    );
  });

  test('CounterStateError names what is wrong: the finished counter, the appended segment, the saved state', () => {
    const c = new RainflowCounter().push([0, 1]);
    c.finish();
    expect(thrown(() => c.push([2]))).toMatchObject({ code: 'counter-state', field: 'counter', value: 'finished' });
    const a = new RainflowCounter().push([0, 1]);
    expect(thrown(() => a.append(new RainflowCounter({ startIndex: 5 })))).toMatchObject({ field: 'startIndex', value: 5 });
    expect(thrown(() => a.append(new RainflowCounter({ startIndex: 2, gate: 1 })))).toMatchObject({ field: 'gate', value: 1 });
    const state = new RainflowCounter().push([0, 2, 1]).toJSON();
    expect(thrown(() => RainflowCounter.fromJSON({ ...state, format: 'x' } as never))).toMatchObject({ field: 'format', value: 'x' });
    expect(thrown(() => RainflowCounter.fromJSON({ ...state, version: 3 } as never))).toMatchObject({ field: 'version', value: 3 });
    expect(thrown(() => RainflowCounter.fromJSON({ ...state, stackIndices: [] }))).toMatchObject({ field: 'stackIndices', value: 0 });
  });

  test('a saved state with a number that is not encoded throws the codec error of @loopwise/base, naming the field', () => {
    const state = JSON.parse(JSON.stringify(new RainflowCounter().push([0, 2, 1, 3]).toJSON()));
    state.stackValues[1] = null; // what plain JSON makes of Infinity
    expect(thrown(() => RainflowCounter.fromJSON(state))).toMatchObject({ code: 'invalid-encoded-number', field: 'stackValues', index: 1, value: null });
  });
});

describe('issue 15: every range that overflows a double, and wrong types, are documented errors', () => {
  test('rainflow([-1.7e308, 1.7e308]) throws RangeOverflowError under every residue policy, and so does RainflowCounter', async () => {
    const { rainflow, RainflowCounter, RangeOverflowError } = await import('@loopwise/rainflow');
    for (const residue of ['half', 'repeat', 'none'] as const) {
      expect(() => rainflow([-1.7e308, 1.7e308], { residue })).toThrow(RangeOverflowError);
      expect(() => rainflow([0, -1.7e308, 1.7e308, 0], { residue })).toThrow(RangeOverflowError);
      expect(() => new RainflowCounter({ residue }).push([-1.7e308]).push([1.7e308]).finish()).toThrow(RangeOverflowError);
    }
  });

  test('a pair that forms only after a close overflows: -1e308, 0.7e308, 0.6e308, 0.8e308 (a to d is 1.8e308)', async () => {
    const { rainflow, RangeOverflowError } = await import('@loopwise/rainflow');
    expect(() => rainflow([-1e308, 0.7e308, 0.6e308, 0.8e308, 0], { residue: 'none' })).toThrow(RangeOverflowError);
  });

  test('the repeating seam overflows: [-1.7e308, 0, 1.7e308] under residue repeat; gateFraction over a history whose max - min overflows', async () => {
    const { rainflow, RangeOverflowError } = await import('@loopwise/rainflow');
    expect(() => rainflow([-1.7e308, 0, 1.7e308], { residue: 'repeat' })).toThrow(RangeOverflowError);
    expect(() => rainflow([-1.7e308, 1.7e308], { gateFraction: 0.1 })).toThrow(RangeOverflowError);
  });

  test('rainflow(null), rainflow(h, null), BigInt and string samples, gate "1" and unknown fields are documented errors, never a TypeError', async () => {
    const { rainflow, RainflowCounter, turningPoints, levelCrossings } = await import('@loopwise/rainflow');
    const bad = (f: () => unknown, code: string, field?: string) => {
      try {
        f();
      } catch (e) {
        expect(e).toBeInstanceOf(LoopwiseError);
        expect((e as LoopwiseError).code).toBe(code);
        if (field !== undefined) expect((e as LoopwiseError).field).toBe(field);
        return;
      }
      throw new Error('did not throw');
    };
    bad(() => rainflow(null as never), 'invalid-option', 'history');
    bad(() => rainflow(5 as never), 'invalid-option', 'history');
    bad(() => rainflow([1, 2], null as never), 'invalid-option', 'options');
    bad(() => rainflow(BigInt64Array.of(1n, 2n) as never), 'invalid-option', 'history');
    bad(() => rainflow([1, 2n, 3] as never), 'non-finite-sample', 'history');
    bad(() => rainflow([1, '2', 3] as never), 'non-finite-sample', 'history');
    bad(() => rainflow([1, null, 3] as never), 'non-finite-sample', 'history');
    bad(() => rainflow([1, 2], { gate: '1' } as never), 'invalid-option', 'gate');
    bad(() => rainflow([1, 2], { resdue: 'none' } as never), 'invalid-option', 'resdue');
    expect(() => rainflow([1, 2], { resdue: 'none' } as never)).toThrow("did you mean 'residue'?");
    bad(() => new RainflowCounter({ gat: 1 } as never), 'invalid-option', 'gat');
    bad(() => new RainflowCounter({ gate: '1' } as never), 'invalid-option', 'gate');
    bad(() => new RainflowCounter().push(undefined as never), 'invalid-option', 'history');
    bad(() => turningPoints([1, 2], { gateFractoin: 0.1 } as never), 'invalid-option', 'gateFractoin');
    bad(() => levelCrossings([1, 2], null as never), 'invalid-option', 'history');
  });
});

describe('issue 15: the overflow check after a resume and an append', () => {
  test('a counter resumed from JSON with -1.7e308 on its stack still throws when a later point overflows against it', async () => {
    const { RainflowCounter, RangeOverflowError } = await import('@loopwise/rainflow');
    const c = new RainflowCounter({ residue: 'none' }).push([-1.7e308, 0]);
    const resumed = RainflowCounter.fromJSON(JSON.parse(JSON.stringify(c.toJSON())));
    expect(() => resumed.push([1e307, -1e307, 1.5e307]).finish()).toThrow(RangeOverflowError);
    const a = new RainflowCounter({ residue: 'none' }).push([-1.7e308, 0]);
    const b = new RainflowCounter({ residue: 'none', startIndex: 2 }).push([1e307, -1e307, 1.5e307]);
    expect(() => a.append(b).finish()).toThrow(RangeOverflowError);
  });
});
