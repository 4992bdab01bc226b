/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-climates.c: the library's climates (EN ISO 13788) in the
 * SQLite backend, and the flag of constructions checked with other climate
 * data than the library holds now. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"
#include "lamina-store-json.h"

#include <math.h>

#define SELF ((LaminaSqlite *) backend)

static gpointer
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

  if (stmt == NULL)
    return NULL;
  return lamina_sqlite_read_rows (SELF, stmt, read_climate_row,
                                  (GDestroyNotify) lamina_climate_free, "cannot read the climates", error);
}

LaminaClimate *
lamina_sqlite_backend_get_climate (LaminaBackend  *backend,
                                   const char     *id,
                                   GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id, name, source, months FROM climate WHERE id = ?1;", error);

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  return lamina_sqlite_read_one (SELF, stmt, read_climate_row, "climate", id, error);
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

gboolean
lamina_sqlite_backend_delete_climate (LaminaBackend  *backend,
                                      const char     *id,
                                      GError        **error)
{
  sqlite3_stmt *stmt;
  int rc, users = 0;
  g_autofree char *code = NULL;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  stmt = lamina_sqlite_prepare (SELF,
    "SELECT count(*), min (coalesce (c.code, c.id)) FROM construction c"
    "  JOIN revision r ON r.construction_id = c.id AND r.revision = c.head"
    " WHERE c.deleted_at IS NULL AND json_extract (r.body, '$.moisture.climate') = ?1;", error);
  if (stmt == NULL)
    goto fail;
  lamina_sqlite_bind_text (stmt, 1, id);
  rc = sqlite3_step (stmt);
  if (rc != SQLITE_ROW)
    {
      lamina_sqlite_set_error (SELF, sqlite3_reset (stmt), "cannot read the constructions", error);
      goto fail;
    }
  users = sqlite3_column_int (stmt, 0);
  code = lamina_sqlite_column_dup (stmt, 1);
  sqlite3_reset (stmt);
  if (users > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IN_USE,
                   users == 1 ? "climate “%s” is used by %d construction (%s); it was not deleted"
                              : "climate “%s” is used by %d constructions (%s and others); it was not deleted",
                   id, users, code);
      goto fail;
    }
  stmt = lamina_sqlite_prepare (SELF, "DELETE FROM climate WHERE id = ?1;", error);
  if (stmt == NULL)
    goto fail;
  lamina_sqlite_bind_text (stmt, 1, id);
  if (!lamina_sqlite_step_done (SELF, stmt, error))
    goto fail;
  if (sqlite3_changes (SELF->db) == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no climate “%s” in the library", id);
      goto fail;
    }
  return lamina_sqlite_commit (SELF, error);
fail:
  lamina_sqlite_rollback (SELF);
  return FALSE;
}

double
lamina_sqlite_moisture_limit (LaminaSqlite *self)
{
  g_autofree char *value = lamina_sqlite_backend_get_setting ((LaminaBackend *) self,
                                                              LAMINA_MOISTURE_LIMIT_KEY, NULL);

  return lamina_library_moisture_limit_from_text (value);
}

/* Every construction with a moisture check, its flags again from its
 * latest revision with @limit. */
static gboolean
refresh_moisture_flags (LaminaSqlite  *self,
                        double         limit,
                        GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "SELECT c.id, r.body FROM construction c"
    "  JOIN revision r ON r.construction_id = c.id AND r.revision = c.head"
    " WHERE (c.flags & ?1) <> 0;", error);
  g_autoptr(GPtrArray) ids = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GArray) flags = g_array_new (FALSE, FALSE, sizeof (int));
  int rc;

  if (stmt == NULL)
    return FALSE;
  sqlite3_bind_int (stmt, 1, LAMINA_SUMMARY_HAS_MOISTURE);
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      g_autoptr(LaminaConstruction) c =
        lamina_store_construction_from_json ((const char *) sqlite3_column_text (stmt, 1), NULL);
      int f = c != NULL ? (int) lamina_library_moisture_flags_for_limit (c, limit)
                        : LAMINA_SUMMARY_HAS_MOISTURE | LAMINA_SUMMARY_MOISTURE_FAILS;

      g_ptr_array_add (ids, lamina_sqlite_column_dup (stmt, 0));
      g_array_append_val (flags, f);
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (self, rc, "cannot read the constructions", error);
      return FALSE;
    }
  for (guint i = 0; i < ids->len; i++)
    {
      stmt = lamina_sqlite_prepare (self,
        "UPDATE construction SET flags = (flags & ~?2) | ?3 WHERE id = ?1;", error);
      if (stmt == NULL)
        return FALSE;
      lamina_sqlite_bind_text (stmt, 1, ids->pdata[i]);
      sqlite3_bind_int (stmt, 2, LAMINA_SUMMARY_HAS_MOISTURE | LAMINA_SUMMARY_MOISTURE_FAILS);
      sqlite3_bind_int (stmt, 3, g_array_index (flags, int, i));
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_backend_set_moisture_limit (LaminaBackend  *backend,
                                          const char     *value,
                                          double          limit,
                                          GError        **error)
{
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (lamina_sqlite_put_setting_in_txn (SELF, LAMINA_MOISTURE_LIMIT_KEY, value, error)
      && refresh_moisture_flags (SELF, limit, error)
      && lamina_sqlite_commit (SELF, error))
    return TRUE;
  lamina_sqlite_rollback (SELF);
  return FALSE;
}
