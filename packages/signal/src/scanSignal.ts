import { SignalError } from './SignalError';
import { SignalScanner, type SignalScan, type SignalScanOptions } from './SignalScanner';

/**
 * The checks of {@link SignalScanner} over a whole record at once (the same rules and results
 * as pushing it in any chunks): spikes, stuck runs and runs at zero, clipping, offset, drift.
 *
 * @example
 * const x = Float64Array.from({ length: 1000 }, (_, i) => Math.sin(i / 8));
 * x.fill(0, 300, 450); // invented: a dropout to zero
 * scanSignal(x).findings.row(0);
 * // returns { code: 'zero-run', index: 300, length: 150, time: undefined, size: 0 }
 */
export function scanSignal(history: ArrayLike<number>, options: SignalScanOptions = {}): SignalScan {
  if (history === null || typeof history !== 'object' || typeof history.length !== 'number') throw new SignalError('invalid-argument', 'history', history, 'must be an array or typed array of numbers');
  const scanner = new SignalScanner(options);
  scanner.push(history);
  return scanner.finish();
}
