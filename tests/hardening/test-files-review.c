/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Safe files and review integrity (issue 7).
 * - The library, its WAL, its folder and the copy kept before a migration
 *   are created with the user's normal permissions (0666/0777 less the
 *   umask, POSIX open(2)/mkdir(2)); exports too.
 * - Exports are atomic: a temporary file beside the target, then rename
 *   (the target's inode changes, no temporary is left, a failed export
 *   leaves the old file), and lamina-cli never overwrites without --force.
 * - An approved revision cannot be changed through the API, the CLI, an
 *   import, or raw SQL on the file; the approval record (who, date, which
 *   revision) is in the exported XML. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <sqlite3.h>
#include <string.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "lamina-hardening-util.h"
#include "lamina-sqlite-private.h"

static guint
mode_of (const char *path)
{
  GStatBuf st;

  g_assert_cmpint (g_stat (path, &st), ==, 0);
  return st.st_mode & 0777;
}

static void
check_umask (mode_t mask)
{
  g_autofree char *dir = g_strdup_printf ("%s/umask-%03o/new-folder", g_get_user_data_dir (),
                                          (guint) mask);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  g_autofree char *old = g_build_filename (dir, "old.sqlite", NULL);
  g_autofree char *xml = g_build_filename (dir, "export.xml", NULL);
  g_autofree char *wal = NULL;
  g_autoptr(GError) error = NULL;
  mode_t saved = umask (mask);

  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, 0, &error);
    g_autoptr(LaminaCatalogue) cat = NULL;

    g_assert_no_error (error);
    wal = g_strconcat (path, "-wal", NULL);
    g_assert_cmpuint (mode_of (path), ==, 0666 & ~mask);
    g_assert_cmpuint (mode_of (dir), ==, 0777 & ~mask);
    if (g_file_test (wal, G_FILE_TEST_EXISTS))
      g_assert_cmpuint (mode_of (wal), ==, 0666 & ~mask);
    cat = lamina_library_export (library, NULL, &error);
    g_assert_no_error (error);
    g_assert_true (lamina_catalogue_write_file (cat, xml, LAMINA_WRITE_DERIVED, &error));
    g_assert_cmpuint (mode_of (xml), ==, 0666 & ~mask);
  }
  /* A library at schema 1 is migrated on open; the copy kept first. */
  g_assert_true (lamina_sqlite_create_at_version (old, 1, &error));
  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (old, 0, &error);
    const char *backup;

    g_assert_no_error (error);
    backup = lamina_library_get_backup_path (library);
    g_assert_nonnull (backup);
    g_assert_cmpuint (mode_of (backup), ==, 0666 & ~mask);
  }
  umask (saved);
}

static void
test_permissions (void)
{
  check_umask (022);
  check_umask (027);
  check_umask (077);
}

static void
test_export_atomic (void)
{
  g_autofree char *dir = g_build_filename (g_get_user_data_dir (), "export", NULL);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  g_autofree char *xml = g_build_filename (dir, "out.xml", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaCatalogue) cat = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  g_autofree char *id = NULL;
  GStatBuf before, after;

  g_mkdir_with_parents (dir, 0700);
  library = lamina_library_open (path, 0, &error);
  c = lamina_hardening_make_wall (library, 3);
  id = lamina_library_create_construction (library, c, "Author", &error);
  g_assert_no_error (error);
  cat = lamina_library_export (library, NULL, &error);
  g_assert_true (g_file_set_contents (xml, "old", -1, NULL));
  g_assert_cmpint (g_stat (xml, &before), ==, 0);
  g_assert_true (lamina_catalogue_write_file (cat, xml, 0, &error));
  g_assert_cmpint (g_stat (xml, &after), ==, 0);
  /* Renamed into place, not rewritten in place. */
  g_assert_cmpuint (before.st_ino, !=, after.st_ino);
  {
    g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
    const char *name;

    while ((name = g_dir_read_name (d)) != NULL)
      g_assert_false (g_str_has_prefix (name, "out.xml."));
  }
  /* A failed export (folder not writable) leaves the old file whole. */
  if (geteuid () != 0)
    {
      g_autofree char *kept = NULL;

      g_assert_cmpint (g_chmod (dir, 0500), ==, 0);
      g_assert_false (lamina_catalogue_write_file (cat, xml, 0, &error));
      g_assert_nonnull (strstr (error->message, "out.xml"));
      g_clear_error (&error);
      g_assert_cmpint (g_chmod (dir, 0700), ==, 0);
      g_assert_true (g_file_get_contents (xml, &kept, NULL, NULL));
      g_assert_true (g_str_has_prefix (kept, "<?xml"));
    }
}

/* ---- review integrity ---------------------------------------------------- */

static int
run_cli (const char *library,
         char      **out,
         char      **err,
         ...) G_GNUC_NULL_TERMINATED;

static int
run_cli (const char *library,
         char      **out,
         char      **err,
         ...)
{
  g_autoptr(GPtrArray) argv = g_ptr_array_new_with_free_func (g_free);
  int status = -1;
  va_list ap;

  g_ptr_array_add (argv, g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli",
                                           "lamina-cli", NULL));
  g_ptr_array_add (argv, g_strdup ("--library"));
  g_ptr_array_add (argv, g_strdup (library));
  va_start (ap, err);
  for (const char *a = va_arg (ap, const char *); a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, g_strdup (a));
  va_end (ap);
  g_ptr_array_add (argv, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               out, err, &status, NULL));
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static void
assert_sql_refused (const char *path,
                    const char *sql)
{
  sqlite3 *db = NULL;
  char *message = NULL;

  g_assert_cmpint (sqlite3_open (path, &db), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_exec (db, sql, NULL, NULL, &message), !=, SQLITE_OK);
  g_assert_nonnull (strstr (message, "immutable"));
  sqlite3_free (message);
  sqlite3_close (db);
}

static void
test_approved_immutable (void)
{
  g_autofree char *dir = g_build_filename (g_get_user_data_dir (), "review", NULL);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  g_autofree char *xml = g_build_filename (dir, "changed.xml", NULL);
  g_autofree char *id = NULL, *approved_state = NULL, *out = NULL, *err = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) approved = NULL;
  int approved_revision;

  g_mkdir_with_parents (dir, 0700);
  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, 0, &error);
    g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, 9);

    id = lamina_library_create_construction (library, c, "Author", &error);
    g_assert_no_error (error);
    g_assert_true (lamina_library_mark_checked (library, id, 1, "C. Checker", &error));
    g_assert_true (lamina_library_approve (library, id, 1, "R. Reviewer", "2099-03-15", &error));
    approved = lamina_library_dup_construction (library, id, 1, &error);
    approved_revision = approved->revision;

    /* API: reviewing an approved revision again is refused. */
    g_assert_false (lamina_library_approve (library, id, 1, "Other", "2099-03-16", &error));
    g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IMMUTABLE);
    g_clear_error (&error);
    g_assert_false (lamina_library_mark_checked (library, id, 1, "Other", &error));
    g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IMMUTABLE);
    g_clear_error (&error);

    /* The export carries the approval record for that revision. */
    {
      g_autoptr(LaminaCatalogue) cat = lamina_library_export (library, NULL, &error);
      gsize len = 0;
      g_autofree char *text = lamina_catalogue_write_to_string (cat, 0, &len, &error);
      g_autoptr(LaminaCatalogue) back = lamina_catalogue_read_memory (text, len, "x", &error);
      LaminaConstruction *b;

      g_assert_nonnull (strstr (text, "<approved by=\"R. Reviewer\" at=\"2099-03-15\"/>"));
      g_assert_nonnull (strstr (text, "status=\"approved\" revision=\"1\""));
      b = lamina_catalogue_find (back, id);
      g_assert_cmpstr (b->approved_by, ==, "R. Reviewer");
      g_assert_cmpstr (b->approved_at, ==, "2099-03-15");
      g_assert_cmpint (b->revision, ==, 1);
      g_assert_cmpint (b->status, ==, LAMINA_STATUS_APPROVED);

      /* A changed copy of it, with a forged approval, to import later. */
      ((LaminaLayer *) b->layers->pdata[0])->thickness = 25;
      g_free (b->approved_by);
      b->approved_by = g_strdup ("Forger");
      g_assert_true (lamina_catalogue_write_file (back, xml, 0, &error));
    }
    approved_state = lamina_hardening_dup_state (library, &error);
  }

  /* Raw SQL on the file: the triggers refuse. */
  assert_sql_refused (path, "UPDATE revision SET approved_by = 'Forger' WHERE revision = 1;");
  assert_sql_refused (path, "UPDATE revision SET status = 'draft' WHERE revision = 1;");
  assert_sql_refused (path, "UPDATE revision SET body = '{}' WHERE revision = 1;");
  assert_sql_refused (path, "DELETE FROM revision WHERE revision = 1;");

  /* CLI: approve or check it again: refused, exit 1. */
  g_assert_cmpint (run_cli (path, &out, &err, "approve", id, "--by", "Other", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "approved"));
  g_clear_pointer (&err, g_free);
  g_clear_pointer (&out, g_free);
  g_assert_cmpint (run_cli (path, &out, &err, "check", id, "--by", "Other", NULL), ==, 1);
  g_clear_pointer (&err, g_free);
  g_clear_pointer (&out, g_free);

  /* CLI import of the changed copy: a conflict is reported, not applied. */
  g_assert_cmpint (run_cli (path, &out, &err, "import", xml, NULL), !=, 2);
  g_assert_nonnull (strstr (out, "conflict") ? out : strstr (err, "conflict") ? err : NULL);
  {
    g_autofree char *state = lamina_hardening_dup_file_state (path, NULL);

    g_assert_cmpstr (state, ==, approved_state);
  }
  g_clear_pointer (&err, g_free);
  g_clear_pointer (&out, g_free);

  /* With --revise-approved it becomes a new draft on top; revision 1 and
   * its approval stay as they were (and the forged name is not taken). */
  g_assert_cmpint (run_cli (path, &out, &err, "import", "--revise-approved", xml, NULL), ==, 0);
  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING,
                                                            &error);
    g_autoptr(LaminaConstruction) first = lamina_library_dup_construction (library, id, 1, &error);
    g_autoptr(LaminaConstruction) latest = lamina_library_dup_construction (library, id, 0, &error);

    g_assert_true (lamina_construction_equal_content (first, approved));
    g_assert_cmpint (first->status, ==, LAMINA_STATUS_APPROVED);
    g_assert_cmpstr (first->approved_by, ==, "R. Reviewer");
    g_assert_cmpstr (first->approved_at, ==, "2099-03-15");
    g_assert_cmpint (latest->revision, ==, approved_revision + 1);
    g_assert_cmpint (latest->status, ==, LAMINA_STATUS_DRAFT);
    g_assert_null (latest->approved_by);

    /* API: a save on top of the approved revision starts a new draft. */
    ((LaminaLayer *) latest->layers->pdata[0])->thickness = 30;
    g_assert_true (lamina_library_save_construction (library, latest, latest->revision, "Editor",
                                                     &error));
    g_assert_cmpint (latest->revision, ==, approved_revision + 2);
    g_clear_pointer (&first, lamina_construction_free);
    first = lamina_library_dup_construction (library, id, 1, &error);
    g_assert_true (lamina_construction_equal_content (first, approved));
  }
}

/* An imported document cannot approve a draft of the library by claiming
 * it: approval is a person's act in this library, never data taken in. */
static void
test_import_cannot_approve (void)
{
  g_autofree char *path = g_build_filename (g_get_user_data_dir (), "forge.sqlite", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaConstruction) after = NULL;
  g_autofree char *id = NULL;

  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  library = lamina_library_open (path, 0, &error);
  c = lamina_hardening_make_wall (library, 11);
  id = lamina_library_create_construction (library, c, "Author", &error);
  g_assert_no_error (error);
  {
    LaminaConstruction *forged = lamina_library_dup_construction (library, id, 0, &error);

    forged->status = LAMINA_STATUS_APPROVED;
    forged->approved_by = g_strdup ("Forger");
    forged->approved_at = g_strdup ("2024-01-01");
    g_ptr_array_add (cat->constructions, forged);
  }
  report = lamina_library_import (library, cat, 0, "Importer", &error);
  g_assert_no_error (error);
  after = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpint (after->status, !=, LAMINA_STATUS_APPROVED);
  g_assert_null (after->approved_by);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/files/permissions", test_permissions);
  g_test_add_func ("/hardening/files/export-atomic", test_export_atomic);
  g_test_add_func ("/hardening/review/approved-immutable", test_approved_immutable);
  g_test_add_func ("/hardening/review/import-cannot-approve", test_import_cannot_approve);
  return g_test_run ();
}
