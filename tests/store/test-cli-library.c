/* SPDX-License-Identifier: GPL-3.0-or-later */
/* End-to-end tests of the library commands of lamina-cli (issue 3): exit
 * codes, JSON keys, and show --json giving the figures of calc --json. */
#include <json-glib/json-glib.h>
#include <string.h>

#include "lamina-store-test-util.h"

#include "lamina-cli-test-util.h"

static JsonObject *
first_construction (JsonParser *parser,
                    const char *text)
{
  JsonObject *root;

  g_assert_true (json_parser_load_from_data (parser, text, -1, NULL));
  root = json_node_get_object (json_parser_get_root (parser));
  return json_array_get_object_element (json_object_get_array_member (root, "constructions"), 0);
}

static void
test_commands (void)
{
  g_autofree char *out = NULL, *err = NULL, *export_path = NULL;
  g_autoptr(JsonParser) p1 = json_parser_new ();
  g_autoptr(JsonParser) p2 = json_parser_new ();
  g_autoptr(JsonParser) p3 = json_parser_new ();
  static const char *const keys[] = {
    "id", "name", "heat_flow", "rsi", "rse", "r_upper", "r_lower", "r_total",
    "relative_error", "u", "delta_u", "u_corrected", "layers", "warnings",
  };
  JsonObject *shown, *calculated, *listed;
  g_autofree char *calc_out = NULL;
  g_autofree char *calc_err = NULL;
  g_autofree char *cli = NULL;
  int status = 0;

  g_free (library_path);
  /* On the test server: a postgresql:// URI of an empty database. */
  library_path = test_library_uri ("cli.sqlite");
  export_path = test_library_path ("export.xml");

  /* A missing --library is refused, not created. */
  g_assert_cmpint (run (&out, &err, "list", NULL), ==, 1);
  g_assert_nonnull (strstr (err, test_on_server () ? "no Lamina library in this database"
                                                   : "no such library"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  if (test_on_server ())
    {
      g_autofree char *location = test_library_location ("cli.sqlite");

      /* The data reached the server (read past Lamina), and the address
       * was never taken for a path (no folder "postgresql:" here). */
      g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM construction;"), ==, 20);
      g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM material;"), >=, 33);
      g_assert_false (g_file_test ("postgresql:", G_FILE_TEST_EXISTS));
      g_assert_false (g_file_test (library_path, G_FILE_TEST_EXISTS));
    }
  /* The demo goes into an empty library only. */
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 1);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  g_assert_cmpint (run (&out, &err, "list", "--element", "wall", "--max-u", "0.2", "--json", NULL), ==, 0);
  listed = first_construction (p1, out);
  g_assert_cmpstr (json_object_get_string_member (listed, "element"), ==, "wall");
  g_assert_cmpfloat (json_object_get_double_member (listed, "u_corrected"), <=, 0.2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "list", "--status", "nonsense", NULL), ==, 2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* show --json: the same keys and figures as calc --json on an export. */
  g_assert_cmpint (run (&out, &err, "show", "EW-101", "--json", NULL), ==, 0);
  shown = first_construction (p2, out);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "export", "-o", export_path, NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "export", "-o", export_path, NULL), ==, 1);
  g_assert_nonnull (strstr (err, "--force"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  cli = g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL);
  {
    const char *argv[] = { cli, "calc", export_path, "--id",
                           json_object_get_string_member (shown, "id"), "--json", NULL };
    g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                                 &calc_out, &calc_err, &status, NULL));
  }
  calculated = first_construction (p3, calc_out);
  for (guint i = 0; i < G_N_ELEMENTS (keys); i++)
    g_assert_true (json_object_has_member (shown, keys[i]));
  g_assert_cmpfloat (json_object_get_double_member (shown, "u_corrected"), ==,
                     json_object_get_double_member (calculated, "u_corrected"));
  g_assert_cmpfloat (json_object_get_double_member (shown, "r_total"), ==,
                     json_object_get_double_member (calculated, "r_total"));

  /* Review: --by is required; an approved revision stays as it is. */
  g_assert_cmpint (run (&out, &err, "check", "EW-102", NULL), ==, 2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "check", "EW-102", "--by", "K. Reviewer", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  /* A date that is not a date is a usage error (exit 2), like any bad
   * option value. */
  g_assert_cmpint (run (&out, &err, "approve", "EW-102", "--by", "M. Lead", "--date", "2026-13-01", NULL), ==, 2);
  g_assert_nonnull (strstr (err, "YYYY-MM-DD"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  /* check --help lists only what check accepts. */
  g_assert_cmpint (run (&out, &err, "check", "--help", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "--by"));
  g_assert_nonnull (strstr (out, "--revision"));
  g_assert_null (strstr (out, "--date"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "approve", "EW-102", "--by", "M. Lead", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "approve", "EW-102", "--by", "M. Lead", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "approved"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "history", "EW-102", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "approved by M. Lead"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* Re-importing the export changes nothing. */
  g_assert_cmpint (run (&out, &err, "import", export_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "0 added, 0 revised"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "materials", "--json", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "\"conductivity\""));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* server-init: the roles on a server; a file has none. */
  if (test_on_server ())
    {
      g_autofree char *location = test_library_location ("cli.sqlite");

      g_assert_cmpint (run (&out, &err, "server-init", NULL), ==, 0);
      g_assert_nonnull (strstr (out, "lamina_approver"));
      g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM pg_roles"
                                               " WHERE rolname LIKE 'lamina\\_%';"), ==, 3);
      g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM meta WHERE key = 'server_roles'"
                                               " AND value = 'on';"), ==, 1);
    }
  else
    {
      g_assert_cmpint (run (&out, &err, "server-init", NULL), ==, 2);
      g_assert_nonnull (strstr (err, "PostgreSQL"));
    }
}

static void
clear_output (char **out,
              char **err)
{
  g_clear_pointer (out, g_free);
  g_clear_pointer (err, g_free);
}

/* What a practitioner meets every day: every writing command says what it
 * did, options go before or after the command, words are the window's. */
/* No two materials of the library are the same one under two names:
 * same category and the same λ, ρ, c, μ and ε. */
static void
assert_no_repeated_material (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = lamina_library_open (library_path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_autoptr(GPtrArray) materials = NULL;

  g_assert_no_error (error);
  materials = lamina_library_list_materials (library, &error);
  g_assert_no_error (error);
  for (guint i = 0; i < materials->len; i++)
    for (guint j = i + 1; j < materials->len; j++)
      {
        LaminaMaterial copy = *(LaminaMaterial *) materials->pdata[j];

        /* Equal but for the naming fields. */
        copy.id = ((LaminaMaterial *) materials->pdata[i])->id;
        copy.name = ((LaminaMaterial *) materials->pdata[i])->name;
        copy.source = ((LaminaMaterial *) materials->pdata[i])->source;
        copy.notes = ((LaminaMaterial *) materials->pdata[i])->notes;
        if (lamina_material_equal (materials->pdata[i], &copy))
          g_error ("“%s” and “%s” are the same material",
                   ((LaminaMaterial *) materials->pdata[i])->name, ((LaminaMaterial *) materials->pdata[j])->name);
      }
}

static void
test_daily (void)
{
  g_autofree char *out = NULL, *err = NULL, *export_path = NULL, *changed_path = NULL;
  g_autofree char *svg_path = NULL, *pdf_path = NULL, *xml = NULL, *svg = NULL;
  g_autofree char *ew302_path = NULL;
  g_autoptr(GString) changed = NULL;

  g_free (library_path);
  library_path = test_library_uri ("daily.sqlite");
  ew302_path = test_library_path ("ew-302.xml");
  export_path = test_library_path ("ew-101.xml");
  changed_path = test_library_path ("ew-101-changed.xml");
  svg_path = test_library_path ("cl-301.svg");
  pdf_path = test_library_path ("ew-101.pdf");

  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  /* Ten of the demo's 33 materials are the seed's generic EN ISO 10456
   * values, defined alike, so the library keeps one of each. */
  g_assert_nonnull (strstr (out, "20 added, 0 revised, 0 unchanged, 0 conflicts; 23 materials added, 0 updated"));
  assert_no_repeated_material ();
  /* The report names constructions by code and name, not by internal id. */
  g_assert_nonnull (strstr (out, "CL-301 “Cellar ceiling, concrete with mineral wool soffit boards”: added"));
  g_assert_null (strstr (out, "demo-cl-301"));
  clear_output (&out, &err);

  /* EN ISO 13788 through the library: the demo's solid brick wall fails
   * the mould check in a class 3 dwelling (fRsi 0.575 < fRsi,min 0.752,
   * figures of data/demo/README.md), and only it. */
  g_assert_cmpint (run (&out, &err, "list", "--moisture", "fails", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-301"));
  g_assert_nonnull (strstr (out, "fails its moisture check"));
  g_assert_null (strstr (out, "EW-302"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "show", "EW-301", "--json", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "\"moisture\""));
  g_assert_nonnull (strstr (out, "\"critical_month\" : 1"));
  g_assert_nonnull (strstr (out, "\"passes\" : false"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "list", "--moisture", "wet", NULL), ==, 2);
  clear_output (&out, &err);
  /* The office's limit is the library's: EW-302's winter condensation
   * (about 0.14 kg/m² at the end of March, dries out) passes the default
   * 0.5 kg/m² (common practice) and fails a stricter 0.1 kg/m², in the list
   * and in "show"; "moisture --limit" still overrides it for a file. */
  g_assert_cmpint (run (&out, &err, "moisture-limit", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "0.5 kg/m²"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "moisture-limit", "--set", "0.1", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "0.1 kg/m²"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "list", "--moisture", "fails", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-302"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "show", "EW-302", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "exceeds the office limit of 0.10 kg/m²"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "show", "EW-302", "--json", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "\"limit\" : 0.1"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "export", "EW-302", "-o", ew302_path, NULL), ==, 0);
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "moisture", ew302_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "Result: FAILS"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "moisture", ew302_path, "--limit", "0.5", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "Result: passes"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "moisture-limit", "--set", "-1", NULL), ==, 2);
  g_assert_nonnull (strstr (err, "--set -1 is outside the allowed range"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "moisture-limit", "--set", "0.5", NULL), ==, 0);
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "list", "--moisture", "fails", NULL), ==, 0);
  g_assert_null (strstr (out, "EW-302"));
  clear_output (&out, &err);

  g_assert_cmpint (run (&out, &err, "check", "EW-102", "--by", "A. Reviewer", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-102 revision 1 checked by A. Reviewer"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "approve", "EW-102", "--by", "B. Partner", "--date", "2026-12-01", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-102 revision 1 approved by B. Partner on 2026-12-01"));
  clear_output (&out, &err);

  /* --status in any case. */
  g_assert_cmpint (run (&out, &err, "list", "--status", "Approved", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-102"));
  g_assert_null (strstr (out, "FL-301")); /* a draft */
  /* Piped, nothing is cut; thickness to one decimal (12.5 mm boards). */
  g_assert_nonnull (strstr (out, "Timber frame wall, insulated service void, wood-fibre sheathing"));
  g_assert_null (strstr (out, "…"));
  g_assert_nonnull (strstr (out, "344.5"));
  g_assert_nonnull (strstr (out, "340.0"));
  clear_output (&out, &err);

  /* --force before or after the command name. */
  g_assert_cmpint (run (&out, &err, "export", "EW-101", "-o", export_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "1 construction and 5 materials exported to"));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "export", "EW-101", "-o", export_path, NULL), ==, 1);
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "export", "EW-101", "-o", export_path, "--force", NULL), ==, 0);
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "--force", "export", "EW-101", "-o", export_path, NULL), ==, 0);
  clear_output (&out, &err);

  /* The same construction back: unchanged.  Renamed: one conflict with
   * the approved revision, in the singular. */
  g_assert_cmpint (run (&out, &err, "import", export_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-101 “Timber frame wall, insulated service void, wood-fibre sheathing”: "
                                 "unchanged"));
  g_assert_nonnull (strstr (out, "0 added, 0 revised, 1 unchanged, 0 conflicts"));
  clear_output (&out, &err);
  g_assert_true (g_file_get_contents (export_path, &xml, NULL, NULL));
  changed = g_string_new (xml);
  g_assert_cmpuint (g_string_replace (changed, "wood-fibre sheathing\"", "wood-fibre sheathing, variant\"", 1), ==, 1);
  g_assert_true (g_file_set_contents (changed_path, changed->str, -1, NULL));
  g_assert_cmpint (run (&out, &err, "import", changed_path, NULL), ==, 1);
  g_assert_nonnull (strstr (out, "0 added, 0 revised, 0 unchanged, 1 conflict;"));
  g_assert_nonnull (strstr (err, "1 conflict with an approved revision"));
  clear_output (&out, &err);

  /* The drawings lay out text through pango and fontconfig, whose
   * process-long caches memcheck reports as lost (lsan.supp suppresses the
   * same for the sanitizers); cairo 1.16's SVG emitter also trips it.  The
   * memcheck pass checks our own code on the commands above. */
  if (g_getenv ("LAMINA_CLI_WRAPPER") != NULL)
    return;
  /* The section as SVG, for the office's drawings. */
  g_assert_cmpint (run (&out, &err, "section", "CL-301", "-o", svg_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "CL-301 revision 2: section drawn to"));
  g_assert_true (g_file_get_contents (svg_path, &svg, NULL, NULL));
  g_assert_true (g_str_has_prefix (svg, "<?xml"));
  g_assert_nonnull (strstr (svg, "<svg"));
  g_assert_nonnull (strstr (svg, "width=\"1600px\""));
  clear_output (&out, &err);
  g_assert_cmpint (run (&out, &err, "sheet", "EW-101", "-o", pdf_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "EW-101 revision 3 (approved): sheet written to"));
  clear_output (&out, &err);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/store/cli/commands", test_commands);
  g_test_add_func ("/store/cli/daily", test_daily);
  return g_test_run ();
}
