/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-copy.c: the whole library read as stored and written into an
 * empty one (LaminaBackendVTable read_all / write_all) on a PostgreSQL
 * server, as lamina-sqlite-copy.c does for a file: an office moving its
 * library from a file to its server and back. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include "lamina-store-json.h"

#include <string.h>

#define SELF ((LaminaPg *) backend)

/* Settings that describe this database, not the library: never copied. */
static gboolean
own_setting (const char *key)
{
  return strcmp (key, "schema_version") == 0 || strcmp (key, "application") == 0
         || strcmp (key, "server_roles") == 0;
}

static GHashTable *
read_times (LaminaPg    *self,
            const char  *sql,
            GError     **error)
{
  PGresult *res = lamina_pg_query (self, sql, NULL, "cannot read the library", error);
  GHashTable *times;

  if (res == NULL)
    return NULL;
  times = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
  for (int i = 0; i < PQntuples (res); i++)
    g_hash_table_insert (times, lamina_pg_dup (res, i, 0), lamina_pg_dup (res, i, 1));
  PQclear (res);
  return times;
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
read_constructions (LaminaPg           *self,
                    LaminaBackendDump  *dump,
                    GError            **error)
{
  g_autoptr(GHashTable) by_id = g_hash_table_new (g_str_hash, g_str_equal);
  PGresult *res = lamina_pg_query (self,
    "SELECT id, deleted_at, flags, material_changed FROM construction ORDER BY num", NULL,
    "cannot read the constructions", error);

  if (res == NULL)
    return FALSE;
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaBackendRecord *record = lamina_backend_record_new (lamina_pg_get (res, i, 0));

      record->deleted_at = lamina_pg_dup (res, i, 1);
      record->flags = lamina_pg_int (res, i, 2);
      record->material_changed = lamina_pg_bool (res, i, 3);
      g_ptr_array_add (dump->constructions, record);
      g_hash_table_insert (by_id, record->id, record);
    }
  PQclear (res);

  res = lamina_pg_query (self,
    "SELECT r.construction_id, r.revision, r.status, r.body, r.u, r.u_corrected, r.r_total,"
    "       r.thickness, r.calc_error, r.modified_by, r.modified_at, r.checked_by,"
    "       r.checked_at, r.approved_by, r.approved_at, r.comment, f.body, f.computed_at"
    "  FROM revision r LEFT JOIN field_check f"
    "    ON f.construction_id = r.construction_id AND f.revision = r.revision"
    " ORDER BY r.construction_id, r.revision", NULL, "cannot read the revisions", error);
  if (res == NULL)
    return FALSE;
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaBackendRecord *record = g_hash_table_lookup (by_id, lamina_pg_get (res, i, 0));
      LaminaBackendRecordRevision *rev;

      if (record == NULL)
        continue;
      rev = lamina_backend_record_revision_new ();
      rev->revision = lamina_pg_int (res, i, 1);
      lamina_status_from_string (lamina_pg_get (res, i, 2), &rev->status);
      rev->body = lamina_pg_dup (res, i, 3);
      rev->u = lamina_pg_double (res, i, 4);
      rev->u_corrected = lamina_pg_double (res, i, 5);
      rev->r_total = lamina_pg_double (res, i, 6);
      rev->thickness = lamina_pg_double (res, i, 7);
      rev->calc_error = lamina_pg_dup (res, i, 8);
      rev->modified_by = lamina_pg_dup (res, i, 9);
      rev->modified_at = lamina_pg_dup (res, i, 10);
      rev->checked_by = lamina_pg_dup (res, i, 11);
      rev->checked_at = lamina_pg_dup (res, i, 12);
      rev->approved_by = lamina_pg_dup (res, i, 13);
      rev->approved_at = lamina_pg_dup (res, i, 14);
      rev->comment = lamina_pg_dup (res, i, 15);
      rev->field_check = lamina_pg_dup (res, i, 16);
      rev->field_check_at = lamina_pg_dup (res, i, 17);
      g_ptr_array_add (record->revisions, rev);
    }
  PQclear (res);

  res = lamina_pg_query (self,
    "SELECT construction_id, revision, act, person, at, date, policy, reason"
    "  FROM review_event ORDER BY num", NULL, "cannot read the review records", error);
  if (res == NULL)
    return FALSE;
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaBackendRecord *record = g_hash_table_lookup (by_id, lamina_pg_get (res, i, 0));
      LaminaReviewEvent *e;

      if (record == NULL)
        continue;
      e = g_new0 (LaminaReviewEvent, 1);
      e->revision = lamina_pg_int (res, i, 1);
      e->act = lamina_pg_dup (res, i, 2);
      e->by = lamina_pg_dup (res, i, 3);
      e->at = lamina_pg_dup (res, i, 4);
      e->date = lamina_pg_dup (res, i, 5);
      e->policy = lamina_pg_dup (res, i, 6);
      e->reason = lamina_pg_dup (res, i, 7);
      g_ptr_array_add (record->review_events, e);
    }
  PQclear (res);
  return TRUE;
}

static gboolean
read_all_in_txn (LaminaPg           *self,
                 LaminaBackendDump  *dump,
                 GError            **error)
{
  LaminaBackend *backend = &self->parent;
  g_autoptr(GHashTable) material_times = NULL;
  g_autoptr(GHashTable) climate_times = NULL;
  g_autoptr(GHashTable) set_times = NULL;
  PGresult *res;
  GPtrArray *list;

  res = lamina_pg_query (self, "SELECT key, value FROM meta ORDER BY key COLLATE \"C\"", NULL,
                         "cannot read the library settings", error);
  if (res == NULL)
    return FALSE;
  for (int i = 0; i < PQntuples (res); i++)
    if (!own_setting (lamina_pg_get (res, i, 0)))
      {
        g_ptr_array_add (dump->settings, lamina_pg_dup (res, i, 0));
        g_ptr_array_add (dump->settings, lamina_pg_dup (res, i, 1));
      }
  PQclear (res);

  material_times = read_times (self, "SELECT id, modified_at FROM material", error);
  if (material_times == NULL || (list = lamina_pg_list_materials (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->materials, list);
  add_times (dump->material_times, material_times, dump->materials, G_STRUCT_OFFSET (LaminaMaterial, id));

  climate_times = read_times (self, "SELECT id, modified_at FROM climate", error);
  if (climate_times == NULL || (list = lamina_pg_list_climates (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->climates, list);
  add_times (dump->climate_times, climate_times, dump->climates, G_STRUCT_OFFSET (LaminaClimate, id));

  set_times = read_times (self, "SELECT id, modified_at FROM target_set", error);
  if (set_times == NULL || (list = lamina_pg_list_target_sets (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->target_sets, list);
  add_times (dump->target_set_times, set_times, dump->target_sets, G_STRUCT_OFFSET (LaminaTargetSet, id));

  if ((list = lamina_pg_list_jobs (backend, error)) == NULL)
    return FALSE;
  g_ptr_array_extend_and_steal (dump->jobs, list);
  return read_constructions (self, dump, error);
}

LaminaBackendDump *
lamina_pg_read_all (LaminaBackend  *backend,
                    GError        **error)
{
  LaminaBackendDump *dump = lamina_backend_dump_new ();
  gboolean ok;

  /* One snapshot for every read, writing nothing. */
  if (!lamina_pg_exec (SELF, "BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY;", error))
    {
      lamina_backend_dump_free (dump);
      return NULL;
    }
  ok = read_all_in_txn (SELF, dump, error);
  PQclear (PQexec (SELF->conn, "ROLLBACK;"));
  if (!ok)
    {
      lamina_backend_dump_free (dump);
      return NULL;
    }
  return dump;
}

/* ---- Writing ---------------------------------------------------------- */

static gboolean
check_empty (LaminaPg  *self,
             GError   **error)
{
  PGresult *res = lamina_pg_query (self,
    "SELECT (SELECT count(*) FROM construction), (SELECT count(*) FROM review_event),"
    "       (SELECT count(*) FROM job), (SELECT count(*) FROM target_set)", NULL,
    "cannot read the library", error);
  gint64 constructions, events, jobs, sets;

  if (res == NULL)
    return FALSE;
  constructions = g_ascii_strtoll (PQgetvalue (res, 0, 0), NULL, 10);
  events = g_ascii_strtoll (PQgetvalue (res, 0, 1), NULL, 10);
  jobs = g_ascii_strtoll (PQgetvalue (res, 0, 2), NULL, 10);
  sets = g_ascii_strtoll (PQgetvalue (res, 0, 3), NULL, 10);
  PQclear (res);
  if (constructions + events + jobs + sets > 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS,
                   "%s: the library is not empty (constructions: %" G_GINT64_FORMAT ", jobs: %"
                   G_GINT64_FORMAT ", target sets: %" G_GINT64_FORMAT "); a library is "
                   "copied only into an empty one",
                   self->label, constructions, jobs, sets);
      return FALSE;
    }
  return TRUE;
}

static gboolean
write_settings_and_records (LaminaPg                 *self,
                            const LaminaBackendDump  *dump,
                            GError                  **error)
{
  for (guint i = 0; i + 1 < dump->settings->len; i += 2)
    {
      g_autoptr(GPtrArray) params = lamina_pg_params_new ();

      if (own_setting (dump->settings->pdata[i]))
        continue;
      lamina_pg_add_text (params, dump->settings->pdata[i]);
      lamina_pg_add_text (params, dump->settings->pdata[i + 1]);
      if (!lamina_pg_run (self, "INSERT INTO meta (key, value) VALUES ($1, $2)"
                                " ON CONFLICT (key) DO UPDATE SET value = $2",
                          params, "cannot copy the settings", error))
        return FALSE;
    }
  if (!lamina_pg_exec (self, "DELETE FROM material; DELETE FROM climate;", error))
    return FALSE;
  for (guint i = 0; i < dump->materials->len; i++)
    if (!lamina_pg_put_material_in_txn (self, dump->materials->pdata[i],
                                        dump->material_times->pdata[i], error))
      return FALSE;
  for (guint i = 0; i < dump->climates->len; i++)
    {
      const LaminaClimate *climate = dump->climates->pdata[i];
      g_autofree char *months = lamina_store_climate_months_to_json (climate);
      g_autofree char *fingerprint = lamina_store_climate_fingerprint (climate);
      g_autoptr(GPtrArray) params = lamina_pg_params_new ();

      lamina_pg_add_text (params, climate->id);
      lamina_pg_add_text (params, climate->name ? climate->name : climate->id);
      lamina_pg_add_text (params, climate->source);
      lamina_pg_add_text (params, months);
      lamina_pg_add_text (params, fingerprint);
      lamina_pg_add_text (params, dump->climate_times->pdata[i]);
      if (!lamina_pg_run (self,
            "INSERT INTO climate (id, name, source, months, fingerprint, modified_at)"
            " VALUES ($1, $2, $3, $4, $5, $6)", params, "cannot copy a climate", error))
        return FALSE;
    }
  for (guint i = 0; i < dump->target_sets->len; i++)
    if (!lamina_pg_put_target_set_in_txn (self, dump->target_sets->pdata[i],
                                          dump->target_set_times->pdata[i], error))
      return FALSE;
  return lamina_pg_put_records (self, NULL, dump->jobs, NULL, error);
}

static gboolean
write_construction_row (LaminaPg                   *self,
                        const LaminaBackendRecord  *record,
                        GError                    **error)
{
  const LaminaBackendRecordRevision *head = record->revisions->pdata[record->revisions->len - 1];
  const LaminaConstruction *c = head->construction;
  g_autofree char *words = lamina_pg_search_words (c);
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, record->id);
  lamina_pg_add_int (params, head->revision);
  lamina_pg_add_text (params, c->code);
  lamina_pg_add_text (params, c->name ? c->name : "");
  lamina_pg_add_text (params, lamina_element_to_string (c->element));
  lamina_pg_add_text (params, lamina_status_to_string (head->status));
  lamina_pg_add_double (params, head->u);
  lamina_pg_add_double (params, head->u_corrected);
  lamina_pg_add_double (params, c->target_u);
  lamina_pg_add_double (params, head->thickness);
  lamina_pg_add_int (params, record->flags);
  lamina_pg_add_text (params, head->modified_at);
  lamina_pg_add_text (params, record->deleted_at);
  lamina_pg_add_text (params, record->material_changed ? "true" : "false");
  lamina_pg_add_text (params, words);
  return lamina_pg_run (self,
    "INSERT INTO construction (id, head, code, name, element, status, u, u_corrected,"
    "   target_u, thickness, flags, modified_at, deleted_at, material_changed, search)"
    " VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14,"
    "   array_to_tsvector (string_to_array ($15, ' ')))",
    params, "cannot copy a construction", error);
}

static gboolean
write_revision (LaminaPg                           *self,
                const LaminaBackendRecord          *record,
                const LaminaBackendRecordRevision  *rev,
                GError                            **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, record->id);
  lamina_pg_add_int (params, rev->revision);
  lamina_pg_add_text (params, lamina_status_to_string (rev->status));
  lamina_pg_add_text (params, rev->body);
  lamina_pg_add_double (params, rev->u);
  lamina_pg_add_double (params, rev->u_corrected);
  lamina_pg_add_double (params, rev->r_total);
  lamina_pg_add_double (params, rev->thickness);
  lamina_pg_add_text (params, rev->calc_error);
  lamina_pg_add_text (params, rev->modified_by);
  lamina_pg_add_text (params, rev->modified_at);
  lamina_pg_add_text (params, rev->checked_by);
  lamina_pg_add_text (params, rev->checked_at);
  lamina_pg_add_text (params, rev->approved_by);
  lamina_pg_add_text (params, rev->approved_at);
  lamina_pg_add_text (params, rev->comment);
  if (!lamina_pg_run (self,
        "INSERT INTO revision (construction_id, revision, status, body, u, u_corrected,"
        "   r_total, thickness, calc_error, modified_by, modified_at, checked_by,"
        "   checked_at, approved_by, approved_at, comment)"
        " VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14, $15, $16)",
        params, "cannot copy a revision", error)
      || !lamina_pg_index_revision (self, rev->construction, TRUE, error))
    return FALSE;
  if (rev->field_check == NULL)
    return TRUE;
  g_ptr_array_set_size (params, 2);
  lamina_pg_add_text (params, rev->field_check);
  lamina_pg_add_text (params, rev->field_check_at ? rev->field_check_at : rev->modified_at);
  return lamina_pg_run (self,
    "INSERT INTO field_check (construction_id, revision, body, computed_at)"
    " VALUES ($1, $2, $3, $4)", params, "cannot copy a 2-D check", error);
}

static gboolean
write_review_events (LaminaPg                   *self,
                     const LaminaBackendRecord  *record,
                     GError                    **error)
{
  for (guint i = 0; i < record->review_events->len; i++)
    {
      const LaminaReviewEvent *e = record->review_events->pdata[i];
      g_autoptr(GPtrArray) params = lamina_pg_params_new ();

      lamina_pg_add_text (params, record->id);
      lamina_pg_add_int (params, e->revision);
      lamina_pg_add_text (params, e->act);
      lamina_pg_add_text (params, e->by);
      lamina_pg_add_text (params, e->at);
      lamina_pg_add_text (params, e->date);
      lamina_pg_add_text (params, e->policy);
      lamina_pg_add_text (params, e->reason);
      if (!lamina_pg_run (self,
            "INSERT INTO review_event (construction_id, revision, act, person, at, date,"
            "   policy, reason) VALUES ($1, $2, $3, $4, $5, $6, $7, $8)",
            params, "cannot copy a review record", error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
write_all_txn (LaminaPg  *self,
               gpointer   data,
               GError   **error)
{
  const LaminaBackendDump *dump = data;

  /* One copy at a time into one library: the second finds it full. */
  if (!lamina_pg_exec (self, "LOCK TABLE construction IN EXCLUSIVE MODE;", error)
      || !check_empty (self, error) || !write_settings_and_records (self, dump, error))
    return FALSE;
  for (guint i = 0; i < dump->constructions->len; i++)
    {
      const LaminaBackendRecord *record = dump->constructions->pdata[i];

      if (record->revisions->len == 0)
        continue;
      if (!write_construction_row (self, record, error))
        return FALSE;
      for (guint k = 0; k < record->revisions->len; k++)
        if (!write_revision (self, record, record->revisions->pdata[k], error))
          return FALSE;
      if (!write_review_events (self, record, error))
        return FALSE;
    }
  return TRUE;
}

gboolean
lamina_pg_write_all (LaminaBackend            *backend,
                     const LaminaBackendDump  *dump,
                     GError                  **error)
{
  return lamina_pg_transaction (SELF, write_all_txn, (gpointer) dump, error);
}

/* ---- Backups ---------------------------------------------------------- */

/* What an office's administrator expects of "lamina-cli backup" on the
 * server: a file they can keep, open and copy back, of the library as it
 * stood at one moment.  read_all reads in one REPEATABLE READ READ ONLY
 * transaction (colleagues go on working; nothing they commit meanwhile is
 * half in the copy), and the new SQLite library @dest is written in one
 * transaction by the copy machinery, so the backup is an ordinary
 * library file with every revision, review record and 2-D check.  No
 * program is started (no pg_dump): the server's own backups of the whole
 * database remain the administrator's business. */
gboolean
lamina_pg_backup_to (LaminaBackend  *backend,
                     const char     *dest,
                     GError        **error)
{
  LaminaBackendDump *dump = lamina_pg_read_all (backend, error);
  LaminaBackend *file = NULL;
  LaminaCopyReport counts = { 0 };
  gboolean ok;

  ok = dump != NULL && lamina_backend_dump_prepare (dump, &counts, error)
       && (file = lamina_sqlite_backend_open (dest, LAMINA_LIBRARY_OPEN_NO_SEED, error)) != NULL
       && file->vtable->write_all (file, dump, error);
  if (file != NULL)
    file->vtable->close (file);
  lamina_backend_dump_free (dump);
  return ok;
}
