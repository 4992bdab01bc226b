/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-bench.c: medians, percentiles, the table row and the JSON line. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

guint
lamina_bench_runs (void)
{
  const char *env = g_getenv ("LAMINA_BENCH_RUNS");
  guint64 n = env ? g_ascii_strtoull (env, NULL, 10) : LAMINA_BENCH_DEFAULT_RUNS;

  return (guint) CLAMP (n, 3, 31);
}

/* CPU time of the process (user + system) by default: the figures are
 * "on one core", and they stay meaningful on a machine shared with
 * compilers and fuzzers.  LAMINA_BENCH_CLOCK=wall selects wall time. */
double
lamina_bench_now_ms (void)
{
  static int use_wall = -1;
  struct timespec ts;

  if (use_wall < 0)
    use_wall = g_strcmp0 (g_getenv ("LAMINA_BENCH_CLOCK"), "wall") == 0;
  if (use_wall)
    return g_get_monotonic_time () / 1000.0;
  clock_gettime (CLOCK_PROCESS_CPUTIME_ID, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

const char *
lamina_bench_clock_name (void)
{
  return g_strcmp0 (g_getenv ("LAMINA_BENCH_CLOCK"), "wall") == 0 ? "wall" : "cpu";
}

static int
compare_double (const void *a,
                const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

double
lamina_bench_percentile (double *values,
                         guint   n,
                         double  percent)
{
  double rank;
  guint lo;

  g_return_val_if_fail (n > 0, NAN);
  qsort (values, n, sizeof (double), compare_double);
  /* Linear interpolation between closest ranks. */
  rank = percent / 100.0 * (n - 1);
  lo = (guint) floor (rank);
  if (lo + 1 >= n)
    return values[n - 1];
  return values[lo] + (rank - lo) * (values[lo + 1] - values[lo]);
}

double
lamina_bench_median (double *values,
                     guint   n)
{
  return lamina_bench_percentile (values, n, 50);
}

void
lamina_bench_figure_init (LaminaBenchFigure *figure,
                          const char        *name,
                          const char        *unit)
{
  memset (figure, 0, sizeof *figure);
  figure->name = name;
  figure->unit = unit;
  figure->value = figure->spread = figure->p99 = NAN;
  figure->floor = figure->target = figure->p99_target = NAN;
  figure->goal = LAMINA_BENCH_AT_MOST;
}

void
lamina_bench_figure_set_runs (LaminaBenchFigure *figure,
                              double            *runs,
                              guint              n)
{
  figure->value = lamina_bench_median (runs, n);
  figure->spread = runs[n - 1] - runs[0];
  figure->runs = n;
}

static gboolean
meets (double          value,
       double          target,
       LaminaBenchGoal goal)
{
  return goal == LAMINA_BENCH_AT_MOST ? value <= target : value >= target;
}

static void
append_json_number (GString    *out,
                    const char *key,
                    double      value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  g_string_append_printf (out, ",\"%s\":", key);
  if (isfinite (value))
    g_string_append (out, g_ascii_formatd (buf, sizeof buf, "%.6g", value));
  else
    g_string_append (out, "null");
}

void
lamina_bench_print (const LaminaBenchFigure *f)
{
  g_autoptr(GString) row = g_string_new (NULL);
  g_autoptr(GString) json = g_string_new (NULL);
  double ratio = isfinite (f->floor) && f->floor > 0 ? f->value / f->floor : NAN;
  gboolean met = TRUE, has_target = FALSE;

  g_string_append_printf (row, "%-40s %11.4g %-8s ±%-9.3g", f->name, f->value, f->unit, f->spread / 2);
  if (isfinite (f->p99))
    g_string_append_printf (row, " p99 %-9.4g", f->p99);
  else
    g_string_append_printf (row, " %-13s", "");
  if (isfinite (ratio))
    g_string_append_printf (row, " floor %-9.4g ×%-6.1f", f->floor, ratio);
  else
    g_string_append_printf (row, " %-23s", "");
  if (isfinite (f->target))
    {
      has_target = TRUE;
      met = meets (f->value, f->target, f->goal);
      g_string_append_printf (row, " target %s%g", f->goal == LAMINA_BENCH_AT_MOST ? "≤" : "≥", f->target);
    }
  if (isfinite (f->p99_target) && isfinite (f->p99))
    {
      has_target = TRUE;
      met = met && f->p99 <= f->p99_target;
      g_string_append_printf (row, ", p99 ≤%g", f->p99_target);
    }
  if (has_target)
    g_string_append (row, met ? "  met" : "  MISSED");
  puts (row->str);

  g_string_append_printf (json, "{\"name\":\"%s\"", f->name);
  append_json_number (json, "value", f->value);
  g_string_append_printf (json, ",\"unit\":\"%s\"", f->unit);
  append_json_number (json, "floor", f->floor);
  append_json_number (json, "ratio", ratio);
  append_json_number (json, "spread", f->spread);
  append_json_number (json, "p99", f->p99);
  append_json_number (json, "target", f->target);
  append_json_number (json, "p99_target", f->p99_target);
  g_string_append_printf (json, ",\"goal\":\"%s\"", f->goal == LAMINA_BENCH_AT_MOST ? "at-most" : "at-least");
  if (has_target)
    g_string_append_printf (json, ",\"met\":%s", met ? "true" : "false");
  else
    g_string_append (json, ",\"met\":null");
  g_string_append_printf (json, ",\"runs\":%u,\"size\":%u,\"clock\":\"%s\"}", f->runs, f->size,
                          lamina_bench_clock_name ());
  printf ("JSON %s\n", json->str);
  fflush (stdout);
}

void
lamina_bench_print_growth (const char   *name,
                           const char   *unit,
                           const guint  *sizes,
                           const double *values,
                           guint         n)
{
  g_autoptr(GString) row = g_string_new (NULL);
  g_autoptr(GString) json = g_string_new (NULL);
  double worst = -INFINITY;
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  g_string_append_printf (row, "%-40s", name);
  g_string_append_printf (json, "{\"name\":\"%s\",\"unit\":\"exponent\",\"sizes\":[", name);
  for (guint i = 0; i < n; i++)
    {
      g_string_append_printf (row, "%s%u: %.4g %s", i ? "  " : " ", sizes[i], values[i], unit);
      g_string_append_printf (json, "%s%u", i ? "," : "", sizes[i]);
    }
  g_string_append (json, "],\"values\":[");
  for (guint i = 0; i < n; i++)
    g_string_append_printf (json, "%s%s", i ? "," : "",
                            g_ascii_formatd (buf, sizeof buf, "%.6g", values[i]));
  g_string_append (json, "],\"exponents\":[");
  g_string_append (row, "  exponent");
  for (guint i = 1; i < n; i++)
    {
      double e = log (values[i] / values[i - 1]) / log ((double) sizes[i] / sizes[i - 1]);

      worst = MAX (worst, e);
      g_string_append_printf (row, " %.2f", e);
      g_string_append_printf (json, "%s%s", i > 1 ? "," : "",
                              g_ascii_formatd (buf, sizeof buf, "%.3f", e));
    }
  g_string_append (json, "]");
  append_json_number (json, "value", worst);
  g_string_append (json, ",\"floor\":null,\"ratio\":null}");
  g_string_append (row, worst > 1.15 ? "  (worse than linear)" : "");
  puts (row->str);
  printf ("JSON %s\n", json->str);
  fflush (stdout);
}

void
lamina_bench_print_skip (const char *name,
                         const char *reason)
{
  printf ("%-40s skipped: %s\n", name, reason);
  printf ("JSON {\"name\":\"%s\",\"value\":null,\"unit\":null,\"floor\":null,\"ratio\":null,"
          "\"skipped\":true}\n", name);
  fflush (stdout);
}

static double
read_status_mb (const char *key)
{
  g_autofree char *status = NULL;
  const char *p;

  if (!g_file_get_contents ("/proc/self/status", &status, NULL, NULL))
    return NAN;
  p = strstr (status, key);
  if (p == NULL)
    return NAN;
  return g_ascii_strtod (p + strlen (key), NULL) / 1024.0;   /* kB → MB */
}

double
lamina_bench_peak_rss_mb (void)
{
  return read_status_mb ("VmHWM:");
}

double
lamina_bench_rss_mb (void)
{
  return read_status_mb ("VmRSS:");
}

const char *
lamina_bench_cache_dir (void)
{
  const char *dir = g_getenv ("LAMINA_BENCH_CACHE");

  return dir && *dir ? dir : g_get_tmp_dir ();
}
