export * from './ingest/index';
export * from './report/index';
export { main, VERSION, type Io } from './cli/main';
export { runAssessment, lifeJobOf, type ChannelResult, type Progress } from './cli/runAssessment';
export { readJobFile, type CliChannel, type CliEvent, type CliJob, type JobFile } from './cli/CliJob';
export { resolveMaterial, type EstimateSpec, type MaterialSpec } from './cli/resolveMaterial';
export { writeOutputAtomic } from './cli/writeOutputAtomic';
export { UsageError } from './cli/CliError';
