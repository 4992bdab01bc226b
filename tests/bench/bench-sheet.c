/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Benchmarks 6 and 7: the catalogue PDF and the drag step of the section.
 *
 *   bench-sheet [SIZE…]     (catalogue sizes; default 100 500 1000)
 *
 * sheet.catalogue_pdf: cover, index and SIZE sheets of synthetic
 *   constructions written by lamina_sheet_write_catalogue, in a child
 *   process per run (so that its peak resident memory, VmHWM, is the
 *   catalogue's alone), in sheets per second of the child's CPU time.
 * sheet.drag_step: one step of dragging a layer boundary of the 12-layer
 *   wall as the window drags it (the scale held from the start of the
 *   drag, the inner face pinned): lamina_calculate,
 *   lamina_section_layout_compute and lamina_section_draw at 1600×1000 on
 *   a cairo image surface (software).  Floor: cairo filling and stroking
 *   the same layer rectangles on the same surface, without layout,
 *   hatches or text.
 * sheet.drag_step_refit: the same with the scale fitted again at every
 *   step (every layer moves and changes width): the figure before issue 19.
 * sheet.drag_step_moisture: what the EN ISO 13788 page redraws at each step
 *   of the same drag: lamina_moisture_calculate_own, the psat/p plot
 *   (1600×700) and the monthly bars (1600×300).  Floor: the same surface
 *   painted and the plot's two curves and layer lines stroked as plain
 *   polylines.
 * sheet.drag_step_u_chart: what the U-against-thickness chart redraws at
 *   each step: lamina_solve_thickness for a target and
 *   lamina_solve_chart_draw at 1600×1000 (its curve is 121 corrected U
 *   values from the engine).  Floor: the surface painted and a 121-point
 *   polyline and the target line stroked. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-calc.h"
#include "lamina-climate.h"
#include "lamina-design.h"
#include "lamina-moisture-plot.h"
#include "lamina-section.h"
#include "lamina-sheet.h"
#include "lamina-solve.h"

#include <glib/gstdio.h>
#include <math.h>
#include <stdlib.h>
#include <unistd.h>

#define CATALOGUE_TARGET_SIZE 500
#define DRAG_WIDTH            1600
#define DRAG_HEIGHT           1000
#define DRAG_STEPS            500
#define DRAG_LAYER            5     /* the 145 mm stud layer */

static LaminaConstruction *
fetch_cb (gpointer   user_data,
          guint      index,
          GError   **error)
{
  return lamina_bench_make_construction (LAMINA_BENCH_SEED, index);
}

/* The child: writes one catalogue and prints "CPU-ms peak-MB". */
static int
run_catalogue_child (guint       n,
                     const char *path)
{
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;
  double t0 = lamina_bench_now_ms ();

  lamina_sheet_options_init (&options);
  options.practice = "Fenwick & Aske Architects (invented)";
  options.title = "Synthetic benchmark catalogue";
  options.library = "bench library";
  options.printed = "2026-01-01";
  if (!lamina_sheet_write_catalogue (path, TRUE, &options, n, fetch_cb, NULL, NULL, NULL, &error))
    {
      g_printerr ("%s\n", error->message);
      return 1;
    }
  printf ("%.3f %.3f\n", lamina_bench_now_ms () - t0, lamina_bench_peak_rss_mb ());
  return 0;
}

static gboolean
spawn_catalogue (guint   n,
                 double *ms,
                 double *peak_mb,
                 char  **failure)
{
  g_autofree char *size = g_strdup_printf ("%u", n);
  g_autofree char *pdf = g_strdup_printf ("%s/bench-catalogue-%u-%d.pdf", lamina_bench_cache_dir (), n, getpid ());
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(GError) error = NULL;
  const char *argv[] = { "/proc/self/exe", "--catalogue", size, pdf, NULL };
  int status = 0;

  if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL, &out, &err, &status, &error))
    {
      *failure = g_strdup (error->message);
      return FALSE;
    }
  g_remove (pdf);
  if (!g_spawn_check_wait_status (status, NULL) || sscanf (out, "%lf %lf", ms, peak_mb) != 2)
    {
      *failure = g_strdup_printf ("the catalogue writer failed: %s", g_strstrip (err));
      return FALSE;
    }
  return TRUE;
}

static void
bench_catalogues (const guint *sizes,
                  guint        n_sizes)
{
  g_autofree double *rates = g_new (double, n_sizes);
  g_autofree double *peaks = g_new (double, n_sizes);
  guint runs = g_getenv ("LAMINA_BENCH_RUNS") ? lamina_bench_runs () : 3;

  for (guint s = 0; s < n_sizes; s++)
    {
      g_autofree char *rate_name = g_strdup_printf ("sheet.catalogue_pdf.n%u", sizes[s]);
      g_autofree char *peak_name = g_strdup_printf ("sheet.catalogue_pdf_peak_rss.n%u", sizes[s]);
      g_autofree double *rate_runs = g_new (double, runs);
      g_autofree double *peak_runs = g_new (double, runs);
      LaminaBenchFigure f;

      for (guint run = 0; run < runs; run++)
        {
          g_autofree char *failure = NULL;
          double ms, mb;

          if (!spawn_catalogue (sizes[s], &ms, &mb, &failure))
            {
              lamina_bench_print_skip (rate_name, failure);
              return;
            }
          rate_runs[run] = sizes[s] / (ms / 1000.0);
          peak_runs[run] = mb;
        }
      lamina_bench_figure_init (&f, rate_name, "sheets/s");
      lamina_bench_figure_set_runs (&f, rate_runs, runs);
      f.goal = LAMINA_BENCH_AT_LEAST;
      f.size = sizes[s];
      if (sizes[s] == CATALOGUE_TARGET_SIZE)
        f.target = 100;
      lamina_bench_print (&f);
      rates[s] = f.value;

      lamina_bench_figure_init (&f, peak_name, "MB");
      lamina_bench_figure_set_runs (&f, peak_runs, runs);
      f.size = sizes[s];
      if (sizes[s] == CATALOGUE_TARGET_SIZE)
        f.target = 300;
      lamina_bench_print (&f);
      peaks[s] = f.value;
    }
  if (n_sizes > 1)
    {
      g_autofree double *seconds = g_new (double, n_sizes);

      for (guint s = 0; s < n_sizes; s++)
        seconds[s] = sizes[s] / rates[s];
      lamina_bench_print_growth ("sheet.catalogue_pdf_time.growth", "s", sizes, seconds, n_sizes);
      lamina_bench_print_growth ("sheet.catalogue_pdf_peak_rss.growth", "MB", sizes, peaks, n_sizes);
    }
}

/* The thickness of the dragged layer at @step: a sweep of the boundary,
 * 100 … 199 mm and back. */
static double
get_drag_thickness (guint step)
{
  return 100 + (step % 200 < 100 ? step % 100 : 99 - step % 100);
}

typedef struct
{
  const char *name;
  double      p99_target;
  /* One step: change the construction and redraw everything that shows it. */
  void      (*step)  (gpointer data, cairo_t *cr, guint step);
  /* The floor of one step. */
  void      (*floor) (gpointer data, cairo_t *cr);
  gpointer    data;
} DragFigure;

static void
run_drag_figure (const DragFigure *figure,
                 guint             size)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, DRAG_WIDTH, DRAG_HEIGHT);
  cairo_t *cr = cairo_create (surface);
  guint runs = lamina_bench_runs ();
  g_autofree double *medians = g_new (double, runs);
  g_autofree double *p99s = g_new (double, runs);
  g_autofree double *floor_medians = g_new (double, runs);
  double one[DRAG_STEPS];
  LaminaBenchFigure f;

  for (guint run = 0; run < runs; run++)
    {
      for (guint step = 0; step < DRAG_STEPS; step++)
        {
          double t0 = lamina_bench_now_ms ();

          cairo_save (cr);
          cairo_set_source_rgb (cr, 1, 1, 1);
          cairo_paint (cr);
          figure->step (figure->data, cr, step);
          cairo_restore (cr);
          cairo_surface_flush (surface);
          one[step] = lamina_bench_now_ms () - t0;
        }
      medians[run] = lamina_bench_median (one, DRAG_STEPS);
      p99s[run] = lamina_bench_percentile (one, DRAG_STEPS, 99);
      for (guint step = 0; step < DRAG_STEPS; step++)
        {
          double t0 = lamina_bench_now_ms ();

          cairo_save (cr);
          cairo_set_source_rgb (cr, 1, 1, 1);
          cairo_paint (cr);
          figure->floor (figure->data, cr);
          cairo_restore (cr);
          cairo_surface_flush (surface);
          one[step] = lamina_bench_now_ms () - t0;
        }
      floor_medians[run] = lamina_bench_median (one, DRAG_STEPS);
    }
  lamina_bench_figure_init (&f, figure->name, "ms");
  lamina_bench_figure_set_runs (&f, medians, runs);
  f.p99 = lamina_bench_median (p99s, runs);
  f.floor = lamina_bench_median (floor_medians, runs);
  f.target = 2;
  f.p99_target = figure->p99_target;
  f.size = size;
  lamina_bench_print (&f);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
}

/* ---- The section ------------------------------------------------------ */

typedef struct
{
  LaminaConstruction  *construction;
  LaminaSection       *painter;
  LaminaSectionLayout  layout;
  LaminaSectionStyle   style;
  gboolean             refit;
  double               anchor;  /* the inner face, held while dragging */
} SectionDrag;

static void
section_step (gpointer data,
              cairo_t *cr,
              guint    step)
{
  SectionDrag *d = data;
  LaminaLayer *dragged = d->construction->layers->pdata[DRAG_LAYER];
  g_autoptr(LaminaResult) result = NULL;

  dragged->thickness = get_drag_thickness (step);
  result = lamina_calculate (d->construction, NULL);
  lamina_section_layout_compute (&d->layout, d->construction, &d->style, 0, 0, DRAG_WIDTH, DRAG_HEIGHT);
  /* As the window's section view lays out a drag: the inner face pinned. */
  if (!d->refit)
    lamina_section_layout_compute (&d->layout, d->construction, &d->style,
                                   d->anchor - d->layout.edges[0], 0, DRAG_WIDTH, DRAG_HEIGHT);
  lamina_section_draw (d->painter, cr, &d->layout, d->construction, result, &d->style);
}

/* Floor of a drag step: the layer rectangles alone. */
static void
section_floor (gpointer data,
               cairo_t *cr)
{
  const LaminaSectionLayout *layout = &((SectionDrag *) data)->layout;

  cairo_set_line_width (cr, 1);
  for (guint i = 0; i < layout->n_layers; i++)
    {
      double a = layout->edges[i], b = layout->edges[i + 1];

      if (layout->orientation == LAMINA_SECTION_ACROSS)
        cairo_rectangle (cr, MIN (a, b), layout->body_y, fabs (b - a), layout->body_height);
      else
        cairo_rectangle (cr, layout->body_x, MIN (a, b), layout->body_width, fabs (b - a));
      cairo_set_source_rgb (cr, 0.6 + 0.03 * (i % 8), 0.6, 0.6);
      cairo_fill_preserve (cr);
      cairo_set_source_rgb (cr, 0, 0, 0);
      cairo_stroke (cr);
    }
}

static void
bench_drag (gboolean refit)
{
  SectionDrag d = { lamina_bench_make_wall_12 (), lamina_section_new () };
  DragFigure figure = { refit ? "sheet.drag_step_refit_1600x1000" : "sheet.drag_step_1600x1000", 6,
                        section_step, section_floor, &d };

  lamina_section_style_init (&d.style, 13);
  d.style.temperatures = TRUE;
  d.style.highlight_boundary = DRAG_LAYER + 1;
  d.refit = refit;
  lamina_section_layout_init (&d.layout);
  if (!refit)
    {
      /* The drag starts with the layer at its thickest and the drawing
       * fitted to the frame; the window then holds scale and inner face. */
      ((LaminaLayer *) d.construction->layers->pdata[DRAG_LAYER])->thickness = get_drag_thickness (99);
      lamina_section_layout_compute (&d.layout, d.construction, &d.style, 0, 0, DRAG_WIDTH, DRAG_HEIGHT);
      d.style.scale = d.layout.scale;
      d.anchor = d.layout.edges[0];
    }
  run_drag_figure (&figure, d.construction->layers->len);
  lamina_section_layout_clear (&d.layout);
  lamina_section_free (d.painter);
  lamina_construction_free (d.construction);
}

/* ---- The moisture page ------------------------------------------------ */

typedef struct
{
  LaminaConstruction   *construction;
  LaminaMoistureResult *result;  /* of the last step */
} MoistureDrag;

static void
moisture_step (gpointer data,
               cairo_t *cr,
               guint    step)
{
  MoistureDrag *d = data;
  g_autoptr(GError) error = NULL;

  ((LaminaLayer *) d->construction->layers->pdata[DRAG_LAYER])->thickness = get_drag_thickness (step);
  g_clear_pointer (&d->result, lamina_moisture_result_free);
  d->result = lamina_moisture_calculate_own (d->construction, NAN, &error);
  if (d->result == NULL)
    g_error ("the benchmark wall cannot be checked for moisture: %s", error->message);
  cairo_set_source_rgb (cr, 0, 0, 0);
  lamina_moisture_plot_draw (cr, d->construction, d->result, d->result->max_month ? d->result->max_month : 1,
                             FALSE, 0, 0, DRAG_WIDTH, DRAG_HEIGHT * 0.7, 13);
  lamina_moisture_bars_draw (cr, d->result, 0, DRAG_HEIGHT * 0.7, DRAG_WIDTH, DRAG_HEIGHT * 0.3, 13);
}

/* Floor: the plot's two curves and the layer lines as plain polylines. */
static void
moisture_floor (gpointer data,
                cairo_t *cr)
{
  const LaminaMoistureResult *r = ((MoistureDrag *) data)->result;
  const LaminaMoistureMonth *m = &r->months[(r->max_month ? r->max_month : 1) - 1];
  double total = r->position[r->n_points - 1], top = 0;

  for (guint j = 0; j < r->n_points; j++)
    top = MAX (top, MAX (m->saturation[j], m->pressure[j]));
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, 1);
  for (guint j = 0; j < r->n_points; j++)
    {
      double x = 50 + (DRAG_WIDTH - 100) * r->position[j] / total;
      cairo_move_to (cr, x, 50);
      cairo_line_to (cr, x, DRAG_HEIGHT * 0.7 - 50);
    }
  cairo_stroke (cr);
  for (guint curve = 0; curve < 2; curve++)
    {
      const double *p = curve == 0 ? m->saturation : m->pressure;

      for (guint j = 0; j < r->n_points; j++)
        cairo_line_to (cr, 50 + (DRAG_WIDTH - 100) * r->position[j] / total,
                       DRAG_HEIGHT * 0.7 - 50 - (DRAG_HEIGHT * 0.7 - 100) * p[j] / top);
      cairo_stroke (cr);
    }
}

static void
bench_drag_moisture (void)
{
  MoistureDrag d = { lamina_bench_make_wall_12 (), NULL };
  DragFigure figure = { "sheet.drag_step_moisture_1600x1000", 6, moisture_step, moisture_floor, &d };
  LaminaClimate *climate = lamina_climate_new ("bench-site", "Bench site (invented)");

  /* An invented climate with a cold winter; μ of the materials as the
   * synthetic data give them. */
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      climate->temperature[m] = 8 - 10 * cos (2 * G_PI * (m - 0.5) / 12);
      climate->humidity[m] = 0.88 - 0.08 * sin (G_PI * m / 11);
    }
  /* μ by category where the synthetic materials leave it out: typical
   * design values (EN ISO 10456 Table 3, from memory; OSB and boards as
   * the usual dry-cup values). */
  for (guint i = 0; i < d.construction->layers->len; i++)
    {
      LaminaLayer *layer = d.construction->layers->pdata[i];
      guint n = layer->parts ? layer->parts->len : 0;

      /* The two declared layers as a vapour control layer inside (sd
       * 20 m) and a breather membrane outside (sd 0.05 m): typical
       * declared values (common practice). */
      if (layer->kind == LAMINA_LAYER_RESISTANCE)
        layer->sd = i < DRAG_LAYER ? 20 : 0.05;
      for (guint k = 0; k <= n; k++)
        {
          LaminaMaterial *material = k < n ? ((LaminaPart *) layer->parts->pdata[k])->material : layer->material;

          if (material != NULL && !(material->vapour_resistance_factor > 0))
            material->vapour_resistance_factor = material->category == LAMINA_CATEGORY_INSULATION ? 1
                                                 : material->category == LAMINA_CATEGORY_TIMBER ? 50
                                                 : material->category == LAMINA_CATEGORY_BOARD ? 30 : 10;
        }
    }
  lamina_construction_set_moisture (d.construction, lamina_moisture_settings_new ("bench-site"));
  d.construction->moisture->humidity_class = 3;
  d.construction->moisture->climate_data = climate;
  run_drag_figure (&figure, d.construction->layers->len);
  g_clear_pointer (&d.result, lamina_moisture_result_free);
  lamina_construction_free (d.construction);
}

/* ---- The U-against-thickness chart ------------------------------------ */

typedef struct
{
  LaminaConstruction *construction;
  LaminaSolve         solve;
  gboolean            has_solve;
} ChartDrag;

#define CHART_TARGET 0.12 /* W/(m²·K): reachable by the dragged layer */

static void
chart_step (gpointer data,
            cairo_t *cr,
            guint    step)
{
  ChartDrag *d = data;

  ((LaminaLayer *) d->construction->layers->pdata[DRAG_LAYER])->thickness = get_drag_thickness (step);
  d->has_solve = lamina_solve_thickness (d->construction, DRAG_LAYER + 1, CHART_TARGET, &d->solve, NULL);
  cairo_set_source_rgb (cr, 0, 0, 0);
  lamina_solve_chart_draw (cr, 0, 0, DRAG_WIDTH, DRAG_HEIGHT, 13, d->construction,
                           d->has_solve ? &d->solve : NULL);
}

/* Floor: a 121-point curve and the target line. */
static void
chart_floor (gpointer data,
             cairo_t *cr)
{
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, 1);
  for (int i = 0; i <= 120; i++)
    cairo_line_to (cr, 80 + (DRAG_WIDTH - 160) * i / 120.0, 80 + (DRAG_HEIGHT - 160) * (1 - exp (-i / 30.0)));
  cairo_stroke (cr);
  cairo_move_to (cr, 80, DRAG_HEIGHT / 2.0);
  cairo_line_to (cr, DRAG_WIDTH - 80, DRAG_HEIGHT / 2.0);
  cairo_stroke (cr);
}

static void
bench_drag_chart (void)
{
  ChartDrag d = { lamina_bench_make_wall_12 () };
  DragFigure figure = { "sheet.drag_step_u_chart_1600x1000", 6, chart_step, chart_floor, &d };
  g_autoptr(GError) error = NULL;

  if (!lamina_solve_thickness (d.construction, DRAG_LAYER + 1, CHART_TARGET, &d.solve, &error))
    lamina_bench_print_skip (figure.name, error->message);
  else
    run_drag_figure (&figure, d.construction->layers->len);
  lamina_construction_free (d.construction);
}

int
main (int    argc,
      char **argv)
{
  guint default_sizes[] = { 100, CATALOGUE_TARGET_SIZE, 1000 };
  g_autofree guint *sizes = NULL;
  guint n_sizes;

  if (argc == 4 && g_str_equal (argv[1], "--catalogue"))
    return run_catalogue_child ((guint) atoi (argv[2]), argv[3]);

  bench_drag (FALSE);
  bench_drag (TRUE);
  bench_drag_moisture ();
  bench_drag_chart ();
  n_sizes = argc > 1 ? (guint) argc - 1 : G_N_ELEMENTS (default_sizes);
  sizes = g_new (guint, n_sizes);
  for (guint i = 0; i < n_sizes; i++)
    sizes[i] = argc > 1 ? (guint) atoi (argv[i + 1]) : default_sizes[i];
  bench_catalogues (sizes, n_sizes);
  return 0;
}
