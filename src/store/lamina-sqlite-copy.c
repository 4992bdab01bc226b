/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-copy.c: a file's side of moving an office's library
 * between files and servers (LaminaBackendVTable read_snapshot, read_rows
 * and write_all; lamina-library-copy.c reads the whole library). */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#include "lamina-store-json.h"

#include <string.h>

#define SELF ((LaminaSqlite *) backend)

/* LaminaBackendVTable read_rows: @sql's rows as typed values. */
gboolean
lamina_sqlite_backend_read_rows (LaminaBackend         *backend,
                                 const char            *sql,
                                 const char            *types,
                                 LaminaBackendRowFunc   row,
                                 gpointer               data,
                                 const char            *what,
                                 GError               **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF, sql, error);
  gsize n = strlen (types);
  g_autofree LaminaBackendValue *values = g_new0 (LaminaBackendValue, MAX (n, 1));
  int rc;

  if (stmt == NULL)
    return FALSE;
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      for (gsize i = 0; i < n; i++)
        switch (types[i])
          {
          case 'i':
            values[i].integer = sqlite3_column_int64 (stmt, (int) i);
            break;
          case 'r':
            values[i].real = lamina_sqlite_column_double (stmt, (int) i);
            break;
          case 'b':
            values[i].boolean = sqlite3_column_int (stmt, (int) i) != 0;
            break;
          default:
            values[i].text = (const char *) sqlite3_column_text (stmt, (int) i);
            break;
          }
      row (values, data);
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (SELF, rc, what, error);
      return FALSE;
    }
  return TRUE;
}

/* LaminaBackendVTable read_snapshot. */
gboolean
lamina_sqlite_backend_read_snapshot (LaminaBackend          *backend,
                                     LaminaBackendReadFunc   func,
                                     gpointer                data,
                                     GError                **error)
{
  gboolean ok;

  /* A plain BEGIN: one snapshot for every read, and no write lock (the
   * source may be read-only). */
  if (!lamina_sqlite_exec (SELF, "BEGIN;", error))
    return FALSE;
  ok = func (backend, data, error);
  lamina_sqlite_rollback (SELF);
  return ok;
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

  for (guint i = 0; i + 1 < dump->settings->len; i += 2)
    if (!lamina_sqlite_put_setting_in_txn (self, dump->settings->pdata[i],
                                           dump->settings->pdata[i + 1], error))
      return FALSE;

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

static gboolean
write_record (LaminaSqlite               *self,
              const LaminaBackendRecord  *record,
              GError                    **error)
{
  LaminaStoreConstructionRow row;
  gint64 num;

  lamina_store_construction_row_for_record (&row, record);
  if (!lamina_sqlite_put_construction_row (self, &row, &num, error))
    return FALSE;
  for (guint k = 0; k < record->revisions->len; k++)
    {
      const LaminaBackendRecordRevision *rev = record->revisions->pdata[k];

      if (!lamina_sqlite_insert_revision (self, record->id, rev, error)
          || !lamina_sqlite_index_revision (self, rev->construction, num, error)
          || (rev->field_check != NULL
              && !lamina_sqlite_put_field_check_in_txn (self, record->id, rev->revision,
                                                        rev->field_check,
                                                        rev->field_check_at ? rev->field_check_at
                                                                            : rev->modified_at,
                                                        error)))
        return FALSE;
    }
  for (guint i = 0; i < record->review_events->len; i++)
    if (!lamina_sqlite_insert_review_event (self, record->id, record->review_events->pdata[i],
                                            error))
      return FALSE;
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

      if (record->revisions->len > 0 && !write_record (self, record, error))
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
