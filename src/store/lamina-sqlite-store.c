/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-store.c: materials, construction revisions and review
 * states in the SQLite backend.  Every write is one BEGIN IMMEDIATE
 * transaction (a plain BEGIN that reads then writes fails with
 * SQLITE_BUSY_SNAPSHOT when another process committed in between). */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#include "lamina-store-json.h"

#define SELF ((LaminaSqlite *) backend)

/* Materials */

#define MATERIAL_COLUMNS \
  "id, name, category, conductivity, density, specific_heat," \
  " vapour_resistance_factor, emissivity, source, notes, stock_thicknesses"

static gpointer
read_material_row (sqlite3_stmt *stmt)
{
  LaminaCategory category = LAMINA_CATEGORY_OTHER;
  LaminaMaterial *m;

  lamina_category_from_string ((const char *) sqlite3_column_text (stmt, 2), &category);
  m = lamina_material_new ((const char *) sqlite3_column_text (stmt, 0),
                           (const char *) sqlite3_column_text (stmt, 1),
                           category, sqlite3_column_double (stmt, 3));
  m->density = lamina_sqlite_column_double (stmt, 4);
  m->specific_heat = lamina_sqlite_column_double (stmt, 5);
  m->vapour_resistance_factor = lamina_sqlite_column_double (stmt, 6);
  m->emissivity = lamina_sqlite_column_double (stmt, 7);
  m->source = lamina_sqlite_column_dup (stmt, 8);
  m->notes = lamina_sqlite_column_dup (stmt, 9);
  /* Written by put_material from a checked list; a hand-edited file
   * with a bad one loses only the stock sizes. */
  lamina_material_parse_stock_string (m, (const char *) sqlite3_column_text (stmt, 10), NULL);
  return m;
}

GPtrArray *
lamina_sqlite_backend_list_materials (LaminaBackend  *backend,
                                      GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT " MATERIAL_COLUMNS " FROM material ORDER BY category, name COLLATE NOCASE, id;",
    error);

  if (stmt == NULL)
    return NULL;
  return lamina_sqlite_read_rows (SELF, stmt, read_material_row,
                                  (GDestroyNotify) lamina_material_free, "cannot read the materials", error);
}

LaminaMaterial *
lamina_sqlite_backend_get_material (LaminaBackend  *backend,
                                    const char     *id,
                                    GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT " MATERIAL_COLUMNS " FROM material WHERE id = ?1;", error);

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  return lamina_sqlite_read_one (SELF, stmt, read_material_row, "material", id, error);
}

gboolean
lamina_sqlite_refresh_material_flags (LaminaSqlite  *self,
                                      const char    *material_id,
                                      GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "UPDATE construction SET material_changed = EXISTS ("
    "    SELECT 1 FROM revision_material rm JOIN material m ON m.id = rm.material_id"
    "     WHERE rm.construction_id = construction.id AND rm.revision = construction.head"
    "       AND m.fingerprint <> rm.fingerprint)"
    " WHERE ?1 IS NULL OR id IN ("
    "    SELECT construction_id FROM revision_material WHERE material_id = ?1);",
    error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, material_id);
  /* A climate changed since review flags the construction as well. */
  return lamina_sqlite_step_done (self, stmt, error)
         && lamina_sqlite_refresh_climate_flags (self, NULL, error);
}

static gboolean
put_material_in_txn (LaminaSqlite          *self,
                     const LaminaMaterial  *m,
                     const char            *now,
                     GError               **error)
{
  g_autofree char *fingerprint = lamina_store_material_fingerprint (m);
  g_autofree char *stock = lamina_material_dup_stock_string (m);
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO material (" MATERIAL_COLUMNS ", fingerprint, modified_at)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?13, ?11, ?12)"
    " ON CONFLICT (id) DO UPDATE SET name = ?2, category = ?3, conductivity = ?4,"
    "   density = ?5, specific_heat = ?6, vapour_resistance_factor = ?7,"
    "   emissivity = ?8, source = ?9, notes = ?10, fingerprint = ?11, modified_at = ?12,"
    "   stock_thicknesses = ?13;",
    error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, m->id);
  lamina_sqlite_bind_text (stmt, 2, m->name);
  lamina_sqlite_bind_text (stmt, 3, lamina_category_to_string (m->category));
  lamina_sqlite_bind_double (stmt, 4, m->conductivity);
  lamina_sqlite_bind_double (stmt, 5, m->density);
  lamina_sqlite_bind_double (stmt, 6, m->specific_heat);
  lamina_sqlite_bind_double (stmt, 7, m->vapour_resistance_factor);
  lamina_sqlite_bind_double (stmt, 8, m->emissivity);
  lamina_sqlite_bind_text (stmt, 9, m->source);
  lamina_sqlite_bind_text (stmt, 10, m->notes);
  lamina_sqlite_bind_text (stmt, 11, fingerprint);
  lamina_sqlite_bind_text (stmt, 12, now);
  lamina_sqlite_bind_text (stmt, 13, stock);
  return lamina_sqlite_step_done (self, stmt, error)
         && lamina_sqlite_refresh_material_flags (self, m->id, error);
}

gboolean
lamina_sqlite_backend_put_material (LaminaBackend         *backend,
                                    const LaminaMaterial  *material,
                                    const char            *now,
                                    GError               **error)
{
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!put_material_in_txn (SELF, material, now, error)
      || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_put_material (LaminaSqlite          *self,
                            const LaminaMaterial  *material,
                            const char            *now,
                            GError               **error)
{
  return put_material_in_txn (self, material, now, error);
}

