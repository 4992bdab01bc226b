/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-copy.c: the whole library read as stored and written into
 * an empty one (LaminaBackendVTable read_all / write_all), for moving an
 * office's library between files and servers. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#include "lamina-store-json.h"

#define SELF ((LaminaSqlite *) backend)

/* id → modified_at of every row of @table. */
static GHashTable *
read_times (LaminaSqlite  *self,
            const char    *sql,
            GError       **error)
{
  g_autoptr(GHashTable) times = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self, sql, error);
  int rc;

  if (stmt == NULL)
    return NULL;
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    g_hash_table_insert (times, lamina_sqlite_column_dup (stmt, 0),
                         lamina_sqlite_column_dup (stmt, 1));
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (self, rc, "cannot read the library", error);
      return NULL;
    }
  return g_steal_pointer (&times);
}

static void
add_times (GPtrArray   *out,
           GHashTable  *times,
           GPtrArray   *items,
           gsize        id_offset)
{
  for (guint i = 0; i < items->len; i++)
    {
      const char *id = G_STRUCT_MEMBER (const char *, items->pdata[i], id_offset);

      g_ptr_array_add (out, g_strdup (g_hash_table_lookup (times, id)));
    }
}

static gboolean
read_settings (LaminaSqlite       *self,
               LaminaBackendDump  *dump,
               GError            **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "SELECT key, value FROM meta ORDER BY key;", error);
  int rc;

  if (stmt == NULL)
    return FALSE;
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      g_ptr_array_add (dump->settings, lamina_sqlite_column_dup (stmt, 0));
      g_ptr_array_add (dump->settings, lamina_sqlite_column_dup (stmt, 1));
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (self, rc, "cannot read the library settings", error);
      return FALSE;
    }
  return TRUE;
}

static gboolean
read_constructions (LaminaSqlite       *self,
                    LaminaBackendDump  *dump,
                    GError            **error)
{
  g_autoptr(GHashTable) by_id = g_hash_table_new (g_str_hash, g_str_equal);
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "SELECT id, deleted_at, flags, material_changed FROM construction ORDER BY num;", error);
  int rc;

  if (stmt == NULL)
    return FALSE;
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      LaminaBackendRecord *record =
        lamina_backend_record_new ((const char *) sqlite3_column_text (stmt, 0));

      record->deleted_at = lamina_sqlite_column_dup (stmt, 1);
      record->flags = sqlite3_column_int (stmt, 2);
      record->material_changed = sqlite3_column_int (stmt, 3) != 0;
      g_ptr_array_add (dump->constructions, record);
      g_hash_table_insert (by_id, record->id, record);
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    goto fail;

  stmt = lamina_sqlite_prepare (self,
    "SELECT r.construction_id, r.revision, r.status, r.body, r.u, r.u_corrected, r.r_total,"
    "       r.thickness, r.calc_error, r.modified_by, r.modified_at, r.checked_by,"
    "       r.checked_at, r.approved_by, r.approved_at, r.comment, f.body, f.computed_at"
    "  FROM revision r LEFT JOIN field_check f"
    "    ON f.construction_id = r.construction_id AND f.revision = r.revision"
    " ORDER BY r.construction_id, r.revision;", error);
  if (stmt == NULL)
    return FALSE;
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      LaminaBackendRecord *record =
        g_hash_table_lookup (by_id, (const char *) sqlite3_column_text (stmt, 0));
      LaminaBackendRecordRevision *rev;

      if (record == NULL)
        continue;
      rev = lamina_backend_record_revision_new ();
      rev->revision = sqlite3_column_int (stmt, 1);
      lamina_status_from_string ((const char *) sqlite3_column_text (stmt, 2), &rev->status);
      rev->body = lamina_sqlite_column_dup (stmt, 3);
      rev->u = lamina_sqlite_column_double (stmt, 4);
      rev->u_corrected = lamina_sqlite_column_double (stmt, 5);
      rev->r_total = lamina_sqlite_column_double (stmt, 6);
      rev->thickness = lamina_sqlite_column_double (stmt, 7);
      rev->calc_error = lamina_sqlite_column_dup (stmt, 8);
      rev->modified_by = lamina_sqlite_column_dup (stmt, 9);
      rev->modified_at = lamina_sqlite_column_dup (stmt, 10);
      rev->checked_by = lamina_sqlite_column_dup (stmt, 11);
      rev->checked_at = lamina_sqlite_column_dup (stmt, 12);
      rev->approved_by = lamina_sqlite_column_dup (stmt, 13);
      rev->approved_at = lamina_sqlite_column_dup (stmt, 14);
      rev->comment = lamina_sqlite_column_dup (stmt, 15);
      rev->field_check = lamina_sqlite_column_dup (stmt, 16);
      rev->field_check_at = lamina_sqlite_column_dup (stmt, 17);
      g_ptr_array_add (record->revisions, rev);
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    goto fail;

  stmt = lamina_sqlite_prepare (self,
    "SELECT construction_id, revision, act, person, at, date, policy, reason"
    "  FROM review_event ORDER BY num;", error);
  if (stmt == NULL)
    return FALSE;
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      LaminaBackendRecord *record =
        g_hash_table_lookup (by_id, (const char *) sqlite3_column_text (stmt, 0));

      if (record != NULL)
        g_ptr_array_add (record->review_events, lamina_sqlite_read_review_event (stmt, 1));
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    goto fail;
  return TRUE;

fail:
  lamina_sqlite_set_error (self, rc, "cannot read the constructions", error);
  return FALSE;
}

static gboolean
read_all_in_txn (LaminaSqlite       *self,
                 LaminaBackendDump  *dump,
                 GError            **error)
{
  LaminaBackend *backend = &self->parent;
  g_autoptr(GHashTable) material_times = NULL;
  g_autoptr(GHashTable) climate_times = NULL;
  g_autoptr(GHashTable) set_times = NULL;
  GPtrArray *list;

  if (!read_settings (self, dump, error))
    return FALSE;

  material_times = read_times (self, "SELECT id, modified_at FROM material;", error);
  if (material_times == NULL || (list = lamina_sqlite_backend_list_materials (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->materials, list);
  add_times (dump->material_times, material_times, dump->materials, G_STRUCT_OFFSET (LaminaMaterial, id));

  climate_times = read_times (self, "SELECT id, modified_at FROM climate;", error);
  if (climate_times == NULL || (list = lamina_sqlite_backend_list_climates (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->climates, list);
  add_times (dump->climate_times, climate_times, dump->climates, G_STRUCT_OFFSET (LaminaClimate, id));

  set_times = read_times (self, "SELECT id, modified_at FROM target_set;", error);
  if (set_times == NULL || (list = lamina_sqlite_backend_list_target_sets (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->target_sets, list);
  add_times (dump->target_set_times, set_times, dump->target_sets, G_STRUCT_OFFSET (LaminaTargetSet, id));

  if ((list = lamina_sqlite_backend_list_jobs (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->jobs, list);

  return read_constructions (self, dump, error);
}

LaminaBackendDump *
lamina_sqlite_backend_read_all (LaminaBackend  *backend,
                                GError        **error)
{
  LaminaBackendDump *dump = lamina_backend_dump_new ();

  /* A plain BEGIN: one snapshot for every read, and no write lock (the
   * source may be read-only). */
  if (!lamina_sqlite_exec (SELF, "BEGIN;", error))
    {
      lamina_backend_dump_free (dump);
      return NULL;
    }
  if (!read_all_in_txn (SELF, dump, error))
    {
      lamina_sqlite_rollback (SELF);
      lamina_backend_dump_free (dump);
      return NULL;
    }
  lamina_sqlite_rollback (SELF);
  return dump;
}

/* ---- Writing ---------------------------------------------------------- */

static gboolean
check_empty (LaminaSqlite  *self,
             GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "SELECT (SELECT count(*) FROM construction), (SELECT count(*) FROM review_event),"
    "       (SELECT count(*) FROM job), (SELECT count(*) FROM target_set);", error);
  gint64 constructions, events, jobs, sets;
  int rc;

  if (stmt == NULL)
    return FALSE;
  rc = sqlite3_step (stmt);
  if (rc != SQLITE_ROW)
    {
      lamina_sqlite_set_error (self, rc, "cannot read the library", error);
      sqlite3_reset (stmt);
      return FALSE;
    }
  constructions = sqlite3_column_int64 (stmt, 0);
  events = sqlite3_column_int64 (stmt, 1);
  jobs = sqlite3_column_int64 (stmt, 2);
  sets = sqlite3_column_int64 (stmt, 3);
  sqlite3_reset (stmt);
  if (constructions + events + jobs + sets > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS,
                   "the library is not empty (constructions: %" G_GINT64_FORMAT ", jobs: %"
                   G_GINT64_FORMAT ", target sets: %" G_GINT64_FORMAT "); a library is "
                   "copied only into an empty one",
                   constructions, jobs, sets);
      return FALSE;
    }
  return TRUE;
}

static gboolean
write_settings_and_records (LaminaSqlite             *self,
                            const LaminaBackendDump  *dump,
                            GError                  **error)
{
  sqlite3_stmt *stmt;

  stmt = lamina_sqlite_prepare (self, "INSERT OR REPLACE INTO meta (key, value) VALUES (?1, ?2);",
                                error);
  if (stmt == NULL)
    return FALSE;
  for (guint i = 0; i + 1 < dump->settings->len; i += 2)
    {
      sqlite3_reset (stmt);
      lamina_sqlite_bind_text (stmt, 1, dump->settings->pdata[i]);
      lamina_sqlite_bind_text (stmt, 2, dump->settings->pdata[i + 1]);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }

  if (!lamina_sqlite_exec (self, "DELETE FROM material; DELETE FROM climate;", error))
    return FALSE;
  for (guint i = 0; i < dump->materials->len; i++)
    if (!lamina_sqlite_put_material (self, dump->materials->pdata[i],
                                     dump->material_times->pdata[i], error))
      return FALSE;

  stmt = lamina_sqlite_prepare (self,
    "INSERT INTO climate (id, name, source, months, fingerprint, modified_at)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6);", error);
  if (stmt == NULL)
    return FALSE;
  for (guint i = 0; i < dump->climates->len; i++)
    {
      const LaminaClimate *climate = dump->climates->pdata[i];
      g_autofree char *months = lamina_store_climate_months_to_json (climate);
      g_autofree char *fingerprint = lamina_store_climate_fingerprint (climate);

      sqlite3_reset (stmt);
      lamina_sqlite_bind_text (stmt, 1, climate->id);
      lamina_sqlite_bind_text (stmt, 2, climate->name ? climate->name : climate->id);
      lamina_sqlite_bind_text (stmt, 3, climate->source);
      lamina_sqlite_bind_text (stmt, 4, months);
      lamina_sqlite_bind_text (stmt, 5, fingerprint);
      lamina_sqlite_bind_text (stmt, 6, dump->climate_times->pdata[i]);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }

  for (guint i = 0; i < dump->target_sets->len; i++)
    if (!lamina_sqlite_put_target_set (self, dump->target_sets->pdata[i],
                                       dump->target_set_times->pdata[i], error))
      return FALSE;
  for (guint i = 0; i < dump->jobs->len; i++)
    if (!lamina_sqlite_put_job (self, dump->jobs->pdata[i], error))
      return FALSE;
  return TRUE;
}

/* The construction's row, from its latest revision: what the list and
 * the search read. */
static gboolean
write_construction_row (LaminaSqlite               *self,
                        const LaminaBackendRecord  *record,
                        gint64                     *num,
                        GError                    **error)
{
  const LaminaBackendRecordRevision *head = record->revisions->pdata[record->revisions->len - 1];
  const LaminaConstruction *c = head->construction;
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO construction (id, head, code, name, element, status, u, u_corrected,"
    "   target_u, thickness, flags, modified_at, deleted_at, material_changed)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14)"
    " RETURNING num;", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, record->id);
  sqlite3_bind_int (stmt, 2, head->revision);
  lamina_sqlite_bind_text (stmt, 3, c->code);
  lamina_sqlite_bind_text (stmt, 4, c->name ? c->name : "");
  lamina_sqlite_bind_text (stmt, 5, lamina_element_to_string (c->element));
  lamina_sqlite_bind_text (stmt, 6, lamina_status_to_string (head->status));
  lamina_sqlite_bind_double (stmt, 7, head->u);
  lamina_sqlite_bind_double (stmt, 8, head->u_corrected);
  lamina_sqlite_bind_double (stmt, 9, c->target_u);
  lamina_sqlite_bind_double (stmt, 10, head->thickness);
  sqlite3_bind_int (stmt, 11, record->flags);
  lamina_sqlite_bind_text (stmt, 12, head->modified_at);
  lamina_sqlite_bind_text (stmt, 13, record->deleted_at);
  sqlite3_bind_int (stmt, 14, record->material_changed ? 1 : 0);
  if (sqlite3_step (stmt) != SQLITE_ROW)
    {
      lamina_sqlite_set_error (self, sqlite3_reset (stmt), "cannot store a construction", error);
      return FALSE;
    }
  *num = sqlite3_column_int64 (stmt, 0);
  sqlite3_reset (stmt);
  return TRUE;
}

static gboolean
write_revision (LaminaSqlite                       *self,
                const LaminaBackendRecord          *record,
                const LaminaBackendRecordRevision  *rev,
                gint64                              num,
                GError                            **error)
{
  sqlite3_stmt *stmt;

  if (!lamina_sqlite_insert_revision (self, record->id, rev, error)
      || !lamina_sqlite_index_revision (self, rev->construction, num, error))
    return FALSE;
  if (rev->field_check == NULL)
    return TRUE;
  stmt = lamina_sqlite_prepare (self,
    "INSERT INTO field_check (construction_id, revision, body, computed_at)"
    " VALUES (?1, ?2, ?3, ?4);", error);
  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, record->id);
  sqlite3_bind_int (stmt, 2, rev->revision);
  lamina_sqlite_bind_text (stmt, 3, rev->field_check);
  lamina_sqlite_bind_text (stmt, 4, rev->field_check_at ? rev->field_check_at : rev->modified_at);
  return lamina_sqlite_step_done (self, stmt, error);
}

static gboolean
write_review_events (LaminaSqlite               *self,
                     const LaminaBackendRecord  *record,
                     GError                    **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO review_event (construction_id, revision, act, person, at, date, policy, reason)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8);", error);

  if (stmt == NULL)
    return FALSE;
  for (guint i = 0; i < record->review_events->len; i++)
    {
      const LaminaReviewEvent *e = record->review_events->pdata[i];

      sqlite3_reset (stmt);
      lamina_sqlite_bind_text (stmt, 1, record->id);
      sqlite3_bind_int (stmt, 2, e->revision);
      lamina_sqlite_bind_text (stmt, 3, e->act);
      lamina_sqlite_bind_text (stmt, 4, e->by);
      lamina_sqlite_bind_text (stmt, 5, e->at);
      lamina_sqlite_bind_text (stmt, 6, e->date);
      lamina_sqlite_bind_text (stmt, 7, e->policy);
      lamina_sqlite_bind_text (stmt, 8, e->reason);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
write_all_in_txn (LaminaSqlite             *self,
                  const LaminaBackendDump  *dump,
                  GError                  **error)
{
  if (!check_empty (self, error) || !write_settings_and_records (self, dump, error))
    return FALSE;
  for (guint i = 0; i < dump->constructions->len; i++)
    {
      const LaminaBackendRecord *record = dump->constructions->pdata[i];
      gint64 num;

      if (record->revisions->len == 0)
        continue;
      if (!write_construction_row (self, record, &num, error))
        return FALSE;
      for (guint k = 0; k < record->revisions->len; k++)
        if (!write_revision (self, record, record->revisions->pdata[k], num, error))
          return FALSE;
      if (!write_review_events (self, record, error))
        return FALSE;
    }
  return lamina_sqlite_flush_search_index (self, error);
}

gboolean
lamina_sqlite_backend_write_all (LaminaBackend            *backend,
                                 const LaminaBackendDump  *dump,
                                 GError                  **error)
{
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!write_all_in_txn (SELF, dump, error) || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}
