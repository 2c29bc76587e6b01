// Public API of delimited-text ingestion; packages/cli/src/index.ts re-exports it.
export { readDelimited, readDelimitedColumns, DEFAULT_CHUNK_BYTES, DEFAULT_CHUNK_SAMPLES } from './readDelimited.js';
export type { ChannelSelection, ColumnReference, IngestChunk, IngestOptions, IngestReport, IngestedChannel, TimeSource } from './readDelimited.js';
export { detectDialect, splitFields, DELIMITER_CHARACTERS } from './detectDialect.js';
export type { Dialect, DialectOverride, DialectSource, DelimiterName } from './detectDialect.js';
export { parseDecimal, parseDecimalText } from './parseDecimal.js';
export { channelConversion, MPA_PER_KSI, MICROSTRAIN_PER_STRAIN } from './channelConversion.js';
export type { ChannelConversion, ChannelQuantity } from './channelConversion.js';
export { SignalChecks, DEFAULT_SIGNAL_CHECK_THRESHOLDS } from './SignalChecks.js';
export type { SampleRange, SignalCheckThresholds, SignalWarning, SignalWarningKind } from './SignalChecks.js';
export { TimeAxisCheck } from './TimeAxisCheck.js';
export type { TimeAxisSummary } from './TimeAxisCheck.js';
export { IngestError, IngestOptionError } from './IngestError.js';
export type { IngestErrorCode } from './IngestError.js';
export { readDelimitedParallel } from './readDelimitedParallel.js';
