/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-copy.c: a PostgreSQL server's side of moving an office's
 * library (LaminaBackendVTable read_snapshot, read_rows and write_all), as
 * lamina-sqlite-copy.c is a file's: from a file to its server and back. */
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

/* LaminaBackendVTable read_rows: @sql's rows as typed values. */
gboolean
lamina_pg_read_rows (LaminaBackend         *backend,
                     const char            *sql,
                     const char            *types,
                     LaminaBackendRowFunc   row,
                     gpointer               data,
                     const char            *what,
                     GError               **error)
{
  PGresult *res = lamina_pg_query (SELF, sql, NULL, what, error);
  gsize n = strlen (types);
  g_autofree LaminaBackendValue *values = g_new0 (LaminaBackendValue, MAX (n, 1));

  if (res == NULL)
    return FALSE;
  for (int r = 0; r < PQntuples (res); r++)
    {
      for (gsize i = 0; i < n; i++)
        switch (types[i])
          {
          case 'i':
            values[i].integer = PQgetisnull (res, r, (int) i)
                                ? 0 : g_ascii_strtoll (PQgetvalue (res, r, (int) i), NULL, 10);
            break;
          case 'r':
            values[i].real = lamina_pg_double (res, r, (int) i);
            break;
          case 'b':
            values[i].boolean = lamina_pg_bool (res, r, (int) i);
            break;
          default:
            values[i].text = lamina_pg_get (res, r, (int) i);
            break;
          }
      row (values, data);
    }
  PQclear (res);
  return TRUE;
}

/* LaminaBackendVTable read_snapshot. */
gboolean
lamina_pg_read_snapshot (LaminaBackend          *backend,
                         LaminaBackendReadFunc   func,
                         gpointer                data,
                         GError                **error)
{
  gboolean ok;

  /* One snapshot for every read, writing nothing. */
  if (!lamina_pg_exec (SELF, "BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY;", error))
    return FALSE;
  ok = func (backend, data, error);
  PQclear (PQexec (SELF->conn, "ROLLBACK;"));
  return ok;
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
  g_autofree char *words = lamina_pg_search_words (head->construction);
  g_autoptr(GPtrArray) params = NULL;
  LaminaStoreConstructionRow row;

  lamina_store_construction_row_for_record (&row, record);
  params = lamina_pg_construction_row_params (&row, words, TRUE);
  return lamina_pg_run (self,
    "INSERT INTO construction (id, head, code, name, element, status, u, u_corrected,"
    "   target_u, thickness, flags, modified_at, search, deleted_at, material_changed)"
    " VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12,"
    "   array_to_tsvector (string_to_array ($13, ' ')), $14, $15)",
    params, "cannot copy a construction", error);
}

static gboolean
write_revision (LaminaPg                           *self,
                const LaminaBackendRecord          *record,
                const LaminaBackendRecordRevision  *rev,
                GError                            **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  if (!lamina_pg_insert_revision (self, record->id, rev, "cannot copy a revision", error)
      || !lamina_pg_index_revision (self, rev->construction, TRUE, error))
    return FALSE;
  if (rev->field_check == NULL)
    return TRUE;
  lamina_pg_add_text (params, record->id);
  lamina_pg_add_int (params, rev->revision);
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
 * stood at one moment.  lamina_backend_read_all reads in one REPEATABLE
 * READ READ ONLY transaction (colleagues go on working; nothing they
 * commit meanwhile is half in the copy), and the new SQLite library @dest is written in one
 * transaction by the copy machinery, so the backup is an ordinary
 * library file with every revision, review record and 2-D check.  No
 * program is started (no pg_dump): the server's own backups of the whole
 * database remain the administrator's business. */
gboolean
lamina_pg_backup_to (LaminaBackend  *backend,
                     const char     *dest,
                     GError        **error)
{
  LaminaBackendDump *dump = lamina_backend_read_all (backend, error);
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
