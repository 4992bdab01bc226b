/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-util.c: the small helpers of the PostgreSQL backend: text
 * parameters, statements prepared once per connection, errors mapped to
 * LAMINA_LIBRARY_ERROR codes, transactions run again when the server
 * asks for it, and reading results. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include <math.h>
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

PGresult *
lamina_pg_query (LaminaPg    *self,
                 const char  *sql,
                 GPtrArray   *params,
                 const char  *what,
                 GError     **error)
{
  int n = params ? (int) params->len : 0;
  const char *name = statement_name (self, sql, n, what, error);
  PGresult *res;
  ExecStatusType status;

  if (name == NULL)
    return NULL;
  res = PQexecPrepared (self->conn, name, n,
                        n > 0 ? (const char *const *) params->pdata : NULL, NULL, NULL, 0);
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
  PGresult *res = lamina_pg_query (self, sql, params, what, error);

  PQclear (res);
  return res != NULL;
}

gboolean
lamina_pg_exec (LaminaPg    *self,
                const char  *sql,
                GError     **error)
{
  PGresult *res = PQexec (self->conn, sql);
  ExecStatusType status = PQresultStatus (res);
  gboolean ok = status == PGRES_COMMAND_OK || status == PGRES_TUPLES_OK;

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
