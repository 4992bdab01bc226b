/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet.h: PDF specification sheets, one construction per page,
 * and catalogues (a cover, a linked index, the sheets, bookmarks and
 * document metadata).  Pages are drawn and written one at a time, so a
 * catalogue of hundreds of sheets holds only its index in memory.  Output
 * is atomic: a temporary file beside the target, renamed when complete. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "lamina-calc.h"
#include "lamina-construction.h"
#include "lamina-job-check.h"

G_BEGIN_DECLS

#define LAMINA_SHEET_ERROR (lamina_sheet_error_quark ())
typedef enum
{
  LAMINA_SHEET_ERROR_IO,      /* cannot write the output */
  LAMINA_SHEET_ERROR_EXISTS,  /* the output exists and overwrite is off */
  LAMINA_SHEET_ERROR_INVALID, /* a construction cannot be calculated */
} LaminaSheetError;
GQuark lamina_sheet_error_quark (void);

typedef enum
{
  LAMINA_PAPER_A4,
  LAMINA_PAPER_A3,
  LAMINA_PAPER_LETTER,
  LAMINA_N_PAPERS
} LaminaPaper;

/* The job a sheet is issued for: a band above the construction's header
 * with the job's name and number, the client and the entry's use. */
typedef struct
{
  const char  *name;
  const char  *number;
  const char  *client;
  const char  *use;       /* the entry's use, or NULL */
} LaminaSheetJob;

typedef struct
{
  const char  *practice;  /* header of every sheet; NULL = none */
  const char  *title;     /* catalogue title on the cover; NULL = default */
  const char  *library;   /* where the sheets come from; never printed
                             (a local path has no place on a sheet) */
  const char  *printed;   /* print date as shown; NULL = today (or
                             SOURCE_DATE_EPOCH when set) */
  LaminaPaper  paper;
  const LaminaSheetJob *job; /* NULL: a library sheet */
  gboolean     field_check; /* a single sheet of a construction outside the
                               scope of EN ISO 6946 (lamina_field_is_advised)
                               continues on a page with its 2-D check
                               (EN ISO 10211), and its warnings say so;
                               calculated while writing (seconds) */
  double       moisture_limit; /* the office's limit on the largest
                                  accumulation (EN ISO 13788), kg/m²;
                                  0 or NAN: the default (0.5) */
} LaminaSheetOptions;

/* Returns an owned construction for @index (0 … n − 1), or NULL with
 * @error set.  Called twice per construction: once for the index, once
 * for its sheet. */
typedef LaminaConstruction *(*LaminaSheetFetch)    (gpointer   user_data,
                                                    guint      index,
                                                    GError   **error);
typedef void                (*LaminaSheetProgress) (gpointer   user_data,
                                                    guint      done,
                                                    guint      total);
/* Asked before each sheet is drawn: FALSE, with @error set, stops the
 * writing, and nothing is written (a worker's Cancel). */
typedef gboolean            (*LaminaSheetContinue) (gpointer   user_data,
                                                    GError   **error);

void        lamina_sheet_options_init (LaminaSheetOptions *options);
const char *lamina_paper_to_string    (LaminaPaper         paper);
gboolean    lamina_paper_from_string  (const char         *name,
                                       LaminaPaper        *paper);
/* Page size in points (1/72 in). */
void        lamina_paper_get_size     (LaminaPaper         paper,
                                       double             *width,
                                       double             *height);

/* One sheet, one page. */
gboolean lamina_sheet_write_pdf       (const char               *path,
                                       gboolean                  overwrite,
                                       const LaminaSheetOptions *options,
                                       const LaminaConstruction *construction,
                                       GError                  **error);
/* Cover, index, @n sheets. */
gboolean lamina_sheet_write_catalogue (const char               *path,
                                       gboolean                  overwrite,
                                       const LaminaSheetOptions *options,
                                       guint                     n,
                                       LaminaSheetFetch          fetch,
                                       gpointer                  fetch_data,
                                       LaminaSheetProgress       progress,
                                       gpointer                  progress_data,
                                       GError                  **error);

/* A job's sheet set: a cover (job, number, client, architect, date,
 * status), the schedule with its check and totals, then the sheet of each
 * entry's construction with the job's band.  @check's lines hold the
 * constructions in the job's design conditions (lamina_library_check_job);
 * an entry whose construction is missing is listed, with no sheet. */
gboolean lamina_sheet_write_job       (const char               *path,
                                       gboolean                  overwrite,
                                       const LaminaSheetOptions *options,
                                       const LaminaJob          *job,
                                       const LaminaTargetSet    *targets,
                                       const LaminaJobCheck     *check,
                                       GError                  **error);
/* The same with progress (sheets done of the total) and a question
 * before each sheet (@keep_going, NULL: always), both given @data. */
gboolean lamina_sheet_write_job_full  (const char               *path,
                                       gboolean                  overwrite,
                                       const LaminaSheetOptions *options,
                                       const LaminaJob          *job,
                                       const LaminaTargetSet    *targets,
                                       const LaminaJobCheck     *check,
                                       LaminaSheetProgress       progress,
                                       LaminaSheetContinue       keep_going,
                                       gpointer                  data,
                                       GError                  **error);

/* The sheet of one entry of a job (@line of its check) as the job's sheet
 * set prints it: the job's band with the entry's use, U compared with the
 * use's target, the entry's EN ISO 13788 criteria in the warnings, in the
 * job's design conditions. */
gboolean lamina_sheet_write_job_entry (const char               *path,
                                       gboolean                  overwrite,
                                       const LaminaSheetOptions *options,
                                       const LaminaJob          *job,
                                       const LaminaJobLine      *line,
                                       GError                  **error);

G_END_DECLS
