/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-jobs.c: target sets and jobs in the SQLite backend.
 *
 * Each record's body is a catalogue document holding that one record, so
 * the store keeps exactly what the exchange reads and writes, and every
 * body read back is checked by the same schema and rules.  job_entry
 * mirrors the schedule (construction, revision) so that "which jobs use
 * this construction" is one indexed query. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"
#include "lamina-store-common.h"

#define SELF ((LaminaSqlite *) backend)

static LaminaCatalogue *
read_body (sqlite3_stmt *stmt,
           int           column,
           const char   *id,
           GError      **error)
{
  return lamina_store_record_body_read ((const char *) sqlite3_column_text (stmt, column),
                                        sqlite3_column_bytes (stmt, column), id, error);
}

/* Target sets */

GPtrArray *
lamina_sqlite_backend_list_target_sets (LaminaBackend  *backend,
                                        GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id, body FROM target_set ORDER BY name COLLATE NOCASE, id;", error);
  g_autoptr(GPtrArray) list = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_target_set_free);
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      g_autoptr(LaminaCatalogue) c = read_body (stmt, 1, (const char *) sqlite3_column_text (stmt, 0),
                                                error);

      if (c == NULL || c->target_sets->len != 1)
        {
          sqlite3_reset (stmt);
          return NULL;
        }
      g_ptr_array_add (list, g_ptr_array_steal_index (c->target_sets, 0));
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (SELF, rc, "cannot read the target sets", error);
      return NULL;
    }
  return g_steal_pointer (&list);
}

gboolean
lamina_sqlite_put_target_set (LaminaSqlite          *self,
                              const LaminaTargetSet *set,
                              const char            *now,
                              GError               **error)
{
  g_autofree char *body = lamina_store_record_body_dup (set, NULL, error);
  sqlite3_stmt *stmt;

  if (body == NULL)
    return FALSE;
  stmt = lamina_sqlite_prepare (self,
    "INSERT INTO target_set (id, name, body, modified_at) VALUES (?1, ?2, ?3, ?4)"
    " ON CONFLICT (id) DO UPDATE SET name = ?2, body = ?3, modified_at = ?4;", error);
  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, set->id);
  lamina_sqlite_bind_text (stmt, 2, set->name);
  lamina_sqlite_bind_text (stmt, 3, body);
  lamina_sqlite_bind_text (stmt, 4, now);
  return lamina_sqlite_step_done (self, stmt, error);
}

static gboolean
in_transaction (LaminaSqlite *self,
                gboolean      ok,
                GError       *local,
                GError      **error)
{
  if (ok && lamina_sqlite_commit (self, &local))
    return TRUE;
  lamina_sqlite_rollback (self);
  g_propagate_error (error, local);
  return FALSE;
}

gboolean
lamina_sqlite_backend_put_target_set (LaminaBackend          *backend,
                                      const LaminaTargetSet  *set,
                                      const char             *now,
                                      GError                **error)
{
  GError *local = NULL;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  return in_transaction (SELF, lamina_sqlite_put_target_set (SELF, set, now, &local), local, error);
}

static gboolean
delete_row (LaminaSqlite *self,
            const char   *sql,
            const char   *id,
            const char   *what,
            GError      **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self, sql, error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, id);
  if (!lamina_sqlite_step_done (self, stmt, error))
    return FALSE;
  if (what != NULL && sqlite3_changes (self->db) == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no %s “%s”", what, id);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_backend_delete_target_set (LaminaBackend  *backend,
                                         const char     *id,
                                         GError        **error)
{
  return delete_row (SELF, "DELETE FROM target_set WHERE id = ?1;", id, "target set", error);
}

/* Jobs */

static LaminaJob *
read_job_row (LaminaSqlite *self,
              sqlite3_stmt *stmt,
              GError      **error)
{
  g_autoptr(LaminaCatalogue) c = read_body (stmt, 1, (const char *) sqlite3_column_text (stmt, 0),
                                            error);

  if (c == NULL)
    return NULL;
  if (c->jobs->len != 1)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                   "the stored job “%s” is damaged", (const char *) sqlite3_column_text (stmt, 0));
      return NULL;
    }
  return g_ptr_array_steal_index (c->jobs, 0);
}

GPtrArray *
lamina_sqlite_backend_list_jobs (LaminaBackend  *backend,
                                 GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id, body FROM job ORDER BY number COLLATE NOCASE, name COLLATE NOCASE, id;", error);
  g_autoptr(GPtrArray) list = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_free);
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      LaminaJob *job = read_job_row (SELF, stmt, error);

      if (job == NULL)
        {
          sqlite3_reset (stmt);
          return NULL;
        }
      g_ptr_array_add (list, job);
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (SELF, rc, "cannot read the jobs", error);
      return NULL;
    }
  return g_steal_pointer (&list);
}

LaminaJob *
lamina_sqlite_backend_get_job (LaminaBackend  *backend,
                               const char     *id,
                               GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF, "SELECT id, body FROM job WHERE id = ?1;", error);
  LaminaJob *job = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    job = read_job_row (SELF, stmt, error);
  else if (rc == SQLITE_DONE)
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND, "no job “%s”", id);
  else
    lamina_sqlite_set_error (SELF, rc, "cannot read the job", error);
  sqlite3_reset (stmt);
  return job;
}

static gboolean
put_entries (LaminaSqlite    *self,
             const LaminaJob *job,
             GError         **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self, "DELETE FROM job_entry WHERE job_id = ?1;", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, job->id);
  if (!lamina_sqlite_step_done (self, stmt, error))
    return FALSE;
  for (guint i = 0; i < job->entries->len; i++)
    {
      const LaminaJobEntry *e = g_ptr_array_index (job->entries, i);

      stmt = lamina_sqlite_prepare (self,
        "INSERT INTO job_entry (job_id, n, construction_id, revision, use)"
        " VALUES (?1, ?2, ?3, ?4, ?5);", error);
      if (stmt == NULL)
        return FALSE;
      lamina_sqlite_bind_text (stmt, 1, job->id);
      sqlite3_bind_int (stmt, 2, e->n);
      lamina_sqlite_bind_text (stmt, 3, e->construction);
      sqlite3_bind_int (stmt, 4, e->revision);
      lamina_sqlite_bind_text (stmt, 5, e->use);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_put_job (LaminaSqlite    *self,
                       const LaminaJob *job,
                       GError         **error)
{
  g_autofree char *body = lamina_store_record_body_dup (NULL, job, error);
  sqlite3_stmt *stmt;

  if (body == NULL)
    return FALSE;
  stmt = lamina_sqlite_prepare (self,
    "INSERT INTO job (id, name, number, status, body, modified_at) VALUES (?1, ?2, ?3, ?4, ?5, ?6)"
    " ON CONFLICT (id) DO UPDATE SET name = ?2, number = ?3, status = ?4, body = ?5,"
    " modified_at = ?6;", error);
  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, job->id);
  lamina_sqlite_bind_text (stmt, 2, job->name);
  lamina_sqlite_bind_text (stmt, 3, job->number);
  lamina_sqlite_bind_text (stmt, 4, lamina_job_status_to_string (job->status));
  lamina_sqlite_bind_text (stmt, 5, body);
  lamina_sqlite_bind_text (stmt, 6, job->modified_at);
  return lamina_sqlite_step_done (self, stmt, error) && put_entries (self, job, error);
}

static int
count_jobs (LaminaSqlite *self,
            const char   *id,
            GError      **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self, "SELECT count(*) FROM job WHERE id = ?1;", error);
  int n = -1;

  if (stmt == NULL)
    return -1;
  lamina_sqlite_bind_text (stmt, 1, id);
  if (sqlite3_step (stmt) == SQLITE_ROW)
    n = sqlite3_column_int (stmt, 0);
  else
    lamina_sqlite_set_error (self, sqlite3_errcode (self->db), "cannot read the jobs", error);
  sqlite3_reset (stmt);
  return n;
}

gboolean
lamina_sqlite_backend_put_job (LaminaBackend    *backend,
                               const LaminaJob  *job,
                               gboolean          create,
                               GError          **error)
{
  GError *local = NULL;
  int n;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  n = count_jobs (SELF, job->id, &local);
  if (n >= 0 && create && n > 0)
    g_set_error (&local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS,
                 "a job “%s” exists already", job->id);
  else if (n == 0 && !create)
    g_set_error (&local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                 "no job “%s”", job->id);
  return in_transaction (SELF, local == NULL && lamina_sqlite_put_job (SELF, job, &local),
                         local, error);
}

gboolean
lamina_sqlite_backend_delete_job (LaminaBackend  *backend,
                                  const char     *id,
                                  GError        **error)
{
  GError *local = NULL;
  gboolean ok;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  ok = delete_row (SELF, "DELETE FROM job_entry WHERE job_id = ?1;", id, NULL, &local)
       && delete_row (SELF, "DELETE FROM job WHERE id = ?1;", id, "job", &local);
  return in_transaction (SELF, ok, local, error);
}

GPtrArray *
lamina_sqlite_backend_list_job_uses (LaminaBackend  *backend,
                                     const char     *construction_id,
                                     GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT j.id, j.name, j.number, e.n, e.revision, e.use, j.status"
    "  FROM job_entry e JOIN job j ON j.id = e.job_id"
    " WHERE e.construction_id = ?1"
    " ORDER BY j.number COLLATE NOCASE, j.name COLLATE NOCASE, e.n;", error);
  g_autoptr(GPtrArray) list = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, construction_id);
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_use_free);
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      LaminaJobUse *use = g_new0 (LaminaJobUse, 1);

      use->job_id = lamina_sqlite_column_dup (stmt, 0);
      use->job_name = lamina_sqlite_column_dup (stmt, 1);
      use->job_number = lamina_sqlite_column_dup (stmt, 2);
      use->entry = sqlite3_column_int (stmt, 3);
      use->revision = sqlite3_column_int (stmt, 4);
      use->use = lamina_sqlite_column_dup (stmt, 5);
      lamina_job_status_from_string ((const char *) sqlite3_column_text (stmt, 6), &use->status);
      g_ptr_array_add (list, use);
    }
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (SELF, rc, "cannot read the jobs", error);
      return NULL;
    }
  return g_steal_pointer (&list);
}

gboolean
lamina_sqlite_put_records (LaminaSqlite  *self,
                           GPtrArray     *target_sets,
                           GPtrArray     *jobs,
                           const char    *now,
                           GError       **error)
{
  for (guint i = 0; target_sets != NULL && i < target_sets->len; i++)
    if (!lamina_sqlite_put_target_set (self, target_sets->pdata[i], now, error))
      return FALSE;
  for (guint i = 0; jobs != NULL && i < jobs->len; i++)
    if (!lamina_sqlite_put_job (self, jobs->pdata[i], error))
      return FALSE;
  return TRUE;
}
