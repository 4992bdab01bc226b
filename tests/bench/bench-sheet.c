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
 *   wall: lamina_calculate, lamina_section_layout_compute and
 *   lamina_section_draw at 1600×1000 on a cairo image surface (software).
 *   Floor: cairo filling and stroking the same layer rectangles on the
 *   same surface, without layout, hatches or text. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-calc.h"
#include "lamina-section.h"
#include "lamina-sheet.h"

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

/* Floor of a drag step: the layer rectangles alone. */
static void
draw_floor (cairo_t                   *cr,
            const LaminaSectionLayout *layout)
{
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
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
  cairo_surface_flush (cairo_get_target (cr));
}

static void
bench_drag (void)
{
  g_autoptr(LaminaConstruction) c = lamina_bench_make_wall_12 ();
  g_autoptr(LaminaSection) section = lamina_section_new ();
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, DRAG_WIDTH, DRAG_HEIGHT);
  cairo_t *cr = cairo_create (surface);
  guint runs = lamina_bench_runs ();
  g_autofree double *medians = g_new (double, runs);
  g_autofree double *p99s = g_new (double, runs);
  g_autofree double *floor_medians = g_new (double, runs);
  double one[DRAG_STEPS];
  LaminaSectionLayout layout;
  LaminaSectionStyle style;
  LaminaBenchFigure f;

  lamina_section_style_init (&style, 13);
  style.temperatures = TRUE;
  style.highlight_boundary = DRAG_LAYER + 1;
  lamina_section_layout_init (&layout);
  for (guint run = 0; run < runs; run++)
    {
      for (guint step = 0; step < DRAG_STEPS; step++)
        {
          LaminaLayer *dragged = c->layers->pdata[DRAG_LAYER];
          g_autoptr(LaminaResult) result = NULL;
          double t0 = lamina_bench_now_ms ();

          /* A sweep of the boundary: 100 … 199 mm and back. */
          dragged->thickness = 100 + (step % 200 < 100 ? step % 100 : 99 - step % 100);
          result = lamina_calculate (c, NULL);
          lamina_section_layout_compute (&layout, c, &style, 0, 0, DRAG_WIDTH, DRAG_HEIGHT);
          cairo_save (cr);
          cairo_set_source_rgb (cr, 1, 1, 1);
          cairo_paint (cr);
          lamina_section_draw (section, cr, &layout, c, result, &style);
          cairo_restore (cr);
          cairo_surface_flush (surface);
          one[step] = lamina_bench_now_ms () - t0;
        }
      medians[run] = lamina_bench_median (one, DRAG_STEPS);
      p99s[run] = lamina_bench_percentile (one, DRAG_STEPS, 99);
      for (guint step = 0; step < DRAG_STEPS; step++)
        {
          double t0 = lamina_bench_now_ms ();

          draw_floor (cr, &layout);
          one[step] = lamina_bench_now_ms () - t0;
        }
      floor_medians[run] = lamina_bench_median (one, DRAG_STEPS);
    }
  lamina_bench_figure_init (&f, "sheet.drag_step_1600x1000", "ms");
  lamina_bench_figure_set_runs (&f, medians, runs);
  f.p99 = lamina_bench_median (p99s, runs);
  f.floor = lamina_bench_median (floor_medians, runs);
  f.target = 2;
  f.p99_target = 8;
  f.size = c->layers->len;
  lamina_bench_print (&f);
  lamina_section_layout_clear (&layout);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
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

  bench_drag ();
  n_sizes = argc > 1 ? (guint) argc - 1 : G_N_ELEMENTS (default_sizes);
  sizes = g_new (guint, n_sizes);
  for (guint i = 0; i < n_sizes; i++)
    sizes[i] = argc > 1 ? (guint) atoi (argv[i + 1]) : default_sizes[i];
  bench_catalogues (sizes, n_sizes);
  return 0;
}
