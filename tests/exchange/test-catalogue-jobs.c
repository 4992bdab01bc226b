/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Target sets and jobs in the catalogue XML: read value by value, exact
 * round trip, the order writers keep (target sets before constructions,
 * jobs after them), and refusals that name FILE:LINE.  The target values
 * are invented for the test. */
#include <glib.h>
#include <math.h>
#include <string.h>

#include "lamina-catalogue.h"

static char *
example_text (gsize *length)
{
  const char *top = g_getenv ("LAMINA_SOURCE_DIR");
  g_autofree char *path = g_build_filename (top ? top : ".", "tests", "exchange", "data",
                                            "jobs-example.xml", NULL);
  g_autoptr(GError) error = NULL;
  char *text = NULL;

  g_file_get_contents (path, &text, length, &error);
  g_assert_no_error (error);
  return text;
}

static LaminaCatalogue *
read_example (void)
{
  gsize length;
  g_autofree char *text = example_text (&length);
  g_autoptr(GError) error = NULL;
  LaminaCatalogue *catalogue = lamina_catalogue_read_memory (text, length, "jobs.xml", &error);

  g_assert_no_error (error);
  return catalogue;
}

static void
test_read (void)
{
  g_autoptr(LaminaCatalogue) c = read_example ();
  LaminaTargetSet *set;
  const LaminaTarget *t;
  LaminaJob *job;
  LaminaJobEntry *e;

  g_assert_cmpuint (c->target_sets->len, ==, 1);
  set = lamina_catalogue_find_target_set (c, "invented");
  g_assert_cmpstr (set->name, ==, "Invented table");
  g_assert_cmpstr (set->source, ==, "invented for a test");
  g_assert_cmpstr (set->notes, ==, "No regulation's values.");
  t = lamina_target_set_find (set, "external-wall");
  g_assert_cmpfloat (t->max_u, ==, 0.2);
  g_assert_cmpint (t->element, ==, LAMINA_ELEMENT_WALL);
  g_assert_cmpstr (t->label, ==, "External wall");
  t = lamina_target_set_find (set, "roof");
  g_assert_cmpfloat (t->min_frsi, ==, 0.7);
  g_assert_cmpint (t->moisture, ==, LAMINA_MOISTURE_NO_ACCUMULATION);
  g_assert_cmpint (t->element, ==, -1);
  g_assert_true (lamina_target_set_find (set, "floor-ground")->ground);

  job = lamina_catalogue_find_job (c, "j-01");
  g_assert_nonnull (job);
  g_assert_cmpstr (job->number, ==, "2026-014");
  g_assert_cmpstr (job->client, ==, "M. Client");
  g_assert_cmpstr (job->architect, ==, "A. Architect");
  g_assert_cmpstr (job->site, ==, "Hill road 3");
  g_assert_cmpint (job->status, ==, LAMINA_JOB_STATUS_SUBMITTED);
  g_assert_cmpstr (job->target_set, ==, "invented");
  g_assert_cmpstr (job->climate, ==, "inland");
  g_assert_cmpfloat (job->inside_temperature, ==, 21);
  g_assert_cmpfloat (job->outside_temperature, ==, -12);
  g_assert_cmpfloat (lamina_job_get_b_prime (job), ==, 5);
  g_assert_cmpuint (job->entries->len, ==, 2);
  e = lamina_job_find_entry (job, 1);
  g_assert_cmpstr (e->construction, ==, "w150");
  g_assert_cmpint (e->revision, ==, 2);
  g_assert_cmpfloat (e->area, ==, 120.5);
  g_assert_cmpstr (e->location, ==, "North & east elevations");
  e = lamina_job_find_entry (job, 3);
  g_assert_true (lamina_job_entry_is_variant (e));
  g_assert_cmpstr (e->origin, ==, "w150");
  g_assert_true (isnan (e->area));
  g_assert_cmpuint (job->junctions->len, ==, 1);
  g_assert_cmpuint (job->log->len, ==, 1);
  g_assert_cmpstr (((LaminaJobEvent *) job->log->pdata[0])->by, ==, "A. Architect");
}

/* Written and read back, every value is the same, and the writer keeps
 * the order: materials, target sets, constructions, jobs. */
static void
test_round_trip (void)
{
  g_autoptr(LaminaCatalogue) c = read_example ();
  g_autoptr(LaminaCatalogue) back = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  g_autofree char *again = NULL;
  gsize length;

  lamina_job_add_junction (c->jobs->pdata[0], lamina_job_junction_new ("sill <1>", -0.01, 12));
  text = lamina_catalogue_write_to_string (c, LAMINA_WRITE_DEFAULT, &length, &error);
  g_assert_no_error (error);
  g_assert_true (strstr (text, "<material") < strstr (text, "<target-set"));
  g_assert_true (strstr (text, "<target-set") < strstr (text, "<construction"));
  g_assert_true (strstr (text, "</construction>") < strstr (text, "<job"));
  back = lamina_catalogue_read_memory (text, length, "back.xml", &error);
  g_assert_no_error (error);
  g_assert_true (lamina_target_set_equal (back->target_sets->pdata[0], c->target_sets->pdata[0]));
  g_assert_true (lamina_job_equal (back->jobs->pdata[0], c->jobs->pdata[0]));
  g_assert_cmpuint (((LaminaJob *) back->jobs->pdata[0])->log->len, ==, 1);
  again = lamina_catalogue_write_to_string (back, LAMINA_WRITE_DEFAULT, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (again, ==, text);
}

/* Bad input names the file and line (table-driven); nothing is returned. */
static void
test_refusals (void)
{
  static const struct { const char *from, *to, *expect; } cases[] = {
    { "max-u=\"0.18\"", "max-u=\"0\"", "jobs.xml:13: target set “invented”, use “roof”: max-u=0" },
    { "max-u=\"0.18\"", "max-u=\"abc\"", "jobs.xml:13:" },
    { "use=\"roof\"", "use=\"external-wall\"", "jobs.xml:13: target set “invented”: the use “external-wall” is given twice" },
    { "area=\"120.5\"", "area=\"-3\"", "jobs.xml:27: job “j-01”, entry 1: area=-3" },
    { "entry n=\"3\"", "entry n=\"1\"", "jobs.xml:31: job “j-01”: entry number 1 is not unique" },
    { "origin-revision=\"2\"", "", "jobs.xml:31: job “j-01”, entry 3: a variant names both" },
    { "psi=\"0.05\"", "psi=\"50\"", "jobs.xml:32: job “j-01”, junction 1: ψ=50" },
    { "outside-temperature=\"-12\"", "outside-temperature=\"-120\"", "jobs.xml:24: job “j-01”: the design temperatures" },
    { "status=\"submitted\"", "status=\"finished\"", "jobs.xml:24:" },
    { "<job id=\"j-01\"", "<target-set id=\"invented\" name=\"x\"/><job id=\"j-01\"", "target set id “invented” is used twice" },
  };
  gsize length;
  g_autofree char *text = example_text (&length);

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(GString) bad = g_string_new (text);
      g_autoptr(GError) error = NULL;
      g_autoptr(LaminaCatalogue) c = NULL;

      g_assert_cmpuint (g_string_replace (bad, cases[i].from, cases[i].to, 1), ==, 1);
      c = lamina_catalogue_read_memory (bad->str, bad->len, "jobs.xml", &error);
      g_assert_null (c);
      g_assert_nonnull (error);
      if (strstr (error->message, cases[i].expect) == NULL)
        g_error ("case %u: “%s” does not contain “%s”", i, error->message, cases[i].expect);
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/exchange/jobs/read", test_read);
  g_test_add_func ("/exchange/jobs/round-trip", test_round_trip);
  g_test_add_func ("/exchange/jobs/refusals", test_refusals);
  return g_test_run ();
}
