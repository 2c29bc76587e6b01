import type { CycleMatrixJSON } from '@loopwise/rainflow';
import type { FleetBins } from './FleetBins';

/**
 * One file of a fleet, ready to assess: everything a worker needs, as plain JSON (it crosses
 * threads and machines). Paths are absolute: a worker on another machine must see the same
 * paths (a shared or mirrored file system).
 */
export interface FleetTask {
  /** Deterministic key of the task's result (see {@link fileKey}); filled in by the planner. */
  key: string;
  /** Manifest row (1 = the first file listed). */
  row: number;
  /** The row as a person names it, for messages: `fleet.csv row 4`. */
  where: string;
  /** The measured file, resolved. */
  file: string;
  /** The file as the manifest wrote it. */
  shown: string;
  asset: string;
  /** The job's channels to assess, by name. */
  channels: string[];
  /** Service one repeat of the file stands for, in the fleet's service unit (> 0). */
  usage: number;
  /** The job file, resolved. */
  job: string;
  /** The job file as the manifest wrote it. */
  jobShown: string;
  /** Whether the job may read files outside its folder. */
  anywhere: boolean;
  bins: FleetBins;
  /** The service unit's name (`km`, `h`, …). */
  unit: string;
  /**
   * Parse the file on a thread of its own (default true). The local pool sets false when its
   * workers fill every core. How a file is read never changes its result, so this is not part of the key.
   */
  parseThread?: boolean;
}

/** The result of one channel of one file. */
export interface ChannelFileResult {
  channel: string;
  route: string;
  meanStress: string;
  /** Damage per repeat of the file (the stabilised pass for a repeating history). */
  damagePerRepeat: number;
  /** Damage per service unit: damage per repeat ÷ usage. */
  damagePerUnit: number;
  /** Damage at which the part is taken to fail (the job's critical damage, default 1). */
  criticalDamage: number;
  /** Life in repeats of the file, and in service units (repeats × usage). */
  lifeRepeats: number;
  lifeService: number;
  /** Life in service units after the job's scatter factor. */
  designService: number;
  /** Rainflow cycles of one repeat of the channel (engine units), range against mean. */
  rangeMean: CycleMatrixJSON;
  /** The same cycles from where they start to where they go. */
  fromTo: CycleMatrixJSON;
  /** Gate range applied to the count, in engine units. */
  gate: number;
  /** Warnings about the measured signal and the assessment, as sentences. */
  warnings: string[];
}

/** The result of one file: assessed, or failed with the reason. */
export interface FileResult {
  format: 'loopwise-fleet-file';
  version: 1;
  key: string;
  row: number;
  file: string;
  asset: string;
  usage: number;
  unit: string;
  samples: number;
  channels: ChannelFileResult[];
  /** Set when the file could not be assessed: the message names the row and the place. */
  failure: { message: string; input: boolean } | null;
}
