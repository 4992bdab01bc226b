/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-revisions.c: construction revisions, history, review acts and
 * the all-or-nothing import in the PostgreSQL backend, with the
 * semantics of lamina-sqlite-revisions.c and lamina-sqlite-review.c.
 *
 * A save locks the construction's row (SELECT … FOR UPDATE) before it
 * compares the revision it was based on with the latest: a colleague's
 * save of the same construction waits for ours and is then refused as
 * stale.  Two creations of one id meet at the primary key. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-pg-private.h"

#include "lamina-store-common.h"
#include "lamina-store-json.h"

#include <math.h>

#define SELF ((LaminaPg *) backend)

LaminaConstruction *
lamina_pg_get_construction (LaminaBackend  *backend,
                            const char     *id,
                            int             revision,
                            GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  LaminaConstruction *c = NULL;
  PGresult *res;

  lamina_pg_add_text (params, id);
  lamina_pg_add_int (params, revision);
  res = lamina_pg_query (SELF,
    "SELECT r.body, r.revision, r.status, r.modified_by, r.modified_at,"
    "       r.checked_by, r.checked_at, r.approved_by, r.approved_at,"
    "       (SELECT e.policy FROM review_event e WHERE e.construction_id = c.id"
    "          AND e.revision = r.revision AND e.act = 'approved' ORDER BY e.num DESC LIMIT 1),"
    "       (SELECT e.reason FROM review_event e WHERE e.construction_id = c.id"
    "          AND e.revision = r.revision AND e.act = 'approved' ORDER BY e.num DESC LIMIT 1)"
    "  FROM construction c JOIN revision r ON r.construction_id = c.id"
    " WHERE c.id = $1 AND c.deleted_at IS NULL"
    "   AND r.revision = CASE WHEN $2::integer > 0 THEN $2::integer ELSE c.head END",
    params, "cannot read a construction", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) == 0)
    {
      if (revision > 0)
        g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                     "construction “%s” has no revision %d", id, revision);
      else
        g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                     "no construction “%s” in the library", id);
      PQclear (res);
      return NULL;
    }
  c = lamina_store_construction_from_json (lamina_pg_get (res, 0, 0), error);
  if (c != NULL)
    {
      c->id = g_strdup (id);
      c->revision = lamina_pg_int (res, 0, 1);
      lamina_status_from_string (lamina_pg_get (res, 0, 2), &c->status);
      c->modified_by = lamina_pg_dup (res, 0, 3);
      c->modified_at = lamina_pg_dup (res, 0, 4);
      c->checked_by = lamina_pg_dup (res, 0, 5);
      c->checked_at = lamina_pg_dup (res, 0, 6);
      c->approved_by = lamina_pg_dup (res, 0, 7);
      c->approved_at = lamina_pg_dup (res, 0, 8);
      if (c->status == LAMINA_STATUS_APPROVED)
        {
          c->approval_policy = lamina_pg_dup (res, 0, 9);
          c->approval_reason = lamina_pg_dup (res, 0, 10);
        }
    }
  PQclear (res);
  return c;
}

/* Refuses a revision that does not go on top of the latest, with the row
 * locked until the commit. */
static gboolean
check_base (LaminaPg                  *self,
            const LaminaConstruction  *c,
            int                        base,
            GError                   **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  int head = 0;
  gboolean deleted = FALSE;

  lamina_pg_add_text (params, c->id);
  res = lamina_pg_query (self, "SELECT head, deleted_at IS NOT NULL FROM construction"
                               " WHERE id = $1 FOR UPDATE", params,
                         "cannot read a construction", error);
  if (res == NULL)
    return FALSE;
  if (PQntuples (res) > 0)
    {
      head = lamina_pg_int (res, 0, 0);
      deleted = lamina_pg_bool (res, 0, 1);
    }
  PQclear (res);
  return lamina_store_check_base (c, base, head, deleted, error);
}

char *
lamina_pg_search_words (const LaminaConstruction *c)
{
  g_autoptr(GPtrArray) words = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GString) names = g_string_new (NULL);
  g_autoptr(GHashTable) materials = lamina_store_collect_materials (c, names);

  lamina_store_add_search_words (words, c->code);
  lamina_store_add_search_words (words, c->name);
  lamina_store_add_search_words (words, c->description);
  for (guint i = 0; i < c->tags->len; i++)
    lamina_store_add_search_words (words, c->tags->pdata[i]);
  lamina_store_add_search_words (words, names->str);
  g_ptr_array_add (words, NULL);
  return g_strjoinv (" ", (char **) words->pdata);
}

static gboolean
put_construction_row (LaminaPg                  *self,
                      const LaminaConstruction  *c,
                      const LaminaResult        *r,
                      gboolean                   create,
                      GError                   **error)
{
  g_autofree char *words = lamina_pg_search_words (c);
  g_autoptr(GPtrArray) params = NULL;
  LaminaStoreConstructionRow row;

  lamina_store_construction_row_for_revision (&row, c, r, lamina_pg_moisture_limit (self));
  params = lamina_pg_construction_row_params (&row, words, FALSE);
  if (create)
    return lamina_pg_run (self,
      "INSERT INTO construction (id, head, code, name, element, status, u, u_corrected,"
      "   target_u, thickness, flags, modified_at, search)"
      " VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12,"
      "   array_to_tsvector (string_to_array ($13, ' ')))",
      params, "cannot store a construction", error);
  return lamina_pg_run (self,
    "UPDATE construction SET head = $2, code = $3, name = $4, element = $5, status = $6,"
    "   u = $7, u_corrected = $8, target_u = $9, thickness = $10, flags = $11,"
    "   modified_at = $12, search = array_to_tsvector (string_to_array ($13, ' '))"
    " WHERE id = $1",
    params, "cannot store a construction", error);
}

static gboolean
insert_revision_row (LaminaPg                     *self,
                     const LaminaBackendRevision  *rev,
                     GError                      **error)
{
  g_autofree char *body = lamina_store_construction_to_json (rev->construction);
  LaminaBackendRecordRevision row;

  lamina_store_revision_row_for (&row, rev, body);
  return lamina_pg_insert_revision (self, rev->construction->id, &row, "cannot store a revision",
                                    error);
}

GPtrArray *
lamina_pg_construction_row_params (const LaminaStoreConstructionRow *row,
                                   const char                       *words,
                                   gboolean                          whole)
{
  GPtrArray *params = lamina_pg_params_new ();

  lamina_pg_add_text (params, row->id);
  lamina_pg_add_int (params, row->head);
  lamina_pg_add_text (params, row->code);
  lamina_pg_add_text (params, row->name);
  lamina_pg_add_text (params, row->element);
  lamina_pg_add_text (params, row->status);
  lamina_pg_add_double (params, row->u);
  lamina_pg_add_double (params, row->u_corrected);
  lamina_pg_add_double (params, row->target_u);
  lamina_pg_add_double (params, row->thickness);
  lamina_pg_add_int (params, row->flags);
  lamina_pg_add_text (params, row->modified_at);
  lamina_pg_add_text (params, words);
  if (whole)
    {
      lamina_pg_add_text (params, row->deleted_at);
      lamina_pg_add_text (params, row->material_changed ? "true" : "false");
    }
  return params;
}

gboolean
lamina_pg_insert_revision (LaminaPg                           *self,
                           const char                         *id,
                           const LaminaBackendRecordRevision  *row,
                           const char                         *what,
                           GError                            **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, id);
  lamina_pg_add_int (params, row->revision);
  lamina_pg_add_text (params, lamina_status_to_string (row->status));
  lamina_pg_add_text (params, row->body);
  lamina_pg_add_double (params, row->u);
  lamina_pg_add_double (params, row->u_corrected);
  lamina_pg_add_double (params, row->r_total);
  lamina_pg_add_double (params, row->thickness);
  lamina_pg_add_text (params, row->calc_error);
  lamina_pg_add_text (params, row->modified_by);
  lamina_pg_add_text (params, row->modified_at);
  lamina_pg_add_text (params, row->checked_by);
  lamina_pg_add_text (params, row->checked_at);
  lamina_pg_add_text (params, row->approved_by);
  lamina_pg_add_text (params, row->approved_at);
  lamina_pg_add_text (params, row->comment);
  return lamina_pg_run (self,
    "INSERT INTO revision (construction_id, revision, status, body, u, u_corrected,"
    "   r_total, thickness, calc_error, modified_by, modified_at, checked_by,"
    "   checked_at, approved_by, approved_at, comment)"
    " VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14, $15, $16)",
    params, what, error);
}

gboolean
lamina_pg_index_revision (LaminaPg                  *self,
                          const LaminaConstruction  *c,
                          gboolean                   with_materials,
                          GError                   **error)
{
  g_autoptr(GHashTable) materials = lamina_store_collect_materials (c, NULL);
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  g_autoptr(GPtrArray) ids = g_ptr_array_new ();
  g_autoptr(GPtrArray) prints = g_ptr_array_new ();
  g_autofree char *ids_array = NULL, *prints_array = NULL, *tags_array = NULL;
  GHashTableIter iter;
  gpointer key, value;

  /* Whole arrays in one statement each (unnest), so that an import of
   * thousands of constructions does not pay a round trip per row. */
  g_hash_table_iter_init (&iter, materials);
  while (g_hash_table_iter_next (&iter, &key, &value))
    {
      g_ptr_array_add (ids, key);
      g_ptr_array_add (prints, value);
    }
  lamina_pg_add_text (params, c->id);
  lamina_pg_add_int (params, c->revision);
  lamina_pg_add_text (params, NULL);
  lamina_pg_add_text (params, NULL);
  g_ptr_array_add (ids, NULL);
  g_ptr_array_add (prints, NULL);
  g_free (params->pdata[2]);
  g_free (params->pdata[3]);
  params->pdata[2] = g_strjoinv ("\x1f", (char **) ids->pdata);
  params->pdata[3] = g_strjoinv ("\x1f", (char **) prints->pdata);
  if (with_materials && g_hash_table_size (materials) > 0
      && !lamina_pg_run (self,
           "INSERT INTO revision_material (construction_id, revision, material_id, fingerprint)"
           " SELECT $1, $2, m, f FROM unnest (string_to_array ($3, chr (31)),"
           "                                  string_to_array ($4, chr (31))) AS t (m, f)",
           params, "cannot store a revision", error))
    return FALSE;
  g_ptr_array_set_size (params, 1);
  if (!lamina_pg_run (self, "DELETE FROM construction_tag WHERE construction_id = $1", params,
                      "cannot store the tags", error))
    return FALSE;
  if (c->tags->len == 0)
    return TRUE;
  g_ptr_array_add (c->tags, NULL);
  lamina_pg_add_text (params, NULL);
  g_free (params->pdata[1]);
  params->pdata[1] = g_strjoinv ("\x1f", (char **) c->tags->pdata);
  g_ptr_array_remove_index (c->tags, c->tags->len - 1);
  return lamina_pg_run (self,
    "INSERT INTO construction_tag (construction_id, tag)"
    " SELECT $1, t FROM unnest (string_to_array ($2, chr (31))) AS t ON CONFLICT DO NOTHING",
    params, "cannot store the tags", error);
}

/* The construction's "a material changed" flag from its revision's
 * materials. */
static gboolean
refresh_material_flag (LaminaPg                  *self,
                       const LaminaConstruction  *c,
                       GError                   **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, c->id);
  lamina_pg_add_int (params, c->revision);
  return lamina_pg_run (self,
    "UPDATE construction SET material_changed = EXISTS ("
    "    SELECT 1 FROM revision_material rm JOIN material m ON m.id = rm.material_id"
    "     WHERE rm.construction_id = $1 AND rm.revision = $2"
    "       AND m.fingerprint <> rm.fingerprint)"
    " WHERE id = $1",
    params, "cannot update the library", error);
}

/* And from its climate's data (EN ISO 13788 checks). */
static gboolean
refresh_material_changed (LaminaPg                  *self,
                          const LaminaConstruction  *c,
                          GError                   **error)
{
  return refresh_material_flag (self, c, error)
         && (c->moisture == NULL
             || lamina_pg_refresh_climate_flags (self, c->moisture->climate, error));
}

/* The id (and name) of the first live construction but @except_id whose
 * office code is @code, ASCII letters compared without case as SQLite's
 * NOCASE does; NULL without an error when none.  The first comparison is
 * that of the index construction_by_code (lower () in the database's
 * collation, which folds ASCII letters alike in every locale but a
 * Turkish one), the second the exact rule. */
static char *
find_code_row (LaminaPg    *self,
               const char  *code,
               const char  *except_id,
               char       **name,
               GError     **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  char *id = NULL;

  lamina_pg_add_text (params, code);
  lamina_pg_add_text (params, except_id);
  res = lamina_pg_query (self,
    "SELECT id, name FROM construction"
    " WHERE lower (code) COLLATE \"C\" = lower ($1::text) COLLATE \"C\""
    "   AND lower (code COLLATE \"C\") = lower ($1::text COLLATE \"C\")"
    "   AND deleted_at IS NULL AND id IS DISTINCT FROM $2::text"
    " ORDER BY num LIMIT 1", params, "cannot read a construction", error);
  if (res == NULL)
    return NULL;
  if (PQntuples (res) > 0)
    {
      id = lamina_pg_dup (res, 0, 0);
      if (name != NULL)
        *name = lamina_pg_dup (res, 0, 1);
    }
  PQclear (res);
  return id;
}

/* Office codes are unique within a library, checked inside the write's
 * transaction.  At READ COMMITTED two writers could each find a code
 * free and both take it, so a writer first takes advisory locks that
 * last until its commit: the office-code lock shared plus a lock on the
 * code itself (two saves of other codes go on side by side), or, for an
 * import, the office-code lock alone, exclusively (one lock however many
 * constructions it brings: the server's lock table is not sized for
 * thousands in one transaction).  The check then reads what the other
 * writer committed.  The locks come before the row lock of check_base, in
 * every write, so that two writers cannot wait for each other. */
#define CODE_LOCK "1279610433"       /* "LMNA": the office-code lock */
#define CODE_LOCK_EACH "1279610434"  /* one code (hashed) */

gboolean
lamina_pg_lock_codes (LaminaPg  *self,
                      GError   **error)
{
  if (self->codes_locked)
    return TRUE;
  if (!lamina_pg_exec (self, "SELECT pg_advisory_xact_lock (" CODE_LOCK ", 0);", error))
    return FALSE;
  self->codes_locked = TRUE;
  return TRUE;
}

static gboolean
check_code_free (LaminaPg                  *self,
                 const LaminaConstruction  *c,
                 GError                   **error)
{
  g_autofree char *id = NULL, *name = NULL;
  g_autoptr(GError) local = NULL;

  if (c->code == NULL)
    return TRUE;
  if (!self->codes_locked)
    {
      g_autoptr(GPtrArray) params = lamina_pg_params_new ();

      lamina_pg_add_text (params, c->code);
      if (!lamina_pg_run (self,
            "SELECT pg_advisory_xact_lock_shared (" CODE_LOCK ", 0),"
            "       pg_advisory_xact_lock (" CODE_LOCK_EACH ","
            "                              hashtext (lower ($1::text COLLATE \"C\")))",
            params, "cannot lock the office code", error))
        return FALSE;
    }
  id = find_code_row (self, c->code, c->id, &name, &local);
  if (local != NULL)
    {
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  if (id == NULL)
    return TRUE;
  lamina_store_set_code_used_error (error, c->code, name ? name : id);
  return FALSE;
}

static gboolean
store_revision_in_txn (LaminaPg                     *self,
                       const LaminaBackendRevision  *rev,
                       int                           base,
                       GError                      **error)
{
  return check_code_free (self, rev->construction, error)
         && check_base (self, rev->construction, base, error)
         && put_construction_row (self, rev->construction, rev->result, base == 0, error)
         && insert_revision_row (self, rev, error)
         && lamina_pg_index_revision (self, rev->construction, TRUE, error)
         && refresh_material_changed (self, rev->construction, error);
}

typedef struct
{
  const LaminaBackendRevision *rev;
  int                          base;
  const LaminaBackendImport   *import;
  const char                  *now;
  const LaminaBackendReview   *review;
} Write;

static gboolean
store_revision_txn (LaminaPg  *self,
                    gpointer   data,
                    GError   **error)
{
  Write *w = data;

  return store_revision_in_txn (self, w->rev, w->base, error);
}

gboolean
lamina_pg_store_revision (LaminaBackend                *backend,
                          const LaminaBackendRevision  *rev,
                          int                           base_revision,
                          GError                      **error)
{
  Write w = { .rev = rev, .base = base_revision };

  return lamina_pg_transaction (SELF, store_revision_txn, &w, error);
}

typedef struct
{
  const char *id;
  const char *when;
} Deletion;

static gboolean
set_deleted_txn (LaminaPg  *self,
                 gpointer   data,
                 GError   **error)
{
  Deletion *d = data;
  const char *id = d->id, *when = d->when;
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  gint64 n;

  lamina_pg_add_text (params, id);
  lamina_pg_add_text (params, when);
  res = lamina_pg_query (self,
    "UPDATE construction SET deleted_at = $2"
    " WHERE id = $1 AND (deleted_at IS NULL) = ($2::text IS NOT NULL)",
    params, "cannot update the library", error);
  if (res == NULL)
    return FALSE;
  n = lamina_pg_changes (res);
  PQclear (res);
  if (n == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   when ? "no construction “%s” in the library"
                        : "no deleted construction “%s” in the library", id);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_pg_set_deleted (LaminaBackend  *backend,
                       const char     *id,
                       const char     *when,
                       GError        **error)
{
  Deletion d = { id, when };

  return lamina_pg_transaction (SELF, set_deleted_txn, &d, error);
}

GPtrArray *
lamina_pg_get_history (LaminaBackend  *backend,
                       const char     *id,
                       GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  g_autoptr(GPtrArray) list = NULL;
  PGresult *res;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (SELF,
    "SELECT revision, status, modified_by, modified_at, checked_by, checked_at,"
    "       approved_by, approved_at, comment, u_corrected"
    "  FROM revision WHERE construction_id = $1 ORDER BY revision DESC",
    params, "cannot read the history", error);
  if (res == NULL)
    return NULL;
  list = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_revision_info_free);
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaRevisionInfo *info = g_new0 (LaminaRevisionInfo, 1);

      info->revision = lamina_pg_int (res, i, 0);
      lamina_status_from_string (lamina_pg_get (res, i, 1), &info->status);
      info->modified_by = lamina_pg_dup (res, i, 2);
      info->modified_at = lamina_pg_dup (res, i, 3);
      info->checked_by = lamina_pg_dup (res, i, 4);
      info->checked_at = lamina_pg_dup (res, i, 5);
      info->approved_by = lamina_pg_dup (res, i, 6);
      info->approved_at = lamina_pg_dup (res, i, 7);
      info->comment = lamina_pg_dup (res, i, 8);
      info->u_corrected = lamina_pg_double (res, i, 9);
      g_ptr_array_add (list, info);
    }
  PQclear (res);
  if (list->len == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no construction “%s” in the library", id);
      return NULL;
    }
  return g_steal_pointer (&list);
}

/* Drafts edited in place (replace_draft, drop_draft): the head must still
 * be draft @draft of a live construction, in the state @stamp names. */
static gboolean
check_draft_head (LaminaPg    *self,
                  const char  *id,
                  int          draft,
                  const char  *stamp,
                  GError     **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  PGresult *res;
  int head = 0;
  gboolean deleted = FALSE, same = FALSE;
  LaminaStatus status = LAMINA_STATUS_DRAFT;

  lamina_pg_add_text (params, id);
  lamina_pg_add_text (params, stamp);
  res = lamina_pg_query (self,
    "SELECT c.head, c.deleted_at IS NOT NULL, r.status,"
    "       (r.body::jsonb ->> 'draft_stamp') IS NOT DISTINCT FROM $2::text"
    "  FROM construction c JOIN revision r ON r.construction_id = c.id AND r.revision = c.head"
    " WHERE c.id = $1 FOR UPDATE OF c", params, "cannot read a construction", error);
  if (res == NULL)
    return FALSE;
  if (PQntuples (res) > 0)
    {
      head = lamina_pg_int (res, 0, 0);
      deleted = lamina_pg_bool (res, 0, 1);
      lamina_status_from_string (lamina_pg_get (res, 0, 2), &status);
      same = lamina_pg_bool (res, 0, 3);
    }
  PQclear (res);
  return lamina_store_check_draft_head (id, draft, head, deleted, status, same, error);
}

/* What belongs to draft @draft alone: its materials, a stored 2-D check
 * and its row (a draft has no review records); the head goes back one. */
static gboolean
delete_draft_rows (LaminaPg    *self,
                   const char  *id,
                   int          draft,
                   GError     **error)
{
  static const char *const sql[] = {
    "DELETE FROM revision_material WHERE construction_id = $1 AND revision = $2",
    "DELETE FROM field_check WHERE construction_id = $1 AND revision = $2",
    "DELETE FROM revision WHERE construction_id = $1 AND revision = $2 AND status = 'draft'",
    "UPDATE construction SET head = $2::integer - 1 WHERE id = $1",
  };
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, id);
  lamina_pg_add_int (params, draft);
  for (guint i = 0; i < G_N_ELEMENTS (sql); i++)
    if (!lamina_pg_run (self, sql[i], params, "cannot replace a draft", error))
      return FALSE;
  return TRUE;
}

typedef struct
{
  const LaminaBackendRevision *rev;
  const char                  *stamp;
  int                          draft;
} Draft;

static gboolean
replace_draft_txn (LaminaPg  *self,
                   gpointer   data,
                   GError   **error)
{
  Draft *d = data;
  const LaminaConstruction *c = d->rev->construction;

  /* The code's locks before the row's (check_code_free). */
  return check_code_free (self, c, error)
         && check_draft_head (self, c->id, c->revision, d->stamp, error)
         && delete_draft_rows (self, c->id, c->revision, error)
         && store_revision_in_txn (self, d->rev, c->revision - 1, error);
}

gboolean
lamina_pg_replace_draft (LaminaBackend                *backend,
                         const LaminaBackendRevision  *rev,
                         const char                   *stamp,
                         GError                      **error)
{
  Draft d = { rev, stamp, 0 };

  return lamina_pg_transaction (SELF, replace_draft_txn, &d, error);
}

static gboolean
drop_draft_txn (LaminaPg  *self,
                gpointer   data,
                GError   **error)
{
  Draft *d = data;
  const LaminaConstruction *c = d->rev->construction;

  return check_draft_head (self, c->id, d->draft, d->stamp, error)
         && delete_draft_rows (self, c->id, d->draft, error)
         && put_construction_row (self, c, d->rev->result, FALSE, error)
         && lamina_pg_index_revision (self, c, FALSE, error)
         && refresh_material_changed (self, c, error);
}

gboolean
lamina_pg_drop_draft (LaminaBackend                *backend,
                      const LaminaBackendRevision  *previous,
                      int                           draft,
                      const char                   *stamp,
                      GError                      **error)
{
  Draft d = { previous, stamp, draft };

  g_return_val_if_fail (previous->construction->revision == draft - 1, FALSE);
  return lamina_pg_transaction (SELF, drop_draft_txn, &d, error);
}

/* Review acts: the schema's lamina_review_act does the whole act on the
 * server (lamina-pg-schema.c). */

static const char *const act_names[] = { "checked", "approved", "withdrawn" };

static gboolean
review_txn (LaminaPg  *self,
            gpointer   data,
            GError   **error)
{
  const LaminaBackendReview *r = ((Write *) data)->review;
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();

  lamina_pg_add_text (params, r->id);
  lamina_pg_add_int (params, r->revision);
  lamina_pg_add_text (params, act_names[r->act]);
  lamina_pg_add_text (params, r->by);
  lamina_pg_add_text (params, r->at);
  lamina_pg_add_text (params, r->date);
  lamina_pg_add_text (params, r->policy);
  lamina_pg_add_text (params, r->reason);
  return lamina_pg_run (self, "SELECT lamina_review_act ($1, $2, $3, $4, $5, $6, $7, $8)",
                        params, "cannot record the review", error);
}

gboolean
lamina_pg_review (LaminaBackend             *backend,
                  const LaminaBackendReview *review,
                  GError                   **error)
{
  Write w = { .review = review };

  return lamina_pg_transaction (SELF, review_txn, &w, error);
}

GPtrArray *
lamina_pg_get_review_events (LaminaBackend  *backend,
                             const char     *id,
                             GError        **error)
{
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  GPtrArray *events;
  PGresult *res;

  lamina_pg_add_text (params, id);
  res = lamina_pg_query (SELF,
    "SELECT revision, act, person, at, date, policy, reason FROM review_event"
    " WHERE construction_id = $1 ORDER BY num", params,
    "cannot read the review records", error);
  if (res == NULL)
    return NULL;
  events = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_review_event_free);
  for (int i = 0; i < PQntuples (res); i++)
    {
      LaminaReviewEvent *e = g_new0 (LaminaReviewEvent, 1);

      e->revision = lamina_pg_int (res, i, 0);
      e->act = lamina_pg_dup (res, i, 1);
      e->by = lamina_pg_dup (res, i, 2);
      e->at = lamina_pg_dup (res, i, 3);
      e->date = lamina_pg_dup (res, i, 4);
      e->policy = lamina_pg_dup (res, i, 5);
      e->reason = lamina_pg_dup (res, i, 6);
      g_ptr_array_add (events, e);
    }
  PQclear (res);
  return events;
}

/* Import */

/* Import: 10,000 constructions should not cost 10,000 × 8 round trips.
 * The constructions' rows are locked and read in one statement, their
 * codes checked in one more, and then every statement that writes them is
 * sent in pipeline mode (lamina_pg_pipeline_begin), whose results are
 * read a batch at a time; the first failure rolls the whole import back
 * as before. */

/* Joins @n strings with the unit separator, which cleaned ids and codes
 * cannot hold (lamina_library_dup_clean_identity refuses control
 * characters), for string_to_array ($n, chr (31)). */
static char *
join_units (GPtrArray *strings)
{
  g_ptr_array_add (strings, NULL);
  return g_strjoinv ("\x1f", (char **) strings->pdata);
}

static gboolean
check_import_bases (LaminaPg                   *self,
                    const LaminaBackendImport  *import,
                    GError                    **error)
{
  g_autoptr(GPtrArray) ids = g_ptr_array_new ();
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  g_autoptr(GHashTable) rows = g_hash_table_new (g_str_hash, g_str_equal);
  PGresult *res;
  gboolean ok = TRUE;

  for (guint i = 0; i < import->revisions->len; i++)
    g_ptr_array_add (ids, ((LaminaBackendRevision *) import->revisions->pdata[i])->construction->id);
  g_ptr_array_add (params, join_units (ids));
  res = lamina_pg_query (self,
    "SELECT id, head, deleted_at IS NOT NULL FROM construction"
    " WHERE id = ANY (string_to_array ($1, chr (31))) ORDER BY id FOR UPDATE",
    params, "cannot read the constructions", error);
  if (res == NULL)
    return FALSE;
  for (int r = 0; r < PQntuples (res); r++)
    g_hash_table_insert (rows, (gpointer) lamina_pg_get (res, r, 0), GINT_TO_POINTER (r + 1));
  for (guint i = 0; ok && i < import->revisions->len; i++)
    {
      const LaminaConstruction *c = ((LaminaBackendRevision *) import->revisions->pdata[i])->construction;
      int r = GPOINTER_TO_INT (g_hash_table_lookup (rows, c->id)) - 1;

      ok = lamina_store_check_base (c, g_array_index (import->base_revisions, int, i),
                                    r >= 0 ? lamina_pg_int (res, r, 1) : 0,
                                    r >= 0 && lamina_pg_bool (res, r, 2), error);
    }
  PQclear (res);
  return ok;
}

/* Every code of the import against the live constructions not in it
 * with that code, and against each other (under the office-code lock). */
static gboolean
check_import_codes (LaminaPg                   *self,
                    const LaminaBackendImport  *import,
                    GError                    **error)
{
  g_autoptr(GPtrArray) ids = g_ptr_array_new ();
  g_autoptr(GPtrArray) codes = g_ptr_array_new ();
  g_autoptr(GPtrArray) params = lamina_pg_params_new ();
  g_autoptr(GHashTable) seen = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  PGresult *res;
  gboolean ok = TRUE;

  for (guint i = 0; i < import->revisions->len; i++)
    {
      const LaminaConstruction *c = ((LaminaBackendRevision *) import->revisions->pdata[i])->construction;
      g_autofree char *key = NULL;
      const LaminaConstruction *twin;

      if (c->code == NULL)
        continue;
      key = g_ascii_strdown (c->code, -1);
      twin = g_hash_table_lookup (seen, key);
      if (twin != NULL)
        {
          lamina_store_set_code_used_error (error, c->code, twin->name ? twin->name : twin->id);
          return FALSE;
        }
      g_hash_table_insert (seen, g_steal_pointer (&key), (gpointer) c);
      g_ptr_array_add (ids, c->id);
      g_ptr_array_add (codes, c->code);
    }
  if (codes->len == 0)
    return TRUE;
  g_ptr_array_add (params, join_units (codes));
  g_ptr_array_add (params, join_units (ids));
  res = lamina_pg_query (self,
    "SELECT t.code, c.name FROM unnest (string_to_array ($1, chr (31)),"
    "                                   string_to_array ($2, chr (31))) AS t (code, id)"
    "  JOIN construction c"
    "    ON lower (c.code) COLLATE \"C\" = lower (t.code) COLLATE \"C\""
    "   AND lower (c.code COLLATE \"C\") = lower (t.code COLLATE \"C\")"
    "   AND c.deleted_at IS NULL AND c.id <> t.id"
    " LIMIT 1", params, "cannot read the constructions", error);
  if (res == NULL)
    return FALSE;
  if (PQntuples (res) > 0)
    {
      lamina_store_set_code_used_error (error, lamina_pg_get (res, 0, 0), lamina_pg_get (res, 0, 1));
      ok = FALSE;
    }
  PQclear (res);
  return ok;
}

static gboolean
write_import_revisions (LaminaPg                   *self,
                        const LaminaBackendImport  *import,
                        GError                    **error)
{
  gboolean ok = TRUE, moisture = FALSE;

  /* Read before the pipeline: put_construction_row uses it. */
  lamina_pg_moisture_limit (self);
  if (!lamina_pg_pipeline_begin (self, error))
    return FALSE;
  for (guint i = 0; ok && i < import->revisions->len; i++)
    {
      const LaminaBackendRevision *rev = import->revisions->pdata[i];
      const LaminaConstruction *c = rev->construction;

      ok = put_construction_row (self, c, rev->result,
                                 g_array_index (import->base_revisions, int, i) == 0, error)
           && insert_revision_row (self, rev, error)
           && lamina_pg_index_revision (self, c, TRUE, error)
           && refresh_material_flag (self, c, error);
      moisture |= c->moisture != NULL;
    }
  if (!lamina_pg_pipeline_end (self, ok, error))
    return FALSE;
  /* Once for the whole import, not once per construction. */
  return !moisture || lamina_pg_refresh_climate_flags (self, NULL, error);
}

static gboolean
import_txn (LaminaPg  *self,
            gpointer   data,
            GError   **error)
{
  Write *w = data;
  const LaminaBackendImport *import = w->import;

  for (guint i = 0; import->climates != NULL && i < import->climates->len; i++)
    if (!lamina_pg_put_climate_in_txn (self, import->climates->pdata[i], w->now, error))
      return FALSE;
  for (guint i = 0; i < import->materials->len; i++)
    if (!lamina_pg_put_material_in_txn (self, import->materials->pdata[i], w->now, error))
      return FALSE;
  if (!lamina_pg_lock_codes (self, error)
      || !check_import_codes (self, import, error)
      || !check_import_bases (self, import, error)
      || !write_import_revisions (self, import, error))
    return FALSE;
  return lamina_pg_put_records (self, import->target_sets, import->jobs, w->now, error);
}

gboolean
lamina_pg_apply_import_records (LaminaBackend              *backend,
                                const LaminaBackendImport  *import,
                                const char                 *now,
                                GError                    **error)
{
  Write w = { .import = import, .now = now };
  GError *local = NULL;

  if (lamina_pg_transaction (SELF, import_txn, &w, &local))
    return TRUE;
  g_propagate_prefixed_error (error, local, "import cancelled, the library is unchanged: ");
  return FALSE;
}

gboolean
lamina_pg_apply_import (LaminaBackend  *backend,
                        GPtrArray      *materials,
                        GPtrArray      *revisions,
                        const GArray   *base_revisions,
                        const char     *now,
                        GError        **error)
{
  LaminaBackendImport import = { materials, revisions, base_revisions, NULL, NULL, NULL };

  return lamina_pg_apply_import_records (backend, &import, now, error);
}

char *
lamina_pg_find_code (LaminaBackend  *backend,
                     const char     *code,
                     const char     *except_id,
                     GError        **error)
{
  return find_code_row (SELF, code, except_id, NULL, error);
}

GPtrArray *
lamina_pg_list_ids (LaminaBackend  *backend,
                    GError        **error)
{
  PGresult *res = lamina_pg_query (SELF,
    "SELECT id FROM construction WHERE deleted_at IS NULL"
    " ORDER BY lower (code) COLLATE \"C\" NULLS FIRST, id COLLATE \"C\"",
    NULL, "cannot list the constructions", error);
  GPtrArray *ids;

  if (res == NULL)
    return NULL;
  ids = g_ptr_array_new_with_free_func (g_free);
  for (int i = 0; i < PQntuples (res); i++)
    g_ptr_array_add (ids, lamina_pg_dup (res, i, 0));
  PQclear (res);
  return ids;
}
