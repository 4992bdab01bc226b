/* SPDX-License-Identifier: GPL-3.0-or-later */
/* A draft that follows an approved revision, through the API.
 * - Its author's edits replace it in place while it is a draft; someone
 *   else's edit is a revision of its own.
 * - Saved back to the approved build-up it is removed: a drag-then-undo
 *   on an approved wall leaves revision 1 approved and the latest, still
 *   in the approved filter, and nothing else in the history.
 * - A job's pinned draft is never changed under it.
 * - A new job's copy starts from the approved revision unless another is
 *   asked for.
 * (Common practice: an approved build-up stays the office's reference
 * until a new revision of it is approved.) */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <math.h>
#include <string.h>

#include "lamina-hardening-util.h"

/* A wall by A. Author, checked by C. Checker, approved by B. Boss: its
 * revision 1 is approved. */
static char *
approved_wall (LaminaLibrary *library,
               guint          n)
{
  g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, n);
  g_autoptr(GError) error = NULL;
  char *id = lamina_library_create_construction (library, c, "A. Author", &error);

  g_assert_no_error (error);
  g_assert_true (lamina_library_mark_checked (library, id, 1, "C. Checker", &error));
  g_assert_true (lamina_library_approve (library, id, 1, "B. Boss", NULL, &error));
  g_assert_no_error (error);
  return id;
}

static guint
history_length (LaminaLibrary *library,
                const char    *id)
{
  g_autoptr(GPtrArray) history = lamina_library_dup_history (library, id, NULL);

  return history->len;
}

static gint64
count_approved (LaminaLibrary *library)
{
  LaminaLibraryQuery q;

  lamina_library_query_init (&q);
  q.status = LAMINA_STATUS_APPROVED;
  return lamina_library_count (library, &q, NULL);
}

static double
first_thickness (const LaminaConstruction *c)
{
  return ((LaminaLayer *) c->layers->pdata[0])->thickness;
}

static void
test_in_place_and_undo (void)
{
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("drafts.sqlite", NULL);
  g_autofree char *id = approved_wall (library, 1);
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, NULL);
  g_autoptr(LaminaConstruction) head = NULL;
  g_autoptr(LaminaConstruction) stale = NULL;
  g_autoptr(GError) error = NULL;
  double t0 = first_thickness (c);

  g_assert_cmpint (count_approved (library), ==, 1);
  /* A drag: the first edit after the approval is draft revision 2. */
  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 5;
  g_assert_true (lamina_library_save_construction (library, c, 1, "A. Author", &error));
  g_assert_cmpint (c->revision, ==, 2);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_DRAFT);
  /* The next drag step by the same person updates that draft. */
  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 12;
  g_assert_true (lamina_library_save_construction (library, c, 2, "a. author", &error));
  g_assert_no_error (error);
  g_assert_cmpint (c->revision, ==, 2);
  g_assert_cmpuint (history_length (library, id), ==, 2);
  head = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpfloat (first_thickness (head), ==, t0 + 12);
  g_assert_cmpint (head->revision, ==, 2);
  g_clear_pointer (&head, lamina_construction_free);
  /* A second window on this very state (kept for later). */
  stale = lamina_construction_copy (c);
  /* The approved revision is untouched meanwhile. */
  head = lamina_library_dup_construction (library, id, 1, &error);
  g_assert_cmpint (head->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpfloat (first_thickness (head), ==, t0);
  g_clear_pointer (&head, lamina_construction_free);

  /* Undo back to the approved build-up: no draft, no new revision. */
  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0;
  g_assert_true (lamina_library_save_construction (library, c, 2, "A. Author", &error));
  g_assert_no_error (error);
  g_assert_cmpint (c->revision, ==, 1);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpstr (c->approved_by, ==, "B. Boss");
  g_assert_cmpuint (history_length (library, id), ==, 1);
  head = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpint (head->revision, ==, 1);
  g_assert_cmpint (head->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpint (count_approved (library), ==, 1);
  g_clear_pointer (&head, lamina_construction_free);

  /* Editing again starts a new draft 2. */
  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 20;
  g_assert_true (lamina_library_save_construction (library, c, 1, "A. Author", &error));
  g_assert_cmpint (c->revision, ==, 2);
  /* The other window's draft 2 was removed and made again since: its
   * save is stale (the same number, another state), not an overwrite. */
  ((LaminaLayer *) stale->layers->pdata[0])->thickness = t0 + 30;
  g_assert_false (lamina_library_save_construction (library, stale, 2, "A. Author", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE);
  g_clear_error (&error);
  head = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpfloat (first_thickness (head), ==, t0 + 20);
  g_clear_pointer (&head, lamina_construction_free);
  /* Someone else's edit of it is a revision of its own (the history
   * keeps who wrote what). */
  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 25;
  g_assert_true (lamina_library_save_construction (library, c, 2, "D. Other", &error));
  g_assert_cmpint (c->revision, ==, 3);
  g_assert_cmpuint (history_length (library, id), ==, 3);
}

static void
test_pinned_draft (void)
{
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("pinned.sqlite", NULL);
  g_autofree char *id = approved_wall (library, 2);
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, NULL);
  g_autoptr(LaminaJob) job = lamina_job_new ("job-1", "Pinned draft");
  g_autoptr(GError) error = NULL;
  double t0 = first_thickness (c);

  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 5;
  g_assert_true (lamina_library_save_construction (library, c, 1, "A. Author", &error));
  g_assert_cmpint (c->revision, ==, 2);
  {
    /* An invented table of targets, for the job only. */
    g_autoptr(LaminaTargetSet) set = lamina_target_set_new ("invented", "Invented table");

    lamina_target_set_add (set, lamina_target_new ("external-wall", 0.30));
    g_assert_true (lamina_library_put_target_set (library, set, &error));
  }
  job->target_set = g_strdup ("invented");
  lamina_job_add_entry (job, lamina_job_entry_new (id, 2, "external-wall"));
  g_assert_true (lamina_library_create_job (library, job, &error));
  g_assert_no_error (error);
  /* The job's revision 2 never changes under it: the edit is revision 3. */
  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 9;
  g_assert_true (lamina_library_save_construction (library, c, 2, "A. Author", &error));
  g_assert_cmpint (c->revision, ==, 3);
}

static void
test_derive_from_approved (void)
{
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("derive.sqlite", NULL);
  g_autofree char *id = approved_wall (library, 3);
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, NULL);
  g_autoptr(GError) error = NULL;
  double t0 = first_thickness (c);
  g_autofree char *copy = NULL, *other = NULL;
  g_autoptr(LaminaConstruction) from_approved = NULL, from_draft = NULL;

  ((LaminaLayer *) c->layers->pdata[0])->thickness = t0 + 40;
  g_assert_true (lamina_library_save_construction (library, c, 1, "A. Author", &error));
  copy = lamina_library_derive_for_job (library, id, TRUE, TRUE, NULL, "E. Newjob", &error);
  g_assert_no_error (error);
  from_approved = lamina_library_dup_construction (library, copy, 0, &error);
  g_assert_cmpfloat (first_thickness (from_approved), ==, t0);
  other = lamina_library_derive_revision_for_job (library, id, 2, TRUE, TRUE, NULL, "E. Newjob", &error);
  g_assert_no_error (error);
  from_draft = lamina_library_dup_construction (library, other, 0, &error);
  g_assert_cmpfloat (first_thickness (from_draft), ==, t0 + 40);
  g_assert_null (lamina_library_derive_revision_for_job (library, id, 9, TRUE, TRUE, NULL, NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/drafts/in-place-and-undo", test_in_place_and_undo);
  g_test_add_func ("/hardening/drafts/pinned", test_pinned_draft);
  g_test_add_func ("/hardening/drafts/derive", test_derive_from_approved);
  return g_test_run ();
}
