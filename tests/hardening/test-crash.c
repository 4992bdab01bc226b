/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Crash consistency of the office library (issue 7).
 *
 * Every write through the store is run in a child process that dies
 * (_exit, as under SIGKILL: no cleanup, no atexit) just before its k-th
 * write-like file operation, for every k the operation performs (the
 * lamina-fault-vfs shim counts them), and once more under SIGKILL at a
 * sweep of times.  After each death the file must pass PRAGMA
 * integrity_check and foreign_key_check, open and read fully, and hold
 * exactly the state before the operation or exactly the state after it,
 * never a mix.  A full disk (the shim's byte budget; ENOSPC from the
 * write) must fail with a clear error and leave the old state.
 *
 * The reference for "atomic": SQLite's documented transaction guarantee
 * (sqlite.org/atomiccommit.html, WAL mode) is what the store relies on;
 * these tests check that the store never splits one user action across
 * transactions. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <signal.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "lamina-fault-vfs.h"
#include "lamina-hardening-util.h"
#include "lamina-sqlite-private.h"

#include <sqlite3.h>

typedef gboolean (*Operation) (LaminaLibrary *library, GError **error);

static guint n_kill_points;
static guint n_states_checked;

/* ---- the operations under test ---------------------------------------- */

static gboolean
op_save (LaminaLibrary  *library,
         GError        **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, "hw-1", 0, error);
  LaminaLayer *layer;

  if (c == NULL)
    return FALSE;
  layer = c->layers->pdata[1];
  layer->thickness += 20;
  g_free (c->name);
  c->name = g_strdup ("Test wall 1, thicker insulation");
  return lamina_library_save_construction (library, c, c->revision, "A. Editor", error);
}

static gboolean
op_approve (LaminaLibrary  *library,
            GError        **error)
{
  return lamina_library_approve (library, "hw-2", 0, "R. Reviewer", "2099-05-02", error);
}

static gboolean
op_create (LaminaLibrary  *library,
           GError        **error)
{
  g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, 77);
  g_autofree char *id = NULL;

  c->id = g_strdup ("hw-new");
  id = lamina_library_create_construction (library, c, "A. Editor", error);
  return id != NULL;
}

static LaminaCatalogue *
make_import (LaminaLibrary *library,
             guint          n)
{
  LaminaCatalogue *cat = lamina_catalogue_new ();

  for (guint i = 0; i < n; i++)
    {
      LaminaConstruction *c = lamina_hardening_make_wall (library, 100 + i);

      c->id = g_strdup_printf ("imp-%u", i);
      g_ptr_array_add (cat->constructions, c);
    }
  /* and a change to an existing draft: a new revision of hw-3 */
  {
    LaminaConstruction *c = lamina_library_dup_construction (library, "hw-3", 0, NULL);

    g_assert_nonnull (c);
    ((LaminaLayer *) c->layers->pdata[0])->thickness = 15;
    g_ptr_array_add (cat->constructions, c);
  }
  return cat;
}

static gboolean
op_import (LaminaLibrary  *library,
           GError        **error)
{
  g_autoptr(LaminaCatalogue) cat = make_import (library, 12);
  g_autoptr(LaminaImportReport) report = lamina_library_import (library, cat, 0, "A. Importer",
                                                                error);

  return report != NULL;
}

static gboolean
op_material (LaminaLibrary  *library,
             GError        **error)
{
  g_autoptr(LaminaMaterial) m = lamina_library_dup_material (library, "typical-mineral-wool-035",
                                                             error);

  if (m == NULL)
    return FALSE;
  m->conductivity = 0.032;
  return lamina_library_put_material (library, m, error);
}

static gboolean
op_delete (LaminaLibrary  *library,
           GError        **error)
{
  return lamina_library_delete_construction (library, "hw-4", "A. Editor", error);
}

/* ---- running an operation in a child that may die ---------------------- */

/* Runs @op on @path in a child.  @exit_after 0: to the end, and the child
 * reports its count of write-like calls through a pipe (returned).
 * @free_bytes ≥ 0: a full disk after that many bytes of growth; the
 * child's error message is written to @message.  Returns the child's
 * wait status in @status. */
static guint64
run_child (const char  *path,
           Operation    op,
           guint64      exit_after,
           gint64       free_bytes,
           int         *status,
           char       **message)
{
  int fds[2];
  pid_t pid;
  guint64 count = 0;
  g_autoptr(GString) text = g_string_new (NULL);
  char buf[256];
  ssize_t n;

  g_assert_cmpint (pipe (fds), ==, 0);
  pid = fork ();
  g_assert_cmpint (pid, >=, 0);
  if (pid == 0)
    {
      g_autoptr(GError) error = NULL;
      LaminaLibrary *library;
      gboolean ok;

      close (fds[0]);
      lamina_fault_vfs_install ();
      lamina_fault_vfs_set_exit_after (exit_after);
      library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
      if (library == NULL)
        _exit (3);
      lamina_fault_vfs_set_free_bytes (free_bytes);
      ok = op (library, &error);
      g_object_unref (library);
      count = lamina_fault_vfs_get_count ();
      if (write (fds[1], &count, sizeof count) != sizeof count)
        _exit (4);
      if (!ok && write (fds[1], error->message, strlen (error->message)) < 0)
        _exit (4);
      _exit (ok ? 0 : 1);
    }
  close (fds[1]);
  if (read (fds[0], &count, sizeof count) != sizeof count)
    count = 0;
  while ((n = read (fds[0], buf, sizeof buf)) > 0)
    g_string_append_len (text, buf, n);
  close (fds[0]);
  g_assert_cmpint (waitpid (pid, status, 0), ==, pid);
  if (message)
    *message = g_strdup (text->str);
  return count;
}

static void
assert_old_or_new (const char *path,
                   const char *old_state,
                   const char *new_state,
                   gboolean   *was_new)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *state = NULL;

  if (!lamina_hardening_check_library (path, &error))
    g_error ("library damaged: %s", error->message);
  state = lamina_hardening_dup_file_state (path, &error);
  g_assert_no_error (error);
  if (g_strcmp0 (state, old_state) != 0 && g_strcmp0 (state, new_state) != 0)
    g_error ("%s holds neither the old nor the new state", path);
  n_states_checked++;
  if (was_new)
    *was_new = g_strcmp0 (state, new_state) == 0;
}

static char *
make_base (void)
{
  g_autofree char *dir = g_build_filename (g_get_user_data_dir (), "crash", NULL);
  char *path = g_build_filename (dir, "base.sqlite", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;

  g_mkdir_with_parents (dir, 0700);
  if (g_file_test (path, G_FILE_TEST_EXISTS))
    return path;
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  for (guint i = 1; i <= 5; i++)
    {
      g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, i);
      g_autofree char *id = NULL;

      c->id = g_strdup_printf ("hw-%u", i);
      id = lamina_library_create_construction (library, c, "A. Author", &error);
      g_assert_no_error (error);
    }
  /* Only checked revisions can be approved (here and by op_approve). */
  g_assert_true (lamina_library_mark_checked (library, "hw-2", 0, "C. Checker", &error));
  g_assert_true (lamina_library_mark_checked (library, "hw-5", 0, "C. Checker", &error));
  g_assert_true (lamina_library_approve (library, "hw-5", 0, "R. Reviewer", "2099-04-30", &error));
  return path;
}

/* LAMINA_TEST_KILL_POINTS caps the kill points per operation (default
 * 200, i.e. every write of every operation here); the sanitizer pass of
 * build-aux/check-hardening lowers it to keep CI time modest. */
static guint64
max_kill_points (void)
{
  const char *env = g_getenv ("LAMINA_TEST_KILL_POINTS");
  guint64 n = 0;

  if (env == NULL || !g_ascii_string_to_unsigned (env, 10, 1, G_MAXUINT, &n, NULL))
    return 200;
  return n;
}

static void
sweep (Operation op)
{
  g_autofree char *base = make_base ();
  g_autofree char *work = g_build_filename (g_get_user_data_dir (), "crash", "work.sqlite", NULL);
  g_autofree char *old_state = lamina_hardening_dup_file_state (base, NULL);
  g_autofree char *new_state = NULL;
  guint64 total, step;
  guint n_new = 0, n_here = 0;
  int status;

  g_assert_nonnull (old_state);
  lamina_hardening_copy_library (base, work);
  total = run_child (work, op, 0, -1, &status, NULL);
  g_assert_true (WIFEXITED (status) && WEXITSTATUS (status) == 0);
  new_state = lamina_hardening_dup_file_state (work, NULL);
  g_assert_nonnull (new_state);
  g_assert_cmpstr (new_state, !=, old_state);
  g_assert_cmpuint (total, >, 0);

  /* Every write-like call up to the cap, then a stride. */
  step = total <= max_kill_points () ? 1 : total / max_kill_points () + 1;
  for (guint64 k = 1; k <= total; k += step)
    {
      gboolean was_new = FALSE;

      lamina_hardening_copy_library (base, work);
      run_child (work, op, k, -1, &status, NULL);
      g_assert_true (WIFEXITED (status));
      g_assert_cmpint (WEXITSTATUS (status), ==, LAMINA_FAULT_EXIT_STATUS);
      assert_old_or_new (work, old_state, new_state, &was_new);
      n_new += was_new;
      n_kill_points++;
      n_here++;
    }
  g_test_message ("%" G_GUINT64_FORMAT " write-like calls; %u kill points, %u left the new state",
                  total, n_here, n_new);
}

static void
test_kill_save (void)     { sweep (op_save); }
static void
test_kill_approve (void)  { sweep (op_approve); }
static void
test_kill_create (void)   { sweep (op_create); }
static void
test_kill_import (void)   { sweep (op_import); }
static void
test_kill_material (void) { sweep (op_material); }
static void
test_kill_delete (void)   { sweep (op_delete); }

static gboolean
op_nothing (LaminaLibrary  *library,
            GError        **error)
{
  return TRUE;
}

static int
raw_user_version (const char *path)
{
  sqlite3 *db = NULL;
  sqlite3_stmt *stmt = NULL;
  int version = -1;

  g_assert_cmpint (sqlite3_open_v2 (path, &db, SQLITE_OPEN_READWRITE, NULL), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_prepare_v2 (db, "PRAGMA user_version;", -1, &stmt, NULL), ==, SQLITE_OK);
  if (sqlite3_step (stmt) == SQLITE_ROW)
    version = sqlite3_column_int (stmt, 0);
  sqlite3_finalize (stmt);
  sqlite3_close (db);
  return version;
}

/* A copy kept before a migration is either absent or a whole schema-1
 * library: a half-written copy would mislead whoever restores it. */
static void
assert_backups_whole (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = NULL;
      sqlite3 *db = NULL;
      sqlite3_stmt *stmt = NULL;

      /* A leftover "….partial-PID" is not a copy anyone restores. */
      if (strstr (name, "-backup") == NULL || strstr (name, ".partial-") != NULL
          || g_str_has_suffix (name, "-wal")
          || g_str_has_suffix (name, "-shm") || g_str_has_suffix (name, "-journal"))
        continue;
      path = g_build_filename (dir, name, NULL);
      g_assert_cmpint (sqlite3_open_v2 (path, &db, SQLITE_OPEN_READONLY, NULL), ==, SQLITE_OK);
      if (sqlite3_prepare_v2 (db, "PRAGMA integrity_check;", -1, &stmt, NULL) != SQLITE_OK
          || sqlite3_step (stmt) != SQLITE_ROW
          || g_strcmp0 ((const char *) sqlite3_column_text (stmt, 0), "ok") != 0)
        g_error ("%s: a partial copy was left: %s", name, sqlite3_errmsg (db));
      sqlite3_finalize (stmt);
      sqlite3_close (db);
      g_assert_cmpint (raw_user_version (path), ==, 1);
    }
}

/* Opening a library of schema 1 migrates it (after keeping a copy): a
 * death anywhere in it leaves the file at schema 1 or fully migrated,
 * intact either way, and the next open finishes the job. */
static void
test_kill_migration (void)
{
  g_autofree char *dir = g_build_filename (g_get_user_data_dir (), "migrate", NULL);
  g_autofree char *base = g_build_filename (dir, "v1.sqlite", NULL);
  g_autofree char *work = g_build_filename (dir, "work.sqlite", NULL);
  g_autoptr(GError) error = NULL;
  guint64 total;
  int status;

  g_mkdir_with_parents (dir, 0700);
  g_assert_true (lamina_sqlite_create_at_version (base, 1, &error));
  lamina_hardening_copy_library (base, work);
  total = run_child (work, op_nothing, 0, -1, &status, NULL);
  g_assert_true (WIFEXITED (status) && WEXITSTATUS (status) == 0);
  g_assert_cmpint (raw_user_version (work), ==, LAMINA_LIBRARY_SCHEMA_VERSION);
  for (guint64 k = 1; k <= total;
       k += total <= max_kill_points () ? 1 : total / max_kill_points () + 1)
    {
      int version;

      lamina_hardening_copy_library (base, work);
      run_child (work, op_nothing, k, -1, &status, NULL);
      g_assert_true (WIFEXITED (status));
      g_assert_cmpint (WEXITSTATUS (status), ==, LAMINA_FAULT_EXIT_STATUS);
      version = raw_user_version (work);
      g_assert_true (version == 1 || version == LAMINA_LIBRARY_SCHEMA_VERSION);
      assert_backups_whole (dir);
      /* The check opens through the store, which finishes the migration. */
      if (!lamina_hardening_check_library (work, &error))
        g_error ("kill point %" G_GUINT64_FORMAT " of the migration: %s", k, error->message);
      g_assert_cmpint (raw_user_version (work), ==, LAMINA_LIBRARY_SCHEMA_VERSION);
      n_kill_points++;
      n_states_checked++;
    }
  g_test_message ("migration: %" G_GUINT64_FORMAT " write-like calls", total);
}

/* Timing rather than file operations: a child importing in a loop is
 * SIGKILLed after 2, 4, … ms. */
static void
test_sigkill_sweep (void)
{
  g_autofree char *base = make_base ();
  g_autofree char *work = g_build_filename (g_get_user_data_dir (), "crash", "work.sqlite", NULL);

  for (guint ms = 2; ms <= 40; ms += 2)
    {
      g_autofree char *before = NULL, *after = NULL;
      pid_t pid;
      int status;

      lamina_hardening_copy_library (base, work);
      before = lamina_hardening_dup_file_state (work, NULL);
      pid = fork ();
      g_assert_cmpint (pid, >=, 0);
      if (pid == 0)
        {
          LaminaLibrary *library = lamina_library_open (work, LAMINA_LIBRARY_OPEN_EXISTING, NULL);

          for (guint round = 0; library != NULL; round++)
            {
              g_autoptr(LaminaCatalogue) cat = make_import (library, 8);

              for (guint i = 0; i < cat->constructions->len; i++)
                {
                  LaminaConstruction *c = cat->constructions->pdata[i];

                  g_free (c->description);
                  c->description = g_strdup_printf ("round %u", round);
                }
              LaminaImportReport *report = lamina_library_import (library, cat, 0, NULL, NULL);

              if (report != NULL)
                lamina_import_report_free (report);
            }
          _exit (3);
        }
      g_usleep (ms * 1000);
      kill (pid, SIGKILL);
      g_assert_cmpint (waitpid (pid, &status, 0), ==, pid);
      /* Any number of whole imports may have committed: the library must
       * be intact and every construction complete (each import brings 8
       * new ones and one revision; no round may be half there). */
      {
        g_autoptr(GError) error = NULL;
        g_autoptr(LaminaLibrary) library = NULL;
        LaminaLibraryQuery q;
        gint64 n;

        if (!lamina_hardening_check_library (work, &error))
          g_error ("library damaged after SIGKILL at %u ms: %s", ms, error->message);
        library = lamina_library_open (work, LAMINA_LIBRARY_OPEN_EXISTING, &error);
        lamina_library_query_init (&q);
        n = lamina_library_count (library, &q, &error);
        g_assert_true (n == 5 || n == 13);
      }
      n_kill_points++;
      n_states_checked++;
    }
}

/* A full disk at a sweep of free space: the write fails with an error
 * that says so, and the old state survives; or it fits and the new state
 * is there. */
static void
test_full_disk (void)
{
  g_autofree char *base = make_base ();
  g_autofree char *work = g_build_filename (g_get_user_data_dir (), "crash", "work.sqlite", NULL);
  g_autofree char *old_state = lamina_hardening_dup_file_state (base, NULL);
  g_autofree char *new_state = NULL;
  guint n_failed = 0;
  int status;

  lamina_hardening_copy_library (base, work);
  run_child (work, op_import, 0, -1, &status, NULL);
  g_assert_true (WIFEXITED (status) && WEXITSTATUS (status) == 0);
  new_state = lamina_hardening_dup_file_state (work, NULL);

  for (gint64 free_bytes = 0; free_bytes <= 2 * 1024 * 1024; free_bytes = free_bytes * 2 + 4096)
    {
      g_autofree char *message = NULL;
      gboolean was_new = FALSE;

      lamina_hardening_copy_library (base, work);
      run_child (work, op_import, 0, free_bytes, &status, &message);
      g_assert_true (WIFEXITED (status));
      assert_old_or_new (work, old_state, new_state, &was_new);
      if (WEXITSTATUS (status) == 1)
        {
          /* Clear: names the file and says the disk is full. */
          g_assert_nonnull (strstr (message, work));
          g_assert_nonnull (strstr (message, "full"));
          g_assert_false (was_new);
          n_failed++;
        }
      else
        {
          g_assert_cmpint (WEXITSTATUS (status), ==, 0);
          g_assert_true (was_new);
        }
    }
  g_assert_cmpuint (n_failed, >, 0);
  g_test_message ("full disk: %u budgets refused cleanly", n_failed);
}

int
main (int    argc,
      char **argv)
{
  int rc;

  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/crash/save", test_kill_save);
  g_test_add_func ("/hardening/crash/approve", test_kill_approve);
  g_test_add_func ("/hardening/crash/create", test_kill_create);
  g_test_add_func ("/hardening/crash/import", test_kill_import);
  g_test_add_func ("/hardening/crash/material", test_kill_material);
  g_test_add_func ("/hardening/crash/delete", test_kill_delete);
  g_test_add_func ("/hardening/crash/migration", test_kill_migration);
  g_test_add_func ("/hardening/crash/sigkill-import", test_sigkill_sweep);
  g_test_add_func ("/hardening/crash/full-disk", test_full_disk);
  rc = g_test_run ();
  g_print ("# figures: %u kill points tried, %u states checked\n", n_kill_points,
           n_states_checked);
  return rc;
}
