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
