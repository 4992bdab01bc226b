/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Bridged layers, EN ISO 6946:2017 6.7.2 (2007: 6.2): upper limit R'T
 * (sections in parallel), lower limit R''T (equivalent layers), RT as their
 * mean and the maximum relative error. */
#include "lamina-test-util.h"

static LaminaResult *
calc_ok (const LaminaConstruction *c)
{
  g_autoptr(GError) error = NULL;
  LaminaResult *r = lamina_calculate (c, &error);

  g_assert_no_error (error);
  return r;
}

static LaminaLayer *
stud_layer (double      thickness,
            double      fraction,
            const char *member)
{
  LaminaLayer *layer = lamina_layer_new_bridged (thickness);
  LaminaPart *stud = lamina_part_new (test_material ("softwood", LAMINA_CATEGORY_TIMBER, 0.13), fraction);

  stud->member = g_strdup (member);
  lamina_layer_add_part (layer, lamina_part_new (test_material ("mineral-wool", LAMINA_CATEGORY_INSULATION, 0.038), NAN));
  lamina_layer_add_part (layer, stud);
  return layer;
}

/* A timber-frame wall laid out like the timber-frame example of the BRE
 * report "Examples of U-value calculations using BS EN ISO 6946" (layers
 * and λ recalled from memory; the figures below are re-worked by hand from
 * 6.7.2, not quoted): inside to outside plasterboard 12.5 mm λ 0.25,
 * mineral wool 140 mm λ 0.038 between studs λ 0.13 at 15 %, plywood 10 mm
 * λ 0.13, unventilated cavity 50 mm (Table 8: 0.18), brick 102.5 mm
 * λ 0.77, Rsi 0.13, Rse 0.04.
 *   insulation path: 0.13 + 0.05 + 3.684211 + 0.076923 + 0.18 + 0.133117 + 0.04 = 4.294251
 *   stud path:       0.13 + 0.05 + 1.076923 + 0.076923 + 0.18 + 0.133117 + 0.04 = 1.686963
 *   R'T = 1 / (0.85/4.294250 + 0.15/1.686963) = 3.486066
 *   bridged layer: 1 / (0.85/3.684211 + 0.15/1.076923) = 2.702703
 *   R''T = 0.13 + 0.05 + 2.702703 + 0.076923 + 0.18 + 0.133117 + 0.04 = 3.312743
 *   RT = 3.399405, U = 0.294169, e = 2.55 % */
static void
test_timber_frame_example (void)
{
  g_autoptr(LaminaConstruction) c = lamina_construction_new ("tf", "timber frame", LAMINA_ELEMENT_WALL);
  g_autoptr(LaminaResult) r = NULL;

  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, stud_layer (140, 0.15, "stud"));
  lamina_construction_add_layer (c, test_layer (10, "plywood", LAMINA_CATEGORY_BOARD, 0.13));
  lamina_construction_add_layer (c, lamina_layer_new_air (50, LAMINA_AIR_UNVENTILATED));
  lamina_construction_add_layer (c, test_layer (102.5, "brick", LAMINA_CATEGORY_MASONRY, 0.77));
  r = calc_ok (c);

  assert_close (r->r_upper, 3.486066, 1e-6);
  assert_close (r->r_lower, 3.312743, 1e-6);
  assert_close (r->r_total, 3.399405, 1e-6);
  assert_close (r->u, 0.294169, 1e-5);
  assert_close (r->relative_error, (3.486066 - 3.312743) / (2 * 3.399405), 1e-5);
  assert_close (r->layers[1].resistance, 2.702703, 1e-6);
  g_assert_true (r->layers[1].bridged);
  g_assert_cmpuint (r->n_sections, ==, 2);
  g_assert_cmpfloat_with_epsilon (lamina_round_significant (r->u, 2), 0.29, 1e-12);
}

/* Width over spacing gives the fraction: 45 / 600 = 0.075. */
static void
test_width_spacing (void)
{
  g_autoptr(LaminaConstruction) a = test_wall ();
  g_autoptr(LaminaConstruction) b = test_wall ();
  LaminaLayer *framed = lamina_layer_new_bridged (145);
  g_autoptr(LaminaResult) ra = NULL;
  g_autoptr(LaminaResult) rb = NULL;

  lamina_layer_add_part (framed, lamina_part_new (test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.037), NAN));
  lamina_layer_add_part (framed, lamina_part_new_framing (test_material ("softwood", LAMINA_CATEGORY_TIMBER, 0.13),
                                                          45, 600, "stud"));
  lamina_construction_add_layer (a, framed);
  lamina_construction_add_layer (b, stud_layer (145, 0.075, "stud"));
  ((LaminaPart *) ((LaminaLayer *) b->layers->pdata[0])->parts->pdata[0])->material->conductivity = 0.037;
  ra = calc_ok (a);
  rb = calc_ok (b);
  assert_close (ra->r_upper, rb->r_upper, 1e-12);
  assert_close (ra->r_lower, rb->r_lower, 1e-12);
}

/* The same member through two layers lines up (2 sections); unnamed
 * patterns cross (4 sections).  EN ISO 6946:2017 6.7.2 divides the element
 * into sections without saying how two independent patterns combine;
 * taking every combination with the product of the fractions (members
 * placed independently) is the product's reading.  Layers: A 100 mm and
 * B 50 mm, each mineral wool λ 0.038 with timber λ 0.13 at f = 0.1.
 *   RA,ins = 2.631579, RA,tim = 0.769231, RB,ins = 1.315789, RB,tim = 0.384615
 *   Rs = 0.13 + 0.04 = 0.17
 * aligned: 1/R' = 0.9/(0.17+3.947368) + 0.1/(0.17+1.153846)
 * crossed: 1/R' = 0.81/(0.17+3.947368) + 0.09/(0.17+2.631579+0.384615)
 *               + 0.09/(0.17+0.769231+1.315789) + 0.01/(0.17+1.153846)
 * R'' is the same in both: 0.17 + 1/(0.9/2.631579 + 0.1/0.769231)
 *                              + 1/(0.9/1.315789 + 0.1/0.384615). */
static void
test_aligned_and_crossing (void)
{
  g_autoptr(LaminaConstruction) aligned = test_wall ();
  g_autoptr(LaminaConstruction) crossed = test_wall ();
  g_autoptr(LaminaResult) ra = NULL;
  g_autoptr(LaminaResult) rc = NULL;
  double ai = 0.1 / 0.038, at = 0.1 / 0.13, bi = 0.05 / 0.038, bt = 0.05 / 0.13;
  double upper_aligned = 1.0 / (0.9 / (0.17 + ai + bi) + 0.1 / (0.17 + at + bt));
  double upper_crossed = 1.0 / (0.81 / (0.17 + ai + bi) + 0.09 / (0.17 + ai + bt)
                                + 0.09 / (0.17 + at + bi) + 0.01 / (0.17 + at + bt));
  double lower = 0.17 + 1.0 / (0.9 / ai + 0.1 / at) + 1.0 / (0.9 / bi + 0.1 / bt);

  lamina_construction_add_layer (aligned, stud_layer (100, 0.1, "stud"));
  lamina_construction_add_layer (aligned, stud_layer (50, 0.1, "stud"));
  lamina_construction_add_layer (crossed, stud_layer (100, 0.1, NULL));
  lamina_construction_add_layer (crossed, stud_layer (50, 0.1, NULL));
  ra = calc_ok (aligned);
  rc = calc_ok (crossed);

  g_assert_cmpuint (ra->n_sections, ==, 2);
  g_assert_cmpuint (rc->n_sections, ==, 4);
  assert_close (ra->r_upper, upper_aligned, 1e-12);
  assert_close (rc->r_upper, upper_crossed, 1e-12);
  assert_close (ra->r_lower, lower, 1e-12);
  assert_close (rc->r_lower, lower, 1e-12);
  /* Aligned studs form a clean path: more heat flow, lower upper limit. */
  g_assert_cmpfloat (ra->r_upper, <, rc->r_upper);
}

/* A member in one layer only, with a different member in the next: the
 * pattern gets one section per member and a background.  Layer A has studs
 * (f 0.1), layer B the same studs plus noggings (member "nog", f 0.05):
 * sections stud 0.1 (A tim, B tim), nog 0.05 (A ins, B nog), rest 0.85. */
static void
test_member_pattern (void)
{
  g_autoptr(LaminaConstruction) c = test_wall ();
  g_autoptr(LaminaResult) r = NULL;
  LaminaLayer *b = stud_layer (50, 0.1, "stud");
  LaminaPart *nog = lamina_part_new (test_material ("softwood", LAMINA_CATEGORY_TIMBER, 0.13), 0.05);
  double ai = 0.1 / 0.038, at = 0.1 / 0.13, bi = 0.05 / 0.038, bt = 0.05 / 0.13;

  nog->member = g_strdup ("nog");
  lamina_layer_add_part (b, nog);
  lamina_construction_add_layer (c, stud_layer (100, 0.1, "stud"));
  lamina_construction_add_layer (c, b);
  r = calc_ok (c);
  g_assert_cmpuint (r->n_sections, ==, 3);
  assert_close (r->r_upper, 1.0 / (0.1 / (0.17 + at + bt) + 0.05 / (0.17 + ai + bt) + 0.85 / (0.17 + ai + bi)),
                1e-12);
}

/* An air part between battens takes Table 8 at the layer thickness:
 * 25 mm horizontal 0.18; battens 25 mm λ 0.13 at 38/400. */
static void
test_air_part (void)
{
  g_autoptr(LaminaConstruction) c = test_wall ();
  g_autoptr(LaminaResult) r = NULL;
  LaminaLayer *battens = lamina_layer_new_bridged (25);
  double f = 38.0 / 400.0, rb = 0.025 / 0.13;

  lamina_layer_add_part (battens, lamina_part_new (NULL, NAN));
  lamina_layer_add_part (battens, lamina_part_new_framing (test_material ("batten", LAMINA_CATEGORY_TIMBER, 0.13),
                                                           38, 400, NULL));
  lamina_construction_add_layer (c, test_layer (100, "mw", LAMINA_CATEGORY_INSULATION, 0.035));
  lamina_construction_add_layer (c, battens);
  r = calc_ok (c);
  assert_close (r->layers[1].resistance, 1.0 / ((1 - f) / 0.18 + f / rb), 1e-12);
}

/* 6.7.2.1: outside R'T/R''T ≤ 1.5 and for insulation bridged by metal the
 * method does not hold; a numerical method (EN ISO 10211) is needed.
 * Steel studs (λ 50, EN ISO 10456 Table 3) 1 mm web in 100 mm insulation. */
static void
test_metal_bridging_warns (void)
{
  g_autoptr(LaminaConstruction) c = test_wall ();
  g_autoptr(LaminaResult) r = NULL;
  LaminaLayer *layer = lamina_layer_new_bridged (100);

  lamina_layer_add_part (layer, lamina_part_new (test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (layer, lamina_part_new_framing (test_material ("steel", LAMINA_CATEGORY_METAL, 50),
                                                         1, 600, "stud"));
  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_construction_add_layer (c, layer);
  lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
  r = calc_ok (c);
  g_assert_true (lamina_result_has_warning (r, LAMINA_WARNING_METAL_BRIDGED_INSULATION));
  g_assert_cmpfloat (r->r_upper / r->r_lower, >, 1.5);
  g_assert_true (lamina_result_has_warning (r, LAMINA_WARNING_RATIO_OUT_OF_RANGE));
}

/* EN ISO 6946:2017 clause 1: insulation bridged by metal is outside the
 * scope, whatever the materials are called: a part with λ ≥ 10 W/(m·K)
 * (metal; stainless steel 17, EN ISO 10456 Table 3) beside a part with
 * λ ≤ 0.1 (insulating; common practice).  Here the steel is filed as
 * "other" and the insulating part is a wood-fibre board (λ 0.04) filed
 * as "board"; a steel stud in concrete bridges nothing insulating. */
static void
test_metal_bridging_by_conductivity (void)
{
  const struct { LaminaCategory category; double lambda; gboolean warns; } cases[] = {
    { LAMINA_CATEGORY_BOARD, 0.04, TRUE },
    { LAMINA_CATEGORY_TIMBER, 0.10, TRUE },
    { LAMINA_CATEGORY_CONCRETE, 1.15, FALSE },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(LaminaConstruction) c = test_wall ();
      g_autoptr(LaminaResult) r = NULL;
      LaminaLayer *layer = lamina_layer_new_bridged (100);

      lamina_layer_add_part (layer, lamina_part_new (test_material ("fill", cases[i].category, cases[i].lambda), NAN));
      lamina_layer_add_part (layer, lamina_part_new_framing (test_material ("steel", LAMINA_CATEGORY_OTHER, 17),
                                                             40, 600, "stud"));
      lamina_construction_add_layer (c, test_layer (12.5, "plasterboard", LAMINA_CATEGORY_BOARD, 0.25));
      lamina_construction_add_layer (c, layer);
      r = calc_ok (c);
      g_assert_cmpint (lamina_result_has_warning (r, LAMINA_WARNING_METAL_BRIDGED_INSULATION), ==, cases[i].warns);
    }
}

/* Invariants over many generated build-ups (EN ISO 6946:2017 6.7.2):
 * R'T ≥ R''T (parallel paths never conduct less than the isothermal
 * planes allow) and e ≥ 0.  A generated pattern whose member "m0" or
 * "m1" has different fractions in two layers is refused (members that
 * line up must have one fraction); every other case must be calculated,
 * and the count of each is fixed by the seed. */
static void
test_limits_invariant (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (6946);
  guint accepted = 0, refused = 0;

  for (int n = 0; n < 500; n++)
    {
      g_autoptr(LaminaConstruction) c = test_wall ();
      g_autoptr(LaminaResult) r = NULL;
      g_autoptr(GError) error = NULL;
      int layers = g_rand_int_range (rand, 1, 7);

      for (int i = 0; i < layers; i++)
        {
          double d = g_rand_double_range (rand, 5, 250);
          if (g_rand_boolean (rand))
            lamina_construction_add_layer (c, test_layer (d, "m", LAMINA_CATEGORY_OTHER,
                                                          g_rand_double_range (rand, 0.02, 3)));
          else
            {
              LaminaLayer *b = lamina_layer_new_bridged (d);
              LaminaPart *p = lamina_part_new (test_material ("b", LAMINA_CATEGORY_OTHER,
                                                              g_rand_double_range (rand, 0.02, 60)),
                                               g_rand_double_range (rand, 0.01, 0.5));
              if (g_rand_boolean (rand))
                p->member = g_strdup_printf ("m%d", g_rand_int_range (rand, 0, 2));
              lamina_layer_add_part (b, lamina_part_new (test_material ("a", LAMINA_CATEGORY_OTHER,
                                                                        g_rand_double_range (rand, 0.02, 1)), NAN));
              lamina_layer_add_part (b, p);
              lamina_construction_add_layer (c, b);
            }
        }
      r = lamina_calculate (c, &error);
      if (r == NULL)
        {
          /* Only a member named in two layers with different fractions. */
          g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
          g_assert_nonnull (strstr (error->message, "must line up"));
          refused++;
          continue;
        }
      accepted++;
      g_assert_cmpfloat (r->r_upper, >=, r->r_lower * (1 - 1e-12));
      g_assert_cmpfloat (r->relative_error, >=, -1e-12);
      g_assert_cmpfloat (r->u, >, 0);
    }
  g_test_message ("%u of 500 generated build-ups calculated, %u refused", accepted, refused);
  g_assert_cmpuint (accepted + refused, ==, 500);
  /* 445 calculated and 55 refused with this seed: a change that refuses
   * more (or skips the checks) shows here. */
  g_assert_cmpuint (accepted, ==, 445);
}

static void
test_single_part_is_homogeneous (void)
{
  g_autoptr(LaminaConstruction) a = test_wall ();
  g_autoptr(LaminaConstruction) b = test_wall ();
  LaminaLayer *one = lamina_layer_new_bridged (120);
  g_autoptr(LaminaResult) ra = NULL;
  g_autoptr(LaminaResult) rb = NULL;

  lamina_layer_add_part (one, lamina_part_new (test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.035), 1.0));
  lamina_construction_add_layer (a, one);
  lamina_construction_add_layer (b, test_layer (120, "mw", LAMINA_CATEGORY_INSULATION, 0.035));
  ra = calc_ok (a);
  rb = calc_ok (b);
  assert_close (ra->r_upper, ra->r_lower, 1e-12);
  assert_close (ra->r_total, rb->r_total, 1e-12);
}

/* Members that should line up must have the same fraction. */
static void
test_member_mismatch (void)
{
  g_autoptr(LaminaConstruction) c = test_wall ();
  g_autoptr(GError) error = NULL;
  LaminaResult *r;

  lamina_construction_add_layer (c, stud_layer (100, 0.1, "stud"));
  lamina_construction_add_layer (c, stud_layer (50, 0.15, "stud"));
  r = lamina_calculate (c, &error);
  g_assert_null (r);
  g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "layer 2"));
  g_assert_nonnull (strstr (error->message, "stud"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/bridged/timber-frame-example", test_timber_frame_example);
  g_test_add_func ("/core/bridged/width-spacing", test_width_spacing);
  g_test_add_func ("/core/bridged/aligned-and-crossing", test_aligned_and_crossing);
  g_test_add_func ("/core/bridged/member-pattern", test_member_pattern);
  g_test_add_func ("/core/bridged/air-part", test_air_part);
  g_test_add_func ("/core/bridged/metal-bridging-warns", test_metal_bridging_warns);
  g_test_add_func ("/core/bridged/metal-bridging-by-conductivity", test_metal_bridging_by_conductivity);
  g_test_add_func ("/core/bridged/limits-invariant", test_limits_invariant);
  g_test_add_func ("/core/bridged/single-part-is-homogeneous", test_single_part_is_homogeneous);
  g_test_add_func ("/core/bridged/member-mismatch", test_member_mismatch);
  return g_test_run ();
}
