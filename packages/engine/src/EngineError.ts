import { LoopwiseError } from '@loopwise/base';

/** Stable codes of {@link EngineError}. */
export type EngineErrorCode = 'invalid-job' | 'invalid-event' | 'non-finite-sample' | 'invalid-margin' | 'session-state' | 'invalid-stress-cycle';

/**
 * An error of the life pipeline: a job field, an event or a sample that cannot be used. `field`
 * names the job field or event (`events[2].repeats`), `index` the sample when there is one.
 * Errors of the lower packages (material validation, notch options) pass through with their
 * own classes and codes; every one is a LoopwiseError.
 */
export class EngineError extends LoopwiseError {
  declare readonly code: EngineErrorCode;

  constructor(code: EngineErrorCode, field: string, value: unknown, message: string, index?: number) {
    super(code, field, value, `${field}: ${message}`, index);
  }
}
