/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-bench.h: what the benchmark programs share.
 *
 * Reporting: every figure is the median over repeated runs with its
 * spread (max − min of the runs), printed as one table row and as one JSON
 * line (name, value, unit, spread, floor, ratio, target, …) for tracking.
 * Benchmarks print figures; they never fail because a machine is slow.
 *
 * Data: synthetic constructions made from a deterministic seed, so that
 * construction i is the same in every run and at every library size. */
#pragma once

#include <glib.h>
#include <stdio.h>

#include "lamina-construction.h"

G_BEGIN_DECLS

/* Runs per figure; LAMINA_BENCH_RUNS in the environment overrides it
 * (3 … 31). */
#define LAMINA_BENCH_DEFAULT_RUNS 7
#define LAMINA_BENCH_SEED         6946u

typedef enum
{
  LAMINA_BENCH_AT_MOST,   /* lower is better: times, memory */
  LAMINA_BENCH_AT_LEAST,  /* higher is better: rates */
} LaminaBenchGoal;

typedef struct
{
  const char      *name;        /* "module.what[.nSIZE]" */
  const char      *unit;
  double           value;       /* median of the runs */
  double           spread;      /* max − min of the runs */
  double           p99;         /* 99th percentile of single operations, or NAN */
  double           floor;       /* the cheapest way to do the same work, or NAN */
  double           target;      /* or NAN */
  double           p99_target;  /* or NAN */
  LaminaBenchGoal  goal;
  guint            runs;
  guint            size;        /* items (constructions, queries, sheets), 0 = n/a */
} LaminaBenchFigure;

guint    lamina_bench_runs       (void);
/* Milliseconds of process CPU time (or wall time, LAMINA_BENCH_CLOCK=wall). */
double   lamina_bench_now_ms     (void);
const char *lamina_bench_clock_name (void);
/* Sorts @values in place. */
double   lamina_bench_median     (double            *values,
                                  guint              n);
double   lamina_bench_percentile (double            *values,
                                  guint              n,
                                  double             percent);

/* A figure with NAN floor, targets and p99. */
void     lamina_bench_figure_init (LaminaBenchFigure *figure,
                                   const char        *name,
                                   const char        *unit);
/* value = median, spread = max − min of @runs (sorted in place). */
void     lamina_bench_figure_set_runs (LaminaBenchFigure *figure,
                                       double            *runs,
                                       guint              n);
void     lamina_bench_print      (const LaminaBenchFigure *figure);
/* How a figure grows with the number of items: per step the ratio of the
 * values and the exponent log(v2/v1)/log(n2/n1) (1 = linear, 0 = flat). */
void     lamina_bench_print_growth (const char   *name,
                                    const char   *unit,
                                    const guint  *sizes,
                                    const double *values,
                                    guint         n);
/* A line saying a figure was not measured, and why (also as JSON). */
void     lamina_bench_print_skip (const char        *name,
                                  const char        *reason);

/* Peak resident memory of this process (VmHWM), in MB. */
double   lamina_bench_peak_rss_mb (void);
/* Current resident memory (VmRSS), in MB. */
double   lamina_bench_rss_mb      (void);

/* Where cached synthetic libraries go: $LAMINA_BENCH_CACHE, else the
 * temporary folder. */
const char *lamina_bench_cache_dir (void);

/* ---- Synthetic data (lamina-bench-data.c) ---------------------------- */

/* The invented materials the synthetic constructions use (owned array of
 * LaminaMaterial*). */
GPtrArray          *lamina_bench_dup_materials   (void);
/* Construction @index of the synthetic library with @seed: 3 to 12
 * layers, some bridged, every element kind, words in code, name,
 * description and tags that prefix searches hit; always calculable. */
LaminaConstruction *lamina_bench_make_construction (guint32 seed,
                                                    guint   index);
/* The fixed 12-layer wall with 3 bridged layers of the engine figure. */
LaminaConstruction *lamina_bench_make_wall_12     (void);

G_END_DECLS
