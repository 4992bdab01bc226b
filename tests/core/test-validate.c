/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Every bad value is refused with a message naming the layer, part and
 * field (the rules of the model; ranges are common practice limits). */
#include "lamina-test-util.h"

typedef void (*Spoil) (LaminaConstruction *c);

static LaminaConstruction *
good_wall (void)
{
  LaminaConstruction *c = test_wall ();
  LaminaLayer *framed = lamina_layer_new_bridged (145);
  LaminaLayer *cavity = lamina_layer_new_air (25, LAMINA_AIR_UNVENTILATED);

  lamina_construction_add_layer (c, test_layer (12.5, "gypsum", LAMINA_CATEGORY_BOARD, 0.25));
  lamina_layer_add_part (framed, lamina_part_new (test_material ("mw", LAMINA_CATEGORY_INSULATION, 0.037), NAN));
  lamina_layer_add_part (framed, lamina_part_new_framing (test_material ("softwood", LAMINA_CATEGORY_TIMBER, 0.13),
                                                          45, 600, "stud"));
  lamina_construction_add_layer (c, framed);
  lamina_construction_add_layer (c, cavity);
  lamina_construction_add_layer (c, lamina_layer_new_resistance (0.5, 0));
  return c;
}

#define LAYER(c, i) ((LaminaLayer *) (c)->layers->pdata[i])
#define PART(c, i, p) ((LaminaPart *) LAYER (c, i)->parts->pdata[p])

static void spoil_zero_thickness (LaminaConstruction *c) { LAYER (c, 0)->thickness = 0; }
static void spoil_negative_thickness (LaminaConstruction *c) { LAYER (c, 0)->thickness = -12.5; }
static void spoil_nan_thickness (LaminaConstruction *c) { LAYER (c, 0)->thickness = NAN; }
static void spoil_inf_thickness (LaminaConstruction *c) { LAYER (c, 0)->thickness = INFINITY; }
static void spoil_zero_conductivity (LaminaConstruction *c) { LAYER (c, 0)->material->conductivity = 0; }
static void spoil_negative_conductivity (LaminaConstruction *c) { LAYER (c, 0)->material->conductivity = -0.2; }
static void spoil_part_conductivity (LaminaConstruction *c) { PART (c, 1, 1)->material->conductivity = NAN; }
static void spoil_fraction_sum (LaminaConstruction *c) { PART (c, 1, 0)->fraction = 0.95; }
static void spoil_fraction_range (LaminaConstruction *c) { PART (c, 1, 0)->fraction = 1.2; }
static void spoil_two_remainders (LaminaConstruction *c)
{
  PART (c, 1, 1)->width = PART (c, 1, 1)->spacing = NAN;
}
static void spoil_width_over_spacing (LaminaConstruction *c) { PART (c, 1, 1)->width = 700; }
static void spoil_width_without_spacing (LaminaConstruction *c) { PART (c, 1, 1)->spacing = NAN; }
static void spoil_negative_resistance (LaminaConstruction *c) { LAYER (c, 3)->resistance = -1; }
static void spoil_emissivity (LaminaConstruction *c) { LAYER (c, 2)->emissivity_outer = 1.5; }
static void spoil_vent_area (LaminaConstruction *c)
{
  LAYER (c, 2)->air = LAMINA_AIR_SLIGHTLY_VENTILATED;
}
static void spoil_air_gap_level (LaminaConstruction *c)
{
  LAYER (c, 0)->corrections.has_air_gaps = TRUE;
  LAYER (c, 0)->corrections.air_gap_level = 3;
}
static void spoil_penetration (LaminaConstruction *c)
{
  LaminaCorrections *k = &LAYER (c, 0)->corrections;
  k->has_fasteners = TRUE;
  k->fastener_conductivity = 50;
  k->fastener_cross_section = 12;
  k->fasteners_per_square_metre = 4;
  k->fastener_penetration = 20;
}
static void spoil_tiny_conductivity (LaminaConstruction *c) { LAYER (c, 0)->material->conductivity = 1e-300; }
static void spoil_tiny_thickness (LaminaConstruction *c) { LAYER (c, 0)->thickness = 1e-300; }
static void spoil_huge_conductivity (LaminaConstruction *c) { LAYER (c, 0)->material->conductivity = 5000; }
static void spoil_temperature (LaminaConstruction *c) { c->outside_temperature = -90; }
static void spoil_target (LaminaConstruction *c) { c->target_u = 0; }
static void spoil_no_layers (LaminaConstruction *c) { g_ptr_array_set_size (c->layers, 0); }
static void spoil_duplicate_member (LaminaConstruction *c)
{
  PART (c, 1, 0)->member = g_strdup ("stud");
  PART (c, 1, 0)->fraction = 0.5;
}

static void
test_bad_values (void)
{
  const struct { const char *name; Spoil spoil; const char *expect; } cases[] = {
    { "zero thickness", spoil_zero_thickness, "layer 1: thickness 0" },
    { "negative thickness", spoil_negative_thickness, "layer 1: thickness -12.5" },
    { "NaN thickness", spoil_nan_thickness, "layer 1: thickness nan" },
    { "infinite thickness", spoil_inf_thickness, "layer 1: thickness inf" },
    { "zero conductivity", spoil_zero_conductivity, "layer 1: thermal conductivity 0" },
    { "negative conductivity", spoil_negative_conductivity, "layer 1: thermal conductivity -0.2" },
    { "part conductivity", spoil_part_conductivity, "layer 2, part 2: thermal conductivity" },
    { "fractions over 1", spoil_fraction_sum, "layer 2: the part fractions sum to 1.025" },
    { "fraction range", spoil_fraction_range, "layer 2, part 1: fraction 1.2" },
    { "two remainders", spoil_two_remainders, "layer 2: only one part" },
    { "width over spacing", spoil_width_over_spacing, "layer 2, part 2: width 700" },
    { "width without spacing", spoil_width_without_spacing, "layer 2, part 2: width and spacing" },
    { "negative resistance", spoil_negative_resistance, "layer 4: thermal resistance -1" },
    { "emissivity", spoil_emissivity, "layer 3: outer emissivity 1.5" },
    { "vent area missing", spoil_vent_area, "layer 3: a slightly ventilated air layer needs its vent area" },
    { "air gap level", spoil_air_gap_level, "layer 1: air gap level 3" },
    { "penetration", spoil_penetration, "layer 1: fastener penetration 20" },
    { "temperature", spoil_temperature, "outside temperature -90" },
    { "target", spoil_target, "target U 0" },
    /* The message is the bare fact: the caller names the construction. */
    { "no layers", spoil_no_layers, "no layers" },
    /* Physical ranges, with the allowed range in the message: the lowest
     * design λ of a building material is a vacuum insulation panel's,
     * about 0.007 W/(m·K), the highest copper's, 380 W/(m·K)
     * (EN ISO 10456:2007, Table 3; from memory). */
    { "tiny conductivity", spoil_tiny_conductivity,
      "layer 1: thermal conductivity 1e-300 is outside the allowed range 0.001 to 1000 W/(m·K)" },
    { "huge conductivity", spoil_huge_conductivity, "layer 1: thermal conductivity 5000 is outside the allowed range 0.001 to 1000 W/(m·K)" },
    { "tiny thickness", spoil_tiny_thickness,
      "layer 1: thickness 1e-300 is outside the allowed range 0.01 to 10000 mm" },
    { "duplicate member", spoil_duplicate_member, "member “stud” appears twice" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(LaminaConstruction) c = good_wall ();
      g_autoptr(GError) error = NULL;
      LaminaResult *r;

      g_test_message ("case: %s", cases[i].name);
      cases[i].spoil (c);
      r = lamina_calculate (c, &error);
      g_assert_null (r);
      g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
      if (strstr (error->message, cases[i].expect) == NULL)
        g_error ("case %s: “%s” does not contain “%s”", cases[i].name, error->message, cases[i].expect);
    }
}

static void
test_good_wall (void)
{
  g_autoptr(LaminaConstruction) c = good_wall ();
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaResult) r = lamina_calculate (c, &error);

  g_assert_no_error (error);
  g_assert_nonnull (r);
}

/* The line of the offending item comes back for located messages. */
static void
test_line (void)
{
  g_autoptr(LaminaConstruction) c = good_wall ();
  g_autoptr(GError) error = NULL;
  int line = -1;

  PART (c, 1, 1)->line = 42;
  PART (c, 1, 1)->width = 0;
  g_assert_false (lamina_construction_validate (c, &line, &error));
  g_assert_cmpint (line, ==, 42);
}

static void
test_copy_equal (void)
{
  g_autoptr(LaminaConstruction) c = good_wall ();
  g_autoptr(LaminaConstruction) d = lamina_construction_copy (c);

  g_assert_true (lamina_construction_equal_content (c, d));
  LAYER (d, 1)->thickness = 150;
  g_assert_false (lamina_construction_equal_content (c, d));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/core/validate/good", test_good_wall);
  g_test_add_func ("/core/validate/bad-values", test_bad_values);
  g_test_add_func ("/core/validate/line", test_line);
  g_test_add_func ("/core/model/copy-equal", test_copy_equal);
  return g_test_run ();
}
