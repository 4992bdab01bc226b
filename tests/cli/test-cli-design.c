/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli solve, the "dynamic" block of calc/show --json and
 * list --meets, end to end.  Figures are worked by hand in the comments
 * from EN ISO 6946:2017 (6.7.1, 6.8 Table 7) and EN ISO 13786:2017 (6.3,
 * 6.4, 7; clause numbers from memory). */
#include <json-glib/json-glib.h>
#include <math.h>
#include <glib/gstdio.h>
#include <string.h>

#include "lamina-cli-test-util.h"

static JsonObject *
parse_first (JsonParser *parser,
             const char *text)
{
  g_autoptr(GError) error = NULL;
  JsonObject *root;

  g_assert_true (json_parser_load_from_data (parser, text, -1, &error));
  g_assert_no_error (error);
  root = json_node_get_object (json_parser_get_root (parser));
  return json_array_get_object_element (json_object_get_array_member (root, "constructions"), 0);
}

#define assert_member(o, key, expected, tolerance) \
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member ((o), (key)), (expected), (tolerance))

/* Closed form: the rest of the wall is Rsi 0.13 + 0.0125/0.25 + 0.2/1.35 +
 * Rse 0.04 = 0.368148; for U 0.15 the wool needs (6.666667 − 0.368148) ·
 * 0.035 = 220.448 mm.  Its stock sizes are 200, 240, 260 mm: 240 mm gives
 * U = 1/(0.368148 + 6.857143) = 0.138403. */
static void
test_solve_file_json (void)
{
  g_autofree char *file = data_path ("design-checks.xml");
  const char *args[] = { "solve", file, "--id", "wall", "--layer", "2", "--target", "0.15", "--json", NULL };
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonObject *o, *s;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  o = parse_first (parser, out);
  g_assert_cmpstr (json_object_get_string_member (o, "id"), ==, "wall");
  s = json_object_get_object_member (o, "solve");
  g_assert_cmpint (json_object_get_int_member (s, "layer"), ==, 2);
  assert_member (s, "target", 0.15, 1e-12);
  assert_member (s, "thickness", 220.448, 0.01);
  assert_member (s, "u", 0.15, 1e-8);
  assert_member (s, "thickness_snapped", 240, 1e-9);
  assert_member (s, "u_snapped", 0.138403, 1e-6);
}

static void
test_solve_refusals (void)
{
  g_autofree char *file = data_path ("design-checks.xml");
  const char *unreachable[] = { "solve", file, "--id", "wall", "--layer", "2", "--target", "0.001", NULL };
  const char *no_layer[] = { "solve", file, "--target", "0.15", NULL };
  const char *bad_target[] = { "solve", file, "--layer", "2", "--target", "zero", NULL };
  const char *no_id[] = { "solve", file, "--id", "nope", "--layer", "2", "--target", "0.15", NULL };
  char *out = NULL, *err = NULL;

  /* 1/(0.368 + 10/0.035) = 0.0035 at the 10 m limit: unreachable, exit 1. */
  g_assert_cmpint (run_cli (unreachable, &out, &err), ==, 1);
  g_assert_nonnull (strstr (err, "design-checks.xml:"));
  g_assert_nonnull (strstr (err, "layer 2"));
  g_assert_nonnull (strstr (err, "10000 mm"));
  g_assert_cmpstr (out, ==, "");
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_cli (no_layer, &out, &err), ==, 2);
  g_assert_nonnull (strstr (err, "--layer"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_cli (bad_target, &out, &err), ==, 2);
  g_assert_nonnull (strstr (err, "--target"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_cli (no_id, &out, &err), ==, 1);
  g_assert_nonnull (strstr (err, "nope"));
  g_free (out);
  g_free (err);
}

/* The slab of EN ISO 13786 by hand (see tests/core/test-dynamic.c):
 * concrete 200 mm λ 2.0, ρ 2400, c 1000, Rsi 0.13, Rse 0.04, 24 h:
 * |Y12| 1.953100, f 0.527337, time shift 5.4751 h, |Y11| 5.775675 W/(m²·K),
 * κ1 = κ2 = 227.013 kJ/(m²·K). */
static void
test_dynamic_json (void)
{
  g_autofree char *file = data_path ("design-checks.xml");
  const char *args[] = { "calc", file, "--id", "slab", "--json", NULL };
  const char *bare[] = { "calc", file, "--id", "bare", "--json", NULL };
  g_autofree char *out = NULL, *err = NULL, *out2 = NULL, *err2 = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(JsonParser) parser2 = json_parser_new ();
  JsonObject *o, *d;
  JsonArray *warnings;
  gboolean named = FALSE;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  o = parse_first (parser, out);
  d = json_object_get_object_member (o, "dynamic");
  g_assert_nonnull (d);
  assert_member (d, "periodic_transmittance", 1.953100, 1e-6);
  assert_member (d, "decrement_factor", 0.527337, 1e-6);
  assert_member (d, "time_shift", 5.4751, 1e-4);
  assert_member (d, "admittance_inner", 5.775675, 1e-6);
  assert_member (d, "areal_heat_capacity_inner", 227.013, 1e-3);
  assert_member (d, "areal_heat_capacity_outer", 227.013, 1e-3);

  /* No specific heat: no block, and a warning naming the material. */
  g_assert_cmpint (run_cli (bare, &out2, &err2), ==, 0);
  o = parse_first (parser2, out2);
  g_assert_false (json_object_has_member (o, "dynamic"));
  warnings = json_object_get_array_member (o, "warnings");
  for (guint i = 0; i < json_array_get_length (warnings); i++)
    named |= strstr (json_array_get_string_element (warnings, i), "Mineral wool without c") != NULL;
  g_assert_true (named);
}

/* The library: import, solve by id, and list --meets --sort thickness. */
static void
test_library (void)
{
  g_autofree char *file = data_path ("design-checks.xml");
  g_autofree char *library = g_build_filename (g_get_user_data_dir (), "office.sqlite", NULL);
  const char *import[] = { "--library", library, "import", file, NULL };
  const char *solve[] = { "--library", library, "solve", "wall", "--layer", "2", "--target", "0.15", "--json", NULL };
  /* wall U = 1/(0.368148 + 2.857143) = 0.310; slab 3.70; bare ≈ 0.33. */
  const char *meets[] = { "--library", library, "list", "--meets", "0.35", "--sort", "thickness", "--json", NULL };
  const char *bad_sort[] = { "--library", library, "list", "--sort", "colour", NULL };
  g_autofree char *out = NULL, *err = NULL, *out2 = NULL, *err2 = NULL;
  char *out3 = NULL, *err3 = NULL, *out4 = NULL, *err4 = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(JsonParser) parser2 = json_parser_new ();
  JsonObject *root;
  JsonArray *list;

  g_assert_cmpint (run_cli (import, &out3, &err3), ==, 0);
  g_assert_cmpint (run_cli (solve, &out, &err), ==, 0);
  assert_member (json_object_get_object_member (parse_first (parser, out), "solve"), "thickness", 220.448, 0.01);

  g_assert_cmpint (run_cli (meets, &out2, &err2), ==, 0);
  g_assert_true (json_parser_load_from_data (parser2, out2, -1, NULL));
  root = json_node_get_object (json_parser_get_root (parser2));
  list = json_object_get_array_member (root, "constructions");
  /* bare (112.5 mm) before wall (312.5 mm); the slab (U 3.7) is out. */
  g_assert_cmpuint (json_array_get_length (list), ==, 2);
  g_assert_cmpstr (json_object_get_string_member (json_array_get_object_element (list, 0), "id"), ==, "bare");
  g_assert_cmpstr (json_object_get_string_member (json_array_get_object_element (list, 1), "id"), ==, "wall");

  g_assert_cmpint (run_cli (bad_sort, &out4, &err4), ==, 2);
  g_assert_nonnull (strstr (err4, "--sort"));
  g_free (out3);
  g_free (err3);
  g_free (out4);
  g_free (err4);
}

/* compare: a table on stdout, or a one-page PDF; the PDF itself is read
 * back in tests/sheet/test-design.c. */
static void
test_compare (void)
{
  g_autofree char *file = data_path ("design-checks.xml");
  g_autofree char *pdf = g_build_filename (g_get_user_data_dir (), "compare.pdf", NULL);
  const char *table[] = { "compare", "wall", "slab", "--from", file, NULL };
  const char *to_pdf[] = { "compare", "wall", "slab", "--from", file, "-o", pdf, NULL };
  const char *missing[] = { "compare", "wall", "nope", "--from", file, NULL };
  const char *one[] = { "compare", "wall", "--from", file, NULL };
  g_autofree char *out = NULL, *err = NULL, *out2 = NULL, *err2 = NULL;
  char *out3 = NULL, *err3 = NULL;

  g_assert_cmpint (g_mkdir_with_parents (g_get_user_data_dir (), 0700), ==, 0);
  g_assert_cmpint (run_cli (table, &out, &err), ==, 0);
  /* wall U 0.310, slab U 3.704 (see the dynamic test): B − A = +3.394. */
  g_assert_nonnull (strstr (out, "Corrected U"));
  g_assert_nonnull (strstr (out, "0.310"));
  g_assert_nonnull (strstr (out, "3.704"));
  g_assert_nonnull (strstr (out, "+3.394"));
  g_assert_cmpint (run_cli (to_pdf, &out2, &err2), ==, 0);
  g_assert_true (g_file_test (pdf, G_FILE_TEST_IS_REGULAR));
  g_assert_cmpint (run_cli (missing, &out3, &err3), ==, 1);
  g_assert_nonnull (strstr (err3, "nope"));
  g_clear_pointer (&out3, g_free);
  g_clear_pointer (&err3, g_free);
  g_assert_cmpint (run_cli (one, &out3, &err3), ==, 2);
  g_free (out3);
  g_free (err3);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/cli/solve/file-json", test_solve_file_json);
  g_test_add_func ("/cli/solve/refusals", test_solve_refusals);
  g_test_add_func ("/cli/dynamic/json", test_dynamic_json);
  g_test_add_func ("/cli/design/library", test_library);
  g_test_add_func ("/cli/design/compare", test_compare);
  return g_test_run ();
}
