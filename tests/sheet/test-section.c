/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the section drawing: geometry to scale, hit-testing, pixels
 * against the geometry, determinism, and number formats per locale. */
#define G_LOG_DOMAIN "lamina-test"

#include <locale.h>
#include <math.h>
#include <string.h>

#include "lamina-catalogue.h"
#include "lamina-section-private.h"
#include "lamina-sheet-format.h"
#include "lamina-test-constructions.h"

#define WIDTH  1000
#define HEIGHT 600

typedef struct
{
  cairo_surface_t     *surface;
  LaminaSectionLayout  layout;
  LaminaSectionStyle   style;
} Render;

static void
render_with (Render                   *out,
             const LaminaConstruction *c,
             gboolean                  temperatures)
{
  g_autoptr(LaminaSection) painter = lamina_section_new ();
  g_autoptr(LaminaResult) result = lamina_calculate (c, NULL);
  cairo_t *cr;

  g_assert_nonnull (result);
  out->surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, WIDTH, HEIGHT);
  cr = cairo_create (out->surface);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  lamina_section_style_init (&out->style, 12);
  out->style.temperatures = temperatures;
  lamina_section_layout_init (&out->layout);
  lamina_section_layout_compute (&out->layout, c, &out->style, 0, 0, WIDTH, HEIGHT);
  lamina_section_draw (painter, cr, &out->layout, c, result, &out->style);
  cairo_destroy (cr);
  cairo_surface_flush (out->surface);
}

static void
render (Render                   *out,
        const LaminaConstruction *c)
{
  render_with (out, c, TRUE);
}

static void
render_clear (Render *r)
{
  cairo_surface_destroy (r->surface);
  lamina_section_layout_clear (&r->layout);
}

/* Darkness 0 (white) … 255 (black) of pixel (x, y). */
static int
get_ink (cairo_surface_t *surface,
         int              x,
         int              y)
{
  const guint8 *data = cairo_image_surface_get_data (surface);
  int stride = cairo_image_surface_get_stride (surface);
  guint32 px;

  g_assert_true (x >= 0 && x < WIDTH && y >= 0 && y < HEIGHT);
  px = *(const guint32 *) (data + y * stride + x * 4);
  return 255 - (int) (((px >> 16 & 0xff) + (px >> 8 & 0xff) + (px & 0xff)) / 3);
}

static void
test_edges_to_scale (void)
{
  /* The drawing is to scale: each layer spans d × scale (the definition
   * of a scale drawing, common practice). */
  g_autoptr(GPtrArray) all = lamina_test_constructions ();

  for (guint k = 0; k < all->len; k++)
    {
      LaminaConstruction *c = all->pdata[k];
      LaminaSectionLayout layout;
      LaminaSectionStyle style;
      double sum = 0;

      lamina_section_style_init (&style, 10);
      lamina_section_layout_init (&layout);
      lamina_section_layout_compute (&layout, c, &style, 10, 20, 800, 500);
      g_assert_cmpuint (layout.n_layers, ==, c->layers->len);
      for (guint i = 0; i < c->layers->len; i++)
        {
          double d = ((LaminaLayer *) c->layers->pdata[i])->thickness;
          g_assert_cmpfloat_with_epsilon (fabs (layout.edges[i + 1] - layout.edges[i]), d * layout.scale, 1e-9);
          sum += d;
        }
      g_assert_cmpfloat_with_epsilon (fabs (layout.edges[c->layers->len] - layout.edges[0]),
                                      sum * layout.scale, 1e-9);
      /* Inside on the left for walls, at the bottom for roofs, top for floors. */
      if (c->element == LAMINA_ELEMENT_WALL)
        g_assert_cmpfloat_with_epsilon (layout.edges[0], layout.body_x, 1e-9);
      else if (c->element == LAMINA_ELEMENT_ROOF)
        g_assert_cmpfloat_with_epsilon (layout.edges[0], layout.body_y + layout.body_height, 1e-9);
      else if (c->element == LAMINA_ELEMENT_FLOOR)
        g_assert_cmpfloat_with_epsilon (layout.edges[0], layout.body_y, 1e-9);
      /* The body stays inside the rectangle. */
      g_assert_cmpfloat (layout.body_x, >=, 10);
      g_assert_cmpfloat (layout.body_x + layout.body_width, <=, 810 + 1e-9);
      g_assert_cmpfloat (layout.body_y + layout.body_height, <=, 520 + 1e-9);
      lamina_section_layout_clear (&layout);
    }
}

static void
test_hit_and_drag (void)
{
  g_autoptr(LaminaConstruction) c = lamina_test_masonry_wall ();
  LaminaSectionLayout layout;
  LaminaSectionStyle style;
  double mid_y;
  guint index = 99;

  lamina_section_style_init (&style, 10);
  lamina_section_layout_init (&layout);
  lamina_section_layout_compute (&layout, c, &style, 0, 0, 900, 500);
  mid_y = layout.body_y + layout.body_height / 2;

  for (guint i = 0; i < layout.n_layers; i++)
    {
      double x = (layout.edges[i] + layout.edges[i + 1]) / 2;
      g_assert_cmpint (lamina_section_layout_hit (&layout, x, mid_y, 1.0, &index), ==, LAMINA_SECTION_HIT_LAYER);
      g_assert_cmpuint (index, ==, i);
    }
  for (guint i = 0; i <= layout.n_layers; i++)
    {
      g_assert_cmpint (lamina_section_layout_hit (&layout, layout.edges[i] + 0.5, mid_y, 1.0, &index), ==,
                       LAMINA_SECTION_HIT_BOUNDARY);
      g_assert_cmpuint (index, ==, i);
    }
  g_assert_cmpint (lamina_section_layout_hit (&layout, layout.body_x - 30, mid_y, 1.0, &index), ==,
                   LAMINA_SECTION_HIT_NONE);
  g_assert_cmpint (lamina_section_layout_hit (&layout, layout.edges[1] + 2, layout.body_y - 40, 1.0, &index), ==,
                   LAMINA_SECTION_HIT_NONE);

  /* Dragging the outer face of layer 3 (mineral wool, 190 mm) to 150 mm
   * past its inner face gives 150 mm; never below the minimum. */
  g_assert_cmpfloat_with_epsilon (lamina_section_layout_drag_thickness (&layout, 3,
                                    layout.edges[2] + 150 * layout.scale, mid_y, 1.0), 150.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (lamina_section_layout_drag_thickness (&layout, 3,
                                    layout.edges[2] - 50, mid_y, 1.0), 1.0, 1e-9);
  lamina_section_layout_clear (&layout);
}

static void
check_pixels (const LaminaConstruction *c)
{
  Render r;
  gboolean across;
  double length;

  render (&r, c);
  across = r.layout.orientation == LAMINA_SECTION_ACROSS;
  length = across ? r.layout.body_height : r.layout.body_width;

  for (guint i = 0; i <= r.layout.n_layers; i++)
    {
      /* A boundary line at the scaled position: dark within half a pixel
       * of it, at three places along the strip. */
      for (int q = 1; q <= 3; q++)
        {
          double along = (across ? r.layout.body_y : r.layout.body_x) + length * q / 4.0 + 0.5;
          int a = (int) floor (r.layout.edges[i]), best = 0;
          for (int p = a - 1; p <= a + 1; p++)
            best = MAX (best, across ? get_ink (r.surface, p, (int) along) : get_ink (r.surface, (int) along, p));
          if (best < 100)
            g_error ("%s: no boundary line at edge %u (%.2f): ink %d", c->code, i, r.layout.edges[i], best);
        }
    }
  for (guint i = 0; i < r.layout.n_layers; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      double lo = MIN (r.layout.edges[i], r.layout.edges[i + 1]) + 2;
      double hi = MAX (r.layout.edges[i], r.layout.edges[i + 1]) - 2;
      guint inked = 0, total = 0;

      if (hi <= lo)
        continue; /* thinner than the boundary lines */
      for (int t = (int) ceil (lo); t <= (int) floor (hi); t++)
        for (double s = 0.05; s < 0.95; s += 0.01)
          {
            int along = (int) ((across ? r.layout.body_y : r.layout.body_x) + s * length);
            total++;
            if ((across ? get_ink (r.surface, t, along) : get_ink (r.surface, along, t)) > 40)
              inked++;
          }
      /* Every material is hatched; an air layer is blank apart from its label. */
      if (layer->kind == LAMINA_LAYER_AIR)
        g_assert_cmpfloat ((double) inked / total, <, 0.2);
      else if (inked == 0)
        g_error ("%s: layer %u has no hatch", c->code, i + 1);
    }
  render_clear (&r);
}

static void
test_pixels (void)
{
  g_autoptr(GPtrArray) all = lamina_test_constructions ();

  for (guint k = 0; k < all->len; k++)
    check_pixels (all->pdata[k]);
}

/* Framing members are drawn inside their layer only: the same build-up
 * with each bridged layer filled by its main part alone must look the same
 * outside the body of the section (a member cut by the end of the strip
 * once spilled over the dimension chain). */
static void
test_members_stay_inside (void)
{
  g_autoptr(GPtrArray) all = lamina_test_constructions ();
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (demo, NULL);

  /* The demo library's build-ups too: their crossing battens once did it. */
  g_assert_nonnull (catalogue);
  for (guint k = 0; k < catalogue->constructions->len; k++)
    g_ptr_array_add (all, lamina_construction_copy (catalogue->constructions->pdata[k]));

  for (guint k = 0; k < all->len; k++)
    {
      const LaminaConstruction *c = all->pdata[k];
      g_autoptr(LaminaConstruction) plain = lamina_construction_copy (c);
      gboolean bridged = FALSE;
      Render a, b;
      const guint8 *da, *db;
      int stride;

      for (guint i = 0; i < plain->layers->len; i++)
        {
          LaminaLayer *layer = plain->layers->pdata[i];
          LaminaPart *bulk;

          if (layer->kind != LAMINA_LAYER_BRIDGED)
            continue;
          bulk = layer->parts->pdata[0];
          for (guint p = 1; p < layer->parts->len; p++)
            if (lamina_layer_get_part_fraction (layer, p) > lamina_layer_get_part_fraction (layer, 0))
              bulk = layer->parts->pdata[p];
          if (bulk->material == NULL)
            continue;
          layer->kind = LAMINA_LAYER_MATERIAL;
          layer->material = lamina_material_copy (bulk->material);
          bridged = TRUE;
        }
      if (!bridged)
        continue;
      render_with (&a, c, FALSE);
      render_with (&b, plain, FALSE);
      da = cairo_image_surface_get_data (a.surface);
      db = cairo_image_surface_get_data (b.surface);
      stride = cairo_image_surface_get_stride (a.surface);
      for (int y = 0; y < HEIGHT; y++)
        for (int x = 0; x < WIDTH; x++)
          {
            gboolean inside = x >= a.layout.body_x - 2 && x <= a.layout.body_x + a.layout.body_width + 2
                              && y >= a.layout.body_y - 2 && y <= a.layout.body_y + a.layout.body_height + 2;
            if (!inside && memcmp (da + y * stride + x * 4, db + y * stride + x * 4, 4) != 0)
              g_error ("%s: a framing member shows outside the section at (%d, %d)", c->code, x, y);
          }
      render_clear (&a);
      render_clear (&b);
    }
}

static void
test_deterministic (void)
{
  g_autoptr(LaminaConstruction) c = lamina_test_timber_wall ();
  Render a, b;

  render (&a, c);
  render (&b, c);
  g_assert_cmpint (memcmp (cairo_image_surface_get_data (a.surface), cairo_image_surface_get_data (b.surface),
                           (gsize) cairo_image_surface_get_stride (a.surface) * HEIGHT), ==, 0);
  render_clear (&a);
  render_clear (&b);
}

/* The white ground under the layers leaves out the pixels that opaque
 * hatch tiles cover (lamina-section.c, fill_ground): drawn on a
 * transparent surface, no pixel inside the body may stay see-through,
 * whatever the construction, its orientation or the drawing's size. */
static void
test_ground_covered (void)
{
  g_autoptr(GPtrArray) all = lamina_test_constructions ();
  g_autoptr(LaminaSection) painter = lamina_section_new ();
  const int sizes[][2] = { { WIDTH, HEIGHT }, { 433, 611 }, { 257, 199 } };

  for (guint k = 0; k < all->len; k++)
    for (guint z = 0; z < G_N_ELEMENTS (sizes); z++)
      {
        const LaminaConstruction *c = all->pdata[k];
        g_autoptr(LaminaResult) result = lamina_calculate (c, NULL);
        int w = sizes[z][0], h = sizes[z][1];
        cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
        cairo_t *cr = cairo_create (surface);
        LaminaSectionLayout layout;
        LaminaSectionStyle style;
        const guint8 *data;
        int stride;

        lamina_section_style_init (&style, 11);
        lamina_section_layout_init (&layout);
        lamina_section_layout_compute (&layout, c, &style, 0.3, 0.6, w - 1, h - 1);
        lamina_section_draw (painter, cr, &layout, c, result, &style);
        cairo_surface_flush (surface);
        data = cairo_image_surface_get_data (surface);
        stride = cairo_image_surface_get_stride (surface);
        for (int y = (int) ceil (layout.body_y) + 1; y < (int) floor (layout.body_y + layout.body_height) - 1; y++)
          for (int x = (int) ceil (layout.body_x) + 1; x < (int) floor (layout.body_x + layout.body_width) - 1; x++)
            {
              guint32 px = *(const guint32 *) (data + y * stride + x * 4);
              if (px >> 24 != 0xff)
                g_error ("%s at %d×%d: pixel (%d, %d) inside the section is not opaque (alpha %u)",
                         c->code, w, h, x, y, px >> 24);
            }
        lamina_section_layout_clear (&layout);
        cairo_destroy (cr);
        cairo_surface_destroy (surface);
      }
}

/* A painter kept through a drag (scale held, as the window holds it)
 * draws each step exactly as a new painter draws it: nothing it keeps
 * between frames (text layouts, hatch tiles) shows a stale state. */
static void
test_drag_sequence (void)
{
  g_autoptr(GPtrArray) all = lamina_test_constructions ();
  g_autoptr(LaminaSection) kept = lamina_section_new ();

  for (guint k = 0; k < all->len; k++)
    {
      LaminaConstruction *c = all->pdata[k];
      guint dragged = c->layers->len / 2;
      LaminaLayer *layer = c->layers->pdata[dragged];
      double start = layer->thickness;
      cairo_surface_t *a = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, WIDTH, HEIGHT);
      cairo_surface_t *b = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, WIDTH, HEIGHT);
      LaminaSectionLayout layout;
      LaminaSectionStyle style;

      lamina_section_style_init (&style, 12);
      style.highlight_boundary = (int) dragged + 1;
      lamina_section_layout_init (&layout);
      lamina_section_layout_compute (&layout, c, &style, 0, 0, WIDTH, HEIGHT);
      style.scale = layout.scale;
      for (guint step = 0; step < 6; step++)
        {
          g_autoptr(LaminaSection) fresh = lamina_section_new ();
          g_autoptr(LaminaResult) result = NULL;
          cairo_surface_t *targets[2] = { a, b };
          LaminaSection *painters[2] = { kept, fresh };

          layer->thickness = start * (1.0 + 0.11 * step) + 0.3 * step;
          result = lamina_calculate (c, NULL);
          lamina_section_layout_compute (&layout, c, &style, 0, 0, WIDTH, HEIGHT);
          for (guint t = 0; t < 2; t++)
            {
              cairo_t *cr = cairo_create (targets[t]);
              cairo_set_source_rgb (cr, 1, 1, 1);
              cairo_paint (cr);
              lamina_section_draw (painters[t], cr, &layout, c, result, &style);
              cairo_destroy (cr);
              cairo_surface_flush (targets[t]);
            }
          if (memcmp (cairo_image_surface_get_data (a), cairo_image_surface_get_data (b),
                      (gsize) cairo_image_surface_get_stride (a) * HEIGHT) != 0)
            g_error ("%s: step %u of a drag differs from a fresh drawing", c->code, step);
        }
      layer->thickness = start;
      lamina_section_layout_clear (&layout);
      cairo_surface_destroy (a);
      cairo_surface_destroy (b);
    }
}

/* The dimension chain of every demo construction, at the sizes the sheet
 * (unit 7 pt, 0.2–0.4 of an A4 page), the window (its text unit, zoomed
 * out to a quarter) and a small image draw it: no layer label overlaps
 * another, a label that stays on its layer fits in it, and none leaves
 * the drawing (common practice for dimension chains: every figure
 * legible, thin layers taken out on leaders). */
static void
test_chain_labels_demo (void)
{
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (demo, NULL);
  g_autoptr(LaminaSection) painter = lamina_section_new ();
  static const struct { double unit, width, height, zoom; } sizes[] = {
    { 7, 481, 160, 1 }, { 7, 481, 320, 1 },       /* the sheet's section box */
    { 11, 900, 240, 1 }, { 11, 900, 240, 0.5 }, { 11, 900, 240, 0.25 }, /* the window */
    { 10, 400, 150, 1 }, { 10, 300, 300, 1 },     /* small PNGs */
  };
  guint checked = 0;

  g_assert_nonnull (catalogue);
  for (guint k = 0; k < catalogue->constructions->len; k++)
    for (guint z = 0; z < G_N_ELEMENTS (sizes); z++)
      {
        const LaminaConstruction *c = catalogue->constructions->pdata[k];
        LaminaSectionLayout layout;
        LaminaSectionStyle style;
        guint n = c->layers->len;
        g_autofree double *extent = g_new0 (double, n);
        g_autofree double *want = g_new0 (double, n);
        g_autofree double *pos = g_new0 (double, n);
        g_autofree double *moved = g_new0 (double, n);
        g_autofree double *scratch = g_new0 (double, 3 * n);
        double total, u, t_lo, t_hi;

        lamina_section_style_init (&style, sizes[z].unit);
        style.scale = lamina_section_fit_scale (c, &style, sizes[z].width, sizes[z].height) * sizes[z].zoom;
        lamina_section_layout_init (&layout);
        lamina_section_layout_compute (&layout, c, &style, 0, 0, sizes[z].width, sizes[z].height);
        lamina_section_measure_chain_labels (painter, &layout, c, &style, extent);
        lamina_section_layout_chain_labels (&layout, &style, extent, want, pos, moved, scratch);
        total = fabs (layout.edges[n] - layout.edges[0]);
        u = style.unit;
        /* The drawing's rectangle along the thickness axis, in t (from the
         * inner face outwards). */
        {
          double sign = layout.edges[n] >= layout.edges[0] ? 1 : -1;
          gboolean across = layout.orientation == LAMINA_SECTION_ACROSS;
          double a0 = across ? layout.x : layout.y, a1 = a0 + (across ? layout.width : layout.height);

          t_lo = MIN (sign * (a0 - layout.edges[0]), sign * (a1 - layout.edges[0]));
          t_hi = MAX (sign * (a0 - layout.edges[0]), sign * (a1 - layout.edges[0]));
          g_assert_cmpfloat (t_lo, <=, 0);
          g_assert_cmpfloat (t_hi, >=, total);
        }
        for (guint i = 0; i < n; i++)
          {
            if (i > 0 && pos[i] - pos[i - 1] < (extent[i] + extent[i - 1]) / 2 + LAMINA_SECTION_LABEL_GAP * u - 1e-9)
              g_error ("%s at %g × %g (zoom %g): labels %u and %u overlap", c->code, sizes[z].width,
                       sizes[z].height, sizes[z].zoom, i, i + 1);
            if (moved[i] == 0 && fabs (layout.edges[i + 1] - layout.edges[i]) < extent[i])
              g_error ("%s: label %u stays on a layer too thin for it", c->code, i + 1);
            if (pos[i] - extent[i] / 2 < t_lo - 1e-9 || pos[i] + extent[i] / 2 > t_hi + 1e-9)
              g_error ("%s at %g × %g (zoom %g): label %u leaves the drawing", c->code, sizes[z].width,
                       sizes[z].height, sizes[z].zoom, i + 1);
          }
        lamina_section_layout_clear (&layout);
        checked++;
      }
  g_assert_cmpuint (checked, ==, catalogue->constructions->len * G_N_ELEMENTS (sizes));
}

static void
test_spread (void)
{
  /* Labels that fit stay put; crowded ones move apart by their size. */
  double want[4] = { 0, 1, 2, 50 }, size[4] = { 4, 4, 4, 4 }, pos[4], scratch[12];

  lamina_section_spread (want, size, 4, 1, pos, scratch);
  g_assert_cmpfloat_with_epsilon (pos[3], 50, 1e-9);
  g_assert_cmpfloat_with_epsilon (pos[1] - pos[0], 5, 1e-9);
  g_assert_cmpfloat_with_epsilon (pos[2] - pos[1], 5, 1e-9);
  /* The cluster centres on the mean of what it wanted (1). */
  g_assert_cmpfloat_with_epsilon (pos[1], 1, 1e-9);
}

static void
test_heated_side (void)
{
  /* A section is drawn the way up it is built, with the heated side where
   * it is (common practice): layers run from the inside, so heat flowing
   * down (a kitchen floor over a cellar) puts layer 1 on top, heat flowing
   * up puts it at the bottom; walls read from the left.  Every demo
   * build-up is checked, and CL-301 by name: its tiles lie on top. */
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (demo, NULL);
  gboolean cellar = FALSE;

  g_assert_nonnull (catalogue);
  for (guint k = 0; k < catalogue->constructions->len; k++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[k];
      LaminaSectionLayout layout;
      LaminaSectionStyle style;
      guint n = c->layers->len;

      lamina_section_style_init (&style, 10);
      lamina_section_layout_init (&layout);
      lamina_section_layout_compute (&layout, c, &style, 0, 0, 800, 500);
      if (c->element == LAMINA_ELEMENT_WALL || c->element == LAMINA_ELEMENT_PARTITION)
        g_assert_cmpfloat (layout.edges[0], <, layout.edges[n]);
      else if (c->heat_flow == LAMINA_HEAT_FLOW_DOWNWARD)
        {
          if (!(layout.edges[0] < layout.edges[n]))
            g_error ("%s: heat flows down but the inside is not on top", c->code);
        }
      else if (c->heat_flow == LAMINA_HEAT_FLOW_UPWARD && !(layout.edges[0] > layout.edges[n]))
        g_error ("%s: heat flows up but the inside is not at the bottom", c->code);
      if (g_strcmp0 (c->code, "CL-301") == 0)
        {
          const LaminaLayer *tiles = c->layers->pdata[0];

          cellar = TRUE;
          g_assert_cmpint (c->element, ==, LAMINA_ELEMENT_CEILING);
          g_assert_cmpstr (tiles->material->name, ==, "Ceramic floor tiles");
          g_assert_cmpint (layout.orientation, ==, LAMINA_SECTION_DOWNWARD);
          g_assert_cmpfloat_with_epsilon (layout.edges[0], layout.body_y, 1e-9);
        }
      lamina_section_layout_clear (&layout);
    }
  g_assert_true (cellar);
}

static void
test_spread_within (void)
{
  /* Thin layers at the ends of the chain: their labels are pushed in so
   * that none crosses an end (0 or 40) and none overlaps another. */
  double want[4] = { 0.5, 1.5, 20, 39.5 }, size[4] = { 4, 4, 4, 4 }, pos[4], scratch[12];

  lamina_section_spread_within (want, size, 4, 1, 0, 40, pos, scratch);
  g_assert_cmpfloat (pos[0] - 2, >=, 0 - 1e-9);
  g_assert_cmpfloat (pos[3] + 2, <=, 40 + 1e-9);
  for (guint i = 1; i < 4; i++)
    g_assert_cmpfloat (pos[i] - pos[i - 1], >=, 5 - 1e-9);
  /* One that fits stays where it was wanted. */
  g_assert_cmpfloat_with_epsilon (pos[2], 20, 1e-9);
}

static void
test_format_u (void)
{
  /* U to two significant figures on sheets (common practice for
   * reporting U; lamina_format_u, shared with the window and the CLI). */
  char buffer[LAMINA_FORMAT_SIZE];

  g_assert_cmpstr (lamina_format_u (buffer, 0.1483), ==, "0.15");
  g_assert_cmpstr (lamina_format_thickness (buffer, 12.5), ==, "12.5");
  g_assert_cmpstr (lamina_format_thickness (buffer, 190), ==, "190");
  g_assert_cmpstr (lamina_format_temperature (buffer, -10), ==, "\xe2\x88\x92" "10.0\xc2\xa0°C");
  g_assert_cmpstr (lamina_format_fixed (buffer, -0.001, 1), ==, "0.0");
}

static void
test_format_danish (void)
{
  /* Danish writes a decimal comma (LC_NUMERIC of da_DK, glibc locale
   * data). */
  char buffer[LAMINA_FORMAT_SIZE];
  g_autofree char *saved = g_strdup (setlocale (LC_NUMERIC, NULL));

  if (setlocale (LC_NUMERIC, "da_DK.UTF-8") == NULL)
    {
      g_test_skip ("the da_DK.UTF-8 locale is not installed");
      return;
    }
  g_assert_cmpstr (lamina_format_u (buffer, 0.1483), ==, "0,15");
  g_assert_cmpstr (lamina_format_thickness (buffer, 12.5), ==, "12,5");
  g_assert_cmpstr (lamina_format_temperature (buffer, -9.84), ==, "\xe2\x88\x92" "9,8\xc2\xa0°C");
  setlocale (LC_NUMERIC, saved);
}

int
main (int    argc,
      char **argv)
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/sheet/section/edges-to-scale", test_edges_to_scale);
  g_test_add_func ("/sheet/section/hit-and-drag", test_hit_and_drag);
  g_test_add_func ("/sheet/section/pixels", test_pixels);
  g_test_add_func ("/sheet/section/deterministic", test_deterministic);
  g_test_add_func ("/sheet/section/ground-covered", test_ground_covered);
  g_test_add_func ("/sheet/section/drag-sequence", test_drag_sequence);
  g_test_add_func ("/sheet/section/members-stay-inside", test_members_stay_inside);
  g_test_add_func ("/sheet/section/spread", test_spread);
  g_test_add_func ("/sheet/section/chain-labels-demo", test_chain_labels_demo);
  g_test_add_func ("/sheet/section/spread-within", test_spread_within);
  g_test_add_func ("/sheet/section/heated-side", test_heated_side);
  g_test_add_func ("/sheet/format/u", test_format_u);
  g_test_add_func ("/sheet/format/danish", test_format_danish);
  return g_test_run ();
}
