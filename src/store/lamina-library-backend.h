/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-backend.h: the seam behind LaminaLibrary (private to
 * src/store).  LaminaLibrary checks arguments, fills in who and when,
 * calculates figures and emits "changed"; a backend only stores.  Today
 * there is one backend (lamina-sqlite-*.c); a server backend implements
 * the same table. */
#pragma once

#include "lamina-library.h"
#include "lamina-library-copy.h"

G_BEGIN_DECLS

typedef struct _LaminaBackend LaminaBackend;

/* What the front end hands the backend with every stored revision. */
typedef struct
{
  const LaminaConstruction *construction;  /* id, content, review data */
  const LaminaResult       *result;        /* NULL if not calculable */
  const char               *calc_error;    /* why not, or NULL */
  const char               *comment;
} LaminaBackendRevision;

/* Everything an import writes, in one transaction. */
typedef struct
{
  GPtrArray    *materials;       /* LaminaMaterial* */
  GPtrArray    *revisions;       /* LaminaBackendRevision* */
  const GArray *base_revisions;  /* int, one per revision */
  GPtrArray    *target_sets;     /* LaminaTargetSet*, replacing those of their id */
  GPtrArray    *jobs;            /* LaminaJob*, replacing those of their id */
  /* LaminaClimate*, added or replaced before the revisions (NULL: none);
   * in the same transaction, so a failed import leaves none behind. */
  GPtrArray    *climates;
} LaminaBackendImport;

/* A review act as the backend stores it. */
typedef enum
{
  LAMINA_REVIEW_ACT_CHECK,
  LAMINA_REVIEW_ACT_APPROVE,
  LAMINA_REVIEW_ACT_WITHDRAW,
} LaminaReviewAct;

typedef struct
{
  const char      *id;
  int              revision;   /* the revision the front end checked */
  LaminaReviewAct  act;
  const char      *by;
  const char      *at;         /* now, ISO 8601 */
  const char      *date;       /* approval date */
  const char      *policy;
  const char      *reason;
} LaminaBackendReview;

/* Moving a whole library (lamina-library-copy.c): everything a library
 * stores, as stored, so that a copy keeps every revision with its
 * number, people, dates, figures and review records. */
typedef struct
{
  int                 revision;
  LaminaStatus        status;
  char               *body;          /* as stored (lamina-store-json.h) */
  double              u;             /* the stored figures; NAN: none */
  double              u_corrected;
  double              r_total;
  double              thickness;
  char               *calc_error;
  char               *modified_by;
  char               *modified_at;
  char               *checked_by;
  char               *checked_at;
  char               *approved_by;
  char               *approved_at;
  char               *comment;
  char               *field_check;    /* the body of its 2-D check, or NULL */
  char               *field_check_at;
  /* Filled by the front end before write_all: @body parsed (id and
   * revision set), for the target's tags, material and search indexes. */
  LaminaConstruction *construction;
} LaminaBackendRecordRevision;

typedef struct
{
  char       *id;
  char       *deleted_at;        /* NULL while live */
  int         flags;             /* LaminaSummaryFlags as stored */
  gboolean    material_changed;  /* as stored */
  GPtrArray  *revisions;         /* LaminaBackendRecordRevision*, oldest first */
  GPtrArray  *review_events;     /* LaminaReviewEvent*, oldest first */
} LaminaBackendRecord;

typedef struct
{
  GPtrArray *settings;          /* char*: key, value, key, value, … */
  GPtrArray *materials;         /* LaminaMaterial* */
  GPtrArray *material_times;    /* char*: modified_at of each material */
  GPtrArray *climates;          /* LaminaClimate* */
  GPtrArray *climate_times;     /* char* */
  GPtrArray *target_sets;       /* LaminaTargetSet* */
  GPtrArray *target_set_times;  /* char* (may hold NULL) */
  GPtrArray *jobs;              /* LaminaJob* (with their modified_at) */
  GPtrArray *constructions;     /* LaminaBackendRecord*, in order of creation */
} LaminaBackendDump;

/* One value of a row read by read_rows, typed by its letter. */
typedef union
{
  const char *text;     /* 't' */
  gint64      integer;  /* 'i' */
  double      real;     /* 'r' */
  gboolean    boolean;  /* 'b' */
} LaminaBackendValue;

typedef void     (*LaminaBackendRowFunc)  (const LaminaBackendValue *values,
                                           gpointer                  data);
typedef gboolean (*LaminaBackendReadFunc) (LaminaBackend  *backend,
                                           gpointer        data,
                                           GError        **error);

/* lamina-library-copy.c */
LaminaBackendDump           *lamina_backend_dump_new            (void);
void                         lamina_backend_dump_free           (LaminaBackendDump *dump);
LaminaBackendRecord         *lamina_backend_record_new          (const char *id);
LaminaBackendRecordRevision *lamina_backend_record_revision_new (void);
/* Everything @backend stores, as stored, read in one snapshot through its
 * read_snapshot, read_rows and list operations (which must not be NULL). */
LaminaBackendDump           *lamina_backend_read_all            (LaminaBackend     *backend,
                                                                 GError           **error);
/* Parses every revision's body into its construction (what write_all
 * needs) and counts into @report: CORRUPT, naming the construction and
 * revision, before anything is written. */
gboolean                     lamina_backend_dump_prepare        (LaminaBackendDump *dump,
                                                                 LaminaCopyReport  *report,
                                                                 GError           **error);

typedef struct
{
  void                (*close)              (LaminaBackend *backend);
  gboolean            (*check_for_changes)  (LaminaBackend *backend);

  GPtrArray          *(*list_materials)     (LaminaBackend *backend, GError **error);
  LaminaMaterial     *(*get_material)       (LaminaBackend *backend, const char *id,
                                             GError **error);
  gboolean            (*put_material)       (LaminaBackend *backend,
                                             const LaminaMaterial *material,
                                             const char *now, GError **error);

  LaminaConstruction *(*get_construction)   (LaminaBackend *backend, const char *id,
                                             int revision, GError **error);
  /* Adds revision @base_revision + 1 of an existing construction
   * (@base_revision 0: creates it, refused with EXISTS if taken). */
  gboolean            (*store_revision)     (LaminaBackend *backend,
                                             const LaminaBackendRevision *rev,
                                             int base_revision, GError **error);
  gboolean            (*set_deleted)        (LaminaBackend *backend, const char *id,
                                             const char *when, GError **error);
  GPtrArray          *(*get_history)        (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* Records a review act on the latest revision (@review->revision) and
   * moves it to the act's status, in one transaction. */
  gboolean            (*review)             (LaminaBackend *backend,
                                             const LaminaBackendReview *review,
                                             GError **error);
  GPtrArray          *(*get_review_events)  (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* Library settings (the meta table); NULL without error when unset. */
  char               *(*get_setting)        (LaminaBackend *backend, const char *key,
                                             GError **error);
  gboolean            (*set_setting)        (LaminaBackend *backend, const char *key,
                                             const char *value, GError **error);

  GPtrArray          *(*search)             (LaminaBackend *backend,
                                             const LaminaLibraryQuery *query,
                                             GError **error);
  gint64              (*count)              (LaminaBackend *backend,
                                             const LaminaLibraryQuery *query,
                                             GError **error);
  GPtrArray          *(*list_tags)          (LaminaBackend *backend, GError **error);

  /* All of @revisions and @materials in one transaction, or nothing. */
  gboolean            (*apply_import)       (LaminaBackend *backend,
                                             GPtrArray *materials,
                                             GPtrArray *revisions,
                                             const GArray *base_revisions,
                                             const char *now, GError **error);
  /* Ids of every live construction, sorted by code. */
  GPtrArray          *(*list_ids)           (LaminaBackend *backend, GError **error);

  /* Target sets and jobs (lamina-library-jobs.c). */
  GPtrArray          *(*list_target_sets)   (LaminaBackend *backend, GError **error);
  gboolean            (*put_target_set)     (LaminaBackend *backend,
                                             const LaminaTargetSet *set,
                                             const char *now, GError **error);
  gboolean            (*delete_target_set)  (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* LaminaJob*, by number, then name. */
  GPtrArray          *(*list_jobs)          (LaminaBackend *backend, GError **error);
  LaminaJob          *(*get_job)            (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* @create: refused with EXISTS if the id is taken; otherwise NOT_FOUND
   * unless it is. */
  gboolean            (*put_job)            (LaminaBackend *backend, const LaminaJob *job,
                                             gboolean create, GError **error);
  gboolean            (*delete_job)         (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* LaminaJobUse* of the entries pinning @construction_id. */
  GPtrArray          *(*list_job_uses)      (LaminaBackend *backend,
                                             const char *construction_id,
                                             GError **error);
  /* apply_import with the target sets and jobs of the document. */
  gboolean            (*apply_import_records) (LaminaBackend *backend,
                                               const LaminaBackendImport *import,
                                               const char *now, GError **error);

  /* The 2-D check stored with a revision (lamina-library-field.c): its
   * JSON body, or NULL without an error when the revision has none. */
  char               *(*get_field_check)    (LaminaBackend *backend, const char *id,
                                             int revision, GError **error);
  gboolean            (*put_field_check)    (LaminaBackend *backend, const char *id,
                                             int revision, const char *body,
                                             const char *now, GError **error);

  /* Climates (EN ISO 13788); put also refreshes the flags of the
   * constructions checked with other data for it. */
  GPtrArray          *(*list_climates)      (LaminaBackend *backend, GError **error);
  LaminaClimate      *(*get_climate)        (LaminaBackend *backend, const char *id,
                                             GError **error);
  gboolean            (*put_climate)        (LaminaBackend *backend,
                                             const LaminaClimate *climate,
                                             const char *now, GError **error);

  /* Moving a whole library (lamina-library-copy.c, which reads the
   * source through read_snapshot and read_rows below).  write_all: @dump
   * into this library in one transaction, all or nothing; refused with
   * EXISTS (nothing written) unless the library holds no construction,
   * review record, job or target set.  Its materials, climates and
   * settings are replaced by the dump's (a new library starts with the
   * seed's).  Revisions keep their numbers, people, dates, figures and
   * comments.  NULL where a backend cannot: the copy says "not
   * supported". */
  gboolean            (*write_all)          (LaminaBackend *backend,
                                             const LaminaBackendDump *dump,
                                             GError **error);

  /* Library safety (lamina-library-safety.c).  Either may be NULL where a
   * backend has no such thing; the front end then says "not supported
   * for this library".  verify_storage appends one sentence (char*) per
   * problem the storage's own check finds to @problems and fails only
   * when it could not run; backup_to writes a complete, consistent copy
   * of the library as the new file @dest. */
  gboolean            (*verify_storage)     (LaminaBackend *backend, GPtrArray *problems,
                                             GError **error);
  gboolean            (*backup_to)          (LaminaBackend *backend, const char *dest,
                                             GError **error);
  /* Replaces the library's whole content with that of the backup file
   * @source (made by backup_to), in one step that other connections see
   * whole. */
  gboolean            (*restore_from)       (LaminaBackend *backend, const char *source,
                                             GError **error);
  /* IN_USE while a live construction's latest revision names it. */
  gboolean            (*delete_climate)     (LaminaBackend *backend, const char *id,
                                             GError **error);
  /* Stores the setting LAMINA_MOISTURE_LIMIT_KEY = @value and sets
   * LAMINA_SUMMARY_MOISTURE_FAILS of every construction with a moisture
   * check from lamina_library_moisture_flags_for_limit (@limit), in one
   * transaction.  The backend's stored flags use the setting as well. */
  gboolean            (*set_moisture_limit) (LaminaBackend *backend, const char *value,
                                             double limit, GError **error);
  /* The roles of an office library enforced by its server
   * (lamina-pg-roles.c); NULL for a file. */
  gboolean            (*server_init)        (LaminaBackend *backend, GError **error);

  /* A draft that directly follows an approved revision is edited in
   * place while it is a draft (lamina-library-constructions.c decides
   * when).  Both refuse with STALE unless the draft is still the head and
   * still a draft whose stored state carries @stamp (the draft_stamp of
   * its JSON body, see LaminaConstruction), in one transaction; NULL in a
   * backend that cannot, and the front end then adds revisions as before.
   * replace_draft: @rev->construction is the draft's new content with the
   * same revision number; its body, figures, who and when, materials and
   * search row replace the old, and a 2-D check stored with it goes.
   * drop_draft: removes draft @draft (which has no review records) and
   * makes @previous, revision @draft - 1 as read from the library, the
   * head again (its figures, status and search row). */
  gboolean            (*replace_draft)      (LaminaBackend *backend,
                                             const LaminaBackendRevision *rev,
                                             const char *stamp, GError **error);
  gboolean            (*drop_draft)         (LaminaBackend *backend,
                                             const LaminaBackendRevision *previous,
                                             int draft, const char *stamp,
                                             GError **error);

  /* The id of a live construction other than @except_id whose office code
   * is @code (ASCII letters without case), or NULL without an error when
   * none: codes are unique within a library.  NULL where a backend cannot
   * tell (the front end then does not check). */
  char               *(*find_code)          (LaminaBackend *backend, const char *code,
                                             const char *except_id, GError **error);

  /* How many rows @query matches, counting no further than @at_most:
   * the exact count when it is at most @at_most, otherwise any number
   * above it (the front end reports at_most + 1).  A backend counts
   * like `SELECT count(*) FROM (SELECT 1 … LIMIT at_most + 1)`, so that
   * a short prefix matching most of a large library costs a bounded
   * time.  NULL: the front end falls back to count. */
  gint64              (*count_at_most)      (LaminaBackend *backend,
                                             const LaminaLibraryQuery *query,
                                             gint64 at_most, GError **error);

  /* Takes the library's write lock and lets it go at once, writing
   * nothing: waits (the busy handler, up to busy_timeout) while another
   * program holds it, then BUSY.  NULL for a backend without a library-
   * wide write lock (the front end then does not wait). */
  gboolean            (*probe_write)        (LaminaBackend *backend, GError **error);

  /* Reading a whole library as stored (lamina-library-copy.c).
   * read_snapshot: calls @func, and every read it makes (read_rows and
   * the list operations) sees one consistent state of the library; it
   * writes nothing, so a read-only library can be read.  read_rows: runs
   * @sql, one SELECT without parameters in the SQL both backends share,
   * and calls @row with each row's values, one per letter of @types:
   * 't' text (NULL for NULL), 'i' integer, 'r' real (NAN for NULL), 'b'
   * boolean.  A text is the backend's until @row returns.  @what begins
   * the message of a failure ("cannot read the revisions").  NULL where a
   * backend cannot: the copy says "not supported". */
  gboolean            (*read_snapshot)      (LaminaBackend          *backend,
                                             LaminaBackendReadFunc   func,
                                             gpointer                data,
                                             GError                **error);
  gboolean            (*read_rows)          (LaminaBackend          *backend,
                                             const char             *sql,
                                             const char             *types,
                                             LaminaBackendRowFunc    row,
                                             gpointer                data,
                                             const char             *what,
                                             GError                **error);
} LaminaBackendVTable;

struct _LaminaBackend
{
  const LaminaBackendVTable *vtable;
  char                      *path;
  char                      *backup_path;
  int                        opened_version;
  /* NULL when writable; else why not ("the file is read-only"): every
   * write is refused with LAMINA_LIBRARY_ERROR_READ_ONLY. */
  char                      *read_only_reason;
  /* Called while a write waits for another program's lock (@holder: who,
   * if known, or NULL) and once more with @waiting FALSE when it ends. */
  void                     (*waiting)          (gpointer    data,
                                                gboolean    waiting,
                                                const char *holder);
  gpointer                   waiting_data;
  double                     busy_timeout;     /* seconds */
};

/* lamina-library-safety.c: the message of every refused write to a
 * read-only library, and of a damaged one (naming the last backup). */
void           lamina_backend_set_read_only_error (LaminaBackend *backend,
                                                   GError       **error);
void           lamina_backend_set_damaged_error   (LaminaBackend *backend,
                                                   const char    *where,
                                                   const char    *detail,
                                                   GError       **error);

/* lamina-library-types.c */
LaminaImportReport *lamina_import_report_new (void);
/* Takes @message. */
void           lamina_import_report_add_item (LaminaImportReport *report,
                                              LaminaImportAction  action,
                                              gboolean            is_material,
                                              const char         *id,
                                              const char         *name,
                                              int                 revision,
                                              char               *message);

/* lamina-library-exchange.c: LaminaMaterialChange* for the layers of @c
 * (any revision) against the library's materials now. */
GPtrArray     *lamina_library_collect_material_changes (LaminaLibrary            *self,
                                                        const LaminaConstruction *c);

/* lamina-library-jobs.c, for the export of the whole library: adds every
 * target set and job to @catalogue. */
gboolean       lamina_library_export_records (LaminaLibrary   *self,
                                              LaminaCatalogue *catalogue,
                                              GError         **error);

/* lamina-library-jobs.c, for the import: checks the target sets and jobs
 * of @catalogue against the document and the library, re-pins entries
 * to the revisions the import stores (from @report's items), and adds
 * what is new or changed to @target_sets and @jobs (owned copies). */
gboolean       lamina_library_merge_records (LaminaLibrary         *self,
                                             const LaminaCatalogue *catalogue,
                                             LaminaImportReport    *report,
                                             GPtrArray             *target_sets,
                                             GPtrArray             *jobs,
                                             GError               **error);

/* lamina-library.c, for lamina-library-exchange.c */
LaminaBackend *lamina_library_get_backend  (LaminaLibrary *self);
char          *lamina_library_dup_now      (void);
const char    *lamina_library_default_author (const char *author);
/* Fills in figures, the id and revision, and who and when; stores. */
gboolean       lamina_library_prepare_revision (LaminaConstruction *construction,
                                                LaminaResult      **result,
                                                char              **calc_error);
/* Makes @c draft revision @revision by @author (NULL: the user), now. */
void           lamina_library_set_new_draft (LaminaConstruction *c,
                                             int                 revision,
                                             const char         *author);
void           lamina_library_emit_changed (LaminaLibrary *self);
/* lamina-library-review.c: @value NFC and trimmed, or NULL (INVALID,
 * naming @field and the character's position) when it holds a control or
 * format character. */
char          *lamina_library_dup_clean_identity (const char  *value,
                                                  const char  *field,
                                                  GError     **error);
/* lamina-library-constructions.c: @c's code (and, with @new_id, its id)
 * cleaned as above, in place; @where prefixes the message ("construction
 * 3 (line 40)"), NULL for none. */
gboolean       lamina_library_clean_construction_identity (LaminaConstruction  *c,
                                                           gboolean             new_id,
                                                           const char          *where,
                                                           GError             **error);
/* A material's id cleaned as above, in place, as it enters the library
 * (put or import; the material ids of the layers an import brings are
 * put in NFC alike, so that they still name their materials); @where
 * prefixes the message ("material 2 (line 14)"), NULL: the material's
 * name. */
gboolean       lamina_library_clean_material_identity (LaminaMaterial  *m,
                                                       const char      *where,
                                                       GError         **error);
void           lamina_library_normalize_layer_material_ids (LaminaConstruction *c);
/* The id of another live construction (not @except_id) with @code
 * (ASCII letters compared without case), NULL without an error when none
 * or when the backend cannot tell. */
char          *lamina_library_dup_code_user (LaminaLibrary *self,
                                             const char    *code,
                                             const char    *except_id,
                                             GError       **error);
/* lamina-library-review.c: two names for one person (NFC, case-folded,
 * blanks trimmed). */
gboolean       lamina_library_same_person  (const char *a,
                                            const char *b);
/* lamina-library-climates.c: LAMINA_SUMMARY_HAS_MOISTURE and
 * LAMINA_SUMMARY_MOISTURE_FAILS for a construction about to be stored,
 * with the default limit, or with @limit (kg/m²; NAN: the default). */
LaminaSummaryFlags lamina_library_moisture_flags (const LaminaConstruction *construction);
LaminaSummaryFlags lamina_library_moisture_flags_for_limit (const LaminaConstruction *construction,
                                                            double                    limit);
/* The library setting that holds the office's moisture limit, and its
 * reading (NAN when unset or not a valid limit). */
#define LAMINA_MOISTURE_LIMIT_KEY "moisture-limit"
double             lamina_library_moisture_limit_from_text (const char *value);

/* For the front end's files: the library's backend and its table, and
 * the refusal of every operation on a closed library. */
#define BE(self) (lamina_library_get_backend (self))
#define VT(self) (BE (self)->vtable)
#define BACKEND_OR_FAIL(self, error, value)                                     \
  G_STMT_START {                                                                \
    if (BE (self) == NULL)                                                      \
      {                                                                         \
        g_set_error_literal ((error), LAMINA_LIBRARY_ERROR,                     \
                             LAMINA_LIBRARY_ERROR_IO, "the library is closed"); \
        return (value);                                                         \
      }                                                                         \
  } G_STMT_END

/* lamina-library-safety.c: LAMINA_BUSY_TIMEOUT or 60 s. */
double         lamina_backend_default_busy_timeout (void);

/* lamina-library-backup.c: the newest backup of the library at @path in
 * the folder backups go to when its settings cannot be read, or NULL. */
char          *lamina_backup_dup_latest_for_path (const char *path);
/* lamina-pg-open.c: a library on a PostgreSQL server (@conninfo: any
 * libpq connection string or URI; @password: NULL for libpq's own
 * sources), created in an empty database unless
 * LAMINA_LIBRARY_OPEN_EXISTING. */
LaminaBackend *lamina_pg_backend_open (const char             *conninfo,
                                       const char             *password,
                                       LaminaLibraryOpenFlags  flags,
                                       GError                **error);

/* lamina-pg-open.c: @conninfo without a password, for messages; the
 * name backups of a server library are called by (its database's name,
 * as a file name). */
char          *lamina_pg_dup_label        (const char *conninfo);
char          *lamina_pg_dup_backup_stem  (const char *conninfo);

/* lamina-sqlite-open.c */
LaminaBackend *lamina_sqlite_backend_open (const char             *path,
                                           LaminaLibraryOpenFlags  flags,
                                           GError                **error);

G_END_DECLS
