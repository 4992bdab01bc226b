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
  char *body = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, revision);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    body = lamina_sqlite_column_dup (stmt, 0);
  else if (rc != SQLITE_DONE)
    lamina_sqlite_set_error (SELF, rc, "cannot read the 2-D check", error);
  sqlite3_reset (stmt);
  return body;
}

gboolean
lamina_sqlite_backend_put_field_check (LaminaBackend  *backend,
                                       const char     *id,
                                       int             revision,
                                       const char     *body,
                                       const char     *now,
                                       GError        **error)
{
  sqlite3_stmt *stmt = !lamina_sqlite_check_writable (SELF, error) ? NULL
                       : lamina_sqlite_prepare (SELF,
                                                "INSERT OR REPLACE INTO field_check"
                                                " (construction_id, revision, body, computed_at)"
                                                " VALUES (?1, ?2, ?3, ?4);", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, revision);
  lamina_sqlite_bind_text (stmt, 3, body);
  lamina_sqlite_bind_text (stmt, 4, now);
  return lamina_sqlite_step_done (SELF, stmt, error);
}
