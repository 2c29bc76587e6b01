export { NonFiniteSampleError, InvalidOptionError, RangeOverflowError, CounterStateError, BinError } from './errors';
export { encodeNumber, decodeNumber, type EncodedNumber } from './numberCodec';
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
export { binEdges, binOf, type BinSpec } from './binEdges';
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
export { damageEquivalentRange, type DamageEquivalentOptions } from './damageEquivalentRange';
