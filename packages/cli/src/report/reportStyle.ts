/**
 * The report's CSS, inline so the file opens offline: laid out for a 1200 px window, plots
 * scaled to the column width, print rules that keep each plot on one page and print colours.
 */
export const REPORT_STYLE = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: #fff; color: #1a1a1a; font: 15px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; }
main { max-width: 1160px; margin: 0 auto; padding: 24px 20px 48px; }
h1 { font-size: 26px; margin: 0 0 4px; }
h2 { font-size: 21px; margin: 36px 0 8px; padding-top: 12px; border-top: 2px solid #1a1a1a; }
h3 { font-size: 17px; margin: 24px 0 6px; }
.generated { color: #555; margin: 0 0 12px; }
.invented { background: #fff4d6; border: 1px solid #b98900; padding: 8px 12px; margin: 12px 0; }
.caution { border: 3px solid #b3261e; background: #fdecea; padding: 12px 16px; margin: 16px 0; font-size: 16px; }
.caution strong { color: #8c1d18; }
table { border-collapse: collapse; margin: 8px 0 16px; font-size: 14px; width: 100%; }
caption { text-align: left; font-weight: 600; padding: 4px 0; }
th, td { border-bottom: 1px solid #ccc; padding: 4px 8px; text-align: left; vertical-align: top; }
thead th { border-bottom: 2px solid #555; background: #f3f3f3; }
.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
dl { display: grid; grid-template-columns: repeat(auto-fill, minmax(340px, 1fr)); gap: 2px 24px; margin: 8px 0 16px; }
dl div { display: flex; gap: 8px; border-bottom: 1px dotted #ccc; padding: 2px 0; }
dt { color: #444; min-width: 11em; }
dd { margin: 0; font-variant-numeric: tabular-nums; }
dl.inputs { grid-template-columns: 1fr; }
dl.inputs div { display: grid; grid-template-columns: 20em 1fr; }
ul.warnings li { margin: 4px 0; }
code { font-size: 13px; background: #f3f3f3; padding: 0 3px; }
figure { margin: 12px 0 20px; }
figcaption { font-size: 14px; color: #333; margin-top: 2px; }
svg.plot { display: block; width: 100%; height: auto; font-family: inherit; }
svg .frame { fill: none; stroke: #333; stroke-width: 1; }
svg .grid { stroke: #e3e3e3; stroke-width: 1; }
svg .tick { stroke: #333; }
svg text { font-size: 13px; fill: #1a1a1a; }
svg .axis-label { font-size: 14px; font-weight: 600; }
svg .legend-title { font-size: 13px; font-weight: 600; }
svg .plot-note, svg .legend-note { font-size: 12px; fill: #444; }
svg .empty-note { font-size: 15px; fill: #555; }
svg .history-line { fill: none; stroke: #33638d; stroke-width: 1; stroke-linejoin: round; }
svg .event-start line { stroke: #555; stroke-width: 1; }
svg .event-start text { font-size: 11px; fill: #333; paint-order: stroke; stroke: #fff; stroke-width: 3px; }
svg .loop-marker circle { stroke: #b3261e; stroke-width: 2; }
svg .marker-start circle { fill: #fff; }
svg .marker-turn circle { fill: #b3261e; }
svg .loop-marker text { font-size: 12px; font-weight: 700; fill: #8c1d18; paint-order: stroke; stroke: #fff; stroke-width: 3px; }
svg .loop { stroke-width: 1.6; }
svg .cell { stroke: none; }
svg .bar { fill: #33638d; }
svg .event-bar { fill: #b3261e; }
svg .event-name, svg .event-share { font-size: 14px; }
footer { margin-top: 32px; color: #555; font-size: 13px; }
@media print {
  body { font-size: 11pt; }
  main { max-width: none; padding: 0; }
  h2 { break-before: page; }
  figure, table, .caution, dl { break-inside: avoid; }
  svg.plot, .caution, thead th { print-color-adjust: exact; -webkit-print-color-adjust: exact; }
  @page { size: A4; margin: 14mm; }
}
`;
