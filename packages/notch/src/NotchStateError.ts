import { LoopwiseError } from '@loopwise/base';

/** Thrown by {@link NotchTracker.fromJSON} when a serialised state is malformed; names the field. */
export class NotchStateError extends LoopwiseError {
  declare readonly code: 'invalid-state';

  /** @param field the state field or method at fault; @param rule what it must be or why */
  constructor(field: string, rule: string, value?: unknown) {
    super('invalid-state', field, value, `invalid tracker state: ${field} (${rule})`);
  }
}
