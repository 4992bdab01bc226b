/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Dynamic thermal characteristics by EN ISO 13786:2017 (clause numbers
 * from memory: 6.3 the layer matrix, 6.4 surfaces and the element, 7 the
 * characteristics).  Exact checks: det Z = 1 (each matrix of 6.3/6.4 is
 * unimodular), |Y12| → U as the period grows (the steady state), the layer
 * matrix against the standard's closed form in real functions of ξ, and a
 * slab and a four-layer wall worked by hand (figures in the comments). */
#include "lamina-test-util.h"
#include "lamina-dynamic.h"

static LaminaLayer *
massive_layer (double      thickness,
               const char *id,
               LaminaCategory category,
               double      conductivity,
               double      density,
               double      specific_heat)
{
  LaminaLayer *l = test_layer (thickness, id, category, conductivity);

  l->material->density = density;
  l->material->specific_heat = specific_heat;
  return l;
}

static void
dynamic_ok (const LaminaConstruction *c,
            double                    period,
            LaminaDynamic            *d)
{
  g_autoptr(LaminaResult) r = test_calculate (c);
  g_autoptr(GError) error = NULL;

  g_assert_true (lamina_dynamic_calculate (c, r, period, d, &error));
  g_assert_no_error (error);
}

/* Concrete 200 mm, λ 2.0, ρ 2400, c 1000 (EN ISO 10456 Table 3 reinforced
 * concrete, rounded; from memory), as a wall: Rsi 0.13, Rse 0.04. */
static LaminaConstruction *
slab (void)
{
  LaminaConstruction *c = test_wall ();

  lamina_construction_add_layer (c, massive_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 2.0, 2400, 1000));
  return c;
}

/* Plaster 15 mm (λ 0.57, ρ 1300, c 1000), concrete 200 mm (2.0, 2400,
 * 1000), EPS 100 mm (0.035, 20, 1450), render 10 mm (1.0, 1800, 1000):
 * EN ISO 10456 Table 3 values from memory, EPS a typical declared value. */
static LaminaConstruction *
insulated_wall (void)
{
  LaminaConstruction *c = test_wall ();

  lamina_construction_add_layer (c, massive_layer (15, "plaster", LAMINA_CATEGORY_PLASTER, 0.57, 1300, 1000));
  lamina_construction_add_layer (c, massive_layer (200, "concrete", LAMINA_CATEGORY_CONCRETE, 2.0, 2400, 1000));
  lamina_construction_add_layer (c, massive_layer (100, "eps", LAMINA_CATEGORY_INSULATION, 0.035, 20, 1450));
  lamina_construction_add_layer (c, massive_layer (10, "render", LAMINA_CATEGORY_PLASTER, 1.0, 1800, 1000));
  return c;
}

static void
assert_det_one (const LaminaHeatMatrix *z)
{
  double complex det = lamina_heat_matrix_det (z);

  g_assert_cmpfloat_with_epsilon (creal (det), 1.0, 1e-10);
  g_assert_cmpfloat_with_epsilon (cimag (det), 0.0, 1e-10);
}

/* det Z = 1 for every layer, every surface and the element (6.3, 6.4). */
static void
test_det_one (void)
{
  g_autoptr(LaminaConstruction) c = insulated_wall ();
  g_autoptr(LaminaResult) r = NULL;
  LaminaLayer *framed = lamina_layer_new_bridged (50);
  LaminaMaterial *batten = test_material ("batten", LAMINA_CATEGORY_TIMBER, 0.13);
  LaminaHeatMatrix z;

  batten->density = 500;
  batten->specific_heat = 1600;
  lamina_layer_add_part (framed, lamina_part_new (NULL, NAN));
  lamina_layer_add_part (framed, lamina_part_new_framing (batten, 45, 600, NULL));
  lamina_construction_add_layer (c, framed);
  lamina_construction_add_layer (c, lamina_layer_new_air (25, LAMINA_AIR_UNVENTILATED));
  r = test_calculate (c);

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *l = c->layers->pdata[i];

      if (l->kind == LAMINA_LAYER_MATERIAL)
        {
          z = lamina_heat_matrix_layer (l->thickness / 1000, l->material->conductivity, l->material->density,
                                        l->material->specific_heat, 86400);
          assert_det_one (&z);
        }
    }
  z = lamina_heat_matrix_resistance (0.13);
  assert_det_one (&z);
  g_assert_true (lamina_dynamic_matrix (c, r, 24, TRUE, &z, NULL, NULL));
  assert_det_one (&z);
  g_assert_true (lamina_dynamic_matrix (c, r, 24, FALSE, &z, NULL, NULL));
  assert_det_one (&z);
}

/* 6.3: the standard writes the layer matrix in real functions of ξ = d/δ,
 * δ = √(λT/(πρc)):
 *   Z11 = Z22 = cosh ξ cos ξ + i sinh ξ sin ξ
 *   Z12 = −δ/(2λ) [sinh ξ cos ξ + cosh ξ sin ξ + i (cosh ξ sin ξ − sinh ξ cos ξ)]
 *   Z21 = −λ/δ [sinh ξ cos ξ − cosh ξ sin ξ + i (sinh ξ cos ξ + cosh ξ sin ξ)] */
static void
test_layer_closed_form (void)
{
  static const double thicknesses[] = { 0.01, 0.1, 0.2, 0.5 };

  for (guint i = 0; i < G_N_ELEMENTS (thicknesses); i++)
    {
      double d = thicknesses[i], lambda = 2.0, rho = 2400, c = 1000, t = 86400;
      double delta = sqrt (lambda * t / (G_PI * rho * c)), xi = d / delta;
      double sc = sinh (xi) * cos (xi), cs = cosh (xi) * sin (xi);
      LaminaHeatMatrix z = lamina_heat_matrix_layer (d, lambda, rho, c, t);
      double complex z11 = cosh (xi) * cos (xi) + I * sinh (xi) * sin (xi);
      double complex z12 = -delta / (2 * lambda) * (sc + cs + I * (cs - sc));
      double complex z21 = -lambda / delta * (sc - cs + I * (sc + cs));

      g_assert_cmpfloat (cabs (z.z11 - z11), <, 1e-12 * cabs (z11));
      g_assert_cmpfloat (cabs (z.z22 - z11), <, 1e-12 * cabs (z11));
      g_assert_cmpfloat (cabs (z.z12 - z12), <, 1e-12 * cabs (z12));
      g_assert_cmpfloat (cabs (z.z21 - z21), <, 1e-12 * cabs (z21));
    }
}

/* The slab by hand: δ = √(2.0 · 86400 / (π · 2.4e6)) = 0.151388 m,
 * ξ = 0.2/0.151388 = 1.321109; Z11 = 0.495983 + 1.686399 i,
 * Z12 = −0.089887 − 0.057335 i (surface to surface).  With Rsi and Rse:
 * U = 1/(0.17 + 0.1) = 3.703704, |Y12| = 1.953100, f = 0.527337,
 * time shift = 5.4751 h, |Y11| = 5.775675;
 * κ1 = κ2 = 86400/2π · |(Z11 − 1)/Z12| = 227.013 kJ/(m²·K) (about half the
 * slab's 480 kJ/(m²·K), as for a thin layer ρcd/2). */
static void
test_slab_by_hand (void)
{
  g_autoptr(LaminaConstruction) c = slab ();
  LaminaDynamic d;

  dynamic_ok (c, 24, &d);
  assert_close (d.u, 3.703704, 1e-6);
  assert_close (d.periodic_transmittance, 1.953100, 1e-6);
  assert_close (d.decrement_factor, 0.527337, 1e-5);
  g_assert_cmpfloat_with_epsilon (d.time_shift, 5.4751, 1e-4);
  assert_close (d.admittance_inner, 5.775675, 1e-6);
  assert_close (d.areal_heat_capacity_inner, 227012.8, 1e-6);
  assert_close (d.areal_heat_capacity_outer, 227012.8, 1e-6);
  g_assert_false (d.bridged_equivalent);
}

/* The insulated wall, worked by hand as the product of the four layer
 * matrices and the surfaces: U = 1/(0.17 + 0.026316 + 0.1 + 2.857143 +
 * 0.01) = 0.316110, |Y12| = 0.046220, f = 0.146214, time shift = 8.2251 h,
 * |Y11| = 5.353529 (the heavy inner side), |Y22| = 1.402273, κ1 = 214.298
 * and κ2 = 21.444 kJ/(m²·K): the mass sits inside the insulation. */
static void
test_insulated_wall_by_hand (void)
{
  g_autoptr(LaminaConstruction) c = insulated_wall ();
  LaminaDynamic d;

  dynamic_ok (c, 24, &d);
  assert_close (d.u, 0.316110, 1e-5);
  assert_close (d.periodic_transmittance, 0.046220, 1e-4);
  assert_close (d.decrement_factor, 0.146214, 1e-5);
  g_assert_cmpfloat_with_epsilon (d.time_shift, 8.2251, 1e-4);
  assert_close (d.admittance_inner, 5.353529, 1e-6);
  assert_close (d.admittance_outer, 1.402273, 1e-6);
  assert_close (d.areal_heat_capacity_inner, 214297.9, 1e-6);
  assert_close (d.areal_heat_capacity_outer, 21444.1, 1e-5);
}

/* As the period grows the element reaches its steady state: |Y12| → U,
 * f → 1, time shift → 0 (7; the matrix tends to the resistances). */
static void
test_long_period (void)
{
  g_autoptr(LaminaConstruction) c = insulated_wall ();
  g_autoptr(LaminaResult) r = test_calculate (c);
  double previous = INFINITY;

  for (double period = 24; period <= 24e6; period *= 10)
    {
      LaminaDynamic d;
      double gap;

      dynamic_ok (c, period, &d);
      gap = fabs (d.periodic_transmittance - r->u);
      g_assert_cmpfloat (gap, <, previous);
      previous = gap;
    }
  g_assert_cmpfloat (previous, <, 1e-8);
}

/* Missing density or specific heat: refused, naming the material. */
static void
test_missing_heat_capacity (void)
{
  g_autoptr(LaminaConstruction) c = insulated_wall ();
  g_autoptr(LaminaResult) r = test_calculate (c);
  g_autoptr(GError) error = NULL;
  LaminaLayer *eps = c->layers->pdata[2];
  LaminaDynamic d;

  eps->material->specific_heat = NAN;
  g_assert_false (lamina_dynamic_calculate (c, r, 24, &d, &error));
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "eps"));
  g_assert_nonnull (strstr (error->message, "layer 3"));
}

/* A bridged layer by its lower-limit equivalent: λeq = d / R''eq and
 * ρc = Σ fj ρj cj.  One part of the whole area is the homogeneous layer. */
static void
test_bridged_equivalent (void)
{
  g_autoptr(LaminaConstruction) plain = slab ();
  g_autoptr(LaminaConstruction) bridged = test_wall ();
  LaminaLayer *b = lamina_layer_new_bridged (200);
  LaminaMaterial *m = test_material ("concrete", LAMINA_CATEGORY_CONCRETE, 2.0);
  LaminaDynamic a, e;

  m->density = 2400;
  m->specific_heat = 1000;
  lamina_layer_add_part (b, lamina_part_new (m, 1.0));
  lamina_construction_add_layer (bridged, b);
  dynamic_ok (plain, 24, &a);
  dynamic_ok (bridged, 24, &e);
  assert_close (e.periodic_transmittance, a.periodic_transmittance, 1e-12);
  assert_close (e.areal_heat_capacity_inner, a.areal_heat_capacity_inner, 1e-12);
  g_assert_true (e.bridged_equivalent);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/dynamic/det-one", test_det_one);
  g_test_add_func ("/core/dynamic/layer-closed-form", test_layer_closed_form);
  g_test_add_func ("/core/dynamic/slab-by-hand", test_slab_by_hand);
  g_test_add_func ("/core/dynamic/insulated-wall-by-hand", test_insulated_wall_by_hand);
  g_test_add_func ("/core/dynamic/long-period", test_long_period);
  g_test_add_func ("/core/dynamic/missing-heat-capacity", test_missing_heat_capacity);
  g_test_add_func ("/core/dynamic/bridged-equivalent", test_bridged_equivalent);
  return g_test_run ();
}
