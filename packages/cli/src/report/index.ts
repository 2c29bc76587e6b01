export { renderHtmlReport } from './renderHtmlReport.js';
export { displayHistory } from './displayHistory.js';
export type { HtmlChannel, HtmlHistory, HtmlMatrix, HtmlReportInput } from './HtmlReportInput.js';
