// Okabe and Ito (2008), "Color universal design": distinguishable with the common colour-vision
// deficiencies; their yellow is left out (too light on white paper).
const COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];
const DASHES = ['', '6 3', '2 3'];

/** Stroke colour and dash pattern of the loop of a rank (1-based): colours first, then dashes. */
export function rankStyle(rank: number): { colour: string; dash: string } {
  const i = Math.max(0, rank - 1);
  return { colour: COLOURS[i % COLOURS.length], dash: DASHES[Math.floor(i / COLOURS.length) % DASHES.length] };
}
