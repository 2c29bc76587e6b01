import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { binIndex } from '@loopwise/base';
import { checkProperty } from '../../../test/property';

/** The bin rule read literally: the first i with e[i] <= v < e[i+1], the last bin closed. */
function linearBin(edges: number[], v: number): number {
  for (let i = 0; i + 1 < edges.length; i++) {
    const last = i + 2 === edges.length;
    if (edges[i] <= v && (v < edges[i + 1] || (last && v === edges[i + 1]))) return i;
  }
  return -1;
}

const increasingEdges = fc
  .uniqueArray(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 0, maxLength: 30, comparator: (a, b) => a === b })
  .map((a) => a.sort((x, y) => x - y));

describe('binIndex(edges, v)', () => {
  test('binIndex puts a value on an inner edge in the bin above and the top edge in the last bin', () => {
    const e = Float64Array.of(0, 1, 2, 3);
    expect([0, 0.5, 1, 2.999, 3].map((v) => binIndex(e, v))).toEqual([0, 0, 1, 2, 2]);
    expect([-1e-300, 3.0000000000000004, -Infinity, Infinity].map((v) => binIndex(e, v))).toEqual([-1, -1, -1, -1]);
  });

  test('binIndex(edges, NaN) and binIndex with fewer than two edges are -1', () => {
    expect(binIndex([0, 1], NaN)).toBe(-1);
    expect(binIndex([], 0)).toBe(-1);
    expect(binIndex([5], 5)).toBe(-1);
  });

  test('binIndex treats -0 as 0', () => {
    expect(binIndex([0, 1], -0)).toBe(0);
    expect(binIndex([-1, -0], 0)).toBe(0);
  });

  test('binIndex equals the literal bin rule for any increasing edges and value', () => {
    checkProperty(
      'binIndex = linear scan',
      fc.property(
        increasingEdges.chain((e) =>
          fc.tuple(fc.constant(e), fc.oneof(fc.double({ min: -2e6, max: 2e6 }), e.length ? fc.constantFrom(...e) : fc.constant(0))),
        ),
        ([edges, v]) => {
          expect(binIndex(edges, v)).toBe(linearBin(edges, v));
          expect(binIndex(Float64Array.from(edges), v)).toBe(linearBin(edges, v));
        },
      ),
      { numRuns: 3000 },
    );
  });
});
