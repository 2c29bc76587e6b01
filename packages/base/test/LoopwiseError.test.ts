import { describe, expect, test } from 'vitest';
import { describeValue, LoopwiseError } from '@loopwise/base';

class GateError extends LoopwiseError {
  constructor(value: number) {
    super('invalid-option', 'gate', value, `option gate = ${describeValue(value)} is invalid: must be >= 0`);
  }
}

describe('new LoopwiseError(code, field, value, message, index)', () => {
  test('new LoopwiseError(...) keeps code, field, value, message and index as given', () => {
    const e = new LoopwiseError('non-finite-sample', 'history', NaN, 'sample 3 is NaN', 3);
    expect(e).toBeInstanceOf(Error);
    expect(e.name).toBe('LoopwiseError');
    expect([e.code, e.field, e.message, e.index]).toEqual(['non-finite-sample', 'history', 'sample 3 is NaN', 3]);
    expect(e.value).toBeNaN();
    expect(new LoopwiseError('x', 'f', undefined, 'm').index).toBeUndefined();
  });

  test('a package\'s subclass is a LoopwiseError named after itself, and instanceof tells them apart', () => {
    const e = new GateError(-0);
    expect(e).toBeInstanceOf(LoopwiseError);
    expect(e).toBeInstanceOf(GateError);
    expect(e.name).toBe('GateError');
    expect(e.message).toBe('option gate = -0 is invalid: must be >= 0');
    expect(Object.is(e.value, -0)).toBe(true);
    expect(String(e)).toBe('GateError: option gate = -0 is invalid: must be >= 0');
    expect(new LoopwiseError('c', 'f', 1, 'm')).not.toBeInstanceOf(GateError);
  });
});

describe('describeValue(value)', () => {
  test('describeValue(number) writes -0, NaN and ±Infinity as JavaScript does', () => {
    expect([-0, 0, NaN, Infinity, -Infinity, 1.5e-300].map(describeValue)).toEqual(['-0', '0', 'NaN', 'Infinity', '-Infinity', '1.5e-300']);
  });

  test('describeValue(string) quotes it; undefined, null, booleans, bigints and symbols read as themselves', () => {
    expect(describeValue('half')).toBe('"half"');
    expect(describeValue('')).toBe('""');
    expect(describeValue(undefined)).toBe('undefined');
    expect(describeValue(null)).toBe('null');
    expect(describeValue(true)).toBe('true');
    expect(describeValue(10n)).toBe('10');
    expect(describeValue(Symbol('s'))).toBe('Symbol(s)');
  });

  test('describeValue(array, typed array or object) is JSON whose numbers stay exact', () => {
    // plain JSON would write [null,0] here
    expect(JSON.stringify([NaN, -0])).toBe('[null,0]');
    expect(describeValue([NaN, -0])).toBe('[NaN,-0]');
    expect(describeValue([1, -Infinity, 'a'])).toBe('[1,-Infinity,"a"]');
    expect(describeValue(Float64Array.of(0.5, -0, Infinity))).toBe('[0.5,-0,Infinity]');
    expect(describeValue({ E: NaN, n: 1.2, name: 'x' })).toBe('{"E":NaN,"n":1.2,"name":"x"}');
    expect(describeValue({ cycles: { from: [Infinity] } })).toBe('{"cycles":{"from":[Infinity]}}');
  });

  test('describeValue(long array) shows 20 elements and the length', () => {
    const text = describeValue(new Float64Array(1_000_000));
    expect(text).toBe(`[${new Array(20).fill(0).join(',')},… (1000000 elements)]`);
  });

  test('describeValue of what JSON cannot write falls back to String', () => {
    const cyclic: Record<string, unknown> = {};
    cyclic.self = cyclic;
    expect(describeValue(cyclic)).toBe('[object Object]');
    expect(describeValue([1n])).toBe('1');
  });
});
