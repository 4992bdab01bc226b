/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The remaining cases of EN ISO 6946:2017: unheated spaces (6.10), surface
 * resistances for other conditions (Annex C) and air spaces by the
 * temperature profile, small spaces and air parts (Annex D).  Table values
 * and coefficients from memory of the standard. */
#include "lamina-test-util.h"

/* 6.10.2, Table 9 (2007: Table 3): Ru of roof spaces, m²·K/W. */
static void
test_roof_space_table (void)
{
  g_assert_cmpfloat (lamina_roof_space_resistance (LAMINA_ROOF_TILES_BARE), ==, 0.06);
  g_assert_cmpfloat (lamina_roof_space_resistance (LAMINA_ROOF_TILES_FELT), ==, 0.2);
  g_assert_cmpfloat (lamina_roof_space_resistance (LAMINA_ROOF_LOW_EMISSIVITY), ==, 0.3);
  g_assert_cmpfloat (lamina_roof_space_resistance (LAMINA_ROOF_BOARDS_FELT), ==, 0.3);
}

/* 6.10.3: Ru = Ai/(Σ Ae Ue + 0.33 n V): a garage with 50 m² against the
 * house, 60 m² of U 1.5 to outside, 3 air changes an hour, 100 m³:
 * Ru = 50/(90 + 99) = 0.26455. */
static void
test_other_unheated_space (void)
{
  assert_close (lamina_unheated_space_resistance (50, 60, 1.5, 3, 100), 0.26455, 1e-4);
}

/* A ceiling under a cold loft (plasterboard 12.5 mm λ 0.21, EN ISO 10456
 * Table 3; mineral wool 200 mm λ 0.040, typical) under a tiled roof on felt:
 * RT = 0.10 + 0.05952 + 5.0 + 0.2 + 0.04 = 5.39952 → U = 0.18520. */
static void
test_ceiling_under_loft (void)
{
  g_autoptr (LaminaConstruction) c = lamina_construction_new ("c", "ceiling", LAMINA_ELEMENT_CEILING);
  g_autoptr (LaminaResult) r = NULL;

  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.21));
  lamina_construction_add_layer (c, test_layer (200, "wool", LAMINA_CATEGORY_INSULATION, 0.040));
  c->unheated.kind = LAMINA_UNHEATED_ROOF_SPACE;
  c->unheated.roof = LAMINA_ROOF_TILES_FELT;
  r = lamina_calculate (c, NULL);
  g_assert_nonnull (r);
  assert_close (r->r_unheated, 0.2, 1e-12);
  assert_close (r->r_total, 5.39952, 1e-5);
  assert_close (r->u, 0.18520, 1e-4);
  /* The loft side of the insulation sits at the temperature beyond Ru:
   * θ = 20 − 30·(5.39952 − 0.24)/5.39952 = −8.667 °C. */
  assert_close (r->layers[1].temperature_outer, -8.667, 1e-3);
  g_assert_true (lamina_result_has_warning (r, LAMINA_WARNING_UNHEATED_SPACE));
}

/* Annex C at the standard conditions (v 4 m/s, ε 0.9) reproduces Table 7
 * for each direction of heat flow, when a construction states them. */
static void
test_annex_c_reproduces_table (void)
{
  const LaminaElement elements[] = { LAMINA_ELEMENT_ROOF, LAMINA_ELEMENT_WALL, LAMINA_ELEMENT_FLOOR };
  const double rsi[] = { 0.10, 0.13, 0.17 };

  for (guint i = 0; i < G_N_ELEMENTS (elements); i++)
    {
      g_autoptr (LaminaConstruction) c = lamina_construction_new ("x", "x", elements[i]);
      double si, se;

      c->surfaces.wind_speed = 4.0;
      c->surfaces.emissivity_inside = 0.9;
      c->surfaces.emissivity_outside = 0.9;
      lamina_surface_resistances (c, &si, &se);
      g_assert_cmpfloat_with_epsilon (round (si * 100) / 100, rsi[i], 1e-9);
      g_assert_cmpfloat_with_epsilon (round (se * 100) / 100, 0.04, 1e-9);
    }
}

/* Annex C away from the standard: a low-emissivity inner face (ε 0.05)
 * on a wall: Rsi = 1/(2.5 + 0.05·5.7098) = 0.35898; wind 10 m/s:
 * Rse = 1/(44 + 0.9·4.6216) = 0.020764. */
static void
test_annex_c_conditions (void)
{
  g_autoptr (LaminaConstruction) c = test_wall ();
  g_autoptr (LaminaResult) r = NULL;

  lamina_construction_add_layer (c, test_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 2.0));
  c->surfaces.emissivity_inside = 0.05;
  c->surfaces.wind_speed = 10;
  r = lamina_calculate (c, NULL);
  assert_close (r->rsi, 0.35898, 1e-4);
  assert_close (r->rse, 0.020764, 1e-4);
  assert_close (r->r_total, 0.35898 + 0.1 + 0.020764, 1e-4);
}

/* Annex D with ΔT from the profile: a cavity wall of two brick leaves
 * (100 mm, λ 0.77, typical EN 1745 value) round a 50 mm cavity, 20 °C
 * inside and −10 °C outside.  With Table 8 the cavity has R 0.18 and
 * ΔT = 30·0.18/0.61 ≈ 8.8 K, above 5 K; ha = 0.73 ΔT^⅓ > 1.25 then, so R
 * must fall against the ΔT ≤ 5 K value, and the iteration must settle where
 * R agrees with its own ΔT. */
static void
test_annex_d_profile (void)
{
  g_autoptr (LaminaConstruction) c = test_wall ();
  g_autoptr (LaminaResult) plain = NULL;
  g_autoptr (LaminaResult) r = NULL;
  double dt, tm;

  lamina_construction_add_layer (c, test_layer (100, "brick", LAMINA_CATEGORY_MASONRY, 0.77));
  lamina_construction_add_layer (c, lamina_layer_new_air (50, LAMINA_AIR_UNVENTILATED));
  lamina_construction_add_layer (c, test_layer (100, "brick", LAMINA_CATEGORY_MASONRY, 0.77));
  plain = lamina_calculate (c, NULL);
  c->surfaces.air_from_profile = TRUE;
  r = lamina_calculate (c, NULL);
  g_assert_nonnull (r);

  dt = r->layers[1].temperature_inner - r->layers[1].temperature_outer;
  tm = (r->layers[1].temperature_inner + r->layers[1].temperature_outer) / 2;
  g_assert_cmpfloat (dt, >, 5.0);
  g_assert_cmpuint (r->air_iterations, >, 1);
  g_assert_cmpuint (r->air_iterations, <, 50);
  /* Converged: R is the Annex D value at its own ΔT and Tm. */
  assert_close (r->layers[1].resistance,
                lamina_air_space_resistance (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, NAN, dt, tm), 1e-6);
  /* The right way: at the same mean temperature, ΔT above 5 K means more
   * convection and less R than the ΔT ≤ 5 K coefficients give.  (The cavity
   * is colder than Table 8's 10 °C, which by itself raises R a little:
   * hr0 falls with T³.) */
  g_assert_cmpfloat (r->layers[1].resistance, <,
                     lamina_air_space_resistance (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, NAN, NAN, tm));
  g_assert_cmpfloat (tm, <, 10.0);
  g_assert_cmpfloat (plain->layers[1].resistance, ==, 0.18);
  /* Across a small ΔT the ΔT ≤ 5 K coefficients stay (D.2). */
  assert_close (lamina_air_space_resistance (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, NAN, 3.0, 10.0),
                lamina_air_layer_resistance_formula (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9), 1e-12);
}

/* D.3: a small space (b < 10 d) radiates less across: hr0/(1/ε1 + 1/ε2 − 2
 * + 2/(1 + √(1 + d²/b²) − d/b)).  For b = d the last term is 2/√2 = 1.414
 * instead of 1, so R grows; for a very wide space it meets the plain
 * formula. */
static void
test_small_space (void)
{
  double wide = lamina_air_layer_resistance_formula (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9);
  double huge = lamina_air_space_resistance (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, 499.0 * 1000, NAN, 10);
  double square = lamina_air_space_resistance (50, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, 50, NAN, 10);
  double hr0 = lamina_radiative_coefficient (10);
  double hr = hr0 / (1 / 0.9 + 1 / 0.9 - 2 + 2 / sqrt (2.0));
  double r;

  assert_close (huge, wide, 1e-6);
  assert_close (square, 1.0 / (1.25 + hr), 1e-9);
  g_assert_cmpfloat (square, >, wide);
  /* A layer with a width at or above 10 d stays with Table 8. */
  g_assert_true (lamina_air_layer_resistance_sized (50, 500, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, &r, NULL));
  g_assert_cmpfloat (r, ==, 0.18);
  g_assert_true (lamina_air_layer_resistance_sized (50, 100, LAMINA_HEAT_FLOW_HORIZONTAL, 0.9, 0.9, &r, NULL));
  g_assert_cmpfloat (r, >, wide);
}

/* Air parts with their own faces: a foil-faced cavity between battens
 * (ε 0.05 on one face) resists more than a plain one; slightly
 * ventilated, it counts half (6.9.3, from memory). */
static void
test_air_parts (void)
{
  g_autoptr (LaminaConstruction) c = test_wall ();
  g_autoptr (LaminaResult) plain = NULL;
  g_autoptr (LaminaResult) foil = NULL;
  g_autoptr (LaminaResult) vented = NULL;
  LaminaLayer *bridged = lamina_layer_new_bridged (25);
  LaminaPart *air = lamina_part_new (NULL, NAN);
  double e;

  lamina_layer_add_part (bridged, lamina_part_new (test_material ("batten", LAMINA_CATEGORY_TIMBER, 0.13), 0.1));
  lamina_layer_add_part (bridged, air);
  lamina_construction_add_layer (c, test_layer (100, "wool", LAMINA_CATEGORY_INSULATION, 0.035));
  lamina_construction_add_layer (c, bridged);
  lamina_construction_add_layer (c, test_layer (12.5, "board", LAMINA_CATEGORY_BOARD, 0.21));
  plain = lamina_calculate (c, NULL);
  air->emissivity_outer = 0.05;
  foil = lamina_calculate (c, NULL);
  g_assert_cmpfloat (foil->layers[1].resistance, >, plain->layers[1].resistance);
  /* Plain part: Table 8 at 25 mm, 0.18; the layer 1/(0.1/0.19231 + 0.9/0.18). */
  e = 1.0 / (0.1 / (0.025 / 0.13) + 0.9 / 0.18);
  assert_close (plain->layers[1].resistance, e, 1e-9);
  air->emissivity_outer = 0.9;
  air->air = LAMINA_AIR_SLIGHTLY_VENTILATED;
  vented = lamina_calculate (c, NULL);
  assert_close (vented->layers[1].resistance, 1.0 / (0.1 / (0.025 / 0.13) + 0.9 / 0.09), 1e-9);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/method/roof-space-table", test_roof_space_table);
  g_test_add_func ("/core/method/other-unheated-space", test_other_unheated_space);
  g_test_add_func ("/core/method/ceiling-under-loft", test_ceiling_under_loft);
  g_test_add_func ("/core/method/annex-c-reproduces-table-7", test_annex_c_reproduces_table);
  g_test_add_func ("/core/method/annex-c-conditions", test_annex_c_conditions);
  g_test_add_func ("/core/method/annex-d-profile", test_annex_d_profile);
  g_test_add_func ("/core/method/small-space", test_small_space);
  g_test_add_func ("/core/method/air-parts", test_air_parts);
  return g_test_run ();
}
