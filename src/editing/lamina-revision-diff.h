/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-revision-diff.h: what changed between two revisions of a
 * construction, as sentences for the history window.  No GTK. */
#pragma once

#include "lamina-construction.h"
#include "lamina-library.h"

G_BEGIN_DECLS

/* char* sentences, translated; empty when the content is the same. */
GPtrArray *lamina_revision_diff (const LaminaConstruction *older,
                                 const LaminaConstruction *newer);

/* What job variant @entry changes from its origin at the origin's pinned
 * revision, its own name and code aside (sentences as above; one sentence saying what is missing when
 * either revision is not in @library); NULL when @entry is no variant. */
GPtrArray *lamina_revision_diff_job_entry (LaminaLibrary        *library,
                                           const LaminaJobEntry *entry);

/* "Job variant of ORIGIN revision N: what differs." for @entry; NULL when
 * it is no variant. */
char      *lamina_revision_diff_dup_variant_text (LaminaLibrary        *library,
                                                  const LaminaJobEntry *entry);
/* Adds to each job variant's line of @report's check one note naming its
 * origin and what it changes (what the sheet set prints under the
 * entry). */
void       lamina_revision_diff_note_variants (LaminaLibrary   *library,
                                               LaminaJobReport *report);

G_END_DECLS
