/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sqlite-private.h: the SQLite backend's shared state (private).
 * The helpers (lamina_sqlite_prepare … column_dup) are in
 * lamina-sqlite-util.c. */
#pragma once

#include <sqlite3.h>

#include "lamina-library-backend.h"
#include "lamina-store-common.h"

G_BEGIN_DECLS

/* 'LMNA': PRAGMA application_id of a Lamina library. */
#define LAMINA_SQLITE_APPLICATION_ID 0x4C4D4E41

/* How a text search in a sort key's order finds its page
 * (lamina-sqlite-search.c); tests force each plan to compare them. */
typedef enum
{
  LAMINA_SQLITE_SEARCH_AUTO,          /* SORT_SET for few matches; for many, WALK
                                         for a few hundred rows, then ROW_SET */
  LAMINA_SQLITE_SEARCH_SET_IN_ORDER,  /* all matches collected, the sort index walked */
  LAMINA_SQLITE_SEARCH_SORT_SET,      /* all matches collected and sorted */
  LAMINA_SQLITE_SEARCH_WALK,          /* the sort index walked, each row's text tested */
  LAMINA_SQLITE_SEARCH_ROW_SET,       /* the matches marked in a bit set, the sort index walked */
  LAMINA_SQLITE_SEARCH_IN_ORDER,      /* a text search alone: the matches marked in a bit
                                         set (kept for the count and further pages), the
                                         sort order read from memory */
} LaminaSqliteSearchPlan;

/* lamina-sqlite-search.c: one sort key's order and the last text
 * search's matches, kept in memory while the library is unchanged. */
typedef struct _LaminaSqliteOrder LaminaSqliteOrder;
typedef struct _LaminaSqliteMatches LaminaSqliteMatches;
void lamina_sqlite_order_free   (LaminaSqliteOrder   *order);
void lamina_sqlite_matches_free (LaminaSqliteMatches *matches);

typedef struct
{
  LaminaBackend  parent;
  sqlite3       *db;
  GHashTable    *statements;    /* SQL text → sqlite3_stmt*, reused */
  gint64         data_version;  /* PRAGMA data_version at the last check */
  gint64         busy_since;    /* monotonic µs: when the present wait began */
  gboolean       busy_announced;
  /* The full-text index's own tokenizer, for testing rows against a
   * search in sort order (lamina-sqlite-search.c); created on first use. */
  fts5_tokenizer tokenizer_class;
  Fts5Tokenizer *tokenizer;
  gboolean       tokenizer_failed;
  gboolean       marker_ready;  /* lamina_mark_match is registered */
  LaminaSqliteSearchPlan search_plan;
  LaminaSqliteOrder   *order;
  LaminaSqliteMatches *matches;
} LaminaSqlite;

/* A cached prepared statement, reset and with bindings cleared; NULL with
 * @error set. */
sqlite3_stmt *lamina_sqlite_prepare   (LaminaSqlite  *self,
                                       const char    *sql,
                                       GError       **error);
/* Sets @error from the connection's last error (BUSY, CORRUPT, … mapped
 * to LAMINA_LIBRARY_ERROR codes), prefixed by @what. */
void          lamina_sqlite_set_error (LaminaSqlite  *self,
                                       int            rc,
                                       const char    *what,
                                       GError       **error);
gboolean      lamina_sqlite_exec      (LaminaSqlite  *self,
                                       const char    *sql,
                                       GError       **error);
/* BEGIN IMMEDIATE: every write transaction reads first. */
gboolean      lamina_sqlite_begin     (LaminaSqlite  *self,
                                       GError       **error);
gboolean      lamina_sqlite_commit    (LaminaSqlite  *self,
                                       GError       **error);
void          lamina_sqlite_rollback  (LaminaSqlite  *self);
/* Runs a prepared statement that returns no rows. */
gboolean      lamina_sqlite_step_done (LaminaSqlite  *self,
                                       sqlite3_stmt  *stmt,
                                       GError       **error);
void          lamina_sqlite_bind_text   (sqlite3_stmt *stmt,
                                         int           index,
                                         const char   *text);
void          lamina_sqlite_bind_double (sqlite3_stmt *stmt,
                                         int           index,
                                         double        value);
double        lamina_sqlite_column_double (sqlite3_stmt *stmt,
                                           int           index);
char         *lamina_sqlite_column_dup    (sqlite3_stmt *stmt,
                                           int           index);

/* One row of a result as a new item. */
typedef gpointer (*LaminaSqliteReadRow) (sqlite3_stmt *stmt);

/* Steps @stmt (prepared and bound) through its rows: an array of
 * @read_row's items (freed by @free_item), or NULL with @error set,
 * prefixed by @what ("cannot read the materials"). */
GPtrArray    *lamina_sqlite_read_rows     (LaminaSqlite         *self,
                                           sqlite3_stmt         *stmt,
                                           LaminaSqliteReadRow   read_row,
                                           GDestroyNotify        free_item,
                                           const char           *what,
                                           GError              **error);
/* The first column of @stmt's first row (prepared and bound), or NULL:
 * without an error when there is no row or the value is NULL, with
 * @error set (prefixed by @what) when the read fails. */
char         *lamina_sqlite_step_dup_text (LaminaSqlite         *self,
                                           sqlite3_stmt         *stmt,
                                           const char           *what,
                                           GError              **error);
/* The one row of @stmt read by @read_row, or NULL with NOT_FOUND ("no
 * @kind “@id” in the library") or the database's error set. */
gpointer      lamina_sqlite_read_one      (LaminaSqlite         *self,
                                           sqlite3_stmt         *stmt,
                                           LaminaSqliteReadRow   read_row,
                                           const char           *kind,
                                           const char           *id,
                                           GError              **error);
/* A review record from the 7 columns revision, act, person, at, date,
 * policy, reason starting at @first. */
LaminaReviewEvent *lamina_sqlite_read_review_event (sqlite3_stmt *stmt,
                                                    int           first);
/* lamina-sqlite-review.c: one review record @e of construction @id. */
gboolean      lamina_sqlite_insert_review_event (LaminaSqlite             *self,
                                                 const char               *id,
                                                 const LaminaReviewEvent  *e,
                                                 GError                  **error);
/* lamina-sqlite-field.c: the 2-D check @body of a revision, computed
 * @at, stored (or replacing the one stored) inside the caller's
 * transaction. */
gboolean      lamina_sqlite_put_field_check_in_txn (LaminaSqlite  *self,
                                                    const char    *id,
                                                    int            revision,
                                                    const char    *body,
                                                    const char    *at,
                                                    GError       **error);

/* lamina-sqlite-safety.c: waiting for another program's write lock. */
void          lamina_sqlite_install_busy_handler (LaminaSqlite *self);
/* Tells the wait function that a wait (if any) is over. */
void          lamina_sqlite_end_wait             (LaminaSqlite *self);
/* "which program holds the write lock" (from /proc/locks), or NULL. */
char         *lamina_sqlite_dup_lock_holder      (LaminaSqlite *self);
void          lamina_sqlite_set_busy_error       (LaminaSqlite  *self,
                                                  GError       **error);
/* Refuses a write to a read-only library (FALSE, @error set). */
gboolean      lamina_sqlite_check_writable       (LaminaSqlite  *self,
                                                  GError       **error);
gboolean      lamina_sqlite_backend_probe_write (LaminaBackend  *backend,
                                                 GError        **error);
gboolean      lamina_sqlite_backend_verify_storage (LaminaBackend *backend,
                                                    GPtrArray     *problems,
                                                    GError       **error);
gboolean      lamina_sqlite_backend_backup_to    (LaminaBackend *backend,
                                                  const char    *dest,
                                                  GError       **error);
gboolean      lamina_sqlite_backend_restore_from (LaminaBackend *backend,
                                                  const char    *source,
                                                  GError       **error);

/* lamina-sqlite-schema.c: migration steps.  Step n brings a file from
 * user_version n to n + 1; a new file runs every step from 0. */
gboolean      lamina_sqlite_migrate   (LaminaSqlite  *self,
                                       int            from,
                                       int            to,
                                       GError       **error);
/* lamina-seed.c */
gboolean      lamina_sqlite_seed_materials (LaminaSqlite *self,
                                            GError      **error);

/* The backend's operations (LaminaBackendVTable), gathered into its one
 * table in lamina-sqlite-open.c.  lamina-sqlite-store.c: */
GPtrArray          *lamina_sqlite_backend_list_materials   (LaminaBackend *backend,
                                                            GError **error);
LaminaMaterial     *lamina_sqlite_backend_get_material     (LaminaBackend *backend,
                                                            const char *id,
                                                            GError **error);
gboolean            lamina_sqlite_backend_put_material     (LaminaBackend *backend,
                                                            const LaminaMaterial *material,
                                                            const char *now,
                                                            GError **error);
/* lamina-sqlite-revisions.c: */
LaminaConstruction *lamina_sqlite_backend_get_construction (LaminaBackend *backend,
                                                            const char *id,
                                                            int revision,
                                                            GError **error);
gboolean            lamina_sqlite_backend_store_revision   (LaminaBackend *backend,
                                                            const LaminaBackendRevision *rev,
                                                            int base_revision,
                                                            GError **error);
gboolean            lamina_sqlite_backend_replace_draft    (LaminaBackend *backend,
                                                            const LaminaBackendRevision *rev,
                                                            const char *stamp,
                                                            GError **error);
gboolean            lamina_sqlite_backend_drop_draft       (LaminaBackend *backend,
                                                            const LaminaBackendRevision *previous,
                                                            int draft,
                                                            const char *stamp,
                                                            GError **error);
char               *lamina_sqlite_backend_find_code        (LaminaBackend *backend,
                                                            const char *code,
                                                            const char *except_id,
                                                            GError **error);
gboolean            lamina_sqlite_backend_set_deleted      (LaminaBackend *backend,
                                                            const char *id,
                                                            const char *when,
                                                            GError **error);
GPtrArray          *lamina_sqlite_backend_get_history      (LaminaBackend *backend,
                                                            const char *id,
                                                            GError **error);
/* lamina-sqlite-review.c */
gboolean            lamina_sqlite_backend_review           (LaminaBackend *backend,
                                                            const LaminaBackendReview *review,
                                                            GError **error);
GPtrArray          *lamina_sqlite_backend_get_review_events (LaminaBackend *backend,
                                                            const char *id,
                                                            GError **error);
char               *lamina_sqlite_backend_get_setting      (LaminaBackend *backend,
                                                            const char *key,
                                                            GError **error);
gboolean            lamina_sqlite_backend_set_setting      (LaminaBackend *backend,
                                                            const char *key,
                                                            const char *value,
                                                            GError **error);
gboolean            lamina_sqlite_backend_apply_import     (LaminaBackend *backend,
                                                            GPtrArray *materials,
                                                            GPtrArray *revisions,
                                                            const GArray *base_revisions,
                                                            const char *now,
                                                            GError **error);
GPtrArray          *lamina_sqlite_backend_list_ids         (LaminaBackend *backend,
                                                            GError **error);
/* lamina-sqlite-climates.c: */
GPtrArray          *lamina_sqlite_backend_list_climates    (LaminaBackend *backend,
                                                            GError **error);
LaminaClimate      *lamina_sqlite_backend_get_climate      (LaminaBackend *backend,
                                                            const char *id,
                                                            GError **error);
gboolean            lamina_sqlite_backend_put_climate      (LaminaBackend *backend,
                                                            const LaminaClimate *climate,
                                                            const char *now,
                                                            GError **error);
/* Sets the "changed since review" flag of every construction whose latest
 * revision was checked with other data for climate @climate_id (NULL:
 * any); run after the material flags, which it only adds to. */
gboolean            lamina_sqlite_backend_delete_climate   (LaminaBackend *backend,
                                                            const char    *id,
                                                            GError       **error);
gboolean            lamina_sqlite_backend_set_moisture_limit (LaminaBackend *backend,
                                                              const char    *value,
                                                              double         limit,
                                                              GError       **error);
/* lamina-sqlite-review.c: a library setting inside the caller's
 * transaction. */
gboolean            lamina_sqlite_put_setting_in_txn       (LaminaSqlite *self,
                                                            const char   *key,
                                                            const char   *value,
                                                            GError      **error);
/* The office's moisture limit the library holds, NAN when unset. */
double              lamina_sqlite_moisture_limit           (LaminaSqlite *self);
/* Adds or replaces @climate inside the caller's transaction. */
gboolean            lamina_sqlite_put_climate_in_txn       (LaminaSqlite *self,
                                                            const LaminaClimate *climate,
                                                            const char   *now,
                                                            GError      **error);
gboolean            lamina_sqlite_refresh_climate_flags    (LaminaSqlite *self,
                                                            const char   *climate_id,
                                                            GError      **error);
/* lamina-sqlite-search.c: */
GPtrArray          *lamina_sqlite_backend_search           (LaminaBackend *backend,
                                                            const LaminaLibraryQuery *query,
                                                            GError **error);
gint64              lamina_sqlite_backend_count            (LaminaBackend *backend,
                                                            const LaminaLibraryQuery *query,
                                                            GError **error);
gint64              lamina_sqlite_backend_count_at_most    (LaminaBackend *backend,
                                                            const LaminaLibraryQuery *query,
                                                            gint64 at_most,
                                                            GError **error);
/* Frees the search's tokenizer; before the connection closes. */
void                lamina_sqlite_search_clear             (LaminaSqlite *self);
GPtrArray          *lamina_sqlite_backend_list_tags        (LaminaBackend *backend,
                                                            GError **error);

/* lamina-sqlite-field.c: the body of the 2-D check of a revision, NULL
 * (no error) when there is none. */
char               *lamina_sqlite_backend_get_field_check  (LaminaBackend *backend,
                                                            const char *id,
                                                            int revision,
                                                            GError **error);
gboolean            lamina_sqlite_backend_put_field_check  (LaminaBackend *backend,
                                                            const char *id,
                                                            int revision,
                                                            const char *body,
                                                            const char *now,
                                                            GError **error);
/* lamina-sqlite-jobs.c: */
GPtrArray          *lamina_sqlite_backend_list_target_sets (LaminaBackend *backend,
                                                            GError **error);
gboolean            lamina_sqlite_backend_put_target_set   (LaminaBackend *backend,
                                                            const LaminaTargetSet *set,
                                                            const char *now,
                                                            GError **error);
gboolean            lamina_sqlite_backend_delete_target_set (LaminaBackend *backend,
                                                             const char *id,
                                                             GError **error);
GPtrArray          *lamina_sqlite_backend_list_jobs        (LaminaBackend *backend,
                                                            GError **error);
LaminaJob          *lamina_sqlite_backend_get_job          (LaminaBackend *backend,
                                                            const char *id,
                                                            GError **error);
gboolean            lamina_sqlite_backend_put_job          (LaminaBackend *backend,
                                                            const LaminaJob *job,
                                                            gboolean create,
                                                            GError **error);
gboolean            lamina_sqlite_backend_delete_job       (LaminaBackend *backend,
                                                            const char *id,
                                                            GError **error);
GPtrArray          *lamina_sqlite_backend_list_job_uses    (LaminaBackend *backend,
                                                            const char *construction_id,
                                                            GError **error);
gboolean            lamina_sqlite_backend_apply_import_records (LaminaBackend *backend,
                                                                const LaminaBackendImport *import,
                                                                const char *now,
                                                                GError **error);
/* Inside the caller's transaction. */
gboolean      lamina_sqlite_put_target_set (LaminaSqlite          *self,
                                            const LaminaTargetSet *set,
                                            const char            *now,
                                            GError               **error);
gboolean      lamina_sqlite_put_job        (LaminaSqlite          *self,
                                            const LaminaJob       *job,
                                            GError               **error);
gboolean      lamina_sqlite_put_records    (LaminaSqlite          *self,
                                            GPtrArray             *target_sets,
                                            GPtrArray             *jobs,
                                            const char            *now,
                                            GError               **error);

/* Refreshes the "material data changed since review" flag of every
 * construction using @material_id (NULL: all). */
gboolean      lamina_sqlite_refresh_material_flags (LaminaSqlite *self,
                                                    const char   *material_id,
                                                    GError      **error);

/* Inside the caller's transaction. */
gboolean      lamina_sqlite_put_material (LaminaSqlite          *self,
                                          const LaminaMaterial  *material,
                                          const char            *now,
                                          GError               **error);

/* lamina-sqlite-revisions.c, for lamina-sqlite-copy.c (inside the
 * caller's transaction): the indexes of one stored revision of the
 * construction row @num, and the staged search rows. */
gboolean      lamina_sqlite_index_revision     (LaminaSqlite              *self,
                                                const LaminaConstruction  *c,
                                                gint64                     num,
                                                GError                   **error);
/* The head revision of construction @id, whether it is deleted and its
 * status (either may be NULL); 0 if there is no such construction, -1
 * on error. */
int           lamina_sqlite_get_head            (LaminaSqlite      *self,
                                                 const char        *id,
                                                 gboolean          *deleted,
                                                 LaminaStatus      *status,
                                                 GError           **error);
/* A construction's row: inserted, or its head, figures and flags updated
 * (its deleted_at and material_changed then stay); sets @num, the row's
 * number. */
gboolean      lamina_sqlite_put_construction_row (LaminaSqlite                      *self,
                                                  const LaminaStoreConstructionRow  *row,
                                                  gint64                            *num,
                                                  GError                           **error);
/* One revision row as given (the stored figures, people and dates). */
gboolean      lamina_sqlite_insert_revision    (LaminaSqlite                       *self,
                                                const char                         *id,
                                                const LaminaBackendRecordRevision  *row,
                                                GError                            **error);
gboolean      lamina_sqlite_flush_search_index (LaminaSqlite              *self,
                                                GError                   **error);
/* lamina-sqlite-copy.c */
gboolean           lamina_sqlite_backend_read_snapshot (LaminaBackend          *backend,
                                                        LaminaBackendReadFunc   func,
                                                        gpointer                data,
                                                        GError                **error);
gboolean           lamina_sqlite_backend_read_rows (LaminaBackend         *backend,
                                                    const char            *sql,
                                                    const char            *types,
                                                    LaminaBackendRowFunc   row,
                                                    gpointer               data,
                                                    const char            *what,
                                                    GError               **error);
gboolean           lamina_sqlite_backend_write_all (LaminaBackend            *backend,
                                                    const LaminaBackendDump  *dump,
                                                    GError                  **error);

/* For tests: creates a library file at schema @version (1 …) without
 * seeding, so migrations can be tested from every earlier schema. */
gboolean      lamina_sqlite_create_at_version (const char *path,
                                               int         version,
                                               GError    **error);

G_END_DECLS
