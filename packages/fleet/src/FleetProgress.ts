/** Where a fleet run is: files finished (assessed or failed), of how many, and how many were found done already. */
export interface FleetProgress {
  done: number;
  total: number;
  failed: number;
  /** Results found in the store (an earlier run's) and not redone. */
  reused: number;
}

/** Called after every file that finishes. */
export type FleetProgressHandler = (progress: FleetProgress) => void;
