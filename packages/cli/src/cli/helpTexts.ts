/** Help texts of the command and its subcommands. */
export const HELP: Record<string, string> = {
  main: `loopwise: fatigue life of notched parts from measured load and strain files

Usage: loopwise <command> [options]

Commands:
  assess     estimate the fatigue life of a notched part from a measured file or a job file
  count      count the rainflow cycles of a channel: summary, range-mean matrix, spectrum
  margin     find the load factor at which the life falls to a target
  material   estimate strain-life constants from tensile strength or hardness, or list the handbook table
  demo       assess the bundled demo history (invented data) and print the summary
  help       show help for a command: loopwise help assess

Options for every command: --help, --version

Exit codes: 0 success, 1 failure, 2 usage or input error.
Estimates carry large scatter: validate by test, apply scatter factors, and follow the
applicable design codes and licensed engineering review for safety-critical parts.`,

  assess: `loopwise assess: estimate the fatigue life of a notched part

Usage: loopwise assess <file> [options]
       loopwise assess --job <job.json> [outputs]

The measured file is delimited text (comma, semicolon, tab or whitespace; header optional).
A repeating history (the default) is read twice: the second read goes up to its largest value.

Channel:
  --column <name|n>        column to assess (1-based number or header name); repeat for several.
                           Default: the one numeric column that is not a time; with several, choose
  --quantity <q>           stress, strain or load (default: from the file's unit, else stress)
  --unit <u>               MPa or ksi for stress; strain or microstrain for strain (default: the
                           file's units row or bracketed header unit, else MPa / strain)
  --mpa-per-unit <x>       nominal stress in MPa per unit of a load channel
  --sample-rate <Hz>       sample rate, or --time-column <name|n> (default: a strictly increasing
                           column named or measured as time)
File layout (detected unless given; the summary prints what was found):
  --skip-lines <n>         lines before the table (a logger's preamble) to ignore
  --delimiter <d>          comma, semicolon, tab or whitespace
  --decimal-mark <m>       point or comma
  --header-row yes|no      the first table line holds column names
  --units-row yes|no       the line under the header holds units (µε, ue, MPa, ksi, kN, V, s…)
  --comment-prefix <c>     lines starting with it are comments (default #; none for no comments)
Model:
  --material <m>           handbook name (e.g. "SAE 1045") or a .json file of constants
  --su <MPa>               or estimate the material from tensile strength (Uniform Material Law, steel)
  --hardness <HB>          or from Brinell hardness (Roessle-Fatemi)
  --kt <x> | --kf <x>      stress concentration (nominal stress or load channels); default 1
  --rule <r>               neuber (default), glinka or linear
  --mean-stress <c>         smithWatsonTopper (default), none, morrow, modifiedMorrow, walker, or all
  --gate <x>               gate range in the channel's unit; or --gate-fraction <f> [--full-scale <x>]
  --one-off                the history does not repeat (open loops count as half cycles)
  --scatter-factor <x>     design life = life / x (default 1)
  --cutoff-cycles <n>      loops living longer than n cycles do no damage (default: none)
  --critical-damage <x>    damage sum at failure (default 1)
Corrections of the signal (applied in this order before counting; every output lists them):
  --interpolate-spikes     the one-sample spikes the signal checks find replaced by the line
                           between their neighbours (one more read; the output says which)
  --exclude-flat-runs      cut out the flat runs the signal checks find (a dropout stuck at a
                           value or at zero; rows where any channel is flat), joined across as
                           --exclude-samples (one more read, shared with --interpolate-spikes)
  --exclude-samples <a>..<b>  cut samples a to b (numbers from 0, both included) out; repeat or
                           separate by commas for several, in increasing order; the history is
                           joined across each cut and later sample numbers count the samples kept
                           (the worst loops are also given in the file's numbers)
  --exclude-time <t0>..<t1>   cut the samples with t0 <= t <= t1 out, t in the time column's own
                           unit (ms for a column in ms) or seconds with --sample-rate
  --subtract-offset <x|mean>  subtract x (in the channel's unit, e.g. µε) or the channel's mean
                           (of the samples kept; one more read) from every sample
  --low-pass <Hz>          zero-phase Butterworth low-pass (forwards and backwards) with this
                           cut-off, below half the sample rate (--sample-rate, or a time column
                           with even steps); --low-pass-order <n> per pass, 1 … 16 (default 2).
                           Holds the channels in memory (16 bytes a sample, channel and time column;
                           refused above half of --memory-limit)
Stress-life route (an S-N curve instead of the strain-life model; no material needed):
  --sn-curve <spec>        iiw:<FAT>[,shear][,constant][,below-knee=…][,gamma-m=<x>],
                           en1993:<category>[,shear][,constant][,gamma-mf=<x>][,gamma-ff=<x>],
                           or basquin:stress=<S>,cycles=<N>,slope=<m>[,knee=<N>/<m>][,cutoff=<N>][,amplitude]
  --mean-stress <c>        there: none (default), goodman, gerber, morrow, smithWatsonTopper, walker, iiw, or all
  --ultimate-strength <MPa>, --sigma-f <MPa>, --iiw-category I|II|III   constants of those corrections
  --kf <x>                 fatigue notch factor on range and mean (default 1)
  --stress-factor <x>      a factor on every stress, e.g. a load partial factor (default 1)
  --hot-spot <rule>        the --columns are gauges at the IIW points, in order: typeALinear,
                           typeAQuadratic, typeBLinear or typeBQuadratic; one hot-spot channel is assessed
  --hot-spot-modulus <MPa> E for strain gauges (σ = E·ε)
  --service "<x> <unit>"   service one repeat stands for, e.g. "0.5 h" or "12 km"
  --job <file>             take all of the above from a job file (see the CLI README)
  --job-may-read-anywhere  let the job name files outside its own folder (off: they are refused)
  --memory-limit <MB>      stop with an error before using more memory (default 1024)
The file may be - (standard input).
Outputs (all or nothing, never over a file the run reads; - is standard output):
  --json                   print the JSON report instead of the summary
  --json-out <file>        write the JSON report
  --cycles-out <file>      write the loops as CSV
  --html-out <file>        write the HTML report with plots (opens offline)
  --quiet                  no progress display

Examples:
  loopwise assess fillet.csv --column strain_ue --quantity strain --unit microstrain --material "SAE 1045" --service "60 s"
  loopwise assess loads.csv --column 2 --quantity load --mpa-per-unit 4.2 --kt 2.3 --material steel.json --mean-stress all
  loopwise assess --job axle-job.json --html-out axle.html`,

  count: `loopwise count: rainflow cycles of a channel

Usage: loopwise count <file> [options]

  --column <name|n>        column (1-based number or header name); default as for assess
  --quantity, --unit       as for assess; the count stays in the file's unit (µε stays µε)
  --sample-rate <Hz>       or --time-column <name|n>
  --skip-lines, --delimiter, --decimal-mark, --header-row, --units-row, --comment-prefix
                           the file's layout, as for assess
  --gate <x>               gate range in the channel's unit; or --gate-fraction <f> of its range
  --residue <r>            half (default, ASTM E1049 half cycles), repeat or none
  --range-bins <n>         range bins of the matrix (default 32); --mean-bins <n> (default 32)
  --matrix-out <file>      write the range-mean matrix (format loopwise-cycle-matrix, version 1)
  --from-to-out <file>     write the from-to matrix (range bins on both axes, over the channel's span)
  --matrix-format <f>      json (default: loopwise-cycle-matrix, version 1) or csv (one row per bin)
  --cycles-out <file>      write every cycle as CSV
  --json                   print the summary as JSON
  --memory-limit <MB>      stop with an error before using more memory (default 1024)
Corrections of the signal, as for assess (applied in this order before the range is found and
the cycles counted; the summary lists each one):
  --interpolate-spikes     the one-sample spikes the signal checks find replaced by the line
                           between their neighbours (one more read)
  --exclude-flat-runs      cut out the flat runs the signal checks find (dropouts), as ranges
  --exclude-samples <a>..<b>, --exclude-time <t0>..<t1>
                           cut ranges out (repeat, or separate by commas; in increasing order);
                           the history is joined across each cut and the sample numbers of the
                           cycles CSV count the samples kept
  --subtract-offset <x|mean>  subtract x, in the channel's own unit as counted (µε stays µε), or
                           the mean of the samples kept (one more read)
  --low-pass <Hz>          zero-phase Butterworth low-pass below half the sample rate (needs
                           --sample-rate or a time column with even steps); --low-pass-order <n>
                           per pass, 1 … 16 (default 2). Holds the channel in memory (refused
                           above half of --memory-limit)
The file may be - (standard input); an output may be - (standard output).

Examples:
  loopwise count fillet.csv --column strain_ue --quantity strain --unit microstrain --matrix-out fillet-matrix.json
  loopwise count loads.csv --column 3 --gate-fraction 0.02 --residue repeat
  loopwise count rig.csv --column strain_ue --quantity strain --unit microstrain --interpolate-spikes --exclude-samples 0..4999`,

  margin: `loopwise margin: load factor at which the life falls to a target

Usage: loopwise margin <file> --target-repeats <n> [assess options]
       loopwise margin --job <job.json> --target-life <x> [--target-of design|mean]

Every sample is scaled by a factor f; the smallest f whose life is at most the target is
found by a scan over 0.05 … 20 and bisection to 1e-6 relative. Damage need not grow with the
load when mean stresses matter; the output says whether the scan saw it fall. The search runs
on the turning points of the history (the same loops at every factor); progress shows on a
terminal (--quiet hides it). The corrections of the signal (--interpolate-spikes,
--exclude-flat-runs, --exclude-samples, --exclude-time, --subtract-offset, --low-pass) apply as in assess, and the
factor scales the corrected samples.

  --target-repeats <n>     target life in repeats of the history (or of the job's duty cycle)
  --target-life <x>        or in the service unit: --service, or with --job the job's
                           service.perRepeat or its events' durations
  --target-of <which>      design (default): the design life, mean life ÷ scatter factor, must
                           reach the target; mean: the mean life must

Example:
  loopwise margin loads.csv --column 2 --kt 2.2 --material "SAE 1045" --service "2 h" --target-life 10000`,

  material: `loopwise material: strain-life constants

Usage: loopwise material --list
       loopwise material --su <MPa> [--method uniform-material-law|modified-universal-slopes] [options]
       loopwise material --hardness <HB>

  --list                   the handbook table (reference values, not certified design data); --json for the full records
  --su <MPa>               ultimate tensile strength
  --method <m>             uniform-material-law (default) or modified-universal-slopes
  --metal <m>              steel (default) or aluminium-titanium (Uniform Material Law)
  --reduction-of-area <f>  for modified universal slopes (0 … 1)
  --hardness <HB>          Brinell hardness (Roessle-Fatemi)
  --e <MPa>                Young's modulus (default 207000 for steel)
  --out <file>             write the material as JSON (usable with --material)

Examples:
  loopwise material --su 700 --out steel-700.json
  loopwise material --hardness 250`,

  demo: `loopwise demo: assess the bundled demo history

Usage: loopwise demo [--html-out <file>] [--json]

The demo is INVENTED data: a strain gauge at the shoulder fillet of a machined steel axle of a
loaded two-wheel utility trailer towed over a rough farm track (60 s at 200 Hz), SAE 1045 from
the handbook table, Smith-Watson-Topper, a gate of 20 µε, scatter factor 3; each repeat stands
for 0.25 km of track, so lives are given in repeats and in km.`,
};
