import { correctionName } from './correctionName.js';
import { definitionList } from './definitionList.js';
import { formatNumber } from './formatNumber.js';

type Json = Record<string, unknown>;

function obj(v: unknown): Json {
  return v !== null && typeof v === 'object' ? (v as Json) : {};
}

function numberText(v: unknown): string {
  return typeof v === 'number' ? formatNumber(v) : v === undefined || v === null ? '—' : String(v);
}

/**
 * The inputs of an assessment as resolved (material, input kind, notch, correction, gate,
 * repeating, cut-off, critical damage, scatter factor, unit, initial value and offset, events),
 * read defensively from `report.inputs`: a missing field shows as '—'.
 */
export function inputsList(inputs: Json, stressUnit: string): string {
  const m = obj(inputs.material);
  const notch = obj(inputs.notch);
  const service = inputs.unit === null || inputs.unit === undefined ? null : obj(inputs.unit);
  const kind = String(inputs.input ?? '—');
  const notchText =
    kind === 'nominal'
      ? `${notch.Kf !== undefined && notch.Kf !== null ? `Kf = ${numberText(notch.Kf)}` : `Kt = ${numberText(notch.Kt)}`}, ${numberText(notch.rule)} rule`
      : kind === 'local-strain'
        ? 'none (measured local strain)'
        : `${numberText(notch.rule)} rule on the pseudo-elastic stress`;
  const correction = correctionName(String(inputs.meanStress ?? '—'));
  const gamma = typeof inputs.walkerGamma === 'number' ? `, γ = ${formatNumber(inputs.walkerGamma)}` : '';
  const events = Array.isArray(inputs.events) ? (inputs.events as unknown[]).map(obj) : [];
  const items: Array<[string, string]> = [
    ['material', String(m.name ?? 'unnamed')],
    [
      'constants',
      `E = ${numberText(m.E)} ${stressUnit}, σf′ = ${numberText(m.sigmaF)} ${stressUnit}, b = ${numberText(m.b)}, εf′ = ${numberText(m.epsilonF)}, c = ${numberText(m.c)}, ` +
        `K′ = ${numberText(m.K)} ${stressUnit}, n′ = ${numberText(m.n)}${typeof m.Su === 'number' ? `, Su = ${numberText(m.Su)} ${stressUnit}` : ''}`,
    ],
    ['material source', m.source === undefined || m.source === null ? '—' : String(m.source)],
    ['history holds', kind],
    ['notch', notchText],
    ['load to stress', numberText(inputs.loadToStress)],
    ['mean-stress correction', correction + gamma],
    ['gate range (assessed history units)', numberText(inputs.gate)],
    ['repeating history', inputs.repeating === false ? 'no (one-off: the residue counts as half cycles)' : 'yes (stabilised pass)'],
    ['cut-off', inputs.cutoffCycles === null || inputs.cutoffCycles === undefined ? 'none' : `${numberText(inputs.cutoffCycles)} cycles`],
    ['critical damage sum', numberText(inputs.criticalDamage)],
    ['scatter factor j', numberText(inputs.scatterFactor)],
    ['service unit', service === null ? 'none' : `${String(service.label ?? '—')}${service.perRepeat === undefined ? '' : `, ${numberText(service.perRepeat)} per repeat`}`],
    ['initial value, offset (assessed history units)', `${numberText(inputs.initial)}, ${numberText(inputs.offset)}`],
  ];
  if (events.length > 0) {
    items.push(['events', events.map((e) => `${String(e.name ?? '—')} (${numberText(e.samples)} samples × ${numberText(e.repeats)})`).join('; ')]);
  }
  return definitionList('inputs', items);
}
