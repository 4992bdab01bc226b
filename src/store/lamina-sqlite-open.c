/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-open.c: opening, recognising, checking and migrating a
 * library file; the backend's table of operations. */
#define G_LOG_DOMAIN "lamina-store"

#include "config.h"

#include "lamina-sqlite-private.h"

#include <errno.h>
#include <glib/gstdio.h>
#include <string.h>
#include <unistd.h>

static gint64
query_int (LaminaSqlite *self,
           const char   *sql,
           int          *rc_out)
{
  sqlite3_stmt *stmt = NULL;
  gint64 value = -1;
  int rc = sqlite3_prepare_v2 (self->db, sql, -1, &stmt, NULL);

  if (rc == SQLITE_OK)
    {
      rc = sqlite3_step (stmt);
      if (rc == SQLITE_ROW)
        {
          value = sqlite3_column_int64 (stmt, 0);
          rc = SQLITE_OK;
        }
    }
  sqlite3_finalize (stmt);
  *rc_out = rc;
  return value;
}

static void
lamina_sqlite_backend_close (LaminaBackend *backend)
{
  LaminaSqlite *self = (LaminaSqlite *) backend;

  /* Statements first: sqlite3_close refuses while any is live. */
  g_clear_pointer (&self->statements, g_hash_table_unref);
  lamina_sqlite_search_clear (self);
  if (self->db != NULL)
    {
      sqlite3_close (self->db);
      self->db = NULL;
    }
  g_free (self->parent.path);
  g_free (self->parent.backup_path);
  g_free (self->parent.read_only_reason);
  g_free (self);
}

static gboolean
lamina_sqlite_backend_check_for_changes (LaminaBackend *backend)
{
  LaminaSqlite *self = (LaminaSqlite *) backend;
  int rc;
  gint64 v = query_int (self, "PRAGMA data_version;", &rc);

  if (rc != SQLITE_OK || v == self->data_version)
    return FALSE;
  self->data_version = v;
  return TRUE;
}

static void
finalize_statement (gpointer stmt)
{
  sqlite3_finalize (stmt);
}

/* The SQLite backend's operations, in one place; the operations live in
 * lamina-sqlite-store.c (materials), lamina-sqlite-revisions.c
 * (constructions, review, import) and lamina-sqlite-search.c. */
static const LaminaBackendVTable sqlite_vtable = {
  .close = lamina_sqlite_backend_close,
  .check_for_changes = lamina_sqlite_backend_check_for_changes,

  .list_materials = lamina_sqlite_backend_list_materials,
  .get_material = lamina_sqlite_backend_get_material,
  .put_material = lamina_sqlite_backend_put_material,

  .get_construction = lamina_sqlite_backend_get_construction,
  .store_revision = lamina_sqlite_backend_store_revision,
  .set_deleted = lamina_sqlite_backend_set_deleted,
  .get_history = lamina_sqlite_backend_get_history,
  .review = lamina_sqlite_backend_review,
  .get_review_events = lamina_sqlite_backend_get_review_events,
  .get_setting = lamina_sqlite_backend_get_setting,
  .set_setting = lamina_sqlite_backend_set_setting,

  .search = lamina_sqlite_backend_search,
  .count = lamina_sqlite_backend_count,
  .list_tags = lamina_sqlite_backend_list_tags,

  .apply_import = lamina_sqlite_backend_apply_import,
  .list_ids = lamina_sqlite_backend_list_ids,
  .list_target_sets = lamina_sqlite_backend_list_target_sets,
  .put_target_set = lamina_sqlite_backend_put_target_set,
  .delete_target_set = lamina_sqlite_backend_delete_target_set,
  .list_jobs = lamina_sqlite_backend_list_jobs,
  .get_job = lamina_sqlite_backend_get_job,
  .put_job = lamina_sqlite_backend_put_job,
  .delete_job = lamina_sqlite_backend_delete_job,
  .list_job_uses = lamina_sqlite_backend_list_job_uses,
  .apply_import_records = lamina_sqlite_backend_apply_import_records,
  .get_field_check = lamina_sqlite_backend_get_field_check,
  .put_field_check = lamina_sqlite_backend_put_field_check,

  .list_climates = lamina_sqlite_backend_list_climates,
  .get_climate = lamina_sqlite_backend_get_climate,
  .put_climate = lamina_sqlite_backend_put_climate,
  .write_all = lamina_sqlite_backend_write_all,

  .verify_storage = lamina_sqlite_backend_verify_storage,
  .backup_to = lamina_sqlite_backend_backup_to,
  .restore_from = lamina_sqlite_backend_restore_from,
  .delete_climate = lamina_sqlite_backend_delete_climate,
  .set_moisture_limit = lamina_sqlite_backend_set_moisture_limit,
  .replace_draft = lamina_sqlite_backend_replace_draft,
  .drop_draft = lamina_sqlite_backend_drop_draft,
  .find_code = lamina_sqlite_backend_find_code,

  .count_at_most = lamina_sqlite_backend_count_at_most,
  .probe_write = lamina_sqlite_backend_probe_write,
  .read_snapshot = lamina_sqlite_backend_read_snapshot,
  .read_rows = lamina_sqlite_backend_read_rows,
};

static LaminaSqlite *
sqlite_new (const char *path)
{
  LaminaSqlite *self = g_new0 (LaminaSqlite, 1);

  self->parent.vtable = &sqlite_vtable;
  self->parent.path = g_strdup (path);
  self->statements = g_hash_table_new_full (g_str_hash, g_str_equal, g_free,
                                            finalize_statement);
  return self;
}

/* Looks at the first bytes before anything could write to the file, so
 * that a file of another kind is refused (SQLite would otherwise treat an
 * empty file as a new database).  The bytes are read through SQLite's own
 * file (a read-only connection that never reads a page): a plain
 * open()/close() of the file here would drop every POSIX lock this
 * process holds on it, the locks of the connections already open (the
 * window's, while a worker opens its own), and another program could then
 * checkpoint and delete the WAL under them. */
static gboolean
check_header (const char  *path,
              GError     **error)
{
  static const char magic[16] = "SQLite format 3";
  char header[100] = { 0 };
  sqlite3 *db = NULL;
  sqlite3_file *file = NULL;
  size_t n = 0;
  int rc;

  if (g_access (path, R_OK) != 0)
    {
      int saved = errno;
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot open: %s", path, g_strerror (saved));
      return FALSE;
    }
  rc = sqlite3_open_v2 (path, &db, SQLITE_OPEN_READONLY | SQLITE_OPEN_NOMUTEX, NULL);
  if (rc == SQLITE_OK)
    rc = sqlite3_file_control (db, "main", SQLITE_FCNTL_FILE_POINTER, &file);
  if (rc == SQLITE_OK && (file == NULL || file->pMethods == NULL))
    rc = SQLITE_CANTOPEN;
  if (rc == SQLITE_OK)
    {
      rc = file->pMethods->xRead (file, header, sizeof header, 0);
      /* a shorter file: zero-filled, and not a database */
      n = rc == SQLITE_OK ? sizeof header : 0;
      if (rc == SQLITE_IOERR_SHORT_READ)
        rc = SQLITE_OK;
    }
  sqlite3_close (db);
  if (rc != SQLITE_OK)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot open: %s", path, sqlite3_errstr (rc));
      return FALSE;
    }
  if (n < sizeof header || memcmp (header, magic, sizeof magic) != 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY,
                   "%s: not a Lamina library (not an SQLite database)", path);
      return FALSE;
    }
  return TRUE;
}

static gboolean
configure (LaminaSqlite  *self,
           GError       **error)
{
  int rc;

  /* Another process holding the write lock is waited for (and named). */
  lamina_sqlite_install_busy_handler (self);
  sqlite3_extended_result_codes (self->db, 1);
  /* A 32 MiB page cache (the default is 2 MiB) keeps a large import's
   * dirty pages in memory until the commit instead of spilling them to
   * the WAL half-way; temporary tables stay in memory.  The staging table
   * of the search index (lamina-sqlite-revisions.c) lives as long as the
   * connection, in memory, and never touches the library file. */
  rc = sqlite3_exec (self->db, "PRAGMA foreign_keys = ON;"
                                "PRAGMA cache_size = -32768;"
                                "PRAGMA temp_store = MEMORY;"
                                "CREATE TEMP TABLE construction_fts_stage ("
                                "  num INTEGER PRIMARY KEY, code, name, description, tags, materials);",
                     NULL, NULL, NULL);
  if (rc != SQLITE_OK)
    {
      /* The first statement reads the schema: damage there is met here. */
      lamina_sqlite_set_error (self, rc, "open", error);
      return FALSE;
    }
  return TRUE;
}

/* Refuses what is not ours or is damaged, before anything is written. */
static gboolean
recognise (LaminaSqlite  *self,
           int           *version,
           GError       **error)
{
  int rc;
  gint64 app_id = query_int (self, "PRAGMA application_id;", &rc);
  g_autofree char *check = NULL;
  sqlite3_stmt *stmt = NULL;

  if (rc != SQLITE_OK)
    {
      lamina_sqlite_set_error (self, rc, "cannot read", error);
      return FALSE;
    }
  if (app_id != LAMINA_SQLITE_APPLICATION_ID)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY,
                   "%s: not a Lamina library (an SQLite database of another program)",
                   self->parent.path);
      return FALSE;
    }
  *version = (int) query_int (self, "PRAGMA user_version;", &rc);
  if (*version > LAMINA_LIBRARY_SCHEMA_VERSION)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_TOO_NEW,
                   "%s: made by a newer version of Lamina (library format %d; "
                   "this version reads up to %d); the file was not changed",
                   self->parent.path, *version, LAMINA_LIBRARY_SCHEMA_VERSION);
      return FALSE;
    }
  /* A full PRAGMA quick_check costs O(file size) (about 180 ms at 10,000
   * constructions); opening must stay instant, so read the schema and walk
   * the small tables and the list index instead.  Damage elsewhere is
   * reported as CORRUPT when it is met. */
  rc = sqlite3_prepare_v2 (self->db,
    "SELECT (SELECT count(*) FROM material) + (SELECT count(*) FROM construction)"
    " + (SELECT count(*) FROM construction_tag) + (SELECT count(*) FROM revision_material)"
    " + (SELECT count(*) FROM (SELECT revision FROM revision LIMIT 1));", -1, &stmt, NULL);
  if (rc == SQLITE_OK && (rc = sqlite3_step (stmt)) == SQLITE_ROW)
    check = g_strdup ("ok");
  sqlite3_finalize (stmt);
  if (check == NULL || strcmp (check, "ok") != 0 || *version < 1)
    {
      lamina_backend_set_damaged_error (&self->parent, "on opening",
                                        check ? check : sqlite3_errstr (rc), error);
      return FALSE;
    }
  return TRUE;
}

static char *
backup_path_for (const char *path,
                 int         version)
{
  char *candidate = g_strdup_printf ("%s.v%d-backup", path, version);

  for (int i = 2; g_file_test (candidate, G_FILE_TEST_EXISTS); i++)
    {
      g_free (candidate);
      candidate = g_strdup_printf ("%s.v%d-backup-%d", path, version, i);
    }
  return candidate;
}

static gboolean
upgrade (LaminaSqlite  *self,
         int            version,
         GError       **error)
{
  g_autofree char *backup = backup_path_for (self->parent.path, version);
  g_autofree char *partial = g_strdup_printf ("%s.partial-%ld", backup, (long) getpid ());
  char *quoted = sqlite3_mprintf ("VACUUM INTO %Q;", partial);
  gboolean ok;
  int rc;

  /* VACUUM INTO copies the whole database, WAL content included.  It
   * writes beside the copy's name and renames when complete, so that a
   * crash or a full disk never leaves a partial copy under the name a
   * user would restore from. */
  g_unlink (partial);
  ok = lamina_sqlite_exec (self, quoted, error);
  sqlite3_free (quoted);
  if (ok && g_rename (partial, backup) != 0)
    {
      int saved = errno;

      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                   "%s: cannot keep a copy before the migration: %s", backup, g_strerror (saved));
      ok = FALSE;
    }
  if (!ok)
    {
      g_unlink (partial);
      return FALSE;
    }
  self->parent.backup_path = g_steal_pointer (&backup);
  if (!lamina_sqlite_begin (self, error))
    return FALSE;
  /* Another process may have migrated between our look and the lock. */
  version = (int) query_int (self, "PRAGMA user_version;", &rc);
  if (rc != SQLITE_OK)
    {
      lamina_sqlite_rollback (self);
      lamina_sqlite_set_error (self, rc, "cannot read", error);
      return FALSE;
    }
  if (!lamina_sqlite_migrate (self, version, LAMINA_LIBRARY_SCHEMA_VERSION, error)
      || !lamina_sqlite_commit (self, error))
    {
      lamina_sqlite_rollback (self);
      return FALSE;
    }
  return TRUE;
}

static gboolean
create_schema (LaminaSqlite  *self,
               int            version,
               gboolean       seed,
               GError       **error)
{
  g_autofree char *app_id = g_strdup_printf ("PRAGMA application_id = %d;",
                                             LAMINA_SQLITE_APPLICATION_ID);

  if (!lamina_sqlite_exec (self, "PRAGMA journal_mode = WAL;", error)
      || !lamina_sqlite_begin (self, error))
    return FALSE;
  if (!lamina_sqlite_exec (self, app_id, error)
      || !lamina_sqlite_migrate (self, 0, version, error)
      || (seed && !lamina_sqlite_seed_materials (self, error))
      || !lamina_sqlite_commit (self, error))
    {
      lamina_sqlite_rollback (self);
      return FALSE;
    }
  return TRUE;
}

/* The connection of sqlite3_open_v2's @rc configured, or NULL. */
static LaminaSqlite *
configured (LaminaSqlite  *self,
            int            rc,
            GError       **error)
{
  if (rc != SQLITE_OK)
    {
      lamina_sqlite_set_error (self, rc, "cannot open", error);
      lamina_sqlite_backend_close (&self->parent);
      return NULL;
    }
  if (!configure (self, error))
    {
      lamina_sqlite_backend_close (&self->parent);
      return NULL;
    }
  return self;
}

/* Why the library at @path cannot be written, or NULL. */
static char *
read_only_reason (const char             *path,
                  LaminaLibraryOpenFlags  flags)
{
  g_autofree char *dir = g_path_get_dirname (path);
  g_autofree char *wal = g_strconcat (path, "-wal", NULL);
  g_autofree char *shm = g_strconcat (path, "-shm", NULL);

  if (flags & LAMINA_LIBRARY_OPEN_READ_ONLY)
    return g_strdup ("opened read-only");
  if (access (path, W_OK) != 0)
    return g_strdup (errno == EROFS ? "the disk is read-only" : "the file is read-only");
  /* SQLite writes its journal files beside the library. */
  if (access (dir, W_OK) != 0)
    return g_strdup (errno == EROFS ? "the disk is read-only" : "the folder cannot be written");
  if ((access (wal, F_OK) == 0 && access (wal, W_OK) != 0)
      || (access (shm, F_OK) == 0 && access (shm, W_OK) != 0))
    return g_strdup ("its journal files cannot be written");
  return NULL;
}

static LaminaSqlite *
open_file (const char    *path,
           gboolean       create,
           GError       **error)
{
  LaminaSqlite *self = sqlite_new (path);
  int flags = SQLITE_OPEN_READWRITE | SQLITE_OPEN_NOMUTEX
              | (create ? SQLITE_OPEN_CREATE | SQLITE_OPEN_EXCLUSIVE : 0);
  int rc = sqlite3_open_v2 (path, &self->db, flags & ~SQLITE_OPEN_EXCLUSIVE, NULL);

  return configured (self, rc, error);
}

/* A read-only connection.  In a folder we cannot write, SQLite cannot make
 * the WAL index beside the file; unless another program has it open (its
 * -shm file exists), nobody writes, and the file is read as it stands. */
static LaminaSqlite *
open_read_only (const char  *path,
                const char  *reason,
                GError     **error)
{
  LaminaSqlite *self = sqlite_new (path);
  g_autofree char *dir = g_path_get_dirname (path);
  g_autofree char *shm = g_strconcat (path, "-shm", NULL);
  g_autofree char *uri = NULL;
  int flags = SQLITE_OPEN_READONLY | SQLITE_OPEN_NOMUTEX | SQLITE_OPEN_URI;
  int rc;

  if (access (dir, W_OK) != 0 && access (shm, F_OK) != 0)
    {
      char *escaped = g_uri_escape_string (path, "/", FALSE);

      uri = g_strdup_printf ("file:%s?immutable=1", escaped);
      g_free (escaped);
    }
  self->parent.read_only_reason = g_strdup (reason);
  rc = sqlite3_open_v2 (uri ? uri : path, &self->db, flags, NULL);
  return configured (self, rc, error);
}

static void
remove_with_wal (const char *path)
{
  g_autofree char *wal = g_strconcat (path, "-wal", NULL);
  g_autofree char *shm = g_strconcat (path, "-shm", NULL);

  g_unlink (wal);
  g_unlink (shm);
  g_unlink (path);
}

/* Builds a complete new library beside @path and links it into place, so
 * that no other process ever sees a half-made file: two colleagues
 * opening a new office library at the same moment both end up in the one
 * file that won (link() does not replace), and a failure leaves no file
 * behind.  *@created tells whether ours won. */
static gboolean
create_library_file (const char  *path,
                     gboolean     seed,
                     gboolean    *created,
                     GError     **error)
{
  /* The pid too: forked processes share the random generator's state. */
  g_autofree char *tmp = g_strdup_printf ("%s.new-%ld-%08x", path, (long) getpid (),
                                         g_random_int ());
  LaminaSqlite *self = open_file (tmp, TRUE, error);
  gboolean ok;

  if (self == NULL)
    {
      remove_with_wal (tmp);
      return FALSE;
    }
  ok = create_schema (self, LAMINA_LIBRARY_SCHEMA_VERSION, seed, error);
  /* Closing the last connection checkpoints the WAL into the file. */
  lamina_sqlite_backend_close (&self->parent);
  if (ok && link (tmp, path) == 0)
    *created = TRUE;
  else if (ok && errno != EEXIST)
    {
      int saved = errno;

      /* Some network shares have no hard links: rename instead, which
       * could only replace a file made in the very same instant. */
      if ((saved == EPERM || saved == ENOTSUP || saved == ENOSYS)
          && !g_file_test (path, G_FILE_TEST_EXISTS) && g_rename (tmp, path) == 0)
        *created = TRUE;
      else
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                       "%s: cannot create: %s", path, g_strerror (saved));
          ok = FALSE;
        }
    }
  remove_with_wal (tmp);
  return ok;
}

LaminaBackend *
lamina_sqlite_backend_open (const char             *path,
                                           LaminaLibraryOpenFlags  flags,
                                           GError                **error)
{
  LaminaSqlite *self;
  g_autofree char *reason = NULL;
  g_autoptr(GError) local = NULL;
  int version = 0, rc;
  gboolean created = FALSE;

  if (!g_file_test (path, G_FILE_TEST_EXISTS))
    {
      g_autofree char *dir = g_path_get_dirname (path);

      if (flags & (LAMINA_LIBRARY_OPEN_EXISTING | LAMINA_LIBRARY_OPEN_READ_ONLY))
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                       "%s: no such library", path);
          return NULL;
        }
      /* The user's normal permissions (the umask decides): an office
       * library in a new shared folder must stay readable by colleagues. */
      if (g_mkdir_with_parents (dir, 0777) != 0)
        {
          int saved = errno;
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                       "%s: cannot create the folder: %s", dir, g_strerror (saved));
          return NULL;
        }
      if (!create_library_file (path, !(flags & LAMINA_LIBRARY_OPEN_NO_SEED), &created, error))
        return NULL;
    }
  /* A new file is opened like any other, once it is complete. */
  if (!check_header (path, &local))
    {
      g_autofree char *latest = lamina_backup_dup_latest_for_path (path);
      LaminaBackend named = { .path = (char *) path };

      /* A file we have kept copies of was a library: it is damaged. */
      if (latest != NULL && g_error_matches (local, LAMINA_LIBRARY_ERROR,
                                             LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY))
        lamina_backend_set_damaged_error (&named, "on opening",
                                          "its first page is not a library's any more", error);
      else
        g_propagate_error (error, g_steal_pointer (&local));
      return NULL;
    }
  reason = read_only_reason (path, flags);
  self = reason ? open_read_only (path, reason, error) : open_file (path, FALSE, error);
  if (self == NULL)
    return NULL;
  if (reason == NULL && sqlite3_db_readonly (self->db, "main") == 1)
    self->parent.read_only_reason = g_strdup ("the file cannot be written");
  if (!recognise (self, &version, error))
    {
      lamina_sqlite_backend_close (&self->parent);
      return NULL;
    }
  self->parent.opened_version = version;
  if (reason != NULL && version < LAMINA_LIBRARY_SCHEMA_VERSION)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_READ_ONLY,
                   "%s: made by an earlier version of Lamina (library format %d) and read-only "
                   "here (%s): it cannot be brought up to format %d; open it where it can be "
                   "written, or open a copy", path, version, reason,
                   LAMINA_LIBRARY_SCHEMA_VERSION);
      lamina_sqlite_backend_close (&self->parent);
      return NULL;
    }
  if (version < LAMINA_LIBRARY_SCHEMA_VERSION
      && (!lamina_sqlite_exec (self, "PRAGMA journal_mode = WAL;", error)
          || !upgrade (self, version, error)))
    {
      lamina_sqlite_backend_close (&self->parent);
      return NULL;
    }
  if (created)
    self->parent.opened_version = 0;
  self->data_version = query_int (self, "PRAGMA data_version;", &rc);
  return &self->parent;
}

gboolean
lamina_sqlite_create_at_version (const char  *path,
                                 int          version,
                                 GError     **error)
{
  LaminaSqlite *self;
  gboolean ok;

  g_return_val_if_fail (version >= 1 && version <= LAMINA_LIBRARY_SCHEMA_VERSION, FALSE);

  self = open_file (path, TRUE, error);
  if (self == NULL)
    return FALSE;
  ok = create_schema (self, version, FALSE, error);
  lamina_sqlite_backend_close (&self->parent);
  return ok;
}
