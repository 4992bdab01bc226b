/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-revisions.c: construction revisions, history and review
 * states in the SQLite backend. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#include "lamina-store-common.h"
#include "lamina-store-json.h"

#include <math.h>

#define SELF ((LaminaSqlite *) backend)

LaminaConstruction *
lamina_sqlite_backend_get_construction (LaminaBackend  *backend,
                                        const char     *id,
                                        int             revision,
                                        GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT r.body, r.revision, r.status, r.modified_by, r.modified_at,"
    "       r.checked_by, r.checked_at, r.approved_by, r.approved_at,"
    /* The policy and reason of the approval in force, for the sheet. */
    "       (SELECT e.policy FROM review_event e WHERE e.construction_id = c.id"
    "          AND e.revision = r.revision AND e.act = 'approved' ORDER BY e.num DESC LIMIT 1),"
    "       (SELECT e.reason FROM review_event e WHERE e.construction_id = c.id"
    "          AND e.revision = r.revision AND e.act = 'approved' ORDER BY e.num DESC LIMIT 1)"
    "  FROM construction c JOIN revision r ON r.construction_id = c.id"
    " WHERE c.id = ?1 AND c.deleted_at IS NULL"
    "   AND r.revision = CASE WHEN ?2 > 0 THEN ?2 ELSE c.head END;", error);
  LaminaConstruction *c = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, revision);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    {
      c = lamina_store_construction_from_json ((const char *) sqlite3_column_text (stmt, 0),
                                               error);
      if (c != NULL)
        {
          c->id = g_strdup (id);
          c->revision = sqlite3_column_int (stmt, 1);
          lamina_status_from_string ((const char *) sqlite3_column_text (stmt, 2), &c->status);
          c->modified_by = lamina_sqlite_column_dup (stmt, 3);
          c->modified_at = lamina_sqlite_column_dup (stmt, 4);
          c->checked_by = lamina_sqlite_column_dup (stmt, 5);
          c->checked_at = lamina_sqlite_column_dup (stmt, 6);
          c->approved_by = lamina_sqlite_column_dup (stmt, 7);
          c->approved_at = lamina_sqlite_column_dup (stmt, 8);
          if (c->status == LAMINA_STATUS_APPROVED)
            {
              c->approval_policy = lamina_sqlite_column_dup (stmt, 9);
              c->approval_reason = lamina_sqlite_column_dup (stmt, 10);
            }
        }
    }
  else if (rc == SQLITE_DONE)
    {
      if (revision > 0)
        g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                     "construction “%s” has no revision %d", id, revision);
      else
        g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                     "no construction “%s” in the library", id);
    }
  else
    lamina_sqlite_set_error (SELF, rc, "cannot read a construction", error);
  sqlite3_reset (stmt);
  return c;
}

int
lamina_sqlite_get_head (LaminaSqlite  *self,
                        const char    *id,
                        gboolean      *deleted,
                        LaminaStatus  *status,
                        GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "SELECT head, deleted_at IS NOT NULL, status FROM construction WHERE id = ?1;", error);
  int rc, head = 0;

  if (stmt == NULL)
    return -1;
  lamina_sqlite_bind_text (stmt, 1, id);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    {
      head = sqlite3_column_int (stmt, 0);
      if (deleted)
        *deleted = sqlite3_column_int (stmt, 1);
      if (status)
        lamina_status_from_string ((const char *) sqlite3_column_text (stmt, 2), status);
    }
  else if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (self, rc, "cannot read a construction", error);
      head = -1;
    }
  sqlite3_reset (stmt);
  return head;
}

/* @with_materials: the revision is new and its materials are recorded;
 * otherwise only the construction's tags and search row are rewritten. */
static gboolean
store_tags_and_materials (LaminaSqlite              *self,
                          const LaminaConstruction  *c,
                          gint64                     num,
                          gboolean                   with_materials,
                          GError                   **error)
{
  g_autoptr(GString) names = g_string_new (NULL);
  g_autoptr(GHashTable) materials = lamina_store_collect_materials (c, names);
  g_autofree char *tags = NULL;
  GHashTableIter iter;
  gpointer key, value;
  sqlite3_stmt *stmt;

  stmt = lamina_sqlite_prepare (self,
    "INSERT INTO revision_material (construction_id, revision, material_id, fingerprint)"
    " VALUES (?1, ?2, ?3, ?4);", error);
  if (stmt == NULL)
    return FALSE;
  g_hash_table_iter_init (&iter, materials);
  while (with_materials && g_hash_table_iter_next (&iter, &key, &value))
    {
      sqlite3_reset (stmt);
      lamina_sqlite_bind_text (stmt, 1, c->id);
      sqlite3_bind_int (stmt, 2, c->revision);
      lamina_sqlite_bind_text (stmt, 3, key);
      lamina_sqlite_bind_text (stmt, 4, value);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }

  stmt = lamina_sqlite_prepare (self,
    "DELETE FROM construction_tag WHERE construction_id = ?1;", error);
  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, c->id);
  if (!lamina_sqlite_step_done (self, stmt, error))
    return FALSE;
  stmt = lamina_sqlite_prepare (self,
    "INSERT OR IGNORE INTO construction_tag (construction_id, tag) VALUES (?1, ?2);", error);
  if (stmt == NULL)
    return FALSE;
  for (guint i = 0; i < c->tags->len; i++)
    {
      sqlite3_reset (stmt);
      lamina_sqlite_bind_text (stmt, 1, c->id);
      lamina_sqlite_bind_text (stmt, 2, c->tags->pdata[i]);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }

  /* The search index row (the construction's rowid) is staged and written
   * by flush_search_index() just before the commit. */
  stmt = lamina_sqlite_prepare (self,
    "INSERT OR REPLACE INTO construction_fts_stage (num, code, name, description, tags, materials)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6);", error);
  if (stmt == NULL)
    return FALSE;
  g_ptr_array_add (c->tags, NULL);
  tags = g_strjoinv (" ", (char **) c->tags->pdata);
  g_ptr_array_remove_index (c->tags, c->tags->len - 1);
  sqlite3_bind_int64 (stmt, 1, num);
  lamina_sqlite_bind_text (stmt, 2, c->code);
  lamina_sqlite_bind_text (stmt, 3, c->name);
  lamina_sqlite_bind_text (stmt, 4, c->description);
  lamina_sqlite_bind_text (stmt, 5, tags);
  lamina_sqlite_bind_text (stmt, 6, names->str);
  return lamina_sqlite_step_done (self, stmt, error);
}

/* Writes the staged search index rows in two statements.  FTS5 flushes
 * its pending terms to a new index segment at every statement that runs
 * while it is part of the transaction; touched once per construction in
 * an import, it wrote thousands of tiny segments and spent most of the
 * import merging them. */
static gboolean
flush_search_index (LaminaSqlite  *self,
                    GError       **error)
{
  return lamina_sqlite_exec (self,
           "DELETE FROM construction_fts WHERE rowid IN (SELECT num FROM construction_fts_stage);"
           "INSERT INTO construction_fts (rowid, code, name, description, tags, materials)"
           "  SELECT num, code, name, description, tags, materials FROM construction_fts_stage;"
           "DELETE FROM construction_fts_stage;", error);
}

/* Refuses a revision that does not go on top of the latest: a new
 * construction whose id is taken, an edit of a missing one, or an edit
 * of a revision someone else has since saved over. */
static gboolean
check_base (LaminaSqlite              *self,
            const LaminaConstruction  *c,
            int                        base,
            GError                   **error)
{
  gboolean deleted = FALSE;
  int head = lamina_sqlite_get_head (self, c->id, &deleted, NULL, error);

  if (head < 0)
    return FALSE;
  if (!lamina_store_check_base (c, base, head, deleted, error))
    return FALSE;
  g_assert (c->revision == (base > 0 ? base + 1 : c->revision) && c->revision > 0);
  return TRUE;
}

/* The construction's row: what the list and the search read (the figures
 * of its latest revision).  Sets @num, the row's number. */
static gboolean
put_construction_row (LaminaSqlite              *self,
                      const LaminaConstruction  *c,
                      const LaminaResult        *r,
                      gint64                    *num,
                      GError                   **error)
{
  LaminaStoreConstructionRow row;

  lamina_store_construction_row_for_revision (&row, c, r, lamina_sqlite_moisture_limit (self));
  return lamina_sqlite_put_construction_row (self, &row, num, error);
}

gboolean
lamina_sqlite_put_construction_row (LaminaSqlite                      *self,
                                    const LaminaStoreConstructionRow  *row,
                                    gint64                            *num,
                                    GError                           **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO construction (id, head, code, name, element, status, u, u_corrected,"
    "   target_u, thickness, flags, modified_at, deleted_at, material_changed)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14)"
    " ON CONFLICT (id) DO UPDATE SET head = ?2, code = ?3, name = ?4, element = ?5,"
    "   status = ?6, u = ?7, u_corrected = ?8, target_u = ?9, thickness = ?10,"
    "   flags = ?11, modified_at = ?12"
    " RETURNING num;", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, row->id);
  sqlite3_bind_int (stmt, 2, row->head);
  lamina_sqlite_bind_text (stmt, 3, row->code);
  lamina_sqlite_bind_text (stmt, 4, row->name);
  lamina_sqlite_bind_text (stmt, 5, row->element);
  lamina_sqlite_bind_text (stmt, 6, row->status);
  lamina_sqlite_bind_double (stmt, 7, row->u);
  lamina_sqlite_bind_double (stmt, 8, row->u_corrected);
  lamina_sqlite_bind_double (stmt, 9, row->target_u);
  lamina_sqlite_bind_double (stmt, 10, row->thickness);
  sqlite3_bind_int (stmt, 11, row->flags);
  lamina_sqlite_bind_text (stmt, 12, row->modified_at);
  lamina_sqlite_bind_text (stmt, 13, row->deleted_at);
  sqlite3_bind_int (stmt, 14, row->material_changed ? 1 : 0);
  if (sqlite3_step (stmt) != SQLITE_ROW)
    {
      lamina_sqlite_set_error (self, sqlite3_reset (stmt), "cannot store a construction", error);
      return FALSE;
    }
  *num = sqlite3_column_int64 (stmt, 0);
  sqlite3_reset (stmt);
  return TRUE;
}

/* The revision itself: its body (the construction as JSON), figures and
 * review fields. */
static gboolean
insert_revision_row (LaminaSqlite                 *self,
                     const LaminaBackendRevision  *rev,
                     GError                      **error)
{
  g_autofree char *body = lamina_store_construction_to_json (rev->construction);
  LaminaBackendRecordRevision row;

  lamina_store_revision_row_for (&row, rev, body);
  return lamina_sqlite_insert_revision (self, rev->construction->id, &row, error);
}

gboolean
lamina_sqlite_insert_revision (LaminaSqlite                       *self,
                               const char                         *id,
                               const LaminaBackendRecordRevision  *row,
                               GError                            **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO revision (construction_id, revision, status, body, u, u_corrected,"
    "   r_total, thickness, calc_error, modified_by, modified_at, checked_by,"
    "   checked_at, approved_by, approved_at, comment)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?15, ?16);",
    error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, row->revision);
  lamina_sqlite_bind_text (stmt, 3, lamina_status_to_string (row->status));
  lamina_sqlite_bind_text (stmt, 4, row->body);
  lamina_sqlite_bind_double (stmt, 5, row->u);
  lamina_sqlite_bind_double (stmt, 6, row->u_corrected);
  lamina_sqlite_bind_double (stmt, 7, row->r_total);
  lamina_sqlite_bind_double (stmt, 8, row->thickness);
  lamina_sqlite_bind_text (stmt, 9, row->calc_error);
  lamina_sqlite_bind_text (stmt, 10, row->modified_by);
  lamina_sqlite_bind_text (stmt, 11, row->modified_at);
  lamina_sqlite_bind_text (stmt, 12, row->checked_by);
  lamina_sqlite_bind_text (stmt, 13, row->checked_at);
  lamina_sqlite_bind_text (stmt, 14, row->approved_by);
  lamina_sqlite_bind_text (stmt, 15, row->approved_at);
  lamina_sqlite_bind_text (stmt, 16, row->comment);
  return lamina_sqlite_step_done (self, stmt, error);
}

/* "Material data changed since review" for the new revision: any of its
 * materials whose library data differs from the copy it holds. */
static gboolean
refresh_material_changed (LaminaSqlite              *self,
                          const LaminaConstruction  *c,
                          GError                   **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "UPDATE construction SET material_changed = EXISTS ("
    "    SELECT 1 FROM revision_material rm JOIN material m ON m.id = rm.material_id"
    "     WHERE rm.construction_id = ?1 AND rm.revision = ?2"
    "       AND m.fingerprint <> rm.fingerprint)"
    " WHERE id = ?1;", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, c->id);
  sqlite3_bind_int (stmt, 2, c->revision);
  if (!lamina_sqlite_step_done (self, stmt, error))
    return FALSE;
  return c->moisture == NULL || lamina_sqlite_refresh_climate_flags (self, c->moisture->climate, error);
}

/* Office codes are unique within a library: checked again inside the
 * write's transaction (BEGIN IMMEDIATE holds the write lock, so no other
 * writer can take the code between this check and the commit). */
static gboolean
check_code_free (LaminaSqlite              *self,
                 const LaminaConstruction  *c,
                 GError                   **error)
{
  sqlite3_stmt *stmt;
  g_autofree char *user = NULL;
  int rc;

  if (c->code == NULL)
    return TRUE;
  stmt = lamina_sqlite_prepare (self,
    "SELECT coalesce (name, id) FROM construction WHERE code = ?1 COLLATE NOCASE"
    "   AND id IS NOT ?2 AND deleted_at IS NULL ORDER BY num LIMIT 1;", error);
  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, c->code);
  lamina_sqlite_bind_text (stmt, 2, c->id);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    user = lamina_sqlite_column_dup (stmt, 0);
  else if (rc != SQLITE_DONE)
    lamina_sqlite_set_error (self, rc, "cannot read a construction", error);
  sqlite3_reset (stmt);
  if (rc != SQLITE_ROW && rc != SQLITE_DONE)
    return FALSE;
  if (user == NULL)
    return TRUE;
  lamina_store_set_code_used_error (error, c->code, user);
  return FALSE;
}

static gboolean
store_revision_in_txn (LaminaSqlite                 *self,
                       const LaminaBackendRevision  *rev,
                       int                           base,
                       GError                      **error)
{
  gint64 num;

  return check_base (self, rev->construction, base, error)
         && check_code_free (self, rev->construction, error)
         && put_construction_row (self, rev->construction, rev->result, &num, error)
         && insert_revision_row (self, rev, error)
         && store_tags_and_materials (self, rev->construction, num, TRUE, error)
         && refresh_material_changed (self, rev->construction, error);
}

gboolean
lamina_sqlite_backend_store_revision (LaminaBackend                *backend,
                                      const LaminaBackendRevision  *rev,
                                      int                           base_revision,
                                      GError                      **error)
{
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!store_revision_in_txn (SELF, rev, base_revision, error)
      || !flush_search_index (SELF, error)
      || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}

/* The stored state's stamp of revision @revision: 1 when it is @stamp,
 * 0 when not, -1 on error. */
static int
stamp_matches (LaminaSqlite  *self,
               const char    *id,
               int            revision,
               const char    *stamp,
               GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "SELECT json_extract (body, '$.draft_stamp') IS ?3 FROM revision"
    " WHERE construction_id = ?1 AND revision = ?2;", error);
  int rc, matches = 0;

  if (stmt == NULL)
    return -1;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, revision);
  lamina_sqlite_bind_text (stmt, 3, stamp);
  rc = sqlite3_step (stmt);
  if (rc == SQLITE_ROW)
    matches = sqlite3_column_int (stmt, 0);
  else if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (self, rc, "cannot read a construction", error);
      matches = -1;
    }
  sqlite3_reset (stmt);
  return matches;
}

/* The head must still be draft @draft of a live construction, in the
 * state @stamp names. */
static gboolean
check_draft_head (LaminaSqlite  *self,
                  const char    *id,
                  int            draft,
                  const char    *stamp,
                  GError       **error)
{
  LaminaStatus status = LAMINA_STATUS_DRAFT;
  gboolean deleted = FALSE;
  int head = lamina_sqlite_get_head (self, id, &deleted, &status, error);
  int same = 0;

  if (head < 0)
    return FALSE;
  if (head > 0 && !deleted && head == draft && status == LAMINA_STATUS_DRAFT
      && (same = stamp_matches (self, id, draft, stamp, error)) < 0)
    return FALSE;
  return lamina_store_check_draft_head (id, draft, head, deleted, status, same > 0, error);
}

/* Removes what belongs to draft revision @draft alone: its materials, a
 * stored 2-D check, and the revision row itself (a draft has no review
 * records). */
static gboolean
delete_draft_rows (LaminaSqlite  *self,
                   const char    *id,
                   int            draft,
                   GError       **error)
{
  static const char *const sql[] = {
    "DELETE FROM revision_material WHERE construction_id = ?1 AND revision = ?2;",
    "DELETE FROM field_check WHERE construction_id = ?1 AND revision = ?2;",
    "DELETE FROM revision WHERE construction_id = ?1 AND revision = ?2 AND status = 'draft';",
    /* store_revision_in_txn puts the new content on top of the one before. */
    "UPDATE construction SET head = ?2 - 1 WHERE id = ?1;",
  };

  for (guint i = 0; i < G_N_ELEMENTS (sql); i++)
    {
      sqlite3_stmt *stmt = lamina_sqlite_prepare (self, sql[i], error);

      if (stmt == NULL)
        return FALSE;
      lamina_sqlite_bind_text (stmt, 1, id);
      sqlite3_bind_int (stmt, 2, draft);
      if (!lamina_sqlite_step_done (self, stmt, error))
        return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_backend_replace_draft (LaminaBackend                *backend,
                                     const LaminaBackendRevision  *rev,
                                     const char                   *stamp,
                                     GError                      **error)
{
  const LaminaConstruction *c = rev->construction;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!check_draft_head (SELF, c->id, c->revision, stamp, error)
      || !delete_draft_rows (SELF, c->id, c->revision, error)
      || !store_revision_in_txn (SELF, rev, c->revision - 1, error)
      || !flush_search_index (SELF, error)
      || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}

gboolean
lamina_sqlite_backend_drop_draft (LaminaBackend                *backend,
                                  const LaminaBackendRevision  *previous,
                                  int                           draft,
                                  const char                   *stamp,
                                  GError                      **error)
{
  const LaminaConstruction *c = previous->construction;
  gint64 num;

  g_return_val_if_fail (c->revision == draft - 1, FALSE);
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!check_draft_head (SELF, c->id, draft, stamp, error)
      || !delete_draft_rows (SELF, c->id, draft, error)
      || !put_construction_row (SELF, c, previous->result, &num, error)
      || !store_tags_and_materials (SELF, c, num, FALSE, error)
      || !refresh_material_changed (SELF, c, error)
      || !flush_search_index (SELF, error)
      || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}

char *
lamina_sqlite_backend_find_code (LaminaBackend  *backend,
                                 const char     *code,
                                 const char     *except_id,
                                 GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id FROM construction WHERE code = ?1 COLLATE NOCASE AND id IS NOT ?2"
    "   AND deleted_at IS NULL ORDER BY num LIMIT 1;", error);

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, code);
  lamina_sqlite_bind_text (stmt, 2, except_id);
  return lamina_sqlite_step_dup_text (SELF, stmt, "cannot read a construction", error);
}

gboolean
lamina_sqlite_backend_set_deleted (LaminaBackend  *backend,
                                   const char     *id,
                                   const char     *when,
                                   GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_check_writable (SELF, error) ? lamina_sqlite_prepare (SELF,
    "UPDATE construction SET deleted_at = ?2"
    " WHERE id = ?1 AND (deleted_at IS NULL) = (?2 IS NOT NULL);", error) : NULL;

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, id);
  lamina_sqlite_bind_text (stmt, 2, when);
  if (!lamina_sqlite_step_done (SELF, stmt, error))
    return FALSE;
  if (sqlite3_changes (SELF->db) == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   when ? "no construction “%s” in the library"
                        : "no deleted construction “%s” in the library", id);
      return FALSE;
    }
  return TRUE;
}

static gpointer
read_revision_info_row (sqlite3_stmt *stmt)
{
  LaminaRevisionInfo *info = g_new0 (LaminaRevisionInfo, 1);

  info->revision = sqlite3_column_int (stmt, 0);
  lamina_status_from_string ((const char *) sqlite3_column_text (stmt, 1), &info->status);
  info->modified_by = lamina_sqlite_column_dup (stmt, 2);
  info->modified_at = lamina_sqlite_column_dup (stmt, 3);
  info->checked_by = lamina_sqlite_column_dup (stmt, 4);
  info->checked_at = lamina_sqlite_column_dup (stmt, 5);
  info->approved_by = lamina_sqlite_column_dup (stmt, 6);
  info->approved_at = lamina_sqlite_column_dup (stmt, 7);
  info->comment = lamina_sqlite_column_dup (stmt, 8);
  info->u_corrected = lamina_sqlite_column_double (stmt, 9);
  return info;
}

GPtrArray *
lamina_sqlite_backend_get_history (LaminaBackend  *backend,
                                   const char     *id,
                                   GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT revision, status, modified_by, modified_at, checked_by, checked_at,"
    "       approved_by, approved_at, comment, u_corrected"
    "  FROM revision WHERE construction_id = ?1 ORDER BY revision DESC;", error);
  g_autoptr(GPtrArray) list = NULL;

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  list = lamina_sqlite_read_rows (SELF, stmt, read_revision_info_row,
                                  (GDestroyNotify) lamina_revision_info_free, "cannot read the history", error);
  if (list != NULL && list->len == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no construction “%s” in the library", id);
      return NULL;
    }
  return g_steal_pointer (&list);
}

gboolean
lamina_sqlite_backend_apply_import_records (LaminaBackend              *backend,
                                            const LaminaBackendImport  *import,
                                            const char                 *now,
                                            GError                    **error)
{
  g_autoptr(GError) local = NULL;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  for (guint i = 0; import->climates != NULL && i < import->climates->len; i++)
    if (!lamina_sqlite_put_climate_in_txn (SELF, import->climates->pdata[i], now, &local))
      goto fail;
  for (guint i = 0; i < import->materials->len; i++)
    if (!lamina_sqlite_put_material (SELF, import->materials->pdata[i], now, &local))
      goto fail;
  for (guint i = 0; i < import->revisions->len; i++)
    if (!store_revision_in_txn (SELF, import->revisions->pdata[i],
                                g_array_index (import->base_revisions, int, i), &local))
      goto fail;
  if (!lamina_sqlite_put_records (SELF, import->target_sets, import->jobs, now, &local))
    goto fail;
  if (flush_search_index (SELF, &local) && lamina_sqlite_commit (SELF, &local))
    return TRUE;
fail:
  lamina_sqlite_rollback (SELF);
  g_propagate_prefixed_error (error, g_steal_pointer (&local),
                              "import cancelled, the library is unchanged: ");
  return FALSE;
}

gboolean
lamina_sqlite_backend_apply_import (LaminaBackend  *backend,
                                    GPtrArray      *materials,
                                    GPtrArray      *revisions,
                                    const GArray   *base_revisions,
                                    const char     *now,
                                    GError        **error)
{
  LaminaBackendImport import = { materials, revisions, base_revisions, NULL, NULL, NULL };

  return lamina_sqlite_backend_apply_import_records (backend, &import, now, error);
}

GPtrArray *
lamina_sqlite_backend_list_ids (LaminaBackend  *backend,
                                GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT id FROM construction WHERE deleted_at IS NULL"
    " ORDER BY code COLLATE NOCASE, id;", error);
  g_autoptr(GPtrArray) ids = NULL;
  int rc;

  if (stmt == NULL)
    return NULL;
  ids = g_ptr_array_new_with_free_func (g_free);
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    g_ptr_array_add (ids, lamina_sqlite_column_dup (stmt, 0));
  sqlite3_reset (stmt);
  if (rc != SQLITE_DONE)
    {
      lamina_sqlite_set_error (SELF, rc, "cannot list the constructions", error);
      return NULL;
    }
  return g_steal_pointer (&ids);
}


/* For lamina-sqlite-copy.c: a copied revision's material fingerprints,
 * the construction's tags and its staged search row, and the flush. */
gboolean
lamina_sqlite_index_revision (LaminaSqlite              *self,
                              const LaminaConstruction  *c,
                              gint64                     num,
                              GError                   **error)
{
  return store_tags_and_materials (self, c, num, TRUE, error);
}

gboolean
lamina_sqlite_flush_search_index (LaminaSqlite  *self,
                                  GError       **error)
{
  return flush_search_index (self, error);
}
