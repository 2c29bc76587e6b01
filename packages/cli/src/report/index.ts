export { renderHtmlReport } from './renderHtmlReport.js';
export { DisplayHistory, displayHistory } from './displayHistory.js';
export type { HtmlChannel, HtmlHistory, HtmlMatrix, HtmlReportInput } from './HtmlReportInput.js';
