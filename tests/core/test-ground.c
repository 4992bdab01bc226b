/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Ground floors against EN ISO 13370:2017 (formulas and clause numbers from
 * memory of the standard; the figures are worked by hand beside each
 * assertion). */
#include "lamina-test-util.h"

/* 9.1, first branch (dt < B′): A 100 m², P 40 m → B′ = 100/(0.5·40) = 5 m;
 * w 0.3 m, λ 2.0, Rf 1.0 → dt = 0.3 + 2.0·(0.17 + 1.0 + 0.04) = 2.72 m;
 * U = 2·2/(5π + 2.72)·ln (5π/2.72 + 1) = 0.217062·1.913240 = 0.41529. */
static void
test_slab_thin_branch (void)
{
  assert_close (lamina_ground_slab_u (2.0, 5.0, 2.72), 0.41529, 1e-4);
}

/* 9.1, second branch (dt ≥ B′): Rf 3.0 → dt = 0.3 + 2·3.21 = 6.72 m;
 * U = 2/(0.457·5 + 6.72) = 2/9.005 = 0.22210. */
static void
test_slab_thick_branch (void)
{
  assert_close (lamina_ground_slab_u (2.0, 5.0, 6.72), 0.22210, 1e-4);
}

/* 9.1: the branches meet at dt = B′: 2 ln (π + 1)/(π + 1) = 0.68626 against
 * 1/1.457 = 0.68634, λ/B′ times each (0.012 % apart), whatever B′. */
static void
test_slab_continuity (void)
{
  const double sizes[] = { 0.5, 2, 5, 10, 20 };

  for (guint i = 0; i < G_N_ELEMENTS (sizes); i++)
    {
      double b = sizes[i];
      double below = lamina_ground_slab_u (1.5, b, b * (1 - 1e-12));
      double at = lamina_ground_slab_u (1.5, b, b);

      assert_close (below, 1.5 / b * 0.68626, 1e-4);
      assert_close (at, 1.5 / b * 0.68634, 1e-4);
      g_assert_cmpfloat (fabs (below - at) / at, <, 2e-4);
    }
}

/* Table 1: clay or silt 1.5, sand or gravel 2.0, homogeneous rock 3.5
 * W/(m·K); 2.0 when unknown (9.1 note, from memory). */
static void
test_soil_classes (void)
{
  g_assert_cmpfloat (lamina_ground_soil_conductivity (LAMINA_SOIL_CLAY_SILT), ==, 1.5);
  g_assert_cmpfloat (lamina_ground_soil_conductivity (LAMINA_SOIL_SAND_GRAVEL), ==, 2.0);
  g_assert_cmpfloat (lamina_ground_soil_conductivity (LAMINA_SOIL_ROCK), ==, 3.5);
  g_assert_cmpfloat (lamina_ground_soil_conductivity (LAMINA_SOIL_UNKNOWN), ==, 2.0);
}

/* Annex B: edge insulation 50 mm of λ 0.035 (Rn 1.4286), D 1 m, on the
 * floor of the first branch (dt 2.72, U0 0.41529): d′ = (Rn − 0.05/2)·2 =
 * 2.80714; ΔΨ = −2/π·[ln (1/2.72 + 1) − ln (1/5.52714 + 1)] = −0.093452;
 * U = 0.41529 + 2·(−0.093452)/5 = 0.37791.  Vertical insulation reaching
 * D = 0.5 m down acts as horizontal of 2D = 1 m (same ΔΨ). */
static void
test_edge_insulation (void)
{
  g_autoptr (LaminaConstruction) c = NULL;
  g_autoptr (LaminaResult) r = NULL;
  double psi = lamina_ground_edge_delta_psi (LAMINA_EDGE_HORIZONTAL, 2.0, 2.72, 1.0, 0.05, 0.05 / 0.035);

  assert_close (psi, -0.093452, 1e-4);
  assert_close (lamina_ground_edge_delta_psi (LAMINA_EDGE_VERTICAL, 2.0, 2.72, 0.5, 0.05, 0.05 / 0.035),
                psi, 1e-12);

  c = lamina_construction_new ("f", "slab", LAMINA_ELEMENT_FLOOR);
  lamina_construction_add_layer (c, lamina_layer_new_resistance (100, 1.0));
  c->has_ground = TRUE;
  c->ground.area = 100;
  c->ground.perimeter = 40;
  c->ground.wall_thickness = 300;
  c->ground.edge = LAMINA_EDGE_HORIZONTAL;
  c->ground.edge_size = 1.0;
  c->ground.edge_thickness = 50;
  c->ground.edge_resistance = 0.05 / 0.035;
  r = lamina_calculate (c, NULL);
  g_assert_nonnull (r);
  assert_close (r->ground.u_without_edge, 0.41529, 1e-4);
  assert_close (r->ground.u, 0.37791, 1e-4);
}

/* A whole floor through lamina_calculate: concrete 150 mm (λ 1.35, EN ISO
 * 10456 Table 3, from memory) and insulation 100 mm (λ 0.035, typical):
 * Rf = 0.11111 + 2.85714 = 2.96825; soil unknown → λ 2.0 and a warning;
 * dt = 0.3 + 2·(0.21 + 2.96825) = 6.65651 ≥ B′ 5 →
 * U = 2/(2.285 + 6.65651) = 0.22368.  Its own U (Rsi 0.17, Rse 0.04,
 * EN ISO 6946 Table 7) stays 1/3.17825 = 0.31464. */
static LaminaConstruction *
make_floor (void)
{
  LaminaConstruction *c = lamina_construction_new ("f", "slab", LAMINA_ELEMENT_FLOOR);

  lamina_construction_add_layer (c, test_layer (150, "concrete", LAMINA_CATEGORY_CONCRETE, 1.35));
  lamina_construction_add_layer (c, test_layer (100, "eps", LAMINA_CATEGORY_INSULATION, 0.035));
  c->has_ground = TRUE;
  c->ground.area = 100;
  c->ground.perimeter = 40;
  c->ground.wall_thickness = 300;
  return c;
}

static void
test_slab_construction (void)
{
  g_autoptr (LaminaConstruction) c = make_floor ();
  g_autoptr (LaminaResult) r = lamina_calculate (c, NULL);

  g_assert_nonnull (r);
  assert_close (r->u, 0.31464, 1e-4);
  g_assert_true (r->has_ground);
  assert_close (r->ground.b_prime, 5.0, 1e-12);
  assert_close (r->ground.dt, 6.65651, 1e-5);
  assert_close (r->ground.u, 0.22368, 1e-4);
  g_assert_true (r->ground.soil_assumed);
  g_assert_true (lamina_result_has_warning (r, LAMINA_WARNING_SOIL_ASSUMED));

  /* Clay (Table 1): λ 1.5, no assumption. */
  c->ground.soil = LAMINA_SOIL_CLAY_SILT;
  g_clear_pointer (&r, lamina_result_free);
  r = lamina_calculate (c, NULL);
  g_assert_false (r->ground.soil_assumed);
  g_assert_cmpfloat (r->ground.soil_conductivity, ==, 1.5);
  g_assert_false (lamina_result_has_warning (r, LAMINA_WARNING_SOIL_ASSUMED));
}

/* 9.3, suspended floor over the same plan, Rf 2.96825, h 0.5 m, Uw 1.5,
 * ε 0.003 m²/m, v 5 m/s, fw 0.05:
 * dg = 0.3 + 2·0.21 = 0.72 → Ug = 4/(5π + 0.72)·ln (5π/0.72 + 1) = 0.76150;
 * Ux = 2·0.5·1.5/5 + 1450·0.003·5·0.05/5 = 0.3 + 0.2175 = 0.5175;
 * Uf = 1/(2.96825 + 2·0.17) = 0.30230; U = 1/(1/Uf + 1/(Ug + Ux)) = 0.24451. */
static void
test_suspended (void)
{
  g_autoptr (LaminaConstruction) c = make_floor ();
  g_autoptr (LaminaResult) r = NULL;

  c->ground.kind = LAMINA_GROUND_SUSPENDED;
  c->ground.underfloor_height = 0.5;
  c->ground.underfloor_wall_u = 1.5;
  c->ground.vent_area = 0.003;
  c->ground.wind_speed = 5;
  c->ground.shielding_factor = 0.05;
  r = lamina_calculate (c, NULL);
  g_assert_nonnull (r);
  assert_close (r->ground.u_ground, 0.76150, 1e-4);
  assert_close (r->ground.u_exchange, 0.5175, 1e-9);
  assert_close (r->ground.u_floor, 0.30230, 1e-4);
  assert_close (r->ground.u, 0.24451, 1e-4);
}

/* 9.4, heated basement 2 m deep, walls Rw 2.0: dt 6.65651; floor with
 * dt + z/2 = 7.65651 ≥ B′: Ubf = 2/(2.285 + 7.65651) = 0.20118;
 * dw = 2·(0.13 + 2.0 + 0.04) = 4.34; Ubw = 4/(2π)·(1 + 0.5·6.656/8.656)·
 * ln (2/4.34 + 1) = 0.33405; U′ = (A Ubf + zP Ubw)/(A + zP) =
 * (100·0.20118 + 80·0.33405)/180 = 0.26024. */
static void
test_basement (void)
{
  g_autoptr (LaminaConstruction) c = make_floor ();
  g_autoptr (LaminaResult) r = NULL;

  c->ground.kind = LAMINA_GROUND_BASEMENT;
  c->ground.depth = 2.0;
  c->ground.basement_wall_resistance = 2.0;
  r = lamina_calculate (c, NULL);
  g_assert_nonnull (r);
  assert_close (r->ground.u, 0.20119, 1e-4);
  assert_close (r->ground.u_walls, 0.33405, 1e-4);
  assert_close (r->ground.u_basement, 0.26024, 1e-4);
}

/* The sheet's table of U against B′: U falls as the plan grows (common
 * practice: the edge matters less on a larger floor), and the row at the
 * plan's own B′ is the stated U. */
static void
test_table_by_b_prime (void)
{
  g_autoptr (LaminaConstruction) c = make_floor ();
  g_autoptr (LaminaResult) r = lamina_calculate (c, NULL);
  const double b[] = { 2, 4, 6, 8, 10, 15, 20 };
  LaminaGroundResult row, own;
  double previous = INFINITY;
  double rf = 1.0 / r->u - r->rsi - r->rse;

  for (guint i = 0; i < G_N_ELEMENTS (b); i++)
    {
      lamina_ground_calculate (&c->ground, rf, b[i], &row);
      g_assert_cmpfloat (row.b_prime, ==, b[i]);
      g_assert_cmpfloat (row.u, <, previous);
      previous = row.u;
    }
  lamina_ground_calculate (&c->ground, rf, 5.0, &own);
  assert_close (own.u, r->ground.u, 1e-12);
}

/* Bad input names the field. */
static void
test_refusals (void)
{
  g_autoptr (LaminaConstruction) c = make_floor ();
  g_autoptr (GError) error = NULL;

  c->ground.kind = LAMINA_GROUND_SUSPENDED;
  g_assert_null (lamina_calculate (c, &error));
  g_assert_nonnull (strstr (error->message, "underfloor height"));
  g_clear_error (&error);

  c->ground.kind = LAMINA_GROUND_SLAB;
  c->ground.perimeter = -1;
  g_assert_null (lamina_calculate (c, &error));
  g_assert_nonnull (strstr (error->message, "perimeter"));
  g_clear_error (&error);

  c->ground.perimeter = 40;
  c->element = LAMINA_ELEMENT_WALL;
  g_assert_null (lamina_calculate (c, &error));
  g_assert_nonnull (strstr (error->message, "ground"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/ground/slab-thin-branch", test_slab_thin_branch);
  g_test_add_func ("/core/ground/slab-thick-branch", test_slab_thick_branch);
  g_test_add_func ("/core/ground/slab-continuity", test_slab_continuity);
  g_test_add_func ("/core/ground/soil-classes", test_soil_classes);
  g_test_add_func ("/core/ground/edge-insulation", test_edge_insulation);
  g_test_add_func ("/core/ground/slab-construction", test_slab_construction);
  g_test_add_func ("/core/ground/suspended", test_suspended);
  g_test_add_func ("/core/ground/basement", test_basement);
  g_test_add_func ("/core/ground/table-by-b-prime", test_table_by_b_prime);
  g_test_add_func ("/core/ground/refusals", test_refusals);
  return g_test_run ();
}
