export type { LocalRangeResponse, LocalResponse, NotchSolveOptions } from './LocalResponse';
export { DEFAULT_NOTCH_MAX_ITERATIONS, DEFAULT_NOTCH_TOLERANCE } from './solveEnergyEquation';
export { neuber, neuberRange } from './neuber';
export { glinka, glinkaRange } from './glinka';
export { linearRule, linearRuleRange } from './linearRule';
export { petersonConstantMm, petersonSensitivity } from './petersonSensitivity';
export { neuberConstantMm, neuberSensitivity } from './neuberSensitivity';
export { fatigueNotchFactor } from './fatigueNotchFactor';
export { NotchOptionError } from './NotchOptionError';
export { NotchSampleError } from './NotchSampleError';
export { NotchStateError } from './NotchStateError';
export { NotchValidityError } from './NotchValidityError';
export { ReversalTable, type ReversalColumns, type ReversalRow } from './ReversalTable';
export { LoopTable, type LoopColumns, type LoopRow } from './LoopTable';
export {
  DEFAULT_TRACKER_TOLERANCE,
  type NotchInputKind,
  type NotchRuleName,
  type NotchTrackerOptions,
  type ResolvedTrackerOptions,
} from './NotchTrackerOptions';
export { NotchTracker, type NotchTrackerState, type NotchTrackResult } from './NotchTracker';
export { trackNotch } from './trackNotch';
export { trackNotchRepeating, type NotchRepeatingResult } from './trackNotchRepeating';
export {
  RepeatingNotchTracker,
  type PassRows,
  type RepeatingTrackerOptions,
  type RepeatingTrackResult,
  type SecondPassNeed,
  type TakenLoops,
} from './RepeatingNotchTracker';
export { branchResponse, type LocalPoint } from './branchResponse';
export { checkLoopClosures, loopClosureError, type LoopClosureReport } from './checkLoopClosures';
