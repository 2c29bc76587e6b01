import { correctionName } from './correctionName.js';
import { formatNumber } from './formatNumber.js';
import type { HtmlChannel } from './HtmlReportInput.js';
import { htmlTable, num } from './htmlTable.js';
import { designLifeText, repeatsText, unitLifeText } from './lifeText.js';

/** The results table: one row per channel with correction, damage, life and design life. */
export function resultsTable(channels: HtmlChannel[]): string {
  return htmlTable(
    'results',
    'Results of all channels (mean estimates; design life divided by the scatter factor j)',
    ['channel', 'mean-stress correction', 'damage per repeat', 'life (repeats)', 'life (service unit)', 'design life'],
    channels.map((c) => {
      const r = c.report;
      return [c.name, correctionName(r.damage.meanStress), num(formatNumber(r.damage.perRepeat)), num(repeatsText(r.life)), num(unitLifeText(r.life)), num(designLifeText(r.life))];
    }),
  );
}
