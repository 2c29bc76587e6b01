export { MinerError, type MinerErrorCode } from './MinerError';
export { cutoffLimit, type CutoffPolicy } from './CutoffPolicy';
export { cyclesFromReversals } from './cyclesFromReversals';
export { cyclesFromReversalsInto } from './cyclesFromReversalsInto';
export { damageInto, type DamageOptions } from './damageInto';
export { sumDamage } from './sumDamage';
export { lifeFromDamage, DEFAULT_CRITICAL_DAMAGE, type LifeEstimate, type LifeOptions, type ServiceUnit } from './lifeFromDamage';
export { MinerSum, type CycleRecordColumns, type MinerColumns, type MinerSumOptions } from './MinerSum';
export { CutoffTally, type CutoffColumns, type CutoffReport, type CutoffTallyOptions } from './CutoffTally';
export { residueHalfCycles, type HalfCycleColumns, type ResiduePoints } from './residueHalfCycles';
export type { LoopDamageColumns } from './LoopDamageColumns';
export { damageTimeline, type TimelineOptions } from './damageTimeline';
export { damageByEvent, type EventIds, type EventStarts } from './damageByEvent';
export { mostDamagingLoops } from './mostDamagingLoops';
export { damageByRangeBin, type RangeBinDamage } from './damageByRangeBin';
export {
  damageFromMatrix,
  type MatrixDamage,
  type MatrixDamageOptions,
  type MatrixLife,
  type MatrixLifeKernel,
  type RangeMeanCounts,
} from './damageFromMatrix';
export { equivalentRange, type EquivalentRangeOptions } from './equivalentRange';
