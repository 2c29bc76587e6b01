/** The model's assumptions, stated in every report. */
export const ASSUMPTIONS: readonly string[] = Object.freeze([
  'Uniaxial stress and strain at the notch root; multiaxial states are not modelled.',
  'The material follows its stabilised cyclic stress-strain curve (Ramberg-Osgood) from the first cycle; cyclic hardening or softening transients are not modelled.',
  "Masing behaviour: every branch after a reversal is the cyclic curve scaled by two; material memory after Clormann and Seeger (closed loops hand the path back; the first-loading curve is remembered).",
  'The notch rule (Neuber, Glinka or linear) maps the pseudo-elastic notch stress to local stress and strain; Kt or Kf as given.',
  'Crack initiation only (Coffin-Manson-Basquin strain-life curve with the chosen mean-stress correction); crack growth, surface finish, size, environment and residual stresses are not included unless they are in the material constants.',
  'Linear damage accumulation (Palmgren-Miner); sequence effects enter only through the local stress-strain memory.',
  'A repeating history: life per repeat comes from the stabilised pass, which starts from the memory the first pass left.',
]);

/** The caution that goes with every estimate. */
export const CAUTION =
  'Fatigue life estimates carry large scatter (a factor of several on life is common). Validate them by test on representative parts, apply scatter factors, and for safety-critical parts follow the applicable design codes and have the assessment reviewed by a licensed engineer.';

/** The stress-life route's assumptions, stated in every report of that route. */
export const STRESS_LIFE_ASSUMPTIONS: readonly string[] = Object.freeze([
  'Uniaxial nominal (or hot-spot) stress at the detail; multiaxial states are not modelled.',
  'Cycles by four-point rainflow counting (ASTM E1049-85); a repeating history closes its residue as it repeats, a one-off history counts it as half cycles.',
  'Linear-elastic stresses: the notch enters as the fatigue notch factor Kf on range and mean; local plasticity and its memory are not modelled (use the strain-life route where the notch yields).',
  'The S-N curve as given (its knee, slopes, cut-off and the standard\'s partial factors as chosen) with the chosen mean-stress correction of the amplitude; crack initiation and early growth as the curve represents them.',
  'Linear damage accumulation (Palmgren-Miner, with the critical damage sum given); no sequence effects.',
]);
