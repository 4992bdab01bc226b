/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The design aids drawn by the sheet code: the comparison page read back
 * with poppler, the dynamic paragraph on the sheet, and the chart of U
 * against a layer's thickness rendered to PNG.  The figures the page shows
 * are checked against lamina_calculate and lamina_dynamic_calculate; the
 * physics itself is tested in tests/core. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib/gstdio.h>
#include <math.h>
#include <poppler.h>
#include <string.h>

#include "lamina-design.h"
#include "lamina-sheet-format.h"
#include "lamina-test-constructions.h"

G_DEFINE_AUTOPTR_CLEANUP_FUNC (PopplerPage, g_object_unref)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (PopplerDocument, g_object_unref)

static char *temp_dir;

static char *
dup_pdf_text (const char *path,
              int        *n_pages)
{
  g_autofree char *uri = g_filename_to_uri (path, NULL, NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(PopplerDocument) doc = poppler_document_new_from_file (uri, NULL, &error);
  g_autoptr(PopplerPage) page = NULL;
  g_autofree char *text = NULL;
  g_auto(GStrv) words = NULL;

  g_assert_no_error (error);
  *n_pages = poppler_document_get_n_pages (doc);
  page = poppler_document_get_page (doc, 0);
  text = poppler_page_get_text (page);
  words = g_strsplit_set (text, " \n\t\r", -1);
  {
    GString *out = g_string_new (NULL);
    for (guint i = 0; words[i]; i++)
      if (*words[i])
        g_string_append_printf (out, "%s%s", out->len ? " " : "", words[i]);
    return g_string_free (out, FALSE);
  }
}

static void
assert_has (const char *text,
            const char *what)
{
  if (strstr (text, what) == NULL)
    g_error ("“%s” not found in: %s", what, text);
}

/* Densities and specific heats (EN ISO 10456:2007 Table 3, from memory;
 * typical values for insulation) so that the dynamic figures exist. */
static void
give_heat_capacity (LaminaConstruction *c)
{
  for (guint i = 0; i < c->layers->len; i++)
    {
      LaminaLayer *l = c->layers->pdata[i];
      guint n = l->kind == LAMINA_LAYER_BRIDGED ? l->parts->len : 1;

      for (guint p = 0; p < n; p++)
        {
          LaminaMaterial *m = l->kind == LAMINA_LAYER_BRIDGED ? ((LaminaPart *) l->parts->pdata[p])->material
                                                              : l->material;
          if (m == NULL)
            continue;
          m->density = m->category == LAMINA_CATEGORY_INSULATION ? 30 : 1500;
          m->specific_heat = m->category == LAMINA_CATEGORY_TIMBER ? 1600 : 1000;
        }
    }
}

/* Rows: B − A is the difference of the figures as shown; a construction
 * against itself differs by nothing. */
static void
test_rows (void)
{
  g_autoptr(LaminaConstruction) a = lamina_test_masonry_wall ();
  g_autoptr(LaminaConstruction) b = lamina_test_timber_wall ();
  g_autoptr(LaminaResult) ra = lamina_calculate (a, NULL);
  g_autoptr(LaminaResult) rb = lamina_calculate (b, NULL);
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(GPtrArray) same = NULL;
  char ua[LAMINA_FORMAT_SIZE], ub[LAMINA_FORMAT_SIZE], diff[LAMINA_FORMAT_SIZE];
  gboolean found = FALSE;

  give_heat_capacity (a);
  give_heat_capacity (b);
  rows = lamina_comparison_rows (a, ra, b, rb);
  lamina_format_fixed (ua, ra->u_corrected, 3);
  lamina_format_fixed (ub, rb->u_corrected, 3);
  lamina_format_fixed (diff, g_ascii_strtod (ub, NULL) - g_ascii_strtod (ua, NULL), 3);
  for (guint i = 0; i < rows->len; i++)
    {
      const LaminaComparisonRow *row = rows->pdata[i];

      if (g_strcmp0 (row->label, "Corrected U") != 0)
        continue;
      found = TRUE;
      g_assert_cmpstr (row->a, ==, ua);
      g_assert_cmpstr (row->b, ==, ub);
      /* "+0.012" or "−0.034": the sign shown, the digits of b − a. */
      g_assert_nonnull (strstr (row->difference, diff[0] == '-' ? diff + 1 : diff));
    }
  g_assert_true (found);
  g_assert_cmpuint (rows->len, >=, 18);

  same = lamina_comparison_rows (a, ra, a, ra);
  for (guint i = 0; i < same->len; i++)
    {
      const LaminaComparisonRow *row = same->pdata[i];

      g_assert_cmpstr (row->a, ==, row->b);
      if (*row->difference)
        g_assert_true (strspn (row->difference, "0.") == strlen (row->difference));
    }
}

static void
test_comparison_pdf (void)
{
  g_autoptr(LaminaConstruction) a = lamina_test_masonry_wall ();
  g_autoptr(LaminaConstruction) b = lamina_test_ground_floor ();
  g_autofree char *path = g_build_filename (temp_dir, "compare.pdf", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaResult) ra = NULL;
  g_autoptr(LaminaResult) rb = NULL;
  g_autofree char *text = NULL;
  LaminaSheetOptions options;
  char ua[LAMINA_FORMAT_SIZE], ub[LAMINA_FORMAT_SIZE];
  int n_pages = 0;

  give_heat_capacity (a);
  give_heat_capacity (b);
  ra = lamina_calculate (a, NULL);
  rb = lamina_calculate (b, NULL);
  lamina_sheet_options_init (&options);
  options.practice = "Tamberlin Oke Architects";
  options.printed = "2024-05-02";
  g_assert_true (lamina_comparison_write_pdf (path, FALSE, &options, a, NULL, b, "as edited", &error));
  g_assert_no_error (error);
  /* Written atomically and never over an existing file. */
  g_assert_false (lamina_comparison_write_pdf (path, FALSE, &options, a, NULL, b, NULL, &error));
  g_assert_error (error, LAMINA_SHEET_ERROR, LAMINA_SHEET_ERROR_EXISTS);

  text = dup_pdf_text (path, &n_pages);
  g_assert_cmpint (n_pages, ==, 1);
  assert_has (text, a->code);
  assert_has (text, b->code);
  assert_has (text, a->name);
  assert_has (text, "as edited");
  assert_has (text, "Both sections at 1:");
  assert_has (text, "B − A");
  assert_has (text, "Corrected U");
  assert_has (text, lamina_format_fixed (ua, ra->u_corrected, 3));
  assert_has (text, lamina_format_fixed (ub, rb->u_corrected, 3));
  assert_has (text, "Decrement factor f");
  assert_has (text, "EN ISO 13786:2017");
  assert_has (text, "licensed professional practice");
  /* The floor is a draft: the page says so. */
  assert_has (text, "DRAFT");
  for (guint i = 0; i < a->layers->len; i++)
    if (((LaminaLayer *) a->layers->pdata[i])->kind == LAMINA_LAYER_MATERIAL)
      assert_has (text, lamina_layer_get_label (a->layers->pdata[i]));
  g_unlink (path);
}

/* The sheet carries the dynamic paragraph, or says why it is left out. */
static void
test_sheet_dynamic (void)
{
  g_autoptr(LaminaConstruction) c = lamina_test_masonry_wall ();
  g_autofree char *path = g_build_filename (temp_dir, "sheet.pdf", NULL);
  g_autofree char *text = NULL;
  g_autofree char *bare = NULL;
  g_autoptr(LaminaResult) r = NULL;
  LaminaSheetOptions options;
  LaminaDynamic d;
  char f[LAMINA_FORMAT_SIZE];
  int n_pages;

  lamina_sheet_options_init (&options);
  g_assert_true (lamina_sheet_write_pdf (path, TRUE, &options, c, NULL));
  bare = dup_pdf_text (path, &n_pages);
  assert_has (bare, "Dynamic thermal characteristics, EN ISO 13786:2017");
  assert_has (bare, "Not given");

  give_heat_capacity (c);
  r = lamina_calculate (c, NULL);
  g_assert_true (lamina_dynamic_calculate (c, r, 24, &d, NULL));
  g_assert_true (lamina_sheet_write_pdf (path, TRUE, &options, c, NULL));
  text = dup_pdf_text (path, &n_pages);
  g_assert_cmpint (n_pages, ==, 1);
  assert_has (text, "decrement factor f = ");
  assert_has (text, lamina_format_fixed (f, d.decrement_factor, 2));
  g_unlink (path);
}

/* The chart: the target line and the curve are drawn where the solve
 * says; rendered to PNG (kept in LAMINA_TEST_KEEP_PNG for a look). */
static void
test_chart_png (void)
{
  g_autoptr(LaminaConstruction) c = lamina_test_masonry_wall ();
  g_autofree char *path = g_build_filename (g_getenv ("LAMINA_TEST_KEEP_PNG") ? g_getenv ("LAMINA_TEST_KEEP_PNG")
                                                                              : temp_dir, "chart.png", NULL);
  g_autoptr(GError) error = NULL;
  cairo_surface_t *png;
  LaminaSolve s;
  guint layer = 0, red = 0, dark = 0;

  for (guint i = 0; i < c->layers->len && layer == 0; i++)
    {
      LaminaLayer *l = c->layers->pdata[i];
      if (l->kind == LAMINA_LAYER_MATERIAL && l->material->category == LAMINA_CATEGORY_INSULATION)
        layer = i + 1;
    }
  g_assert_cmpuint (layer, >, 0);
  g_assert_true (lamina_solve_thickness (c, layer, 0.15, &s, &error));
  g_assert_true (lamina_solve_chart_write_png (c, &s, 640, 400, path, &error));
  g_assert_no_error (error);

  png = cairo_image_surface_create_from_png (path);
  g_assert_cmpint (cairo_surface_status (png), ==, CAIRO_STATUS_SUCCESS);
  g_assert_cmpint (cairo_image_surface_get_width (png), ==, 640);
  for (int y = 0; y < 400; y++)
    for (int x = 0; x < 640; x++)
      {
        guint32 px = ((guint32 *) (void *) (cairo_image_surface_get_data (png)
                                            + y * cairo_image_surface_get_stride (png)))[x];
        guint r = (px >> 16) & 0xff, g = (px >> 8) & 0xff, b = px & 0xff;

        red += r > 140 && g < 90 && b < 90;
        dark += r < 60 && g < 60 && b < 60;
      }
  cairo_surface_destroy (png);
  /* A dashed target line across the plot, the curve and the axes. */
  g_assert_cmpuint (red, >, 200);
  g_assert_cmpuint (dark, >, 1000);
  if (g_getenv ("LAMINA_TEST_KEEP_PNG") == NULL)
    g_unlink (path);
}

int
main (int    argc,
      char **argv)
{
  int status;

  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/sheet/design/comparison-rows", test_rows);
  g_test_add_func ("/sheet/design/comparison-pdf", test_comparison_pdf);
  g_test_add_func ("/sheet/design/sheet-dynamic", test_sheet_dynamic);
  g_test_add_func ("/sheet/design/chart-png", test_chart_png);
  temp_dir = g_dir_make_tmp ("lamina-design-XXXXXX", NULL);
  status = g_test_run ();
  g_rmdir (temp_dir);
  g_free (temp_dir);
  return status;
}
