/* SPDX-License-Identifier: GPL-3.0-or-later */
/* A job variant's entry carries, for the sheet set, one note naming its
 * origin and what it changes from the origin's pinned revision (the same
 * revision diff the history window shows); other entries get none. */
#include <string.h>

#include "lamina-revision-diff.h"
#include "lamina-store-test-util.h"

static void
test_variant_notes (void)
{
  g_autofree char *path = test_library_path ("variant-notes.sqlite");
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_autoptr(LaminaConstruction) wall = NULL;
  g_autoptr(LaminaConstruction) variant = NULL;
  g_autoptr(LaminaJob) job = lamina_job_new ("j", "Variant notes");
  g_autoptr(LaminaJobReport) report = NULL;
  g_autofree char *id = NULL, *copy = NULL;
  LaminaJobEntry *e;
  const LaminaJobLine *line;
  const char *note;

  g_assert_no_error (error);
  wall = test_make_wall (library, "EW-145", "Test wall", NULL, 145);
  id = lamina_library_create_construction (library, wall, NULL, &error);
  g_assert_no_error (error);
  copy = lamina_library_derive_job_variant (library, id, 1, job->name, NULL, &error);
  g_assert_no_error (error);
  variant = lamina_library_dup_construction (library, copy, 0, &error);
  ((LaminaLayer *) variant->layers->pdata[1])->thickness = 195;
  g_assert_true (lamina_library_save_construction (library, variant, 1, NULL, &error));
  lamina_job_add_entry (job, lamina_job_entry_new (id, 1, "external-wall"));
  e = lamina_job_add_entry (job, lamina_job_entry_new (copy, 2, "external-wall"));
  e->origin = g_strdup (id);
  e->origin_revision = 1;
  g_assert_true (lamina_library_create_job (library, job, &error));
  g_assert_no_error (error);

  report = lamina_library_check_job (library, "j", &error);
  g_assert_no_error (error);
  lamina_revision_diff_note_variants (library, report);
  line = report->check->lines->pdata[0];
  for (guint i = 0; i < line->notes->len; i++)
    g_assert_null (strstr (line->notes->pdata[i], "Job variant"));
  line = report->check->lines->pdata[1];
  note = line->notes->pdata[line->notes->len - 1];
  g_assert_true (g_str_has_prefix (note, "Job variant of "));
  g_assert_nonnull (strstr (note, " revision 1: "));
  g_assert_nonnull (strstr (note, "Layer 2"));
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/editing/variant-notes", test_variant_notes);
  return g_test_run ();
}
