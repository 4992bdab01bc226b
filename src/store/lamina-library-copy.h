/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-copy.h: moving a whole office library, with its history,
 * from one library to another (a file to a server and back). */
#pragma once

#include "lamina-library.h"

G_BEGIN_DECLS

/* What a copy wrote, per kind. */
typedef struct
{
  guint constructions;   /* every construction, deleted ones included */
  guint deleted;         /* of which deleted (kept with their history) */
  guint revisions;
  guint review_records;
  guint field_checks;    /* stored 2-D checks (EN ISO 10211) */
  guint materials;
  guint climates;
  guint target_sets;
  guint jobs;
  guint settings;        /* the review policy and other library settings */
} LaminaCopyReport;

/* Copies everything @from stores into @to in one transaction of @to, all
 * or nothing: every revision keeps its number, author, dates, figures and
 * comment, every review record and 2-D check is kept, and so are the
 * materials (@to's are replaced), climates, target sets, jobs and the
 * review policy.  @to must hold no construction, review record, job or
 * target set: otherwise EXISTS and nothing is written.  @report (may be
 * NULL) receives the counts. */
gboolean lamina_library_copy (LaminaLibrary     *from,
                              LaminaLibrary     *to,
                              LaminaCopyReport  *report,
                              GError           **error);

G_END_DECLS
