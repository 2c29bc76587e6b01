export { SignalError, type SignalErrorCode } from './SignalError';
export { timesOfSamples, type TimeBase } from './TimeBase';
export { FindingTable, FINDING_CODES, type Finding, type FindingCode, type FindingColumns } from './FindingTable';
export {
  SignalScanner,
  MAD_TO_SIGMA,
  DIFFERENCE_STRIDE,
  type SignalScan,
  type SignalScanOptions,
  type SpikeCheckOptions,
  type StuckRunCheckOptions,
  type ClippingCheckOptions,
  type OffsetCheckOptions,
  type DriftCheckOptions,
} from './SignalScanner';
export { scanSignal } from './scanSignal';
export { detectTimeGaps, type TimeGapOptions } from './detectTimeGaps';
export type { CorrectionKind, CorrectionRecord } from './CorrectionRecord';
export type { Segment, SegmentedHistory } from './Segment';
export { removeSpikes, removeSpikesInto, type SpikeRemoval } from './removeSpikes';
export { excludeRanges, type ExcludeRangesOptions, type SampleRange, type TimeRange } from './excludeRanges';
export { splitAtDropouts, type SplitAtDropoutsOptions } from './splitAtDropouts';
export { removeOffset, type OffsetRemoval, type RemoveOffsetOptions } from './removeOffset';
export { butterworthSections, butterworthResponse, type ButterworthDesign, type ButterworthOptions } from './butterworthSections';
export { zeroPhaseLowPass, zeroPhaseLowPassButterworth, zeroPhaseLowPassInto, type LowPassResult, type ZeroPhaseLowPassOptions } from './zeroPhaseLowPass';
export { conditionSignal, conditionSignalInto, type ConditionSignalOptions, type ConditionedSignal, type SignalConditioning } from './conditionSignal';
export { decimatePeaks, type DecimatePeaksOptions, type Decimation } from './decimatePeaks';
export { PeakDecimator } from './PeakDecimator';
