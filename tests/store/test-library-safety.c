/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Library safety (issue 10): read-only libraries, verification of a
 * library damaged on purpose, rolling backups and their restoration, and
 * a busy library that waits, with real second processes (lamina-cli).
 *
 * These are contracts of the program, not of a published method; the
 * figures compared by verify are EN ISO 6946 results recalculated by the
 * engine, whose own checks against the standard live in tests/core. */
#include <glib/gstdio.h>
#include <sqlite3.h>
#include <string.h>
#include <unistd.h>

#include "lamina-library-safety.h"
#include "lamina-sqlite-private.h"
#include "lamina-store-test-util.h"

#include "lamina-cli-test-util.h"

/* A fresh library with two walls by "Ann Author"; the first is checked
 * by "Bo Checker" and approved by "Cy Approver" (four eyes). */
static char *
make_library (const char *name,
              char      **approved_id)
{
  char *path = test_library_path (name);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(LaminaConstruction) b = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  g_autofree char *id_b = NULL;

  g_unlink (path);
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  a = test_make_wall (library, "SW-1", "Safety wall one", NULL, 160);
  b = test_make_wall (library, "SW-2", "Safety wall two", NULL, 200);
  id = lamina_library_create_construction (library, a, "Ann Author", &error);
  g_assert_no_error (error);
  id_b = lamina_library_create_construction (library, b, "Ann Author", &error);
  g_assert_no_error (error);
  g_assert_true (lamina_library_mark_checked (library, id, 1, "Bo Checker", &error));
  g_assert_no_error (error);
  g_assert_true (lamina_library_approve (library, id, 1, "Cy Approver", NULL, &error));
  g_assert_no_error (error);
  if (approved_id != NULL)
    *approved_id = g_steal_pointer (&id);
  return path;
}

static void
assert_read_only_error (GError     *error,
                        const char *path)
{
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_READ_ONLY);
  g_assert_true (g_str_has_prefix (error->message, path));
  g_assert_nonnull (strstr (error->message, "read-only"));
  g_assert_nonnull (strstr (error->message, "nothing was changed"));
}

/* Every kind of write is refused with the one message; reading works and
 * the file is byte for byte as it was. */
static void
test_read_only_flag (void)
{
  g_autofree char *id = NULL;
  g_autofree char *path = make_library ("ro-flag.sqlite", &id);
  g_autofree char *before = test_checksum (path);
  g_autofree char *after = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaConstruction) extra = NULL;
  g_autoptr(LaminaMaterial) m = NULL;
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  LaminaLibraryQuery query;
  char *new_id;

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_READ_ONLY, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_library_is_read_only (library));
  g_assert_cmpstr (lamina_library_get_read_only_reason (library), ==, "opened read-only");

  lamina_library_query_init (&query);
  rows = lamina_library_search (library, &query, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (rows->len, ==, 2);
  c = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_no_error (error);
  catalogue = lamina_library_export (library, NULL, &error);
  g_assert_no_error (error);

  m = lamina_library_dup_material (library, "typical-mineral-wool-035", &error);
  g_assert_no_error (error);
  g_assert_false (lamina_library_put_material (library, m, &error));
  assert_read_only_error (error, path);
  g_clear_error (&error);

  extra = test_make_wall (library, "SW-9", "Refused wall", NULL, 100);
  new_id = lamina_library_create_construction (library, extra, "Ann Author", &error);
  g_assert_null (new_id);
  assert_read_only_error (error, path);
  g_clear_error (&error);

  g_assert_false (lamina_library_delete_construction (library, id, "Ann Author", &error));
  assert_read_only_error (error, path);
  g_clear_error (&error);

  g_assert_false (lamina_library_set_review_policy (library, LAMINA_REVIEW_SINGLE, &error));
  assert_read_only_error (error, path);
  g_clear_error (&error);

  g_assert_false (lamina_library_set_backup_settings (library, "elsewhere", 3, &error));
  assert_read_only_error (error, path);
  g_clear_error (&error);

  /* An import of a changed document plans, then is refused whole. */
  ((LaminaConstruction *) catalogue->constructions->pdata[1])->name = (g_free (((LaminaConstruction *) catalogue->constructions->pdata[1])->name), g_strdup ("Renamed"));
  report = lamina_library_import (library, catalogue, LAMINA_IMPORT_DEFAULT, "Ann Author", &error);
  g_assert_null (report);
  assert_read_only_error (error, path);
  g_clear_error (&error);

  /* No copies of a library nothing can change through us. */
  g_assert_null (lamina_library_backup_daily (library, &error));
  g_assert_no_error (error);

  g_clear_object (&library);
  after = test_checksum (path);
  g_assert_cmpstr (before, ==, after);
}

/* Runs lamina-cli as an unprivileged user when we are root (permissions
 * do not bind root); returns the exit status. */
static int
run_as_user (const char *library,
             char      **out,
             char      **err,
             const char *first,
             ...)
{
  g_autoptr(GPtrArray) args = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GError) error = NULL;
  g_auto(GStrv) env = g_get_environ ();
  int status = 0;
  va_list ap;

  if (geteuid () == 0)
    {
      g_ptr_array_add (args, g_strdup ("setpriv"));
      g_ptr_array_add (args, g_strdup ("--reuid=65534"));
      g_ptr_array_add (args, g_strdup ("--regid=65534"));
      g_ptr_array_add (args, g_strdup ("--clear-groups"));
    }
  g_ptr_array_add (args, g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL));
  g_ptr_array_add (args, g_strdup ("--library"));
  g_ptr_array_add (args, g_strdup (library));
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (args, g_strdup (a));
  va_end (ap);
  g_ptr_array_add (args, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) args->pdata, env, G_SPAWN_SEARCH_PATH, NULL, NULL,
                               out, err, &status, &error));
  g_assert_no_error (error);
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static void
check_read_only_cli (const char *base,
                     const char *library,
                     const char *id,
                     const char *reason)
{
  g_autofree char *before = test_checksum (library);
  g_autofree char *after = NULL;
  g_autofree char *pdf = g_build_filename (base, "out", "sheet.pdf", NULL);
  g_autofree char *xml = g_build_filename (base, "out", "export.xml", NULL);
  g_autofree char *out = NULL, *err = NULL;
  g_auto(GStrv) lines = NULL;

  g_assert_cmpint (run_as_user (library, &out, &err, "list", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "SW-1"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_as_user (library, &out, &err, "show", "SW-1", NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_as_user (library, &out, &err, "export", "-o", xml, NULL), ==, 0);
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_as_user (library, &out, &err, "sheet", "SW-1", "-o", pdf, NULL), ==, 0);
  g_assert_true (g_file_test (pdf, G_FILE_TEST_IS_REGULAR));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* A write: one clear line, exit 1. */
  g_assert_cmpint (run_as_user (library, &out, &err, "check", "SW-2", "--by", "Bo Checker", NULL), ==, 1);
  lines = g_strsplit (g_strchomp (err), "\n", -1);
  g_assert_cmpuint (g_strv_length (lines), ==, 1);
  g_assert_nonnull (strstr (err, "the library is read-only"));
  g_assert_nonnull (strstr (err, reason));
  g_assert_nonnull (strstr (err, "nothing was changed"));
  after = test_checksum (library);
  g_assert_cmpstr (before, ==, after);
  g_unlink (pdf);
  g_unlink (xml);
  (void) id;
}

/* Real permissions: a read-only file, then a read-only folder. */
static void
test_read_only_permissions (void)
{
  g_autofree char *id = NULL;
  g_autofree char *made = make_library ("ro-perm.sqlite", &id);
  g_autofree char *base = g_dir_make_tmp ("lamina-ro-XXXXXX", NULL);
  g_autofree char *folder = g_build_filename (base, "share", NULL);
  g_autofree char *library = g_build_filename (folder, "office.sqlite", NULL);
  g_autofree char *out_dir = g_build_filename (base, "out", NULL);
  g_autofree char *data = NULL;
  gsize len = 0;
  g_autofree char *setpriv = g_find_program_in_path ("setpriv");

  if (geteuid () == 0 && setpriv == NULL)
    {
      g_test_skip ("running as root without setpriv: permissions cannot be tested");
      return;
    }
  g_assert_true (g_file_get_contents (made, &data, &len, NULL));
  g_assert_cmpint (g_chmod (base, 0755), ==, 0);
  g_assert_cmpint (g_mkdir (folder, 0755), ==, 0);
  g_assert_cmpint (g_mkdir (out_dir, 0777), ==, 0);
  g_assert_cmpint (g_chmod (out_dir, 0777), ==, 0);
  g_assert_true (g_file_set_contents (library, data, len, NULL));
  g_setenv ("XDG_DATA_HOME", out_dir, TRUE);

  g_assert_cmpint (g_chmod (library, 0444), ==, 0);
  g_assert_cmpint (g_chmod (folder, 0777), ==, 0);
  check_read_only_cli (base, library, id, "the file is read-only");

  g_assert_cmpint (g_chmod (library, 0666), ==, 0);
  g_assert_cmpint (g_chmod (folder, 0555), ==, 0);
  check_read_only_cli (base, library, id, "the folder cannot be written");

  g_chmod (folder, 0755);
  g_unsetenv ("XDG_DATA_HOME");
}

/* Changes a stored column of revision @revision of @id behind Lamina's
 * back, as a tool or a bad disk could: the triggers that guard approved
 * revisions are put aside for the change and put back. */
static void
tamper (const char *path,
        const char *id,
        int         revision,
        const char *assignment)
{
  sqlite3 *db = NULL;
  sqlite3_stmt *stmt = NULL;
  g_autoptr(GPtrArray) triggers = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *sql = g_strdup_printf ("UPDATE revision SET %s WHERE construction_id = '%s'"
                                          " AND revision = %d;", assignment, id, revision);

  g_assert_cmpint (sqlite3_open (path, &db), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_prepare_v2 (db, "SELECT name, sql FROM sqlite_master WHERE type = 'trigger'"
                                           " AND tbl_name = 'revision';", -1, &stmt, NULL), ==, SQLITE_OK);
  while (sqlite3_step (stmt) == SQLITE_ROW)
    {
      g_ptr_array_add (names, g_strdup ((const char *) sqlite3_column_text (stmt, 0)));
      g_ptr_array_add (triggers, g_strdup ((const char *) sqlite3_column_text (stmt, 1)));
    }
  sqlite3_finalize (stmt);
  for (guint i = 0; i < names->len; i++)
    {
      g_autofree char *drop = g_strdup_printf ("DROP TRIGGER \"%s\";", (char *) names->pdata[i]);
      g_assert_cmpint (sqlite3_exec (db, drop, NULL, NULL, NULL), ==, SQLITE_OK);
    }
  g_assert_cmpint (sqlite3_exec (db, sql, NULL, NULL, NULL), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_changes (db), ==, 1);
  for (guint i = 0; i < triggers->len; i++)
    g_assert_cmpint (sqlite3_exec (db, triggers->pdata[i], NULL, NULL, NULL), ==, SQLITE_OK);
  sqlite3_close (db);
}

static LaminaVerifyReport *
verify_path (const char *path)
{
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  LaminaVerifyReport *report;

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  report = lamina_library_verify (library, &error);
  g_assert_no_error (error);
  return report;
}

static void
test_verify_figures (void)
{
  g_autofree char *id = NULL;
  g_autofree char *path = make_library ("verify.sqlite", &id);
  g_autofree char *out = NULL, *err = NULL;
  g_autoptr(LaminaVerifyReport) sound = verify_path (path);
  g_autoptr(LaminaVerifyReport) figure = NULL;
  g_autoptr(LaminaVerifyReport) date = NULL;

  g_assert_true (sound->storage_checked);
  g_assert_cmpuint (sound->n_constructions, ==, 2);
  g_assert_cmpuint (sound->n_approved, ==, 1);
  g_assert_cmpuint (sound->n_reviews, ==, 2);   /* the check and the approval */
  g_assert_cmpuint (sound->problems->len, ==, 0);

  g_free (library_path);
  library_path = g_strdup (path);
  g_assert_cmpint (run (&out, &err, "verify", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "no problems found"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* A stored figure changed by 0.05 W/(m²·K): found, with both values. */
  tamper (path, id, 1, "u_corrected = u_corrected + 0.05");
  figure = verify_path (path);
  g_assert_cmpuint (figure->problems->len, ==, 1);
  g_assert_nonnull (strstr (figure->problems->pdata[0], "SW-1 revision 1 (approved)"));
  g_assert_nonnull (strstr (figure->problems->pdata[0], "differs"));
  g_assert_cmpint (run (&out, &err, "verify", NULL), ==, 1);
  g_assert_nonnull (strstr (out, "SW-1 revision 1 (approved)"));
  g_assert_nonnull (strstr (err, "1 problem found"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);

  /* An approval dated before the revision was made. */
  tamper (path, id, 1, "u_corrected = u_corrected - 0.05, approved_at = '2001-01-01'");
  date = verify_path (path);
  g_assert_cmpuint (date->problems->len, ==, 1);
  g_assert_nonnull (strstr (date->problems->pdata[0], "approved on 2001-01-01, before it was modified"));
}

static guint
page_of (const char *path,
         const char *name)
{
  sqlite3 *db = NULL;
  sqlite3_stmt *stmt = NULL;
  guint page = 0;

  g_assert_cmpint (sqlite3_open_v2 (path, &db, SQLITE_OPEN_READONLY, NULL), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_prepare_v2 (db, "SELECT rootpage FROM sqlite_master WHERE name = ?1;",
                                       -1, &stmt, NULL), ==, SQLITE_OK);
  sqlite3_bind_text (stmt, 1, name, -1, SQLITE_STATIC);
  if (sqlite3_step (stmt) == SQLITE_ROW)
    page = sqlite3_column_int (stmt, 0);
  sqlite3_finalize (stmt);
  sqlite3_close (db);
  g_assert_cmpuint (page, >, 1);
  return page;
}

static void
overwrite (const char *path,
           gint64      offset,
           gsize       len)
{
  FILE *f = fopen (path, "r+b");
  g_autofree char *junk = g_malloc (len);

  memset (junk, 0xA5, len);
  g_assert_nonnull (f);
  g_assert_cmpint (fseek (f, offset, SEEK_SET), ==, 0);
  g_assert_cmpuint (fwrite (junk, 1, len, f), ==, len);
  fclose (f);
}

/* Pages overwritten: verify says what SQLite found; a command meeting the
 * damage names the library and its last good backup. */
static void
test_verify_pages (void)
{
  g_autofree char *path = make_library ("pages.sqlite", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(LaminaVerifyReport) report = NULL;
  g_autofree char *backup = NULL;
  g_autofree char *out = NULL, *err = NULL;
  LaminaLibraryQuery query;
  guint page;

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  backup = lamina_library_backup_now (library, &error);
  g_assert_no_error (error);
  g_clear_object (&library);

  page = page_of (path, "construction_by_u");
  overwrite (path, (gint64) (page - 1) * 4096, 4096);
  report = verify_path (path);
  g_assert_true (report->storage_checked);
  g_assert_cmpuint (report->problems->len, >, 0);
  g_assert_true (g_str_has_prefix (report->problems->pdata[0], "storage: "));

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  lamina_library_query_init (&query);
  query.sort = LAMINA_SORT_U;
  rows = lamina_library_search (library, &query, &error);
  g_assert_null (rows);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT);
  g_assert_true (g_str_has_prefix (error->message, path));
  g_assert_nonnull (strstr (error->message, " is damaged ("));
  g_assert_nonnull (strstr (error->message, backup));
  g_assert_nonnull (strstr (error->message, "the last good backup is"));

  /* The day's copy of a damaged library is refused, not rotated in. */
  g_clear_pointer (&backup, g_free);
  g_clear_error (&error);
  backup = lamina_library_backup_now (library, &error);
  g_assert_null (backup);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT);
  g_clear_object (&library);

  g_free (library_path);
  library_path = g_strdup (path);
  g_assert_cmpint (run (&out, &err, "verify", NULL), ==, 1);
  g_assert_nonnull (strstr (out, "storage: "));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  /* The import names the library, not the document it reads. */
  {
    g_autofree char *doc = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo",
                                             "lamina-demo.xml", NULL);

    g_assert_cmpint (run (&out, &err, "import", doc, NULL), ==, 1);
    g_assert_null (strstr (err, doc));
    g_assert_nonnull (strstr (err, " is damaged ("));
  }
}

static guint
count_constructions (const char *path)
{
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, NULL);
  LaminaLibraryQuery query;

  g_assert_nonnull (library);
  lamina_library_query_init (&query);
  return (guint) lamina_library_count (library, &query, NULL);
}

static void
test_backup_rotation (void)
{
  g_autofree char *path = make_library ("rotate.sqlite", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) list = NULL;
  g_autofree char *daily = NULL;
  g_autofree char *dir = NULL;
  g_autofree char *beside = g_strconcat (path, ".backups", NULL);
  char *made[5];

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  dir = lamina_library_dup_backup_dir (library);
  g_assert_cmpstr (dir, ==, beside);
  daily = lamina_library_backup_daily (library, &error);
  g_assert_no_error (error);
  g_assert_nonnull (daily);
  g_assert_true (g_str_has_prefix (daily, beside));
  /* Once a day. */
  g_assert_null (lamina_library_backup_daily (library, &error));
  g_assert_no_error (error);

  g_assert_true (lamina_library_set_backup_settings (library, NULL, 3, &error));
  g_assert_no_error (error);
  for (guint i = 0; i < G_N_ELEMENTS (made); i++)
    {
      made[i] = lamina_library_backup_now (library, &error);
      g_assert_no_error (error);
    }
  list = lamina_backup_list (path, dir);
  g_assert_cmpuint (list->len, ==, 3);
  g_assert_cmpstr (list->pdata[0], ==, made[4]);
  g_assert_cmpstr (list->pdata[1], ==, made[3]);
  g_assert_cmpstr (list->pdata[2], ==, made[2]);
  /* Each copy stands alone (no journal beside it) and is a library. */
  for (guint i = 0; i < list->len; i++)
    {
      g_autofree char *wal = g_strconcat (list->pdata[i], "-wal", NULL);

      g_assert_false (g_file_test (wal, G_FILE_TEST_EXISTS));
      g_assert_cmpuint (count_constructions (list->pdata[i]), ==, 2);
    }
  for (guint i = 0; i < G_N_ELEMENTS (made); i++)
    g_free (made[i]);

  /* A folder of the office's choice, relative to the library. */
  g_assert_true (lamina_library_set_backup_settings (library, "kept-copies", -1, &error));
  g_clear_pointer (&dir, g_free);
  dir = lamina_library_dup_backup_dir (library);
  g_assert_true (g_str_has_suffix (dir, "/kept-copies"));
  /* The environment wins (the CLI's --dir). */
  g_setenv ("LAMINA_BACKUP_DIR", "/nonexistent-lamina-test", TRUE);
  g_clear_pointer (&dir, g_free);
  dir = lamina_library_dup_backup_dir (library);
  g_assert_cmpstr (dir, ==, "/nonexistent-lamina-test");
  g_unsetenv ("LAMINA_BACKUP_DIR");
}

/* lamina-cli --library LIB restore with @input (NULL: nothing) on its
 * standard input. */
static int
run_with_input (const char  *input,
                char       **out,
                char       **err)
{
  g_autofree char *cli = g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL);
  g_autofree char *command = g_strdup_printf ("printf '%s' | '%s' --library '%s' restore",
                                              input ? input : "", cli, library_path);
  const char *argv[] = { "/bin/sh", "-c", command, NULL };
  g_autoptr(GError) error = NULL;
  int status = 0;

  g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               out, err, &status, &error));
  g_assert_no_error (error);
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static void
test_restore (void)
{
  g_autofree char *path = make_library ("restore.sqlite", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaConstruction) extra = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *backup = NULL;
  g_autofree char *kept = NULL;
  g_autofree char *new_id = NULL;
  g_autofree char *out = NULL, *err = NULL;

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  backup = lamina_library_backup_now (library, &error);
  g_assert_no_error (error);
  extra = test_make_wall (library, "SW-3", "Made after the backup", NULL, 120);
  new_id = lamina_library_create_construction (library, extra, "Ann Author", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (count_constructions (path), ==, 3);

  /* Round trip, with the library still open here: the open connection
   * sees the restored content. */
  g_assert_true (lamina_library_restore_backup (path, backup, NULL, &kept, &error));
  g_assert_no_error (error);
  g_assert_cmpuint (count_constructions (path), ==, 2);
  {
    LaminaLibraryQuery query;

    lamina_library_query_init (&query);
    g_assert_cmpint (lamina_library_count (library, &query, NULL), ==, 2);
  }
  g_assert_nonnull (kept);
  g_assert_nonnull (strstr (kept, "-before-restore"));
  g_assert_cmpuint (count_constructions (kept), ==, 3);
  g_clear_object (&library);
  g_clear_pointer (&kept, g_free);

  /* The file lost: the copy comes back. */
  g_assert_cmpint (g_unlink (path), ==, 0);
  g_assert_true (lamina_library_restore_backup (path, backup, NULL, &kept, &error));
  g_assert_no_error (error);
  g_assert_null (kept);
  g_assert_cmpuint (count_constructions (path), ==, 2);

  /* Damaged beyond opening: replaced whole, the damaged file kept aside. */
  overwrite (path, 0, 100);
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_null (library);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT);
  g_assert_nonnull (strstr (error->message, "the last good backup is"));
  g_clear_error (&error);
  g_assert_true (lamina_library_restore_backup (path, backup, NULL, &kept, &error));
  g_assert_no_error (error);
  g_assert_nonnull (strstr (kept, "-damaged"));
  g_assert_cmpuint (count_constructions (path), ==, 2);

  /* A damaged copy is refused and nothing changes. */
  {
    g_autofree char *bad = g_strconcat (backup, ".bad.sqlite", NULL);
    g_autofree char *data = NULL;
    gsize len = 0;

    g_assert_true (g_file_get_contents (backup, &data, &len, NULL));
    g_assert_true (g_file_set_contents (bad, data, len, NULL));
    overwrite (bad, (gint64) (page_of (bad, "construction_by_u") - 1) * 4096, 4096);
    g_assert_false (lamina_library_restore_backup (path, bad, NULL, NULL, &error));
    g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT);
    g_clear_error (&error);
    g_unlink (bad);
  }

  /* A copy made before this version's format (an upgrade since): it is
   * brought up to date on the way in, and the copy itself is untouched. */
  {
    g_autofree char *old_copy = g_strconcat (backup, ".old.sqlite", NULL);
    g_autofree char *sum = NULL;
    g_autofree char *sum_after = NULL;

    g_assert_true (lamina_sqlite_create_at_version (old_copy, LAMINA_LIBRARY_SCHEMA_VERSION - 1, &error));
    g_assert_no_error (error);
    sum = test_checksum (old_copy);
    g_clear_pointer (&kept, g_free);
    g_assert_true (lamina_library_restore_backup (path, old_copy, NULL, &kept, &error));
    g_assert_no_error (error);
    sum_after = test_checksum (old_copy);
    g_assert_cmpstr (sum, ==, sum_after);
    g_assert_cmpuint (count_constructions (path), ==, 0);
    {
      g_autoptr(LaminaLibrary) reopened = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);

      g_assert_no_error (error);
      g_assert_cmpint (lamina_library_get_opened_version (reopened), ==, LAMINA_LIBRARY_SCHEMA_VERSION);
    }
    g_unlink (old_copy);
    /* No working copies are left beside the library. */
    {
      g_autofree char *folder = g_path_get_dirname (path);
      g_autoptr(GDir) d = g_dir_open (folder, 0, NULL);
      const char *name;

      while ((name = g_dir_read_name (d)) != NULL)
        g_assert_false (g_str_has_prefix (name, ".restore-restoring"));
    }
  }

  /* The command asks first (no answer, "n": not restored; "y": restored);
   * --yes is for scripts. */
  g_free (library_path);
  library_path = g_strdup (path);
  g_assert_cmpint (run_with_input (NULL, &out, &err), ==, 1);
  g_assert_nonnull (strstr (err, "not restored"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_with_input ("n\n", &out, &err), ==, 1);
  g_assert_nonnull (strstr (err, "Replace the library"));
  g_assert_nonnull (strstr (err, "not restored"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run_with_input ("y\n", &out, &err), ==, 0);
  g_assert_nonnull (strstr (out, "restored from"));
  g_clear_pointer (&out, g_free);
  g_clear_pointer (&err, g_free);
  g_assert_cmpint (run (&out, &err, "restore", "--yes", NULL), ==, 0);
  g_assert_nonnull (strstr (out, "restored from"));
  g_assert_nonnull (strstr (out, "is kept as"));
}

/* ---- A busy library: real second processes ---------------------------- */

static sqlite3 *
hold_write_lock (const char *path)
{
  sqlite3 *db = NULL;

  g_assert_cmpint (sqlite3_open (path, &db), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_exec (db, "BEGIN IMMEDIATE;", NULL, NULL, NULL), ==, SQLITE_OK);
  return db;
}

static void
release (sqlite3 *db)
{
  g_assert_cmpint (sqlite3_exec (db, "ROLLBACK;", NULL, NULL, NULL), ==, SQLITE_OK);
  sqlite3_close (db);
}

static void
test_busy_gives_up (void)
{
  g_autofree char *path = make_library ("busy.sqlite", NULL);
  g_autofree char *out = NULL, *err = NULL;
  g_autofree char *pid = g_strdup_printf ("process %ld", (long) getpid ());
  gint64 start;
  double took;
  sqlite3 *db;

  g_free (library_path);
  library_path = g_strdup (path);
  db = hold_write_lock (path);
  g_setenv ("LAMINA_BUSY_TIMEOUT", "1.5", TRUE);
  start = g_get_monotonic_time ();
  g_assert_cmpint (run (&out, &err, "check", "SW-2", "--by", "Bo Checker", NULL), ==, 1);
  took = (g_get_monotonic_time () - start) / 1e6;
  g_unsetenv ("LAMINA_BUSY_TIMEOUT");
  release (db);
  /* It waited (not an instant "database is locked"), said so, and named
   * the holder: this test program. */
  g_assert_cmpfloat (took, >=, 1.5);
  g_assert_nonnull (strstr (err, "waiting for another program writing this library ("));
  g_assert_nonnull (strstr (err, "test-store-safety"));
  g_assert_nonnull (strstr (err, pid));
  g_assert_nonnull (strstr (err, "gave up after waiting 1.5 s"));
  g_assert_null (strstr (err, "database is locked"));
}

/* Office codes are unique (common practice: a code is how drawings and
 * specifications name a build-up).  Two writers that both find a code
 * free before they write: the one that writes second is refused, because
 * the check is made again inside its transaction, which BEGIN IMMEDIATE
 * gives one writer at a time. */
typedef struct
{
  sqlite3       *holder;
  LaminaLibrary *other;
  gboolean       done;
} CodeRace;

static void
on_code_race_wait (LaminaLibrary *library,
                   gboolean       waiting,
                   const char    *holder,
                   gpointer       user_data)
{
  CodeRace *race = user_data;
  g_autoptr(LaminaConstruction) winner = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  if (!waiting || race->done)
    return;
  race->done = TRUE;
  /* While the first writer waits for the lock, having found "SW-9" free,
   * the lock goes and a second writer stores "SW-9". */
  release (race->holder);
  winner = test_make_wall (race->other, "SW-9", "Race winner", NULL, 120);
  id = lamina_library_create_construction (race->other, winner, "Ann Author", &error);
  g_assert_no_error (error);
}

static void
test_code_race (void)
{
  g_autofree char *path = make_library ("code-race.sqlite", NULL);
  g_autoptr(LaminaLibrary) first = NULL;
  g_autoptr(LaminaLibrary) second = NULL;
  g_autoptr(LaminaConstruction) loser = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  CodeRace race = { 0 };
  sqlite3 *db = NULL;
  sqlite3_stmt *stmt = NULL;

  first = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  second = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  race.holder = hold_write_lock (path);
  race.other = second;
  lamina_library_set_wait_func (first, on_code_race_wait, &race);
  loser = test_make_wall (first, "sw-9", "Race loser", NULL, 140);
  id = lamina_library_create_construction (first, loser, "Ann Author", &error);
  g_assert_true (race.done);
  g_assert_null (id);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS);
  g_assert_nonnull (strstr (error->message, "construction code “sw-9”: already used by "
                                            "“Race winner”"));
  /* One construction has the code, in any letter case. */
  g_assert_cmpint (sqlite3_open (path, &db), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_prepare_v2 (db, "SELECT count(*) FROM construction"
                                           " WHERE code = 'SW-9' COLLATE NOCASE;",
                                       -1, &stmt, NULL), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_step (stmt), ==, SQLITE_ROW);
  g_assert_cmpint (sqlite3_column_int (stmt, 0), ==, 1);
  sqlite3_finalize (stmt);
  sqlite3_close (db);
}

static void
spawn_import (const char *doc,
              GPid       *pid,
              int        *out_fd)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *cli = g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL);
  const char *argv[] = { cli, "--library", library_path, "import", doc, NULL };

  g_assert_true (g_spawn_async_with_pipes (NULL, (char **) argv, NULL, G_SPAWN_DO_NOT_REAP_CHILD,
                                           NULL, NULL, pid, NULL, out_fd, NULL, &error));
  g_assert_no_error (error);
}

static char *
finish (GPid pid,
        int  fd,
        int *status)
{
  GString *text = g_string_new (NULL);
  char buffer[4096];
  ssize_t n;

  while ((n = read (fd, buffer, sizeof buffer)) > 0)
    g_string_append_len (text, buffer, n);
  close (fd);
  g_assert_cmpint (waitpid (pid, status, 0), ==, pid);
  g_spawn_close_pid (pid);
  return g_string_free (text, FALSE);
}

/* Two imports of one document started together while a third program
 * holds the lock: both plan "add", both wait; the one that writes second
 * finds the constructions there and ends as "unchanged", not a conflict. */
static void
test_parallel_imports (void)
{
  g_autofree char *doc = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo",
                                           "lamina-demo.xml", NULL);
  g_autofree char *a_out = NULL, *b_out = NULL;
  GPid a, b;
  int a_fd, b_fd, a_status, b_status;
  sqlite3 *db;

  g_free (library_path);
  library_path = test_library_path ("parallel.sqlite");
  g_unlink (library_path);
  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (library_path, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
    g_assert_nonnull (library);
  }
  db = hold_write_lock (library_path);
  g_setenv ("LAMINA_BUSY_TIMEOUT", "60", TRUE);
  spawn_import (doc, &a, &a_fd);
  spawn_import (doc, &b, &b_fd);
  /* Both read the document and plan against the empty library. */
  g_usleep (2 * G_USEC_PER_SEC);
  release (db);
  a_out = finish (a, a_fd, &a_status);
  b_out = finish (b, b_fd, &b_status);
  g_unsetenv ("LAMINA_BUSY_TIMEOUT");
  g_assert_true (WIFEXITED (a_status) && WEXITSTATUS (a_status) == 0);
  g_assert_true (WIFEXITED (b_status) && WEXITSTATUS (b_status) == 0);
  g_assert_true ((strstr (a_out, ": 20 added,") != NULL && strstr (b_out, " 0 added, 0 revised, 20 unchanged, 0 conflicts") != NULL)
                 || (strstr (b_out, ": 20 added,") != NULL && strstr (a_out, " 0 added, 0 revised, 20 unchanged, 0 conflicts") != NULL));
  g_assert_cmpuint (count_constructions (library_path), ==, 20);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/store/safety/read-only/flag", test_read_only_flag);
  g_test_add_func ("/store/safety/read-only/permissions", test_read_only_permissions);
  g_test_add_func ("/store/safety/verify/figures", test_verify_figures);
  g_test_add_func ("/store/safety/verify/pages", test_verify_pages);
  g_test_add_func ("/store/safety/backup/rotation", test_backup_rotation);
  g_test_add_func ("/store/safety/backup/restore", test_restore);
  g_test_add_func ("/store/safety/busy/gives-up", test_busy_gives_up);
  g_test_add_func ("/store/safety/busy/parallel-imports", test_parallel_imports);
  g_test_add_func ("/store/safety/busy/code-race", test_code_race);
  return g_test_run ();
}
