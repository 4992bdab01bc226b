/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-util.c: the small helpers of the PostgreSQL backend: text
 * parameters, statements prepared once per connection, errors mapped to
 * LAMINA_LIBRARY_ERROR codes, transactions run again when the server
 * asks for it, and reading results. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include <errno.h>
#include <math.h>
#include <poll.h>
#include <string.h>

/* A transaction the server refused for a concurrent one is run again
 * this many times before the refusal is reported (as BUSY). */
#define MAX_ATTEMPTS 8

GPtrArray *
lamina_pg_params_new (void)
{
  return g_ptr_array_new_with_free_func (g_free);
}

int
lamina_pg_add_text (GPtrArray  *params,
                    const char *text)
{
  g_ptr_array_add (params, g_strdup (text));
  return (int) params->len;
}

int
lamina_pg_add_int (GPtrArray *params,
                   gint64     value)
{
  g_ptr_array_add (params, g_strdup_printf ("%" G_GINT64_FORMAT, value));
  return (int) params->len;
}

int
lamina_pg_add_double (GPtrArray *params,
                      double     value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  if (isnan (value))
    g_ptr_array_add (params, NULL);
  else if (isinf (value))
    g_ptr_array_add (params, g_strdup (value > 0 ? "Infinity" : "-Infinity"));
  else
    g_ptr_array_add (params, g_strdup (g_ascii_dtostr (buf, sizeof buf, value)));
  return (int) params->len;
}

static LaminaLibraryError
code_for_sqlstate (const char *state)
{
  if (state == NULL)
    return LAMINA_LIBRARY_ERROR_IO;   /* no answer: the connection is gone */
  /* Our own refusals (the schema's functions and triggers). */
  if (strcmp (state, "LM001") == 0)
    return LAMINA_LIBRARY_ERROR_IMMUTABLE;
  if (strcmp (state, "LM002") == 0)
    return LAMINA_LIBRARY_ERROR_POLICY;
  if (strcmp (state, "LM003") == 0)
    return LAMINA_LIBRARY_ERROR_STALE;
  if (strcmp (state, "LM004") == 0)
    return LAMINA_LIBRARY_ERROR_NOT_FOUND;
  if (strcmp (state, "LM005") == 0)
    return LAMINA_LIBRARY_ERROR_INVALID;
  if (strcmp (state, "23505") == 0)
    return LAMINA_LIBRARY_ERROR_EXISTS;
  if (strcmp (state, "40001") == 0 || strcmp (state, "40P01") == 0
      || strcmp (state, "55P03") == 0)
    return LAMINA_LIBRARY_ERROR_BUSY;
  if (strcmp (state, "42501") == 0 || strcmp (state, "25006") == 0)
    return LAMINA_LIBRARY_ERROR_READ_ONLY;
  if (strncmp (state, "23", 2) == 0 || strncmp (state, "22", 2) == 0)
    return LAMINA_LIBRARY_ERROR_INVALID;
  if (strncmp (state, "08", 2) == 0 || strncmp (state, "57", 2) == 0
      || strncmp (state, "53", 2) == 0 || strncmp (state, "58", 2) == 0)
    return LAMINA_LIBRARY_ERROR_IO;
  if (strcmp (state, "XX001") == 0 || strcmp (state, "XX002") == 0)
    return LAMINA_LIBRARY_ERROR_CORRUPT;
  return LAMINA_LIBRARY_ERROR_FAILED;
}

void
lamina_pg_set_error (LaminaPg        *self,
                     const PGresult  *res,
                     const char      *what,
                     GError         **error)
{
  const char *state = res ? PQresultErrorField (res, PG_DIAG_SQLSTATE) : NULL;
  const char *primary = res ? PQresultErrorField (res, PG_DIAG_MESSAGE_PRIMARY) : NULL;
  g_autofree char *message = g_strdup (primary ? primary : PQerrorMessage (self->conn));

  g_strstrip (message);
  g_strlcpy (self->sqlstate, state ? state : "", sizeof self->sqlstate);
  /* A refusal of our own schema speaks for itself, without the server. */
  if (state != NULL && strncmp (state, "LM", 2) == 0)
    g_set_error_literal (error, LAMINA_LIBRARY_ERROR, code_for_sqlstate (state), message);
  else
    g_set_error (error, LAMINA_LIBRARY_ERROR, code_for_sqlstate (state), "%s: %s: %s",
                 self->label, what, message);
}

/* ---- Pipeline mode ---------------------------------------------------- */

/* What a statement sent in pipeline mode still owes: its result, and for a
 * statement prepared in the pipeline the SQL it was prepared for. */
typedef struct
{
  const char *what;
  char       *prepared_sql;   /* NULL: an execution */
} Pending;

/* Statements in flight before their results are read: their results
 * (about 25 bytes each) must fit the socket buffers, or the server and
 * we would each wait for the other to read. */
#define PIPELINE_BATCH 400

static void
pending_free (gpointer data)
{
  Pending *p = data;

  g_free (p->prepared_sql);
  g_free (p);
}

static void
push_pending (LaminaPg    *self,
              const char  *what,
              const char  *prepared_sql)
{
  Pending *p = g_new0 (Pending, 1);

  p->what = what;
  p->prepared_sql = g_strdup (prepared_sql);
  g_ptr_array_add (self->pending, p);
}

static const char *
statement_name (LaminaPg    *self,
                const char  *sql,
                int          n_params,
                const char  *what,
                GError     **error)
{
  const char *name = g_hash_table_lookup (self->statements, sql);
  g_autofree char *new_name = NULL;
  PGresult *res;

  if (name != NULL)
    return name;
  new_name = g_strdup_printf ("lamina_%u", ++self->n_statements);
  if (self->pipeline)
    {
      /* Prepared in the pipeline; its result is read with the others. */
      if (!PQsendPrepare (self->conn, new_name, sql, n_params, NULL))
        {
          lamina_pg_set_error (self, NULL, what, error);
          return NULL;
        }
      push_pending (self, what, sql);
      name = new_name;
      g_hash_table_insert (self->statements, g_strdup (sql), g_steal_pointer (&new_name));
      return name;
    }
  res = PQprepare (self->conn, new_name, sql, n_params, NULL);
  if (PQresultStatus (res) != PGRES_COMMAND_OK)
    {
      lamina_pg_set_error (self, res, what, error);
      PQclear (res);
      return NULL;
    }
  PQclear (res);
  name = new_name;
  g_hash_table_insert (self->statements, g_strdup (sql), g_steal_pointer (&new_name));
  return name;
}

/* ---- Waiting for a colleague's lock ------------------------------------ */

/* Who holds the lock our session waits for, from the server's own view
 * (pg_blocking_pids, pg_stat_activity): "lamina-cli, server process
 * 4242, user anna"; NULL when nobody blocks us (a statement that is just
 * slow) or the side connection that asks cannot be made.  Asked on a
 * second connection, since ours is busy waiting. */
static char *
dup_blocker (LaminaPg *self)
{
  g_autofree char *pid = g_strdup_printf ("%d", PQbackendPID (self->conn));
  const char *values[] = { pid };
  PGresult *res;
  char *holder = NULL;

  if (self->watch == NULL && !self->watch_failed)
    {
      self->watch = lamina_pg_connect_raw (self->parent.path, self->password);
      if (PQstatus (self->watch) != CONNECTION_OK)
        {
          g_debug ("%s: cannot ask who holds a lock: %s", self->label, PQerrorMessage (self->watch));
          g_clear_pointer (&self->watch, PQfinish);
          self->watch_failed = TRUE;
        }
    }
  if (self->watch == NULL)
    return NULL;
  res = PQexecParams (self->watch,
    "SELECT coalesce (nullif (a.application_name, ''), 'a program'), a.pid,"
    "       coalesce (a.usename, '?')"
    "  FROM pg_stat_activity a WHERE a.pid = ANY (pg_blocking_pids ($1::integer))"
    " ORDER BY a.xact_start NULLS LAST LIMIT 1", 1, NULL, values, NULL, NULL, 0);
  if (PQresultStatus (res) == PGRES_TUPLES_OK && PQntuples (res) > 0)
    holder = g_strdup_printf ("%s, server process %s, user %s", PQgetvalue (res, 0, 0),
                              PQgetvalue (res, 0, 1), PQgetvalue (res, 0, 2));
  PQclear (res);
  return holder;
}

/* The result of the statement just sent: the first that failed, else the
 * last.  While the server has not answered, every half second or so: is
 * our session blocked by another's lock?  Then the library's wait
 * function hears who holds it (as the SQLite backend's busy handler
 * does), and once more when the wait ends.  The wait itself is bounded
 * by the session's lock_timeout (the busy timeout). */
static PGresult *
await_result (LaminaPg *self)
{
  gint64 next_look = g_get_monotonic_time () + G_USEC_PER_SEC / 2;
  gboolean announced = FALSE;
  PGresult *res, *kept = NULL;

  while (PQisBusy (self->conn))
    {
      struct pollfd pfd = { PQsocket (self->conn), POLLIN, 0 };
      int rc = poll (&pfd, 1, self->parent.waiting != NULL ? 250 : -1);

      if (rc < 0 && errno != EINTR)
        break;
      if (rc > 0 && !PQconsumeInput (self->conn))
        break;
      if (self->parent.waiting != NULL && g_get_monotonic_time () >= next_look)
        {
          g_autofree char *holder = dup_blocker (self);

          /* Said once per holder; a slow statement alone is no wait. */
          if (holder != NULL && g_strcmp0 (holder, self->announced_holder) != 0)
            {
              self->parent.waiting (self->parent.waiting_data, TRUE, holder);
              g_free (self->announced_holder);
              self->announced_holder = g_steal_pointer (&holder);
              announced = TRUE;
            }
          next_look = g_get_monotonic_time () + 2 * G_USEC_PER_SEC;
        }
    }
  if (announced)
    {
      g_clear_pointer (&self->announced_holder, g_free);
      self->parent.waiting (self->parent.waiting_data, FALSE, NULL);
    }
  while ((res = PQgetResult (self->conn)) != NULL)
    {
      ExecStatusType status = kept ? PQresultStatus (kept) : PGRES_COMMAND_OK;

      /* The first failure is the one to report. */
      if (status != PGRES_TUPLES_OK && status != PGRES_COMMAND_OK)
        {
          PQclear (res);
          continue;
        }
      PQclear (kept);
      kept = res;
    }
  return kept;
}

PGresult *
lamina_pg_query (LaminaPg    *self,
                 const char  *sql,
                 GPtrArray   *params,
                 const char  *what,
                 GError     **error)
{
  int n = params ? (int) params->len : 0;
  const char *name;
  PGresult *res;
  ExecStatusType status;

  /* A result is not at hand in pipeline mode: only lamina_pg_run. */
  g_return_val_if_fail (!self->pipeline, NULL);
  name = statement_name (self, sql, n, what, error);
  if (name == NULL)
    return NULL;
  res = PQsendQueryPrepared (self->conn, name, n,
                             n > 0 ? (const char *const *) params->pdata : NULL, NULL, NULL, 0)
        ? await_result (self) : NULL;
  status = PQresultStatus (res);
  if (status != PGRES_TUPLES_OK && status != PGRES_COMMAND_OK)
    {
      lamina_pg_set_error (self, res, what, error);
      PQclear (res);
      return NULL;
    }
  return res;
}

gboolean
lamina_pg_run (LaminaPg    *self,
               const char  *sql,
               GPtrArray   *params,
               const char  *what,
               GError     **error)
{
  PGresult *res;

  if (self->pipeline)
    {
      int n = params ? (int) params->len : 0;
      const char *name = statement_name (self, sql, n, what, error);

      if (name == NULL)
        return FALSE;
      if (!PQsendQueryPrepared (self->conn, name, n,
                                n > 0 ? (const char *const *) params->pdata : NULL, NULL, NULL, 0))
        {
          lamina_pg_set_error (self, NULL, what, error);
          return FALSE;
        }
      push_pending (self, what, NULL);
      return self->pending->len < PIPELINE_BATCH || lamina_pg_pipeline_sync (self, error);
    }
  res = lamina_pg_query (self, sql, params, what, error);
  PQclear (res);
  return res != NULL;
}

gboolean
lamina_pg_exec (LaminaPg    *self,
                const char  *sql,
                GError     **error)
{
  PGresult *res;
  ExecStatusType status;
  gboolean ok;

  g_return_val_if_fail (!self->pipeline, FALSE);
  res = PQsendQuery (self->conn, sql) ? await_result (self) : NULL;
  status = PQresultStatus (res);
  ok = status == PGRES_COMMAND_OK || status == PGRES_TUPLES_OK;

  if (!ok)
    lamina_pg_set_error (self, res, "cannot update the library", error);
  PQclear (res);
  return ok;
}

static void
rollback (LaminaPg *self)
{
  if (PQtransactionStatus (self->conn) != PQTRANS_IDLE)
    PQclear (PQexec (self->conn, "ROLLBACK;"));
}

static gboolean
retryable (const char *state)
{
  return strcmp (state, "40001") == 0 || strcmp (state, "40P01") == 0;
}

gboolean
lamina_pg_transaction (LaminaPg        *self,
                       LaminaPgTxnFunc  func,
                       gpointer         data,
                       GError         **error)
{
  if (self->parent.read_only_reason != NULL)
    {
      lamina_backend_set_read_only_error (&self->parent, error);
      return FALSE;
    }
  for (int attempt = 1; ; attempt++)
    {
      g_autoptr(GError) local = NULL;

      self->sqlstate[0] = '\0';
      self->limit_read = FALSE;
      self->codes_locked = FALSE;
      if (lamina_pg_exec (self, "BEGIN;", &local)
          && func (self, data, &local)
          && lamina_pg_exec (self, "COMMIT;", &local))
        return TRUE;
      rollback (self);
      if (attempt < MAX_ATTEMPTS && retryable (self->sqlstate))
        {
          /* A little later, and not in step with the other client. */
          g_usleep (1000 * (guint) g_random_int_range (1, 10 * attempt));
          continue;
        }
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
}

const char *
lamina_pg_get (const PGresult *res,
               int             row,
               int             col)
{
  return PQgetisnull (res, row, col) ? NULL : PQgetvalue (res, row, col);
}

char *
lamina_pg_dup (const PGresult *res,
               int             row,
               int             col)
{
  return g_strdup (lamina_pg_get (res, row, col));
}

double
lamina_pg_double (const PGresult *res,
                  int             row,
                  int             col)
{
  const char *text = lamina_pg_get (res, row, col);

  if (text == NULL)
    return NAN;
  if (strcmp (text, "Infinity") == 0)
    return INFINITY;
  if (strcmp (text, "-Infinity") == 0)
    return -INFINITY;
  return g_ascii_strtod (text, NULL);
}

int
lamina_pg_int (const PGresult *res,
               int             row,
               int             col)
{
  const char *text = lamina_pg_get (res, row, col);

  return text ? (int) g_ascii_strtoll (text, NULL, 10) : 0;
}

gboolean
lamina_pg_bool (const PGresult *res,
                int             row,
                int             col)
{
  const char *text = lamina_pg_get (res, row, col);

  return text != NULL && text[0] == 't';
}

gint64
lamina_pg_changes (const PGresult *res)
{
  const char *n = PQcmdTuples ((PGresult *) res);

  return n && *n ? g_ascii_strtoll (n, NULL, 10) : 0;
}
gboolean
lamina_pg_pipeline_begin (LaminaPg  *self,
                          GError   **error)
{
  g_return_val_if_fail (!self->pipeline, FALSE);
  if (!PQenterPipelineMode (self->conn))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO, "%s: %s", self->label,
                   PQerrorMessage (self->conn));
      return FALSE;
    }
  self->pipeline = TRUE;
  self->pending = g_ptr_array_new_with_free_func (pending_free);
  return TRUE;
}

/* Sends a sync and reads every result owed; the first failure is
 * reported (the server skips the rest of the batch after it). */
gboolean
lamina_pg_pipeline_sync (LaminaPg  *self,
                         GError   **error)
{
  g_autoptr(GError) first = NULL;
  guint next = 0, nulls = 0;
  gboolean reading = TRUE;

  g_return_val_if_fail (self->pipeline, FALSE);
  if (self->pending->len == 0)
    return TRUE;
  if (!PQpipelineSync (self->conn))
    {
      lamina_pg_set_error (self, NULL, "cannot update the library", &first);
      reading = FALSE;
    }
  while (reading)
    {
      PGresult *res = PQgetResult (self->conn);
      ExecStatusType status;
      Pending *p;

      if (res == NULL)
        {
          /* One NULL ends each statement's results; two in a row: nothing
           * more is coming (the connection is gone). */
          if (++nulls > 1)
            {
              if (first == NULL)
                lamina_pg_set_error (self, NULL, "cannot update the library", &first);
              reading = FALSE;
            }
          continue;
        }
      nulls = 0;
      status = PQresultStatus (res);
      if (status == PGRES_PIPELINE_SYNC)
        reading = FALSE;
      else
        {
          p = next < self->pending->len ? self->pending->pdata[next++] : NULL;
          if (status == PGRES_FATAL_ERROR && first == NULL)
            lamina_pg_set_error (self, res, p ? p->what : "cannot update the library", &first);
          /* A statement whose preparation did not happen is prepared
           * again the next time it is used. */
          if (p != NULL && p->prepared_sql != NULL && status != PGRES_COMMAND_OK)
            g_hash_table_remove (self->statements, p->prepared_sql);
        }
      PQclear (res);
    }
  /* Preparations never answered (the connection went) are made again. */
  for (; next < self->pending->len; next++)
    {
      Pending *p = self->pending->pdata[next];

      if (p->prepared_sql != NULL)
        g_hash_table_remove (self->statements, p->prepared_sql);
    }
  g_ptr_array_set_size (self->pending, 0);
  if (first != NULL)
    {
      g_propagate_error (error, g_steal_pointer (&first));
      return FALSE;
    }
  return TRUE;
}

/* Reads what is owed (when @ok) and leaves pipeline mode; FALSE when a
 * statement failed or the mode cannot be left. */
gboolean
lamina_pg_pipeline_end (LaminaPg  *self,
                        gboolean   ok,
                        GError   **error)
{
  g_autoptr(GError) local = NULL;

  if (!self->pipeline)
    return ok;
  /* Even after a failure the results are read, or the connection could
   * not leave pipeline mode. */
  if (!lamina_pg_pipeline_sync (self, ok ? &local : NULL))
    ok = FALSE;
  self->pipeline = FALSE;
  g_clear_pointer (&self->pending, g_ptr_array_unref);
  if (!PQexitPipelineMode (self->conn) && ok)
    {
      g_set_error (&local, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO, "%s: %s", self->label,
                   PQerrorMessage (self->conn));
      ok = FALSE;
    }
  if (local != NULL)
    g_propagate_error (error, g_steal_pointer (&local));
  return ok;
}
