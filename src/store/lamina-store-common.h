/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-store-common.h: what every backend derives from a construction
 * or record the same way before storing it (private to src/store): the
 * bodies of target sets and jobs, the list flags, the materials a
 * revision was calculated with, the words of the search index, and the
 * seed materials. */
#pragma once

#include <glib.h>

#include "lamina-library.h"
#include "lamina-library-backend.h"

G_BEGIN_DECLS

/* A catalogue document holding @set or @job (one of them), as a target
 * set or job row keeps it; NULL with @error set. */
char              *lamina_store_record_body_dup   (const LaminaTargetSet *set,
                                                   const LaminaJob       *job,
                                                   GError               **error);
/* Reads a stored record body back (@len -1: NUL-terminated). */
LaminaCatalogue   *lamina_store_record_body_read  (const char  *text,
                                                   gssize       len,
                                                   const char  *id,
                                                   GError     **error);

/* Refuses a revision of @c based on @base (0: a new construction) when
 * the library's latest is @head (0: none) and @deleted: an id taken, a
 * missing construction, or a stale edit (someone saved since). */
gboolean           lamina_store_check_base        (const LaminaConstruction *c,
                                                   int                       base,
                                                   int                       head,
                                                   gboolean                  deleted,
                                                   GError                  **error);

/* The refusal of a second construction with office code @code; @user:
 * the name (or id) of the construction that has it. */
void               lamina_store_set_code_used_error (GError     **error,
                                                     const char  *code,
                                                     const char  *user);

/* Refuses an edit in place of draft @draft of @id when the library's
 * latest is @head (0: none), @deleted, in @status, and @same_stamp (its
 * stored state carries the editor's stamp): a missing construction, or a
 * draft someone else has since saved over or reviewed. */
gboolean           lamina_store_check_draft_head  (const char    *id,
                                                   int            draft,
                                                   int            head,
                                                   gboolean       deleted,
                                                   LaminaStatus   status,
                                                   gboolean       same_stamp,
                                                   GError       **error);

/* A construction's row, from its latest revision: what the list, the
 * filters and the search read.  The strings are borrowed. */
typedef struct
{
  const char *id;
  int         head;
  const char *code;
  const char *name;         /* "" when the construction has none */
  const char *element;
  const char *status;
  double      u;            /* NAN: not calculated */
  double      u_corrected;
  double      target_u;
  double      thickness;
  int         flags;        /* LaminaSummaryFlags */
  const char *modified_at;
  const char *deleted_at;   /* NULL while live */
  gboolean    material_changed;
} LaminaStoreConstructionRow;

/* The row of @c stored now with result @r (NULL: not calculable), its
 * moisture flags judged against @moisture_limit (NAN: the default). */
void               lamina_store_construction_row_for_revision (LaminaStoreConstructionRow *row,
                                                               const LaminaConstruction   *c,
                                                               const LaminaResult         *r,
                                                               double                      moisture_limit);
/* The row of a copied construction, as its source stored it; @record's
 * head revision has been parsed (LaminaBackendRecordRevision.construction). */
void               lamina_store_construction_row_for_record   (LaminaStoreConstructionRow *row,
                                                               const LaminaBackendRecord   *record);
/* The revision row of @rev (figures from its result, who and when from
 * its construction) with body @body, borrowed. */
void               lamina_store_revision_row_for              (LaminaBackendRecordRevision        *row,
                                                               const LaminaBackendRevision        *rev,
                                                               const char                          *body);

/* The list flags of a revision's result @r (NULL: not calculable); the
 * moisture flags come from lamina_library_moisture_flags_for_limit. */
LaminaSummaryFlags lamina_store_summary_flags     (const LaminaResult       *r);

/* Material id → fingerprint (owned) of every material of @c's layers
 * and parts; @names (if not NULL) gets their names, space separated. */
GHashTable        *lamina_store_collect_materials (const LaminaConstruction *c,
                                                   GString                  *names);

/* The words of @text as the SQLite search index splits them (runs of
 * letters, digits and marks), lower case, without diacritics, appended
 * to @words (owned strings) unless there already. */
void               lamina_store_add_search_words  (GPtrArray  *words,
                                                   const char *text);

/* Seed material @i (lamina_library_get_seed_materials) as a material
 * with its notes. */
LaminaMaterial    *lamina_store_seed_material_new (guint i);

G_END_DECLS
