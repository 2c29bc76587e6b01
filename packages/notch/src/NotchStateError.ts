/** Thrown by {@link NotchTracker.fromJSON} when a serialised state is malformed; names the field. */
export class NotchStateError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'invalid-state' as const;
  /** The field of the state that is wrong. */
  readonly field: string;

  constructor(field: string, rule: string) {
    super(`invalid tracker state: ${field} (${rule})`);
    this.name = 'NotchStateError';
    this.field = field;
  }
}
