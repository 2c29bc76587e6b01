import { checkHistory, integerOption, onlyKnownFields } from './checkOptions';
import { FINDING_CODES, type FindingCode, type FindingTable } from './FindingTable';
import { segmentsOutside, type SegmentedHistory } from './Segment';
import { SignalError } from './SignalError';

/** Options of {@link splitAtDropouts}. */
export interface SplitAtDropoutsOptions {
  /** Which findings cut the history. Default `['stuck-run', 'zero-run', 'time-gap']`. */
  codes?: readonly FindingCode[];
  /** Segments shorter than this are dropped too (and recorded as removed). Default 1 (keep all). */
  minimumSegment?: number;
}

/**
 * Cuts a history at its dropouts: the samples of each `stuck-run` and `zero-run` finding are
 * removed, and the history is cut before each `time-gap` finding's sample (nothing measured
 * lies in the gap, so nothing is removed there); what is left is returned as segments with the
 * sample index of their first sample. Findings that overlap (a clip inside a stuck run) are
 * merged. Assess the segments as separate events, or join them knowing that the joint is a
 * range that was never measured.
 *
 * Effect on a fatigue result: the frozen samples carried no cycles, but the loops that spanned
 * the dropout are cut (each segment's residue is counted on its own). Removing data is an
 * engineering decision.
 *
 * @example
 * const x = [1, -1, 0, 0, 0, 0, 2, -2];
 * const f = scanSignal(x, { stuckRuns: { minimumSamples: 3 }, spikes: false, offset: false, drift: false, clipping: false }).findings;
 * splitAtDropouts(x, f).segments.map((s) => Array.from(s.values));
 * // returns [[1, -1], [2, -2]]
 */
export function splitAtDropouts(history: ArrayLike<number>, findings: FindingTable, options: SplitAtDropoutsOptions = {}): SegmentedHistory {
  onlyKnownFields(options, ['codes', 'minimumSegment'], 'options');
  const x = checkHistory(history);
  const minimumSegment = integerOption(options.minimumSegment, 'minimumSegment', 1, 1);
  const codes = options.codes ?? (['stuck-run', 'zero-run', 'time-gap'] as const);
  if (!Array.isArray(codes)) throw new SignalError('invalid-option', 'codes', codes, 'must be an array of finding codes');
  codes.forEach((c, k) => {
    if (!FINDING_CODES.includes(c)) throw new SignalError('invalid-option', `codes[${k}]`, c, `must be one of ${FINDING_CODES.join(', ')}`);
  });
  if (findings === null || typeof findings !== 'object' || typeof (findings as FindingTable).select !== 'function') throw new SignalError('invalid-argument', 'findings', findings, 'must be a FindingTable');
  const n = x.length;
  const cols = findings.select(...codes).columns();
  const spans: [number, number][] = [];
  for (let k = 0; k < cols.index.length; k++) {
    const first = cols.index[k];
    if (first >= n) throw new SignalError('invalid-range', `findings[${k}].index`, first, `must be a sample index in [0, ${n - 1}]`);
    // a time gap cuts before its sample without removing one: a place of length 0
    spans.push([first, FINDING_CODES[cols.code[k]] === 'time-gap' ? first : Math.min(n, first + cols.length[k])]);
  }
  spans.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
  const places: number[] = [];
  for (const [first, end] of spans) {
    const m = places.length;
    if (m > 0 && places[m - 2] + places[m - 1] >= first && !(places[m - 1] === 0 && first > places[m - 2])) {
      places[m - 1] = Math.max(places[m - 2] + places[m - 1], end) - places[m - 2];
    } else places.push(first, end - first);
  }
  return segmentsOutside(x, places, 'split-at-dropouts', { codes: codes.join(','), minimumSegment }, minimumSegment, 'removed or cut');
}
