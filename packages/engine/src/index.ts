export { EngineError, type EngineErrorCode } from './EngineError';
export { resolveLifeJob, type JobServiceUnit, type LifeJob, type ResolvedJob } from './LifeJob';
export type { EventDamage, LifeLoopColumns, LifeReport, LifeWarning, WorstLoop } from './LifeReport';
export { ASSUMPTIONS, CAUTION } from './assumptions';
export { assessLife } from './assessLife';
export { assessDutyCycle, type DutyEvent } from './assessDutyCycle';
export { compareCorrections, type CorrectionResult } from './compareCorrections';
export { findLoadMargin, type MarginOptions, type MarginResult } from './findLoadMargin';
export { LifeSession, type LifeSessionOptions } from './LifeSession';
