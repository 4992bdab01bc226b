/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tapered layers, EN ISO 6946:2017 Annex E (formulas from memory).  Each
 * closed form is checked against a numerical integration of 1/R over the
 * plan, done here on a grid of cells. */
#include "lamina-test-util.h"

#define GRID 1500

/* The plan is the unit square (rectangle) or the triangle with its base on
 * y = 0 and its apex at (0.5, 1).  R runs linearly in y, from R0 at y = 0 to
 * R0 + R1 at y = 1 (apex thickest), or from R0 at the apex (y = 1) to
 * R0 + R1 at the base (apex thinnest).  The mean of 1/R over the cells whose
 * centre lies inside the plan. */
static double
integrate_plan (LaminaTaper shape,
                double      r0,
                double      r1)
{
  double sum = 0.0;
  guint64 cells = 0;

  for (guint j = 0; j < GRID; j++)
    {
      double y = (j + 0.5) / GRID;
      double r = shape == LAMINA_TAPER_APEX_THIN ? r0 + r1 * (1.0 - y) : r0 + r1 * y;

      for (guint i = 0; i < GRID; i++)
        {
          double x = (i + 0.5) / GRID;

          if (shape != LAMINA_TAPER_RECTANGLE && fabs (x - 0.5) > 0.5 * (1.0 - y))
            continue;
          sum += 1.0 / r;
          cells++;
        }
    }
  return sum / (double) cells;
}

static void
test_shapes_against_integration (void)
{
  const LaminaTaper shapes[] = { LAMINA_TAPER_RECTANGLE, LAMINA_TAPER_APEX_THICK, LAMINA_TAPER_APEX_THIN };
  const double r0[] = { 0.5, 1.2, 3.0 };
  const double r1[] = { 0.4, 4.0, 6.0 };

  for (guint s = 0; s < G_N_ELEMENTS (shapes); s++)
    for (guint k = 0; k < G_N_ELEMENTS (r0); k++)
      assert_close (lamina_tapered_u (shapes[s], r0[k], r1[k]), integrate_plan (shapes[s], r0[k], r1[k]), 2e-3);
}

/* E.2 by hand: R0 1.0, R1 4.0: U = ln 5 / 4 = 0.40236 (rectangle);
 * apex thick: 2/4·(1.25·ln 5 − 1) = 0.50589; apex thin: 2/4·(1 − 0.25·ln 5)
 * = 0.29882.  The thick apex concentrates the area at the thin edge. */
static void
test_hand_values (void)
{
  assert_close (lamina_tapered_u (LAMINA_TAPER_RECTANGLE, 1.0, 4.0), 0.40236, 1e-4);
  assert_close (lamina_tapered_u (LAMINA_TAPER_APEX_THICK, 1.0, 4.0), 0.50589, 1e-4);
  assert_close (lamina_tapered_u (LAMINA_TAPER_APEX_THIN, 1.0, 4.0), 0.29882, 1e-4);
}

/* A wedge that vanishes gives 1/R0 (common practice: a flat layer). */
static void
test_vanishing_wedge (void)
{
  assert_close (lamina_tapered_u (LAMINA_TAPER_RECTANGLE, 2.0, 1e-9), 0.5, 1e-8);
  assert_close (lamina_tapered_u (LAMINA_TAPER_APEX_THICK, 2.0, 1e-6), 0.5, 1e-6);
  assert_close (lamina_tapered_u (LAMINA_TAPER_APEX_THIN, 2.0, 1e-4), 1.0 / (2.0 + 2.0 / 3.0 * 1e-4), 1e-7);
}

/* E.4: areas combine by area: 30 m² rectangle (0.40236) and 10 m² thin
 * apex (0.29882): (30·0.40236 + 10·0.29882)/40 = 0.37648. */
static void
test_combined (void)
{
  const LaminaTaperArea areas[] = {
    { LAMINA_TAPER_RECTANGLE, 30, 1.0, 4.0 },
    { LAMINA_TAPER_APEX_THIN, 10, 1.0, 4.0 },
  };

  assert_close (lamina_tapered_u_combined (areas, G_N_ELEMENTS (areas)), 0.37648, 1e-4);
}

/* A flat roof: concrete 200 mm (λ 2.3, reinforced 1 %, EN ISO 10456 Table
 * 3, from memory), tapered PIR λ 0.022 from 100 to 200 mm, membrane as
 * declared R 0.01.  R0 = 0.10 + 0.08696 + 4.54545 + 0.01 + 0.04 = 4.78241
 * (Table 7, upward); R1 = 0.1/0.022 = 4.54545; rectangle: U = ln (1 +
 * R1/R0)/R1 = 0.14697; between 1/R0 = 0.20910 and 1/(R0 + R1) = 0.10721. */
static void
test_roof (void)
{
  g_autoptr (LaminaConstruction) c = lamina_construction_new ("r", "roof", LAMINA_ELEMENT_ROOF);
  g_autoptr (LaminaResult) r = NULL;
  g_autoptr (GError) error = NULL;
  LaminaLayer *wedge = test_layer (100, "pir", LAMINA_CATEGORY_INSULATION, 0.022);

  wedge->taper = LAMINA_TAPER_RECTANGLE;
  wedge->thickness_max = 200;
  lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 2.3));
  lamina_construction_add_layer (c, wedge);
  lamina_construction_add_layer (c, lamina_layer_new_resistance (5, 0.01));
  r = lamina_calculate (c, &error);
  g_assert_no_error (error);
  g_assert_true (r->tapered);
  g_assert_cmpuint (r->tapered_layer, ==, 2);
  assert_close (r->tapered_r0, 4.78241, 1e-5);
  assert_close (r->tapered_r1, 4.54545, 1e-5);
  assert_close (r->u, 0.14697, 1e-4);
  assert_close (r->u_thin_end, 0.20910, 1e-4);
  assert_close (r->u_thick_end, 0.10721, 1e-4);
  g_assert_true (lamina_result_has_warning (r, LAMINA_WARNING_TAPERED));

  /* Refusals: the thick end must be thicker, one tapered layer only. */
  wedge->thickness_max = 100;
  g_assert_null (lamina_calculate (c, &error));
  g_assert_nonnull (strstr (error->message, "maximum thickness"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/tapered/against-integration", test_shapes_against_integration);
  g_test_add_func ("/core/tapered/hand-values", test_hand_values);
  g_test_add_func ("/core/tapered/vanishing-wedge", test_vanishing_wedge);
  g_test_add_func ("/core/tapered/combined", test_combined);
  g_test_add_func ("/core/tapered/roof", test_roof);
  return g_test_run ();
}
