/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Moving a whole library (lamina_library_copy, lamina-cli copy): every
 * revision, review record, 2-D check and figure arrives unchanged, a copy
 * onto a library that is not empty is refused, and a failure in the
 * middle of the copy leaves the target as it was.
 *
 * The figures compared are those the source library stored
 * (lamina_calculate, EN ISO 6946); the copy must not recalculate them, so
 * the check is equality with the source, bit for bit. */
#include <sqlite3.h>
#include <string.h>

#include "lamina-library-copy.h"
#include "lamina-library-safety.h"
#include "lamina-store-json.h"
#include "lamina-store-test-util.h"
#include "lamina-cli-test-util.h"

static void
same_string (const char *a,
             const char *b,
             const char *what)
{
  if (g_strcmp0 (a, b) != 0)
    g_error ("%s differs: “%s” / “%s”", what, a ? a : "(null)", b ? b : "(null)");
}

static void
same_double (double      a,
             double      b,
             const char *what)
{
  if (!(isnan (a) && isnan (b)) && memcmp (&a, &b, sizeof a) != 0)
    g_error ("%s differs: %.17g / %.17g", what, a, b);
}

/* A source with what an office's library holds: the demo practice's
 * build-ups, target sets and jobs, a construction with several revisions
 * and every review act, a stored 2-D check, a deleted construction and a
 * library setting. */
static LaminaLibrary *
make_source (const char *path,
             char      **reviewed_id,
             char      **deleted_id)
{
  g_autofree char *demo = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo",
                                            "lamina-demo.xml", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (demo, &error);
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaFieldCheck) check = NULL;
  LaminaLibrary *library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  LaminaConstruction *wall;
  char *id;

  g_assert_no_error (error);
  report = lamina_library_import (library, catalogue, LAMINA_IMPORT_DEFAULT, "Tess Arvel", &error);
  g_assert_no_error (error);

  wall = test_make_wall (library, "TW-1", "Test wall", "copy", 120);
  id = lamina_library_create_construction (library, wall, "Ann Author", &error);
  g_assert_no_error (error);
  lamina_construction_free (wall);
  wall = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_no_error (error);
  ((LaminaLayer *) wall->layers->pdata[1])->thickness = 145;
  g_assert_true (lamina_library_save_construction (library, wall, 1, "Ann Author", &error));
  g_assert_no_error (error);
  lamina_construction_free (wall);
  g_assert_true (lamina_library_mark_checked (library, id, 2, "Ben Checker", &error));
  g_assert_true (lamina_library_mark_checked (library, id, 2, "Dora Second", &error));
  g_assert_true (lamina_library_approve (library, id, 2, "Cleo Approver", NULL, &error));
  g_assert_true (lamina_library_withdraw_approval (library, id, 2, "Cleo Approver",
                                                   "stud spacing to be confirmed", &error));
  g_assert_true (lamina_library_approve_with_reason (library, id, 2, "Cleo Approver", NULL,
                                                     "spacing confirmed on site", &error));
  g_assert_no_error (error);
  check = lamina_library_refresh_field_check (library, id, NULL, NULL, NULL, &error);
  g_assert_no_error (error);
  g_assert_nonnull (check);

  g_assert_true (lamina_library_delete_construction (library, "demo-ew-102", "Ann Author", &error));
  g_assert_true (lamina_library_set_review_policy (library, LAMINA_REVIEW_SINGLE, &error));
  g_assert_no_error (error);
  *reviewed_id = id;
  *deleted_id = g_strdup ("demo-ew-102");
  return library;
}

static void
compare_construction (LaminaLibrary *a,
                      LaminaLibrary *b,
                      const char    *id)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) ha = lamina_library_dup_history (a, id, &error);
  g_autoptr(GPtrArray) hb = lamina_library_dup_history (b, id, &error);
  g_autoptr(GPtrArray) ea = NULL;
  g_autoptr(GPtrArray) eb = NULL;

  g_assert_no_error (error);
  g_assert_cmpuint (ha->len, ==, hb->len);
  for (guint i = 0; i < ha->len; i++)
    {
      LaminaRevisionInfo *x = ha->pdata[i], *y = hb->pdata[i];
      g_autoptr(LaminaConstruction) ca = NULL;
      g_autoptr(LaminaConstruction) cb = NULL;
      g_autoptr(LaminaResult) ra = NULL;
      g_autoptr(LaminaResult) rb = NULL;
      g_autoptr(LaminaFieldCheck) fa = NULL;
      g_autoptr(LaminaFieldCheck) fb = NULL;
      g_autofree char *ja = NULL, *jb = NULL;

      g_assert_cmpint (x->revision, ==, y->revision);
      g_assert_cmpint (x->status, ==, y->status);
      same_string (x->modified_by, y->modified_by, "author");
      same_string (x->modified_at, y->modified_at, "modified at");
      same_string (x->checked_by, y->checked_by, "checker");
      same_string (x->checked_at, y->checked_at, "checked at");
      same_string (x->approved_by, y->approved_by, "approver");
      same_string (x->approved_at, y->approved_at, "approval date");
      same_string (x->comment, y->comment, "comment");
      same_double (x->u_corrected, y->u_corrected, "stored corrected U");

      ca = lamina_library_dup_construction (a, id, x->revision, &error);
      g_assert_no_error (error);
      cb = lamina_library_dup_construction (b, id, x->revision, &error);
      g_assert_no_error (error);
      ja = lamina_store_construction_to_json (ca);
      jb = lamina_store_construction_to_json (cb);
      same_string (ja, jb, "revision body");
      same_string (ca->approval_policy, cb->approval_policy, "approval policy");
      same_string (ca->approval_reason, cb->approval_reason, "approval reason");

      ra = lamina_library_dup_result (a, id, x->revision, NULL);
      rb = lamina_library_dup_result (b, id, x->revision, NULL);
      g_assert_true ((ra == NULL) == (rb == NULL));
      if (ra != NULL)
        {
          same_double (ra->u, rb->u, "U");
          same_double (ra->u_corrected, rb->u_corrected, "corrected U");
          same_double (ra->r_total, rb->r_total, "RT");
        }
      fa = lamina_library_dup_field_check (a, id, x->revision, NULL);
      fb = lamina_library_dup_field_check (b, id, x->revision, NULL);
      g_assert_true ((fa == NULL) == (fb == NULL));
      if (fa != NULL)
        same_double (fa->u, fb->u, "2-D check U");
    }

  ea = lamina_library_dup_review_events (a, id, &error);
  g_assert_no_error (error);
  eb = lamina_library_dup_review_events (b, id, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (ea->len, ==, eb->len);
  for (guint i = 0; i < ea->len; i++)
    {
      LaminaReviewEvent *x = ea->pdata[i], *y = eb->pdata[i];

      g_assert_cmpint (x->revision, ==, y->revision);
      same_string (x->act, y->act, "review act");
      same_string (x->by, y->by, "reviewer");
      same_string (x->at, y->at, "review time");
      same_string (x->date, y->date, "review date");
      same_string (x->policy, y->policy, "review policy");
      same_string (x->reason, y->reason, "review reason");
    }
}

static char *
export_all (LaminaLibrary *library)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) catalogue = lamina_library_export (library, NULL, &error);
  char *text;

  g_assert_no_error (error);
  text = lamina_catalogue_write_to_string (catalogue, 0, NULL, &error);
  g_assert_no_error (error);
  return text;
}

static void
compare_libraries (LaminaLibrary *a,
                   LaminaLibrary *b)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) ma = lamina_library_list_materials (a, &error);
  g_autoptr(GPtrArray) mb = lamina_library_list_materials (b, &error);
  g_autoptr(GPtrArray) ka = lamina_library_list_climates (a, &error);
  g_autoptr(GPtrArray) kb = lamina_library_list_climates (b, &error);
  g_autoptr(GPtrArray) sa = NULL;
  g_autoptr(GPtrArray) sb = NULL;
  g_autofree char *xa = export_all (a);
  g_autofree char *xb = export_all (b);
  LaminaLibraryQuery query;

  g_assert_no_error (error);
  g_assert_cmpuint (ma->len, ==, mb->len);
  for (guint i = 0; i < ma->len; i++)
    {
      g_autofree char *fa = lamina_store_material_fingerprint (ma->pdata[i]);
      g_autofree char *fb = lamina_store_material_fingerprint (mb->pdata[i]);

      same_string (((LaminaMaterial *) ma->pdata[i])->id, ((LaminaMaterial *) mb->pdata[i])->id,
                   "material");
      same_string (fa, fb, "material data");
    }
  g_assert_cmpuint (ka->len, ==, kb->len);
  for (guint i = 0; i < ka->len; i++)
    {
      g_autofree char *fa = lamina_store_climate_fingerprint (ka->pdata[i]);
      g_autofree char *fb = lamina_store_climate_fingerprint (kb->pdata[i]);

      same_string (fa, fb, "climate data");
    }
  /* Constructions, materials, target sets and jobs as a document. */
  same_string (xa, xb, "export");
  g_assert_cmpint (lamina_library_get_review_policy (a), ==, lamina_library_get_review_policy (b));

  lamina_library_query_init (&query);
  sa = lamina_library_search (a, &query, &error);
  g_assert_no_error (error);
  sb = lamina_library_search (b, &query, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (sa->len, ==, sb->len);
  for (guint i = 0; i < sa->len; i++)
    {
      LaminaSummary *x = sa->pdata[i], *y = sb->pdata[i];

      same_string (x->id, y->id, "list order");
      g_assert_cmpint (x->revision, ==, y->revision);
      g_assert_cmpint (x->status, ==, y->status);
      g_assert_cmpint (x->flags, ==, y->flags);
      same_double (x->u_corrected, y->u_corrected, "listed U");
      same_double (x->thickness, y->thickness, "listed thickness");
      same_string (x->modified_at, y->modified_at, "listed date");
      compare_construction (a, b, x->id);
    }
  /* The search index was built on the target. */
  query.text = "timber";
  g_assert_cmpint (lamina_library_count (a, &query, NULL), >, 0);
  g_assert_cmpint (lamina_library_count (a, &query, NULL), ==, lamina_library_count (b, &query, NULL));
}

static void
test_round_trip (void)
{
  g_autofree char *src_path = test_library_path ("copy-source.sqlite");
  /* On the test server: a file, copied to the server and back to a file. */
  g_autofree char *dst_path = test_library_location ("copy-target.sqlite");
  g_autofree char *back_path = test_library_path ("copy-back.sqlite");
  g_autofree char *reviewed = NULL, *deleted = NULL;
  g_autoptr(LaminaLibrary) src = make_source (src_path, &reviewed, &deleted);
  g_autoptr(LaminaLibrary) dst = lamina_library_open (dst_path, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
  g_autoptr(LaminaLibrary) back = lamina_library_open (back_path, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) events = NULL;
  LaminaCopyReport report = { 0 };

  g_assert_true (lamina_library_copy (src, dst, &report, &error));
  g_assert_no_error (error);
  /* 20 demo build-ups (data/demo) and the test wall; its 2 revisions,
   * 5 review acts (2 checks, approval, withdrawal, approval) and 1 check. */
  g_assert_cmpuint (report.constructions, ==, 21);
  g_assert_cmpuint (report.deleted, ==, 1);
  g_assert_cmpuint (report.revisions, ==, 22);
  g_assert_cmpuint (report.field_checks, ==, 1);
  g_assert_cmpuint (report.jobs, ==, 2);
  g_assert_cmpuint (report.target_sets, ==, 1);
  events = lamina_library_dup_review_events (src, reviewed, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (events->len, ==, 5);
  g_assert_cmpuint (report.review_records, >=, 5);
  compare_libraries (src, dst);

  /* And back again, through a second copy. */
  g_assert_true (lamina_library_copy (dst, back, NULL, &error));
  g_assert_no_error (error);
  compare_libraries (src, back);

  /* The deleted construction came along, deleted, with its history. */
  g_assert_null (lamina_library_dup_construction (dst, deleted, 0, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);
  g_assert_true (lamina_library_restore_construction (src, deleted, &error));
  g_assert_true (lamina_library_restore_construction (dst, deleted, &error));
  g_assert_no_error (error);
  compare_construction (src, dst, deleted);

  /* The copy is a library like any other: review goes on. */
  g_assert_true (lamina_library_mark_checked (dst, "demo-ew-102", 0, "Ben Checker", &error));
  g_assert_no_error (error);
}

static void
test_refuses_non_empty (void)
{
  g_autofree char *src_path = test_library_path ("refuse-source.sqlite");
  g_autofree char *dst_path = test_library_location ("refuse-target.sqlite");
  g_autofree char *reviewed = NULL, *deleted = NULL;
  g_autoptr(LaminaLibrary) src = make_source (src_path, &reviewed, &deleted);
  g_autoptr(LaminaLibrary) dst = lamina_library_open (dst_path, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
  g_autoptr(GError) error = NULL;
  LaminaConstruction *wall = test_make_wall (dst, "OWN-1", "Their own wall", NULL, 100);
  g_autofree char *own = lamina_library_create_construction (dst, wall, "Zed", &error);
  g_autofree char *before = export_all (dst);
  g_autofree char *after = NULL;

  lamina_construction_free (wall);
  g_assert_no_error (error);
  g_assert_false (lamina_library_copy (src, dst, NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS);
  g_assert_nonnull (strstr (error->message, "not empty"));
  g_assert_nonnull (strstr (error->message, dst_path));
  g_clear_error (&error);
  after = export_all (dst);
  same_string (before, after, "refused target");
  g_assert_cmpint (lamina_library_get_review_policy (dst), ==, LAMINA_REVIEW_FOUR_EYES);

  /* Nor onto itself. */
  g_assert_false (lamina_library_copy (src, src, NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
}

/* A failure after the materials and revisions were written (a review
 * record refused by the target's database) rolls everything back. */
static void
test_failure_leaves_target (void)
{
  g_autofree char *src_path = test_library_path ("fail-source.sqlite");
  g_autofree char *dst_path = test_library_location ("fail-target.sqlite");
  g_autofree char *reviewed = NULL, *deleted = NULL;
  g_autoptr(LaminaLibrary) src = make_source (src_path, &reviewed, &deleted);
  g_autoptr(LaminaLibrary) dst = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *before = NULL, *after = NULL;
  LaminaLibraryQuery query;

  g_clear_object (&dst);
  dst = lamina_library_open (dst_path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  before = export_all (dst);
  if (test_on_server ())
    g_assert_true (test_raw_exec (dst_path,
      "CREATE FUNCTION test_fail () RETURNS trigger LANGUAGE plpgsql AS $$"
      " BEGIN RAISE EXCEPTION 'refused for the test'; END $$;"
      "CREATE TRIGGER test_fail BEFORE INSERT ON review_event"
      " FOR EACH ROW EXECUTE FUNCTION test_fail ();"));
  else
    g_assert_true (test_raw_exec (dst_path, "CREATE TRIGGER test_fail BEFORE INSERT ON review_event"
                                            " BEGIN SELECT RAISE (ABORT, 'refused for the test'); END;"));

  g_assert_false (lamina_library_copy (src, dst, NULL, &error));
  g_assert_nonnull (error);
  g_assert_nonnull (strstr (error->message, "refused for the test"));
  g_clear_error (&error);
  after = export_all (dst);
  same_string (before, after, "target after a failed copy");
  lamina_library_query_init (&query);
  g_assert_cmpint (lamina_library_count (dst, &query, NULL), ==, 0);
  g_assert_cmpint (lamina_library_get_review_policy (dst), ==, LAMINA_REVIEW_FOUR_EYES);

  /* With the obstacle gone the same target takes the copy. */
  g_assert_true (test_raw_exec (dst_path, test_on_server () ? "DROP TRIGGER test_fail ON review_event;"
                                                          : "DROP TRIGGER test_fail;"));
  g_assert_true (lamina_library_copy (src, dst, NULL, &error));
  g_assert_no_error (error);
  compare_libraries (src, dst);
}

/* lamina-cli copy: counts, the same export and history JSON on both
 * sides, refusal onto a library that is not empty, and no file left
 * behind when a copy into a new file fails. */
static void
test_cli (void)
{
  g_autofree char *src_path = test_library_path ("cli-source.sqlite");
  g_autofree char *dst_path = test_library_uri ("cli-target.sqlite");
  g_autofree char *missing = test_library_path ("no-such-library.sqlite");
  g_autofree char *reviewed = NULL, *deleted = NULL;
  g_autoptr(LaminaLibrary) src = make_source (src_path, &reviewed, &deleted);
  g_autoptr(GPtrArray) ids = NULL;
  LaminaLibraryQuery query;
  char *out = NULL, *err = NULL;

  library_path = src_path;
  g_assert_cmpint (run (&out, &err, "copy", "--from", src_path, "--to", dst_path, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "revisions           22"));
  g_assert_nonnull (strstr (out, "2-D checks           1"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  lamina_library_query_init (&query);
  ids = lamina_library_search (src, &query, NULL);
  for (guint i = 0; i <= ids->len; i++)
    {
      const char *args[] = { "export", "-o", "-", NULL, NULL };
      g_autofree char *a = NULL, *b = NULL;

      if (i < ids->len)
        {
          args[0] = "history";
          args[1] = "--json";
          args[2] = ((LaminaSummary *) ids->pdata[i])->id;
        }
      library_path = src_path;
      g_assert_cmpint (run (&a, &err, args[0], args[1], args[2], NULL), ==, 0);
      g_clear_pointer (&err, g_free);
      library_path = dst_path;
      g_assert_cmpint (run (&b, &err, args[0], args[1], args[2], NULL), ==, 0);
      g_clear_pointer (&err, g_free);
      same_string (a, b, args[0]);
    }

  g_assert_cmpint (run (&out, &err, "copy", "--from", src_path, "--to", dst_path, NULL), ==, 1);
  g_assert_nonnull (strstr (err, "not empty"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  g_assert_cmpint (run (&out, &err, "copy", "--from", missing, "--to", dst_path, NULL), ==, 1);
  g_assert_nonnull (strstr (err, "--from"));
  g_assert_false (g_file_test (missing, G_FILE_TEST_EXISTS));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "copy", "--from", src_path, NULL), ==, 2);
  g_free (out);
  g_free (err);
}

/* lamina-cli backup on either backend: a library file, equal to the
 * library it was made from (every revision, review record and figure);
 * on a server a restore is refused, naming the copy into a new database,
 * and nothing changes. */
static void
test_backup (void)
{
  g_autofree char *path = test_library_location ("backup-source.sqlite");
  g_autofree char *reviewed = NULL, *deleted = NULL;
  g_autoptr(LaminaLibrary) src = make_source (path, &reviewed, &deleted);
  g_autoptr(LaminaLibrary) copy = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *made = lamina_library_backup_now (src, &error);
  g_autofree char *backups = g_build_filename (g_get_user_data_dir (), "cli-backups", NULL);
  char *out = NULL, *err = NULL;

  g_assert_no_error (error);
  g_assert_true (g_str_has_suffix (made, ".sqlite"));
  copy = lamina_library_open (made, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  compare_libraries (src, copy);
  g_clear_object (&copy);

  library_path = path;
  g_assert_cmpint (run (&out, &err, "backup", "--dir", backups, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "backup written: "));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  if (!test_on_server ())
    return;
  g_assert_false (lamina_library_restore_backup (path, made, NULL, NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_FAILED);
  g_assert_nonnull (strstr (error->message, "lamina-cli copy --from"));
  g_assert_null (strstr (error->message, "password"));
  g_clear_error (&error);
  /* No question first: the refusal comes before any prompt. */
  g_assert_cmpint (run (&out, &err, "restore", made, NULL), ==, 1);
  g_assert_nonnull (strstr (err, "new, empty database"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  compare_construction (src, src, reviewed);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/library-copy/round-trip", test_round_trip);
  g_test_add_func ("/library-copy/refuses-non-empty", test_refuses_non_empty);
  g_test_add_func ("/library-copy/failure-leaves-target", test_failure_leaves_target);
  g_test_add_func ("/library-copy/cli", test_cli);
  g_test_add_func ("/library-copy/backup", test_backup);
  return g_test_run ();
}
