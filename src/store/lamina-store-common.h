/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-store-common.h: what every backend derives from a construction
 * or record the same way before storing it (private to src/store): the
 * bodies of target sets and jobs, the list flags, the materials a
 * revision was calculated with, the words of the search index, and the
 * seed materials. */
#pragma once

#include <glib.h>

#include "lamina-library.h"

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
