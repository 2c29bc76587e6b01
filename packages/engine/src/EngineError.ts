/** Stable codes of {@link EngineError}. */
export type EngineErrorCode =
  | 'invalid-job'
  | 'invalid-event'
  | 'invalid-history'
  | 'invalid-margin'
  | 'session-state';

/**
 * An error of the life pipeline: a job field, an event or a sample that cannot be used. `field`
 * names the job field or event (`events[2].repeats`), `index` the sample when there is one.
 * Errors of the lower packages (material validation, non-finite samples) pass through with
 * their own classes and codes.
 */
export class EngineError extends Error {
  constructor(
    readonly code: EngineErrorCode,
    readonly field: string,
    readonly value: unknown,
    message: string,
    readonly index?: number,
  ) {
    super(`${field}: ${message}`);
    this.name = 'EngineError';
  }
}
