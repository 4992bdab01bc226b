/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-safety.c: the SQLite backend's side of library safety:
 * waiting for another program's write lock (and naming it), the storage
 * check, and the online backup in both directions. */
#define G_LOG_DOMAIN "lamina-store"

#include "config.h"

#include "lamina-sqlite-private.h"

#include <errno.h>
#include <glib/gstdio.h>
#include <pwd.h>
#include <stdio.h>
#include <string.h>
#include <sys/stat.h>
#include <sys/sysmacros.h>
#include <unistd.h>

/* In WAL mode SQLite's unix VFS takes the write lock as a POSIX lock on
 * byte 120 of the -shm file (UNIX_SHM_BASE, (22 + SQLITE_SHM_NLOCK) * 4,
 * plus WAL_WRITE_LOCK 0; see os_unix.c).  /proc/locks lists it with the
 * holder's process id; reading it opens nothing of the library (closing a
 * descriptor of the -shm file would drop our own connection's locks). */
#define WAL_WRITE_LOCK_BYTE 120

static char *
describe_process (long pid)
{
  g_autofree char *cmdline_path = g_strdup_printf ("/proc/%ld/cmdline", pid);
  g_autofree char *proc_dir = g_strdup_printf ("/proc/%ld", pid);
  g_autofree char *cmdline = NULL;
  g_autofree char *program = NULL;
  const char *user = NULL;
  struct passwd pw, *found = NULL;
  char buffer[1024];
  GStatBuf st;
  gsize len = 0;

  if (g_file_get_contents (cmdline_path, &cmdline, &len, NULL) && len > 0)
    program = g_path_get_basename (cmdline);
  if (g_stat (proc_dir, &st) == 0
      && getpwuid_r (st.st_uid, &pw, buffer, sizeof buffer, &found) == 0 && found != NULL)
    user = found->pw_name;
  if (program == NULL)
    return g_strdup_printf ("process %ld", pid);
  if (user == NULL)
    return g_strdup_printf ("%s, process %ld", program, pid);
  return g_strdup_printf ("%s, process %ld, user %s", program, pid, user);
}

char *
lamina_sqlite_dup_lock_holder (LaminaSqlite *self)
{
  g_autofree char *shm = g_strconcat (self->parent.path, "-shm", NULL);
  g_autofree char *locks = NULL;
  g_auto(GStrv) lines = NULL;
  GStatBuf st;

  if (g_stat (shm, &st) != 0 || !g_file_get_contents ("/proc/locks", &locks, NULL, NULL))
    return NULL;
  lines = g_strsplit (locks, "\n", -1);
  for (guint i = 0; lines[i] != NULL; i++)
    {
      /* "1: POSIX  ADVISORY  WRITE 4242 08:01:131090 120 120"; waiters
       * are listed with "->" and hold nothing. */
      char kind[16], mode[16], type[16], start[32];
      unsigned int major_n, minor_n;
      unsigned long long inode;
      long pid;

      if (strstr (lines[i], "->") != NULL)
        continue;
      if (sscanf (lines[i], "%*d: %15s %15s %15s %ld %x:%x:%llu %31s",
                  kind, mode, type, &pid, &major_n, &minor_n, &inode, start) != 8)
        continue;
      if (strcmp (kind, "POSIX") == 0 && strcmp (type, "WRITE") == 0
          && inode == (unsigned long long) st.st_ino
          && major_n == major (st.st_dev) && minor_n == minor (st.st_dev)
          && g_ascii_strtoll (start, NULL, 10) == WAL_WRITE_LOCK_BYTE
          && pid != (long) getpid ())
        return describe_process (pid);
    }
  return NULL;
}

/* SQLite calls this while another connection holds the lock we need:
 * wait in short steps up to the timeout, and say so after half a second
 * (a short wait is normal and not worth a line). */
static int
busy_handler (void *data,
              int   count)
{
  LaminaSqlite *self = data;
  gint64 now = g_get_monotonic_time ();
  double waited;

  if (count == 0)
    self->busy_since = now;
  waited = (now - self->busy_since) / (double) G_USEC_PER_SEC;
  if (waited >= self->parent.busy_timeout)
    return 0;
  if (!self->busy_announced && waited >= 0.5)
    {
      g_autofree char *holder = lamina_sqlite_dup_lock_holder (self);

      self->busy_announced = TRUE;
      if (self->parent.waiting != NULL)
        self->parent.waiting (self->parent.waiting_data, TRUE, holder);
    }
  g_usleep (count < 20 ? 5000 : 50000);
  return 1;
}

void
lamina_sqlite_install_busy_handler (LaminaSqlite *self)
{
  self->parent.busy_timeout = lamina_backend_default_busy_timeout ();
  sqlite3_busy_handler (self->db, busy_handler, self);
}

void
lamina_sqlite_end_wait (LaminaSqlite *self)
{
  if (!self->busy_announced)
    return;
  self->busy_announced = FALSE;
  if (self->parent.waiting != NULL)
    self->parent.waiting (self->parent.waiting_data, FALSE, NULL);
}

void
lamina_sqlite_set_busy_error (LaminaSqlite  *self,
                              GError       **error)
{
  g_autofree char *holder = lamina_sqlite_dup_lock_holder (self);

  lamina_sqlite_end_wait (self);
  g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY,
               "%s: another program is writing this library (%s); gave up after "
               "waiting %g s: nothing was changed, try again when it has finished",
               self->parent.path, holder ? holder : "which one, the system does not tell",
               self->parent.busy_timeout);
}

/* BEGIN IMMEDIATE takes the WAL write lock (waiting for it like any
 * write); ROLLBACK lets it go: nothing was written. */
gboolean
lamina_sqlite_backend_probe_write (LaminaBackend  *backend,
                                   GError        **error)
{
  LaminaSqlite *self = (LaminaSqlite *) backend;

  if (!lamina_sqlite_begin (self, error))
    return FALSE;
  lamina_sqlite_rollback (self);
  return TRUE;
}

/* ---- The storage check ------------------------------------------------- */

gboolean
lamina_sqlite_backend_verify_storage (LaminaBackend  *backend,
                                      GPtrArray      *problems,
                                      GError        **error)
{
  LaminaSqlite *self = (LaminaSqlite *) backend;
  static const char *const checks[] = {
    "PRAGMA integrity_check(100);",
    "SELECT 'a row of ' || \"table\" || ' refers to a missing row of ' || parent"
    " FROM pragma_foreign_key_check;",
  };

  for (guint i = 0; i < G_N_ELEMENTS (checks); i++)
    {
      sqlite3_stmt *stmt = NULL;
      int rc = sqlite3_prepare_v2 (self->db, checks[i], -1, &stmt, NULL);

      while (rc == SQLITE_OK && (rc = sqlite3_step (stmt)) == SQLITE_ROW)
        {
          const char *line = (const char *) sqlite3_column_text (stmt, 0);

          if (line != NULL && strcmp (line, "ok") != 0)
            g_ptr_array_add (problems, g_strdup_printf ("storage: %s", line));
          rc = SQLITE_OK;
        }
      sqlite3_finalize (stmt);
      if (rc == SQLITE_CORRUPT || rc == SQLITE_NOTADB)
        g_ptr_array_add (problems, g_strdup_printf ("storage: %s", sqlite3_errstr (rc)));
      else if (rc != SQLITE_DONE)
        {
          lamina_sqlite_set_error (self, rc, "cannot check the library", error);
          return FALSE;
        }
    }
  return TRUE;
}

/* ---- Online backup ------------------------------------------------------ */

static gboolean
copy_database (LaminaSqlite  *self,
               sqlite3       *to,
               sqlite3       *from,
               const char    *what,
               const char    *other_path,
               GError       **error)
{
  sqlite3_backup *backup = sqlite3_backup_init (to, "main", from, "main");
  int rc;

  if (backup == NULL)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot %s: %s", other_path, what, sqlite3_errmsg (to));
      return FALSE;
    }
  /* All pages in one step: a consistent copy.  The busy handler of the
   * connection waits for a writer like any other write. */
  /* The busy handler has waited its timeout already when a step says
   * BUSY; a few more tries cover a lock taken between two steps. */
  for (int tries = 0;; tries++)
    {
      rc = sqlite3_backup_step (backup, -1);
      if ((rc != SQLITE_BUSY && rc != SQLITE_LOCKED) || tries >= 20)
        break;
      g_usleep (50000);
    }
  sqlite3_backup_finish (backup);
  if (rc == SQLITE_BUSY || rc == SQLITE_LOCKED)
    {
      lamina_sqlite_set_busy_error (self, error);
      return FALSE;
    }
  if (rc != SQLITE_DONE)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR,
                   (rc & 0xff) == SQLITE_CORRUPT ? LAMINA_LIBRARY_ERROR_CORRUPT
                                                 : LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot %s: %s", other_path, what, sqlite3_errstr (rc));
      return FALSE;
    }
  (void) self;
  return TRUE;
}

gboolean
lamina_sqlite_backend_backup_to (LaminaBackend  *backend,
                                 const char     *dest,
                                 GError        **error)
{
  LaminaSqlite *self = (LaminaSqlite *) backend;
  sqlite3 *to = NULL;
  gboolean ok;
  int rc = sqlite3_open_v2 (dest, &to, SQLITE_OPEN_READWRITE | SQLITE_OPEN_CREATE
                                       | SQLITE_OPEN_NOMUTEX, NULL);

  if (rc != SQLITE_OK)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot write the backup: %s", dest,
                   to ? sqlite3_errmsg (to) : sqlite3_errstr (rc));
      sqlite3_close (to);
      return FALSE;
    }
  ok = copy_database (self, to, self->db, "write the backup", dest, error);
  /* The copy is of pages as they are: a damaged page would be copied
   * too, and a damaged copy must never push a good one out. */
  if (ok)
    {
      sqlite3_stmt *stmt = NULL;
      const char *answer = NULL;

      rc = sqlite3_prepare_v2 (to, "PRAGMA quick_check(1);", -1, &stmt, NULL);
      if (rc == SQLITE_OK && sqlite3_step (stmt) == SQLITE_ROW)
        answer = (const char *) sqlite3_column_text (stmt, 0);
      if (g_strcmp0 (answer, "ok") != 0)
        {
          lamina_backend_set_damaged_error (backend, "while making a backup",
                                            answer ? answer : sqlite3_errmsg (to), error);
          ok = FALSE;
        }
      sqlite3_finalize (stmt);
    }
  /* A copy stands alone: one file, no WAL beside it. */
  if (ok && sqlite3_exec (to, "PRAGMA journal_mode = DELETE;", NULL, NULL, NULL) != SQLITE_OK)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot finish the backup: %s", dest, sqlite3_errmsg (to));
      ok = FALSE;
    }
  if (sqlite3_close (to) != SQLITE_OK && ok)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot finish the backup", dest);
      ok = FALSE;
    }
  return ok;
}

gboolean
lamina_sqlite_backend_restore_from (LaminaBackend  *backend,
                                    const char     *source,
                                    GError        **error)
{
  LaminaSqlite *self = (LaminaSqlite *) backend;
  sqlite3 *from = NULL;
  gboolean ok;
  int rc;

  if (self->parent.read_only_reason != NULL)
    {
      lamina_backend_set_read_only_error (backend, error);
      return FALSE;
    }
  rc = sqlite3_open_v2 (source, &from, SQLITE_OPEN_READONLY | SQLITE_OPEN_NOMUTEX, NULL);
  if (rc != SQLITE_OK)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot read the backup: %s", source,
                   from ? sqlite3_errmsg (from) : sqlite3_errstr (rc));
      sqlite3_close (from);
      return FALSE;
    }
  /* Cached statements would hold the old schema: drop them first. */
  g_hash_table_remove_all (self->statements);
  ok = copy_database (self, self->db, from, "restore the backup", source, error);
  sqlite3_close (from);
  /* The copy's header says DELETE; the library goes on in WAL mode. */
  if (ok)
    ok = lamina_sqlite_exec (self, "PRAGMA journal_mode = WAL;", error);
  return ok;
}
