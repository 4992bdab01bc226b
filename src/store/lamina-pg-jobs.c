/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-jobs.c: target sets and jobs in the PostgreSQL backend, kept
 * as the SQLite backend keeps them (lamina-sqlite-jobs.c): a body that is
 * a catalogue document with the one record, and job_entry mirroring
 * each schedule. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include "lamina-store-common.h"

#define SELF ((LaminaPg *) backend)

GPtrArray *
lamina_pg_list_target_sets (LaminaBackend  *backend,
                            GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT id, body FROM target_set ORDER BY lower (name) COLLATE \"C\", id COLLATE \"C\"",
    NULL, "cannot read the target sets", error);
  g_autoptr(GPtrArray) list = NULL;

  if (res == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_target_set_free);
  for (int i = 0; i < PQntuples (res); i++)
    {
      g_autoptr(LaminaCatalogue) c = lamina_store_record_body_read (lamina_pg_get (res, i, 1), -1,
                                                                    lamina_pg_get (res, i, 0),
                                                                    error);

      if (c == NULL || c->target_sets->len != 1)
        {
          if (c != NULL)
            g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                         "the stored target set “%s” is damaged", lamina_pg_get (res, i, 0));
          PQclear (res);
          return NULL;
        }
      g_ptr_array_add (list, g_ptr_array_steal_index (c->target_sets, 0));
    }
  PQclear (res);
  return g_steal_pointer (&list);
}

gboolean
lamina_pg_put_target_set_in_txn (LaminaPg              *self,
                       const LaminaTargetSet *set,
                       const char            *now,
                       GError               **error)
{
  g_autofree char *body = lamina_store_record_body_dup (set, NULL, error);
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  if (body == NULL)
    return FALSE;
  lamina_pg_add_text (params, set->id);
  lamina_pg_add_text (params, set->name);
  lamina_pg_add_text (params, body);
  lamina_pg_add_text (params, now);
  return lamina_pg_run (self,
    "INSERT INTO target_set (id, name, body, modified_at) VALUES ($1, $2, $3, $4)"
    " ON CONFLICT (id) DO UPDATE SET name = $2, body = $3, modified_at = $4",
    params, "cannot store a target set", error);
}

typedef struct
{
  const LaminaTargetSet *set;
  const LaminaJob       *job;
  const char            *id;
  const char            *now;
  gboolean               create;
} Record;

static gboolean
put_target_set_txn (LaminaPg  *self,
                    gpointer   data,
                    GError   **error)
{
  Record *r = data;

  return lamina_pg_put_target_set_in_txn (self, r->set, r->now, error);
}

gboolean
lamina_pg_put_target_set (LaminaBackend          *backend,
                          const LaminaTargetSet  *set,
                          const char             *now,
                          GError                **error)
{
  Record r = { .set = set, .now = now };

  return lamina_pg_transaction (SELF, put_target_set_txn, &r, error);
}

static gboolean
delete_row (LaminaPg    *self,
            const char  *sql,
            const char  *id,
            const char  *what,
            GError     **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  gint64 n;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (self, sql, params, "cannot update the library", error);
  if (res == NULL)
    return FALSE;
  n = lamina_pg_changes (res);
  PQclear (res);
  if (what != NULL && n == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no %s “%s”", what, id);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_pg_delete_target_set (LaminaBackend  *backend,
                             const char     *id,
                             GError        **error)
{
  return delete_row (SELF, "DELETE FROM target_set WHERE id = $1", id, "target set", error);
}

static LaminaJob *
read_job_row (const PGresult  *res,
              int              row,
              GError         **error)
{
  const char *id = lamina_pg_get (res, row, 0);
  g_autoptr(LaminaCatalogue) c = lamina_store_record_body_read (lamina_pg_get (res, row, 1), -1,
                                                                id, error);

  if (c == NULL)
    return NULL;
  if (c->jobs->len != 1)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                   "the stored job “%s” is damaged", id);
      return NULL;
    }
  return g_ptr_array_steal_index (c->jobs, 0);
}

GPtrArray *
lamina_pg_list_jobs (LaminaBackend  *backend,
                     GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT id, body FROM job ORDER BY lower (number) COLLATE \"C\" NULLS FIRST,"
    " lower (name) COLLATE \"C\", id COLLATE \"C\"",
    NULL, "cannot read the jobs", error);
  g_autoptr(GPtrArray) list = NULL;

  if (res == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_free);
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaJob *job = read_job_row (res, i, error);

      if (job == NULL)
        {
          PQclear (res);
          return NULL;
        }
      g_ptr_array_add (list, job);
    }
  PQclear (res);
  return g_steal_pointer (&list);
}

LaminaJob *
lamina_pg_get_job (LaminaBackend  *backend,
                   const char     *id,
                   GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  LaminaJob *job = NULL;
  PGresult *res;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (SELF, "SELECT id, body FROM job WHERE id = $1", params,
                         "cannot read the job", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) > 0)
    job = read_job_row (res, 0, error);
  else
    g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND, "no job “%s”", id);
  PQclear (res);
  return job;
}

static gboolean
put_job_in_txn (LaminaPg         *self,
                const LaminaJob  *job,
                GError          **error)
{
  g_autofree char *body = lamina_store_record_body_dup (NULL, job, error);
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  if (body == NULL)
    return FALSE;
  lamina_pg_add_text (params, job->id);
  lamina_pg_add_text (params, job->name);
  lamina_pg_add_text (params, job->number);
  lamina_pg_add_text (params, lamina_job_status_to_string (job->status));
  lamina_pg_add_text (params, body);
  lamina_pg_add_text (params, job->modified_at);
  if (!lamina_pg_run (self,
        "INSERT INTO job (id, name, number, status, body, modified_at)"
        " VALUES ($1, $2, $3, $4, $5, $6)"
        " ON CONFLICT (id) DO UPDATE SET name = $2, number = $3, status = $4, body = $5,"
        " modified_at = $6",
        params, "cannot store a job", error))
    return FALSE;
  g_ptr_array_set_size (params, 1);
  if (!lamina_pg_run (self, "DELETE FROM job_entry WHERE job_id = $1", params,
                      "cannot store a job", error))
    return FALSE;
  for (guint i = 0; i < job->entries->len; i++)
    {
      const LaminaJobEntry *e = g_ptr_array_index (job->entries, i);

      g_ptr_array_set_size (params, 1);
      lamina_pg_add_int (params, e->n);
      lamina_pg_add_text (params, e->construction);
      lamina_pg_add_int (params, e->revision);
      lamina_pg_add_text (params, e->use);
      if (!lamina_pg_run (self,
            "INSERT INTO job_entry (job_id, n, construction_id, revision, use)"
            " VALUES ($1, $2, $3, $4, $5)", params, "cannot store a job", error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
put_job_txn (LaminaPg  *self,
             gpointer   data,
             GError   **error)
{
  Record *r = data;
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  gboolean exists;

  lamina_pg_add_text (params, r->job->id);
  res = lamina_pg_query (self, "SELECT 1 FROM job WHERE id = $1 FOR UPDATE", params,
                         "cannot read the jobs", error);
  if (res == NULL)
    return FALSE;
  exists = PQntuples (res) > 0;
  PQclear (res);
  if (r->create && exists)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS,
                   "a job “%s” exists already", r->job->id);
      return FALSE;
    }
  if (!r->create && !exists)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no job “%s”", r->job->id);
      return FALSE;
    }
  return put_job_in_txn (self, r->job, error);
}

gboolean
lamina_pg_put_job (LaminaBackend    *backend,
                   const LaminaJob  *job,
                   gboolean          create,
                   GError          **error)
{
  Record r = { .job = job, .create = create };

  return lamina_pg_transaction (SELF, put_job_txn, &r, error);
}

static gboolean
delete_job_txn (LaminaPg  *self,
                gpointer   data,
                GError   **error)
{
  Record *r = data;

  return delete_row (self, "DELETE FROM job_entry WHERE job_id = $1", r->id, NULL, error)
         && delete_row (self, "DELETE FROM job WHERE id = $1", r->id, "job", error);
}

gboolean
lamina_pg_delete_job (LaminaBackend  *backend,
                      const char     *id,
                      GError        **error)
{
  Record r = { .id = id };

  return lamina_pg_transaction (SELF, delete_job_txn, &r, error);
}

GPtrArray *
lamina_pg_list_job_uses (LaminaBackend  *backend,
                         const char     *construction_id,
                         GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  GPtrArray *list;
  PGresult *res;

  lamina_pg_add_text (params, construction_id);
  res = lamina_pg_query (SELF,
    "SELECT j.id, j.name, j.number, e.n, e.revision, e.use, j.status"
    "  FROM job_entry e JOIN job j ON j.id = e.job_id"
    " WHERE e.construction_id = $1"
    " ORDER BY lower (j.number) COLLATE \"C\" NULLS FIRST, lower (j.name) COLLATE \"C\", e.n",
    params, "cannot read the jobs", error);
  if (res == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_job_use_free);
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaJobUse *use = g_new0 (LaminaJobUse, 1);

      use->job_id = lamina_pg_dup (res, i, 0);
      use->job_name = lamina_pg_dup (res, i, 1);
      use->job_number = lamina_pg_dup (res, i, 2);
      use->entry = lamina_pg_int (res, i, 3);
      use->revision = lamina_pg_int (res, i, 4);
      use->use = lamina_pg_dup (res, i, 5);
      lamina_job_status_from_string (lamina_pg_get (res, i, 6), &use->status);
      g_ptr_array_add (list, use);
    }
  PQclear (res);
  return list;
}

gboolean
lamina_pg_put_records (LaminaPg    *self,
                       GPtrArray   *target_sets,
                       GPtrArray   *jobs,
                       const char  *now,
                       GError     **error)
{
  for (guint i = 0; target_sets != NULL && i < target_sets->len; i++)
    if (!lamina_pg_put_target_set_in_txn (self, target_sets->pdata[i], now, error))
      return FALSE;
  for (guint i = 0; jobs != NULL && i < jobs->len; i++)
    if (!put_job_in_txn (self, jobs->pdata[i], error))
      return FALSE;
  return TRUE;
}
