/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library.h: the office library of materials and constructions.
 *
 * The rest of the program sees only this interface: no SQLite type leaves
 * src/store.  Behind it sits a backend (today one SQLite file; a server
 * backend for offices sharing one library can be added behind the same
 * calls, see lamina-library-backend.h).
 *
 * Revisions.  Every saved change makes a new revision of a construction;
 * the history is kept.  A revision is draft, checked (by a named person)
 * or approved (by a named person, with date).  An approved revision never
 * changes: saving over it starts a new draft revision and the approved one
 * stays readable with lamina_library_dup_construction (…, revision, …).
 * Each layer keeps the material data it was calculated with; when a
 * library material changes later, the constructions using it are flagged
 * (LAMINA_SUMMARY_MATERIAL_CHANGED) and nothing changes under them until
 * the user asks (lamina_library_update_materials).
 *
 * Concurrency.  Several processes may open one library.  A save states the
 * revision it was based on; if someone else saved in between, the save is
 * refused with LAMINA_LIBRARY_ERROR_STALE and nothing is written.
 *
 * Threads: a LaminaLibrary is used from one thread at a time. */
#pragma once

#include <glib-object.h>

#include "lamina-calc.h"
#include "lamina-construction.h"
#include "lamina-field.h"
#include "lamina-job-check.h"
#include "lamina-material.h"
#include "exchange/lamina-catalogue.h"

G_BEGIN_DECLS

#define LAMINA_LIBRARY_ERROR (lamina_library_error_quark ())

typedef enum
{
  LAMINA_LIBRARY_ERROR_IO,            /* cannot open, create or copy the file */
  LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY, /* some other file, or another program's SQLite */
  LAMINA_LIBRARY_ERROR_TOO_NEW,       /* written by a newer Lamina: schema unknown */
  LAMINA_LIBRARY_ERROR_CORRUPT,       /* damaged file (integrity check failed) */
  LAMINA_LIBRARY_ERROR_NOT_FOUND,     /* no such construction, revision or material */
  LAMINA_LIBRARY_ERROR_EXISTS,        /* create with an id that is taken */
  LAMINA_LIBRARY_ERROR_STALE,         /* someone saved a newer revision meanwhile */
  LAMINA_LIBRARY_ERROR_IMMUTABLE,     /* the revision is approved, or not the latest */
  LAMINA_LIBRARY_ERROR_INVALID,       /* a value breaks a rule (message names the field) */
  LAMINA_LIBRARY_ERROR_BUSY,          /* locked by another process beyond the timeout */
  LAMINA_LIBRARY_ERROR_READ_ONLY,     /* file or medium not writable */
  LAMINA_LIBRARY_ERROR_FAILED,        /* anything else the backend reports */
  LAMINA_LIBRARY_ERROR_POLICY,        /* the review policy refuses the act (four eyes) */
  LAMINA_LIBRARY_ERROR_SCOPE,         /* beyond the method's scope: a 2-D check or a reason is needed */
  LAMINA_LIBRARY_ERROR_IN_USE,        /* still used by a construction: not deleted */
} LaminaLibraryError;

GQuark lamina_library_error_quark (void);

/* The schema version this build writes (PRAGMA user_version). */
#define LAMINA_LIBRARY_SCHEMA_VERSION 8

typedef enum
{
  LAMINA_LIBRARY_OPEN_DEFAULT  = 0,      /* create if missing, seed materials */
  LAMINA_LIBRARY_OPEN_EXISTING = 1 << 0, /* fail with IO if the file is missing */
  LAMINA_LIBRARY_OPEN_NO_SEED  = 1 << 1, /* a new library starts without materials */
  LAMINA_LIBRARY_OPEN_READ_ONLY = 1 << 2, /* never write, even if the file could be
                                             (see lamina-library-safety.h) */
} LaminaLibraryOpenFlags;

#define LAMINA_TYPE_LIBRARY (lamina_library_get_type ())
G_DECLARE_FINAL_TYPE (LaminaLibrary, lamina_library, LAMINA, LIBRARY, GObject)

/* TRUE if @location names a library on a PostgreSQL server rather than
 * a file: a postgresql:// or postgres:// URI, or a libpq connection
 * string ("service=office", "host=… dbname=…").  Such a location is never
 * taken for a path. */
gboolean       lamina_library_is_server_address (const char *location);

/* On a PostgreSQL server, makes the library's roles (lamina_author,
 * lamina_checker, lamina_approver) and hands the review acts to the
 * server: from then on it refuses any review not made through Lamina's
 * review function by a person holding the role, and records the server's
 * name of the person.  Run by the library's owner; safe to run again.
 * A file library has no server: fails with FAILED ("not supported"). */
gboolean       lamina_library_server_init (LaminaLibrary *self,
                                           GError       **error);

/* g_get_user_data_dir()/lamina/library.sqlite */
char          *lamina_library_dup_default_path (void);

/* @path NULL opens the default library (creating its folder).  Fails
 * without touching the file if it is not a Lamina library, is newer than
 * this build or is corrupt.  An older library is migrated; a copy of it is
 * kept first (lamina_library_get_backup_path). */
LaminaLibrary *lamina_library_open         (const char             *path,
                                            LaminaLibraryOpenFlags  flags,
                                            GError                **error);
/* As lamina_library_open, for a server library with @password (may be
 * NULL: libpq's own sources) for this connection and the library's
 * side connections only: it is kept in memory, never in the library's
 * path or in messages.  Safe to call in a worker thread (the library is
 * then used by one thread at a time).  A file library ignores it. */
LaminaLibrary *lamina_library_open_with_password (const char             *path,
                                                  const char             *password,
                                                  LaminaLibraryOpenFlags  flags,
                                                  GError                **error);
/* Closes the file now (also done on finalize); later calls fail. */
void           lamina_library_close        (LaminaLibrary          *self);
const char    *lamina_library_get_path     (LaminaLibrary          *self);
/* The copy kept before a migration in this open, or NULL. */
const char    *lamina_library_get_backup_path (LaminaLibrary       *self);
/* The schema version the file had when opened (before any migration). */
int            lamina_library_get_opened_version (LaminaLibrary    *self);

/* The "changed" signal is emitted after every write through @self, and by
 * lamina_library_check_for_changes when another process or connection
 * wrote to the file (cheap: call it from a timeout or on focus). */
gboolean       lamina_library_check_for_changes (LaminaLibrary     *self);

/* ---- Materials ------------------------------------------------------- */

/* LaminaMaterial*, sorted by category then name. */
GPtrArray     *lamina_library_list_materials (LaminaLibrary        *self,
                                              GError              **error);
LaminaMaterial *lamina_library_dup_material  (LaminaLibrary        *self,
                                              const char           *id,
                                              GError              **error);
/* Adds or replaces the material with @material->id (a NULL id gets a new
 * one, written back into @material).  Constructions whose layers hold
 * different data for it become flagged; they are not changed. */
gboolean       lamina_library_put_material   (LaminaLibrary        *self,
                                              LaminaMaterial       *material,
                                              GError              **error);

/* ---- Climates (EN ISO 13788) ------------------------------------------ */

/* LaminaClimate*, sorted by name. */
GPtrArray     *lamina_library_list_climates  (LaminaLibrary        *self,
                                              GError              **error);
LaminaClimate *lamina_library_dup_climate    (LaminaLibrary        *self,
                                              const char           *id,
                                              GError              **error);
/* Adds or replaces the climate with @climate->id (validated).  The
 * constructions checked with other data for it become flagged
 * (LAMINA_SUMMARY_MATERIAL_CHANGED, as for a material); they are not
 * changed. */
gboolean       lamina_library_put_climate    (LaminaLibrary        *self,
                                              const LaminaClimate  *climate,
                                              GError              **error);
/* Deletes the climate @id.  Refused with IN_USE (naming how many and one
 * code) while the latest revision of a construction is checked with it;
 * NOT_FOUND when there is none.  A deleted construction keeps the climate
 * data it carries. */
gboolean       lamina_library_delete_climate (LaminaLibrary        *self,
                                              const char           *id,
                                              GError              **error);

/* The office's limit on the largest interstitial accumulation in a year
 * that dries out, kg/m² (EN ISO 13788 sets none; 0.5 by default, common
 * practice).  Every moisture check the library makes uses it: the stored
 * "fails its moisture check" flags, the sheets and the window. */
double         lamina_library_get_moisture_limit (LaminaLibrary    *self);
/* Stores @limit (above 0, at most LAMINA_MOISTURE_LIMIT_MAX) and
 * recomputes every construction's moisture flags with it, in one
 * transaction. */
gboolean       lamina_library_set_moisture_limit (LaminaLibrary    *self,
                                                  double            limit,
                                                  GError          **error);

/* ---- Constructions --------------------------------------------------- */

/* @revision 0 = the latest.  The result carries status, revision and the
 * review data of that revision.  A deleted construction is NOT_FOUND. */
LaminaConstruction *lamina_library_dup_construction (LaminaLibrary *self,
                                                     const char    *id,
                                                     int            revision,
                                                     GError       **error);
/* The figures stored with a revision (0 = latest), as lamina_calculate
 * gave them at save time; NULL with NOT_FOUND, or when the construction
 * could not be calculated (an INVALID error naming why). */
LaminaResult  *lamina_library_dup_result   (LaminaLibrary          *self,
                                            const char             *id,
                                            int                     revision,
                                            GError                **error);

/* Stores @construction (its id must exist) as a new draft revision on top
 * of @base_revision.  Refused with STALE if the latest revision is not
 * @base_revision.  Saving unchanged content is a no-op that succeeds.  On
 * success @construction's revision, status and review fields are updated.
 * @author NULL = the user's name.
 * A draft that directly follows an approved revision (and that no job
 * pins) is not a string of revisions: its author's edits replace it in
 * place while it is a draft (someone else's edit is a revision of its
 * own), and saving it back to the approved build-up removes the draft,
 * so the approved revision is the latest again (@construction then
 * carries its number and review fields). */
gboolean       lamina_library_save_construction (LaminaLibrary      *self,
                                                 LaminaConstruction *construction,
                                                 int                 base_revision,
                                                 const char         *author,
                                                 GError            **error);
/* Stores a new construction as revision 1 (draft).  A NULL id gets a new
 * one; returns the id (also written into @construction). */
char          *lamina_library_create_construction (LaminaLibrary      *self,
                                                   LaminaConstruction *construction,
                                                   const char         *author,
                                                   GError            **error);
/* A job variant: revision @revision of @id copied to a new construction
 * (draft, revision 1, name "… (variant for JOB)", no code) that a job's
 * entry pins with @id at @revision as its origin; returns the new id. */
char          *lamina_library_derive_job_variant (LaminaLibrary *self,
                                                  const char    *id,
                                                  int            revision,
                                                  const char    *job_name,
                                                  const char    *author,
                                                  GError       **error);
/* Copies the latest approved revision of @id (the latest revision when
 * none is approved) to a new construction (draft, revision 1, name
 * "… (copy)", no code); returns the new id. */
char          *lamina_library_derive_construction (LaminaLibrary *self,
                                                   const char    *id,
                                                   const char    *author,
                                                   GError       **error);
/* The same for a new job, keeping what the user chose: the description
 * and the notes or not, and only the @tags listed (NULL keeps them all). */
char          *lamina_library_derive_for_job      (LaminaLibrary      *self,
                                                   const char         *id,
                                                   gboolean            keep_description,
                                                   gboolean            keep_notes,
                                                   const char * const *tags,
                                                   const char         *author,
                                                   GError            **error);
/* The same from revision @revision of @id (0: the latest approved, else
 * the latest; a revision asked for must exist, NOT_FOUND). */
char          *lamina_library_derive_revision_for_job (LaminaLibrary      *self,
                                                       const char         *id,
                                                       int                 revision,
                                                       gboolean            keep_description,
                                                       gboolean            keep_notes,
                                                       const char * const *tags,
                                                       const char         *author,
                                                       GError            **error);
/* Deleting hides a construction and keeps its history; restoring brings
 * it back as it was (the window's undo). */
gboolean       lamina_library_delete_construction  (LaminaLibrary *self,
                                                    const char    *id,
                                                    const char    *author,
                                                    GError       **error);
gboolean       lamina_library_restore_construction (LaminaLibrary *self,
                                                    const char    *id,
                                                    GError       **error);

/* One revision in a construction's history. */
typedef struct
{
  int           revision;
  LaminaStatus  status;
  char         *modified_by;
  char         *modified_at;   /* ISO 8601, UTC */
  char         *checked_by;    /* NULL unless checked or approved */
  char         *checked_at;
  char         *approved_by;   /* NULL unless approved */
  char         *approved_at;   /* the approval date, YYYY-MM-DD */
  char         *comment;       /* "imported from …", "derived from …", or NULL */
  double        u_corrected;   /* NAN if it could not be calculated */
} LaminaRevisionInfo;

void           lamina_revision_info_free   (LaminaRevisionInfo     *info);
/* LaminaRevisionInfo*, newest first. */
GPtrArray     *lamina_library_dup_history  (LaminaLibrary          *self,
                                            const char             *id,
                                            GError                **error);

/* Review.  @revision must be the latest (0 = the latest): reviewing what
 * is not on screen any more fails with STALE; an approved revision cannot
 * be checked or approved again (IMMUTABLE); only a checked revision can be
 * approved; the review policy applies (see below).  A second check adds a
 * record and keeps the first checker.  @name is required.  @date NULL =
 * today (YYYY-MM-DD). */
gboolean       lamina_library_mark_checked (LaminaLibrary          *self,
                                            const char             *id,
                                            int                     revision,
                                            const char             *name,
                                            GError                **error);
gboolean       lamina_library_approve      (LaminaLibrary          *self,
                                            const char             *id,
                                            int                     revision,
                                            const char             *name,
                                            const char             *date,
                                            GError                **error);

/* ---- Review integrity --------------------------------------------------
 *
 * The review policy is stored in the library.  Four eyes (the default):
 * whoever checks or approves a revision is not its author (the person who
 * last modified it).  Single reviewer: for a one-person practice; the act
 * is allowed and its record names the policy.  Names are compared after
 * NFC normalisation, case-insensitively. */
typedef enum
{
  LAMINA_REVIEW_FOUR_EYES,
  LAMINA_REVIEW_SINGLE,
} LaminaReviewPolicy;

const char        *lamina_review_policy_to_string   (LaminaReviewPolicy  policy);
gboolean           lamina_review_policy_from_string (const char         *text,
                                                     LaminaReviewPolicy *policy);
/* A sentence for sheets and history ("four eyes: checked and approved by
 * others than the author"). */
const char        *lamina_review_policy_describe    (LaminaReviewPolicy  policy);
/* The same without its label ("checked and approved by others than the
 * author"), for output that already names the policy. */
const char        *lamina_review_policy_explain     (LaminaReviewPolicy  policy);
LaminaReviewPolicy lamina_library_get_review_policy (LaminaLibrary      *self);
gboolean           lamina_library_set_review_policy (LaminaLibrary      *self,
                                                     LaminaReviewPolicy  policy,
                                                     GError            **error);

/* One review act, kept for good: "checked", "approved" or "withdrawn". */
typedef struct
{
  int   revision;
  char *act;
  char *by;
  char *at;        /* when it was recorded, ISO 8601 UTC */
  char *date;      /* the approval date given, YYYY-MM-DD, or NULL */
  char *policy;    /* of an approval: "four-eyes" or "single" */
  char *reason;    /* override reason of an approval, or why withdrawn */
} LaminaReviewEvent;

void           lamina_review_event_free         (LaminaReviewEvent *event);
/* LaminaReviewEvent*, oldest first. */
GPtrArray     *lamina_library_dup_review_events (LaminaLibrary     *self,
                                                 const char        *id,
                                                 GError           **error);
/* Approval with everything it may need: @revision must be the latest and
 * checked (0 = the latest); the policy applies (POLICY); @date, NULL =
 * today, is not before the revision's modification; a construction whose
 * result carries a method-limit warning (lamina_field_is_advised ()) needs
 * a stored 2-D check of that revision or an override @reason (SCOPE),
 * which is recorded and printed on the sheet. */
gboolean       lamina_library_approve_with_reason (LaminaLibrary   *self,
                                                   const char      *id,
                                                   int              revision,
                                                   const char      *name,
                                                   const char      *date,
                                                   const char      *reason,
                                                   GError         **error);
/* Withdraws the approval of @revision (0 = the latest), which must be the
 * latest and approved; @reason is required and recorded.  The revision is
 * "checked" again and can be approved anew. */
gboolean       lamina_library_withdraw_approval (LaminaLibrary     *self,
                                                 const char        *id,
                                                 int                revision,
                                                 const char        *name,
                                                 const char        *reason,
                                                 GError           **error);

/* ---- Material data changed since review ------------------------------ */

typedef struct
{
  char           *material_id;
  LaminaMaterial *stored;   /* what the construction's layers hold */
  LaminaMaterial *library;  /* what the library holds now (NULL: deleted) */
} LaminaMaterialChange;

void           lamina_material_change_free (LaminaMaterialChange   *change);
/* LaminaMaterialChange* for the latest revision of @id; empty when the
 * layers agree with the library. */
GPtrArray     *lamina_library_list_material_changes (LaminaLibrary *self,
                                                     const char    *id,
                                                     GError       **error);
/* The user's act: copies the library's current data into the layers of
 * @id as a new draft revision (recalculated); refused with STALE unless
 * @base_revision is the latest.  Returns the new revision, 0 on error. */
int            lamina_library_update_materials (LaminaLibrary *self,
                                                const char    *id,
                                                int            base_revision,
                                                const char    *author,
                                                GError       **error);

/* ---- Listing and search ---------------------------------------------- */

typedef enum
{
  LAMINA_SORT_CODE,
  LAMINA_SORT_NAME,
  LAMINA_SORT_U,            /* corrected U */
  LAMINA_SORT_THICKNESS,
  LAMINA_SORT_MODIFIED,     /* date of the latest revision */
  LAMINA_SORT_RELEVANCE,    /* search rank; falls back to CODE without text */
  LAMINA_N_SORTS
} LaminaSortKey;

typedef struct
{
  const char    *text;          /* as typed: every word must match a prefix
                                   of a word in code, name, description,
                                   tags or material names; NULL = any */
  int            element;       /* LaminaElement, or -1 = any */
  int            status;        /* LaminaStatus, or -1 = any */
  const char    *tag;           /* exact tag, or NULL */
  double         min_u;         /* corrected U, W/(m²·K); NAN = open */
  double         max_u;
  double         min_thickness; /* mm; NAN = open */
  double         max_thickness;
  gboolean       material_changed_only;
  gboolean       moisture_fails_only;  /* fails its EN ISO 13788 check */
  LaminaSortKey  sort;
  gboolean       descending;
  guint          offset;        /* paging for a virtualised list */
  guint          limit;         /* 0 = no limit */
} LaminaLibraryQuery;

/* Fills @query with "everything, sorted by code, no paging". */
void           lamina_library_query_init   (LaminaLibraryQuery     *query);

typedef enum
{
  LAMINA_SUMMARY_NONE             = 0,
  LAMINA_SUMMARY_MATERIAL_CHANGED = 1 << 0, /* material data changed since review */
  LAMINA_SUMMARY_TARGET_NOT_MET   = 1 << 1, /* corrected U above target U */
  LAMINA_SUMMARY_HAS_WARNINGS     = 1 << 2, /* lamina_calculate gave warnings */
  LAMINA_SUMMARY_NOT_CALCULATED   = 1 << 3, /* invalid: U and figures are NAN */
  LAMINA_SUMMARY_MOISTURE_FAILS   = 1 << 8, /* fails its EN ISO 13788 check */
  LAMINA_SUMMARY_HAS_MOISTURE     = 1 << 9, /* has an EN ISO 13788 check */
} LaminaSummaryFlags;

/* A light row of the list: no layers. */
typedef struct
{
  char               *id;
  char               *code;
  char               *name;
  LaminaElement       element;
  LaminaStatus        status;
  int                 revision;
  double              u;            /* W/(m²·K), NAN if not calculated */
  double              u_corrected;
  double              target_u;     /* NAN if none */
  double              thickness;    /* mm */
  char               *modified_at;
  LaminaSummaryFlags  flags;
} LaminaSummary;

void           lamina_summary_free         (LaminaSummary          *summary);
/* LaminaSummary*, one page as asked by @query. */
GPtrArray     *lamina_library_search       (LaminaLibrary            *self,
                                            const LaminaLibraryQuery *query,
                                            GError                  **error);
/* How many rows @query matches, ignoring offset and limit; -1 on error. */
gint64         lamina_library_count        (LaminaLibrary            *self,
                                            const LaminaLibraryQuery *query,
                                            GError                  **error);
/* The count of @query, stopped early: the exact count when it is at most
 * @at_most, otherwise @at_most + 1 ("1,000+ constructions"); -1 on error.
 * Bounded in time whatever the library's size. */
gint64         lamina_library_count_at_most (LaminaLibrary            *self,
                                             const LaminaLibraryQuery *query,
                                             gint64                    at_most,
                                             GError                  **error);
/* All tags in use, sorted (char*). */
GPtrArray     *lamina_library_list_tags    (LaminaLibrary          *self,
                                            GError                **error);

/* ---- Exchange with the catalogue XML --------------------------------- */

typedef enum
{
  LAMINA_IMPORT_DEFAULT         = 0,
  LAMINA_IMPORT_DRY_RUN         = 1 << 0, /* report only, write nothing */
  LAMINA_IMPORT_REVISE_APPROVED = 1 << 1, /* a change to an approved
                                             construction becomes a new
                                             draft revision, not a conflict */
  LAMINA_IMPORT_UPDATE_MATERIALS = 1 << 2,/* replace differing library
                                             materials (flags users) */
  LAMINA_IMPORT_KEEP_REVIEW     = 1 << 3, /* a new construction keeps the
                                             document's review state
                                             (approved elsewhere); without
                                             it, it arrives as a draft and
                                             the record is kept in words */
} LaminaImportFlags;

typedef enum
{
  LAMINA_IMPORT_ADDED,     /* new id */
  LAMINA_IMPORT_REVISED,   /* changed: stored as a new draft revision */
  LAMINA_IMPORT_SKIPPED,   /* identical content */
  LAMINA_IMPORT_CONFLICT,  /* differs from an approved revision (or a
                              library material): not applied */
} LaminaImportAction;

typedef struct
{
  LaminaImportAction  action;
  gboolean            is_material;
  char               *id;
  char               *name;
  int                 revision;   /* the revision stored or compared with */
  char               *message;    /* a sentence for the user */
} LaminaImportItem;

typedef struct
{
  GPtrArray *items;               /* LaminaImportItem*, in document order */
  guint      n_added;             /* constructions */
  guint      n_revised;
  guint      n_skipped;
  guint      n_conflicts;
  guint      n_materials_added;
  guint      n_materials_updated;
} LaminaImportReport;

void           lamina_import_report_free   (LaminaImportReport     *report);
/* One line for the window and the command line alike: "20 added,
 * 0 revised, 0 unchanged, 1 conflict; 33 materials added, 0 updated". */
char          *lamina_import_report_dup_summary (const LaminaImportReport *report);

/* All or nothing, in one transaction: on error nothing is written.  The
 * computed figures in @catalogue are never trusted: every construction is
 * recalculated. */
LaminaImportReport *lamina_library_import  (LaminaLibrary          *self,
                                            const LaminaCatalogue  *catalogue,
                                            LaminaImportFlags       flags,
                                            const char             *author,
                                            GError                **error);
/* The latest revisions of @ids (NULL = every construction) with the
 * materials they use (all library materials when @ids is NULL), with
 * status, code, tags, revision and review data. */
LaminaCatalogue *lamina_library_export     (LaminaLibrary          *self,
                                            const char * const     *ids,
                                            GError                **error);

/* ---- Target sets and jobs -------------------------------------------- */

/* LaminaTargetSet*, by name. */
GPtrArray     *lamina_library_list_target_sets (LaminaLibrary        *self,
                                                GError              **error);
LaminaTargetSet *lamina_library_dup_target_set (LaminaLibrary        *self,
                                                const char           *id,
                                                GError              **error);
/* Adds or replaces the set of @set->id (INVALID names the faulty target). */
gboolean       lamina_library_put_target_set   (LaminaLibrary         *self,
                                                const LaminaTargetSet *set,
                                                GError               **error);
/* Refused (INVALID, naming the jobs) while a job uses the set. */
gboolean       lamina_library_delete_target_set (LaminaLibrary       *self,
                                                 const char          *id,
                                                 GError             **error);

/* LaminaJob*, by number, then name. */
GPtrArray     *lamina_library_list_jobs        (LaminaLibrary        *self,
                                                GError              **error);
LaminaJob     *lamina_library_dup_job          (LaminaLibrary        *self,
                                                const char           *id,
                                                GError              **error);
/* The id of the job that @key names: the job whose id is @key, else the
 * one job whose number is @key (ASCII letters without case).  NOT_FOUND
 * when none; INVALID, naming both jobs, when @key is one job's id and
 * another job's number, or naming them when it is the number of several
 * jobs. */
char          *lamina_library_dup_job_id       (LaminaLibrary        *self,
                                                const char           *key,
                                                GError              **error);
/* Stores a new job (EXISTS if the id is taken) or the changed one
 * (NOT_FOUND if there is none); the job is validated, its target set must
 * be in the library and every use one of the set's.  Sets modified_at. */
gboolean       lamina_library_create_job       (LaminaLibrary        *self,
                                                LaminaJob            *job,
                                                GError              **error);
gboolean       lamina_library_save_job         (LaminaLibrary        *self,
                                                LaminaJob            *job,
                                                GError              **error);
gboolean       lamina_library_delete_job       (LaminaLibrary        *self,
                                                const char           *id,
                                                GError              **error);

/* An entry of a job naming a construction (what the library shows for
 * each construction). */
typedef struct
{
  char            *job_id;
  char            *job_name;
  char            *job_number;
  LaminaJobStatus  status;
  int              entry;
  int              revision;
  char            *use;
} LaminaJobUse;

void           lamina_job_use_free             (LaminaJobUse         *use);
/* LaminaJobUse*, by job number. */
GPtrArray     *lamina_library_list_job_uses    (LaminaLibrary        *self,
                                                const char           *construction_id,
                                                GError              **error);

/* The revision a new entry pins when none is asked (0): the latest
 * approved revision, else the latest (then *@approved is FALSE).  A
 * revision asked for must exist (NOT_FOUND). */
int            lamina_library_pick_revision    (LaminaLibrary        *self,
                                                const char           *construction_id,
                                                int                   revision,
                                                gboolean             *approved,
                                                GError              **error);

/* A job with everything its check and its sheets need, owned together:
 * each entry's construction at its pinned revision in the job's design
 * conditions (NULL if missing) and its result, the target set, and the
 * check (lamina-job-check.h). */
typedef struct
{
  LaminaJob          *job;
  LaminaTargetSet    *targets;        /* NULL if the job has none */
  GPtrArray          *constructions;  /* LaminaConstruction* or NULL, per entry */
  GPtrArray          *results;        /* LaminaResult* or NULL, per entry */
  LaminaJobInput     *inputs;
  LaminaJobCheck     *check;
  /* EN ISO 13788 per entry, for a use whose target asks a moisture
   * criterion: LaminaMoistureResult* or NULL, and why not (char* or
   * NULL).  The climate is the job's, else the construction's own. */
  GPtrArray          *moisture;
  GPtrArray          *moisture_problems;
  LaminaClimate      *climate;        /* the job's, NULL if none or unknown */
  /* The job names a climate the library does not hold. */
  gboolean            climate_unknown;
} LaminaJobReport;

void           lamina_job_report_free          (LaminaJobReport      *report);
LaminaJobReport *lamina_library_check_job      (LaminaLibrary        *self,
                                                const char           *id,
                                                GError              **error);
/* The user's act: moves entry @n of job @id to @revision (0 = the newest
 * approved) and records who and when in the job's log. */
gboolean       lamina_library_move_job_entry   (LaminaLibrary        *self,
                                                const char           *id,
                                                int                   n,
                                                int                   revision,
                                                const char           *author,
                                                GError              **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaJobUse, lamina_job_use_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaJobReport, lamina_job_report_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaRevisionInfo, lamina_revision_info_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaReviewEvent, lamina_review_event_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaMaterialChange, lamina_material_change_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaSummary, lamina_summary_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaImportReport, lamina_import_report_free)

/* ---- The 2-D check (EN ISO 10211) stored with a revision --------------
 *
 * EN ISO 6946 does not apply where metal bridges insulation or R'T/R''T
 * exceeds 1.5 (the engine's method-limit warnings, see
 * lamina_field_is_advised ()).  A 2-D check of one module answers for
 * such a construction; its figures are stored with the revision they were
 * calculated for.  A revision never changes, so a stored check stays true
 * of it; a new revision (changed content) has none until it is checked
 * again (lamina_library_refresh_field_check ()). */
typedef struct
{
  int      revision;
  double   u;                 /* W/(m²·K), 2-D plus the Annex F ΔU */
  double   u_6946;
  double   heat_flow;         /* W/m per module, design temperatures */
  double   min_inner_surface_temperature;     /* °C, Rsi as for U */
  double   f_rsi;
  double   min_inner_surface_temperature_mould; /* °C, Rsi 0.25 */
  double   f_rsi_mould;
  double   module_width;      /* mm */
  guint    cells;
  gboolean converged;         /* the last halving changed U < 0.1 % */
  double   change;            /* relative change of the last halving */
} LaminaFieldCheck;

void              lamina_field_check_free (LaminaFieldCheck *check);
/* The figures of @result for @revision. */
LaminaFieldCheck *lamina_field_check_new_from_result (const LaminaFieldResult *result,
                                                      int                      revision);

/* The check stored with revision @revision of @id (0 = the latest); NULL
 * with LAMINA_LIBRARY_ERROR_NOT_FOUND when that revision has none (a check
 * of an earlier revision does not count: the content changed since). */
LaminaFieldCheck *lamina_library_dup_field_check (LaminaLibrary *self,
                                                  const char    *id,
                                                  int            revision,
                                                  GError       **error);
/* Whether revision @revision (0 = latest) has a stored 2-D check: what the
 * approval of a construction with a method-limit warning asks for. */
gboolean          lamina_library_has_field_check (LaminaLibrary *self,
                                                  const char    *id,
                                                  int            revision);
/* Stores @result as the check of revision @revision (which must exist). */
gboolean          lamina_library_put_field_check (LaminaLibrary           *self,
                                                  const char              *id,
                                                  int                      revision,
                                                  const LaminaFieldResult *result,
                                                  GError                 **error);
/* The check of the latest revision: the stored one, or calculated now
 * (lamina_field_calculate, slow: seconds) and stored.  @result, if not
 * NULL, receives the full result (with the field for a picture) when one
 * was calculated, else NULL. */
LaminaFieldCheck *lamina_library_refresh_field_check (LaminaLibrary       *self,
                                                      const char          *id,
                                                      LaminaFieldProgress  progress,
                                                      gpointer             user_data,
                                                      LaminaFieldResult  **result,
                                                      GError             **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaFieldCheck, lamina_field_check_free)

G_END_DECLS
