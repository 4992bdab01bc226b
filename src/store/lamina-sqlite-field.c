/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The SQLite backend's store of 2-D checks (EN ISO 10211): one JSON body
 * per construction revision.  A revision never changes, so a check stored
 * with it stays true of it; a new revision has none until it is checked. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#define SELF ((LaminaSqlite *) backend)

char *
lamina_sqlite_backend_get_field_check (LaminaBackend  *backend,
                                       const char     *id,
                                       int             revision,
                                       GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
                                              "SELECT body FROM field_check"
                                              " WHERE construction_id = ?1 AND revision = ?2;", error);

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, revision);
  return lamina_sqlite_step_dup_text (SELF, stmt, "cannot read the 2-D check", error);
}

gboolean
lamina_sqlite_put_field_check_in_txn (LaminaSqlite  *self,
                                      const char    *id,
                                      int            revision,
                                      const char    *body,
                                      const char    *at,
                                      GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
                                              "INSERT OR REPLACE INTO field_check"
                                              " (construction_id, revision, body, computed_at)"
                                              " VALUES (?1, ?2, ?3, ?4);", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, revision);
  lamina_sqlite_bind_text (stmt, 3, body);
  lamina_sqlite_bind_text (stmt, 4, at);
  return lamina_sqlite_step_done (self, stmt, error);
}

gboolean
lamina_sqlite_backend_put_field_check (LaminaBackend  *backend,
                                       const char     *id,
                                       int             revision,
                                       const char     *body,
                                       const char     *now,
                                       GError        **error)
{
  return lamina_sqlite_check_writable (SELF, error)
         && lamina_sqlite_put_field_check_in_txn (SELF, id, revision, body, now, error);
}
