import { describe, expect, test } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import {
  CutoffTally,
  MinerError,
  MinerSum,
  damageByEvent,
  damageByRangeBin,
  damageFromMatrix,
  damageTimeline,
  equivalentRange,
  lifeFromDamage,
  mostDamagingLoops,
  residueHalfCycles,
  sumDamage,
} from '@loopwise/miner';

// Every public entry point against bad input: a MinerError with a stable code naming the field
// and the value it got. Never a NaN result.
const cases: [string, () => unknown, string, string, unknown][] = [
  ['addCycles NaN count', () => new MinerSum().addCycles(NaN, 10, 0, 1), 'invalid-count', 'count', NaN],
  ['addCycles Infinity count', () => new MinerSum().addCycles(Infinity, 10, 0, 1), 'invalid-count', 'count', Infinity],
  ['addCycles negative count', () => new MinerSum().addCycles(-1, 10, 0, 1), 'invalid-count', 'count', -1],
  ['addCycles NaN life', () => new MinerSum().addCycles(1, NaN, 0, 1), 'invalid-life', 'cyclesToFailure', NaN],
  ['addCycles zero life', () => new MinerSum().addCycles(1, 0, 0, 1), 'invalid-life', 'cyclesToFailure', 0],
  ['addCycles negative life', () => new MinerSum().addCycles(1, -5, 0, 1), 'invalid-life', 'cyclesToFailure', -5],
  ['addCycles -Infinity life', () => new MinerSum().addCycles(1, -Infinity, 0, 1), 'invalid-life', 'cyclesToFailure', -Infinity],
  ['addReversals zero reversals', () => new MinerSum().addReversals(1, 0, 0, 1), 'invalid-life', 'reversalsToFailure', 0],
  ['addCycles negative index', () => new MinerSum().addCycles(1, 10, -1, 1), 'invalid-index', 'startIndex', -1],
  ['addCycles fractional index', () => new MinerSum().addCycles(1, 10, 0, 1.5), 'invalid-index', 'turnIndex', 1.5],
  ['addCycles NaN index', () => new MinerSum().addCycles(1, 10, NaN, 1), 'invalid-index', 'startIndex', NaN],
  ['addCycles Infinity range', () => new MinerSum().addCycles(1, 10, 0, 1, Infinity), 'invalid-range', 'range', Infinity],
  ['addCycles negative range', () => new MinerSum().addCycles(1, 10, 0, 1, -3), 'invalid-range', 'range', -3],
  ['addSum zero repeats', () => new MinerSum().addSum(new MinerSum(), 0), 'invalid-repeats', 'repeats', 0],
  ['addSum negative repeats', () => new MinerSum().addSum(new MinerSum(), -2), 'invalid-repeats', 'repeats', -2],
  ['addSum NaN repeats', () => new MinerSum().addSum(new MinerSum(), NaN), 'invalid-repeats', 'repeats', NaN],
  ['cut-off of zero cycles', () => new MinerSum({ cutoff: { cycles: 0 } }), 'invalid-cutoff', 'cutoff.cycles', 0],
  ['cut-off NaN cycles', () => new MinerSum({ cutoff: { cycles: NaN } }), 'invalid-cutoff', 'cutoff.cycles', NaN],
  ['Dcrit 0', () => lifeFromDamage(0.1, { criticalDamage: 0 }), 'invalid-critical-damage', 'criticalDamage', 0],
  ['Dcrit negative', () => lifeFromDamage(0.1, { criticalDamage: -1 }), 'invalid-critical-damage', 'criticalDamage', -1],
  ['Dcrit NaN', () => lifeFromDamage(0.1, { criticalDamage: NaN }), 'invalid-critical-damage', 'criticalDamage', NaN],
  ['Dcrit Infinity', () => lifeFromDamage(0.1, { criticalDamage: Infinity }), 'invalid-critical-damage', 'criticalDamage', Infinity],
  ['scatter factor 0.9', () => lifeFromDamage(0.1, { scatterFactor: 0.9 }), 'invalid-scatter-factor', 'scatterFactor', 0.9],
  ['scatter factor NaN', () => lifeFromDamage(0.1, { scatterFactor: NaN }), 'invalid-scatter-factor', 'scatterFactor', NaN],
  ['negative duration per repeat', () => lifeFromDamage(0.1, { unit: { label: 'h', perRepeat: -2 } }), 'invalid-amount', 'unit.perRepeat', -2],
  ['zero duration per repeat', () => lifeFromDamage(0.1, { unit: { label: 'h', perRepeat: 0 } }), 'invalid-amount', 'unit.perRepeat', 0],
  ['Infinity duration per repeat', () => lifeFromDamage(0.1, { unit: { label: 'h', perRepeat: Infinity } }), 'invalid-amount', 'unit.perRepeat', Infinity],
  ['empty unit label', () => lifeFromDamage(0.1, { unit: { label: '', perRepeat: 1 } }), 'invalid-amount', 'unit.label', ''],
  ['NaN damage per repeat', () => lifeFromDamage(NaN), 'invalid-argument', 'damagePerRepeat', NaN],
  ['negative damage per repeat', () => lifeFromDamage(-1), 'invalid-argument', 'damagePerRepeat', -1],
  ['sumDamage NaN life', () => sumDamage([1], [NaN]), 'invalid-life', 'cyclesToFailure', NaN],
  ['timeline binSize NaN', () => damageTimeline({ damage: [], startIndex: [], turnIndex: [] }, { binSize: NaN }), 'invalid-argument', 'binSize', NaN],
  ['timeline sampleCount 0', () => damageTimeline({ damage: [], startIndex: [], turnIndex: [] }, { binSize: 1, sampleCount: 0 }), 'invalid-argument', 'sampleCount', 0],
  ['event starts negative', () => damageByEvent({ damage: [], startIndex: [], turnIndex: [] }, { starts: [-1] }), 'invalid-events', 'starts', -1],
  ['worst loops NaN n', () => mostDamagingLoops({ damage: [] }, NaN), 'invalid-argument', 'n', NaN],
  ['range bins NaN range', () => damageByRangeBin({ damage: [1], range: [NaN] }, [0, 1]), 'invalid-range', 'range', NaN],
  ['matrix NaN edge', () => damageFromMatrix({ rowEdges: [0, NaN], columnEdges: [0, 1], counts: [1] }, () => 1), 'invalid-bins', 'rowEdges', NaN],
  ['matrix negative count', () => damageFromMatrix({ rowEdges: [0, 1], columnEdges: [0, 1], counts: [-1] }, () => 1), 'invalid-count', 'counts', -1],
  ['cut-off tally NaN count', () => new CutoffTally({ cycles: 1e6 }).add(NaN, 10), 'invalid-count', 'count', NaN],
  ['cut-off tally zero life', () => new CutoffTally('none').add(1, 0), 'invalid-life', 'cyclesToFailure', 0],
  ['cut-off tally near factor 1', () => new CutoffTally('none', { nearFactor: 1 }), 'invalid-argument', 'nearFactor', 1],
  ['residue NaN stress', () => residueHalfCycles({ index: [0, 1], stress: [0, NaN], strain: [0, 0] }), 'invalid-residue', 'stress', NaN],
  ['residue Infinity strain', () => residueHalfCycles({ index: [0, 1], stress: [0, 1], strain: [0, Infinity] }), 'invalid-residue', 'strain', Infinity],
  ['residue fractional index', () => residueHalfCycles({ index: [0.5], stress: [0], strain: [0] }), 'invalid-index', 'index', 0.5],
  ['equivalent range NaN slope', () => equivalentRange({ count: [], range: [] }, { slope: NaN, referenceCount: 1 }), 'invalid-argument', 'slope', NaN],
];

describe('bad input: every entry point names the field and the value', () => {
  test.each(cases)('%s', (_name, call, code, field, value) => {
    let error: unknown;
    try {
      call();
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(MinerError);
    expect(error).toBeInstanceOf(LoopwiseError);
    const e = error as MinerError;
    expect(e.name).toBe('MinerError');
    expect(e.code).toBe(code);
    expect(e.field).toBe(field);
    expect(Object.is(e.value, value)).toBe(true);
    expect(e.message).toContain(field);
    expect(e.message).toContain(typeof value === 'string' ? JSON.stringify(value) : String(value));
  });
});
