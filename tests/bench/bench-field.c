/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Benchmark: the 2-D conduction solver (EN ISO 10211).
 *
 *  - the demo's steel-stud wall (EW-202's layers): the whole check, i.e.
 *    every grid of the refinement and the Rsi 0.25 pass;
 *  - one solve on uniform grids of about 10⁴, 10⁵ and 10⁶ cells of the
 *    same module, with the growth exponent per step and the peak memory;
 *  - the peer: the same linear systems solved by scipy's sparse direct
 *    solver (python3-scipy, installed by build-aux/bench), timed in the
 *    same run; its time is the "floor" of each row, so the ratio is ours
 *    over scipy's.
 * Prints figures; never fails on a slow machine. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-field.h"

#include <glib/gstdio.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

static LaminaMaterial *
material (const char     *id,
          LaminaCategory  category,
          double          conductivity)
{
  return lamina_material_new (id, id, category, conductivity);
}

/* The layers of the demo's EW-202 (data/demo/lamina-demo.xml). */
static LaminaConstruction *
steel_stud_wall (void)
{
  LaminaConstruction *c = lamina_construction_new ("bench-ew-202", "steel stud wall", LAMINA_ELEMENT_WALL);
  LaminaLayer *studs = lamina_layer_new_bridged (100);

  c->inside_temperature = 18;
  c->outside_temperature = -12;
  lamina_layer_add_part (studs, lamina_part_new (material ("mw-035", LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (studs, lamina_part_new_framing (material ("steel", LAMINA_CATEGORY_METAL, 50),
                                                         1.2, 600, "stud"));
  lamina_construction_add_layer (c, lamina_layer_new_material (12.5, material ("gyp", LAMINA_CATEGORY_BOARD, 0.25)));
  lamina_construction_add_layer (c, lamina_layer_new_material (12.5, material ("gyp", LAMINA_CATEGORY_BOARD, 0.25)));
  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.2, 0));
  lamina_construction_add_layer (c, studs);
  lamina_construction_add_layer (c, lamina_layer_new_material (12, material ("cement-particle", LAMINA_CATEGORY_BOARD, 0.23)));
  lamina_construction_add_layer (c, lamina_layer_new_material (80, material ("pir", LAMINA_CATEGORY_INSULATION, 0.022)));
  lamina_construction_add_layer (c, lamina_layer_new_air (50, LAMINA_AIR_WELL_VENTILATED));
  lamina_construction_add_layer (c, lamina_layer_new_material (8, material ("fibre-cement", LAMINA_CATEGORY_BOARD, 0.40)));
  return c;
}

/* The module of EW-202 inside its ventilated cavity, on a uniform grid of
 * spacing @h (m): about (0.6/h)·(0.2172/h) cells. */
static LaminaFieldModel *
module_model (double h)
{
  const double w = 0.6, layers[] = { 0.0125, 0.0125, 0.0002, 0.100, 0.012, 0.080 };
  const double lambda[] = { 0.25, 0.25, 1.0, 0.035, 0.23, 0.022 };
  double y = 0;
  LaminaFieldModel *model;
  guint steel;

  for (guint k = 0; k < G_N_ELEMENTS (layers); k++)
    y += layers[k];
  model = lamina_field_model_new (w, y);
  y = 0;
  for (guint k = 0; k < G_N_ELEMENTS (layers); k++)
    {
      guint m = lamina_field_model_add_material (model, lambda[k], k == 2 ? 0.0002 / 1e-4 : lambda[k]);
      lamina_field_model_add_rectangle (model, 0, y, w, y + layers[k], m);
      if (k == 3)
        {
          steel = lamina_field_model_add_material (model, 50, 50);
          lamina_field_model_add_rectangle (model, 0.3 - 0.0006, y, 0.3 + 0.0006, y + layers[k], steel);
        }
      y += layers[k];
    }
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_BOTTOM, 0.13, 18);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_TOP, 0.13, -12);
  lamina_field_model_set_spacing (model, h, h);
  return model;
}

/* Writes the system for the peer; returns the file name or NULL. */
static char *
write_system (const LaminaFieldModel *model)
{
  g_autofree double *diag = NULL, *east = NULL, *north = NULL, *rhs = NULL;
  g_autoptr(LaminaFieldSolution) layout = NULL;
  g_autofree char *path = g_build_filename (g_get_tmp_dir (), "lamina-bench-field-system.bin", NULL);
  g_autofree char *header = NULL;
  gsize n;
  FILE *f;

  layout = lamina_field_model_dup_system (model, 0, &diag, &east, &north, &rhs, NULL);
  if (layout == NULL || (f = fopen (path, "wb")) == NULL)
    return NULL;
  n = (gsize) layout->nx * layout->ny;
  header = g_strdup_printf ("%u %u\n", layout->nx, layout->ny);
  fputs (header, f);
  fwrite (diag, sizeof (double), n, f);
  fwrite (east, sizeof (double), n, f);
  fwrite (north, sizeof (double), n, f);
  fwrite (rhs, sizeof (double), n, f);
  fclose (f);
  return g_steal_pointer (&path);
}

/* The peer's CPU time in ms, or NAN with @why set. */
static double
run_peer (const char *system_path,
          char      **why)
{
  g_autofree char *script = g_build_filename (LAMINA_BENCH_SOURCE_DIR, "bench-field-peer.py", NULL);
  /* Debian's interpreter, which python3-scipy is for (another python3 may
   * come first on PATH). */
  const char *python = g_file_test ("/usr/bin/python3", G_FILE_TEST_IS_EXECUTABLE) ? "/usr/bin/python3" : "python3";
  const char *argv[] = { python, script, system_path, NULL };
  g_autofree char *out = NULL;
  g_autoptr(GError) error = NULL;
  int status = 0;
  double ms;

  if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &out, NULL, &status, &error))
    {
      *why = g_strdup (error->message);
      return NAN;
    }
  if (g_str_has_prefix (out, "peer-skip "))
    {
      *why = g_strstrip (g_strdup (out + strlen ("peer-skip ")));
      return NAN;
    }
  if (sscanf (out, "peer-ms %lf", &ms) != 1)
    {
      *why = g_strdup_printf ("the peer printed “%s”", g_strstrip (out));
      return NAN;
    }
  printf ("  peer: %s", out);
  return ms;
}

int
main (void)
{
  g_autoptr(LaminaConstruction) wall = steel_stud_wall ();
  guint runs = lamina_bench_runs ();
  g_autofree double *samples = g_new (double, runs);
  static const guint sizes[] = { 10000, 100000, 1000000 };
  double values[G_N_ELEMENTS (sizes)];
  guint cells[G_N_ELEMENTS (sizes)];
  LaminaBenchFigure f;
  guint levels = 0, wall_cells = 0;

  /* The whole check of the demo's steel-stud wall. */
  for (guint r = 0; r < runs; r++)
    {
      g_autoptr(GError) error = NULL;
      double t0 = lamina_bench_now_ms ();
      g_autoptr(LaminaFieldResult) result = lamina_field_calculate (wall, 0, NULL, NULL, &error);

      samples[r] = lamina_bench_now_ms () - t0;
      if (result == NULL)
        g_error ("the steel-stud wall failed: %s", error->message);
      levels = result->refinement.n_levels;
      wall_cells = result->cells;
    }
  lamina_bench_figure_init (&f, "field.demo_steel_stud_wall", "ms");
  lamina_bench_figure_set_runs (&f, samples, runs);
  f.target = 1000;
  lamina_bench_print (&f);
  printf ("  %u grids, finest %u cells, plus the Rsi 0.25 pass; peak memory %.1f MB\n", levels, wall_cells,
          lamina_bench_peak_rss_mb ());

  /* One solve per size; the peer on the same system. */
  for (guint k = 0; k < G_N_ELEMENTS (sizes); k++)
    {
      double h = sqrt (0.6 * 0.2172 / sizes[k]);
      g_autoptr(LaminaFieldModel) model = module_model (h);
      g_autofree char *name = g_strdup_printf ("field.solve.n%u", sizes[k]);
      g_autofree char *mem_name = g_strdup_printf ("field.solve_peak_memory.n%u", sizes[k]);
      g_autofree char *system_path = NULL, *why = NULL;
      guint n_runs = sizes[k] >= 1000000 ? MIN (runs, 3) : runs;
      guint iterations = 0;
      double peer;
      LaminaBenchFigure m;

      for (guint r = 0; r < n_runs; r++)
        {
          g_autoptr(GError) error = NULL;
          double t0 = lamina_bench_now_ms ();
          g_autoptr(LaminaFieldSolution) s = lamina_field_model_solve_level (model, 0, NULL, NULL, NULL, &error);

          samples[r] = lamina_bench_now_ms () - t0;
          if (s == NULL)
            g_error ("%s: %s", name, error->message);
          cells[k] = lamina_field_solution_get_cells (s);
          iterations = s->iterations;
        }
      lamina_bench_figure_init (&f, name, "ms");
      lamina_bench_figure_set_runs (&f, samples, n_runs);
      f.size = cells[k];
      system_path = write_system (model);
      peer = system_path ? run_peer (system_path, &why) : NAN;
      if (system_path)
        g_unlink (system_path);
      f.floor = peer;
      lamina_bench_print (&f);
      printf ("  %u cells, %u iterations (MIC(0)-PCG to a relative residual of %g)\n", cells[k], iterations,
              LAMINA_FIELD_SOLVER_TOLERANCE);
      if (!isfinite (peer))
        lamina_bench_print_skip ("field.peer_scipy_spsolve", why ? why : "not run");
      values[k] = f.value;
      lamina_bench_figure_init (&m, mem_name, "MB");
      m.value = lamina_bench_peak_rss_mb ();
      m.spread = 0;
      m.runs = 1;
      m.size = cells[k];
      lamina_bench_print (&m);
    }
  lamina_bench_print_growth ("field.solve", "ms", cells, values, G_N_ELEMENTS (sizes));
  return 0;
}
