// Delimited files from disk: the Node file loops around @loopwise/ingest's DelimitedReader (which
// holds the parsing, dialect detection, conversions and checks); packages/cli/src/index.ts
// re-exports both, so `@loopwise/cli` keeps its ingestion names.
export {
  DelimitedReader,
  DEFAULT_CHUNK_SAMPLES,
  detectDialect,
  splitFields,
  DELIMITER_CHARACTERS,
  parseDecimal,
  parseDecimalText,
  surveyColumns,
  describeDialect,
  recognizeUnit,
  channelConversion,
  MPA_PER_KSI,
  MICROSTRAIN_PER_STRAIN,
  SignalChecks,
  DEFAULT_SIGNAL_CHECK_THRESHOLDS,
  TimeAxisCheck,
  IngestError,
  IngestOptionError,
} from '@loopwise/ingest';
export type {
  ChannelSelection,
  ColumnReference,
  IngestChunk,
  IngestReport,
  IngestedChannel,
  ReaderOptions,
  TimeSource,
  Dialect,
  DialectOverride,
  DialectSource,
  DelimiterName,
  ChannelConversion,
  ChannelQuantity,
  SampleRange,
  SignalCheckThresholds,
  SignalWarning,
  SignalWarningKind,
  TimeAxisSummary,
  IngestErrorCode,
  ColumnSurvey,
  UnitReading,
} from '@loopwise/ingest';
export { readDelimited, readDelimitedColumns, DEFAULT_CHUNK_BYTES } from './readDelimited.js';
export type { IngestOptions } from './readDelimited.js';
export { readDelimitedParallel } from './readDelimitedParallel.js';
