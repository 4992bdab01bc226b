/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Surface and interstitial condensation by EN ISO 13788:2012.  The standard
 * was not to hand: the formulas, coefficients and clause numbers below are
 * from memory, and each expected figure is worked by hand in the comment
 * beside it. */
#include "lamina-test-util.h"
#include "lamina-moisture.h"

static LaminaLayer *
vapour_layer (double          thickness,
              const char     *id,
              LaminaCategory  category,
              double          conductivity,
              double          mu)
{
  LaminaLayer *layer = test_layer (thickness, id, category, conductivity);

  layer->material->vapour_resistance_factor = mu;
  return layer;
}

/* plasterboard 12.5 mm (λ 0.25, μ 10), mineral wool 150 mm (λ 0.040, μ 1),
 * OSB 15 mm (λ 0.13, μ 30): EN ISO 10456 Table 3 values from memory, the
 * wool a typical declared value.  θi 20 °C, φi 0.5. */
static LaminaConstruction *
timber_wall (void)
{
  LaminaConstruction *c = test_wall ();

  lamina_construction_add_layer (c, vapour_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25, 10));
  lamina_construction_add_layer (c, vapour_layer (150, "mineral-wool", LAMINA_CATEGORY_INSULATION, 0.040, 1));
  lamina_construction_add_layer (c, vapour_layer (15, "osb", LAMINA_CATEGORY_BOARD, 0.13, 30));
  lamina_construction_set_moisture (c, lamina_moisture_settings_new ("site"));
  c->moisture->inside_humidity = 0.5;
  return c;
}

/* An invented cool temperate climate (test data only): cold damp winters,
 * mild summers. */
static LaminaClimate *
temperate_climate (void)
{
  static const double t[LAMINA_MONTHS] = { -1, 0, 3, 7, 12, 15, 17, 17, 13, 9, 4, 1 };
  static const double h[LAMINA_MONTHS] = { .88, .85, .80, .75, .72, .74, .75, .77, .80, .84, .87, .89 };
  LaminaClimate *climate = lamina_climate_new ("site", "temperate");

  memcpy (climate->temperature, t, sizeof t);
  memcpy (climate->humidity, h, sizeof h);
  return climate;
}

static LaminaMoistureResult *
moisture_ok (const LaminaConstruction *c,
             const LaminaClimate      *climate)
{
  g_autoptr(GError) error = NULL;
  LaminaMoistureResult *r = lamina_moisture_calculate (c, climate, NAN, &error);

  g_assert_no_error (error);
  g_assert_nonnull (r);
  return r;
}

/* Annex E (E.1 over water, E.2 over ice), from memory; the published
 * coefficients give 401.2 Pa at −5 °C, 610.5 Pa at 0 °C and 2337 Pa at
 * 20 °C (within 0.5 % of the IAPWS formulation, general reference tables). */
static void
test_saturation (void)
{
  /* 610.5·exp (21.875·−5 / 260.5) = 610.5·exp (−0.419866) = 401.18 */
  assert_close (lamina_saturation_pressure (-5.0), 401.18, 1e-4);
  g_assert_cmpfloat (lamina_saturation_pressure (0.0), ==, 610.5);
  /* 610.5·exp (17.269·20 / 257.3) = 610.5·exp (1.342324) = 2336.95 */
  assert_close (lamina_saturation_pressure (20.0), 2336.95, 1e-5);
  /* the inverse returns the temperature on either branch */
  assert_close (lamina_saturation_temperature (2336.95), 20.0, 1e-5);
  assert_close (lamina_saturation_temperature (401.18), -5.0, 1e-4);
}

/* Annex A, from memory: Δp at θe ≤ 0 °C is 270/540/810/1080/1350 Pa for
 * classes 1–5, falling linearly to 0 at 20 °C. */
static void
test_humidity_class (void)
{
  g_assert_cmpfloat (lamina_humidity_class_excess (3, -5.0), ==, 810.0);
  g_assert_cmpfloat (lamina_humidity_class_excess (5, 0.0), ==, 1350.0);
  /* class 3 at 10 °C: 810·(1 − 10/20) = 405 */
  assert_close (lamina_humidity_class_excess (3, 10.0), 405.0, 1e-12);
  /* class 1 at 5 °C: 270·0.75 = 202.5 */
  assert_close (lamina_humidity_class_excess (1, 5.0), 202.5, 1e-12);
  g_assert_cmpfloat (lamina_humidity_class_excess (4, 20.0), ==, 0.0);
  g_assert_cmpfloat (lamina_humidity_class_excess (2, 25.0), ==, 0.0);
}

/* pi = pe + 1.10·Δp (Annex A): class 4, θe −5 °C, φe 0.8:
 * pe = 0.8·401.18 = 320.94, pi = 320.94 + 1.1·1080 = 1508.94. */
static void
test_class_pressure (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = test_constant_climate (-5, 0.8);
  g_autoptr(LaminaMoistureResult) r = NULL;

  c->moisture->inside_humidity = NAN;
  c->moisture->humidity_class = 4;
  r = moisture_ok (c, climate);
  assert_close (r->outside_pressure[0], 320.94, 1e-4);
  assert_close (r->inside_pressure[0], 1508.94, 1e-5);
}

/* One plane, one month, by hand (clause 7, tangent construction).
 * RT = 0.13 + 0.05 + 3.75 + 0.115385 + 0.04 = 4.085385 (Rsi/Rse by EN ISO
 * 6946 Table 7); θ at the wool/OSB plane = 20 − 25·3.93/4.085385 = −4.0491 °C,
 * psat there (E.2) = 435.07 Pa.  pi = 0.5·2336.95 = 1168.48, pe = 0.8·401.18
 * = 320.94.  sd: 0.125 / 0.15 / 0.45 m, so the plane is at s = 0.275 of 0.725
 * and the straight line there would be 1168.48 − 847.53·0.275/0.725 = 847 Pa
 * > 435: condensation.  gc = δ0·[(1168.48 − 435.07)/0.275 − (435.07 −
 * 320.94)/0.45] = 2e-10·(2666.94 − 253.62) = 4.8266e-7 kg/(m²·s); in 31 days
 * of January 4.8266e-7·2 678 400 = 1.2928 kg/m².  Every month condenses, so
 * the cycle starts in January (7.3, reading of the product). */
static void
test_single_plane_month (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = test_constant_climate (-5, 0.8);
  g_autoptr(LaminaMoistureResult) r = moisture_ok (c, climate);

  g_assert_cmpuint (r->n_points, ==, 4);
  assert_close (r->months[0].temperature[2], -4.0491, 1e-4);
  assert_close (r->months[0].saturation[2], 435.07, 1e-4);
  g_assert_true (r->condensation);
  g_assert_cmpint (r->start_month, ==, 1);
  assert_close (r->months[0].accumulation[2], 1.2928, 1e-4);
  g_assert_cmpfloat (r->months[0].accumulation[1], ==, 0.0);
  assert_close (r->accumulation[0], 1.2928, 1e-4);
  /* the line is pinned at psat at the plane */
  assert_close (r->months[0].pressure[2], 435.07, 1e-4);
  /* February adds 28 days at the same rate: 1.2928 + 4.8266e-7·2 419 200 = 2.4604 */
  assert_close (r->accumulation[1], 2.4604, 1e-4);
  /* never dries: December holds the most, and the check fails */
  g_assert_false (r->dries_out);
  g_assert_cmpint (r->max_month, ==, 12);
  g_assert_true (lamina_moisture_result_fails (r));
  g_assert_true (lamina_moisture_result_has_warning (r, LAMINA_MOISTURE_WARNING_NOT_DRYING));
  g_assert_true (lamina_moisture_result_has_warning (r, LAMINA_MOISTURE_WARNING_OVER_LIMIT));
  g_assert_true (lamina_moisture_result_has_warning (r, LAMINA_MOISTURE_WARNING_METHOD));
}

/* Clause 5 by hand: U* = 1/(4.085385 − 0.13 + 0.25) = 0.237790, fRsi =
 * 1 − 0.25·0.237790 = 0.940552.  pi/0.8 = 1460.59 Pa: θsi,min = 237.3·x /
 * (17.269 − x), x = ln (1460.59/610.5) = 0.87232, = 12.6246 °C;
 * fRsi,min = (12.6246 + 5)/25 = 0.70498: passes. */
static void
test_surface (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = test_constant_climate (-5, 0.8);
  g_autoptr(LaminaMoistureResult) r = NULL;

  climate->temperature[6] = 25;   /* a month warmer than inside cannot be critical */
  r = moisture_ok (c, climate);
  assert_close (r->u_star, 0.237790, 1e-5);
  assert_close (r->f_rsi, 0.940552, 1e-6);
  assert_close (r->f_rsi_min, 0.70498, 1e-4);
  g_assert_true (isnan (r->f_rsi_min_month[6]));
  g_assert_cmpint (r->critical_month, ==, 1);
  g_assert_true (r->surface_passes);
}

/* A poorly insulated wall in a very humid room fails the surface check:
 * 200 mm concrete (λ 2.0, μ 80) alone, RT = 0.13 + 0.1 + 0.04 = 0.27,
 * U* = 1/0.39 = 2.5641, fRsi = 0.35897; class 5 at θe 0 °C, φe 0.9:
 * pe = 549.45, pi = 549.45 + 1485 = 2034.45, pi/0.8 = 2543.06 Pa,
 * x = ln (2543.06/610.5) = 1.42693, θsi,min = 237.3·x/(17.269 − x) =
 * 21.3728 °C > θi: fRsi,min = 1.06864. */
static void
test_surface_fails (void)
{
  g_autoptr(LaminaConstruction) c = test_wall ();
  g_autoptr(LaminaClimate) climate = test_constant_climate (0, 0.9);
  g_autoptr(LaminaMoistureResult) r = NULL;

  lamina_construction_add_layer (c, vapour_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 2.0, 80));
  lamina_construction_set_moisture (c, lamina_moisture_settings_new ("site"));
  c->moisture->humidity_class = 5;
  r = moisture_ok (c, climate);
  assert_close (r->f_rsi, 0.358974, 1e-5);
  assert_close (r->f_rsi_min, 1.06864, 1e-5);
  g_assert_false (r->surface_passes);
  g_assert_true (lamina_moisture_result_fails (r));
  g_assert_true (lamina_moisture_result_has_warning (r, LAMINA_MOISTURE_WARNING_SURFACE));
}

/* Invariant (clause 7): with pi ≤ pe and heat flowing outwards the vapour
 * line lies below psat everywhere, so nothing condenses, whatever the
 * build-up. */
static void
test_no_condensation_when_dry_inside (void)
{
  g_autoptr(LaminaClimate) climate = temperate_climate ();
  g_autoptr(GRand) rand = g_rand_new_with_seed (13788);

  for (int k = 0; k < 200; k++)
    {
      g_autoptr(LaminaConstruction) c = test_wall ();
      g_autoptr(LaminaMoistureResult) r = NULL;
      int n = g_rand_int_range (rand, 1, 7);

      for (int i = 0; i < n; i++)
        lamina_construction_add_layer (c, vapour_layer (g_rand_double_range (rand, 1, 200), "m",
                                                        LAMINA_CATEGORY_OTHER,
                                                        g_rand_double_range (rand, 0.02, 2.0),
                                                        g_rand_double_range (rand, 1, 50000)));
      lamina_construction_set_moisture (c, lamina_moisture_settings_new ("site"));
      /* φi·psat(20 °C) ≤ the lowest pe of the year (φe 0.88 at −1 °C:
       * 0.88·567.7 = 499.6 Pa): φi = 0.2 gives 467 Pa. */
      c->moisture->inside_humidity = 0.2;
      r = moisture_ok (c, climate);
      for (int m = 0; m < LAMINA_MONTHS; m++)
        g_assert_cmpfloat (r->inside_pressure[m], <=, r->outside_pressure[m]);
      g_assert_false (r->condensation);
      g_assert_cmpfloat (r->max_accumulation, ==, 0.0);
      g_assert_true (r->dries_out);
    }
}

/* Invariant (clause 7): more sd on the inside (a vapour control layer of
 * growing sd at the warm side) never adds condensation in any month. */
static void
test_more_sd_inside (void)
{
  g_autoptr(LaminaClimate) climate = temperate_climate ();
  double previous[LAMINA_MONTHS];
  double previous_max = G_MAXDOUBLE;
  static const double sds[] = { 0.01, 0.1, 0.5, 1, 2, 5, 10, 20, 50, 100 };

  for (int m = 0; m < LAMINA_MONTHS; m++)
    previous[m] = G_MAXDOUBLE;
  for (guint k = 0; k < G_N_ELEMENTS (sds); k++)
    {
      g_autoptr(LaminaConstruction) c = timber_wall ();
      g_autoptr(LaminaMoistureResult) r = NULL;
      LaminaLayer *vcl = vapour_layer (0.2, "foil", LAMINA_CATEGORY_MEMBRANE, 0.4, NAN);

      vcl->sd = sds[k];
      g_ptr_array_insert (c->layers, 1, vcl);
      c->moisture->inside_humidity = NAN;
      c->moisture->humidity_class = 4;
      r = moisture_ok (c, climate);
      if (k == 0)
        g_assert_true (r->condensation);   /* the check below is not empty */
      for (int m = 0; m < LAMINA_MONTHS; m++)
        {
          g_assert_cmpfloat (r->accumulation[m], <=, previous[m] + 1e-12);
          previous[m] = r->accumulation[m];
        }
      g_assert_cmpfloat (r->max_accumulation, <=, previous_max + 1e-12);
      previous_max = r->max_accumulation;
      if (k + 1 == G_N_ELEMENTS (sds))
        g_assert_false (r->condensation);   /* sd 100 m stops it */
    }
}

/* Clause 7.3: the cycle starts in the first month with condensation after
 * one without, each tested from dry.  Here only November to February are
 * cold enough; the year starts in November and the moisture accumulates to
 * February, then dries by the end of the year (October holds nothing). */
static void
test_start_month (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = test_constant_climate (15, 0.7);
  g_autoptr(LaminaMoistureResult) r = NULL;
  static const int cold[] = { 0, 1, 10, 11 };

  for (guint k = 0; k < G_N_ELEMENTS (cold); k++)
    {
      climate->temperature[cold[k]] = -5;
      climate->humidity[cold[k]] = 0.8;
    }
  r = moisture_ok (c, climate);
  g_assert_true (r->condensation);
  g_assert_cmpint (r->start_month, ==, 11);
  g_assert_cmpint (r->max_month, ==, 2);
  g_assert_cmpfloat (r->accumulation[10], <, r->accumulation[11]);
  g_assert_cmpfloat (r->accumulation[11], <, r->accumulation[0]);
  g_assert_cmpfloat (r->accumulation[0], <, r->accumulation[1]);
  g_assert_cmpfloat (r->accumulation[2], <, r->accumulation[1]);
  g_assert_cmpfloat (r->accumulation[9], ==, 0.0);
  g_assert_true (r->dries_out);
  /* Nov: 30 days at 4.8266e-7 = 1.2510 kg/m² (as the single-plane case). */
  assert_close (r->accumulation[10], 1.2510, 1e-4);
}

/* EN ISO 6946 6.9.4 read for moisture: a well ventilated air layer and all
 * outside it are dropped; the cladding outside needs no μ. */
static void
test_ventilated_dropped (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = temperate_climate ();
  g_autoptr(LaminaMoistureResult) r = NULL;

  lamina_construction_add_layer (c, lamina_layer_new_air (25, LAMINA_AIR_WELL_VENTILATED));
  lamina_construction_add_layer (c, test_layer (20, "cladding", LAMINA_CATEGORY_TIMBER, 0.13));
  r = moisture_ok (c, climate);
  g_assert_cmpuint (r->n_layers, ==, 3);
  assert_close (r->rse, 0.13, 1e-12);
  assert_close (r->sd[3], 0.725, 1e-12);
  g_assert_true (lamina_moisture_result_has_warning (r, LAMINA_MOISTURE_WARNING_LAYERS_DROPPED));
}

/* Reading of the product: a bridged layer enters through its largest part.
 * Wool 0.85 / timber 0.15 (λ 0.13, μ 50): R = 0.15/0.040 = 3.75, sd 0.15. */
static void
test_bridged_largest_part (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = temperate_climate ();
  g_autoptr(LaminaMoistureResult) r = NULL;
  LaminaLayer *bridged = lamina_layer_new_bridged (150);
  LaminaMaterial *wool = test_material ("wool", LAMINA_CATEGORY_INSULATION, 0.040);
  LaminaMaterial *timber = test_material ("timber", LAMINA_CATEGORY_TIMBER, 0.13);

  wool->vapour_resistance_factor = 1;
  timber->vapour_resistance_factor = 50;
  lamina_layer_add_part (bridged, lamina_part_new (timber, 0.15));
  lamina_layer_add_part (bridged, lamina_part_new (wool, NAN));
  g_ptr_array_remove_index (c->layers, 1);
  g_ptr_array_insert (c->layers, 1, bridged);
  r = moisture_ok (c, climate);
  assert_close (r->resistance[1], 3.75, 1e-12);
  assert_close (r->sd[2] - r->sd[1], 0.15, 1e-12);
}

/* A material without μ is refused, naming the layer and the material. */
static void
test_missing_mu (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(LaminaClimate) climate = temperate_climate ();
  g_autoptr(GError) error = NULL;
  LaminaLayer *layer = c->layers->pdata[2];

  layer->material->vapour_resistance_factor = NAN;
  g_assert_null (lamina_moisture_calculate (c, climate, NAN, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "layer 3"));
  g_assert_nonnull (strstr (error->message, "osb"));
  g_clear_error (&error);
  /* ... unless the layer declares its sd */
  layer->sd = 0.45;
  g_autoptr(LaminaMoistureResult) r = moisture_ok (c, climate);
  assert_close (r->sd[3], 0.725, 1e-12);
}

/* Settings are checked like every other value of a construction. */
static void
test_settings_validated (void)
{
  g_autoptr(LaminaConstruction) c = timber_wall ();
  g_autoptr(GError) error = NULL;

  c->moisture->humidity_class = 3;     /* both a class and φi */
  g_assert_false (lamina_construction_validate (c, NULL, &error));
  g_assert_nonnull (strstr (error->message, "either"));
  g_clear_error (&error);
  c->moisture->inside_humidity = NAN;
  c->moisture->humidity_class = 6;
  g_assert_false (lamina_construction_validate (c, NULL, &error));
  g_clear_error (&error);
  c->moisture->humidity_class = 5;
  g_assert_true (lamina_construction_validate (c, NULL, &error));
  ((LaminaLayer *) c->layers->pdata[0])->sd = -1;
  g_assert_false (lamina_construction_validate (c, NULL, &error));
  g_assert_nonnull (strstr (error->message, "sd"));
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/moisture/saturation-pressure", test_saturation);
  g_test_add_func ("/core/moisture/humidity-class", test_humidity_class);
  g_test_add_func ("/core/moisture/class-pressure", test_class_pressure);
  g_test_add_func ("/core/moisture/single-plane-month", test_single_plane_month);
  g_test_add_func ("/core/moisture/surface", test_surface);
  g_test_add_func ("/core/moisture/surface-fails", test_surface_fails);
  g_test_add_func ("/core/moisture/no-condensation-when-dry-inside", test_no_condensation_when_dry_inside);
  g_test_add_func ("/core/moisture/more-sd-inside", test_more_sd_inside);
  g_test_add_func ("/core/moisture/start-month", test_start_month);
  g_test_add_func ("/core/moisture/ventilated-dropped", test_ventilated_dropped);
  g_test_add_func ("/core/moisture/bridged-largest-part", test_bridged_largest_part);
  g_test_add_func ("/core/moisture/missing-mu", test_missing_mu);
  g_test_add_func ("/core/moisture/settings-validated", test_settings_validated);
  return g_test_run ();
}
