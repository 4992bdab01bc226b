/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-review.c: review acts (check, approve, withdraw) kept as
 * records, and the library's settings, in the SQLite backend. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#define SELF ((LaminaSqlite *) backend)

static const char *const act_names[] = { "checked", "approved", "withdrawn" };

/* What the act asks of the revision's state, checked inside the
 * transaction so that two reviewers cannot both pass. */
static gboolean
check_state (const LaminaBackendReview *r,
             int                        head,
             LaminaStatus               status,
             GError                   **error)
{
  if (head == 0)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND,
                   "no construction “%s” in the library", r->id);
      return FALSE;
    }
  if (r->revision > 0 && r->revision != head)
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE,
                   "construction “%s”: revision %d is not the latest (%d); "
                   "review the latest revision", r->id, r->revision, head);
      return FALSE;
    }
  switch (r->act)
    {
    case LAMINA_REVIEW_ACT_CHECK:
    case LAMINA_REVIEW_ACT_APPROVE:
      if (status == LAMINA_STATUS_APPROVED)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IMMUTABLE,
                       "construction “%s” revision %d is approved already; "
                       "an approved revision cannot change", r->id, head);
          return FALSE;
        }
      if (r->act == LAMINA_REVIEW_ACT_APPROVE && status != LAMINA_STATUS_CHECKED)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY,
                       "construction “%s” revision %d has not been checked; "
                       "only a checked revision can be approved", r->id, head);
          return FALSE;
        }
      return TRUE;
    case LAMINA_REVIEW_ACT_WITHDRAW:
    default:
      if (status != LAMINA_STATUS_APPROVED)
        {
          g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID,
                       "construction “%s” revision %d is not approved; there is no "
                       "approval to withdraw", r->id, head);
          return FALSE;
        }
      return TRUE;
    }
}

static gboolean
update_revision (LaminaSqlite              *self,
                 const LaminaBackendReview *r,
                 int                        head,
                 GError                   **error)
{
  static const char *const sql[] = {
    /* A second check keeps the first checker; its record is added below. */
    "UPDATE revision SET status = 'checked',"
    "   checked_by = coalesce (checked_by, ?3), checked_at = coalesce (checked_at, ?4)"
    " WHERE construction_id = ?1 AND revision = ?2;",
    "UPDATE revision SET status = 'approved', approved_by = ?3, approved_at = ?5"
    " WHERE construction_id = ?1 AND revision = ?2;",
    "UPDATE revision SET status = 'checked', approved_by = NULL, approved_at = NULL"
    " WHERE construction_id = ?1 AND revision = ?2;",
  };
  const char *status = r->act == LAMINA_REVIEW_ACT_APPROVE ? "approved" : "checked";
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self, sql[r->act], error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, r->id);
  sqlite3_bind_int (stmt, 2, head);
  lamina_sqlite_bind_text (stmt, 3, r->by);
  lamina_sqlite_bind_text (stmt, 4, r->at);
  lamina_sqlite_bind_text (stmt, 5, r->date);
  if (!lamina_sqlite_step_done (self, stmt, error))
    return FALSE;
  stmt = lamina_sqlite_prepare (self, "UPDATE construction SET status = ?2 WHERE id = ?1;", error);
  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, r->id);
  lamina_sqlite_bind_text (stmt, 2, status);
  if (!lamina_sqlite_step_done (self, stmt, error))
    return FALSE;

  return lamina_sqlite_insert_review_event (self, r->id, &(LaminaReviewEvent) {
      .revision = head,
      .act = (char *) act_names[r->act],
      .by = (char *) r->by,
      .at = (char *) r->at,
      .date = r->act == LAMINA_REVIEW_ACT_APPROVE ? (char *) r->date : NULL,
      .policy = r->act == LAMINA_REVIEW_ACT_WITHDRAW ? NULL : (char *) r->policy,
      .reason = (char *) r->reason,
    }, error);
}

gboolean
lamina_sqlite_insert_review_event (LaminaSqlite             *self,
                                   const char               *id,
                                   const LaminaReviewEvent  *e,
                                   GError                  **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self,
    "INSERT INTO review_event (construction_id, revision, act, person, at, date, policy, reason)"
    " VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8);", error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, id);
  sqlite3_bind_int (stmt, 2, e->revision);
  lamina_sqlite_bind_text (stmt, 3, e->act);
  lamina_sqlite_bind_text (stmt, 4, e->by);
  lamina_sqlite_bind_text (stmt, 5, e->at);
  lamina_sqlite_bind_text (stmt, 6, e->date);
  lamina_sqlite_bind_text (stmt, 7, e->policy);
  lamina_sqlite_bind_text (stmt, 8, e->reason);
  return lamina_sqlite_step_done (self, stmt, error);
}

gboolean
lamina_sqlite_backend_review (LaminaBackend             *backend,
                              const LaminaBackendReview *review,
                              GError                   **error)
{
  LaminaStatus status = LAMINA_STATUS_DRAFT;
  gboolean deleted = FALSE;
  int head;

  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  head = lamina_sqlite_get_head (SELF, review->id, &deleted, &status, error);
  if (head > 0 && deleted)
    head = 0;   /* a deleted construction is not reviewed */
  if (head < 0 || !check_state (review, head, status, error)
      || !update_revision (SELF, review, head, error) || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}

static gpointer
read_review_event_row (sqlite3_stmt *stmt)
{
  return lamina_sqlite_read_review_event (stmt, 0);
}

GPtrArray *
lamina_sqlite_backend_get_review_events (LaminaBackend  *backend,
                                         const char     *id,
                                         GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF,
    "SELECT revision, act, person, at, date, policy, reason FROM review_event"
    " WHERE construction_id = ?1 ORDER BY num;", error);

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, id);
  return lamina_sqlite_read_rows (SELF, stmt, read_review_event_row,
                                  (GDestroyNotify) lamina_review_event_free,
                                  "cannot read the review records", error);
}

char *
lamina_sqlite_backend_get_setting (LaminaBackend  *backend,
                                   const char     *key,
                                   GError        **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (SELF, "SELECT value FROM meta WHERE key = ?1;", error);

  if (stmt == NULL)
    return NULL;
  lamina_sqlite_bind_text (stmt, 1, key);
  return lamina_sqlite_step_dup_text (SELF, stmt, "cannot read the library settings", error);
}

gboolean
lamina_sqlite_put_setting_in_txn (LaminaSqlite  *self,
                                  const char    *key,
                                  const char    *value,
                                  GError       **error)
{
  sqlite3_stmt *stmt = lamina_sqlite_prepare (self, "INSERT OR REPLACE INTO meta (key, value) VALUES (?1, ?2);",
                                              error);

  if (stmt == NULL)
    return FALSE;
  lamina_sqlite_bind_text (stmt, 1, key);
  lamina_sqlite_bind_text (stmt, 2, value);
  return lamina_sqlite_step_done (self, stmt, error);
}

gboolean
lamina_sqlite_backend_set_setting (LaminaBackend  *backend,
                                   const char     *key,
                                   const char     *value,
                                   GError        **error)
{
  if (!lamina_sqlite_begin (SELF, error))
    return FALSE;
  if (!lamina_sqlite_put_setting_in_txn (SELF, key, value, error) || !lamina_sqlite_commit (SELF, error))
    {
      lamina_sqlite_rollback (SELF);
      return FALSE;
    }
  return TRUE;
}
