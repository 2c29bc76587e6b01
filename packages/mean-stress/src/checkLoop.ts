import type { LoopColumns } from './Loop';
import { MeanStressError } from './MeanStressError';

/** Internal: throws MeanStressError('invalid-loop') unless the loop's extremes are finite and ordered. */
export function checkLoop(sMax: number, sMin: number, eMax: number, eMin: number, index: number | undefined): void {
  if (sMax >= sMin && eMax >= eMin && sMax < Infinity && sMin > -Infinity && eMax < Infinity && eMin > -Infinity) return;
  throwBadLoop(sMax, sMin, eMax, eMin, index);
}

/**
 * Internal: checks loops 0 … count − 1 of columns, naming the index of a bad one. The test is
 * written out in the loop, and the error built apart, so the loop stays small and inlined.
 */
export function checkLoopRows(loops: LoopColumns, count: number): void {
  const { stressMax, stressMin, strainMax, strainMin } = loops;
  for (let i = 0; i < count; i++) {
    const sMax = stressMax[i];
    const sMin = stressMin[i];
    const eMax = strainMax[i];
    const eMin = strainMin[i];
    if (!(sMax >= sMin && eMax >= eMin && sMax < Infinity && sMin > -Infinity && eMax < Infinity && eMin > -Infinity)) {
      throwBadLoop(sMax, sMin, eMax, eMin, i);
    }
  }
}

/** The error of a loop that failed the check: the first non-finite field, else the order. */
function throwBadLoop(sMax: number, sMin: number, eMax: number, eMin: number, index: number | undefined): never {
  const fields = [
    ['stressMax', sMax],
    ['stressMin', sMin],
    ['strainMax', eMax],
    ['strainMin', eMin],
  ] as const;
  for (const [field, value] of fields) {
    if (!Number.isFinite(value)) throw new MeanStressError('invalid-loop', field, value, 'must be a finite number', index);
  }
  if (sMax < sMin) {
    throw new MeanStressError('invalid-loop', 'stressMin', sMin, `must be <= stressMax (${sMax})`, index);
  }
  throw new MeanStressError('invalid-loop', 'strainMin', eMin, `must be <= strainMax (${eMax})`, index);
}

/** Internal: checks that the columns and output have a common length and returns it. */
export function checkColumns(loops: LoopColumns, out: Float64Array, flags: Uint8Array | undefined): number {
  const count = loops.stressMax.length;
  for (const field of ['stressMin', 'strainMax', 'strainMin'] as const) {
    if (loops[field].length !== count) {
      throw new MeanStressError('invalid-argument', `loops.${field}`, loops[field].length, `length must equal loops.stressMax.length (${count})`);
    }
  }
  if (out.length < count) throw new MeanStressError('invalid-argument', 'out', out.length, `length must be >= ${count}`);
  if (flags !== undefined && flags.length < count) {
    throw new MeanStressError('invalid-argument', 'flags', flags.length, `length must be >= ${count}`);
  }
  return count;
}

/** Internal: the flag names of a bit set. */
export function flagNames<T extends string>(bits: number, table: Readonly<Record<T, number>>): T[] {
  const names: T[] = [];
  for (const name of Object.keys(table) as T[]) if (bits & table[name]) names.push(name);
  return names;
}
