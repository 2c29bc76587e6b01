// Child process of the cli suite: assesses a file by the command's code path and prints the
// time, the damage and the peak resident set size.
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { runAssessment } from '@loopwise/cli';
import { handbookSteels } from '@loopwise/material';

const file = process.argv[2];
const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)');
const job = {
  material,
  meanStress: 'smithWatsonTopper',
  scatterFactor: 1,
  repeating: true,
  channels: [{ column: 'strain_ue', quantity: 'strain', unit: 'microstrain' }],
  file,
  events: null,
};
const t0 = performance.now();
const [result] = await runAssessment(job, undefined, { keepLoops: false });
const seconds = (performance.now() - t0) / 1000;
const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
console.log(JSON.stringify({ seconds, damage: result.report.damage.perRepeat, samples: result.report.timeline.samples, maxRssMB: m ? Number(m[1]) / 1024 : null }));
