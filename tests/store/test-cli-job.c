/* SPDX-License-Identifier: GPL-3.0-or-later */
/* End-to-end tests of `lamina-cli job`: the keys of job show --json (the
 * contract), the corrected U of each entry equal to the construction's
 * own show --json, H_T equal to the hand sum of U·A, the default pin
 * (latest approved, else latest with a note), and exit codes 0/1/2. */
#include <json-glib/json-glib.h>
#include <math.h>
#include <string.h>

#include "lamina-store-test-util.h"
#include "lamina-cli-test-util.h"

static JsonObject *
parse_object (JsonParser *parser,
              const char *text,
              const char *member)
{
  g_assert_true (json_parser_load_from_data (parser, text, -1, NULL));
  return json_object_get_object_member (json_node_get_object (json_parser_get_root (parser)),
                                        member);
}

static double
construction_u (const char *id)
{
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonObject *root;

  g_assert_cmpint (run (&out, &err, "show", id, "--json", NULL), ==, 0);
  g_assert_true (json_parser_load_from_data (parser, out, -1, NULL));
  root = json_node_get_object (json_parser_get_root (parser));
  return json_object_get_double_member (
    json_array_get_object_element (json_object_get_array_member (root, "constructions"), 0),
    "u_corrected");
}

/* The demo's school job: every contract key, the hall wall failing its
 * invented target, and h_t = Σ u·area (EN ISO 13789:2017 8.2 H = Σ A·U,
 * from memory) summed here by hand from the entries. */
static void
test_show_json (void)
{
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  static const char *const keys[] = {
    "construction", "revision", "use", "u", "target", "met", "area", "ua",
  };
  JsonObject *job;
  JsonArray *entries;
  double sum = 0;

  g_free (library_path);
  library_path = test_library_path ("cli-job.sqlite");
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "demo-job-riverside", "--json", NULL), ==, 0);
  job = parse_object (parser, out, "job");
  g_assert_cmpstr (json_object_get_string_member (job, "id"), ==, "demo-job-riverside");
  g_assert_true (json_object_has_member (job, "name"));
  entries = json_object_get_array_member (job, "entries");
  g_assert_cmpuint (json_array_get_length (entries), ==, 5);
  for (guint i = 0; i < json_array_get_length (entries); i++)
    {
      JsonObject *e = json_array_get_object_element (entries, i);
      double u = json_object_get_double_member (e, "u");

      for (guint k = 0; k < G_N_ELEMENTS (keys); k++)
        g_assert_true (json_object_has_member (e, keys[k]));
      g_assert_cmpfloat_with_epsilon (u, construction_u (json_object_get_string_member (e, "construction")),
                                      1e-12);
      g_assert_cmpfloat_with_epsilon (json_object_get_double_member (e, "ua"),
                                      u * json_object_get_double_member (e, "area"), 1e-9);
      /* No entry of the demo job states its ground: every U by EN ISO 6946. */
      g_assert_cmpstr (json_object_get_string_member (e, "method"), ==, "EN ISO 6946:2017");
      sum += u * json_object_get_double_member (e, "area");
    }
  g_assert_cmpfloat_with_epsilon (json_object_get_double_member (job, "h_t"), sum, 1e-9);
  /* EW-203: U 0.326 above the invented 0.18 for external walls. */
  g_assert_cmpstr (json_object_get_string_member (json_array_get_object_element (entries, 1),
                                                  "construction"), ==, "demo-ew-203");
  g_assert_false (json_object_get_boolean_member (json_array_get_object_element (entries, 1), "met"));
  g_assert_true (json_object_get_boolean_member (json_array_get_object_element (entries, 0), "met"));
  g_assert_cmpfloat (json_object_get_double_member (json_array_get_object_element (entries, 1), "target"),
                     ==, 0.18);
}

/* new, add, update, remove, list, and their refusals. */
static void
test_edit (void)
{
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  static const struct { int status; const char *args[10]; const char *expect; } cases[] = {
    { 0, { "job", "new", "j1", "--name", "Test job", "--number", "T-1", "--client", "C", "--targets" }, NULL },
    { 1, { "job", "new", "j1", "--name", "Again" }, "exists" },
    { 2, { "job", "new", "j2" }, "--name" },
    { 2, { "job", "new", "j2", "--name", "X", "--status", "finished" }, "--status" },
    { 2, { "job", "new", "j2", "--name", "X", "--outside-temperature", "-300" }, "--outside-temperature" },
    { 1, { "job", "new", "j2", "--name", "X", "--targets", "nope" }, "no target set “nope”" },
    { 0, { "job", "add", "j1", "EW-101", "--use", "external-wall", "--area", "100" }, NULL },
    { 0, { "job", "add", "j1", "demo-ew-102", "--use", "external-wall" }, "not approved" },
    { 1, { "job", "add", "j1", "EW-101", "--use", "balcony" }, "its uses: external-wall" },
    { 2, { "job", "add", "j1", "EW-101", "--use", "roof", "--area", "-1" }, "--area" },
    { 1, { "job", "add", "j1", "EW-999", "--use", "roof" }, "EW-999" },
    { 1, { "job", "add", "j1", "EW-101", "--use", "roof", "--revision", "99" }, "no revision 99" },
    { 2, { "job", "add", "j1", "EW-101" }, "--use" },
    { 0, { "job", "add", "j1", "--junction", "eaves", "--psi", "0.05", "--length", "20" }, NULL },
    { 0, { "job", "update", "j1", "--entry", "2", "--area", "40", "--location", "Gable" }, NULL },
    { 0, { "job", "update", "j1", "--move", "1", "--revision", "3", "--by", "A. Architect" }, NULL },
    { 1, { "job", "update", "j1", "--move", "9" }, "no entry 9" },
    { 1, { "job", "show", "nope" }, "no job “nope”" },
    { 1, { "job", "update", "j1", "--climate", "nowhere" }, "job “j1”, climate: there is no climate “nowhere”" },
    { 0, { "job", "update", "j1", "--climate", "fallowmere" }, NULL },
    { 2, { "job", "frobnicate" }, "unknown job command" },
    { 0, { "job", "remove", "j1", "2" }, NULL },
    { 1, { "job", "remove", "j1", "2" }, "no entry 2" },
    { 2, { "job", "remove", "j1", "two" }, "entry number" },
  };
  JsonObject *job;
  JsonArray *entries;

  g_free (library_path);
  library_path = test_library_path ("cli-job-edit.sqlite");
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      const char *const *a = cases[i].args;
      int status;

      g_clear_pointer (&out, g_free);
      g_clear_pointer (&err, g_free);
      if (i == 0)
        status = run (&out, &err, a[0], a[1], a[2], a[3], a[4], a[5], a[6], a[7], a[8], a[9],
                      "demo-fallowmere-rules", NULL);
      else
        status = run (&out, &err, a[0], a[1], a[2], a[3], a[4], a[5], a[6], a[7], a[8], a[9], NULL);
      if (status != cases[i].status)
        g_error ("case %u (%s %s): exit %d, expected %d; %s", i, a[1], a[2], status,
                 cases[i].status, err);
      if (cases[i].expect != NULL && strstr (err, cases[i].expect) == NULL)
        g_error ("case %u: “%s” does not name “%s”", i, err, cases[i].expect);
    }
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "j1", "--json", NULL), ==, 0);
  job = parse_object (parser, out, "job");
  entries = json_object_get_array_member (job, "entries");
  g_assert_cmpuint (json_array_get_length (entries), ==, 1);
  /* The default pin is EW-101's approved revision 3 (data/demo). */
  g_assert_cmpint (json_object_get_int_member (json_array_get_object_element (entries, 0), "revision"),
                   ==, 3);
  g_assert_cmpstr (json_object_get_string_member (job, "number"), ==, "T-1");
  g_assert_cmpuint (json_array_get_length (json_object_get_array_member (job, "junctions")), ==, 1);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "list", "--json", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "\"j1\""));
  /* The sheet set's report counts its one entry in the singular. */
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_autofree char *pdf = test_library_path ("cli-job-edit.pdf");
  g_assert_cmpint (run (&out, &err, "--force", "job", "sheets", "j1", "-o", pdf, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "job “j1”: 1 entry, sheet set written to "));
}

/* job sheets: one PDF (%PDF), refused without -o (2) and over an existing
 * file without --force (1). */
static void
test_sheets (void)
{
  g_autofree char *out = NULL, *err = NULL, *pdf = NULL, *data = NULL;
  gsize length = 0;

  g_free (library_path);
  library_path = test_library_path ("cli-job-sheets.sqlite");
  pdf = test_library_path ("riverside.pdf");
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "sheets", "demo-job-riverside", "-o", pdf, NULL), ==, 0);
  g_assert_true (g_file_get_contents (pdf, &data, &length, NULL));
  g_assert_true (length > 1000 && memcmp (data, "%PDF", 4) == 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "sheets", "demo-job-riverside", "-o", pdf, NULL), ==, 1);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "sheets", "demo-job-riverside", NULL), ==, 2);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "--force", "job", "sheets", "nope", "-o", pdf, NULL), ==, 1);
  g_assert_nonnull (strstr (err, "no job “nope”"));
}

/* A job variant's entry: job show names its origin and prints what the
 * variant changes from the origin at the pinned origin revision (the
 * history's revision diff), as text and as "differences" in JSON. */
static void
test_variant_differences (void)
{
  g_autofree char *out = NULL, *err = NULL, *variant_id = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaConstruction) variant = NULL;
  g_autoptr(GError) error = NULL;
  JsonObject *entry;
  JsonArray *differences;
  LaminaLayer *layer;
  guint n_layer = 0;

  g_free (library_path);
  library_path = test_library_path ("cli-job-variant.sqlite");
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "new", "jv", "--name", "Variant", "--targets",
                        "demo-fallowmere-rules", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "add", "jv", "EW-101", "--use", "external-wall",
                        "--variant", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "jv", "--json", NULL), ==, 0);
  entry = json_array_get_object_element (json_object_get_array_member (parse_object (parser, out, "job"),
                                                                       "entries"), 0);
  g_assert_cmpstr (json_object_get_string_member (entry, "origin"), ==, "demo-ew-101");
  variant_id = g_strdup (json_object_get_string_member (entry, "construction"));

  /* the variant's first layer 20 mm thicker, stored as its revision 2 */
  library = lamina_library_open (library_path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  variant = lamina_library_dup_construction (library, variant_id, 0, &error);
  g_assert_no_error (error);
  layer = variant->layers->pdata[0];
  layer->thickness += 20;
  g_assert_true (lamina_library_save_construction (library, variant, 1, "A. Planner", &error));
  g_assert_no_error (error);
  g_clear_object (&library);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "update", "jv", "--move", "1", "--revision", "2", NULL), ==, 0);

  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "jv", "--json", NULL), ==, 0);
  entry = json_array_get_object_element (json_object_get_array_member (parse_object (parser, out, "job"),
                                                                       "entries"), 0);
  differences = json_object_get_array_member (entry, "differences");
  g_assert_nonnull (differences);
  g_assert_cmpuint (json_array_get_length (differences), ==, 1);
  /* the first layer differs (the variant's own name and code aside) */
  for (guint i = 0; i < json_array_get_length (differences); i++)
    n_layer += g_str_has_prefix (json_array_get_string_element (differences, i), "Layer 1");
  g_assert_cmpuint (n_layer, ==, 1);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "jv", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "job variant of demo-ew-101 revision 3:"));
  g_assert_nonnull (strstr (out, "– Layer 1"));
}

/* job delete: a job in design asks “y”; a submitted one only takes its
 * job number typed in full; no answer or a wrong one deletes nothing
 * (exit 1); --yes does not ask.  The library's constructions stay. */
static void
test_delete (void)
{
  g_autofree char *out = NULL, *err = NULL;
  static const struct { const char *input, *job; gboolean yes; int status; const char *expect; } cases[] = {
    /* the school: design, 5 entries */
    { "", "TO-2402", FALSE, 1, "not deleted: no confirmation" },
    { "n\n", "demo-job-riverside", FALSE, 1, "not deleted" },
    /* the houses: submitted, 3 entries; “y” is not enough */
    { "y\n", "TO-2401", FALSE, 1, "type “TO-2401”" },
    { "TO-2402\n", "demo-job-sloe-row", FALSE, 1, "its sheets may have been issued" },
    { "TO-2401\n", "demo-job-sloe-row", FALSE, 0, "schedule of 3 entries" },
    { NULL, "demo-job-sloe-row", TRUE, 1, "no job “demo-job-sloe-row”" },
    { "y\n", "TO-2402", FALSE, 0, "schedule of 5 entries?" },
  };

  g_free (library_path);
  library_path = test_library_path ("cli-job-delete.sqlite");
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      int status;

      g_clear_pointer (&out, g_free);
      g_clear_pointer (&err, g_free);
      if (cases[i].yes)
        status = run (&out, &err, "job", "delete", cases[i].job, "--yes", NULL);
      else
        status = run_with_stdin (cases[i].input, &out, &err, "job", "delete", cases[i].job, NULL);
      if (status != cases[i].status)
        g_error ("case %u: exit %d, expected %d; %s", i, status, cases[i].status, err);
      if (strstr (err, cases[i].expect) == NULL && strstr (out, cases[i].expect) == NULL)
        g_error ("case %u: “%s” does not say “%s”", i, err, cases[i].expect);
    }
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "list", NULL), ==, 0);
  g_assert_cmpstr (out, ==, "");
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "show", "EW-203", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "delete", NULL), ==, 2);
}

/* Every job command finds a job by its number as well as its id; one
 * job's id that is another's number is refused (exit 1) naming both.
 * job show writes a temperature below zero with the minus sign U+2212
 * (ISO 80000-1 writes the minus sign so, from memory); JSON stays a
 * number. */
static void
test_job_number (void)
{
  g_autofree char *out = NULL, *err = NULL, *pdf = NULL;
  g_autoptr(JsonParser) parser = json_parser_new ();
  JsonObject *job;

  g_free (library_path);
  library_path = test_library_path ("cli-job-number.sqlite");
  pdf = test_library_path ("cli-job-number.pdf");
  g_assert_cmpint (run (&out, &err, "demo", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "TO-2402", "--json", NULL), ==, 0);
  job = parse_object (parser, out, "job");
  g_assert_cmpstr (json_object_get_string_member (job, "id"), ==, "demo-job-riverside");
  g_assert_cmpfloat (json_object_get_double_member (job, "outside_temperature"), ==, -10);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "to-2402", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "\u221210.0\u00a0°C outside"));
  g_assert_null (strstr (out, "-10"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "sheets", "TO-2401", "-o", pdf, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "job “demo-job-sloe-row”: 3 entries"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "update", "TO-2401", "--entry", "1", "--location", "Terrace", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "new", "TO-2401", "--name", "Clash", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "show", "TO-2401", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "is the id of the job “TO-2401” (Clash) and the job number of the job "
                                 "“demo-job-sloe-row”"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "add", "TO-2401", "EW-101", "--use", "external-wall", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "(Clash)"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "job", "sheets", "--help", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "An id is taken first, but a text that is one job's id and another "
                                 "job's number is refused"));
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/cli/job/show-json", test_show_json);
  g_test_add_func ("/cli/job/edit", test_edit);
  g_test_add_func ("/cli/job/sheets", test_sheets);
  g_test_add_func ("/cli/job/variant-differences", test_variant_differences);
  g_test_add_func ("/cli/job/delete", test_delete);
  g_test_add_func ("/cli/job/job-number", test_job_number);
  return g_test_run ();
}
