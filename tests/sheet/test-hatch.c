/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the hatch tiles: on a raster target the face-to-face patterns
 * (insulation, timber along the grain, boards) come from a tile one
 * period long; it must draw what the paths draw, in every quarter turn
 * of the section, and a vector target must still get the paths.  The
 * reference is the path drawing itself (the patterns are common
 * practice, not from a standard). */
#define G_LOG_DOMAIN "lamina-test"

#include <math.h>

#include "lamina-hatch.h"

#define SIZE  400
#define BLOCK 20

typedef struct
{
  double x0, y0, xx, yx, xy, yy; /* where the hatch frame lands */
} Turn;

static const Turn turns[] = {
  { 0, 0, 1, 0, 0, 1 },          /* a wall: x across the layer */
  { 0, SIZE, 0, -1, 1, 0 },      /* a roof: thickness upwards */
  { SIZE, 0, 0, 1, -1, 0 },      /* a floor-like quarter turn */
  { SIZE, SIZE, -1, 0, 0, -1 },  /* a half turn */
};

static cairo_surface_t *
draw (LaminaCategory    category,
      const Turn       *turn,
      LaminaHatchCache *cache,
      double            x,
      double            width)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, SIZE, SIZE);
  cairo_t *cr = cairo_create (surface);
  cairo_matrix_t m;

  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  cairo_matrix_init (&m, turn->xx, turn->yx, turn->xy, turn->yy, turn->x0, turn->y0);
  cairo_transform (cr, &m);
  lamina_hatch_fill (cr, cache, category, LAMINA_HATCH_LAYER, x, 13.0, width, 350.0, 12, 7);
  cairo_destroy (cr);
  cairo_surface_flush (surface);
  return surface;
}

static double
get_block_ink (cairo_surface_t *surface,
               int              bx,
               int              by)
{
  const guint8 *data = cairo_image_surface_get_data (surface);
  int stride = cairo_image_surface_get_stride (surface);
  double ink = 0;

  for (int y = by * BLOCK; y < (by + 1) * BLOCK; y++)
    for (int x = bx * BLOCK; x < (bx + 1) * BLOCK; x++)
      ink += 255 - (data[y * stride + 4 * x + 1]);
  return ink / (BLOCK * BLOCK);
}

/* Same ink overall and block by block (a tile may sit up to a pixel off
 * the paths, and stretch a period by under a pixel). */
static void
assert_alike (cairo_surface_t *paths,
              cairo_surface_t *tiled,
              const char      *what)
{
  double total_p = 0, total_t = 0, worst = 0;

  for (int by = 0; by < SIZE / BLOCK; by++)
    for (int bx = 0; bx < SIZE / BLOCK; bx++)
      {
        double p = get_block_ink (paths, bx, by), t = get_block_ink (tiled, bx, by);

        total_p += p;
        total_t += t;
        worst = MAX (worst, fabs (p - t));
      }
  g_test_message ("%s: ink %.0f (paths) / %.0f (tile), worst block %.1f", what, total_p, total_t, worst);
  g_assert_cmpfloat (total_p, >, 100);
  g_assert_cmpfloat (fabs (total_t - total_p), <, 0.06 * total_p);
  g_assert_cmpfloat (worst, <, 40);
}

static void
test_tiles_match_paths (void)
{
  const LaminaCategory categories[] = {
    LAMINA_CATEGORY_INSULATION, LAMINA_CATEGORY_TIMBER, LAMINA_CATEGORY_BOARD,
  };
  const double widths[] = { 37.3, 118.6, 241.2 };

  for (guint c = 0; c < G_N_ELEMENTS (categories); c++)
    for (guint t = 0; t < G_N_ELEMENTS (turns); t++)
      for (guint w = 0; w < G_N_ELEMENTS (widths); w++)
        {
          g_autoptr(LaminaHatchCache) cache = lamina_hatch_cache_new ();
          g_autofree char *what = g_strdup_printf ("category %d, turn %u, width %.1f", categories[c], t, widths[w]);
          cairo_surface_t *paths = draw (categories[c], &turns[t], NULL, 21.4, widths[w]);
          cairo_surface_t *tiled = draw (categories[c], &turns[t], cache, 21.4, widths[w]);
          cairo_surface_t *again = draw (categories[c], &turns[t], cache, 21.4, widths[w]);

          assert_alike (paths, tiled, what);
          /* The second fill reuses the tile: the same pixels. */
          g_assert_cmpmem (cairo_image_surface_get_data (tiled), SIZE * cairo_image_surface_get_stride (tiled),
                           cairo_image_surface_get_data (again), SIZE * cairo_image_surface_get_stride (again));
          cairo_surface_destroy (paths);
          cairo_surface_destroy (tiled);
          cairo_surface_destroy (again);
        }
}

/* A vector target (a PDF sheet) keeps the strokes as paths: drawn through
 * a recording surface and replayed, with or without the cache, the
 * pixels are identical. */
static void
test_vector_keeps_paths (void)
{
  const LaminaCategory categories[] = {
    LAMINA_CATEGORY_INSULATION, LAMINA_CATEGORY_TIMBER, LAMINA_CATEGORY_BOARD,
  };

  for (guint c = 0; c < G_N_ELEMENTS (categories); c++)
    {
      g_autoptr(LaminaHatchCache) cache = lamina_hatch_cache_new ();
      cairo_surface_t *out[2];

      for (guint k = 0; k < 2; k++)
        {
          cairo_surface_t *recording = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
          cairo_t *cr = cairo_create (recording);

          lamina_hatch_fill (cr, k ? cache : NULL, categories[c], LAMINA_HATCH_LAYER, 21.4, 13, 118.6, 350, 12, 7);
          cairo_destroy (cr);
          out[k] = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, SIZE, SIZE);
          cr = cairo_create (out[k]);
          cairo_set_source_rgb (cr, 1, 1, 1);
          cairo_paint (cr);
          cairo_set_source_surface (cr, recording, 0, 0);
          cairo_paint (cr);
          cairo_destroy (cr);
          cairo_surface_destroy (recording);
          cairo_surface_flush (out[k]);
        }
      g_assert_cmpmem (cairo_image_surface_get_data (out[0]), SIZE * cairo_image_surface_get_stride (out[0]),
                       cairo_image_surface_get_data (out[1]), SIZE * cairo_image_surface_get_stride (out[1]));
      cairo_surface_destroy (out[0]);
      cairo_surface_destroy (out[1]);
    }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/sheet/hatch/tiles-match-paths", test_tiles_match_paths);
  g_test_add_func ("/sheet/hatch/vector-keeps-paths", test_vector_keeps_paths);
  return g_test_run ();
}
