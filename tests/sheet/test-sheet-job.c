/* SPDX-License-Identifier: GPL-3.0-or-later */
/* A job's sheet set read back with poppler: the cover with the job's data,
 * the schedule with each entry's U, target, verdict and U·A and H_T equal
 * to the sum of U·A over the entries with an area (EN ISO 13789:2017 8.2,
 * H = Σ A·U; from memory), then one sheet per construction with the job's
 * band (job, number, client, the entry's use).  The targets are invented
 * for the test. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib/gstdio.h>
#include <locale.h>
#include <math.h>
#include <poppler.h>
#include <stdio.h>
#include <string.h>

#include "lamina-sheet.h"
#include "lamina-test-constructions.h"

G_DEFINE_AUTOPTR_CLEANUP_FUNC (PopplerPage, g_object_unref)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (PopplerDocument, g_object_unref)

static char *
dup_page_text (PopplerDocument *doc,
               int              index)
{
  g_autoptr(PopplerPage) page = poppler_document_get_page (doc, index);
  g_autofree char *text = poppler_page_get_text (page);
  g_auto(GStrv) words = g_strsplit_set (text, " \n\t\r", -1);
  GString *out = g_string_new (NULL);

  for (guint i = 0; words[i]; i++)
    if (*words[i])
      g_string_append_printf (out, "%s%s", out->len ? " " : "", words[i]);
  return g_string_free (out, FALSE);
}

static void
assert_contains (const char *text,
                 const char *what,
                 const char *where)
{
  if (strstr (text, what) == NULL)
    g_error ("%s: “%s” not found in: %s", where, what, text);
}

typedef struct
{
  LaminaJob          *job;
  LaminaTargetSet    *targets;
  GPtrArray          *constructions;  /* owned */
  GPtrArray          *results;        /* owned */
  LaminaJobInput      inputs[4];
  LaminaJobCheck     *check;
} Fixture;

static void
fixture_set_up (Fixture *f)
{
  const char *uses[] = { "external-wall", "roof", "floor-ground", "external-wall" };
  const double areas[] = { 120.5, 80, NAN, 10 };
  LaminaConstruction *made[] = { lamina_test_masonry_wall (), lamina_test_flat_roof (),
                                 lamina_test_ground_floor (), NULL };

  memset (f, 0, sizeof *f);
  f->job = lamina_job_new ("j", "Test house by the mill");
  f->job->number = g_strdup ("T-204");
  f->job->client = g_strdup ("M. Client");
  f->job->architect = g_strdup ("A. Architect");
  f->job->status = LAMINA_JOB_STATUS_SUBMITTED;
  f->job->target_set = g_strdup ("invented");
  f->targets = lamina_target_set_new ("invented", "Invented test table");
  f->targets->source = g_strdup ("Made up for this test");
  lamina_target_set_add (f->targets, lamina_target_new ("external-wall", 0.25));
  ((LaminaTarget *) f->targets->targets->pdata[0])->moisture = LAMINA_MOISTURE_NO_CONDENSATION;
  lamina_target_set_add (f->targets, lamina_target_new ("roof", 0.10));
  ((LaminaTarget *) f->targets->targets->pdata[1])->min_frsi = 0.5;
  lamina_target_set_add (f->targets, lamina_target_new ("floor-ground", 0.30));
  f->constructions = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_construction_free);
  f->results = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_result_free);
  for (guint i = 0; i < G_N_ELEMENTS (uses); i++)
    {
      LaminaJobEntry *e = lamina_job_add_entry (f->job, lamina_job_entry_new (made[i] ? made[i]->id : "gone",
                                                                              1, uses[i]));

      e->area = areas[i];
      if (made[i] == NULL)
        {
          f->inputs[i].flags = LAMINA_ENTRY_MISSING;
          continue;
        }
      made[i]->inside_temperature = 21;
      g_ptr_array_add (f->constructions, made[i]);
      g_ptr_array_add (f->results, lamina_calculate (made[i], NULL));
      f->inputs[i].construction = made[i];
      f->inputs[i].result = f->results->pdata[f->results->len - 1];
    }
  f->check = lamina_job_check (f->job, f->targets, f->inputs, G_N_ELEMENTS (uses));
}

static void
fixture_tear_down (Fixture *f)
{
  lamina_job_check_free (f->check);
  g_ptr_array_unref (f->results);
  g_ptr_array_unref (f->constructions);
  lamina_target_set_free (f->targets);
  lamina_job_free (f->job);
}

static void
test_sheet_set (void)
{
  Fixture f;
  g_autofree char *dir = g_dir_make_tmp ("lamina-job-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "job.pdf", NULL);
  g_autofree char *uri = g_filename_to_uri (path, NULL, NULL);
  g_autoptr(PopplerDocument) doc = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *cover = NULL, *schedule = NULL;
  LaminaSheetOptions options;
  double h_t = 0;
  char expect[64];

  fixture_set_up (&f);
  lamina_sheet_options_init (&options);
  options.practice = "Tamberlin Oke Architects";
  options.printed = "2024-05-02";
  g_assert_true (lamina_sheet_write_job (path, FALSE, &options, f.job, f.targets, f.check, &error));
  g_assert_no_error (error);
  doc = poppler_document_new_from_file (uri, NULL, &error);
  g_assert_no_error (error);
  /* Cover, schedule, three sheets: the missing construction has none. */
  g_assert_cmpint (poppler_document_get_n_pages (doc), ==, 5);

  cover = dup_page_text (doc, 0);
  assert_contains (cover, "Test house by the mill", "cover");
  assert_contains (cover, "T-204", "cover");
  assert_contains (cover, "M. Client", "cover");
  assert_contains (cover, "A. Architect", "cover");
  assert_contains (cover, "2024-05-02", "cover");
  assert_contains (cover, "Submitted", "cover");
  assert_contains (cover, "Invented test table", "cover");
  /* The set's name, then its source, each once. */
  assert_contains (cover, "TARGETSInvented test table SOURCE OF TARGETSMade up for this test", "cover targets");
  g_assert_null (strstr (strstr (cover, "Made up for this test") + 1, "Made up for this test"));
  /* The count line agrees with the check, with numbers after their words
   * so that one entry reads as well as four. */
  g_snprintf (expect, sizeof expect, "4 entries: met %u, not met %u, without a target or figure %u",
              f.check->n_met, f.check->n_not_met, f.check->n_open);
  assert_contains (cover, expect, "cover count");

  schedule = dup_page_text (doc, 1);
  for (guint i = 0; i < f.constructions->len; i++)
    {
      const LaminaConstruction *c = f.constructions->pdata[i];
      const LaminaResult *r = f.results->pdata[i];

      assert_contains (schedule, c->code, "schedule");
      g_snprintf (expect, sizeof expect, "%.3f", r->u_corrected);
      assert_contains (schedule, expect, "schedule U");
      if (i < 2)
        h_t += r->u_corrected * (i == 0 ? 120.5 : 80);
    }
  /* The hand sum of U·A over the two entries with an area (the floor has
   * none; the missing entry has no U), to two decimals as printed. */
  g_snprintf (expect, sizeof expect, "%.2f", h_t);
  assert_contains (schedule, expect, "schedule H_T");
  g_assert_cmpfloat_with_epsilon (f.check->h_t, h_t, 1e-9);
  assert_contains (schedule, "fabric of the listed elements only", "schedule");
  assert_contains (schedule, "Revision 1 of “gone” is not in the library.", "schedule");
  /* The moisture criteria of the targets, pass or fail, under each entry:
   * the roof's fRsi = 1 − 0.25·U (EN ISO 13788:2012 clause 5, Rsi 0.25;
   * from memory) against the invented minimum 0.5; the wall's criterion
   * with no EN ISO 13788 assessment given is "not assessed". */
  g_snprintf (expect, sizeof expect, "fRsi %.3f, minimum 0.500: met",
              1 - 0.25 * ((LaminaJobLine *) f.check->lines->pdata[1])->u);
  assert_contains (schedule, expect, "schedule fRsi");
  assert_contains (schedule, "no interstitial condensation: not assessed", "schedule moisture");
  /* The flat roof does not meet the invented 0.10. */
  assert_contains (schedule, "NO", "schedule");
  /* The cautions every sheet carries (common practice), on the schedule
   * too: local code and licensed practice, the fabric of the listed
   * elements only, no thermal bridges but the ψ·l entries listed. */
  assert_contains (schedule, "Cautions.", "schedule cautions");
  assert_contains (schedule, "licensed professional practice", "schedule cautions");
  assert_contains (schedule, "the fabric of the listed elements only: it includes no thermal bridges "
                             "unless ψ·l entries are listed", "schedule cautions");

  for (int p = 2; p < 5; p++)
    {
      g_autofree char *text = dup_page_text (doc, p);
      const LaminaJobLine *line = f.check->lines->pdata[p - 2];

      assert_contains (text, "T-204 Test house by the mill", "sheet band");
      assert_contains (text, "Client: M. Client", "sheet band");
      assert_contains (text, line->entry->use, "sheet band");
      assert_contains (text, line->construction->code, "sheet");
      /* The job's design conditions: 21 °C inside. */
      assert_contains (text, "21.0 °C", "sheet conditions");
      /* The entry's EN ISO 13788 criteria as the schedule states them. */
      {
        g_autofree char *criteria = lamina_job_line_dup_criteria_text (line);

        if (criteria != NULL)
          {
            g_autofree char *sentence = g_strdup_printf ("The job's target for “%s”: %s",
                                                         line->entry->use, criteria);

            assert_contains (text, sentence, "sheet criteria");
          }
      }
    }
  g_unlink (path);
  g_rmdir (dir);
  fixture_tear_down (&f);
}

/* @c with a moisture check in an invented climate (μ: EN ISO 10456
 * Table 3 from memory, 10 for the masonry and 1 for the insulation). */
static void
add_moisture_check (LaminaConstruction *c)
{
  LaminaClimate *climate = lamina_climate_new ("test-site", "Test site (invented)");

  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      climate->temperature[m] = m < 3 || m > 9 ? -2 : 12;
      climate->humidity[m] = 0.85;
    }
  for (guint i = 0; i < c->layers->len; i++)
    {
      LaminaLayer *layer = c->layers->pdata[i];

      if (layer->material != NULL)
        layer->material->vapour_resistance_factor = layer->material->category == LAMINA_CATEGORY_INSULATION ? 1 : 10;
    }
  lamina_construction_set_moisture (c, lamina_moisture_settings_new ("test-site"));
  c->moisture->humidity_class = 3;
  c->moisture->climate_data = climate;
}

/* A job's sheet that continues on a moisture page carries the job's band
 * there too: a page of a job's set is never without its job. */
static void
test_continued_band (void)
{
  Fixture f;
  g_autofree char *dir = g_dir_make_tmp ("lamina-job-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "wall.pdf", NULL);
  g_autofree char *uri = g_filename_to_uri (path, NULL, NULL);
  g_autoptr(PopplerDocument) doc = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *second = NULL;
  LaminaSheetOptions options;

  fixture_set_up (&f);
  add_moisture_check (f.constructions->pdata[0]);
  lamina_sheet_options_init (&options);
  g_assert_true (lamina_sheet_write_job_entry (path, FALSE, &options, f.job, f.check->lines->pdata[0], &error));
  g_assert_no_error (error);
  doc = poppler_document_new_from_file (uri, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpint (poppler_document_get_n_pages (doc), ==, 2);
  second = dup_page_text (doc, 1);
  assert_contains (second, "moisture, EN ISO 13788", "moisture page");
  assert_contains (second, "T-204 Test house by the mill", "moisture page band");
  assert_contains (second, "Use: external-wall", "moisture page band");
  g_unlink (path);
  g_rmdir (dir);
  fixture_tear_down (&f);
}

/* One entry's sheet from the window is the set's sheet of that entry:
 * the band, the job's conditions, the comparison with the use's target
 * and the EN ISO 13788 criteria line, from one function. */
static void
test_entry_sheet (void)
{
  Fixture f;
  g_autofree char *dir = g_dir_make_tmp ("lamina-job-XXXXXX", NULL);
  g_autofree char *set_path = g_build_filename (dir, "set.pdf", NULL);
  g_autofree char *one_path = g_build_filename (dir, "one.pdf", NULL);
  g_autofree char *set_uri = g_filename_to_uri (set_path, NULL, NULL);
  g_autofree char *one_uri = g_filename_to_uri (one_path, NULL, NULL);
  g_autoptr(PopplerDocument) set = NULL;
  g_autoptr(PopplerDocument) one = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *in_set = NULL, *alone = NULL, *criteria = NULL;
  const LaminaJobLine *roof;
  LaminaSheetOptions options;

  fixture_set_up (&f);
  roof = f.check->lines->pdata[1];
  lamina_sheet_options_init (&options);
  options.printed = "2024-05-02";
  g_assert_true (lamina_sheet_write_job (set_path, FALSE, &options, f.job, f.targets, f.check, &error));
  g_assert_true (lamina_sheet_write_job_entry (one_path, FALSE, &options, f.job, roof, &error));
  g_assert_no_error (error);
  set = poppler_document_new_from_file (set_uri, NULL, &error);
  one = poppler_document_new_from_file (one_uri, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpint (poppler_document_get_n_pages (one), ==, 1);
  in_set = dup_page_text (set, 3);
  alone = dup_page_text (one, 0);
  criteria = lamina_job_line_dup_criteria_text (roof);
  g_assert_nonnull (criteria);
  for (guint i = 0; i < 2; i++)
    {
      const char *text = i == 0 ? in_set : alone;

      assert_contains (text, "T-204 Test house by the mill", "band");
      assert_contains (text, "Client: M. Client · Use: roof", "band");
      assert_contains (text, criteria, "criteria");
      assert_contains (text, "21.0 °C", "conditions");
    }
  g_unlink (set_path);
  g_unlink (one_path);
  g_rmdir (dir);
  fixture_tear_down (&f);
}

int
main (int    argc,
      char **argv)
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/sheet/job/sheet-set", test_sheet_set);
  g_test_add_func ("/sheet/job/entry-sheet", test_entry_sheet);
  g_test_add_func ("/sheet/job/continued-band", test_continued_band);
  return g_test_run ();
}
