import { escapeHtml } from './escapeHtml.js';
import { eventsPlot } from './eventsPlot.js';
import { eventsTable } from './eventsTable.js';
import { historyPlot } from './historyPlot.js';
import type { HtmlChannel } from './HtmlReportInput.js';
import { inputsList } from './inputsList.js';
import { loopsPlot } from './loopsPlot.js';
import { matrixPlot } from './matrixPlot.js';
import { snCurvePlot } from './snCurvePlot.js';
import { summaryList } from './summaryList.js';
import { timelinePlot } from './timelinePlot.js';
import { warningsList } from './warningsList.js';
import { worstLoopsTable } from './worstLoopsTable.js';

function figure(svg: string, caption: string): string {
  return `<figure>${svg}<figcaption>${escapeHtml(caption)}</figcaption></figure>`;
}

/** The corrections applied to the signal, one item each in the order applied, or a line saying the samples are as measured. */
export function correctionsList(corrections: readonly { kind: string; summary: string }[]): string {
  if (corrections.length === 0) return '<p class="none corrections">None: the samples were assessed as measured.</p>';
  return `<ol class="corrections">${corrections.map((c) => `<li data-kind="${escapeHtml(c.kind)}"><code>${escapeHtml(c.kind)}</code> ${escapeHtml(c.summary)}</li>`).join('')}</ol>`;
}

/** One channel's section: summary, plots, worst loops, events, warnings and inputs. */
export function channelSection(channel: HtmlChannel, ordinal: number, stressUnit: string): string {
  const id = `channel-${ordinal + 1}`;
  const r = channel.report;
  const loops = r.worstLoops.length;
  return [
    `<section class="channel" id="${id}" data-channel="${escapeHtml(channel.name)}">`,
    `<h2>Channel ${ordinal + 1}: ${escapeHtml(channel.name)} <small>(${escapeHtml(channel.unit)})</small></h2>`,
    summaryList(r, channel.loopTotals, channel.unit),
    '<h3>Corrections of the signal</h3>',
    correctionsList(channel.signalCorrections ?? []),
    '<h3>History</h3>',
    figure(
      historyPlot(channel, `${id}-history`),
      `The history (display copy: the extremes of each pixel column kept) with the ${loops} most damaging loops marked by rank: open circle where the loop starts, filled circle where it turns.`,
    ),
    '<h3>Rainflow matrix</h3>',
    figure(matrixPlot(channel, `${id}-matrix`), 'Cycles by range and mean; the colour is the count on a logarithmic scale; empty cells hold no cycles.'),
    ...(r.damage.route === 'stress-life'
      ? [
          '<h3>S-N curve and the counted spectrum</h3>',
          figure(
            snCurvePlot(channel, `${id}-sn`, stressUnit),
            'The S-N curve of the assessment (solid; log-log), the worst cycles at their lives on it (dots), and, when the cycles were kept, the counted spectrum drawn to the predicted life: the cycles of one repeat at or above each equivalent stress, times the life in repeats (dashed).',
          ),
        ]
      : [
          '<h3>Hysteresis loops of the worst cycles</h3>',
          figure(
            loopsPlot(channel, `${id}-loops`, stressUnit),
            'Local stress against local strain at the notch root. Each loop joins the assessed corners (σmin, εmin) and (σmax, εmax) by the two Masing branches Δε = Δσ/E + 2(Δσ/2K′)^(1/n′) of the material model.',
          ),
        ]),
    worstLoopsTable(r.worstLoops, stressUnit, r.events, channel.cutOut),
    '<h3>Damage timeline and damage by event</h3>',
    figure(timelinePlot(channel, `${id}-timeline`), `Damage per repeat in bins of ${r.timeline.binSize} samples (half of each loop's damage at each of its two reversals).`),
    figure(eventsPlot(channel, `${id}-events`), 'Damage per repeat of the schedule by event, with its share.'),
    eventsTable(r.events),
    '<h3>Warnings</h3>',
    warningsList(r.warnings, channel.signalWarnings ?? []),
    '<h3>Inputs</h3>',
    inputsList(r.inputs, stressUnit),
    '</section>',
  ].join('\n');
}
