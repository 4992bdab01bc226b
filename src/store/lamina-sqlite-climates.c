/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-climates.c: the library's climates (EN ISO 13788) in the
 * SQLite backend, and the flag of constructions checked with other climate
 * data than the library holds now. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"
#include "lamina-store-json.h"

#define SELF ((LaminaSqlite *) backend)

static LaminaClimate *
read_climate_row (sqlite3_stmt *stmt)
{
  LaminaClimate *climate = lamina_climate_new ((const char *) sqlite3_column_text (stmt, 0),
                                               (const char *) sqlite3_column_text (stmt, 1));

  climate->source = lamina_sqlite_column_dup (stmt, 2);
  /* A damaged body leaves the months NAN: lamina_climate_validate and the
   * check refuse them with the climate's name. */
  lamina_store_climate_months_from_json ((const char *) sqlite3_column_text (stmt, 3), climate);
  return climate;
}

GPtrArray *
lamina_sqlite_backend_list_climates (LaminaBackend  *backend,
                                     GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id, name, source, months FROM climate ORDER BY name COLLATE NOCASE, id;", error);
  g_autoptr(GPtrArray) list = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_climate_free);
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    g_ptr_array_add (list, read_climate_row (stmt));
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (SELF, rc, "cannot read the climates", error);
      return NULL;
    }
  return g_steal_pointer (&list);
}

LaminaClimate *
lamina_sqlite_backend_get_climate (LaminaBackend  *backend,
                                   const char     *id,
                                   GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id, name, source, months FROM climate WHERE id = ?1;", error);
  LaminaClimate *climate = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    climate = read_climate_row (stmt);
  else if (rc == SQLITE_DONE)
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                 "no climate “%s” in the library", id);
  else
    lamina_sqlite_set_error (SELF, rc, "cannot read a climate", error);
  sqlite3_reset (stmt);
  return climate;
}

gboolean
lamina_sqlite_refresh_climate_flags (LaminaSqlite  *self,
                                     const char    *climate_id,
                                     GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "UPDATE construction SET material_changed = 1"
    " WHERE deleted_at IS NULL AND id IN ("
    "   SELECT r.construction_id FROM revision r"
    "     JOIN construction c ON c.id = r.construction_id AND c.head = r.revision"
    "     JOIN climate cl ON cl.id = json_extract (r.body, '$.moisture.climate')"
    "    WHERE (?1 IS NULL OR cl.id = ?1)"
    "      AND json_extract (r.body, '$.moisture.climate_fingerprint') IS NOT cl.fingerprint);",
    error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, climate_id);
  return lamina_sqlite_step_done (self, stmt, error);
}

gboolean
lamina_sqlite_put_climate_in_txn (LaminaSqlite         *self,
                    const LaminaClimate  *climate,
                    const char           *now,
                    GError              **error)
{
  g_autofree char *months = lamina_store_climate_months_to_json (climate);
  g_autofree char *fingerprint = lamina_store_climate_fingerprint (climate);
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO climate (id, name, source, months, fingerprint, modified_at)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6)"
    " ON CONFLICT (id) DO UPDATE SET name = ?2, source = ?3, months = ?4,"
    "   fingerprint = ?5, modified_at = ?6;", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, climate->id);
  lamina_sqlite_bind_text (stmt, 2, climate->name ? climate->name : climate->id);
  lamina_sqlite_bind_text (stmt, 3, climate->source);
  lamina_sqlite_bind_text (stmt, 4, months);
  lamina_sqlite_bind_text (stmt, 5, fingerprint);
  lamina_sqlite_bind_text (stmt, 6, now);
  /* Clear and recompute every flag: a climate put back to the data a
   * construction was checked with clears its flag. */
  return lamina_sqlite_step_done (self, stmt, error)
         && lamina_sqlite_refresh_material_flags (self, NULL, error);
}

gboolean
lamina_sqlite_backend_put_climate (LaminaBackend        *backend,
                                   const LaminaClimate  *climate,
                                   const char           *now,
                                   GError              **error)
{
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!lamina_sqlite_put_climate_in_txn (SELF, climate, now, error)
      || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}
