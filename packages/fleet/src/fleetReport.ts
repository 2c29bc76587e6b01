import { encodeNumber } from '@loopwise/base';
import { CAUTION } from '@loopwise/engine';
import { matrixExceedance } from './matrixExceedance';
import type { FleetResult } from './mergeFleet';

/** Version of the fleet JSON (`loopwise-fleet-report`). */
export const FLEET_REPORT_VERSION = 1;

/** What the fleet's outputs say about safety, beside the engine's caution. */
export const FLEET_CAUTION =
  'Fleet statistics and extrapolated spectra are estimates built on estimates: the damage of each file carries the scatter of the fatigue model, and the extrapolation assumes that the target service repeats the measured usage mix with an exponential tail of ranges. Validate predictions by test, apply scatter factors, and defer to the applicable design codes and licensed engineering review for safety-critical parts.';

/** JSON with non-finite numbers and -0 in base's exact encoding (JSON has no Infinity). */
export function fleetJson(value: unknown): string {
  return JSON.stringify(value, (_k, v) => (typeof v === 'number' && (!Number.isFinite(v) || Object.is(v, -0)) ? encodeNumber(v) : v), 2) + '\n';
}

/**
 * The fleet's JSON report: deterministic (no dates, fixed key order), small (per-asset sums and
 * the fleet's figures; the spectra as exceedance lists; the per-file table is in Parquet and
 * the full matrices in `spectra.json`).
 */
export function fleetReport(fleet: FleetResult, tool: string): string {
  return fleetJson({
    format: 'loopwise-fleet-report',
    version: FLEET_REPORT_VERSION,
    tool,
    unit: fleet.settings.unit,
    targetService: fleet.settings.targetService,
    counts: fleet.counts,
    failures: fleet.failures,
    channels: fleet.channels.map((c) => ({
      channel: c.channel,
      assets: c.assets,
      files: c.files,
      usage: c.usage,
      damage: c.damage,
      damagePerUnit: c.damagePerUnit,
      distribution: c.distribution,
      spectrum: matrixExceedance(c.rangeMean),
      outsideBins: c.rangeMean.outside.count,
      extrapolation:
        c.extrapolation === null
          ? null
          : {
              targetService: c.extrapolation.targetService,
              factor: c.extrapolation.tail.factor,
              damageLinear: c.extrapolation.damageLinear,
              linear: matrixExceedance(c.extrapolation.linear),
              tail: {
                method: 'peaks over threshold, exponential excess (Johannesson 2006)',
                fitted: c.extrapolation.tail.fitted,
                threshold: c.extrapolation.tail.threshold,
                meanExcess: c.extrapolation.tail.meanExcess,
                tailCycles: c.extrapolation.tail.tailCycles,
                largestRange: c.extrapolation.tail.largestRange,
                measuredLargestRange: c.extrapolation.tail.measuredLargestRange,
                note: c.extrapolation.tail.note,
                spectrum: matrixExceedance(c.extrapolation.tail.matrix),
              },
            },
    })),
    assets: fleet.assets,
    caution: CAUTION,
    fleetCaution: FLEET_CAUTION,
  });
}

/** The combined matrices of every channel (exact encoding; they add and load again with `fromJSON`). */
export function spectraJson(fleet: FleetResult): string {
  return fleetJson({
    format: 'loopwise-fleet-spectra',
    version: 1,
    unit: fleet.settings.unit,
    channels: fleet.channels.map((c) => ({
      channel: c.channel,
      usage: c.usage,
      rangeMean: c.rangeMean.toJSON(),
      fromTo: c.fromTo.toJSON(),
      extrapolated:
        c.extrapolation === null ? null : { targetService: c.extrapolation.targetService, linear: c.extrapolation.linear.toJSON(), tail: c.extrapolation.tail.matrix.toJSON() },
    })),
  });
}
