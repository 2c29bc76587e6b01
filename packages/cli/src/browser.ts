// The browser entry of @loopwise/cli (`@loopwise/cli/browser`): the parts of the command that need
// no file system, no threads of Node and no process, so the browser page computes and writes
// exactly what the command does. Nothing here may import a `node:` module (test/browserEntry.test.ts
// follows every import from this file and fails on one).
export { assessStream, type ChannelResult, type Progress, type StreamRead, type StreamSettings } from './cli/assessStream';
export { assessEvents, type EventRead, type EventSettings } from './cli/assessEvents';
export { lifeJobOf, mainCorrection } from './cli/lifeJobOf';
export { jobOfJobFile, checkRoute, type JobFileAccess } from './cli/jobOfJobFile';
export type { CliChannel, CliCorrection, CliEvent, CliJob, CliStressLife, JobFile } from './cli/CliJob';
export { resolveMaterial, handbookNames, DEFAULT_STEEL_E_MPA, type EstimateSpec, type MaterialSpec, type TextAccess } from './cli/resolveMaterial';
export { LoopSpool } from './cli/LoopSpool';
export { MemorySpool } from './cli/MemorySpool';
export type { SpoolStore } from './cli/SpoolStore';
export { jsonReport, writeCyclesCsv, CYCLES_CSV_HEADER, stableJson } from './cli/outputs';
export { renderChannelsHtml, htmlChannelsOf, reportTitle, signalWarningsOf } from './cli/renderChannelsHtml';
export type { OutputSink } from './cli/OutputSet';
export { UsageError } from './cli/CliError';
export { VERSION, TOOL } from './cli/version';
export { repeatsText, unitLifeText, designLifeText } from './report/lifeText';
export { formatNumber } from './report/formatNumber';
export { fileSampleOf, loopInFile } from './report/cutNumbering';
export { masingLoop, type CyclicConstants, type MasingLoop } from './report/masingLoop';
export { snCurvePlot } from './report/snCurvePlot';
export { readCyclicConstants } from './report/readCyclicConstants';
export type { HtmlChannel, HtmlMatrix } from './report/HtmlReportInput';
