/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Solving a layer's thickness for a target U.  The homogeneous case has a
 * closed form from EN ISO 6946:2017 6.7.1 and 6.7.3 (resistances in series);
 * with fasteners the root of the F.3 formula is worked beside the test; in
 * every case the engine's own U at the solved thickness must equal the
 * target. */
#include "lamina-test-util.h"
#include "lamina-solve.h"

/* plasterboard 12.5 mm λ 0.25, mineral wool λ 0.035 (typical declared
 * value), concrete 200 mm λ 1.35 (EN ISO 10456 Table 3, from memory). */
static LaminaConstruction *
homogeneous_wall (void)
{
  LaminaConstruction *c = test_wall ();

  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, test_layer (100, "mineral-wool", LAMINA_CATEGORY_INSULATION, 0.035));
  lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 1.35));
  return c;
}

static double
engine_u (const LaminaConstruction *c)
{
  g_autoptr(LaminaResult) r = test_calculate (c);

  return r->u_corrected;
}

static void
solve_ok (const LaminaConstruction *c,
          guint                     layer,
          double                    target,
          LaminaSolve              *s)
{
  g_autoptr(GError) error = NULL;

  g_assert_true (lamina_solve_thickness (c, layer, target, s, &error));
  g_assert_no_error (error);
}

/* Closed form (6.7.1, 6.8 Table 7): RT = 1/0.15 = 6.666667; the rest is
 * Rsi 0.13 + 0.0125/0.25 + 0.2/1.35 + Rse 0.04 = 0.368148, so the wool needs
 * R = 6.298519 and d = 6.298519 · 0.035 = 0.2204481 m = 220.448 mm.  Snapped
 * up to the next 10 mm: 230 mm, U = 1/(0.368148 + 6.571429) = 0.144101. */
static void
test_homogeneous_closed_form (void)
{
  g_autoptr(LaminaConstruction) c = homogeneous_wall ();
  LaminaSolve s;

  solve_ok (c, 2, 0.15, &s);
  g_assert_cmpuint (s.layer, ==, 2);
  g_assert_cmpfloat_with_epsilon (s.thickness, (1 / 0.15 - (0.13 + 0.05 + 0.2 / 1.35 + 0.04)) * 35, 0.01);
  g_assert_cmpfloat_with_epsilon (s.thickness, 220.448, 0.01);
  g_assert_cmpfloat_with_epsilon (s.u, 0.15, 1e-8);
  g_assert_cmpfloat (s.thickness_snapped, ==, 230);
  g_assert_false (s.stock);
  assert_close (s.u_snapped, 1 / (0.368148148 + 0.23 / 0.035), 1e-8);
  assert_close (s.u_snapped, 0.144101, 1e-5);
  g_assert_cmpfloat (s.thickness_before, ==, 100);

  /* The engine's U at the solved thickness equals the target. */
  ((LaminaLayer *) c->layers->pdata[1])->thickness = s.thickness;
  g_assert_cmpfloat_with_epsilon (engine_u (c), 0.15, 1e-8);
}

/* Stock thicknesses: 220.448 mm snaps to the smallest listed size above it. */
static void
test_stock (void)
{
  g_autoptr(LaminaConstruction) c = homogeneous_wall ();
  LaminaLayer *wool = c->layers->pdata[1];
  const double stock[] = { 260, 100, 240, 200, 240 };
  LaminaSolve s;

  lamina_material_set_stock_thicknesses (wool->material, stock, G_N_ELEMENTS (stock));
  g_assert_cmpuint (wool->material->n_stock_thicknesses, ==, 4);
  solve_ok (c, 2, 0.15, &s);
  g_assert_cmpfloat (s.thickness_snapped, ==, 240);
  g_assert_true (s.stock);
  assert_close (s.u_snapped, 1 / (0.368148148 + 0.24 / 0.035), 1e-8);

  /* No stock size is thick enough: back to the next 10 mm. */
  solve_ok (c, 2, 0.12, &s);
  g_assert_cmpfloat (s.thickness, >, 260);
  g_assert_false (s.stock);
  g_assert_cmpfloat (s.thickness_snapped, ==, ceil (s.thickness / 10) * 10);
}

/* A stud wall: the bridged layer grows with its studs.  No closed form
 * (6.7.2 upper and lower limits): the engine at the solved depth is the
 * check, and U falls on either side of it. */
static void
test_bridged (void)
{
  g_autoptr(LaminaConstruction) c = test_wall ();
  LaminaLayer *framed = lamina_layer_new_bridged (145);
  LaminaMaterial *timber = test_material ("softwood", LAMINA_CATEGORY_TIMBER, 0.13);
  LaminaMaterial *wool = test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.037);
  const double studs[] = { 95, 145, 195, 220 }, batts[] = { 95, 145, 170, 195, 220, 245 };
  LaminaSolve s;
  double u_thinner, u_thicker;

  lamina_material_set_stock_thicknesses (timber, studs, G_N_ELEMENTS (studs));
  lamina_material_set_stock_thicknesses (wool, batts, G_N_ELEMENTS (batts));
  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_layer_add_part (framed, lamina_part_new (wool, NAN));
  lamina_layer_add_part (framed, lamina_part_new_framing (timber, 45, 600, "stud"));
  lamina_construction_add_layer (c, framed);
  lamina_construction_add_layer (c, test_layer (9, "osb", LAMINA_CATEGORY_BOARD, 0.13));

  solve_ok (c, 2, 0.25, &s);
  g_assert_cmpfloat_with_epsilon (s.u, 0.25, 1e-8);
  g_assert_true (lamina_solve_u_at (c, 2, s.thickness - 0.01, &u_thinner, NULL));
  g_assert_true (lamina_solve_u_at (c, 2, s.thickness + 0.01, &u_thicker, NULL));
  g_assert_cmpfloat (u_thinner, >, 0.25);
  g_assert_cmpfloat (u_thicker, <, 0.25);
  ((LaminaLayer *) c->layers->pdata[1])->thickness = s.thickness;
  g_assert_cmpfloat_with_epsilon (engine_u (c), 0.25, 1e-8);
  /* Both the studs and the batts must come in the snapped depth: 170 mm
   * batts have no 170 mm stud, so the next common size is taken. */
  g_assert_cmpfloat (s.thickness, >, 145);
  g_assert_cmpfloat (s.thickness, <, 170);
  g_assert_true (s.stock);
  g_assert_cmpfloat (s.thickness_snapped, ==, 195);
}

/* Warm deck roof (heat flow upward, Rsi 0.10, Rse 0.04; 6.8 Table 7):
 * concrete 200 mm λ 2.3 (EN ISO 10456 Table 3, from memory), PIR λ 0.022
 * (typical declared value) with 6 steel fasteners per m², λf 50, Af 12.57
 * mm², right through.  F.3: ΔUf = 0.8 λf Af nf / d0 · (R1/RT)².  With
 * a = 0.10 + 0.2/2.3 + 0.04 = 0.226957, U(d) = 1/(a + d/0.022) + 0.8 · 50 ·
 * 12.57e-6 · 6 / d · ((d/0.022)/(a + d/0.022))²; for the target 0.13 the
 * root of that formula (bisected by hand in a calculator) is d = 186.840 mm,
 * against 164.238 mm without fasteners (1/0.13 − a = 7.465351, · 0.022). */
static void
test_fasteners_included (void)
{
  g_autoptr(LaminaConstruction) c = lamina_construction_new ("r", "deck", LAMINA_ELEMENT_ROOF);
  LaminaLayer *pir = test_layer (160, "pir", LAMINA_CATEGORY_INSULATION, 0.022);
  const double a = 0.10 + 0.2 / 2.3 + 0.04;
  LaminaSolve s;
  double r1, rt;

  c->heat_flow = LAMINA_HEAT_FLOW_UPWARD;
  lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 2.3));
  lamina_construction_add_layer (c, pir);

  solve_ok (c, 2, 0.13, &s);
  g_assert_cmpfloat_with_epsilon (s.thickness, 164.238, 0.01);

  pir->corrections.has_fasteners = TRUE;
  pir->corrections.fastener_conductivity = 50;
  pir->corrections.fastener_cross_section = 12.57;
  pir->corrections.fasteners_per_square_metre = 6;
  solve_ok (c, 2, 0.13, &s);
  g_assert_cmpfloat_with_epsilon (s.thickness, 186.840, 0.01);
  r1 = s.thickness / 1000 / 0.022;
  rt = a + r1;
  g_assert_cmpfloat_with_epsilon (1 / rt + 0.8 * 50 * 12.57e-6 * 6 / (s.thickness / 1000) * pow (r1 / rt, 2),
                                  0.13, 1e-8);
  pir->thickness = s.thickness;
  g_assert_cmpfloat_with_epsilon (engine_u (c), 0.13, 1e-8);
  g_assert_cmpfloat (s.thickness_snapped, ==, 190);

  /* Recessed 120 mm: the layer may not get thinner than the fastener. */
  pir->corrections.fastener_penetration = 120;
  solve_ok (c, 2, 0.13, &s);
  g_assert_cmpfloat (s.thickness, >, 120);
  g_assert_cmpfloat_with_epsilon (s.u, 0.13, 1e-8);
}

static void
test_refusals (void)
{
  g_autoptr(LaminaConstruction) c = homogeneous_wall ();
  g_autoptr(GError) error = NULL;
  LaminaSolve s;

  /* 1 / (0.368 + 10/0.035) = 0.0035: 0.001 cannot be reached. */
  g_assert_false (lamina_solve_thickness (c, 2, 0.001, &s, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNREACHABLE);
  g_assert_nonnull (strstr (error->message, "10000 mm"));
  g_clear_error (&error);

  /* Met even with no wool: 1 / 0.368 = 2.7 < 3. */
  g_assert_false (lamina_solve_thickness (c, 2, 3.0, &s, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNREACHABLE);
  g_clear_error (&error);

  g_assert_false (lamina_solve_thickness (c, 4, 0.15, &s, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_false (lamina_solve_thickness (c, 0, 0.15, &s, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_false (lamina_solve_thickness (c, 2, -1, &s, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
  g_clear_error (&error);

  lamina_construction_add_layer (c, lamina_layer_new_air (50, LAMINA_AIR_UNVENTILATED));
  g_assert_false (lamina_solve_thickness (c, 4, 0.15, &s, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED);
}

/* The chart's curve falls monotonically through the solved point. */
static void
test_curve (void)
{
  g_autoptr(LaminaConstruction) c = homogeneous_wall ();
  double d[21], u[21];

  g_assert_true (lamina_solve_curve (c, 2, 0, 400, G_N_ELEMENTS (d), d, u, NULL));
  g_assert_cmpfloat (d[0], ==, 0.01);
  g_assert_cmpfloat (d[20], ==, 400);
  for (guint i = 1; i < G_N_ELEMENTS (d); i++)
    g_assert_cmpfloat (u[i], <, u[i - 1]);
  assert_close (u[20], 1 / (0.368148148 + 0.4 / 0.035), 1e-8);
}

static void
test_stock_string (void)
{
  g_autoptr(LaminaMaterial) m = test_material ("m", LAMINA_CATEGORY_INSULATION, 0.035);
  g_autoptr(LaminaMaterial) copy = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;

  g_assert_null (lamina_material_dup_stock_string (m));
  g_assert_true (lamina_material_parse_stock_string (m, " 200 ,100 12.5 100", &error));
  text = lamina_material_dup_stock_string (m);
  g_assert_cmpstr (text, ==, "12.5 100 200");
  copy = lamina_material_copy (m);
  g_assert_true (lamina_material_equal (m, copy));
  lamina_material_set_stock_thicknesses (copy, NULL, 0);
  g_assert_false (lamina_material_equal (m, copy));
  g_assert_false (lamina_material_parse_stock_string (m, "100 abc", &error));
  g_assert_nonnull (strstr (error->message, "abc"));
  g_assert_cmpuint (m->n_stock_thicknesses, ==, 3);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/solve/homogeneous-closed-form", test_homogeneous_closed_form);
  g_test_add_func ("/core/solve/stock", test_stock);
  g_test_add_func ("/core/solve/bridged", test_bridged);
  g_test_add_func ("/core/solve/fasteners-included", test_fasteners_included);
  g_test_add_func ("/core/solve/refusals", test_refusals);
  g_test_add_func ("/core/solve/curve", test_curve);
  g_test_add_func ("/core/solve/stock-string", test_stock_string);
  return g_test_run ();
}
