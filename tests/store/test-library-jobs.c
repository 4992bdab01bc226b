/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Jobs and target sets in the library: an entry pins the approved
 * revision by default, the check uses each pinned revision's U (the
 * stored figure of EN ISO 6946) and sums U·A to H_T, a newer approved
 * revision or changed material data is flagged, moving an entry is an
 * explicit act recorded in the job's log, the library names the jobs that
 * use a construction, and jobs travel through export and import.  The
 * target values are invented for the test. */
#include "lamina-store-test-util.h"

#include "lamina-sqlite-private.h"
#include "lamina-moisture.h"

#include <math.h>

static LaminaLibrary *
open_at (const char *name)
{
  g_autofree char *path = test_library_location (name);
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);

  g_assert_no_error (error);
  return library;
}

static char *
create_approved_wall (LaminaLibrary *library,
                      const char    *code,
                      double         mm)
{
  g_autoptr(LaminaConstruction) c = test_make_wall (library, code, code, NULL, mm);
  g_autoptr(GError) error = NULL;
  char *id = lamina_library_create_construction (library, c, "A. Planner", &error);

  g_assert_no_error (error);
  g_assert_true (lamina_library_mark_checked (library, id, 0, "C. Checker", &error));
  g_assert_true (lamina_library_approve (library, id, 0, "D. Director", "2099-05-04", &error));
  g_assert_no_error (error);
  return id;
}

static void
put_targets (LaminaLibrary *library)
{
  g_autoptr(LaminaTargetSet) set = lamina_target_set_new ("invented", "Invented table");
  g_autoptr(GError) error = NULL;

  set->source = g_strdup ("invented for a test; no regulation's values");
  lamina_target_set_add (set, lamina_target_new ("external-wall", 0.30));
  lamina_target_set_add (set, lamina_target_new ("wall-unheated", 0.20));
  g_assert_true (lamina_library_put_target_set (library, set, &error));
  g_assert_no_error (error);
}

static LaminaJobEntry *
pin (LaminaLibrary *library,
     LaminaJob     *job,
     const char    *id,
     const char    *use,
     double         area)
{
  g_autoptr(GError) error = NULL;
  gboolean approved = FALSE;
  int revision = lamina_library_pick_revision (library, id, 0, &approved, &error);
  LaminaJobEntry *e;

  g_assert_no_error (error);
  e = lamina_job_add_entry (job, lamina_job_entry_new (id, revision, use));
  e->area = area;
  return e;
}

static double
stored_u (LaminaLibrary *library,
          const char    *id,
          int            revision)
{
  g_autoptr(LaminaResult) r = lamina_library_dup_result (library, id, revision, NULL);

  g_assert_nonnull (r);
  return r->u_corrected;
}

/* H_T = Σ U·A over the entries with an area (EN ISO 13789:2017 8.2, from
 * memory); the U of each is the stored EN ISO 6946 figure of its pinned
 * revision.  Two walls, 100 m² and 40 m², the 145 mm wall against both
 * uses: met for 0.30, not met for the invented 0.20. */
static void
test_check_and_h_t (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("jobs.sqlite");
  g_autofree char *a = create_approved_wall (library, "EW-145", 145);
  g_autofree char *b = create_approved_wall (library, "EW-195", 195);
  g_autoptr(LaminaJob) job = lamina_job_new ("j1", "Test house");
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(GError) error = NULL;
  double ua, ub;
  const LaminaJobLine *line;

  put_targets (library);
  job->target_set = g_strdup ("invented");
  pin (library, job, a, "external-wall", 100);
  pin (library, job, b, "external-wall", 40);
  pin (library, job, a, "wall-unheated", NAN);
  g_assert_true (lamina_library_create_job (library, job, &error));
  g_assert_no_error (error);
  g_assert_false (lamina_library_create_job (library, job, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS);
  g_clear_error (&error);

  report = lamina_library_check_job (library, "j1", &error);
  g_assert_no_error (error);
  ua = stored_u (library, a, 1);
  ub = stored_u (library, b, 1);
  g_assert_cmpfloat (ua, >, 0.20);
  g_assert_cmpfloat (ua, <, 0.30);
  line = report->check->lines->pdata[0];
  g_assert_cmpfloat_with_epsilon (line->u, ua, 1e-12);
  g_assert_cmpint (line->verdict, ==, LAMINA_VERDICT_MET);
  g_assert_cmpint (line->flags, ==, LAMINA_ENTRY_NONE);
  line = report->check->lines->pdata[2];
  g_assert_cmpint (line->verdict, ==, LAMINA_VERDICT_NOT_MET);
  g_assert_cmpfloat_with_epsilon (report->check->h_t, ua * 100 + ub * 40, 1e-9);
  g_assert_cmpfloat_with_epsilon (report->check->kinds[LAMINA_ELEMENT_WALL].mean_u,
                                  (ua * 100 + ub * 40) / 140, 1e-12);
}

/* Pinning and moving: an entry takes the approved revision while a newer
 * draft exists; once a newer revision is approved the entry is flagged
 * and stays put until the user moves it, which the log records. */
static void
test_pin_and_move (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("pins.sqlite");
  g_autofree char *a = create_approved_wall (library, "EW-145", 145);
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, a, 0, NULL);
  g_autoptr(LaminaJob) job = lamina_job_new ("j2", "Pins");
  g_autoptr(LaminaJob) stored = NULL;
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(GPtrArray) uses = NULL;
  g_autoptr(GError) error = NULL;
  const LaminaJobLine *line;
  const LaminaJobEvent *event;
  gboolean approved = FALSE;

  ((LaminaLayer *) c->layers->pdata[1])->thickness = 195;
  g_assert_true (lamina_library_save_construction (library, c, 1, "A. Planner", &error));
  g_assert_cmpint (lamina_library_pick_revision (library, a, 0, &approved, NULL), ==, 1);
  g_assert_true (approved);
  g_assert_cmpint (lamina_library_pick_revision (library, a, 2, &approved, NULL), ==, 2);
  g_assert_false (approved);
  g_assert_cmpint (lamina_library_pick_revision (library, a, 7, NULL, &error), ==, 0);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);

  pin (library, job, a, "external-wall", 10);
  g_assert_true (lamina_library_create_job (library, job, &error));
  g_assert_true (lamina_library_mark_checked (library, a, 2, "C. Checker", NULL));
  g_assert_true (lamina_library_approve (library, a, 2, "D. Director", NULL, NULL));

  report = lamina_library_check_job (library, "j2", &error);
  line = report->check->lines->pdata[0];
  g_assert_cmpint (line->entry->revision, ==, 1);
  g_assert_true (line->flags & LAMINA_ENTRY_NEWER_APPROVED);
  g_assert_cmpint (line->newer_revision, ==, 2);
  g_clear_pointer (&report, lamina_job_report_free);

  g_assert_true (lamina_library_move_job_entry (library, "j2", 1, 0, "A. Architect", &error));
  g_assert_no_error (error);
  stored = lamina_library_dup_job (library, "j2", &error);
  g_assert_cmpint (lamina_job_find_entry (stored, 1)->revision, ==, 2);
  event = stored->log->pdata[stored->log->len - 1];
  g_assert_cmpstr (event->by, ==, "A. Architect");
  g_assert_nonnull (strstr (event->text, "revision 1 to revision 2"));
  report = lamina_library_check_job (library, "j2", &error);
  line = report->check->lines->pdata[0];
  g_assert_false (line->flags & LAMINA_ENTRY_NEWER_APPROVED);
  g_assert_cmpfloat_with_epsilon (line->u, stored_u (library, a, 2), 1e-12);

  uses = lamina_library_list_job_uses (library, a, &error);
  g_assert_cmpuint (uses->len, ==, 1);
  g_assert_cmpstr (((LaminaJobUse *) uses->pdata[0])->job_id, ==, "j2");
  g_assert_cmpint (((LaminaJobUse *) uses->pdata[0])->revision, ==, 2);
  g_assert_false (lamina_library_move_job_entry (library, "j2", 5, 0, NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
}

/* A library material changed after the pinned revision was checked: the
 * entry says so, and its U stays the pinned revision's. */
static void
test_material_changed (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("material.sqlite");
  g_autofree char *a = create_approved_wall (library, "EW-145", 145);
  g_autoptr(LaminaMaterial) wool = lamina_library_dup_material (library, "typical-mineral-wool-035", NULL);
  g_autoptr(LaminaJob) job = lamina_job_new ("j3", "Material");
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(GError) error = NULL;
  const LaminaJobLine *line;

  pin (library, job, a, "external-wall", 10);
  g_assert_true (lamina_library_create_job (library, job, &error));
  wool->conductivity = 0.040;
  g_assert_true (lamina_library_put_material (library, wool, &error));
  report = lamina_library_check_job (library, "j3", &error);
  line = report->check->lines->pdata[0];
  g_assert_true (line->flags & LAMINA_ENTRY_MATERIAL_CHANGED);
  g_assert_cmpfloat_with_epsilon (line->u, stored_u (library, a, 1), 1e-12);
  /* No target set: nothing is met or failed. */
  g_assert_cmpint (line->verdict, ==, LAMINA_VERDICT_NO_TARGET);
}

/* Refusals name what is wrong and write nothing. */
static void
test_refusals (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("refuse.sqlite");
  g_autofree char *a = create_approved_wall (library, "EW-145", 145);
  g_autoptr(LaminaJob) job = lamina_job_new ("j4", "Refusals");
  g_autoptr(LaminaJob) nope = lamina_job_new ("nope", "N");
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) jobs = NULL;

  put_targets (library);
  job->target_set = g_strdup ("invented");
  pin (library, job, a, "roof", 10);
  g_assert_false (lamina_library_create_job (library, job, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "the use “roof” is not in the target set “invented” "
                                            "(its uses: external-wall, wall-unheated)"));
  g_clear_error (&error);
  jobs = lamina_library_list_jobs (library, &error);
  g_assert_cmpuint (jobs->len, ==, 0);
  g_free (((LaminaJobEntry *) job->entries->pdata[0])->use);
  ((LaminaJobEntry *) job->entries->pdata[0])->use = g_strdup ("external-wall");
  g_assert_true (lamina_library_create_job (library, job, &error));
  g_assert_false (lamina_library_delete_target_set (library, "invented", &error));
  g_assert_nonnull (strstr (error->message, "the job “j4” uses the target set"));
  g_clear_error (&error);
  g_assert_false (lamina_library_save_job (library, nope, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);
  g_assert_true (lamina_library_delete_job (library, "j4", &error));
  g_assert_true (lamina_library_delete_target_set (library, "invented", &error));
  g_assert_no_error (error);
}

/* The whole library exported and imported into an empty one: target sets
 * and jobs arrive with entries pinned to the revisions the import stored;
 * a second import changes nothing.  An entry whose construction is
 * neither in the document nor in the library stops the whole import. */
static void
test_exchange (void)
{
  g_autoptr(LaminaLibrary) a = open_at ("from.sqlite");
  g_autoptr(LaminaLibrary) b = open_at ("to.sqlite");
  g_autofree char *id = create_approved_wall (a, "EW-145", 145);
  g_autoptr(LaminaJob) job = lamina_job_new ("j5", "Exchange");
  g_autoptr(LaminaCatalogue) cat = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaJob) back = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) jobs = NULL;
  g_autoptr(LaminaJobReport) check = NULL;

  put_targets (a);
  job->target_set = g_strdup ("invented");
  job->client = g_strdup ("M. Client");
  pin (a, job, id, "external-wall", 55);
  lamina_job_add_junction (job, lamina_job_junction_new ("eaves", 0.05, 20));
  g_assert_true (lamina_library_create_job (a, job, &error));
  cat = lamina_library_export (a, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (cat->jobs->len, ==, 1);
  g_assert_cmpuint (cat->target_sets->len, ==, 1);

  report = lamina_library_import (b, cat, LAMINA_IMPORT_DEFAULT, "I. Importer", &error);
  g_assert_no_error (error);
  back = lamina_library_dup_job (b, "j5", &error);
  g_assert_no_error (error);
  g_assert_cmpstr (back->client, ==, "M. Client");
  g_assert_cmpuint (back->junctions->len, ==, 1);
  check = lamina_library_check_job (b, "j5", &error);
  g_assert_no_error (error);
  g_assert_nonnull (((LaminaJobLine *) check->check->lines->pdata[0])->construction);
  g_clear_pointer (&report, lamina_import_report_free);
  report = lamina_library_import (b, cat, LAMINA_IMPORT_DEFAULT, "I. Importer", &error);
  g_assert_no_error (error);
  for (guint i = 0; i < report->items->len; i++)
    g_assert_cmpint (((LaminaImportItem *) report->items->pdata[i])->action, ==,
                     LAMINA_IMPORT_SKIPPED);

  g_free (((LaminaJobEntry *) ((LaminaJob *) cat->jobs->pdata[0])->entries->pdata[0])->construction);
  ((LaminaJobEntry *) ((LaminaJob *) cat->jobs->pdata[0])->entries->pdata[0])->construction =
    g_strdup ("elsewhere");
  g_clear_pointer (&report, lamina_import_report_free);
  g_free (((LaminaJob *) cat->jobs->pdata[0])->name);
  ((LaminaJob *) cat->jobs->pdata[0])->name = g_strdup ("Changed");
  report = lamina_library_import (b, cat, LAMINA_IMPORT_DEFAULT, NULL, &error);
  g_assert_null (report);
  g_assert_nonnull (strstr (error->message, "“elsewhere” is neither in the document nor in the library"));
  g_clear_pointer (&back, lamina_job_free);
  back = lamina_library_dup_job (b, "j5", NULL);
  g_assert_cmpstr (back->name, ==, "Exchange");
  jobs = lamina_library_list_jobs (b, NULL);
  g_assert_cmpuint (jobs->len, ==, 1);
}

/* A version 3 library migrates to version 4 with empty job tables. */
static void
test_migration (void)
{
  g_autofree char *path = test_library_path ("v3.sqlite");
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GPtrArray) jobs = NULL;

  g_assert_true (lamina_sqlite_create_at_version (path, 3, &error));
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  g_assert_cmpint (lamina_library_get_opened_version (library), ==, 3);
  jobs = lamina_library_list_jobs (library, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (jobs->len, ==, 0);
  put_targets (library);
}

/* The job's climate: it must be one of the library's (the field is named
 * when not); each entry whose use asks a moisture criterion is assessed by
 * EN ISO 13788 in it (the same figures as lamina_moisture_calculate on the
 * pinned revision in that climate); a change of the climate data a pinned
 * revision was checked with is flagged like a material change.  The
 * seeded wall (no vapour control layer) at humidity class 4 keeps water
 * through the year in a −8 °C winter and stays dry in a +6 °C one
 * (common practice: a cold wall without a vapour control layer collects
 * condensate; the monthly balance is clause 7). */
static void
test_climate_and_moisture (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("climate.sqlite");
  g_autoptr(LaminaClimate) cold = test_make_climate ("cold", -8);
  g_autoptr(LaminaClimate) mild = test_make_climate ("mild", 6);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaConstruction) stored = NULL;
  g_autoptr(LaminaTargetSet) set = lamina_target_set_new ("wet", "Invented moisture table");
  g_autoptr(LaminaJob) job = lamina_job_new ("j6", "Climate");
  g_autoptr(LaminaJobReport) report = NULL;
  g_autoptr(LaminaMoistureResult) expected = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  LaminaTarget *t = lamina_target_new ("external-wall", 0.50);
  const LaminaJobLine *line;

  g_assert_true (lamina_library_put_climate (library, cold, NULL));
  g_assert_true (lamina_library_put_climate (library, mild, NULL));
  c = test_make_wall (library, "EW-M", "Wall with moisture check", NULL, 145);
  lamina_construction_set_moisture (c, lamina_moisture_settings_new ("mild"));
  c->moisture->humidity_class = 4;
  id = lamina_library_create_construction (library, c, "tester", &error);
  g_assert_no_error (error);
  t->moisture = LAMINA_MOISTURE_NO_ACCUMULATION;
  lamina_target_set_add (set, t);
  g_assert_true (lamina_library_put_target_set (library, set, &error));
  job->target_set = g_strdup ("wet");
  pin (library, job, id, "external-wall", 20);

  /* an unknown climate is refused, naming the field and the climates */
  job->climate = g_strdup ("nowhere");
  g_assert_false (lamina_library_create_job (library, job, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "job “j6”, climate: there is no climate “nowhere” "
                                            "in the library (its climates: cold, mild)"));
  g_clear_error (&error);

  /* in the job's cold climate: assessed, condensate left, not met */
  g_free (job->climate);
  job->climate = g_strdup ("cold");
  g_assert_true (lamina_library_create_job (library, job, &error));
  report = lamina_library_check_job (library, "j6", &error);
  g_assert_no_error (error);
  g_assert_false (report->climate_unknown);
  line = report->check->lines->pdata[0];
  g_assert_nonnull (line->moisture);
  stored = lamina_construction_copy (report->constructions->pdata[0]);
  g_free (stored->moisture->climate);
  stored->moisture->climate = g_strdup ("cold");
  expected = lamina_moisture_calculate (stored, cold, NAN, &error);
  g_assert_no_error (error);
  g_assert_false (expected->dries_out);
  g_assert_cmpfloat (line->moisture->max_accumulation, ==, expected->max_accumulation);
  g_assert_cmpint (line->moisture_verdict, ==, LAMINA_VERDICT_NOT_MET);
  g_assert_cmpint (line->verdict, ==, LAMINA_VERDICT_NOT_MET);
  g_assert_true (line->flags & LAMINA_ENTRY_MOISTURE_NOT_MET);
  g_assert_false (line->flags & LAMINA_ENTRY_CLIMATE_CHANGED);
  /* The construction the sheets print carries the job's climate, so its
   * own moisture check is the schedule's. */
  {
    const LaminaConstruction *printed = report->constructions->pdata[0];
    g_autoptr(LaminaMoistureResult) own = lamina_moisture_calculate_own (printed, NAN, &error);

    g_assert_cmpstr (printed->moisture->climate, ==, "cold");
    g_assert_no_error (error);
    g_assert_cmpfloat (own->max_accumulation, ==, line->moisture->max_accumulation);
  }

  /* in the mild climate (the job's climate changed): met */
  g_free (job->climate);
  job->climate = g_strdup ("mild");
  g_assert_true (lamina_library_save_job (library, job, &error));
  g_clear_pointer (&report, lamina_job_report_free);
  report = lamina_library_check_job (library, "j6", &error);
  line = report->check->lines->pdata[0];
  g_assert_true (line->moisture->dries_out);
  g_assert_cmpint (line->moisture_verdict, ==, LAMINA_VERDICT_MET);
  g_assert_cmpint (line->verdict, ==, LAMINA_VERDICT_MET);

  /* the library's data of "mild", which the revision was checked with,
   * change: flagged, with a note */
  mild->temperature[0] = 5;
  g_assert_true (lamina_library_put_climate (library, mild, &error));
  g_clear_pointer (&report, lamina_job_report_free);
  report = lamina_library_check_job (library, "j6", &error);
  line = report->check->lines->pdata[0];
  g_assert_true (line->flags & LAMINA_ENTRY_CLIMATE_CHANGED);
  g_assert_cmpstr (line->notes->pdata[line->notes->len - 1], ==,
                   "Library climate data changed since this revision was checked.");
}

/* A job naming a climate neither the document nor the library holds stops
 * the whole import, with the job's line. */
static void
test_import_unknown_climate (void)
{
  g_autoptr(LaminaLibrary) a = open_at ("climate-from.sqlite");
  g_autoptr(LaminaLibrary) b = open_at ("climate-to.sqlite");
  g_autoptr(LaminaClimate) cold = test_make_climate ("cold", -8);
  g_autofree char *id = create_approved_wall (a, "EW-145", 145);
  g_autoptr(LaminaJob) job = lamina_job_new ("j7", "Import");
  g_autoptr(LaminaCatalogue) cat = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(GPtrArray) jobs = NULL;
  g_autoptr(GError) error = NULL;
  LaminaJob *carried;

  g_assert_true (lamina_library_put_climate (a, cold, NULL));
  job->climate = g_strdup ("cold");
  pin (a, job, id, "external-wall", 10);
  g_assert_true (lamina_library_create_job (a, job, &error));
  cat = lamina_library_export (a, NULL, &error);
  g_assert_no_error (error);
  carried = cat->jobs->pdata[0];
  carried->line = 42;
  g_free (carried->climate);
  carried->climate = g_strdup ("elsewhere");
  report = lamina_library_import (b, cat, LAMINA_IMPORT_DEFAULT, NULL, &error);
  g_assert_null (report);
  g_assert_nonnull (strstr (error->message, "line 42: job “j7”, climate: there is no climate “elsewhere”"));
  jobs = lamina_library_list_jobs (b, NULL);
  g_assert_cmpuint (jobs->len, ==, 0);
  /* the document's own climate is known to its jobs */
  g_free (carried->climate);
  carried->climate = g_strdup ("cold");
  g_clear_error (&error);
  report = lamina_library_import (b, cat, LAMINA_IMPORT_DEFAULT, NULL, &error);
  g_assert_no_error (error);
}

/* A job variant copies the revision the entry pins (the approved one),
 * not the latest draft: its layers are revision 1's. */
static void
test_job_variant_revision (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("variant.sqlite");
  g_autofree char *id = create_approved_wall (library, "EW-145", 145);
  g_autoptr(LaminaConstruction) draft = lamina_library_dup_construction (library, id, 0, NULL);
  g_autoptr(LaminaConstruction) variant = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *copy = NULL;

  ((LaminaLayer *) draft->layers->pdata[1])->thickness = 195;
  g_assert_true (lamina_library_save_construction (library, draft, 1, NULL, &error));
  g_assert_cmpint (draft->revision, ==, 2);
  copy = lamina_library_derive_job_variant (library, id, 1, "Test house", NULL, &error);
  g_assert_no_error (error);
  variant = lamina_library_dup_construction (library, copy, 0, &error);
  g_assert_cmpint (variant->revision, ==, 1);
  g_assert_cmpint (variant->status, ==, LAMINA_STATUS_DRAFT);
  g_assert_null (variant->code);
  g_assert_cmpstr (variant->name, ==, "EW-145 (variant for Test house)");
  g_assert_cmpfloat (((LaminaLayer *) variant->layers->pdata[1])->thickness, ==, 145);
}

/* Deleting a job removes it and its schedule, so the library no longer
 * names it among the jobs that use a construction; the constructions and
 * the other job stay; deleting it again is NOT_FOUND.  On either backend
 * (the -pg run of this program). */
static void
test_delete (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("delete.sqlite");
  g_autofree char *a = create_approved_wall (library, "EW-145", 145);
  g_autoptr(LaminaJob) doomed = lamina_job_new ("j6", "Doomed");
  g_autoptr(LaminaJob) kept = lamina_job_new ("j7", "Kept");
  g_autoptr(LaminaJob) gone = NULL;
  g_autoptr(GPtrArray) uses = NULL;
  g_autoptr(GPtrArray) jobs = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(GError) error = NULL;

  pin (library, doomed, a, "external-wall", 10);
  pin (library, doomed, a, "external-wall", 20);
  pin (library, kept, a, "external-wall", 5);
  g_assert_true (lamina_library_create_job (library, doomed, &error));
  g_assert_true (lamina_library_create_job (library, kept, &error));
  g_assert_no_error (error);
  uses = lamina_library_list_job_uses (library, a, &error);
  g_assert_cmpuint (uses->len, ==, 3);
  g_clear_pointer (&uses, g_ptr_array_unref);

  g_assert_true (lamina_library_delete_job (library, "j6", &error));
  g_assert_no_error (error);
  gone = lamina_library_dup_job (library, "j6", &error);
  g_assert_null (gone);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);
  uses = lamina_library_list_job_uses (library, a, &error);
  g_assert_cmpuint (uses->len, ==, 1);
  g_assert_cmpstr (((LaminaJobUse *) uses->pdata[0])->job_id, ==, "j7");
  jobs = lamina_library_list_jobs (library, &error);
  g_assert_cmpuint (jobs->len, ==, 1);
  c = lamina_library_dup_construction (library, a, 0, &error);
  g_assert_no_error (error);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_false (lamina_library_delete_job (library, "j6", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
}

/* A job is named by its id or its job number; a text that is one job's
 * id and another's number, or the number of two jobs, is refused with
 * both named. */
static void
test_find_by_number (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("numbers.sqlite");
  static const struct { const char *id, *number, *name; } jobs[] = {
    { "school", "TO-2402", "School" },
    { "houses", "TO-2401", "Houses" },
    { "TO-2402", NULL, "Annex named by the school's number" },
    { "shed", "TO-7", "Shed" },
    { "barn", "to-7", "Barn" },
  };
  static const struct { const char *key, *id, *message[3]; } cases[] = {
    { "houses", "houses", { NULL } },
    { "TO-2401", "houses", { NULL } },
    { "to-2401", "houses", { NULL } },
    { "school", "school", { NULL } },
    { "TO-2402", NULL, { "the id of the job “TO-2402”", "the job number of the job “school” (TO-2402, School)" } },
    { "TO-7", NULL, { "the job number of 2 jobs", "“shed”", "“barn”" } },
    { "TO-9", NULL, { "no job “TO-9”" } },
  };
  g_autoptr(GError) error = NULL;

  for (guint i = 0; i < G_N_ELEMENTS (jobs); i++)
    {
      g_autoptr(LaminaJob) job = lamina_job_new (jobs[i].id, jobs[i].name);

      job->number = g_strdup (jobs[i].number);
      g_assert_true (lamina_library_create_job (library, job, &error));
      g_assert_no_error (error);
    }
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *id = lamina_library_dup_job_id (library, cases[i].key, &error);

      g_assert_cmpstr (id, ==, cases[i].id);
      if (cases[i].id != NULL)
        {
          g_assert_no_error (error);
          continue;
        }
      g_assert_nonnull (error);
      for (guint k = 0; k < G_N_ELEMENTS (cases[i].message) && cases[i].message[k] != NULL; k++)
        if (strstr (error->message, cases[i].message[k]) == NULL)
          g_error ("case %u: “%s” does not say “%s”", i, error->message, cases[i].message[k]);
      g_clear_error (&error);
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/store/jobs/check-and-h-t", test_check_and_h_t);
  g_test_add_func ("/store/jobs/pin-and-move", test_pin_and_move);
  g_test_add_func ("/store/jobs/material-changed", test_material_changed);
  g_test_add_func ("/store/jobs/refusals", test_refusals);
  g_test_add_func ("/store/jobs/exchange", test_exchange);
  g_test_add_func ("/store/jobs/migration", test_migration);
  g_test_add_func ("/store/jobs/climate-and-moisture", test_climate_and_moisture);
  g_test_add_func ("/store/jobs/import-unknown-climate", test_import_unknown_climate);
  g_test_add_func ("/store/jobs/job-variant-revision", test_job_variant_revision);
  g_test_add_func ("/store/jobs/delete", test_delete);
  g_test_add_func ("/store/jobs/find-by-number", test_find_by_number);
  return g_test_run ();
}
