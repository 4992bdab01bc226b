/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Shared reporting for the benchmark programs: median and spread over
 * repeated runs, as a table row and as one JSON line per figure. */
#pragma once

#include <glib.h>
#include <stdio.h>
#include <stdlib.h>

#define LAMINA_BENCH_RUNS 7

static int
lamina_bench_cmp (const void *a,
                  const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

static inline double
lamina_bench_median (double *samples,
                     int     n)
{
  qsort (samples, n, sizeof (double), lamina_bench_cmp);
  return samples[n / 2];
}

/* @floor_samples may be NULL; @target is the figure's target in @unit. */
static inline void
lamina_bench_report (const char *name,
                     double     *samples,
                     double     *floor_samples,
                     const char *unit,
                     double      target)
{
  double median = lamina_bench_median (samples, LAMINA_BENCH_RUNS);
  double spread = samples[LAMINA_BENCH_RUNS - 1] - samples[0];
  double floor_value = floor_samples ? lamina_bench_median (floor_samples, LAMINA_BENCH_RUNS) : 0;
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  printf ("%-44s %12.3f %-6s ±%-10.3f target %-10g %s%s\n", name, median, unit, spread / 2, target,
          median <= target ? "met" : "MISSED",
          "");
  if (floor_samples)
    printf ("%-44s %12.3f %-6s ratio %.1f\n", "  floor", floor_value, unit, median / floor_value);
  printf ("{\"name\":\"%s\",\"value\":%s,", name, g_ascii_dtostr (buf, sizeof buf, median));
  printf ("\"unit\":\"%s\",\"spread\":%s,", unit, g_ascii_dtostr (buf, sizeof buf, spread));
  printf ("\"floor\":%s,", floor_samples ? g_ascii_dtostr (buf, sizeof buf, floor_value) : "null");
  printf ("\"ratio\":%s,", floor_samples ? g_ascii_dtostr (buf, sizeof buf, median / floor_value) : "null");
  printf ("\"target\":%s}\n", g_ascii_dtostr (buf, sizeof buf, target));
}
