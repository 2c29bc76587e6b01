// The worker thread of the local pool (built to dist/poolWorker.js): Piscina calls the default
// export with one task and sends its result back.
import { assessFileOrFailure } from './assessFile';
import type { FileResult, FleetTask } from './FleetTask';

export default function assessInWorker(task: FleetTask): Promise<FileResult> {
  return assessFileOrFailure(task);
}
