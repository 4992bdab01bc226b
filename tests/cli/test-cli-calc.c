/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli calc end to end: figures against hand calculations by EN ISO
 * 6946:2017 (each worked in the comment beside it), the JSON contract, and
 * exit codes with located messages for bad input. */
#include <glib.h>
#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>

#include "lamina-cli-test-util.h"

static JsonObject *
find_construction (JsonParser *parser,
                   const char *id)
{
  JsonObject *root = json_node_get_object (json_parser_get_root (parser));
  JsonArray *list = json_object_get_array_member (root, "constructions");

  for (guint i = 0; i < json_array_get_length (list); i++)
    {
      JsonObject *o = json_array_get_object_element (list, i);
      if (g_strcmp0 (json_object_get_string_member (o, "id"), id) == 0)
        return o;
    }
  g_error ("no construction %s in the JSON", id);
}

#define assert_figure(o, key, expected) \
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member ((o), (key)), (expected), 1e-9 + 1e-6 * fabs (expected))

static void
test_json_figures (void)
{
  g_autofree char *file = data_path ("hand-checks.xml");
  const char *args[] = { "calc", file, "--json", NULL };
  g_autofree char *out = NULL;
  g_autofree char *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) error = NULL;
  JsonObject *o;
  JsonArray *layers;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  g_assert_true (json_parser_load_from_data (parser, out, -1, &error));
  g_assert_no_error (error);

  /* w1, a timber-frame wall with a rainscreen: the cavity is well
   * ventilated, so it and the cladding are disregarded and Rse = Rsi = 0.13
   * (6.9.4).  Studs 45/600 → f = 0.075 (6.7.2).
   *   insulation path 0.13 + 0.05 + 0.145/0.037 + 0.012/0.13 + 0.13
   *   stud path       0.13 + 0.05 + 0.145/0.13  + 0.012/0.13 + 0.13
   *   R''T = 0.13 + 0.05 + 1/(0.925·0.037/0.145 + 0.075·0.13/0.145) + 0.012/0.13 + 0.13 */
  {
    double rins = 0.145 / 0.037, rtim = 0.145 / 0.13, rosb = 0.012 / 0.13;
    double upper = 1.0 / (0.925 / (0.31 + rins + rosb) + 0.075 / (0.31 + rtim + rosb));
    double layer = 1.0 / (0.925 / rins + 0.075 / rtim);
    double lower = 0.31 + layer + rosb;
    double rt = (upper + lower) / 2;

    o = find_construction (parser, "w1");
    g_assert_cmpstr (json_object_get_string_member (o, "heat_flow"), ==, "horizontal");
    assert_figure (o, "rsi", 0.13);
    assert_figure (o, "rse", 0.13);
    assert_figure (o, "r_upper", upper);
    assert_figure (o, "r_lower", lower);
    assert_figure (o, "r_total", rt);
    assert_figure (o, "relative_error", (upper - lower) / (2 * rt));
    assert_figure (o, "u", 1 / rt);
    assert_figure (o, "delta_u", 0.0);
    assert_figure (o, "u_corrected", 1 / rt);
    layers = json_object_get_array_member (o, "layers");
    g_assert_cmpuint (json_array_get_length (layers), ==, 5);
    assert_figure (json_array_get_object_element (layers, 0), "thickness", 0.0125);
    assert_figure (json_array_get_object_element (layers, 1), "resistance", layer);
    g_assert_cmpuint (json_array_get_length (json_object_get_array_member (o, "warnings")), >=, 1);
  }

  /* r1, a warm deck: roof → upward, Rsi 0.10, Rse 0.04 (6.8, Table 7);
   * membrane declared R 0; steel fasteners through the PIR (F.3, α 0.8). */
  {
    double r1 = 0.16 / 0.022, rt = 0.10 + 0.2 / 2.3 + r1 + 0.04;
    double du = 0.8 * 50 * 12.57e-6 * 6 / 0.16 * (r1 / rt) * (r1 / rt);

    o = find_construction (parser, "r1");
    g_assert_cmpstr (json_object_get_string_member (o, "heat_flow"), ==, "upward");
    assert_figure (o, "rsi", 0.10);
    assert_figure (o, "r_total", rt);
    assert_figure (o, "u", 1 / rt);
    assert_figure (o, "delta_u", du);
    assert_figure (o, "u_corrected", 1 / rt + du);
  }

  /* p1, a partition (both faces indoors: Rsi on both sides, 6.8) with a
   * 25 mm cavity against a foil face ε 0.05: Annex D, E = 1/(1/0.9 + 1/0.05
   * − 1), hr0 = 4σ(283.15 K)³, ha = 1.25 → R = 1/(1.25 + E·hr0). */
  {
    double e = 1.0 / (1 / 0.9 + 1 / 0.05 - 1);
    double hr0 = 4 * 5.670374419e-8 * pow (283.15, 3);
    double rair = 1.0 / (1.25 + e * hr0);
    double rt = 0.13 + 0.05 + rair + 0.1025 / 0.77 + 0.13;

    o = find_construction (parser, "p1");
    assert_figure (o, "rse", 0.13);
    assert_figure (o, "r_total", rt);
    assert_figure (json_array_get_object_element (json_object_get_array_member (o, "layers"), 1),
                   "resistance", rair);
  }
}

static void
test_text_report (void)
{
  g_autofree char *file = data_path ("hand-checks.xml");
  const char *args[] = { "calc", file, "--id", "r1", NULL };
  g_autofree char *out = NULL;
  g_autofree char *err = NULL;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  g_assert_nonnull (strstr (out, "Warm deck on concrete"));
  g_assert_null (strstr (out, "Timber frame wall"));
  g_assert_nonnull (strstr (out, "R'T"));
  g_assert_nonnull (strstr (out, "Caution"));
  /* U = 0.1333 + ΔU 0.0177 → reported to two significant figures 0.15 */
  g_assert_nonnull (strstr (out, "reported U = 0.15"));
}

/* Bad input exits 1 with FILE:LINE; bad usage exits 2. */
static void
test_bad_input (void)
{
  const struct { const char *file; const char *expect; } cases[] = {
    { "bad-thickness.xml", "bad-thickness.xml:6:" },
    { "bad-material.xml", "bad-material.xml:6:" },
    { "bad-doctype.xml", "bad-doctype.xml:" },
    { "bad-air.xml", "bad-air.xml:" },
    { "truncated.xml", "truncated.xml:" },
    { "missing-file.xml", "missing-file.xml" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *file = data_path (cases[i].file);
      const char *args[] = { "calc", file, NULL };
      g_autofree char *out = NULL;
      g_autofree char *err = NULL;

      g_test_message ("%s", cases[i].file);
      g_assert_cmpint (run_cli (args, &out, &err), ==, 1);
      if (strstr (err, cases[i].expect) == NULL)
        g_error ("%s: stderr “%s” lacks “%s”", cases[i].file, err, cases[i].expect);
      g_assert_cmpstr (out, ==, "");
    }
}

static void
test_usage (void)
{
  const char *no_file[] = { "calc", NULL };
  const char *bad_option[] = { "calc", "--frobnicate", "x.xml", NULL };
  const char *bad_command[] = { "frobnicate", NULL };
  g_autofree char *file = data_path ("hand-checks.xml");
  const char *unknown_id[] = { "calc", file, "--id", "nope", NULL };
  char *out = NULL, *err = NULL;

  g_assert_cmpint (run_cli (no_file, &out, &err), ==, 2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_cli (bad_option, &out, &err), ==, 2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_cli (bad_command, &out, &err), ==, 2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_cli (unknown_id, &out, &err), ==, 1);
  g_assert_nonnull (strstr (err, "nope"));
  g_free (out);
  g_free (err);
}

/* lamina-cli moisture: the JSON contract of issue 13 and a month checked by
 * hand (EN ISO 13788:2012 clause 7, from memory).  Construction "hand":
 * plasterboard 12.5 (μ 10) / wool 150 (μ 1) / OSB 15 (μ 30), θi 20 °C,
 * φi 0.5, θe −5 °C, φe 0.8 all year.  RT = 4.085385 (EN ISO 6946 Rsi 0.13,
 * Rse 0.04); the wool/OSB plane is at −4.0491 °C, psat 435.07 Pa; pi =
 * 1168.48, pe = 320.94; gc = 2e-10·[(1168.48 − 435.07)/0.275 − (435.07 −
 * 320.94)/0.45] = 4.8266e-7 kg/(m²·s): January 1.2928 kg/m², and it never
 * dries.  Surface (clause 5): fRsi = 1 − 0.25/4.205385 = 0.940552,
 * fRsi,min = (12.6246 + 5)/25 = 0.70498. */
static void
test_moisture_json (void)
{
  g_autofree char *file = data_path ("moisture.xml");
  const char *args[] = { "moisture", file, "--json", NULL };
  g_autofree char *out = NULL;
  g_autofree char *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonObject *o, *m, *surface, *inter;
  JsonArray *months, *list;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  g_assert_true (json_parser_load_from_data (parser, out, -1, NULL));
  list = json_object_get_array_member (json_node_get_object (json_parser_get_root (parser)), "constructions");
  g_assert_cmpuint (json_array_get_length (list), ==, 2);   /* "plain" has no check */
  o = find_construction (parser, "hand");
  m = json_object_get_object_member (o, "moisture");
  surface = json_object_get_object_member (m, "surface");
  assert_figure (surface, "f_rsi", 0.940552);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (surface, "f_rsi_min"), 0.70498, 1e-5);
  g_assert_cmpint (json_object_get_int_member (surface, "critical_month"), ==, 1);
  g_assert_true (json_object_get_boolean_member (surface, "passes"));
  inter = json_object_get_object_member (m, "interstitial");
  g_assert_true (json_object_get_boolean_member (inter, "condensation"));
  g_assert_false (json_object_get_boolean_member (inter, "dries_out"));
  g_assert_cmpint (json_object_get_int_member (inter, "max_month"), ==, 12);
  months = json_object_get_array_member (inter, "months");
  g_assert_cmpuint (json_array_get_length (months), ==, 12);
  g_assert_cmpint (json_object_get_int_member (json_array_get_object_element (months, 0), "month"), ==, 1);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (json_array_get_object_element (months, 0),
                                                                 "accumulation"), 1.2928, 1e-4);
  g_assert_cmpuint (json_array_get_length (json_object_get_array_member (m, "warnings")), >=, 3);
  /* the vapour control layer (sd 100 m) stops it */
  inter = json_object_get_object_member (json_object_get_object_member (find_construction (parser, "vcl"),
                                                                        "moisture"), "interstitial");
  g_assert_false (json_object_get_boolean_member (inter, "condensation"));
  g_assert_cmpfloat (json_object_get_double_member (inter, "max_accumulation"), ==, 0.0);
  g_assert_true (json_object_get_boolean_member (inter, "dries_out"));
}

/* calc --json carries the same block; --id of a construction without a
 * check is an error naming it. */
static void
test_moisture_in_calc (void)
{
  g_autofree char *file = data_path ("moisture.xml");
  const char *calc[] = { "calc", file, "--json", "--id", "hand", NULL };
  const char *plain[] = { "moisture", file, "--id", "plain", NULL };
  const char *text[] = { "moisture", file, "--id", "hand", NULL };
  g_autofree char *out = NULL, *err = NULL, *out2 = NULL, *err2 = NULL, *out3 = NULL, *err3 = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonObject *m;

  g_assert_cmpint (run_cli (calc, &out, &err), ==, 0);
  g_assert_true (json_parser_load_from_data (parser, out, -1, NULL));
  m = json_object_get_object_member (find_construction (parser, "hand"), "moisture");
  g_assert_nonnull (m);
  g_assert_true (json_object_has_member (m, "surface"));
  g_assert_cmpint (run_cli (plain, &out2, &err2), ==, 1);
  g_assert_nonnull (strstr (err2, "moisture.xml:"));
  g_assert_nonnull (strstr (err2, "plain"));
  g_assert_cmpint (run_cli (text, &out3, &err3), ==, 0);
  g_assert_nonnull (strstr (out3, "does NOT dry out"));
  g_assert_nonnull (strstr (out3, "EN 15026"));
}

/* The contract of issue 14: "ground":{"b_prime","dt","u"} for a floor with
 * <ground>, "tapered":{"r0","r1"} with "u" the area mean.  Figures:
 * slab (EN ISO 13370 9.1, from memory): Rf = 0.07/1.35 + 0.15/1.35 +
 * 0.12/0.035 = 3.59153; clay λ 1.5 (Table 1); B′ = 120/23 = 5.21739;
 * dt = 0.35 + 1.5·(0.17 + 3.59153 + 0.04) = 6.05230 ≥ B′ →
 * U0 = 1.5/(0.457·5.21739 + 6.05230) = 0.17780; vertical edge insulation
 * (Annex B) D 0.6, dn 0.06, Rn 1.7: d′ = (1.7 − 0.06/1.5)·1.5 = 2.49;
 * ΔΨ = −1.5/π·[ln (1.2/6.05230 + 1) − ln (1.2/8.54230 + 1)] = −0.023603;
 * U = 0.17780 − 2·0.023603/5.21739 = 0.16875.
 * Tapered roof (EN ISO 6946 Annex E, from memory; Table 7 upward):
 * R0 = 0.10 + 0.2/2.3 + 0.06/0.022 + 0.01 + 0.04 = 2.96423,
 * R1 = 0.16/0.022 = 7.27273; thick apex:
 * U = 2/R1·[(1 + R0/R1)·ln (1 + R1/R0) − 1] = 0.20475. */
static void
test_method_json (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "examples",
                                            "ground-floor-and-tapered-roof.xml", NULL);
  const char *args[] = { "calc", "--json", path, NULL };
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) error = NULL;
  JsonObject *slab, *roof, *ground, *tapered;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  g_assert_true (json_parser_load_from_data (parser, out, -1, &error));
  slab = find_construction (parser, "slab-on-ground");
  ground = json_object_get_object_member (slab, "ground");
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (ground, "b_prime"), 5.21739, 1e-5);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (ground, "dt"), 6.05230, 1e-5);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (ground, "u"), 0.16875, 1e-5);
  g_assert_false (json_object_has_member (slab, "tapered"));

  roof = find_construction (parser, "tapered-flat-roof");
  tapered = json_object_get_object_member (roof, "tapered");
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (tapered, "r0"), 2.96423, 1e-5);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (tapered, "r1"), 7.27273, 1e-5);
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (roof, "u"), 0.20475, 1e-5);
  g_assert_false (json_object_has_member (roof, "ground"));
}

/* The caution and "method" name the method the reported U comes from: a
 * floor with the ground by EN ISO 13370:2017 (its clause 9.1 applies
 * Rf from EN ISO 6946), everything else by EN ISO 6946:2017. */
static void
test_method_named (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "examples",
                                            "ground-floor-and-tapered-roof.xml", NULL);
  const char *json[] = { "calc", "--json", path, NULL };
  const char *slab_text[] = { "calc", path, "--id", "slab-on-ground", NULL };
  const char *roof_text[] = { "calc", path, "--id", "tapered-flat-roof", NULL };
  g_autofree char *out = NULL, *err = NULL, *out2 = NULL, *err2 = NULL, *out3 = NULL, *err3 = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) error = NULL;
  const char *caution;

  g_assert_cmpint (run_cli (json, &out, &err), ==, 0);
  g_assert_true (json_parser_load_from_data (parser, out, -1, &error));
  g_assert_cmpstr (json_object_get_string_member (find_construction (parser, "slab-on-ground"), "method"),
                   ==, "EN ISO 13370:2017");
  g_assert_cmpstr (json_object_get_string_member (find_construction (parser, "tapered-flat-roof"), "method"),
                   ==, "EN ISO 6946:2017");

  g_assert_cmpint (run_cli (slab_text, &out2, &err2), ==, 0);
  caution = strstr (out2, "Caution:");
  g_assert_nonnull (caution);
  g_assert_true (g_str_has_prefix (caution, "Caution: figures are for the stated design conditions by EN ISO "
                                            "13370:2017 with the ground"));

  g_assert_cmpint (run_cli (roof_text, &out3, &err3), ==, 0);
  caution = strstr (out3, "Caution:");
  g_assert_nonnull (caution);
  g_assert_true (g_str_has_prefix (caution, "Caution: figures are for the stated design conditions by EN ISO "
                                            "6946:2017."));
  g_assert_null (strstr (out3, "13370"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/cli/calc/json-figures", test_json_figures);
  g_test_add_func ("/cli/calc/text-report", test_text_report);
  g_test_add_func ("/cli/calc/bad-input", test_bad_input);
  g_test_add_func ("/cli/calc/usage", test_usage);
  g_test_add_func ("/cli/moisture/json", test_moisture_json);
  g_test_add_func ("/cli/moisture/in-calc", test_moisture_in_calc);
  g_test_add_func ("/cli/calc/method-json", test_method_json);
  g_test_add_func ("/cli/calc/method-named", test_method_named);
  return g_test_run ();
}
