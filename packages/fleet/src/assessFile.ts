import { InputFiles, readJobFile, runAssessment, type CliChannel } from '@loopwise/cli';
import { FromToMatrix, RainflowCounter, RangeMeanMatrix, type CycleSink } from '@loopwise/rainflow';
import { FleetError } from './FleetError';
import type { ChannelFileResult, FileResult, FleetTask } from './FleetTask';
import { isInputError } from './isInputError';

/** A channel's name as a manifest names it: the job's `name`, else its column as written. */
export function channelName(c: CliChannel): string {
  return c.name ?? String(c.column);
}

/** Both matrices as one cycle sink: each cycle goes to each (one object; nothing per sample). */
class BothMatrices implements CycleSink {
  constructor(
    readonly rangeMean: RangeMeanMatrix,
    readonly fromTo: FromToMatrix,
  ) {}

  addCycle(from: number, to: number, count: number, startIndex: number, turnIndex: number, closeIndex: number): void {
    this.rangeMean.addCycle(from, to, count, startIndex, turnIndex, closeIndex);
    this.fromTo.addCycle(from, to, count, startIndex, turnIndex, closeIndex);
  }
}

/**
 * Assesses one file of a fleet: the task's job (read with `readJobFile`) applied to the file
 * through `runAssessment` of `@loopwise/cli` (the command's own recipe: streaming life sessions,
 * the second read for a repeating history), with the file's usage as its service per repeat;
 * the chunks of its first read are also counted, channel by channel, into the fleet's
 * range-mean and from-to matrices (the job's residue rule: `repeat` for a repeating history,
 * `half` for a one-off; the gate the assessment applies). `task.parseThread` false reads the
 * file on the calling thread (a pool worker: the pool already keeps every core busy). Deterministic: the same task gives the same result,
 * to the last bit, on any thread or machine.
 *
 * Throws on bad input ({@link FleetError}, or the error of the package that found it); use
 * {@link assessFileOrFailure} to get a failure result instead.
 */
export async function assessFile(task: FleetTask): Promise<FileResult> {
  const job = readJobFile(task.job, new InputFiles(), task.anywhere);
  if (job.events !== null) {
    throw new FleetError('fleet-job', 'events', 'events', `${task.where}: ${task.jobShown}: a fleet job assesses one file per row; its duty cycle (events) cannot be applied to a manifest's file`, task.row);
  }
  const known = job.channels.map(channelName);
  const channels = task.channels.map((name) => {
    const k = known.indexOf(name);
    if (k < 0) throw new FleetError('unknown-channel', 'channels', name, `${task.where}: channels: '${name}' is not a channel of ${task.jobShown} (its channels: ${known.join(', ')})`, task.row);
    return job.channels[k];
  });
  job.channels = channels;
  job.file = task.file;
  job.fileShown = task.shown;
  job.service = { unit: task.unit, perRepeat: task.usage };
  // the rainflow cycles of each channel go into the fleet's bins from the same read (the job's
  // residue rule: repeat for a repeating history, half for a one-off; the gate the sessions apply)
  const sinks = channels.map(() => new BothMatrices(new RangeMeanMatrix({ range: task.bins.range, mean: task.bins.mean }), new FromToMatrix({ from: task.bins.fromTo, to: task.bins.fromTo })));
  const counters: RainflowCounter[] = [];
  const results = await runAssessment(job, undefined, {
    keepLoops: false,
    parseThread: task.parseThread ?? true,
    onChunk: (chunk, gates) => {
      if (counters.length === 0) gates.forEach((gate, k) => counters.push(new RainflowCounter({ residue: job.repeating ? 'repeat' : 'half', gate, sink: sinks[k] })));
      for (let k = 0; k < counters.length; k++) counters[k].push(chunk.channels[k]);
    },
  });
  for (const c of counters) c.finish();
  const source = results[0].sources[0];
  const out: ChannelFileResult[] = results.map((r, k) => {
    const rep = r.report;
    const d = rep.damage.perRepeat;
    return {
      channel: task.channels[k],
      route: rep.damage.route,
      meanStress: rep.damage.meanStress,
      damagePerRepeat: d,
      damagePerUnit: d / task.usage,
      criticalDamage: job.criticalDamage ?? 1,
      lifeRepeats: rep.life.repeats,
      lifeService: rep.life.service ?? rep.life.repeats * task.usage,
      designService: rep.life.designService ?? rep.life.designRepeats * task.usage,
      rangeMean: sinks[k].rangeMean.toJSON(),
      fromTo: sinks[k].fromTo.toJSON(),
      gate: rep.gate.range,
      warnings: [
        ...source.warnings.filter((w) => w.channel === r.name || w.channel === '').map((w) => `signal: ${w.message}`),
        ...rep.warnings.map((w) => `assessment: ${w.message}`),
      ],
    };
  });
  return { format: 'loopwise-fleet-file', version: 1, key: task.key, row: task.row, file: task.shown, asset: task.asset, usage: task.usage, unit: task.unit, samples: source.samples, channels: out, failure: null };
}

/** The failure result of a task: the error's message, naming the row and file. */
export function failureOf(task: FleetTask, error: unknown): FileResult {
  const text = (error instanceof Error ? error.message : String(error)).replace(/\s*\n\s*/g, '; ');
  const message = text.startsWith(task.where) ? text : `${task.where} (${task.shown}): ${text}`;
  return { format: 'loopwise-fleet-file', version: 1, key: task.key, row: task.row, file: task.shown, asset: task.asset, usage: task.usage, unit: task.unit, samples: 0, channels: [], failure: { message, input: isInputError(error) } };
}

/**
 * {@link assessFile}, with an input error turned into a failure result (the other files go
 * on). Any other error is thrown: a fault of the program or machine, which a caller may retry.
 */
export async function assessFileOrFailure(task: FleetTask): Promise<FileResult> {
  try {
    return await assessFile(task);
  } catch (error) {
    if (isInputError(error)) return failureOf(task, error);
    throw error;
  }
}
