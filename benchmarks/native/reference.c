/*
 * Native reference of the benchmark's hot stages, for benchmarks/suites/native.mjs.
 *
 * A plain C11 program, written for this benchmark from the published methods (not a port of
 * the packages' code), that does the same work as the JS packages on the same history and
 * writes the same result tables (struct-of-arrays doubles, grown by doubling):
 *
 *   scan      min/max of the history (the pinned baseline of benchmarks/harness.mjs)
 *   exp       exp() of the pinned arguments of the compute-bound baseline, summed
 *   rainflow  turning points (plateaus collapse to their first sample; first and last sample
 *             kept) and four-point rainflow counting, residue as half cycles: a full cycle
 *             (b, c) when |c-b| < |b-a| and |c-b| <= |d-c| (a range equal to the one before it
 *             closes that earlier range: the count equals ASTM E1049-85 5.4.4 cycle by cycle).
 *             Columns range, mean, from, to, count, startIndex, turnIndex, closeIndex.
 *   tracker   the memory-aware local stress-strain tracker (Clormann and Seeger, Stahlbau 55(3),
 *             1986, 65-71) on a repeating block, nominal input, Neuber's rule on the
 *             Ramberg-Osgood cyclic curve and Masing branches; first pass, then the second pass
 *             up to the block's first sample of largest |value| and, when the memories agree
 *             there, reuse of the first pass's loops from that sample on. Loop table stressMax,
 *             stressMin, strainMax, strainMin, startIndex, turnIndex, closeIndex, count; the
 *             reversal table (index, value, stress, strain) too, as the JS tracker keeps it by
 *             default.
 *   pipeline  the tracker without the reversal table, then the Smith-Watson-Topper life of every
 *             loop of both passes, the Palmgren-Miner damage column of the stabilised pass and
 *             the compensated (Neumaier) sums of the stabilised and the first pass.
 *
 * Solves (--solve): `newton` (default) runs Newton's method for every Neuber and SWT solve;
 * `table` answers Neuber solves from a verified cubic Hermite table of σ(a), ε(a) where its
 * measured error is at most a tenth of the tolerance (Newton elsewhere) and starts every SWT
 * solve from a cubic Hermite table of the root, the same kind of method as the JS packages use.
 *
 * Each stage is timed by the program itself with clock_gettime(CLOCK_MONOTONIC): `warmup` untimed
 * runs, then `runs` timed runs, the median reported (as benchmarks/harness.mjs does). Tables
 * are allocated afresh in every run and freed after the clock stops. Output: one JSON object on
 * stdout with per-stage seconds and check values.
 *
 * Build: cc -O3 -std=c11 -o reference reference.c -lm   (plain -O3, no fast-math: the results
 * must agree with the JS packages).
 *
 * Usage: reference --history FILE (raw little-endian binary64) [--stages scan,exp,rainflow,
 *   tracker,pipeline] [--solve newton|table] --E --sigmaF --b --epsilonF --c --K --n (material) [--tracker-kt 2.5]
 *   [--pipeline-kt 2] [--load-to-stress 1] [--offset 0] [--tolerance 1e-10] [--exp-calls 1e7]
 *   [--warmup 3] [--runs 7] [--pipeline-warmup 1] [--pipeline-runs 3]
 */
#define _POSIX_C_SOURCE 199309L
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <stdint.h>
#include <time.h>

static const double LN2 = 0.6931471805599453; /* ln 2 */

/* ------------------------------------------------------------------------------------------ */
/* small helpers */

static void fail(const char *msg, double value, long index) {
  fprintf(stderr, "reference: %s (value %.17g, index %ld)\n", msg, value, index);
  exit(2);
}

static void *xmalloc(size_t bytes) {
  void *p = malloc(bytes ? bytes : 1);
  if (!p) fail("out of memory", (double)bytes, -1);
  return p;
}

static double *grow_column(double *col, size_t cap) {
  double *p = realloc(col, cap * sizeof(double));
  if (!p) fail("out of memory", (double)cap, -1);
  return p;
}

static double now_seconds(void) {
  struct timespec ts;
  clock_gettime(CLOCK_MONOTONIC, &ts);
  return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

static int cmp_double(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return x < y ? -1 : x > y;
}

static double median(double *t, int n) {
  qsort(t, (size_t)n, sizeof(double), cmp_double);
  return t[n / 2];
}

/* Neumaier's improved Kahan-Babuska summation (A. Neumaier, ZAMM 54 (1974) 39-51). */
static double neumaier_sum(const double *x, size_t n) {
  double s = 0, c = 0;
  for (size_t i = 0; i < n; i++) {
    double v = x[i], t = s + v;
    c += fabs(s) >= fabs(v) ? (s - t) + v : (v - t) + s;
    s = t;
  }
  return s + c;
}

/* ------------------------------------------------------------------------------------------ */
/* scan and exp baselines */

static double minmax_scan(const double *x, long n) {
  double lo = INFINITY, hi = -INFINITY;
  for (long i = 0; i < n; i++) {
    double v = x[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return hi - lo;
}

/* The pinned arguments of harness.mjs expArguments: a Weyl sequence u_i = frac(u_{i-1} + g) on
   [0, 1) mapped to [-2, 2). Same operations in the same order, so the same doubles. */
static void exp_arguments(double *x, long n) {
  const double g = 0.6180339887498949;
  double u = 0;
  for (long i = 0; i < n; i++) {
    u += g;
    if (u >= 1) u -= 1;
    x[i] = 4 * u - 2;
  }
}

static double exp_calls(const double *x, long n) {
  double s = 0;
  for (long i = 0; i < n; i++) s += exp(x[i]);
  return s;
}

/* ------------------------------------------------------------------------------------------ */
/* rainflow: turning points and four-point counting into a cycle table */

typedef struct {
  double *range, *mean, *from, *to, *count, *start, *turn, *close;
  size_t n, cap;
} CycleTable;

static void cycles_init(CycleTable *t, size_t cap) {
  t->n = 0;
  t->cap = cap;
  t->range = xmalloc(cap * sizeof(double));
  t->mean = xmalloc(cap * sizeof(double));
  t->from = xmalloc(cap * sizeof(double));
  t->to = xmalloc(cap * sizeof(double));
  t->count = xmalloc(cap * sizeof(double));
  t->start = xmalloc(cap * sizeof(double));
  t->turn = xmalloc(cap * sizeof(double));
  t->close = xmalloc(cap * sizeof(double));
}

static void cycles_free(CycleTable *t) {
  free(t->range); free(t->mean); free(t->from); free(t->to);
  free(t->count); free(t->start); free(t->turn); free(t->close);
}

static void cycles_add(CycleTable *t, double from, double to, double count, double start, double turn, double close) {
  if (t->n == t->cap) {
    size_t cap = 2 * t->cap;
    t->range = grow_column(t->range, cap); t->mean = grow_column(t->mean, cap);
    t->from = grow_column(t->from, cap); t->to = grow_column(t->to, cap);
    t->count = grow_column(t->count, cap); t->start = grow_column(t->start, cap);
    t->turn = grow_column(t->turn, cap); t->close = grow_column(t->close, cap);
    t->cap = cap;
  }
  size_t i = t->n++;
  double sum = from + to;
  t->range[i] = to > from ? to - from : from - to;
  t->mean[i] = sum - sum == 0 ? sum * 0.5 : from * 0.5 + to * 0.5; /* no overflow for huge values */
  t->from[i] = from;
  t->to[i] = to;
  t->count[i] = count;
  t->start[i] = start;
  t->turn[i] = turn;
  t->close[i] = close;
}

typedef struct {
  double *v, *i;
  size_t top, cap;
  CycleTable *out;
  int keepStart; /* 1 for a repeating history: no range from the start is final (no step 5) */
} RainflowStack;

/* One turning point onto the stack: closes the full cycles it completes (four-point rule), then
   drops a leading range that the next one reaches (ASTM E1049-85 5.4.4 step 5: a half cycle). */
static void rainflow_point(RainflowStack *s, double v, double idx) {
  if (s->top == s->cap) {
    s->cap *= 2;
    s->v = grow_column(s->v, s->cap);
    s->i = grow_column(s->i, s->cap);
  }
  double *sv = s->v, *si = s->i;
  size_t top = s->top;
  sv[top] = v;
  si[top] = idx;
  top++;
  while (top >= 4) {
    double a = sv[top - 4], b = sv[top - 3], c = sv[top - 2], d = sv[top - 1];
    double x = fabs(c - b);
    if (x < fabs(b - a) && x <= fabs(d - c)) {
      cycles_add(s->out, b, c, 1, si[top - 3], si[top - 2], si[top - 1]);
      sv[top - 3] = d;
      si[top - 3] = si[top - 1];
      top -= 2;
    } else {
      break;
    }
  }
  if (top == 3 && !s->keepStart && fabs(sv[2] - sv[1]) >= fabs(sv[1] - sv[0])) {
    cycles_add(s->out, sv[0], sv[1], 0.5, si[0], si[1], si[1]);
    sv[0] = sv[1]; si[0] = si[1];
    sv[1] = sv[2]; si[1] = si[2];
    top = 2;
  }
  s->top = top;
}

/*
 * Closes the residue of a repeating history (ASTM E1049-85 5.4.5): the residue read as a ring
 * from its point of largest magnitude, that point closing it; the turning points of the ring
 * (plateaus and points that are no reversal across the seam drop), then every range Y that the
 * next range X reaches (X >= Y) is one full cycle.
 */
static void close_repeating_residue(const double *v, const double *vi, size_t m, CycleTable *out) {
  if (m < 2) return;
  size_t j = 0;
  for (size_t k = 1; k < m; k++) if (fabs(v[k]) > fabs(v[j])) j = k;
  double *tv = xmalloc((m + 2) * sizeof(double)), *ti = xmalloc((m + 2) * sizeof(double));
  size_t n = 0;
  double ext = v[j], ei = vi[j];
  int dir = 0;
  tv[n] = ext; ti[n++] = ei;
  for (size_t k = 1; k <= m; k++) {
    double x = v[(j + k) % m], xi = vi[(j + k) % m];
    if (dir > 0) {
      if (x > ext) { ext = x; ei = xi; }
      else if (x < ext) { tv[n] = ext; ti[n++] = ei; dir = -1; ext = x; ei = xi; }
    } else if (dir < 0) {
      if (x < ext) { ext = x; ei = xi; }
      else if (x > ext) { tv[n] = ext; ti[n++] = ei; dir = 1; ext = x; ei = xi; }
    } else if (x != ext) {
      dir = x > ext ? 1 : -1;
      ext = x;
      ei = xi;
    }
  }
  if (dir != 0) { tv[n] = ext; ti[n++] = ei; }
  size_t top = 0;
  for (size_t k = 0; k < n; k++) {
    tv[top] = tv[k];
    ti[top] = ti[k];
    top++;
    while (top >= 3) {
      double x = fabs(tv[top - 1] - tv[top - 2]), y = fabs(tv[top - 2] - tv[top - 3]);
      if (x < y) break;
      cycles_add(out, tv[top - 3], tv[top - 2], 1, ti[top - 3], ti[top - 2], ti[top - 1]);
      tv[top - 3] = tv[top - 1];
      ti[top - 3] = ti[top - 1];
      top -= 2;
    }
  }
  free(tv);
  free(ti);
}

/* Counts the whole history into `out` (repeating: the residue closed; else half cycles); returns the number of turning points. */
static long rainflow_count_policy(const double *x, long n, CycleTable *out, int repeating);

static long rainflow_count(const double *x, long n, CycleTable *out) {
  return rainflow_count_policy(x, n, out, 0);
}

static long rainflow_count_policy(const double *x, long n, CycleTable *out, int repeating) {
  RainflowStack s = { xmalloc(256 * sizeof(double)), xmalloc(256 * sizeof(double)), 0, 256, out, repeating };
  long points = 0;
  if (n > 0) {
    double ext = x[0];
    if (ext - ext != 0) fail("sample is not finite", ext, 0);
    long ei = 0;
    int dir = 0;
    rainflow_point(&s, ext, 0);
    points = 1;
    for (long i = 1; i < n; i++) {
      double v = x[i];
      if (v - v != 0) fail("sample is not finite", v, i);
      if (dir > 0) {
        if (v > ext) { ext = v; ei = i; }
        else if (v < ext) { rainflow_point(&s, ext, (double)ei); points++; dir = -1; ext = v; ei = i; }
      } else if (dir < 0) {
        if (v < ext) { ext = v; ei = i; }
        else if (v > ext) { rainflow_point(&s, ext, (double)ei); points++; dir = 1; ext = v; ei = i; }
      } else if (v != ext) {
        dir = v > ext ? 1 : -1;
        ext = v;
        ei = i;
      }
    }
    if (dir != 0) { rainflow_point(&s, ext, (double)ei); points++; } /* the last extreme */
    if (repeating) close_repeating_residue(s.v, s.i, s.top, out);
    else for (size_t k = 0; k + 1 < s.top; k++) cycles_add(out, s.v[k], s.v[k + 1], 0.5, s.i[k], s.i[k + 1], s.i[k + 1]);
  }
  free(s.v);
  free(s.i);
  return points;
}

/* ------------------------------------------------------------------------------------------ */
/* The stress-life route: rainflow with the repeat residue, then every cycle on an S-N curve */

/*
 * Palmgren-Miner damage of the counted cycles on a weld detail curve of the IIW recommendations
 * (Hobbacher, IIW-2259-15): FAT class `fat` at 2e6 cycles, slope 3 down to the knee at 1e7
 * cycles, then Haibach's slope 2·3 − 1 = 5 for variable amplitude; the stress amplitude corrected
 * by Goodman, σar = σa / (1 − σm/Su) for σm >= 0 (unchanged below zero mean). The same equations,
 * in the same order, as the stress-life suite's literal reference.
 */
static double stress_life_damage(const CycleTable *t, double fat, double su) {
  double knee = fat * pow(2e6 / 1e7, 1.0 / 3.0);
  double d = 0;
  for (size_t i = 0; i < t->n; i++) {
    double sa = t->range[i] / 2, sm = t->mean[i];
    double sar = sm < 0 ? sa : sa / (1 - sm / su);
    double r = 2 * sar;
    if (r == 0) continue;
    double life = r >= knee ? 2e6 * pow(fat / r, 3) : 1e7 * pow(knee / r, 5);
    d += t->count[i] / life;
  }
  return d;
}

/* ------------------------------------------------------------------------------------------ */
/* Neuber's rule on the cyclic curve, and the memory-aware tracker */

typedef struct {
  double E, sigmaF, b, epsilonF, c, K, n;
} Material;

/*
 * An answer table of Neuber's rule (the --solve table mode): σ(a) and ε(a) as cubic Hermite
 * pieces on cells that split every binade of the amplitude a into 2^bits equal parts, so a cell
 * is found from the leading bits of a's binary64 encoding (exponent and top mantissa bits).
 * Nodes are solved to rounding, slopes come from the implicit derivative. After it is built,
 * its error is measured against the exact solve at a quarter, half and three quarters of every
 * cell; it serves a tolerance only when the tolerance is at least ten times that worst error.
 * Below its first cell the plastic strain is under 1e-17 of the elastic one (σ = a, ε = a/E to
 * rounding); above its last cell, and when it cannot serve the tolerance, Newton runs.
 */
typedef struct {
  int bits;
  long keyLo, cells;
  double *tab; /* per cell: left end, 1/width, 4 coefficients of σ, 4 of ε */
  double worst;
} NeuberTable;

typedef struct {
  double E, m, lnK, lnE, tol;
  int maxIterations;
  long iterations, solves;
  const NeuberTable *table; /* NULL: Newton for every solve */
} NeuberSolver;

/*
 * Neuber's rule at pseudo-elastic amplitude a > 0 on the first-loading curve
 * ε = σ/E + (σ/K')^(1/n'):  σ·ε = a²/E  (H. Neuber, J. Appl. Mech. 28 (1961) 544-550; cyclic form
 * T. H. Topper, R. M. Wetzel, J. Morrow, J. Materials 4 (1969) 200-209). With s = ln σ, m = 1/n'
 * and the elastic root s_e = ln a, the equation is
 *     F(s) = 2(s - s_e) + ln(1 + r(s)) = 0,   r(s) = E·σ^(m-1)·K'^(-m)  (plastic over elastic strain)
 * F is convex and increasing; the elastic root and the fully plastic root each lie at or above the
 * root, so Newton from the smaller of them decreases monotonically onto it (no bracket needed, no
 * NaN). F' = (2 + (1+m) r)/(1 + r) >= 2 and F'' <= (m-1)²/4, so after a step δ the remaining error
 * in s (the relative error of σ) is at most (m-1)²/16·δ²; the solve stops when that bound is at
 * most the tolerance. Each step costs one exp and one log1p.
 */
static void neuber_newton(NeuberSolver *ns, double a, double tol, double *stress, double *strain) {
  const double m = ns->m, se = log(a);
  const double cr = ns->lnE - m * ns->lnK; /* ln r = (m-1)·s + cr */
  const double sp = (2 * se - cr) / (m + 1); /* fully plastic root: σ^(1+m)·K'^(-m) = a²/E */
  const double bound = (m - 1) * (m - 1) / 16;
  double s = se < sp ? se : sp;
  int k = 0;
  for (;;) {
    double r = exp((m - 1) * s + cr);
    double f = 2 * (s - se) + log1p(r);
    double step = f * (1 + r) / (2 + (1 + m) * r);
    s -= step;
    k++;
    if (bound * step * step <= tol || step == 0) break;
    if (k >= ns->maxIterations) fail("Neuber solve did not converge", a, -1);
  }
  ns->iterations += k;
  ns->solves++;
  double sigma = exp(s);
  *stress = sigma;
  *strain = sigma / ns->E + exp(m * (s - ns->lnK));
}

static void neuber_solve(NeuberSolver *ns, double a, double *stress, double *strain) {
  if (a == 0) { *stress = 0; *strain = 0; return; }
  const NeuberTable *t = ns->table;
  if (t != NULL) {
    uint64_t bits;
    memcpy(&bits, &a, sizeof bits);
    long i = (long)(bits >> (52 - t->bits)) - t->keyLo;
    if (i < 0) { *stress = a; *strain = a / ns->E; return; }
    if (i < t->cells) {
      const double *c = t->tab + 10 * i;
      double f = (a - c[0]) * c[1];
      *stress = c[2] + f * (c[3] + f * (c[4] + f * c[5]));
      *strain = c[6] + f * (c[7] + f * (c[8] + f * c[9]));
      return;
    }
  }
  neuber_newton(ns, a, ns->tol, stress, strain);
}

/* σ, ε and their slopes in a, solved to rounding (for the table's nodes and its check). */
static void neuber_exact(NeuberSolver *ns, double a, double *sg, double *ep, double *dsg, double *dep) {
  neuber_newton(ns, a, 1e-17, sg, ep);
  double m = ns->m, s = log(*sg);
  double r = exp((m - 1) * s + ns->lnE - m * ns->lnK);
  double dsdse = 2 * (1 + r) / (2 + (1 + m) * r); /* ds/d(ln a) from F(s, ln a) = 0 */
  *dsg = *sg / a * dsdse;
  *dep = (1 / ns->E + m * exp(m * (s - ns->lnK)) / *sg) * *dsg;
}

static void hermite(double *c, double y0, double y1, double d0, double d1) {
  c[0] = y0;
  c[1] = d0;
  c[2] = 3 * (y1 - y0) - 2 * d0 - d1;
  c[3] = 2 * (y0 - y1) + d0 + d1;
}

/* Builds and checks an answer table with 2^bits cells per binade (NULL when the range is unusable). */
static NeuberTable *neuber_table(const NeuberSolver *proto, int bits) {
  NeuberSolver ns = *proto;
  const double m = ns.m;
  /* ln σ where the plastic strain equals the elastic one; the table spans from where it is 1e-17
     of the elastic one to 2^16 times that crossover */
  double tCross = (m * ns.lnK - ns.lnE) / (m - 1);
  long binLo = (long)floor((tCross + log(1e-17) / (m - 1)) / LN2);
  long binHi = (long)ceil(tCross / LN2) + 16;
  if (!(binLo >= -1020 && binHi <= 1020 && binHi > binLo)) return NULL;
  long per = 1L << bits, cells = (binHi - binLo) << bits;
  NeuberTable *t = xmalloc(sizeof *t);
  t->bits = bits;
  t->keyLo = (binLo + 1023) << bits;
  t->cells = cells;
  t->tab = xmalloc((size_t)cells * 10 * sizeof(double));
  double aL = 0, sL = 0, eL = 0, dsL = 0, deL = 0;
  for (long j = 0; j <= cells; j++) {
    double a = ldexp(1 + (double)(j & (per - 1)) / (double)per, (int)(binLo + (j >> bits))); /* exact */
    double sg, ep, dsg, dep;
    neuber_exact(&ns, a, &sg, &ep, &dsg, &dep);
    if (j > 0) {
      double h = a - aL, *c = t->tab + 10 * (j - 1);
      c[0] = aL;
      c[1] = 1 / h;
      hermite(c + 2, sL, sg, dsL * h, dsg * h);
      hermite(c + 6, eL, ep, deL * h, dep * h);
    }
    aL = a; sL = sg; eL = ep; dsL = dsg; deL = dep;
  }
  double worst = 0;
  for (long j = 0; j < cells; j++) {
    const double *c = t->tab + 10 * j;
    for (int k = 1; k <= 3; k++) {
      double f = k / 4.0, sg, ep, dsg, dep;
      neuber_exact(&ns, c[0] + f / c[1], &sg, &ep, &dsg, &dep);
      double st = c[2] + f * (c[3] + f * (c[4] + f * c[5]));
      double et = c[6] + f * (c[7] + f * (c[8] + f * c[9]));
      double err = fmax(fabs(st / sg - 1), fabs(et / ep - 1));
      if (!(err < INFINITY)) { free(t->tab); free(t); return NULL; }
      if (err > worst) worst = err;
    }
  }
  t->worst = worst;
  return t;
}

typedef struct {
  double *index, *value, *stress, *strain;
  size_t n, cap;
} ReversalTable;

typedef struct {
  double *stressMax, *stressMin, *strainMax, *strainMin, *start, *turn, *close, *count;
  size_t n, cap;
} LoopTable;

static void reversals_reserve(ReversalTable *t, size_t cap) {
  if (cap <= t->cap) return;
  t->index = grow_column(t->index, cap); t->value = grow_column(t->value, cap);
  t->stress = grow_column(t->stress, cap); t->strain = grow_column(t->strain, cap);
  t->cap = cap;
}

static void loops_reserve(LoopTable *t, size_t cap) {
  if (cap <= t->cap) return;
  t->stressMax = grow_column(t->stressMax, cap); t->stressMin = grow_column(t->stressMin, cap);
  t->strainMax = grow_column(t->strainMax, cap); t->strainMin = grow_column(t->strainMin, cap);
  t->start = grow_column(t->start, cap); t->turn = grow_column(t->turn, cap);
  t->close = grow_column(t->close, cap); t->count = grow_column(t->count, cap);
  t->cap = cap;
}

typedef struct {
  NeuberSolver solver;
  double scale, offset, initial, strainLimit;
  int recordReversals;
  ReversalTable revs;
  LoopTable loops;
  long next, samples, extIndex;
  int dir;
  double ext, thr;
  /* memory: reversal points still open (value, index, local stress, local strain) */
  double *sv, *si, *ss, *se;
  size_t k, memCap;
  int beyond;
  long firstBeyond;
  /* first reversal point of largest |value| and the table rows at that time */
  double peakAbs, peakValue;
  long peakIndex;
  size_t peakReversalRow, peakLoopRow;
  double outStress, outStrain;
} Tracker;

static void tracker_init(Tracker *t, const Material *mat, double scale, double offset, double tol, int recordReversals) {
  memset(t, 0, sizeof *t);
  t->solver.E = mat->E;
  t->solver.m = 1 / mat->n;
  t->solver.lnK = log(mat->K);
  t->solver.lnE = log(mat->E);
  t->solver.tol = tol;
  t->solver.maxIterations = 60;
  t->scale = scale;
  t->offset = offset;
  t->initial = 0;
  t->ext = t->initial;
  t->extIndex = -1;
  t->strainLimit = mat->sigmaF / mat->E + mat->epsilonF;
  t->recordReversals = recordReversals;
  reversals_reserve(&t->revs, 256);
  loops_reserve(&t->loops, 256);
  t->memCap = 64;
  t->sv = xmalloc(64 * sizeof(double)); t->si = xmalloc(64 * sizeof(double));
  t->ss = xmalloc(64 * sizeof(double)); t->se = xmalloc(64 * sizeof(double));
  t->firstBeyond = -1;
  t->peakAbs = -1;
  t->peakIndex = -1;
}

static void tracker_free(Tracker *t) {
  free(t->revs.index); free(t->revs.value); free(t->revs.stress); free(t->revs.strain);
  free(t->loops.stressMax); free(t->loops.stressMin); free(t->loops.strainMax); free(t->loops.strainMin);
  free(t->loops.start); free(t->loops.turn); free(t->loops.close); free(t->loops.count);
  free(t->sv); free(t->si); free(t->ss); free(t->se);
}

/* The level whose reaching closes the newest loop (memory 1, 2) or rejoins the first-loading
   curve beyond the mirror of the oldest point (memory 3). */
static void set_threshold(Tracker *t) {
  size_t k = t->k;
  t->thr = k >= 2 ? t->sv[k - 2] : k == 1 ? -t->sv[0] : t->dir * INFINITY;
}

/* Local σ, ε at the extreme `ext` on the current branch: the first-loading curve when the memory
   is empty, else the Masing branch from the newest memory point (twice the first-loading response
   at half the range). */
static void at_extreme(Tracker *t, int reversal) {
  double v = t->ext, a;
  size_t k = t->k;
  if (k == 0) a = t->scale * fabs(v);
  else a = t->scale * fabs(v - t->sv[k - 1]) * 0.5;
  if (a == INFINITY) fail("pseudo-elastic amplitude overflows", v, t->extIndex);
  double s, e;
  neuber_solve(&t->solver, a, &s, &e);
  if (s == INFINITY || e == INFINITY) fail("local stress or strain overflows", v, t->extIndex);
  if (reversal && e > t->strainLimit && !t->beyond) { t->beyond = 1; t->firstBeyond = t->extIndex; }
  if (k == 0) {
    t->outStress = v < 0 ? -s : s;
    t->outStrain = v < 0 ? -e : e;
  } else if (t->dir > 0) {
    t->outStress = t->ss[k - 1] + 2 * s;
    t->outStrain = t->se[k - 1] + 2 * e;
  } else {
    t->outStress = t->ss[k - 1] - 2 * s;
    t->outStrain = t->se[k - 1] - 2 * e;
  }
}

/* A reversal at the pending extreme: solve, record, push onto the memory, turn. */
static void reverse(Tracker *t) {
  double v = t->ext, av = fabs(v);
  at_extreme(t, 1);
  if (av > t->peakAbs) {
    t->peakAbs = av;
    t->peakValue = v;
    t->peakIndex = t->extIndex;
    t->peakReversalRow = t->revs.n;
    t->peakLoopRow = t->loops.n;
  }
  if (t->recordReversals) {
    ReversalTable *r = &t->revs;
    if (r->n == r->cap) reversals_reserve(r, 2 * r->cap);
    r->index[r->n] = (double)t->extIndex;
    r->value[r->n] = v;
    r->stress[r->n] = t->outStress;
    r->strain[r->n] = t->outStrain;
    r->n++;
  }
  if (t->k == t->memCap) {
    t->memCap *= 2;
    t->sv = grow_column(t->sv, t->memCap); t->si = grow_column(t->si, t->memCap);
    t->ss = grow_column(t->ss, t->memCap); t->se = grow_column(t->se, t->memCap);
  }
  size_t k = t->k++;
  t->sv[k] = v;
  t->si[k] = (double)t->extIndex;
  t->ss[k] = t->outStress;
  t->se[k] = t->outStrain;
  t->dir = -t->dir;
  set_threshold(t);
}

/* Closes every loop the extreme reaches (ties close); sample `idx` closes them. */
static void close_loops(Tracker *t, long idx) {
  double x = t->ext;
  int up = t->dir > 0;
  while (up ? x >= t->thr : x <= t->thr) {
    size_t k = t->k;
    if (k >= 2) {
      LoopTable *l = &t->loops;
      if (l->n == l->cap) loops_reserve(l, 2 * l->cap);
      size_t i = l->n++;
      double sA = t->ss[k - 2], sB = t->ss[k - 1], eA = t->se[k - 2], eB = t->se[k - 1];
      l->stressMax[i] = sA >= sB ? sA : sB;
      l->stressMin[i] = sA >= sB ? sB : sA;
      l->strainMax[i] = eA >= eB ? eA : eB;
      l->strainMin[i] = eA >= eB ? eB : eA;
      l->start[i] = t->si[k - 2];
      l->turn[i] = t->si[k - 1];
      l->close[i] = (double)idx;
      l->count[i] = 1;
      t->k = k - 2;
    } else if (k == 1) {
      /* memory 3 needs the mirror exceeded; turning exactly at it keeps the start in memory */
      if (x == t->thr) break;
      t->k = 0;
    } else {
      break;
    }
    set_threshold(t);
  }
}

/* First movement away from the initial value. */
static void start(Tracker *t, double x, long idx) {
  double v0 = t->ext;
  int d = x > v0 ? 1 : -1;
  if (t->k == 0 && (v0 == 0 || (v0 > 0) == (d > 0))) {
    t->dir = d;
    t->thr = d * INFINITY;
    t->ext = x;
    t->extIndex = idx;
    return;
  }
  t->dir = -d; /* the initial value is a reversal of the path */
  reverse(t);
  t->ext = x;
  t->extIndex = idx;
  if (d > 0 ? x >= t->thr : x <= t->thr) close_loops(t, idx);
}

/* Pushes samples x[from] ... x[to-1] with sample indices counting on from `next`. */
static void tracker_push(Tracker *t, const double *x, long from, long to) {
  const double off = t->offset;
  const long base = t->next - from;
  for (long i = from; i < to; i++) {
    long idx = base + i;
    double v = x[i] + off;
    if (v - v != 0) fail("sample is not finite", x[i], idx);
    if (t->dir > 0) {
      if (v > t->ext) {
        t->ext = v; t->extIndex = idx;
        if (v >= t->thr) close_loops(t, idx);
      } else if (v < t->ext) {
        reverse(t);
        t->ext = v; t->extIndex = idx;
        if (v <= t->thr) close_loops(t, idx);
      }
    } else if (t->dir < 0) {
      if (v < t->ext) {
        t->ext = v; t->extIndex = idx;
        if (v <= t->thr) close_loops(t, idx);
      } else if (v > t->ext) {
        reverse(t);
        t->ext = v; t->extIndex = idx;
        if (v >= t->thr) close_loops(t, idx);
      }
    } else if (v != t->ext) {
      start(t, v, idx);
    }
  }
  t->samples += to - from;
  if (to > from) t->next = base + to;
}

/* Sizes the tables for `total` samples from the reversal (or loop) rate seen so far. */
static void reserve_for(Tracker *t, long total) {
  if (t->samples == 0) return;
  double seen = t->recordReversals ? (double)t->revs.n : 2.0 * (double)t->loops.n;
  double rows = ceil(1.25 * seen * (double)total / (double)t->samples) + 64;
  if (rows > (double)total + 1) rows = (double)total + 1;
  if (t->recordReversals) reversals_reserve(&t->revs, (size_t)rows);
  loops_reserve(&t->loops, ((size_t)rows >> 1) + 1);
}

typedef struct {
  long largestIndex;
  int reused;
  size_t firstLoops, firstReversals, stabilisedFrom, stabilisedReversalFrom;
} RepeatingResult;

/*
 * A repeating block: the first pass from the unloaded state, then the stabilised pass from the
 * memory the first left. Reaching the block's first sample of largest |value| closes every loop
 * back to the first-loading curve, so from there both passes are the same: the second pass runs
 * up to that sample only and, when its state there equals the first pass's state right after it,
 * the stabilised loops are the first pass's from that sample on followed by the second pass's
 * (one run of table rows). Otherwise the second pass runs to the end. `sizingPiece` is the
 * length of the first piece whose reversal rate sizes the tables for `expected` samples.
 */
static RepeatingResult track_repeating(Tracker *t, const double *x, long n, long sizingPiece, long expected) {
  RepeatingResult r = { -1, 0, 0, 0, 0, 0 };
  if (n == 0) return r;
  long head = n < sizingPiece ? n : sizingPiece;
  tracker_push(t, x, 0, head);
  reserve_for(t, expected);
  tracker_push(t, x, head, n);
  /* the largest point: a reversal point, or the pending last extreme */
  double abs = t->peakAbs, value = t->peakValue;
  long index = t->peakIndex;
  size_t revRow = t->peakReversalRow, loopRow = t->peakLoopRow;
  if (fabs(t->ext) > abs) { abs = fabs(t->ext); value = t->ext; index = t->extIndex; revRow = t->revs.n; loopRow = t->loops.n; }
  int known = t->dir != 0 && index >= 0 && fabs(t->initial) < abs;
  long m = index;
  if (!known) {
    double best = -1;
    for (long i = 0; i < n; i++) if (fabs(x[i] + t->offset) > best) { best = fabs(x[i] + t->offset); m = i; }
  }
  r.largestIndex = m;
  r.firstLoops = t->loops.n;
  r.firstReversals = t->revs.n;
  t->next = 0; /* the block again, with its own sample indices */
  if (known) {
    tracker_push(t, x, 0, m + 1);
    r.reused = t->k == 0 && t->dir == (value > 0 ? 1 : -1) && t->ext == value && t->extIndex == index;
  }
  if (!r.reused) tracker_push(t, x, known ? m + 1 : 0, n);
  r.stabilisedFrom = r.reused ? loopRow : r.firstLoops;
  r.stabilisedReversalFrom = r.reused ? revRow : r.firstReversals;
  return r;
}

/* ------------------------------------------------------------------------------------------ */
/* Smith-Watson-Topper life and the Miner sum */

/*
 * Reversals 2Nf from the Smith-Watson-Topper parameter (K. N. Smith, P. Watson, T. H. Topper,
 * J. Materials 5 (1970) 767-778) on the strain-life curve:
 *     σmax·εa = σf'²/E·(2Nf)^(2b) + σf'·εf'·(2Nf)^(b+c)
 * In u = ln 2Nf the left side's logarithm g(u) = ln(A e^(pu) + B e^(qu)) is convex and decreasing;
 * each one-term root lies at or below the root and that root plus ln 2/|exponent| at or above
 * it, which brackets it. Newton from the larger one-term root rises monotonically onto the root;
 * iterates are clamped to the bracket; it stops when the bound (p-q)²/(8 min(|p|,|q|))·δ² on the
 * remaining error in u is below 1e-12 (2Nf to better than 1e-10 relative). σmax <= 0 or εa = 0:
 * Infinity (no damage); beyond 1e20 reversals: Infinity; at or below one reversal: 1.
 */
/*
 * Start table of the SWT solve (the --solve table mode): the root u(t) of g(u) = t, t = ln Y, is
 * smooth and decreasing, with du/dt = 1/g'(u); cubic Hermite pieces between nodes 1/32 apart in
 * t over the targets of the call give each solve a start close enough that the first Newton step
 * meets the stopping rule. Only the start changes: the bracket, the clamps, the stopping rule
 * and the special cases are those of the plain solve.
 */
typedef struct {
  double lnA, p, lnB, q, t0, invStep;
  long cells;
  double *tab; /* per cell: 4 coefficients of u in the cell fraction */
} SwtTable;

static const double SWT_LN_CUTOFF = 46.051701859880914; /* ln 1e20 */

/* The root of ln(A e^(pu) + B e^(qu)) = t, any sign, by Newton from the larger one-term root. */
static double swt_root(double lnA, double p, double lnB, double q, double t, double *slope) {
  double a = lnA - t, b = lnB - t, ua = -a / p, ub = -b / q;
  double u = ua > ub ? ua : ub, d = p - q, bound = d * d / (8 * (p > q ? -p : -q));
  for (int k = 0; k < 100; k++) {
    double ta = exp(a + p * u), tb = exp(b + q * u), sum = ta + tb;
    double step = -log(sum) * sum / (p * ta + q * tb);
    u += step;
    if (bound * step * step <= 1e-20 || step == 0) break;
  }
  double ta = exp(a + p * u), tb = exp(b + q * u);
  *slope = (ta + tb) / (p * ta + q * tb);
  return u;
}

static SwtTable *swt_table(double lnA, double p, double lnB, double q, double tMin, double tMax) {
  if (!(tMax >= tMin) || !(tMax - tMin < 1e4)) return NULL;
  SwtTable *t = xmalloc(sizeof *t);
  const double step = 1.0 / 32;
  t->lnA = lnA; t->p = p; t->lnB = lnB; t->q = q;
  t->t0 = tMin;
  t->invStep = 1 / step;
  t->cells = (long)ceil((tMax - tMin) / step) + 1;
  t->tab = xmalloc((size_t)t->cells * 4 * sizeof(double));
  double uL = 0, dL = 0;
  for (long j = 0; j <= t->cells; j++) {
    double d, u = swt_root(lnA, p, lnB, q, tMin + (double)j * step, &d);
    if (j > 0) hermite(t->tab + 4 * (j - 1), uL, u, dL * step, d * step);
    uL = u;
    dL = d;
  }
  return t;
}

static double swt_reversals(double lnA, double p, double lnB, double q, double sMax, double ea, const SwtTable *tab) {
  if (!(sMax > 0)) return INFINITY;
  const double lnCutoff = SWT_LN_CUTOFF;
  double lnY = log(sMax * ea);
  double a = lnA - lnY, b = lnB - lnY;
  double ua = -a / p, ub = -b / q;
  double lo = ua > ub ? ua : ub;
  if (lo != lo) fail("SWT parameter is NaN", sMax * ea, -1);
  if (lo >= lnCutoff) return INFINITY;
  double ha = ua - LN2 / p, hb = ub - LN2 / q;
  double hi = ha > hb ? ha : hb;
  if (hi <= 0) return 1;
  double d = p - q, bound = d * d / (8 * (p > q ? -p : -q));
  double u = lo > 0 ? lo : 0;
  if (tab != NULL) {
    double x = (lnY - tab->t0) * tab->invStep;
    long i = (long)x;
    if (x >= 0 && i < tab->cells) {
      const double *c = tab->tab + 4 * i;
      double f = x - (double)i, start = c[0] + f * (c[1] + f * (c[2] + f * c[3]));
      /* starts near one reversal or the cut-off keep the plain start (its special cases) */
      if (start > 1e-3 && start < lnCutoff - 1e-3) u = start < lo ? lo : start > hi ? hi : start;
    }
  }
  for (int k = 0; k < 40; k++) {
    double ta = exp(a + p * u), tb = exp(b + q * u), s = ta + tb, g = log(s);
    if (u == 0 && g <= 0) return 1;
    double step = -g * s / (p * ta + q * tb);
    u += step;
    if (u > hi) u = hi;
    if (u >= lnCutoff) return INFINITY;
    if (bound * step * step <= 1e-12) return u <= 1e-12 ? 1 : exp(u);
  }
  fail("SWT solve did not converge", sMax * ea, -1);
  return 0;
}

typedef struct {
  size_t loops, firstLoops;
  double sumStressMax, damage, firstDamage;
  long largestIndex;
  int reused;
  double meanIterations;
} PipelineChecks;

/* What one pipeline run allocated; freed by the caller after the clock stops. */
typedef struct {
  Tracker t;
  double *reversals, *cycles, *parameter, *damage, *firstDamage;
} PipelineRun;

static void pipeline_free(PipelineRun *run) {
  free(run->reversals); free(run->cycles); free(run->parameter); free(run->damage); free(run->firstDamage);
  tracker_free(&run->t);
}

static PipelineChecks pipeline(PipelineRun *run, const Material *mat, const double *x, long n, double scale, double offset, double tol,
                               const NeuberTable *answers, int useTables) {
  Tracker *t = &run->t;
  tracker_init(t, mat, scale, offset, tol, 0);
  t->solver.table = answers;
  RepeatingResult r = track_repeating(t, x, n, 65536, 2 * n);
  const LoopTable *loops = &t->loops;
  size_t all = loops->n;
  /* lives of every loop of both passes */
  double *reversals = xmalloc(all * sizeof(double));
  double *cycles = xmalloc(all * sizeof(double));
  double *parameter = xmalloc(all * sizeof(double));
  const double lnA = 2 * log(mat->sigmaF) - log(mat->E), p = 2 * mat->b;
  const double lnB = log(mat->sigmaF * mat->epsilonF), q = mat->b + mat->c;
  SwtTable *tab = NULL;
  if (useTables) {
    /* the range of the SWT parameter over the loops, then the start table over it */
    double yMin = INFINITY, yMax = 0;
    for (size_t i = 0; i < all; i++) {
      double sMax = loops->stressMax[i], y = sMax * (loops->strainMax[i] - loops->strainMin[i]) / 2;
      if (sMax > 0 && y > 0) {
        if (y < yMin) yMin = y;
        if (y > yMax) yMax = y;
      }
    }
    tab = swt_table(lnA, p, lnB, q, log(yMin), log(yMax));
  }
  for (size_t i = 0; i < all; i++) {
    double sMax = loops->stressMax[i], ea = (loops->strainMax[i] - loops->strainMin[i]) / 2;
    double rv = swt_reversals(lnA, p, lnB, q, sMax, ea, tab);
    reversals[i] = rv;
    cycles[i] = rv / 2;
    parameter[i] = sMax > 0 ? sMax * ea : 0;
  }
  /* Palmgren-Miner: D = Σ count / Nf, per repeat from the stabilised pass; the first pass too */
  size_t from = r.stabilisedFrom, ns = all - from;
  double *damage = xmalloc(ns * sizeof(double));
  double sumStressMax = 0;
  for (size_t i = 0; i < ns; i++) {
    damage[i] = loops->count[from + i] / cycles[from + i];
    sumStressMax += loops->stressMax[from + i];
  }
  double *firstDamage = xmalloc(r.firstLoops * sizeof(double));
  for (size_t i = 0; i < r.firstLoops; i++) firstDamage[i] = loops->count[i] / cycles[i];
  PipelineChecks c;
  c.loops = ns;
  c.firstLoops = r.firstLoops;
  c.sumStressMax = sumStressMax;
  c.damage = neumaier_sum(damage, ns);
  c.firstDamage = neumaier_sum(firstDamage, r.firstLoops);
  c.largestIndex = r.largestIndex;
  c.reused = r.reused;
  c.meanIterations = (double)t->solver.iterations / (double)(t->solver.solves ? t->solver.solves : 1);
  if (tab != NULL) { free(tab->tab); free(tab); }
  run->reversals = reversals; run->cycles = cycles; run->parameter = parameter;
  run->damage = damage; run->firstDamage = firstDamage;
  return c;
}

/* ------------------------------------------------------------------------------------------ */
/* options and the timed stages */

typedef struct {
  const char *history, *stages, *solve;
  Material mat;
  double trackerKt, pipelineKt, loadToStress, offset, tol, stressPeak, fat, ultimate;
  long expCalls;
  int warmup, runs, pipelineWarmup, pipelineRuns;
} Options;

static int has_stage(const Options *o, const char *name) {
  size_t len = strlen(name);
  for (const char *s = o->stages; (s = strstr(s, name)) != NULL; s += len) {
    if ((s == o->stages || s[-1] == ',') && (s[len] == ',' || s[len] == 0)) return 1;
  }
  return 0;
}

static double number_arg(const char *name, const char *v) {
  char *end;
  double x = strtod(v, &end);
  if (*v == 0 || *end != 0) {
    fprintf(stderr, "reference: %s needs a number, got '%s'\n", name, v);
    exit(2);
  }
  return x;
}

static Options parse(int argc, char **argv) {
  Options o = { NULL, "scan,exp,rainflow,tracker,pipeline", "newton", { 0, 0, 0, 0, 0, 0, 0 }, 2.5, 2, 1, 0, 1e-10, 300, 90, 600, 10000000, 3, 7, 1, 3 };
  for (int i = 1; i + 1 < argc; i += 2) {
    const char *k = argv[i], *v = argv[i + 1];
    if (!strcmp(k, "--history")) o.history = v;
    else if (!strcmp(k, "--stages")) o.stages = v;
    else if (!strcmp(k, "--solve")) o.solve = v;
    else if (!strcmp(k, "--E")) o.mat.E = number_arg(k, v);
    else if (!strcmp(k, "--sigmaF")) o.mat.sigmaF = number_arg(k, v);
    else if (!strcmp(k, "--b")) o.mat.b = number_arg(k, v);
    else if (!strcmp(k, "--epsilonF")) o.mat.epsilonF = number_arg(k, v);
    else if (!strcmp(k, "--c")) o.mat.c = number_arg(k, v);
    else if (!strcmp(k, "--K")) o.mat.K = number_arg(k, v);
    else if (!strcmp(k, "--n")) o.mat.n = number_arg(k, v);
    else if (!strcmp(k, "--tracker-kt")) o.trackerKt = number_arg(k, v);
    else if (!strcmp(k, "--pipeline-kt")) o.pipelineKt = number_arg(k, v);
    else if (!strcmp(k, "--load-to-stress")) o.loadToStress = number_arg(k, v);
    else if (!strcmp(k, "--offset")) o.offset = number_arg(k, v);
    else if (!strcmp(k, "--tolerance")) o.tol = number_arg(k, v);
    else if (!strcmp(k, "--exp-calls")) o.expCalls = (long)number_arg(k, v);
    else if (!strcmp(k, "--stress-peak")) o.stressPeak = number_arg(k, v);
    else if (!strcmp(k, "--fat")) o.fat = number_arg(k, v);
    else if (!strcmp(k, "--ultimate")) o.ultimate = number_arg(k, v);
    else if (!strcmp(k, "--warmup")) o.warmup = (int)number_arg(k, v);
    else if (!strcmp(k, "--runs")) o.runs = (int)number_arg(k, v);
    else if (!strcmp(k, "--pipeline-warmup")) o.pipelineWarmup = (int)number_arg(k, v);
    else if (!strcmp(k, "--pipeline-runs")) o.pipelineRuns = (int)number_arg(k, v);
    else { fprintf(stderr, "reference: unknown option %s\n", k); exit(2); }
  }
  if (!o.history) { fprintf(stderr, "reference: --history FILE is required\n"); exit(2); }
  if (strcmp(o.solve, "newton") && strcmp(o.solve, "table")) { fprintf(stderr, "reference: --solve is newton or table\n"); exit(2); }
  const Material *m = &o.mat;
  if (!(m->E > 0 && m->sigmaF > 0 && m->b < 0 && m->epsilonF > 0 && m->c < 0 && m->K > 0 && m->n > 0 && m->n < 1)) {
    fprintf(stderr, "reference: material needs E, sigmaF, epsilonF, K > 0, b, c < 0 and 0 < n < 1\n");
    exit(2);
  }
  if (o.runs < 1 || o.pipelineRuns < 1 || o.warmup < 0 || o.pipelineWarmup < 0) { fprintf(stderr, "reference: bad run counts\n"); exit(2); }
  return o;
}

static double *read_history(const char *path, long *n) {
  FILE *f = fopen(path, "rb");
  if (!f) { fprintf(stderr, "reference: cannot open %s\n", path); exit(2); }
  fseek(f, 0, SEEK_END);
  long bytes = ftell(f);
  fseek(f, 0, SEEK_SET);
  if (bytes < 0 || bytes % 8) { fprintf(stderr, "reference: %s is not a file of doubles\n", path); exit(2); }
  *n = bytes / 8;
  double *x = xmalloc((size_t)bytes);
  if (fread(x, 8, (size_t)*n, f) != (size_t)*n) { fprintf(stderr, "reference: short read of %s\n", path); exit(2); }
  fclose(f);
  /* the file is little-endian binary64 */
  const unsigned one = 1;
  if (*(const unsigned char *)&one != 1) {
    unsigned char *b = (unsigned char *)x;
    for (long i = 0; i < *n; i++, b += 8) for (int j = 0; j < 4; j++) { unsigned char t = b[j]; b[j] = b[7 - j]; b[7 - j] = t; }
  }
  return x;
}

int main(int argc, char **argv) {
  Options o = parse(argc, argv);
  long n;
  double *x = read_history(o.history, &n);
  double *times = xmalloc((size_t)(o.runs > o.pipelineRuns ? o.runs : o.pipelineRuns) * sizeof(double));
  const char *sep = "";
  /* table mode: the Neuber answer table is built once per process (as the JS packages keep one
     per material), the coarsest that serves the tolerance with the tenfold margin */
  int useTables = !strcmp(o.solve, "table");
  NeuberTable *answers = NULL;
  double answerWorst = -1;
  if (useTables) {
    NeuberSolver proto = { o.mat.E, 1 / o.mat.n, log(o.mat.K), log(o.mat.E), o.tol, 60, 0, 0, NULL };
    for (int bits = 8; bits <= 9 && answers == NULL; bits++) {
      NeuberTable *t = neuber_table(&proto, bits);
      if (t == NULL) break;
      answerWorst = t->worst;
      if (o.tol >= 10 * t->worst) answers = t;
      else { free(t->tab); free(t); }
    }
  }
  printf("{\"format\":\"loopwise-native-reference\",\"version\":1,\"samples\":%ld,\"warmupRuns\":%d,\"timedRuns\":%d,"
         "\"pipelineWarmupRuns\":%d,\"pipelineTimedRuns\":%d,\"tolerance\":%.17g,\"solve\":\"%s\",\"answerTable\":%s,"
         "\"answerTableWorst\":%.6g,\"stages\":{",
         n, o.warmup, o.runs, o.pipelineWarmup, o.pipelineRuns, o.tol, o.solve, answers ? "true" : "false", answerWorst);

  if (has_stage(&o, "scan")) {
    volatile double sink = 0;
    double range = 0;
    for (int r = 0; r < o.warmup + o.runs; r++) {
      double t0 = now_seconds();
      range = minmax_scan(x, n);
      double t1 = now_seconds();
      sink += range;
      if (r >= o.warmup) times[r - o.warmup] = t1 - t0;
    }
    printf("%s\"scan\":{\"seconds\":%.9g,\"range\":%.17g}", sep, median(times, o.runs), range);
    sep = ",";
  }

  if (has_stage(&o, "exp")) {
    double *args = xmalloc((size_t)o.expCalls * sizeof(double));
    exp_arguments(args, o.expCalls);
    double sum = 0;
    for (int r = 0; r < o.warmup + o.runs; r++) {
      double t0 = now_seconds();
      sum = exp_calls(args, o.expCalls);
      double t1 = now_seconds();
      if (r >= o.warmup) times[r - o.warmup] = t1 - t0;
    }
    free(args);
    printf("%s\"exp\":{\"seconds\":%.9g,\"calls\":%ld,\"sum\":%.17g}", sep, median(times, o.runs), o.expCalls, sum);
    sep = ",";
  }

  if (has_stage(&o, "rainflow")) {
    size_t rows = 0;
    long points = 0;
    double totalCount = 0, sumRange = 0, sumStart = 0, sumClose = 0;
    for (int r = 0; r < o.warmup + o.runs; r++) {
      CycleTable t;
      double t0 = now_seconds();
      cycles_init(&t, 1024);
      points = rainflow_count(x, n, &t);
      double t1 = now_seconds();
      if (r >= o.warmup) times[r - o.warmup] = t1 - t0;
      rows = t.n;
      totalCount = sumRange = sumStart = sumClose = 0;
      for (size_t i = 0; i < t.n; i++) {
        totalCount += t.count[i];
        sumRange += t.range[i];
        sumStart += t.start[i];
        sumClose += t.close[i];
      }
      cycles_free(&t);
    }
    printf("%s\"rainflow\":{\"seconds\":%.9g,\"turningPoints\":%ld,\"cycles\":%zu,\"totalCount\":%.17g,\"sumRange\":%.17g,"
           "\"sumStartIndex\":%.17g,\"sumCloseIndex\":%.17g}",
           sep, median(times, o.runs), points, rows, totalCount, sumRange, sumStart, sumClose);
    sep = ",";
  }

  if (has_stage(&o, "stresslife")) {
    /* the history as MPa: scaled (outside the timed region, the same operations as the JS
       suite) so that its largest |value| is --stress-peak */
    double peak = 0;
    for (long i = 0; i < n; i++) peak = fmax(peak, fabs(x[i]));
    double *y = xmalloc((size_t)n * sizeof(double));
    for (long i = 0; i < n; i++) y[i] = (x[i] * o.stressPeak) / peak;
    size_t rows = 0;
    long points = 0;
    double totalCount = 0, damage = 0, countSeconds = 0;
    double *countTimes = xmalloc((size_t)o.runs * sizeof(double));
    for (int r = 0; r < o.warmup + o.runs; r++) {
      CycleTable t;
      double t0 = now_seconds();
      cycles_init(&t, 1024);
      points = rainflow_count_policy(y, n, &t, 1);
      double t1 = now_seconds();
      damage = stress_life_damage(&t, o.fat, o.ultimate);
      double t2 = now_seconds();
      if (r >= o.warmup) { times[r - o.warmup] = t2 - t0; countTimes[r - o.warmup] = t1 - t0; }
      rows = t.n;
      totalCount = 0;
      for (size_t i = 0; i < t.n; i++) totalCount += t.count[i];
      cycles_free(&t);
    }
    countSeconds = median(countTimes, o.runs);
    printf("%s\"stresslife\":{\"seconds\":%.9g,\"countSeconds\":%.9g,\"turningPoints\":%ld,\"cycles\":%zu,\"totalCount\":%.17g,\"damage\":%.17g}",
           sep, median(times, o.runs), countSeconds, points, rows, totalCount, damage);
    sep = ",";
    free(countTimes);
    free(y);
  }

  if (has_stage(&o, "tracker")) {
    RepeatingResult res = { 0, 0, 0, 0, 0, 0 };
    size_t loops = 0, reversals = 0;
    double sumStressMax = 0, sumStrainMax = 0, meanIterations = 0;
    for (int r = 0; r < o.warmup + o.runs; r++) {
      Tracker t;
      double t0 = now_seconds();
      tracker_init(&t, &o.mat, o.trackerKt * o.loadToStress, o.offset, o.tol, 1);
      t.solver.table = answers;
      res = track_repeating(&t, x, n, 16384, n + (n >> 1));
      double t1 = now_seconds();
      if (r >= o.warmup) times[r - o.warmup] = t1 - t0;
      loops = t.loops.n - res.stabilisedFrom;
      reversals = t.revs.n - res.stabilisedReversalFrom;
      sumStressMax = sumStrainMax = 0;
      for (size_t i = res.stabilisedFrom; i < t.loops.n; i++) {
        sumStressMax += t.loops.stressMax[i];
        sumStrainMax += t.loops.strainMax[i];
      }
      meanIterations = (double)t.solver.iterations / (double)(t.solver.solves ? t.solver.solves : 1);
      tracker_free(&t);
    }
    printf("%s\"tracker\":{\"seconds\":%.9g,\"firstReversals\":%zu,\"firstLoops\":%zu,\"stabilisedReversals\":%zu,"
           "\"stabilisedLoops\":%zu,\"largestIndex\":%ld,\"reusedFirstPass\":%s,\"sumStressMax\":%.17g,\"sumStrainMax\":%.17g,"
           "\"meanNewtonSteps\":%.6g}",
           sep, median(times, o.runs), res.firstReversals, res.firstLoops, reversals, loops, res.largestIndex,
           res.reused ? "true" : "false", sumStressMax, sumStrainMax, meanIterations);
    sep = ",";
  }

  if (has_stage(&o, "pipeline")) {
    PipelineChecks c = { 0, 0, 0, 0, 0, 0, 0, 0 };
    for (int r = 0; r < o.pipelineWarmup + o.pipelineRuns; r++) {
      PipelineRun run;
      double t0 = now_seconds();
      c = pipeline(&run, &o.mat, x, n, o.pipelineKt * o.loadToStress, o.offset, o.tol, answers, useTables);
      double t1 = now_seconds();
      if (r >= o.pipelineWarmup) times[r - o.pipelineWarmup] = t1 - t0;
      pipeline_free(&run);
    }
    printf("%s\"pipeline\":{\"seconds\":%.9g,\"loops\":%zu,\"firstLoops\":%zu,\"largestIndex\":%ld,\"reusedFirstPass\":%s,"
           "\"sumStressMax\":%.17g,\"damage\":%.17g,\"firstPassDamage\":%.17g,\"meanNewtonSteps\":%.6g}",
           sep, median(times, o.pipelineRuns), c.loops, c.firstLoops, c.largestIndex, c.reused ? "true" : "false",
           c.sumStressMax, c.damage, c.firstDamage, c.meanIterations);
    sep = ",";
  }
  printf("}}\n");
  if (answers) { free(answers->tab); free(answers); }
  free(times);
  free(x);
  return 0;
}
