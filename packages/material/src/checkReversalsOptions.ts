import { unknownField } from '@loopwise/base';
import { ArgumentError } from './ArgumentError';

const FIELDS = ['cutoffReversals', 'maxIterations'] as const;

/**
 * Checks the options object of a reversals solve (`reversalsToFailure`, `reversalsToFailureInto`,
 * the damage parameters of @loopwise/mean-stress): undefined or an object whose fields are
 * known (`cutoffReversals`, `maxIterations` and any `extra` the caller accepts), with
 * `cutoffReversals` a number >= 1 (Infinity allowed: no cut-off) and `maxIterations` an integer
 * from 0 to 10000 when given (0 reaches the cap at once: ConvergenceError). An unknown field is an error that suggests the nearest known name.
 *
 * @param where what the options are, for the message (`reversalsToFailure options`)
 * @throws {ArgumentError} naming the field (`options`, the unknown field, or the bad one).
 * @example
 * checkReversalsOptions({ cutoff: 1e7 }, 'reversalsToFailure options')
 * // throws ArgumentError: "invalid argument: cutoff = 10000000 (unknown field 'cutoff' in reversalsToFailure options; the fields are cutoffReversals, maxIterations)"
 */
export function checkReversalsOptions(options: unknown, where: string, extra: readonly string[] = []): void {
  if (options === undefined) return;
  if (options === null || typeof options !== 'object' || Array.isArray(options)) {
    throw new ArgumentError('options', options, `${where} must be an object`);
  }
  const u = unknownField(options, [...FIELDS, ...extra], where);
  if (u !== undefined) throw new ArgumentError(u.field, u.value, u.rule);
  const o = options as { cutoffReversals?: unknown; maxIterations?: unknown };
  if (o.cutoffReversals !== undefined && !(typeof o.cutoffReversals === 'number' && o.cutoffReversals >= 1)) {
    throw new ArgumentError('cutoffReversals', o.cutoffReversals, 'must be a number >= 1');
  }
  if (o.maxIterations !== undefined && !(Number.isInteger(o.maxIterations) && (o.maxIterations as number) >= 0 && (o.maxIterations as number) <= 10000)) {
    throw new ArgumentError('maxIterations', o.maxIterations, 'must be an integer from 0 to 10000 (0 only to test the cap)');
  }
}
