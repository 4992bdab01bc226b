/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Benchmark 1: the full EN ISO 6946 calculation (validation, upper and
 * lower limits, temperatures, warnings) of a 12-layer construction with 3
 * bridged layers.  Floor: the plain series sum of the same layers' d/λ.
 * Prints figures; never fails on a slow machine. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-calc.h"

#define N_CALCULATIONS 200000

static double
time_calculate (const LaminaConstruction *c,
                volatile double          *sink)
{
  double t0 = lamina_bench_now_ms ();

  for (int i = 0; i < N_CALCULATIONS; i++)
    {
      LaminaResult *r = lamina_calculate (c, NULL);

      *sink += r->u;
      lamina_result_free (r);
    }
  return (lamina_bench_now_ms () - t0) * 1e6 / N_CALCULATIONS;   /* ns */
}

static double
time_series_sum (const LaminaConstruction *c,
                 volatile double          *sink)
{
  double t0 = lamina_bench_now_ms ();

  for (int i = 0; i < N_CALCULATIONS; i++)
    {
      double r = 0.13 + 0.04;

      for (guint k = 0; k < c->layers->len; k++)
        {
          const LaminaLayer *l = c->layers->pdata[k];

          r += l->material ? l->thickness / 1000.0 / l->material->conductivity : 0.1;
        }
      *sink += 1.0 / r;
    }
  return (lamina_bench_now_ms () - t0) * 1e6 / N_CALCULATIONS;
}

int
main (void)
{
  g_autoptr(LaminaConstruction) c = lamina_bench_make_wall_12 ();
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaResult) check = lamina_calculate (c, &error);
  guint runs = lamina_bench_runs ();
  g_autofree double *samples = g_new (double, runs);
  g_autofree double *floor_samples = g_new (double, runs);
  volatile double sink = 0;
  LaminaBenchFigure f;

  if (check == NULL)
    g_error ("the bench construction does not calculate: %s", error->message);
  for (guint run = 0; run < runs; run++)
    {
      samples[run] = time_calculate (c, &sink);
      floor_samples[run] = time_series_sum (c, &sink);
    }
  lamina_bench_figure_init (&f, "engine.calc_12_layers_3_bridged", "ns");
  lamina_bench_figure_set_runs (&f, samples, runs);
  f.floor = lamina_bench_median (floor_samples, runs);
  f.target = 1000;
  f.size = 1;
  lamina_bench_print (&f);
  return sink != 0 ? 0 : 1;
}
