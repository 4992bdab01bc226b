/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli field end to end: the JSON contract of the 2-D check, its
 * figures against EN ISO 6946 (homogeneous build-ups are one-dimensional,
 * so the 2-D U must equal the 1-D U; a bridged one lies between the
 * limits 1/R'T and 1/R''T of 6.7.2), the PNG, the library form and bad
 * usage. */
#include <glib.h>
#include <glib/gstdio.h>
#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>

#include "lamina-cli-test-util.h"

static JsonObject *
parse_first (JsonParser *parser,
             const char *text,
             const char *member)
{
  g_autoptr(GError) error = NULL;
  JsonObject *root;
  JsonArray *list;

  g_assert_true (json_parser_load_from_data (parser, text, -1, &error));
  g_assert_no_error (error);
  root = json_node_get_object (json_parser_get_root (parser));
  list = json_object_get_array_member (root, "constructions");
  g_assert_cmpuint (json_array_get_length (list), ==, 1);
  return member ? json_object_get_object_member (json_array_get_object_element (list, 0), member)
                : json_array_get_object_element (list, 0);
}

static void
calc_figures (const char *file,
              const char *id,
              double     *u,
              double     *r_upper,
              double     *r_lower)
{
  const char *args[] = { "calc", file, "--id", id, "--json", NULL };
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonObject *o;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  o = parse_first (parser, out, NULL);
  *u = json_object_get_double_member (o, "u_corrected");
  *r_upper = json_object_get_double_member (o, "r_upper");
  *r_lower = json_object_get_double_member (o, "r_lower");
}

/* The contract: {"constructions":[{"id","field":{"u","u_6946",
 * "min_inner_surface_temperature","f_rsi","cells","module_width"}}]}. */
static void
test_json_contract (void)
{
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
  const char *args[] = { "field", demo, "--id", "demo-ew-202", "--json", NULL };
  static const char *const keys[] = { "u", "u_6946", "min_inner_surface_temperature", "f_rsi", "cells",
                                      "module_width" };
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(JsonParser) outer = json_parser_new ();
  JsonObject *f, *c;
  double u6946, r_upper, r_lower, u, f_rsi, theta;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  c = parse_first (outer, out, NULL);
  g_assert_cmpstr (json_object_get_string_member (c, "id"), ==, "demo-ew-202");
  g_assert_cmpuint (json_object_get_size (c), ==, 2);
  f = parse_first (parser, out, "field");
  g_assert_cmpuint (json_object_get_size (f), ==, G_N_ELEMENTS (keys));
  for (guint k = 0; k < G_N_ELEMENTS (keys); k++)
    g_assert_true (json_object_has_member (f, keys[k]));

  calc_figures (demo, "demo-ew-202", &u6946, &r_upper, &r_lower);
  u = json_object_get_double_member (f, "u");
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (f, "u_6946"), u6946, 1e-12);
  /* EN ISO 6946 6.7.2: the exact U lies between the two limits. */
  g_assert_cmpfloat (u, >, 1.0 / r_upper);
  g_assert_cmpfloat (u, <, 1.0 / r_lower);
  /* The module is the stud spacing, 600 mm (the demo's EW-202). */
  g_assert_cmpfloat (json_object_get_double_member (f, "module_width"), ==, 600.0);
  g_assert_cmpint (json_object_get_int_member (f, "cells"), >, 1000);
  /* fRsi = (θsi − θe)/(θi − θe) with the design 18 °C / −12 °C. */
  f_rsi = json_object_get_double_member (f, "f_rsi");
  theta = json_object_get_double_member (f, "min_inner_surface_temperature");
  g_assert_cmpfloat (f_rsi, >, 0.0);
  g_assert_cmpfloat (f_rsi, <, 1.0);
  g_assert_cmpfloat_with_epsilon (theta, -12.0 + 30.0 * f_rsi, 1e-9);
}

/* Homogeneous build-ups: the 2-D U is the 1-D U of EN ISO 6946 (6.7.1,
 * Annex D for the low-emissivity cavity of p1; r1 carries a membrane
 * declared R = 0, modelled with R 1e-4, hence the 1e-4 tolerance). */
static void
test_homogeneous_is_1d (void)
{
  g_autofree char *file = data_path ("hand-checks.xml");
  static const char *const ids[] = { "r1", "p1" };

  for (guint k = 0; k < G_N_ELEMENTS (ids); k++)
    {
      const char *args[] = { "field", file, "--id", ids[k], "--json", NULL };
      g_autofree char *out = NULL, *err = NULL;
      g_autoptr(JsonParser) parser = json_parser_new ();
      double u6946, r_upper, r_lower;
      JsonObject *f;

      g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
      f = parse_first (parser, out, "field");
      calc_figures (file, ids[k], &u6946, &r_upper, &r_lower);
      g_assert_cmpfloat_with_epsilon (json_object_get_double_member (f, "u"), u6946, 1e-4 * u6946);
    }
}

static void
test_png (void)
{
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
  g_autofree char *dir = g_dir_make_tmp ("lamina-field-XXXXXX", NULL);
  g_autofree char *png = g_build_filename (dir, "field.png", NULL);
  const char *args[] = { "field", demo, "--id", "demo-ew-202", "--png", png, NULL };
  g_autofree char *out = NULL, *err = NULL, *again_out = NULL, *again_err = NULL;
  g_autofree char *bytes = NULL;
  gsize length = 0;

  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  g_assert_nonnull (strstr (out, "U (2-D)"));
  g_assert_nonnull (strstr (out, "EN ISO 10211"));
  g_assert_true (g_file_get_contents (png, &bytes, &length, NULL));
  g_assert_cmpuint (length, >, 1000);
  g_assert_cmpmem (bytes, 8, "\x89PNG\r\n\x1a\n", 8);
  /* An existing file is kept unless --force. */
  g_assert_cmpint (run_cli (args, &again_out, &again_err), ==, 1);
  g_assert_nonnull (strstr (again_err, "--force"));
  g_unlink (png);
  g_rmdir (dir);
}

static void
test_library (void)
{
  g_autofree char *dir = g_dir_make_tmp ("lamina-field-XXXXXX", NULL);
  g_autofree char *library = g_build_filename (dir, "office.sqlite", NULL);
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo", "lamina-demo.xml", NULL);
  const char *fill[] = { "--library", library, "demo", NULL };
  const char *args[] = { "--library", library, "field", "EW-202", "--json", NULL };
  const char *text_args[] = { "--library", library, "field", "EW-202", NULL };
  g_autofree char *tout = NULL, *terr = NULL;
  const char *file_args[] = { "field", demo, "--id", "demo-ew-202", "--json", NULL };
  g_autofree char *out = NULL, *err = NULL, *fout = NULL, *ferr = NULL, *o1 = NULL, *e1 = NULL;
  g_autoptr(JsonParser) p1 = json_parser_new ();
  g_autoptr(JsonParser) p2 = json_parser_new ();
  JsonObject *from_library, *from_file;

  g_assert_cmpint (run_cli (fill, &o1, &e1), ==, 0);
  g_assert_cmpint (run_cli (args, &out, &err), ==, 0);
  g_assert_cmpint (run_cli (file_args, &fout, &ferr), ==, 0);
  from_library = parse_first (p1, out, "field");
  from_file = parse_first (p2, fout, "field");
  /* The same construction gives the same figures from either source. */
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (from_library, "u"),
                                  json_object_get_double_member (from_file, "u"), 1e-12);
  /* The library form keeps the check with the revision it is of. */
  g_assert_cmpint (run_cli (text_args, &tout, &terr), ==, 0);
  g_assert_nonnull (strstr (tout, "2-D check stored with revision 1 of EW-202"));
  g_unlink (library);
  {
    g_autofree char *wal = g_strconcat (library, "-wal", NULL);
    g_autofree char *shm = g_strconcat (library, "-shm", NULL);
    g_unlink (wal);
    g_unlink (shm);
  }
  g_rmdir (dir);
}

static void
test_usage (void)
{
  g_autofree char *file = data_path ("hand-checks.xml");
  const char *none[] = { "field", NULL };
  const char *unknown[] = { "field", file, "--id", "nope", NULL };
  const char *many_png[] = { "field", file, "--png", "x.png", NULL };
  g_autofree char *o1 = NULL, *e1 = NULL, *o2 = NULL, *e2 = NULL, *o3 = NULL, *e3 = NULL;

  g_assert_cmpint (run_cli (none, &o1, &e1), ==, 2);
  g_assert_cmpint (run_cli (unknown, &o2, &e2), ==, 1);
  g_assert_nonnull (strstr (e2, "hand-checks.xml"));
  g_assert_nonnull (strstr (e2, "nope"));
  g_assert_cmpint (run_cli (many_png, &o3, &e3), ==, 2);
}

int
main (int argc, char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/cli/field/json-contract", test_json_contract);
  g_test_add_func ("/cli/field/homogeneous-is-1d", test_homogeneous_is_1d);
  g_test_add_func ("/cli/field/png", test_png);
  g_test_add_func ("/cli/field/library", test_library);
  g_test_add_func ("/cli/field/usage", test_usage);
  return g_test_run ();
}
