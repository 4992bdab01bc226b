/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-search.c: the list of constructions in the PostgreSQL
 * backend: prefix search on the words of the search column (the words
 * the SQLite index holds, so the same text finds the same
 * constructions), filters, sorting (NULL first, as SQLite sorts) and
 * paging. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include "lamina-store-common.h"

#include <math.h>

#define SELF ((LaminaPg *) backend)

/* Every word of @text as a required prefix ('w':*), or NULL when @text
 * has no word.  The words hold only letters and digits, so nothing of
 * the user's text reaches tsquery syntax. */
static char *
text_to_tsquery (const char *text)
{
  g_autoptr(GPtrArray) words = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GString) query = g_string_new (NULL);

  lamina_store_add_search_words (words, text);
  for (guint i = 0; i < words->len; i++)
    g_string_append_printf (query, "%s'%s':*", i ? " & " : "", (char *) words->pdata[i]);
  if (query->len == 0)
    return NULL;
  return g_string_free (g_steal_pointer (&query), FALSE);
}

static const char *const sort_columns[] = {
  [LAMINA_SORT_CODE] = "lower (c.code) COLLATE \"C\"",
  [LAMINA_SORT_NAME] = "lower (c.name) COLLATE \"C\"",
  [LAMINA_SORT_U] = "c.u_corrected",
  [LAMINA_SORT_THICKNESS] = "c.thickness",
  [LAMINA_SORT_MODIFIED] = "c.modified_at COLLATE \"C\"",
};

static const char *
get_sort_column (LaminaSortKey key)
{
  if ((guint) key >= G_N_ELEMENTS (sort_columns) || sort_columns[key] == NULL)
    key = LAMINA_SORT_CODE;
  return sort_columns[key];
}

/* Appends FROM and WHERE for @q, adding the parameters as they come;
 * @tsq: the parameter number of the text query, or 0. */
static void
append_filters (GString                  *sql,
                GPtrArray                *params,
                const LaminaLibraryQuery *q,
                int                       tsq)
{
  g_string_append (sql, " FROM construction c WHERE c.deleted_at IS NULL");
  if (tsq > 0)
    g_string_append_printf (sql, " AND c.search @@ $%d::tsquery", tsq);
  if (q->element >= 0)
    g_string_append_printf (sql, " AND c.element = $%d",
                            lamina_pg_add_text (params, lamina_element_to_string (q->element)));
  if (q->status >= 0)
    g_string_append_printf (sql, " AND c.status = $%d",
                            lamina_pg_add_text (params, lamina_status_to_string (q->status)));
  if (q->tag != NULL)
    g_string_append_printf (sql, " AND EXISTS (SELECT 1 FROM construction_tag t"
                                 " WHERE t.construction_id = c.id AND t.tag = $%d)",
                            lamina_pg_add_text (params, q->tag));
  if (!isnan (q->min_u))
    g_string_append_printf (sql, " AND c.u_corrected >= $%d::float8",
                            lamina_pg_add_double (params, q->min_u));
  if (!isnan (q->max_u))
    g_string_append_printf (sql, " AND c.u_corrected <= $%d::float8",
                            lamina_pg_add_double (params, q->max_u));
  if (!isnan (q->min_thickness))
    g_string_append_printf (sql, " AND c.thickness >= $%d::float8",
                            lamina_pg_add_double (params, q->min_thickness));
  if (!isnan (q->max_thickness))
    g_string_append_printf (sql, " AND c.thickness <= $%d::float8",
                            lamina_pg_add_double (params, q->max_thickness));
  if (q->material_changed_only)
    g_string_append (sql, " AND c.material_changed");
  if (q->moisture_fails_only)
    g_string_append (sql, " AND (c.flags & 256) <> 0");
}

GPtrArray *
lamina_pg_search (LaminaBackend             *backend,
                  const LaminaLibraryQuery  *q,
                  GError                   **error)
{
  g_autofree char *tsquery = text_to_tsquery (q->text);
  g_autoptr(GString) sql = g_string_new (
    "SELECT c.id, c.code, c.name, c.element, c.status, c.head, c.u, c.u_corrected,"
    " c.target_u, c.thickness, c.modified_at, c.flags, c.material_changed");
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  gboolean rank = q->sort == LAMINA_SORT_RELEVANCE && tsquery != NULL;
  const char *dir = q->descending ? "DESC NULLS LAST" : "ASC NULLS FIRST";
  int tsq = tsquery ? lamina_pg_add_text (params, tsquery) : 0;
  GPtrArray *rows;
  PGresult *res;

  append_filters (sql, params, q, tsq);
  if (rank)
    /* Best first, as SQLite's rank (lower is better) sorts. */
    g_string_append_printf (sql, " ORDER BY -ts_rank (c.search, $%d::tsquery) %s", tsq, dir);
  else
    g_string_append_printf (sql, " ORDER BY %s %s", get_sort_column (q->sort), dir);
  g_string_append_printf (sql, ", c.id COLLATE \"C\" %s", q->descending ? "DESC" : "ASC");
  if (q->limit > 0)
    g_string_append_printf (sql, " LIMIT $%d", lamina_pg_add_int (params, q->limit));
  g_string_append_printf (sql, " OFFSET $%d", lamina_pg_add_int (params, q->offset));
  res = lamina_pg_query (SELF, sql->str, params, "cannot search the library", error);
  if (res == NULL)
    return NULL;
  rows = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_summary_free);
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaSummary *s = g_new0 (LaminaSummary, 1);

      s->id = lamina_pg_dup (res, i, 0);
      s->code = lamina_pg_dup (res, i, 1);
      s->name = lamina_pg_dup (res, i, 2);
      lamina_element_from_string (lamina_pg_get (res, i, 3), &s->element);
      lamina_status_from_string (lamina_pg_get (res, i, 4), &s->status);
      s->revision = lamina_pg_int (res, i, 5);
      s->u = lamina_pg_double (res, i, 6);
      s->u_corrected = lamina_pg_double (res, i, 7);
      s->target_u = lamina_pg_double (res, i, 8);
      s->thickness = lamina_pg_double (res, i, 9);
      s->modified_at = lamina_pg_dup (res, i, 10);
      s->flags = lamina_pg_int (res, i, 11);
      if (lamina_pg_bool (res, i, 12))
        s->flags |= LAMINA_SUMMARY_MATERIAL_CHANGED;
      g_ptr_array_add (rows, s);
    }
  PQclear (res);
  return rows;
}

/* How many rows @q matches; with @at_most >= 0, counting no further than
 * @at_most + 1, so that a short prefix matching most of a large library
 * costs a bounded time. */
static gint64
count_rows (LaminaPg                  *self,
            const LaminaLibraryQuery  *q,
            gint64                     at_most,
            GError                   **error)
{
  g_autofree char *tsquery = text_to_tsquery (q->text);
  g_autoptr(GString) sql = g_string_new (at_most < 0 ? "SELECT count(*)"
                                                     : "SELECT count(*) FROM (SELECT 1");
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  int tsq = tsquery ? lamina_pg_add_text (params, tsquery) : 0;
  PGresult *res;
  gint64 n;

  append_filters (sql, params, q, tsq);
  if (at_most >= 0)
    g_string_append_printf (sql, " LIMIT $%d) AS capped",
                            lamina_pg_add_int (params, at_most + 1));
  res = lamina_pg_query (self, sql->str, params, "cannot search the library", error);
  if (res == NULL)
    return -1;
  n = g_ascii_strtoll (PQgetvalue (res, 0, 0), NULL, 10);
  PQclear (res);
  return n;
}

gint64
lamina_pg_count (LaminaBackend             *backend,
                 const LaminaLibraryQuery  *q,
                 GError                   **error)
{
  return count_rows (SELF, q, -1, error);
}

gint64
lamina_pg_count_at_most (LaminaBackend             *backend,
                         const LaminaLibraryQuery  *q,
                         gint64                     at_most,
                         GError                   **error)
{
  return count_rows (SELF, q, MAX (at_most, 0), error);
}

GPtrArray *
lamina_pg_list_tags (LaminaBackend  *backend,
                     GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT DISTINCT t.tag COLLATE \"C\" FROM construction_tag t"
    "  JOIN construction c ON c.id = t.construction_id AND c.deleted_at IS NULL"
    " ORDER BY 1", NULL, "cannot list the tags", error);
  GPtrArray *tags;

  if (res == NULL)
    return NULL;
  tags = g_ptr_array_new_with_free_func (g_free);
  for (int i = 0; i < PQntuples (res); i++)
    g_ptr_array_add (tags, lamina_pg_dup (res, i, 0));
  PQclear (res);
  return tags;
}
