/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-store.c: materials, library settings, climates (EN ISO 13788)
 * and the 2-D checks (EN ISO 10211) in the PostgreSQL backend, as the
 * SQLite backend keeps them (lamina-sqlite-store.c, -climates.c,
 * -field.c). */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include "lamina-store-common.h"
#include "lamina-store-json.h"
#include "lamina-library-seed.h"

#define SELF ((LaminaPg *) backend)

/* Materials */

#define MATERIAL_COLUMNS \
  "id, name, category, conductivity, density, specific_heat," \
  " vapour_resistance_factor, emissivity, source, notes, stock_thicknesses"

static LaminaMaterial *
read_material_row (const PGresult *res,
                   int             row)
{
  LaminaCategory category = LAMINA_CATEGORY_OTHER;
  LaminaMaterial *m;

  lamina_category_from_string (lamina_pg_get (res, row, 2), &category);
  m = lamina_material_new (lamina_pg_get (res, row, 0), lamina_pg_get (res, row, 1),
                           category, lamina_pg_double (res, row, 3));
  m->density = lamina_pg_double (res, row, 4);
  m->specific_heat = lamina_pg_double (res, row, 5);
  m->vapour_resistance_factor = lamina_pg_double (res, row, 6);
  m->emissivity = lamina_pg_double (res, row, 7);
  m->source = lamina_pg_dup (res, row, 8);
  m->notes = lamina_pg_dup (res, row, 9);
  lamina_material_parse_stock_string (m, lamina_pg_get (res, row, 10), NULL);
  return m;
}

GPtrArray *
lamina_pg_list_materials (LaminaBackend  *backend,
                          GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT " MATERIAL_COLUMNS " FROM material"
    " ORDER BY category COLLATE \"C\", lower (name) COLLATE \"C\", id COLLATE \"C\"",
    NULL, "cannot read the materials", error);
  GPtrArray *list;

  if (res == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);
  for (int i = 0; i < PQntuples (res); i++)
    g_ptr_array_add (list, read_material_row (res, i));
  PQclear (res);
  return list;
}

LaminaMaterial *
lamina_pg_get_material (LaminaBackend  *backend,
                        const char     *id,
                        GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  LaminaMaterial *m = NULL;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (SELF, "SELECT " MATERIAL_COLUMNS " FROM material WHERE id = $1",
                         params, "cannot read a material", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) > 0)
    m = read_material_row (res, 0);
  else
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                 "no material “%s” in the library", id);
  PQclear (res);
  return m;
}

gboolean
lamina_pg_refresh_material_flags (LaminaPg     *self,
                                  const char   *material_id,
                                  GError      **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, material_id);
  return lamina_pg_run (self,
    "UPDATE construction SET material_changed = EXISTS ("
    "    SELECT 1 FROM revision_material rm JOIN material m ON m.id = rm.material_id"
    "     WHERE rm.construction_id = construction.id AND rm.revision = construction.head"
    "       AND m.fingerprint <> rm.fingerprint)"
    " WHERE $1::text IS NULL OR id IN ("
    "    SELECT construction_id FROM revision_material WHERE material_id = $1::text)",
    params, "cannot update the library", error)
    && lamina_pg_refresh_climate_flags (self, NULL, error);
}

gboolean
lamina_pg_put_material_in_txn (LaminaPg              *self,
                               const LaminaMaterial  *m,
                               const char            *now,
                               GError               **error)
{
  g_autofree char *fingerprint = lamina_store_material_fingerprint (m);
  g_autofree char *stock = lamina_material_dup_stock_string (m);
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, m->id);
  lamina_pg_add_text (params, m->name);
  lamina_pg_add_text (params, lamina_category_to_string (m->category));
  lamina_pg_add_double (params, m->conductivity);
  lamina_pg_add_double (params, m->density);
  lamina_pg_add_double (params, m->specific_heat);
  lamina_pg_add_double (params, m->vapour_resistance_factor);
  lamina_pg_add_double (params, m->emissivity);
  lamina_pg_add_text (params, m->source);
  lamina_pg_add_text (params, m->notes);
  lamina_pg_add_text (params, stock);
  lamina_pg_add_text (params, fingerprint);
  lamina_pg_add_text (params, now);
  return lamina_pg_run (self,
    "INSERT INTO material (" MATERIAL_COLUMNS ", fingerprint, modified_at)"
    " VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13)"
    " ON CONFLICT (id) DO UPDATE SET name = $2, category = $3, conductivity = $4,"
    "   density = $5, specific_heat = $6, vapour_resistance_factor = $7,"
    "   emissivity = $8, source = $9, notes = $10, stock_thicknesses = $11,"
    "   fingerprint = $12, modified_at = $13",
    params, "cannot store a material", error)
    && lamina_pg_refresh_material_flags (self, m->id, error);
}

typedef struct
{
  const LaminaMaterial *material;
  const LaminaClimate  *climate;
  const char           *now;
  const char           *key;
  const char           *value;
} Put;

static gboolean
put_material_txn (LaminaPg  *self,
                  gpointer   data,
                  GError   **error)
{
  Put *put = data;

  return lamina_pg_put_material_in_txn (self, put->material, put->now, error);
}

gboolean
lamina_pg_put_material (LaminaBackend         *backend,
                        const LaminaMaterial  *material,
                        const char            *now,
                        GError               **error)
{
  Put put = { .material = material, .now = now };

  return lamina_pg_transaction (SELF, put_material_txn, &put, error);
}

gboolean
lamina_pg_seed_materials (LaminaPg  *self,
                          GError   **error)
{
  g_autofree char *stamp = lamina_library_dup_now ();
  guint n = 0;

  lamina_library_get_seed_materials (&n);
  for (guint i = 0; i < n; i++)
    {
      g_autoptr(LaminaMaterial) m = lamina_store_seed_material_new (i);

      if (!lamina_pg_put_material_in_txn (self, m, stamp, error))
        return FALSE;
    }
  return TRUE;
}

/* Settings */

char *
lamina_pg_get_setting (LaminaBackend  *backend,
                       const char     *key,
                       GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  char *value = NULL;

  lamina_pg_add_text (params, key);
  res = lamina_pg_query (SELF, "SELECT value FROM meta WHERE key = $1", params,
                         "cannot read the library settings", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) > 0)
    value = lamina_pg_dup (res, 0, 0);
  PQclear (res);
  return value;
}

static gboolean
set_setting_txn (LaminaPg  *self,
                 gpointer   data,
                 GError   **error)
{
  Put *put = data;
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, put->key);
  lamina_pg_add_text (params, put->value);
  return lamina_pg_run (self, "INSERT INTO meta (key, value) VALUES ($1, $2)"
                              " ON CONFLICT (key) DO UPDATE SET value = $2",
                        params, "cannot change the library settings", error);
}

gboolean
lamina_pg_set_setting (LaminaBackend  *backend,
                       const char     *key,
                       const char     *value,
                       GError        **error)
{
  Put put = { .key = key, .value = value };

  return lamina_pg_transaction (SELF, set_setting_txn, &put, error);
}

/* Climates */

static LaminaClimate *
read_climate_row (const PGresult *res,
                  int             row)
{
  LaminaClimate *climate = lamina_climate_new (lamina_pg_get (res, row, 0),
                                               lamina_pg_get (res, row, 1));

  climate->source = lamina_pg_dup (res, row, 2);
  lamina_store_climate_months_from_json (lamina_pg_get (res, row, 3), climate);
  return climate;
}

GPtrArray *
lamina_pg_list_climates (LaminaBackend  *backend,
                         GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT id, name, source, months FROM climate"
    " ORDER BY lower (name) COLLATE \"C\", id COLLATE \"C\"",
    NULL, "cannot read the climates", error);
  GPtrArray *list;

  if (res == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_climate_free);
  for (int i = 0; i < PQntuples (res); i++)
    g_ptr_array_add (list, read_climate_row (res, i));
  PQclear (res);
  return list;
}

LaminaClimate *
lamina_pg_get_climate (LaminaBackend  *backend,
                       const char     *id,
                       GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  LaminaClimate *climate = NULL;
  PGresult *res;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (SELF, "SELECT id, name, source, months FROM climate WHERE id = $1",
                         params, "cannot read a climate", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) > 0)
    climate = read_climate_row (res, 0);
  else
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                 "no climate “%s” in the library", id);
  PQclear (res);
  return climate;
}

gboolean
lamina_pg_refresh_climate_flags (LaminaPg    *self,
                                 const char  *climate_id,
                                 GError     **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, climate_id);
  return lamina_pg_run (self,
    "UPDATE construction SET material_changed = true"
    " WHERE deleted_at IS NULL AND id IN ("
    "   SELECT r.construction_id FROM revision r"
    "     JOIN construction c ON c.id = r.construction_id AND c.head = r.revision"
    "     JOIN climate cl ON cl.id = r.body::jsonb #>> '{moisture,climate}'"
    "    WHERE ($1::text IS NULL OR cl.id = $1::text)"
    "      AND (r.body::jsonb #>> '{moisture,climate_fingerprint}')"
    "          IS DISTINCT FROM cl.fingerprint)",
    params, "cannot update the library", error);
}

static gboolean
put_climate_txn (LaminaPg  *self,
                 gpointer   data,
                 GError   **error)
{
  Put *put = data;

  return lamina_pg_put_climate_in_txn (self, put->climate, put->now, error);
}

gboolean
lamina_pg_put_climate_in_txn (LaminaPg             *self,
                              const LaminaClimate  *climate,
                              const char           *now,
                              GError              **error)
{
  g_autofree char *months = lamina_store_climate_months_to_json (climate);
  g_autofree char *fingerprint = lamina_store_climate_fingerprint (climate);
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, climate->id);
  lamina_pg_add_text (params, climate->name ? climate->name : climate->id);
  lamina_pg_add_text (params, climate->source);
  lamina_pg_add_text (params, months);
  lamina_pg_add_text (params, fingerprint);
  lamina_pg_add_text (params, now);
  /* Clear and recompute every flag, as the SQLite backend does. */
  return lamina_pg_run (self,
    "INSERT INTO climate (id, name, source, months, fingerprint, modified_at)"
    " VALUES ($1, $2, $3, $4, $5, $6)"
    " ON CONFLICT (id) DO UPDATE SET name = $2, source = $3, months = $4,"
    "   fingerprint = $5, modified_at = $6",
    params, "cannot store a climate", error)
    && lamina_pg_refresh_material_flags (self, NULL, error);
}

gboolean
lamina_pg_put_climate (LaminaBackend        *backend,
                       const LaminaClimate  *climate,
                       const char           *now,
                       GError              **error)
{
  Put put = { .climate = climate, .now = now };

  return lamina_pg_transaction (SELF, put_climate_txn, &put, error);
}

/* 2-D checks */

char *
lamina_pg_get_field_check (LaminaBackend  *backend,
                           const char     *id,
                           int             revision,
                           GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  char *body = NULL;

  lamina_pg_add_text (params, id);
  lamina_pg_add_int (params, revision);
  res = lamina_pg_query (SELF, "SELECT body FROM field_check"
                               " WHERE construction_id = $1 AND revision = $2",
                         params, "cannot read the 2-D check", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) > 0)
    body = lamina_pg_dup (res, 0, 0);
  PQclear (res);
  return body;
}

typedef struct
{
  const char *id;
  int         revision;
  const char *body;
  const char *now;
} FieldCheck;

static gboolean
put_field_check_txn (LaminaPg  *self,
                     gpointer   data,
                     GError   **error)
{
  FieldCheck *f = data;
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, f->id);
  lamina_pg_add_int (params, f->revision);
  lamina_pg_add_text (params, f->body);
  lamina_pg_add_text (params, f->now);
  return lamina_pg_run (self,
    "INSERT INTO field_check (construction_id, revision, body, computed_at)"
    " VALUES ($1, $2, $3, $4)"
    " ON CONFLICT (construction_id, revision) DO UPDATE SET body = $3, computed_at = $4",
    params, "cannot store the 2-D check", error);
}

gboolean
lamina_pg_put_field_check (LaminaBackend  *backend,
                           const char     *id,
                           int             revision,
                           const char     *body,
                           const char     *now,
                           GError        **error)
{
  FieldCheck f = { id, revision, body, now };

  return lamina_pg_transaction (SELF, put_field_check_txn, &f, error);
}

/* Deleting a climate no construction uses (IN_USE otherwise). */

static gboolean
delete_climate_txn (LaminaPg  *self,
                    gpointer   data,
                    GError   **error)
{
  const char *id = data;
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  int users;
  gint64 n;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (self,
    "SELECT count(*), min (coalesce (c.code, c.id)) FROM construction c"
    "  JOIN revision r ON r.construction_id = c.id AND r.revision = c.head"
    " WHERE c.deleted_at IS NULL AND r.body::jsonb #>> '{moisture,climate}' = $1",
    params, "cannot read the constructions", error);
  if (res == NULL)
    return FALSE;
  users = lamina_pg_int (res, 0, 0);
  if (users > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IN_USE,
                   users == 1 ? "climate “%s” is used by %d construction (%s); it was not deleted"
                              : "climate “%s” is used by %d constructions (%s and others); it was not deleted",
                   id, users, lamina_pg_get (res, 0, 1));
      PQclear (res);
      return FALSE;
    }
  PQclear (res);
  res = lamina_pg_query (self, "DELETE FROM climate WHERE id = $1", params,
                         "cannot delete the climate", error);
  if (res == NULL)
    return FALSE;
  n = lamina_pg_changes (res);
  PQclear (res);
  if (n == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no climate “%s” in the library", id);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_pg_delete_climate (LaminaBackend  *backend,
                          const char     *id,
                          GError        **error)
{
  return lamina_pg_transaction (SELF, delete_climate_txn, (gpointer) id, error);
}

/* The office's moisture limit (EN ISO 13788): the setting, and the
 * "fails its moisture check" flag of every construction with a check
 * computed again from its latest revision, in one transaction. */

double
lamina_pg_moisture_limit (LaminaPg *self)
{
  g_autofree char *value = NULL;

  /* In pipeline mode the transaction shows as active. */
  if (self->limit_read && (self->pipeline || PQtransactionStatus (self->conn) == PQTRANS_INTRANS))
    return self->moisture_limit;
  value = lamina_pg_get_setting (&self->parent, LAMINA_MOISTURE_LIMIT_KEY, NULL);
  self->moisture_limit = lamina_library_moisture_limit_from_text (value);
  self->limit_read = TRUE;
  return self->moisture_limit;
}

typedef struct
{
  const char *value;
  double      limit;
} Limit;

static gboolean
set_moisture_limit_txn (LaminaPg  *self,
                        gpointer   data,
                        GError   **error)
{
  Limit *l = data;
  Put put = { .key = LAMINA_MOISTURE_LIMIT_KEY, .value = l->value };
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;

  if (!set_setting_txn (self, &put, error))
    return FALSE;
  lamina_pg_add_int (params, LAMINA_SUMMARY_HAS_MOISTURE);
  res = lamina_pg_query (self,
    "SELECT c.id, r.body FROM construction c"
    "  JOIN revision r ON r.construction_id = c.id AND r.revision = c.head"
    " WHERE (c.flags & $1::integer) <> 0 FOR UPDATE OF c", params,
    "cannot read the constructions", error);
  if (res == NULL)
    return FALSE;
  for (int i = 0; i < PQntuples (res); i++)
    {
      g_autoptr(LaminaConstruction) c = lamina_store_construction_from_json (lamina_pg_get (res, i, 1),
                                                                            NULL);
      int f = c != NULL ? (int) lamina_library_moisture_flags_for_limit (c, l->limit)
                        : LAMINA_SUMMARY_HAS_MOISTURE | LAMINA_SUMMARY_MOISTURE_FAILS;
      g_autoptr(GPtrArray) row = lamina_pg_params_new ();

      lamina_pg_add_text (row, lamina_pg_get (res, i, 0));
      lamina_pg_add_int (row, LAMINA_SUMMARY_HAS_MOISTURE | LAMINA_SUMMARY_MOISTURE_FAILS);
      lamina_pg_add_int (row, f);
      if (!lamina_pg_run (self, "UPDATE construction SET flags = (flags & ~$2::integer) | $3::integer"
                                " WHERE id = $1", row, "cannot update the library", error))
        {
          PQclear (res);
          return FALSE;
        }
    }
  PQclear (res);
  return TRUE;
}

gboolean
lamina_pg_set_moisture_limit (LaminaBackend  *backend,
                              const char     *value,
                              double          limit,
                              GError        **error)
{
  Limit l = { value, limit };

  return lamina_pg_transaction (SELF, set_moisture_limit_txn, &l, error);
}

/* The storage check (lamina-cli verify): the server keeps its own files
 * whole; what is checked here is what the library's rules need of the
 * rows and of the schema's guards. */
gboolean
lamina_pg_verify_storage (LaminaBackend  *backend,
                          GPtrArray      *problems,
                          GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT 'construction ' || coalesce (c.code, c.id) || ': its latest revision '"
    "       || c.head || ' is missing'"
    "  FROM construction c WHERE NOT EXISTS (SELECT 1 FROM revision r"
    "   WHERE r.construction_id = c.id AND r.revision = c.head)"
    " UNION ALL "
    "SELECT 'construction ' || coalesce (c.code, c.id) || ': listed as ' || c.status"
    "       || ' but its latest revision is ' || r.status"
    "  FROM construction c JOIN revision r ON r.construction_id = c.id AND r.revision = c.head"
    " WHERE r.status <> c.status"
    " UNION ALL "
    "SELECT 'the server''s guard ' || g || ' is missing: stored revisions or review records "
    "could be changed' FROM unnest (ARRAY['revision_guard', 'review_event_guard']) AS g"
    " WHERE NOT EXISTS (SELECT 1 FROM pg_trigger t WHERE t.tgname = g AND t.tgenabled <> 'D')",
    NULL, "cannot check the library", error);

  if (res == NULL)
    return FALSE;
  for (int i = 0; i < PQntuples (res); i++)
    g_ptr_array_add (problems, g_strdup_printf ("storage: %s", lamina_pg_get (res, i, 0)));
  PQclear (res);
  return TRUE;
}
