/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Benchmark: the full EN ISO 6946 calculation of a 12-layer construction
 * with 3 bridged layers.  Prints figures; never fails on a slow machine. */
#include "lamina-bench.h"
#include "lamina-calc.h"

#include <math.h>

static LaminaLayer *
layer (double d, const char *id, LaminaCategory category, double lambda)
{
  return lamina_layer_new_material (d, lamina_material_new (id, id, category, lambda));
}

static LaminaLayer *
framed (double d, double width, double spacing, const char *member)
{
  LaminaLayer *l = lamina_layer_new_bridged (d);

  lamina_layer_add_part (l, lamina_part_new (lamina_material_new ("mw", "mw", LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (l, lamina_part_new_framing (lamina_material_new ("sw", "sw", LAMINA_CATEGORY_TIMBER, 0.13),
                                                     width, spacing, member));
  return l;
}

LaminaConstruction *lamina_bench_construction (void);

LaminaConstruction *
lamina_bench_construction (void)
{
  LaminaConstruction *c = lamina_construction_new ("b", "bench wall", LAMINA_ELEMENT_WALL);

  lamina_construction_add_layer (c, layer (12.5, "gyp", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, layer (12.5, "gyp", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, framed (45, 45, 600, NULL));
  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.2, 0));
  lamina_construction_add_layer (c, layer (12, "osb", LAMINA_CATEGORY_BOARD, 0.13));
  lamina_construction_add_layer (c, framed (145, 45, 600, "stud"));
  lamina_construction_add_layer (c, framed (95, 45, 600, "stud"));
  lamina_construction_add_layer (c, layer (9, "gypsum sheathing", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, layer (60, "wood fibre", LAMINA_CATEGORY_INSULATION, 0.042));
  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.5, 0));
  lamina_construction_add_layer (c, lamina_layer_new_air (25, LAMINA_AIR_UNVENTILATED));
  lamina_construction_add_layer (c, layer (22, "larch", LAMINA_CATEGORY_TIMBER, 0.13));
  return c;
}

int
main (void)
{
  g_autoptr(LaminaConstruction) c = lamina_bench_construction ();
  const int n = 200000;
  double samples[LAMINA_BENCH_RUNS];
  volatile double sink = 0;

  for (int run = 0; run < LAMINA_BENCH_RUNS; run++)
    {
      gint64 t0 = g_get_monotonic_time ();
      for (int i = 0; i < n; i++)
        {
          LaminaResult *r = lamina_calculate (c, NULL);
          sink += r->u;
          lamina_result_free (r);
        }
      samples[run] = (double) (g_get_monotonic_time () - t0) * 1000.0 / n;   /* ns */
    }

  /* Floor: the series sum of the same twelve layers' d/λ, done plainly. */
  double floor_samples[LAMINA_BENCH_RUNS];
  for (int run = 0; run < LAMINA_BENCH_RUNS; run++)
    {
      gint64 t0 = g_get_monotonic_time ();
      for (int i = 0; i < n; i++)
        {
          double r = 0.17;
          for (guint k = 0; k < c->layers->len; k++)
            {
              LaminaLayer *l = c->layers->pdata[k];
              r += l->material ? l->thickness / 1000.0 / l->material->conductivity : 0.1;
            }
          sink += 1.0 / r;
        }
      floor_samples[run] = (double) (g_get_monotonic_time () - t0) * 1000.0 / n;
    }
  lamina_bench_report ("engine.calc_12_layers_3_bridged", samples, floor_samples, "ns", 1000.0);
  return sink > 0 ? 0 : 1;
}
