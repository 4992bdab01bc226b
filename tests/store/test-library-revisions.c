/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of revisions, review, concurrency, material flags and search. */
#include <string.h>

#include "lamina-library.h"
#include "lamina-library-backend.h"
#include "lamina-library-search.h"
#include "lamina-store-test-util.h"

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
create_wall (LaminaLibrary *library,
             const char    *code,
             const char    *name,
             const char    *tag,
             double         mm)
{
  g_autoptr(LaminaConstruction) c = test_make_wall (library, code, name, tag, mm);
  g_autoptr(GError) error = NULL;
  char *id = lamina_library_create_construction (library, c, "A. Planner", &error);

  g_assert_no_error (error);
  g_assert_nonnull (id);
  return id;
}

/* Revisions: an approved revision never changes (issue 3; review
 * integrity of issue 7), an edit makes a new draft. */
static void
test_approved_immutable (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("rev.sqlite");
  g_autofree char *id = create_wall (library, "EW-01", "Timber frame wall", "housing", 145);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaConstruction) old = NULL;
  g_autoptr(LaminaResult) r1 = NULL;
  g_autoptr(LaminaResult) r2 = NULL;
  g_autoptr(GPtrArray) history = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *path = g_strdup (lamina_library_get_path (library));
  LaminaLayer *layer;

  g_assert_false (lamina_library_approve (library, id, 1, "  ", NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_true (lamina_library_mark_checked (library, id, 1, "C. Checker", &error));
  g_assert_no_error (error);
  /* An approval dated before the revision was made is refused. */
  g_assert_false (lamina_library_approve (library, id, 1, "D. Director", "2001-03-01", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "before revision 1"));
  g_clear_error (&error);
  /* A date far ahead keeps the test true for decades. */
  g_assert_true (lamina_library_approve (library, id, 1, "D. Director", "2099-03-01", &error));
  g_assert_no_error (error);
  g_assert_false (lamina_library_mark_checked (library, id, 1, "C. Checker", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IMMUTABLE);
  g_clear_error (&error);

  r1 = lamina_library_dup_result (library, id, 0, &error);
  g_assert_no_error (error);
  c = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_APPROVED);
  layer = c->layers->pdata[1];
  layer->thickness = 195;
  g_assert_true (lamina_library_save_construction (library, c, 1, "A. Planner", &error));
  g_assert_no_error (error);
  g_assert_cmpint (c->revision, ==, 2);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_DRAFT);
  g_assert_null (c->approved_by);

  /* Revision 1 is still there, approved, with its figures. */
  old = lamina_library_dup_construction (library, id, 1, &error);
  g_assert_no_error (error);
  g_assert_cmpint (old->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpstr (old->approved_by, ==, "D. Director");
  g_assert_cmpstr (old->approved_at, ==, "2099-03-01");
  g_assert_cmpstr (old->checked_by, ==, "C. Checker");
  g_assert_cmpfloat (((LaminaLayer *) old->layers->pdata[1])->thickness, ==, 145);
  r2 = lamina_library_dup_result (library, id, 1, &error);
  g_assert_cmpfloat (r2->u_corrected, ==, r1->u_corrected);
  g_clear_pointer (&r2, lamina_result_free);
  /* More insulation: lower U (EN ISO 6946 physics, R grows with d). */
  r2 = lamina_library_dup_result (library, id, 2, &error);
  g_assert_cmpfloat (r2->u_corrected, <, r1->u_corrected);

  history = lamina_library_dup_history (library, id, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (history->len, ==, 2);
  g_assert_cmpint (((LaminaRevisionInfo *) history->pdata[0])->revision, ==, 2);
  g_assert_cmpint (((LaminaRevisionInfo *) history->pdata[1])->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpstr (((LaminaRevisionInfo *) history->pdata[1])->modified_by, ==, "A. Planner");

  /* Not even raw SQL can change the approved row (triggers), nor a
   * review record. */
  g_assert_false (test_raw_exec (path, "UPDATE revision SET approved_by = 'X' WHERE revision = 1;"));
  g_assert_false (test_raw_exec (path, "UPDATE revision SET body = '{}';"));
  g_assert_false (test_raw_exec (path, "DELETE FROM revision WHERE revision = 1;"));
  g_assert_false (test_raw_exec (path, "UPDATE review_event SET person = 'X';"));
  g_assert_false (test_raw_exec (path, "DELETE FROM review_event;"));
  g_assert_cmpint (test_raw_int (path, "SELECT count(*) FROM review_event;"), >=, 2);
}

/* Two connections on one file (as two processes would): the save based
 * on the older revision is refused and the other's work is kept. */
static void
test_stale_save (void)
{
  g_autoptr(LaminaLibrary) a = open_at ("shared.sqlite");
  g_autoptr(LaminaLibrary) b = open_at ("shared.sqlite");
  g_autofree char *id = create_wall (a, "EW-02", "Shared wall", NULL, 120);
  g_autoptr(LaminaConstruction) ca = lamina_library_dup_construction (a, id, 0, NULL);
  g_autoptr(LaminaConstruction) cb = lamina_library_dup_construction (b, id, 0, NULL);
  g_autoptr(LaminaConstruction) now = NULL;
  g_autoptr(GError) error = NULL;

  g_assert_false (lamina_library_check_for_changes (a));
  g_free (ca->name);
  ca->name = g_strdup ("Shared wall, edited by A");
  g_assert_true (lamina_library_save_construction (a, ca, 1, "A", &error));
  g_assert_no_error (error);
  g_assert_true (lamina_library_check_for_changes (b));

  g_free (cb->name);
  cb->name = g_strdup ("Shared wall, edited by B");
  g_assert_false (lamina_library_save_construction (b, cb, 1, "B", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE);
  g_assert_nonnull (strstr (error->message, "someone else"));
  g_assert_cmpint (cb->revision, ==, 1);
  g_clear_error (&error);
  now = lamina_library_dup_construction (b, id, 0, &error);
  g_assert_cmpstr (now->name, ==, "Shared wall, edited by A");
  g_assert_cmpint (now->revision, ==, 2);

  /* Reviewing what is not the latest is refused too. */
  g_assert_false (lamina_library_mark_checked (b, id, 1, "C", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE);
}

static void
test_delete_restore_derive (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("undo.sqlite");
  g_autofree char *id = create_wall (library, "EW-03", "Wall to delete", NULL, 100);
  g_autofree char *copy = NULL;
  g_autoptr(LaminaConstruction) derived = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;

  lamina_library_query_init (&q);
  g_assert_true (lamina_library_delete_construction (library, id, NULL, &error));
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, 0);
  g_assert_null (lamina_library_dup_construction (library, id, 0, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);
  g_assert_true (lamina_library_restore_construction (library, id, &error));
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, 1);

  copy = lamina_library_derive_construction (library, id, "B", &error);
  g_assert_no_error (error);
  derived = lamina_library_dup_construction (library, copy, 0, &error);
  g_assert_cmpint (derived->revision, ==, 1);
  g_assert_null (derived->code);
  g_assert_nonnull (strstr (derived->name, "Wall to delete"));
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, 2);
}

/* A library material that changes flags its users; they keep the λ they
 * were calculated with until the user updates them. */
static void
test_material_changed (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("flag.sqlite");
  g_autofree char *id = create_wall (library, "EW-04", "Flagged wall", NULL, 145);
  g_autoptr(LaminaMaterial) wool = lamina_library_dup_material (library, "typical-mineral-wool-035", NULL);
  g_autoptr(LaminaResult) before = lamina_library_dup_result (library, id, 0, NULL);
  g_autoptr(LaminaResult) still = NULL;
  g_autoptr(LaminaResult) after = NULL;
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(GPtrArray) changes = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;
  int rev;

  wool->conductivity = 0.040;
  g_assert_true (lamina_library_put_material (library, wool, &error));
  lamina_library_query_init (&q);
  rows = lamina_library_search (library, &q, &error);
  g_assert_true (((LaminaSummary *) rows->pdata[0])->flags & LAMINA_SUMMARY_MATERIAL_CHANGED);
  still = lamina_library_dup_result (library, id, 0, NULL);
  g_assert_cmpfloat (still->u_corrected, ==, before->u_corrected);
  changes = lamina_library_list_material_changes (library, id, &error);
  g_assert_cmpuint (changes->len, ==, 1);
  g_assert_cmpfloat (((LaminaMaterialChange *) changes->pdata[0])->stored->conductivity, ==, 0.035);

  rev = lamina_library_update_materials (library, id, 1, "A", &error);
  g_assert_no_error (error);
  g_assert_cmpint (rev, ==, 2);
  after = lamina_library_dup_result (library, id, 0, NULL);
  g_assert_cmpfloat (after->u_corrected, >, before->u_corrected);
  g_clear_pointer (&rows, g_ptr_array_unref);
  rows = lamina_library_search (library, &q, &error);
  g_assert_false (((LaminaSummary *) rows->pdata[0])->flags & LAMINA_SUMMARY_MATERIAL_CHANGED);
}

/* Stock thicknesses are kept with the material and do not flag its users:
 * they change what is built, not the figures. */
static void
test_stock_thicknesses (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("stock.sqlite");
  g_autofree char *id = create_wall (library, "EW-05", "Stock wall", NULL, 145);
  g_autoptr(LaminaMaterial) wool = lamina_library_dup_material (library, "typical-mineral-wool-035", NULL);
  g_autoptr(LaminaMaterial) back = NULL;
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(GError) error = NULL;
  const double stock[] = { 145, 45, 95 };
  LaminaLibraryQuery q;

  lamina_material_set_stock_thicknesses (wool, stock, G_N_ELEMENTS (stock));
  g_assert_true (lamina_library_put_material (library, wool, &error));
  back = lamina_library_dup_material (library, "typical-mineral-wool-035", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (back->n_stock_thicknesses, ==, 3);
  g_assert_cmpfloat (back->stock_thicknesses[0], ==, 45);
  g_assert_cmpfloat (back->stock_thicknesses[2], ==, 145);
  lamina_library_query_init (&q);
  rows = lamina_library_search (library, &q, &error);
  g_assert_false (((LaminaSummary *) rows->pdata[0])->flags & LAMINA_SUMMARY_MATERIAL_CHANGED);
  (void) id;
}

static guint
count_text (LaminaLibrary *library,
            const char    *text)
{
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;
  gint64 n;

  lamina_library_query_init (&q);
  q.text = text;
  n = lamina_library_count (library, &q, &error);
  g_assert_no_error (error);
  return (guint) n;
}

static void
test_search (void)
{
  static const char *const hostile[] = {
    "\"", "'", "EW-0", "NOT", "a OR b", "x AND", "(", ")", "*", "^", "name:wall",
    "NEAR(a b)", "-", "--", "\"\"\"", "' OR 1=1 --", "é", "  ", "",
  };
  g_autoptr(LaminaLibrary) library = open_at ("search.sqlite");
  g_autofree char *a = create_wall (library, "EW-10", "Larch clad timber wall", "passivhaus", 200);
  g_autofree char *b = create_wall (library, "EW-11", "Brick slip wall", "retrofit", 100);
  g_autofree char *c = create_wall (library, "RF-01", "Warm deck roof", "retrofit", 150);
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;

  g_assert_cmpuint (count_text (library, "lar"), ==, 1);          /* prefix of a name word */
  g_assert_cmpuint (count_text (library, "ew"), ==, 2);           /* prefix of a code */
  g_assert_cmpuint (count_text (library, "EW-1"), ==, 2);
  g_assert_cmpuint (count_text (library, "ew-11"), ==, 1);
  g_assert_cmpuint (count_text (library, "retro"), ==, 2);        /* tag */
  g_assert_cmpuint (count_text (library, "mineral"), ==, 3);      /* material name */
  g_assert_cmpuint (count_text (library, "softw"), ==, 3);        /* material of a part */
  g_assert_cmpuint (count_text (library, "retro deck"), ==, 1);   /* all words */
  g_assert_cmpuint (count_text (library, "zzz"), ==, 0);
  for (guint i = 0; i < G_N_ELEMENTS (hostile); i++)
    count_text (library, hostile[i]);

  lamina_library_query_init (&q);
  q.tag = "retrofit";
  q.sort = LAMINA_SORT_THICKNESS;
  q.descending = TRUE;
  rows = lamina_library_search (library, &q, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (rows->len, ==, 2);
  g_assert_cmpstr (((LaminaSummary *) rows->pdata[0])->code, ==, "RF-01");
  g_clear_pointer (&rows, g_ptr_array_unref);

  /* Less insulation, higher U: the 100 mm wall is the only one above 0.3. */
  lamina_library_query_init (&q);
  q.min_u = 0.30;
  rows = lamina_library_search (library, &q, &error);
  g_assert_cmpuint (rows->len, ==, 1);
  g_assert_cmpstr (((LaminaSummary *) rows->pdata[0])->id, ==, b);
  g_assert_true (((LaminaSummary *) rows->pdata[0])->flags & LAMINA_SUMMARY_TARGET_NOT_MET);
  g_clear_pointer (&rows, g_ptr_array_unref);

  /* Paging. */
  lamina_library_query_init (&q);
  q.sort = LAMINA_SORT_CODE;
  q.offset = 1;
  q.limit = 1;
  rows = lamina_library_search (library, &q, &error);
  g_assert_cmpuint (rows->len, ==, 1);
  g_assert_cmpstr (((LaminaSummary *) rows->pdata[0])->code, ==, "EW-11");
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, 3);
}

/* The tag filter offers each tag in use once, sorted, and forgets the tags
 * of deleted constructions (and a deleted text match is not counted). */
static void
test_list_tags (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("tags.sqlite");
  g_autofree char *a = create_wall (library, "EW-20", "Wall A", "school", 200);
  g_autofree char *b = create_wall (library, "EW-21", "Wall B", "school", 120);
  g_autofree char *c = create_wall (library, "EW-22", "Wall C", "annex", 100);
  g_autoptr(GPtrArray) tags = NULL;
  g_autoptr(GError) error = NULL;

  tags = lamina_library_list_tags (library, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (tags->len, ==, 2);
  g_assert_cmpstr (tags->pdata[0], ==, "annex");
  g_assert_cmpstr (tags->pdata[1], ==, "school");
  g_clear_pointer (&tags, g_ptr_array_unref);

  g_assert_true (lamina_library_delete_construction (library, c, "A. Planner", &error));
  g_assert_no_error (error);
  tags = lamina_library_list_tags (library, &error);
  g_assert_cmpuint (tags->len, ==, 1);
  g_assert_cmpstr (tags->pdata[0], ==, "school");
  g_assert_cmpuint (count_text (library, "wall"), ==, 2);
  g_assert_cmpuint (count_text (library, "annex"), ==, 0);
}

/* Office codes are unique within a library (common practice: a code is
 * how drawings and specifications name one build-up), compared as
 * SQLite's NOCASE compares (ASCII letters without case; the code is kept
 * in Unicode NFC, Unicode Standard Annex #15).  The backend's find_code
 * on both backends, and the refusal inside the write's own transaction,
 * past the front end's early check. */
static void
test_office_code (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("codes.sqlite");
  g_autofree char *a = create_wall (library, "EW-101", "Wall A", NULL, 200);
  g_autofree char *b = create_wall (library, "\xc3\x89W-7", "Wall B", NULL, 120);
  g_autoptr(LaminaConstruction) twin = NULL;
  g_autoptr(LaminaResult) result = NULL;
  g_autofree char *calc_error = NULL;
  g_autoptr(GError) error = NULL;
  char *found;

  found = lamina_library_dup_code_user (library, "ew-101", NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (found, ==, a);
  g_free (found);
  /* Its own code is not another's. */
  g_assert_null (lamina_library_dup_code_user (library, "EW-101", a, &error));
  g_assert_no_error (error);
  /* "É" is not an ASCII letter: "éW-7" is another code, "ÉW-7" the same. */
  g_assert_null (lamina_library_dup_code_user (library, "\xc3\xa9W-7", NULL, &error));
  g_assert_no_error (error);
  found = lamina_library_dup_code_user (library, "\xc3\x89w-7", NULL, &error);
  g_assert_cmpstr (found, ==, b);
  g_free (found);
  /* A prefix is not the code. */
  g_assert_null (lamina_library_dup_code_user (library, "EW-10", NULL, &error));

  /* The write itself refuses a second EW-101, whatever the caller
   * checked before: straight to the backend, as a concurrent writer
   * whose early check came before the other's commit would get there. */
  twin = test_make_wall (library, "ew-101", "Wall C", NULL, 100);
  twin->id = g_strdup ("wall-c");
  lamina_library_prepare_revision (twin, &result, &calc_error);
  lamina_library_set_new_draft (twin, 1, "A. Planner");
  {
    LaminaBackendRevision rev = { twin, result, calc_error, NULL };

    g_assert_false (VT (library)->store_revision (BE (library), &rev, 0, &error));
    g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS);
    g_assert_nonnull (strstr (error->message, "already used by “Wall A”"));
    g_clear_error (&error);
  }
  g_assert_null (lamina_library_dup_construction (library, "wall-c", 0, NULL));

  /* A deleted construction's code is free again. */
  g_assert_true (lamina_library_delete_construction (library, a, "A. Planner", &error));
  g_assert_null (lamina_library_dup_code_user (library, "EW-101", NULL, &error));
  g_assert_no_error (error);
  found = lamina_library_create_construction (library, twin, "A. Planner", &error);
  g_assert_no_error (error);
  g_free (found);
}

/* The list's count that stops (lamina_library_count_at_most): exact up
 * to the cap, the cap + 1 beyond it, with and without a text. */
static void
test_count_at_most (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("capped.sqlite");
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;

  for (int i = 0; i < 5; i++)
    {
      g_autofree char *code = g_strdup_printf ("EW-%d", 30 + i);
      g_autofree char *id = create_wall (library, code, "Capped wall", i < 2 ? "annex" : NULL,
                                         100 + 20 * i);
    }
  lamina_library_query_init (&q);
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 3, &error), ==, 4);
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 4, &error), ==, 5);
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 5, &error), ==, 5);
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 1000, &error), ==, 5);
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 0, &error), ==, 1);
  g_assert_no_error (error);
  q.text = "annex";
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 1, &error), ==, 2);
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 2, &error), ==, 2);
  q.text = "zzz";
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 0, &error), ==, 0);
  q.text = NULL;
  q.max_u = 0.0;
  g_assert_cmpint (lamina_library_count_at_most (library, &q, 10, &error), ==, 0);
  g_assert_no_error (error);
  /* The backend's own operation is there on both backends. */
  g_assert_nonnull (VT (library)->count_at_most);
  g_assert_nonnull (VT (library)->find_code);
}

static void
test_fts_query (void)
{
  g_autofree char *q1 = lamina_library_text_to_fts_query ("EW-0 \"larch\"");
  g_autofree char *q2 = lamina_library_text_to_fts_query ("' OR ( ) *");

  g_assert_cmpstr (q1, ==, "\"EW\"* \"0\"* \"larch\"*");
  g_assert_cmpstr (q2, ==, "\"OR\"*");
  g_assert_null (lamina_library_text_to_fts_query ("-- ' \" *"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);

  g_test_add_func ("/store/revisions/approved-immutable", test_approved_immutable);
  g_test_add_func ("/store/revisions/stale-save", test_stale_save);
  g_test_add_func ("/store/revisions/delete-restore-derive", test_delete_restore_derive);
  g_test_add_func ("/store/revisions/material-changed", test_material_changed);
  g_test_add_func ("/store/revisions/stock-thicknesses", test_stock_thicknesses);
  g_test_add_func ("/store/search/prefix-tag-material", test_search);
  g_test_add_func ("/store/search/fts-query", test_fts_query);
  g_test_add_func ("/store/search/list-tags", test_list_tags);
  g_test_add_func ("/store/revisions/office-code", test_office_code);
  g_test_add_func ("/store/search/count-at-most", test_count_at_most);
  return g_test_run ();
}
