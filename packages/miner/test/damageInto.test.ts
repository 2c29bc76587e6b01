import { describe, expect, test } from 'vitest';
import { damageInto } from '@loopwise/miner';

describe('damageInto(counts, cyclesToFailure, out, {cutoff?})', () => {
  test('damageInto writes count / Nf per row into the caller-owned out (the TSDoc example)', () => {
    const out = new Float64Array(4).fill(7);
    const r = damageInto(Float64Array.of(1, 0.5, 1), Float64Array.of(1000, 1000, Infinity), out);
    expect(r).toBe(out);
    expect(Array.from(out)).toEqual([0.001, 0.0005, 0, 7]);
  });

  test('damageInto applies the cut-off, rejects a short out, tiny lives that overflow and bad policies', () => {
    expect(Array.from(damageInto([1, 1], [10, 11], new Float64Array(2), { cutoff: { cycles: 10 } }))).toEqual([0.1, 0]);
    expect(() => damageInto([1, 1], [1, 1], new Float64Array(1))).toThrow(expect.objectContaining({ field: 'out.length' }));
    expect(() => damageInto([1], [1e-320], new Float64Array(1))).toThrow(expect.objectContaining({ code: 'invalid-life', index: 0 }));
    expect(() => damageInto([1], [1], new Float64Array(1), { cutoff: { cycles: 0 } })).toThrow(expect.objectContaining({ code: 'invalid-cutoff', field: 'cutoff.cycles' }));
    expect(() => damageInto([1], [1], new Float64Array(1), { cutoff: 'never' as never })).toThrow(expect.objectContaining({ code: 'invalid-cutoff' }));
  });
});
