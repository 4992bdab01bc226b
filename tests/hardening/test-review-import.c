/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Imported review records are not this library's approvals, through the
 * API and lamina-cli.
 * - Without --keep-review a construction that another library approved
 *   arrives as a draft; its history keeps the source's record in words
 *   ("approved in the source library by … on …").
 * - With --keep-review the state is kept, and history and sheet say it
 *   was approved elsewhere.
 * (Common practice: an approval is the signature of a person responsible
 * in the office that issues the document; another office's signature is
 * information, not an approval here.) */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <string.h>
#include <sys/wait.h>

#include "lamina-hardening-util.h"

/* A document from another office: one wall, checked and approved there. */
static LaminaCatalogue *
approved_elsewhere (LaminaLibrary *library)
{
  LaminaCatalogue *cat = lamina_catalogue_new ();
  LaminaConstruction *c = lamina_hardening_make_wall (library, 7);

  g_free (c->id);
  c->id = g_strdup ("other-office-wall");
  c->status = LAMINA_STATUS_APPROVED;
  c->revision = 3;
  c->modified_by = g_strdup ("X. Drafter");
  c->modified_at = g_strdup ("2026-02-20T09:00:00Z");
  c->checked_by = g_strdup ("C. Outside");
  c->checked_at = g_strdup ("2026-02-27T10:00:00Z");
  c->approved_by = g_strdup ("B. Outside");
  c->approved_at = g_strdup ("2026-03-01");
  g_ptr_array_add (cat->constructions, c);
  return cat;
}

static const char *
head_comment (LaminaLibrary *library,
              const char    *id)
{
  static char comment[512];
  g_autoptr(GPtrArray) history = lamina_library_dup_history (library, id, NULL);

  g_strlcpy (comment, ((LaminaRevisionInfo *) history->pdata[0])->comment, sizeof comment);
  return comment;
}

static void
test_api (void)
{
  g_autofree char *path = NULL, *path2 = NULL;
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("import.sqlite", &path);
  g_autoptr(LaminaLibrary) keeping = lamina_hardening_open_library ("keep.sqlite", &path2);
  g_autoptr(LaminaCatalogue) cat = approved_elsewhere (library);
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(GError) error = NULL;

  report = lamina_library_import (library, cat, LAMINA_IMPORT_DEFAULT, "I. Importer", &error);
  g_assert_no_error (error);
  c = lamina_library_dup_construction (library, "other-office-wall", 0, &error);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_DRAFT);
  g_assert_null (c->checked_by);
  g_assert_null (c->approved_by);
  g_assert_cmpstr (c->source_review, ==,
                   "approved in the source library by B. Outside on 2026-03-01, "
                   "checked by C. Outside on 2026-02-27");
  g_assert_nonnull (strstr (head_comment (library, c->id),
                            "imported as a draft; approved in the source library by B. Outside"));
  /* Our reviewers can now check and approve it as usual. */
  g_assert_true (lamina_library_mark_checked (library, c->id, 0, "C. Checker", &error));
  g_assert_true (lamina_library_approve (library, c->id, 0, "B. Boss", NULL, &error));
  g_assert_no_error (error);
  g_clear_pointer (&report, lamina_import_report_free);
  /* The same document again: unchanged, whatever its review says. */
  report = lamina_library_import (library, cat, LAMINA_IMPORT_DEFAULT, "I. Importer", &error);
  g_assert_cmpuint (report->n_skipped, ==, 1);
  g_clear_pointer (&report, lamina_import_report_free);

  /* Kept on request: approved, and said to be approved elsewhere. */
  report = lamina_library_import (keeping, cat, LAMINA_IMPORT_KEEP_REVIEW, "I. Importer", &error);
  g_assert_no_error (error);
  g_clear_pointer (&c, lamina_construction_free);
  c = lamina_library_dup_construction (keeping, "other-office-wall", 0, &error);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpstr (c->approved_by, ==, "B. Outside");
  g_assert_nonnull (c->source_review);
  g_assert_nonnull (strstr (head_comment (keeping, c->id), "approved elsewhere"));
  /* An edit of it is our draft and carries no record of the source. */
  ((LaminaLayer *) c->layers->pdata[0])->thickness += 10;
  g_assert_true (lamina_library_save_construction (keeping, c, c->revision, "A. Author", &error));
  g_clear_pointer (&c, lamina_construction_free);
  c = lamina_library_dup_construction (keeping, "other-office-wall", 0, &error);
  g_assert_null (c->source_review);
}

static int
run_cli (const char  *library,
         char       **out,
         const char  *a,
         const char  *b,
         const char  *c)
{
  g_autofree char *cli = g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL);
  const char *argv[] = { cli, "--library", library, a, b, c, NULL };
  int status = -1;

  g_free (*out);
  *out = NULL;
  g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_STDERR_TO_DEV_NULL, NULL, NULL,
                               out, NULL, &status, NULL));
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static void
test_cli (void)
{
  g_autofree char *path = NULL, *path2 = NULL, *out = NULL;
  g_autofree char *xml = g_build_filename (g_get_user_data_dir (), "other-office.xml", NULL);
  g_autoptr(GError) error = NULL;

  {
    g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("cli.sqlite", &path);
    g_autoptr(LaminaLibrary) keeping = lamina_hardening_open_library ("cli-keep.sqlite", &path2);
    g_autoptr(LaminaCatalogue) cat = approved_elsewhere (library);

    g_assert_true (lamina_catalogue_write_file (cat, xml, 0, &error));
    g_assert_no_error (error);
  }
  g_assert_cmpint (run_cli (path, &out, "import", xml, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "(draft)"));
  g_assert_cmpint (run_cli (path, &out, "history", "other-office-wall", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "approved in the source library by B. Outside on 2026-03-01"));
  g_assert_cmpint (run_cli (path, &out, "list", "--status", "approved"), ==, 0);
  g_assert_null (strstr (out, "HW-0007"));

  g_assert_cmpint (run_cli (path2, &out, "import", "--keep-review", xml), ==, 0);
  g_assert_nonnull (strstr (out, "(approved)"));
  g_assert_cmpint (run_cli (path2, &out, "history", "other-office-wall", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "approved elsewhere"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/import-review/api", test_api);
  g_test_add_func ("/hardening/import-review/cli", test_cli);
  return g_test_run ();
}
