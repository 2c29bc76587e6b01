import type { IngestChunk, IngestReport, ReaderOptions, SignalWarning } from '@loopwise/ingest';

interface HeldChunk {
  firstSample: number;
  length: number;
  channels: Float64Array[];
  time: Float64Array | null;
}

/**
 * A reader whose chunks have the flagged one-sample spikes of each channel replaced by the
 * straight line between the samples on either side (adjacent spikes share one line), at the same
 * sample indices, so every loop, plot and output keeps the file's numbering. `spikes[k]` are the
 * sorted sample indices of channel k (from a first read's signal checks). A chunk is handed on
 * once the sample after its last spike has been read (usually one chunk late), as a copy: the
 * reader may reuse its buffers. A spike at the very start or end takes its one neighbour's value.
 */
export function spikeInterpolatedReader(read: (options: ReaderOptions) => Promise<IngestReport>, spikes: readonly Float64Array[]): (options: ReaderOptions) => Promise<IngestReport> {
  return async (options) => {
    const onChunk = options.onChunk;
    if (!onChunk) return read(options);
    const held: HeldChunk[] = [];
    const next = spikes.map(() => 0);
    // each channel's last sample handed on (the left neighbour of a spike at a chunk's start)
    const before = spikes.map(() => NaN);
    /** Sample `i` of channel k from the held chunks (NaN when not read yet or past the end). */
    const valueAt = (k: number, i: number): number => {
      for (const c of held) if (i >= c.firstSample && i < c.firstSample + c.length) return c.channels[k][i - c.firstSample];
      return NaN;
    };
    const readEnd = () => (held.length === 0 ? 0 : held[held.length - 1].firstSample + held[held.length - 1].length);
    /** Whether the head chunk's spike runs all have their right neighbour read (or the file ended). */
    const ready = (ended: boolean): boolean => {
      if (ended) return true;
      const c = held[0];
      const end = c.firstSample + c.length;
      return spikes.every((s, k) => {
        let q = next[k];
        while (q < s.length && s[q] < c.firstSample) q++;
        let last = -1;
        for (; q < s.length && s[q] < end; q++) last = q;
        if (last < 0) return true;
        while (last + 1 < s.length && s[last + 1] === s[last] + 1) last++;
        return s[last] + 1 < readEnd();
      });
    };
    const emit = () => {
      const c = held[0];
      const end = c.firstSample + c.length;
      c.channels.forEach((v, k) => {
        const s = spikes[k];
        while (next[k] < s.length && s[next[k]] < c.firstSample) next[k]++;
        for (let q = next[k]; q < s.length && s[q] < end; q++) {
          // the run of adjacent spikes from here, and the good samples either side of it
          let last = q;
          while (last + 1 < s.length && s[last + 1] === s[last] + 1) last++;
          const first = s[q];
          const left = first > c.firstSample ? v[first - 1 - c.firstSample] : before[k];
          const right = valueAt(k, s[last] + 1);
          const a = left === left ? left : right;
          const b = right === right ? right : left;
          const h = s[last] - first + 1;
          // the run's samples in this chunk now; those in later chunks when they are handed on
          for (let j = 0; j < h; j++) {
            const i = first + j;
            if (i < c.firstSample || i >= end || !(a === a)) continue;
            const t = (j + 1) / (h + 1);
            v[i - c.firstSample] = (1 - t) * a + t * b;
          }
          q = last;
        }
        if (c.length > 0) before[k] = v[c.length - 1];
      });
      held.shift();
      onChunk(c as IngestChunk);
    };
    const report = await read({
      ...options,
      onChunk: (chunk) => {
        held.push({ firstSample: chunk.firstSample, length: chunk.length, channels: chunk.channels.map((v) => v.slice(0, chunk.length)), time: chunk.time ? chunk.time.slice(0, chunk.length) : null });
        while (held.length > 1 && ready(false)) emit();
      },
    });
    while (held.length > 0) emit();
    return report;
  };
}

/** The warning that says which spikes were interpolated (kind 'spikes-interpolated'). */
export function interpolatedWarning(channel: string, spikes: Float64Array): SignalWarning {
  const shown = Array.from(spikes.subarray(0, 5)).join(', ') + (spikes.length > 5 ? `, … (${spikes.length - 5} more)` : '');
  return {
    kind: 'spikes-interpolated',
    channel,
    samples: spikes.length,
    ranges: Array.from(spikes.subarray(0, 5), (i) => ({ first: i, last: i })),
    rangesOmitted: Math.max(0, spikes.length - 5),
    message: `${channel}: ${spikes.length} spike(s) interpolated between their neighbours (asked for) at sample(s) ${shown}; the assessment is of the corrected samples`,
  };
}
