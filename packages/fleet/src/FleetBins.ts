import type { BinSpec } from '@loopwise/rainflow';
import { FleetError } from './FleetError';

/**
 * The bins every file's matrices are counted into. One set for the whole fleet, so that the
 * matrices of all files add (matrices add only over identical bins). Values are in the engine's
 * units of the channels (MPa, or strain for strain channels).
 */
export interface FleetBins {
  /** Rows of the range-mean matrix: the cycle range. */
  range: BinSpec;
  /** Columns of the range-mean matrix: the cycle mean. */
  mean: BinSpec;
  /** Rows and columns of the from-to matrix: where a cycle starts and where it goes. */
  fromTo: BinSpec;
}

/**
 * Reads bins written as `count:min:max` (e.g. `32:0:800`), the command line's form; `where`
 * names the option in the message.
 */
export function parseBinText(text: string, where: string): BinSpec {
  const parts = text.split(':');
  const [count, min, max] = parts.map(Number);
  if (parts.length !== 3 || !Number.isInteger(count) || count < 1 || count > 4096 || !Number.isFinite(min) || !Number.isFinite(max) || !(max > min)) {
    throw new FleetError('invalid-bins', where, text, `${where}: expected count:min:max with an integer count from 1 to 4096 and min < max, got "${text}"`);
  }
  return { count, min, max };
}
