/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-pg-private.h: the PostgreSQL backend's shared state (private).
 *
 * One connection per LaminaLibrary; every statement is prepared once per
 * connection (by its SQL text) and run with text parameters.  Every write
 * is one transaction at READ COMMITTED that locks the rows it decides on
 * (SELECT … FOR UPDATE), retried whole when the server reports a
 * serialization failure or a deadlock. */
#pragma once

#include <libpq-fe.h>

#include "lamina-library-backend.h"
#include "lamina-store-common.h"

G_BEGIN_DECLS

/* The channel every write notifies (schema triggers) and every open
 * connection listens on. */
#define LAMINA_PG_CHANNEL "lamina_library_changed"

typedef struct
{
  LaminaBackend  parent;
  PGconn        *conn;
  char          *label;        /* the conninfo for messages, without a password */
  GHashTable    *statements;   /* SQL text → prepared statement name */
  guint          n_statements;
  char           sqlstate[6];  /* of the last failed statement, or "" */
  gboolean       roles;        /* server-init ran: the review acts go through
                                * the SECURITY DEFINER functions */
  gboolean       limit_read;   /* moisture_limit holds the setting, read in
                                * this transaction (an import reads it once) */
  double         moisture_limit;
  gboolean       pipeline;     /* lamina_pg_run sends without waiting */
  GPtrArray     *pending;      /* what the pipeline still owes */
  char          *password;     /* given to open, or NULL */
  PGconn        *watch;        /* asks who holds a lock we wait for */
  gboolean       watch_failed;
  char          *announced_holder;
  gboolean       codes_locked; /* this transaction holds the office-code
                                * lock exclusively (an import) */
} LaminaPg;

/* Parameters of a statement: owned strings, NULL for SQL NULL.  Each
 * add returns the parameter's number for the SQL text ($n). */
GPtrArray    *lamina_pg_params_new     (void);
int           lamina_pg_add_text       (GPtrArray *params, const char *text);
int           lamina_pg_add_int        (GPtrArray *params, gint64 value);
/* NAN is NULL. */
int           lamina_pg_add_double     (GPtrArray *params, double value);

/* Runs @sql (prepared once per connection) with @params (may be NULL);
 * the result (tuples or command OK) or NULL with @error set from the
 * server's message, prefixed by @what.  PQclear the result. */
PGresult     *lamina_pg_query          (LaminaPg    *self,
                                        const char  *sql,
                                        GPtrArray   *params,
                                        const char  *what,
                                        GError     **error);
/* The same for statements without a result. */
gboolean      lamina_pg_run            (LaminaPg    *self,
                                        const char  *sql,
                                        GPtrArray   *params,
                                        const char  *what,
                                        GError     **error);
/* Runs one or more statements without parameters (not prepared). */
gboolean      lamina_pg_exec           (LaminaPg    *self,
                                        const char  *sql,
                                        GError     **error);
/* Sets @error from a failed result (SQLSTATE mapped to a
 * LAMINA_LIBRARY_ERROR code). */
void          lamina_pg_set_error      (LaminaPg        *self,
                                        const PGresult  *res,
                                        const char      *what,
                                        GError         **error);

/* Pipeline mode (libpq 14 and later), for writes of many rows: from
 * begin to end, lamina_pg_run sends its statement and returns, and the
 * results are read a batch at a time (sync); a failure shows at the next
 * sync or at the end, and the transaction is then rolled back whole as
 * always.  lamina_pg_query and lamina_pg_exec cannot be used meanwhile.
 * end with @ok FALSE only reads what is owed and leaves the mode. */
gboolean      lamina_pg_pipeline_begin (LaminaPg *self, GError **error);
gboolean      lamina_pg_pipeline_sync  (LaminaPg *self, GError **error);
gboolean      lamina_pg_pipeline_end   (LaminaPg *self, gboolean ok, GError **error);

typedef gboolean (*LaminaPgTxnFunc) (LaminaPg *self, gpointer data, GError **error);
/* BEGIN, @func, COMMIT; rolled back on failure, run again (a few times)
 * when the server asks for it (serialization failure, deadlock). */
gboolean      lamina_pg_transaction    (LaminaPg        *self,
                                        LaminaPgTxnFunc  func,
                                        gpointer         data,
                                        GError         **error);

/* Reading a result: NULL, NAN or 0 for SQL NULL. */
char         *lamina_pg_dup            (const PGresult *res, int row, int col);
const char   *lamina_pg_get            (const PGresult *res, int row, int col);
double        lamina_pg_double         (const PGresult *res, int row, int col);
int           lamina_pg_int            (const PGresult *res, int row, int col);
gboolean      lamina_pg_bool           (const PGresult *res, int row, int col);

/* "Changed" rows of an UPDATE or DELETE. */
gint64        lamina_pg_changes        (const PGresult *res);

/* lamina-pg-open.c: connects and sets the session up. */
LaminaPg     *lamina_pg_connect        (const char *conninfo, const char *password,
                                        GError **error);
/* A bare connection to @conninfo (with @password unless NULL, the
 * program's name as the server shows it, a bounded connect time that
 * @conninfo may change); check PQstatus. */
PGconn       *lamina_pg_connect_raw    (const char *conninfo, const char *password);

/* lamina-pg-schema.c: migration steps, as lamina-sqlite-schema.c. */
gboolean      lamina_pg_migrate        (LaminaPg *self, int from, int to, GError **error);

/* The operations (LaminaBackendVTable), gathered in lamina-pg-open.c.
 * lamina-pg-store.c: materials, settings, climates, 2-D checks. */
GPtrArray          *lamina_pg_list_materials   (LaminaBackend *backend, GError **error);
LaminaMaterial     *lamina_pg_get_material     (LaminaBackend *backend, const char *id,
                                                GError **error);
gboolean            lamina_pg_put_material     (LaminaBackend *backend,
                                                const LaminaMaterial *material,
                                                const char *now, GError **error);
gboolean            lamina_pg_put_material_in_txn (LaminaPg *self,
                                                   const LaminaMaterial *material,
                                                   const char *now, GError **error);
gboolean            lamina_pg_refresh_material_flags (LaminaPg *self, const char *material_id,
                                                      GError **error);
gboolean            lamina_pg_refresh_climate_flags (LaminaPg *self, const char *climate_id,
                                                     GError **error);
gboolean            lamina_pg_seed_materials   (LaminaPg *self, GError **error);
char               *lamina_pg_get_setting      (LaminaBackend *backend, const char *key,
                                                GError **error);
gboolean            lamina_pg_set_setting      (LaminaBackend *backend, const char *key,
                                                const char *value, GError **error);
GPtrArray          *lamina_pg_list_climates    (LaminaBackend *backend, GError **error);
LaminaClimate      *lamina_pg_get_climate      (LaminaBackend *backend, const char *id,
                                                GError **error);
gboolean            lamina_pg_put_climate_in_txn (LaminaPg *self, const LaminaClimate *climate,
                                                  const char *now, GError **error);
gboolean            lamina_pg_put_climate      (LaminaBackend *backend,
                                                const LaminaClimate *climate,
                                                const char *now, GError **error);
gboolean            lamina_pg_delete_climate   (LaminaBackend *backend, const char *id,
                                                GError **error);
gboolean            lamina_pg_set_moisture_limit (LaminaBackend *backend, const char *value,
                                                  double limit, GError **error);
gboolean            lamina_pg_verify_storage   (LaminaBackend *backend, GPtrArray *problems,
                                                GError **error);
/* The office's moisture limit, from the settings. */
double              lamina_pg_moisture_limit   (LaminaPg *self);
char               *lamina_pg_get_field_check  (LaminaBackend *backend, const char *id,
                                                int revision, GError **error);
gboolean            lamina_pg_put_field_check  (LaminaBackend *backend, const char *id,
                                                int revision, const char *body,
                                                const char *now, GError **error);
/* lamina-pg-revisions.c: constructions, revisions, review, import. */
LaminaConstruction *lamina_pg_get_construction (LaminaBackend *backend, const char *id,
                                                int revision, GError **error);
gboolean            lamina_pg_store_revision   (LaminaBackend *backend,
                                                const LaminaBackendRevision *rev,
                                                int base_revision, GError **error);
gboolean            lamina_pg_set_deleted      (LaminaBackend *backend, const char *id,
                                                const char *when, GError **error);
GPtrArray          *lamina_pg_get_history      (LaminaBackend *backend, const char *id,
                                                GError **error);
gboolean            lamina_pg_review           (LaminaBackend *backend,
                                                const LaminaBackendReview *review,
                                                GError **error);
GPtrArray          *lamina_pg_get_review_events (LaminaBackend *backend, const char *id,
                                                 GError **error);
gboolean            lamina_pg_apply_import     (LaminaBackend *backend, GPtrArray *materials,
                                                GPtrArray *revisions,
                                                const GArray *base_revisions,
                                                const char *now, GError **error);
gboolean            lamina_pg_apply_import_records (LaminaBackend *backend,
                                                    const LaminaBackendImport *import,
                                                    const char *now, GError **error);
/* Takes the office-code lock exclusively until the commit (before any
 * write that sets many constructions' codes: an import, a copy). */
gboolean            lamina_pg_lock_codes       (LaminaPg *self, GError **error);
GPtrArray          *lamina_pg_list_ids         (LaminaBackend *backend, GError **error);
char               *lamina_pg_find_code        (LaminaBackend *backend, const char *code,
                                                const char *except_id, GError **error);
/* lamina-pg-search.c */
GPtrArray          *lamina_pg_search           (LaminaBackend *backend,
                                                const LaminaLibraryQuery *query,
                                                GError **error);
gint64              lamina_pg_count            (LaminaBackend *backend,
                                                const LaminaLibraryQuery *query,
                                                GError **error);
gint64              lamina_pg_count_at_most    (LaminaBackend *backend,
                                                const LaminaLibraryQuery *query,
                                                gint64 at_most, GError **error);
GPtrArray          *lamina_pg_list_tags        (LaminaBackend *backend, GError **error);
/* The search words of a construction, space separated (the index). */
char               *lamina_pg_search_words     (const LaminaConstruction *c);
/* The tags, materials and search words of a revision being stored. */
gboolean            lamina_pg_index_revision   (LaminaPg *self, const LaminaConstruction *c,
                                                gboolean with_materials, GError **error);
gboolean            lamina_pg_replace_draft    (LaminaBackend *backend,
                                                const LaminaBackendRevision *rev,
                                                const char *stamp, GError **error);
gboolean            lamina_pg_drop_draft       (LaminaBackend *backend,
                                                const LaminaBackendRevision *previous,
                                                int draft, const char *stamp, GError **error);
/* The parameters $1 … $13 of a construction row (@words: its search
 * words), and with @whole $14 deleted_at and $15 material_changed. */
GPtrArray          *lamina_pg_construction_row_params (const LaminaStoreConstructionRow *row,
                                                       const char *words, gboolean whole);
/* One revision row as given (the stored figures, people and dates). */
gboolean            lamina_pg_insert_revision  (LaminaPg *self, const char *id,
                                                const LaminaBackendRecordRevision *row,
                                                const char *what, GError **error);
/* lamina-pg-copy.c */
gboolean            lamina_pg_read_snapshot    (LaminaBackend *backend, LaminaBackendReadFunc func,
                                                gpointer data, GError **error);
gboolean            lamina_pg_read_rows        (LaminaBackend *backend, const char *sql,
                                                const char *types, LaminaBackendRowFunc row,
                                                gpointer data, const char *what, GError **error);
gboolean            lamina_pg_write_all        (LaminaBackend *backend,
                                                const LaminaBackendDump *dump, GError **error);
gboolean            lamina_pg_backup_to        (LaminaBackend *backend, const char *dest,
                                                GError **error);
/* lamina-pg-roles.c */
gboolean            lamina_pg_server_init      (LaminaBackend *backend, GError **error);
/* lamina-pg-jobs.c */
GPtrArray          *lamina_pg_list_target_sets (LaminaBackend *backend, GError **error);
gboolean            lamina_pg_put_target_set   (LaminaBackend *backend,
                                                const LaminaTargetSet *set,
                                                const char *now, GError **error);
gboolean            lamina_pg_delete_target_set (LaminaBackend *backend, const char *id,
                                                 GError **error);
GPtrArray          *lamina_pg_list_jobs        (LaminaBackend *backend, GError **error);
LaminaJob          *lamina_pg_get_job          (LaminaBackend *backend, const char *id,
                                                GError **error);
gboolean            lamina_pg_put_job          (LaminaBackend *backend, const LaminaJob *job,
                                                gboolean create, GError **error);
gboolean            lamina_pg_delete_job       (LaminaBackend *backend, const char *id,
                                                GError **error);
GPtrArray          *lamina_pg_list_job_uses    (LaminaBackend *backend,
                                                const char *construction_id, GError **error);
gboolean            lamina_pg_put_target_set_in_txn (LaminaPg *self, const LaminaTargetSet *set,
                                                     const char *now, GError **error);
gboolean            lamina_pg_put_records      (LaminaPg *self, GPtrArray *target_sets,
                                                GPtrArray *jobs, const char *now,
                                                GError **error);

G_END_DECLS
