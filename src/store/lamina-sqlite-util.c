/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-util.c: the small helpers every SQLite file of the
 * backend uses: errors mapped to LAMINA_LIBRARY_ERROR codes, cached
 * statements, transactions, NULL-aware binding and reading. */
#define G_LOG_DOMAIN "lamina-store"

#include "config.h"

#include "lamina-sqlite-private.h"

#include <math.h>
#include <string.h>

void
lamina_sqlite_set_error (LaminaSqlite  *self,
                         int            rc,
                         const char    *what,
                         GError       **error)
{
  LaminaLibraryError code;

  /* The three the user must act on get a sentence of their own. */
  switch (rc & 0xff)
    {
    case SQLITE_BUSY:
      lamina_sqlite_set_busy_error (self, error);
      return;
    case SQLITE_READONLY:
      if (rc == SQLITE_READONLY_DBMOVED)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO,
                       "%s: the library file was moved, deleted or replaced while open "
                       "(a restore?); nothing was changed: open it again", self->parent.path);
          return;
        }
      lamina_backend_set_read_only_error (&self->parent, error);
      return;
    case SQLITE_CORRUPT:
    case SQLITE_NOTADB:
      {
        g_autofree char *where = g_strdup_printf ("while trying to %s",
                                                  g_str_has_prefix (what, "cannot ")
                                                    ? what + strlen ("cannot ") : what);

        lamina_backend_set_damaged_error (&self->parent, where,
                                          self->db ? sqlite3_errmsg (self->db)
                                                   : sqlite3_errstr (rc), error);
        return;
      }
    default:
      break;
    }
  switch (rc & 0xff)
    {
    case SQLITE_BUSY:
    case SQLITE_LOCKED:
      code = LAMINA_LIBRARY_ERROR_BUSY;
      break;
    case SQLITE_CORRUPT:
      code = LAMINA_LIBRARY_ERROR_CORRUPT;
      break;
    case SQLITE_NOTADB:
      code = LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY;
      break;
    case SQLITE_READONLY:
      code = LAMINA_LIBRARY_ERROR_READ_ONLY;
      break;
    case SQLITE_CANTOPEN:
    case SQLITE_IOERR:
    case SQLITE_FULL:
      code = LAMINA_LIBRARY_ERROR_IO;
      break;
    case SQLITE_CONSTRAINT:
      code = LAMINA_LIBRARY_ERROR_INVALID;
      break;
    default:
      code = LAMINA_LIBRARY_ERROR_FAILED;
    }
  g_set_error (error, LAMINA_LIBRARY_ERROR, code, "%s: %s: %s",
               self->parent.path, what,
               self->db ? sqlite3_errmsg (self->db) : sqlite3_errstr (rc));
}

sqlite3_stmt *
lamina_sqlite_prepare (LaminaSqlite  *self,
                       const char    *sql,
                       GError       **error)
{
  sqlite3_stmt *stmt = g_hash_table_lookup (self->statements, sql);
  int rc;

  if (stmt != NULL)
    {
      sqlite3_reset (stmt);
      sqlite3_clear_bindings (stmt);
      return stmt;
    }
  rc = sqlite3_prepare_v3 (self->db, sql, -1, SQLITE_PREPARE_PERSISTENT, &stmt, NULL);
  if (rc != SQLITE_OK)
    {
      lamina_sqlite_set_error (self, rc, "cannot prepare a query", error);
      return NULL;
    }
  g_hash_table_insert (self->statements, g_strdup (sql), stmt);
  return stmt;
}

gboolean
lamina_sqlite_exec (LaminaSqlite  *self,
                    const char    *sql,
                    GError       **error)
{
  int rc = sqlite3_exec (self->db, sql, NULL, NULL, NULL);

  if (rc != SQLITE_OK)
    {
      lamina_sqlite_set_error (self, rc, "cannot update the library", error);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_check_writable (LaminaSqlite  *self,
                              GError       **error)
{
  if (self->parent.read_only_reason == NULL)
    return TRUE;
  lamina_backend_set_read_only_error (&self->parent, error);
  return FALSE;
}

gboolean
lamina_sqlite_begin (LaminaSqlite  *self,
                     GError       **error)
{
  gboolean ok;

  if (!lamina_sqlite_check_writable (self, error))
    return FALSE;
  ok = lamina_sqlite_exec (self, "BEGIN IMMEDIATE;", error);
  lamina_sqlite_end_wait (self);
  return ok;
}

gboolean
lamina_sqlite_commit (LaminaSqlite  *self,
                      GError       **error)
{
  if (!lamina_sqlite_exec (self, "COMMIT;", error))
    {
      lamina_sqlite_rollback (self);
      return FALSE;
    }
  return TRUE;
}

void
lamina_sqlite_rollback (LaminaSqlite *self)
{
  if (!sqlite3_get_autocommit (self->db))
    sqlite3_exec (self->db, "ROLLBACK;", NULL, NULL, NULL);
}

gboolean
lamina_sqlite_step_done (LaminaSqlite  *self,
                         sqlite3_stmt  *stmt,
                         GError       **error)
{
  int rc = sqlite3_step (stmt);

  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE && rc != SQLITE_ROW)
    {
      lamina_sqlite_set_error (self, rc, "cannot update the library", error);
      return FALSE;
    }
  return TRUE;
}

void
lamina_sqlite_bind_text (sqlite3_stmt *stmt,
                         int           index,
                         const char   *text)
{
  if (text == NULL)
    sqlite3_bind_null (stmt, index);
  else
    sqlite3_bind_text (stmt, index, text, -1, SQLITE_TRANSIENT);
}

void
lamina_sqlite_bind_double (sqlite3_stmt *stmt,
                           int           index,
                           double        value)
{
  if (isnan (value))
    sqlite3_bind_null (stmt, index);
  else
    sqlite3_bind_double (stmt, index, value);
}

double
lamina_sqlite_column_double (sqlite3_stmt *stmt,
                             int           index)
{
  if (sqlite3_column_type (stmt, index) == SQLITE_NULL)
    return NAN;
  return sqlite3_column_double (stmt, index);
}

char *
lamina_sqlite_column_dup (sqlite3_stmt *stmt,
                          int           index)
{
  return g_strdup ((const char *) sqlite3_column_text (stmt, index));
}

GPtrArray *
lamina_sqlite_read_rows (LaminaSqlite         *self,
                         sqlite3_stmt         *stmt,
                         LaminaSqliteReadRow   read_row,
                         GDestroyNotify        free_item,
                         const char           *what,
                         GError              **error)
{
  g_autoptr(GPtrArray) list = g_ptr_array_new_with_free_func (free_item);
  int rc;

  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    g_ptr_array_add (list, read_row (stmt));
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (self, rc, what, error);
      return NULL;
    }
  return g_steal_pointer (&list);
}

gpointer
lamina_sqlite_read_one (LaminaSqlite         *self,
                        sqlite3_stmt         *stmt,
                        LaminaSqliteReadRow   read_row,
                        const char           *kind,
                        const char           *id,
                        GError              **error)
{
  gpointer item = NULL;
  int rc = sqlite3_step (stmt);

  if (rc == SQLITE_ROW)
    item = read_row (stmt);
  else if (rc == SQLITE_DONE)
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                 "no %s “%s” in the library", kind, id);
  else
    {
      g_autofree char *what = g_strdup_printf ("cannot read a %s", kind);

      lamina_sqlite_set_error (self, rc, what, error);
    }
  sqlite3_reset (stmt);
  return item;
}

char *
lamina_sqlite_step_dup_text (LaminaSqlite  *self,
                             sqlite3_stmt  *stmt,
                             const char    *what,
                             GError       **error)
{
  char *text = NULL;
  int rc = sqlite3_step (stmt);

  if (rc == SQLITE_ROW)
    text = lamina_sqlite_column_dup (stmt, 0);
  else if (rc != SQLITE_DONE)
    lamina_sqlite_set_error (self, rc, what, error);
  sqlite3_reset (stmt);
  return text;
}

LaminaReviewEvent *
lamina_sqlite_read_review_event (sqlite3_stmt *stmt,
                                 int           first)
{
  LaminaReviewEvent *e = g_new0 (LaminaReviewEvent, 1);

  e->revision = sqlite3_column_int (stmt, first);
  e->act = lamina_sqlite_column_dup (stmt, first + 1);
  e->by = lamina_sqlite_column_dup (stmt, first + 2);
  e->at = lamina_sqlite_column_dup (stmt, first + 3);
  e->date = lamina_sqlite_column_dup (stmt, first + 4);
  e->policy = lamina_sqlite_column_dup (stmt, first + 5);
  e->reason = lamina_sqlite_column_dup (stmt, first + 6);
  return e;
}
