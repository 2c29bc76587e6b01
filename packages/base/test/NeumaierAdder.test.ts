import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { NeumaierAdder, neumaierSum } from '@loopwise/base';
import { checkProperty } from '../../../test/property';
import { exactSum } from './support/exactSum';

const adderSum = (terms: ArrayLike<number>): number => {
  const a = new NeumaierAdder();
  for (let i = 0; i < terms.length; i++) a.add(terms[i]);
  return a.valueOf();
};

const plainSum = (terms: ArrayLike<number>): number => {
  let s = 0;
  for (let i = 0; i < terms.length; i++) s += terms[i];
  return s;
};

/**
 * Sums whose exact value is known without wide arithmetic: small integers (their exact sum is
 * their plain sum, below 2^53), with bursts [h, small integers…, −h] inserted between them, h a
 * double of magnitude 2^70 … 2^1000. Inside a burst every partial sum rounds to h, so the plain
 * sum loses everything added before and inside the burst, while each rounding error is exactly
 * the small term it swallowed: Neumaier's sum must return the small integers' sum exactly.
 */
const cancellingSum = fc
  .tuple(
    fc.array(fc.integer({ min: -1000, max: 1000 }), { maxLength: 30 }),
    fc.array(
      fc.tuple(
        fc.nat(),
        fc.double({ min: 2 ** 70, max: 2 ** 1000, noNaN: true }),
        fc.boolean(),
        fc.array(fc.integer({ min: -1000, max: 1000 }), { maxLength: 5 }),
      ),
      { maxLength: 4 },
    ),
  )
  .map(([small, bursts]) => {
    // each burst goes whole into a gap between the small integers, never inside another burst
    const slots: number[][] = Array.from({ length: small.length + 1 }, () => []);
    let exact = small.reduce((a, b) => a + b, 0);
    for (const [at, h, negative, inside] of bursts) {
      const big = negative ? -h : h;
      slots[at % slots.length].push(big, ...inside, -big);
      exact += inside.reduce((a, b) => a + b, 0);
    }
    const terms = slots.flatMap((burst, i) => (i < small.length ? [...burst, small[i]] : burst));
    return { terms, exact };
  });

describe('new NeumaierAdder().add(x)…valueOf() and neumaierSum(x, from, to)', () => {
  test('neumaierSum([1, 1e100, 1, -1e100]) is 2, where the plain sum is 0', () => {
    // a large term that cancels later, between small ones: the case Neumaier's branch on the
    // larger term is for (common practice, no source for the particular numbers; Kahan's
    // compensation without the branch also gives 0 on this order)
    expect(plainSum([1, 1e100, 1, -1e100])).toBe(0);
    expect(neumaierSum([1, 1e100, 1, -1e100])).toBe(2);
    expect(new NeumaierAdder().add(1).add(1e100).add(1).add(-1e100).valueOf()).toBe(2);
    expect(neumaierSum([1e100, 1, -1e100, 1])).toBe(2);
  });

  test('neumaierSum returns the exact sum of small integers with cancelling large bursts', () => {
    checkProperty(
      'exact under cancellation',
      fc.property(cancellingSum, ({ terms, exact }) => {
        // Act
        const a = neumaierSum(terms);
        const b = adderSum(terms);
        // Assert
        expect(a).toBe(exact);
        expect(b).toBe(exact);
      }),
      { numRuns: 1000 },
    );
  });

  test('neumaierSum is not exact when two large terms of different size are open at once (the documented limit)', () => {
    // exact sum 1: the rounding error of 1e100 + 1.234e99 (about 1e84) swallows the 1 in c
    const terms = [1e100, 1.234e99, 1, -1e100, -1.234e99];
    expect(exactSum(terms)).toBe(1);
    expect(neumaierSum(terms)).toBe(0);
  });

  test('neumaierSum stays within the bound u·|S| + γ(n−1)²·Σ|xᵢ| of the exact sum S', () => {
    // Bound of Ogita, Rump and Oishi, SIAM J. Sci. Comput. 26(6) (2005), for their Sum2, which
    // accumulates the same exact errors (bound quoted from memory; checked here with a 2x margin).
    // The exact sum comes from Shewchuk's exact partials (test/support/exactSum.ts).
    const u = 2 ** -53;
    checkProperty(
      'error bound',
      fc.property(
        fc.array(fc.double({ min: -1e30, max: 1e30, noNaN: true, noDefaultInfinity: true }), { minLength: 1, maxLength: 60 }),
        (terms) => {
          const n = terms.length;
          const gamma = ((n - 1) * u) / (1 - (n - 1) * u);
          let abs = 0;
          for (const x of terms) abs += Math.abs(x);
          const got = neumaierSum(terms);
          const S = exactSum(terms);
          const error = Math.abs(exactSum([...terms, -got]));
          expect(error).toBeLessThanOrEqual(2 * (u * Math.abs(S) + gamma * gamma * abs) + Number.MIN_VALUE);
        },
      ),
      { numRuns: 2000 },
    );
  });

  test('new NeumaierAdder() and neumaierSum give the same double for any terms, non-finite included', () => {
    checkProperty(
      'adder = neumaierSum',
      fc.property(fc.array(fc.double(), { maxLength: 30 }), (terms) => {
        expect(Object.is(adderSum(terms), neumaierSum(terms))).toBe(true);
      }),
      { numRuns: 1000 },
    );
  });

  test('neumaierSum(x, from, to) sums the slice from … to − 1', () => {
    const x = [1e100, 1, 2, -1e100, 3];
    expect(neumaierSum(x, 1, 3)).toBe(3);
    expect(neumaierSum(x, 0, 4)).toBe(3);
    expect(neumaierSum(x, 4)).toBe(3);
    expect(neumaierSum(x, 2, 2)).toBe(0);
  });

  test('no terms give 0; -0 terms give 0', () => {
    expect(Object.is(neumaierSum([]), 0)).toBe(true);
    expect(Object.is(new NeumaierAdder().valueOf(), 0)).toBe(true);
    expect(Object.is(neumaierSum([-0, -0]), 0)).toBe(true);
  });

  test('non-finite terms give the plain sum: Infinity stays Infinity, ∞ − ∞ and NaN give NaN', () => {
    // as documented in NeumaierAdder: the compensation would turn an infinite sum into NaN
    expect(neumaierSum([1, Infinity, 2])).toBe(Infinity);
    expect(neumaierSum([-Infinity, 1e300])).toBe(-Infinity);
    expect(neumaierSum([Infinity, -Infinity])).toBeNaN();
    expect(neumaierSum([1, NaN, 1])).toBeNaN();
    expect(new NeumaierAdder().add(Infinity).add(1).valueOf()).toBe(Infinity);
    expect(new NeumaierAdder().add(NaN).valueOf()).toBeNaN();
  });

  test('finite terms whose partial sum overflows give ±Infinity, as the plain sum does', () => {
    const big = Number.MAX_VALUE;
    expect(neumaierSum([big, big])).toBe(Infinity);
    expect(neumaierSum([big, big, -big])).toBe(Infinity);
    expect(neumaierSum([-big, -big])).toBe(-Infinity);
    expect(neumaierSum([big, -big, big])).toBe(big);
  });

  test('valueOf() does not change the sum: terms added afterwards continue it', () => {
    const a = new NeumaierAdder().add(1e100).add(1);
    const first = a.valueOf();
    expect(a.valueOf()).toBe(first);
    expect(a.add(-1e100).valueOf()).toBe(1);
  });

  test('a million damages of 1e-12 beside 1e-3 add up like the exact sum', () => {
    // the case named in the class comment: exact value 1e-3 + 1e6 · 1e-12 = 1.000001e-3
    const a = new NeumaierAdder().add(1e-3);
    let plain = 1e-3;
    for (let i = 0; i < 1e6; i++) {
      a.add(1e-12);
      plain += 1e-12;
    }
    const exact = exactSum([1e-3, ...new Array<number>(1e6).fill(1e-12)]);
    expect(Math.abs(a.valueOf() - exact)).toBeLessThanOrEqual(2 ** -52 * exact);
    expect(Math.abs(plain - exact)).toBeGreaterThan(1e3 * 2 ** -52 * exact); // the plain sum drifts
  });
});
