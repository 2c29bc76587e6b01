import { correctionName } from './correctionName.js';
import { formatNumber } from './formatNumber.js';
import type { HtmlChannel } from './HtmlReportInput.js';
import { htmlTable, num } from './htmlTable.js';
import { designLifeText, repeatsText, unitLifeText } from './lifeText.js';

/**
 * The results table: one row per channel with correction, damage, life and design life; with
 * every correction side by side, one row per correction, the one the report details marked.
 */
export function resultsTable(channels: HtmlChannel[]): string {
  const compared = channels.some((c) => (c.corrections ?? null) !== null);
  return htmlTable(
    'results',
    compared
      ? 'Results of all channels under every mean-stress correction (mean estimates; design life divided by the scatter factor j; the correction marked * is the one detailed below)'
      : 'Results of all channels (mean estimates; design life divided by the scatter factor j)',
    ['channel', 'mean-stress correction', 'damage per repeat', 'life (repeats)', 'life (service unit)', 'design life'],
    channels.flatMap((c) => {
      const r = c.report;
      const rows = c.corrections ?? [{ meanStress: r.damage.meanStress, damagePerRepeat: r.damage.perRepeat, life: r.life }];
      return rows.map((k) => {
        const mark = c.corrections && k.meanStress === r.damage.meanStress ? ' *' : '';
        return [c.name, correctionName(k.meanStress) + mark, num(formatNumber(k.damagePerRepeat)), num(repeatsText(k.life)), num(unitLifeText(k.life)), num(designLifeText(k.life))];
      });
    }),
  );
}
