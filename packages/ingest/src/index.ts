// Public API of @loopwise/ingest: delimited numeric text from bytes, with no file system (browser, worker, Node).
export { DelimitedReader, DEFAULT_CHUNK_SAMPLES } from './DelimitedReader.js';
export type { ChannelSelection, ColumnReference, IngestChunk, IngestReport, IngestedChannel, ReaderOptions, TimeSource } from './DelimitedReader.js';
export { QuotedRecordReader } from './QuotedRecordReader.js';
export type { RecordSink } from './QuotedRecordReader.js';
export { detectDialect, splitFields, firstInvalidUtf8, DELIMITER_CHARACTERS } from './detectDialect.js';
export type { Dialect, DialectOverride, DialectSource, DelimiterName } from './detectDialect.js';
export { parseDecimal, parseDecimalText } from './parseDecimal.js';
export { surveyColumns, recognizeUnit } from './surveyColumns.js';
export type { ColumnSurvey, UnitReading } from './surveyColumns.js';
export { channelConversion, MPA_PER_KSI, MICROSTRAIN_PER_STRAIN } from './channelConversion.js';
export type { ChannelConversion, ChannelQuantity } from './channelConversion.js';
export { SignalChecks, DEFAULT_SIGNAL_CHECK_THRESHOLDS } from './SignalChecks.js';
export type { SampleRange, SignalCheckThresholds, SignalWarning, SignalWarningKind } from './SignalChecks.js';
export { TimeAxisCheck } from './TimeAxisCheck.js';
export type { TimeAxisSummary } from './TimeAxisCheck.js';
export { IngestError, IngestOptionError } from './IngestError.js';
export type { IngestErrorCode } from './IngestError.js';
export { excerpt, EXCERPT_CHARACTERS } from './excerpt.js';
