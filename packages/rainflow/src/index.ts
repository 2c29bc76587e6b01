export { NonFiniteSampleError, InvalidOptionError, RangeOverflowError, CounterStateError, BinError, type BinErrorCode } from './errors';
export { ReversalFilter, type ReversalFilterOptions, type ReversalFilterState } from './ReversalFilter';
export { turningPoints, type TurningPoints, type TurningPointOptions } from './turningPoints';
export { gateRange, type GateOptions } from './gateRange';
export type { CycleSink } from './CycleSink';
export { CycleTable, type CycleColumns, type CycleTableState } from './CycleTable';
export {
  RainflowCounter,
  type RainflowCounterOptions,
  type RainflowCounterState,
  type RainflowResult,
  type Residue,
  type ResiduePolicy,
} from './RainflowCounter';
export { rainflowFourPoint, rainflow, type RainflowOptions } from './rainflowFourPoint';
export { binEdges, type BinSpec } from './binEdges';
/**
 * @deprecated The bin lookup is `binIndex` of `@loopwise/base` (this name re-exports it, the one
 * definition, while packages move over); import it from there.
 */
export {
  CycleMatrix,
  OutsideBinsError,
  type CycleMatrixJSON,
  type CycleMatrixKind,
  type OutsidePolicy,
  type OutsideTally,
} from './CycleMatrix';
export { RangeMeanMatrix, type RangeMeanMatrixOptions } from './RangeMeanMatrix';
export { FromToMatrix, type FromToMatrixOptions } from './FromToMatrix';
export { levelCrossings, type LevelCrossings } from './levelCrossings';
export { rangeSpectrum, type RangeSpectrum } from './rangeSpectrum';
