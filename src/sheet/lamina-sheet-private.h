/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-private.h: the state shared by the page painters. */
#pragma once

#include <pango/pangocairo.h>

#include "lamina-field.h"
#include "lamina-section.h"
#include "lamina-moisture.h"
#include "lamina-sheet.h"

G_BEGIN_DECLS

typedef enum
{
  SHEET_FONT_BODY,
  SHEET_FONT_BOLD,
  SHEET_FONT_SMALL,
  SHEET_FONT_LABEL,     /* small captions above values */
  SHEET_FONT_HEADING,
  SHEET_FONT_TITLE,
  SHEET_FONT_CODE,
  SHEET_FONT_BIG,
  SHEET_FONT_WATERMARK,
  SHEET_N_FONTS
} SheetFont;

/* One row of the catalogue index: what the index page shows. */
typedef struct
{
  char          *code;
  char          *name;
  LaminaElement  element;
  LaminaStatus   status;
  double         u;
  double         thickness;
  guint          extra_pages;  /* pages after the first (EN ISO 13788) */
  guint          page;         /* of the sheet's first page */
} SheetIndexEntry;

typedef struct
{
  cairo_t                  *cr;           /* borrowed */
  const LaminaSheetOptions *options;      /* borrowed */
  PangoLayout              *layout;       /* owned, reused for all text */
  PangoFontDescription     *fonts[SHEET_N_FONTS];
  LaminaSection            *section;      /* owned */
  LaminaSectionLayout       section_layout;
  double                    width, height;          /* page, pt */
  double                    left, right, top, bottom; /* content box */
  double                    grey;                   /* secondary text */
  guint                     page, n_pages;
  const char               *dest;         /* named destination of the page */
  char                      printed[32];
  const LaminaFieldResult  *field;        /* borrowed: the 2-D check of the
                                             construction on the page, or NULL */
  const LaminaMoistureResult *moisture;   /* borrowed: the EN ISO 13788 check of
                                             the construction on the page, or NULL */
  gboolean                  moisture_page; /* the sheet continues with it */
  char                     *footer;       /* owned: what the page is (practice,
                                             code, revision, date); NULL = the
                                             practice and the title */
  const LaminaJobLine      *job_line;     /* the entry on a job's sheet, or NULL */
} SheetContext;

/* A job's sheet set being written (lamina-sheet-job.c). */
typedef struct
{
  const LaminaJob       *job;
  const LaminaTargetSet *targets;    /* NULL if none */
  const LaminaJobCheck  *check;
  GPtrArray             *sheets;     /* LaminaJobLine* with a construction */
  LaminaSheetJob         band;
  LaminaSheetOptions     options;    /* the caller's, with .job = &band */
  gboolean               front;      /* the cover and the schedule first;
                                        FALSE: one entry's sheet alone */
  LaminaSheetContinue    keep_going; /* NULL: always */
  gpointer               keep_going_data;
} SheetJobSet;

/* Pages of the cover and the schedule. */
guint  sheet_job_count_front (SheetContext      *ctx,
                              const SheetJobSet *set);
/* Draws and ends the cover and schedule pages from page 1. */
void   sheet_job_draw_front  (SheetContext      *ctx,
                              const SheetJobSet *set,
                              guint              first_sheet_page);
/* The line a job's sheet adds to its warnings: the entry's EN ISO 13788
 * criteria against the job's target for its use (NULL when the target
 * asks none or the sheet is not a job's). */
char  *sheet_job_dup_criteria_text (const SheetContext *ctx);
/* The band with the job above a construction's header; returns the y
 * below it. */
double sheet_draw_job_band   (SheetContext      *ctx,
                              double             y);
/* lamina-sheet-document.c: the pages of a job's set. */
gboolean sheet_write_job_document (const char          *path,
                                   gboolean             overwrite,
                                   const SheetJobSet   *set,
                                   LaminaSheetProgress  progress,
                                   gpointer             progress_data,
                                   GError             **error);

void   sheet_context_init    (SheetContext             *ctx,
                              cairo_t                  *cr,
                              const LaminaSheetOptions *options);
void   sheet_context_clear   (SheetContext             *ctx);

/* Sets the text; returns its logical size.  @width > 0 wraps. */
void   sheet_text_set        (SheetContext *ctx,
                              SheetFont     font,
                              const char   *text,
                              double        width,
                              double       *text_width,
                              double       *text_height);
/* Draws text with its top at @y; x is the left, centre or right edge by
 * @align.  Returns the height used. */
double sheet_text            (SheetContext   *ctx,
                              SheetFont       font,
                              const char     *text,
                              double          x,
                              double          y,
                              double          width,
                              PangoAlignment  align);
/* One line cut with an ellipsis to @width. */
void   sheet_text_line       (SheetContext   *ctx,
                              SheetFont       font,
                              const char     *text,
                              double          x,
                              double          y,
                              double          width,
                              PangoAlignment  align);
void   sheet_rule            (SheetContext   *ctx,
                              double          y,
                              double          weight,
                              double          grey);

void   sheet_draw_frame      (SheetContext   *ctx,
                              gboolean        draft);
void   sheet_draw_footer     (SheetContext   *ctx);
/* Draws a construction's sheet from ctx->page on: a sheet whose text does
 * not fit goes on over further pages (ended here; the caller ends the
 * last), so ctx->page is the sheet's last page on return. */
void   sheet_draw_page       (SheetContext             *ctx,
                              const LaminaConstruction *construction,
                              const LaminaResult       *result);
/* The pages sheet_draw_page takes for the construction (1 + its
 * continuation pages), with the 2-D check's and the moisture check's
 * summaries it will print. */
guint  sheet_count_pages     (const LaminaSheetOptions   *options,
                              const LaminaConstruction   *construction,
                              const LaminaResult         *result,
                              const LaminaFieldResult    *field,
                              const LaminaMoistureResult *moisture,
                              const LaminaJobLine        *job_line);
void   sheet_draw_cover      (SheetContext   *ctx,
                              guint           n);
/* Rows @first … @first + count − 1 of the index; returns rows drawn. */
guint  sheet_draw_index      (SheetContext           *ctx,
                              const SheetIndexEntry  *entries,
                              guint                   n,
                              guint                   first,
                              guint                   first_sheet_page);
guint  sheet_index_rows_per_page (const SheetContext *ctx,
                                  gboolean            first_page);

/* The Annex F corrections by layer, one line each, and the total; NULL
 * when the construction has none. */
char       *sheet_dup_corrections_text (const LaminaConstruction *c,
                                        const LaminaResult       *result);

/* A one-page PDF drawn by @paint (atomic like the sheets); @title goes
 * into the metadata. */
typedef gboolean (*SheetPaintFunc) (SheetContext *ctx,
                                    gpointer      user_data,
                                    GError      **error);
gboolean    sheet_write_single_page (const char               *path,
                                     gboolean                  overwrite,
                                     const LaminaSheetOptions *options,
                                     const char               *title,
                                     SheetPaintFunc            paint,
                                     gpointer                  paint_data,
                                     GError                  **error);
/* EN ISO 13370 block of a ground floor (0 / @y when there is none), and
 * the lines on a tapered layer, an unheated space and Annex C/D (NULL
 * when none applies); lamina-sheet-method.c. */
double      sheet_measure_ground       (SheetContext             *ctx,
                                        const LaminaConstruction *c,
                                        const LaminaResult       *result);
double      sheet_draw_ground          (SheetContext             *ctx,
                                        const LaminaConstruction *c,
                                        const LaminaResult       *result,
                                        double                    y);
char       *sheet_dup_method_text      (const LaminaConstruction *c,
                                        const LaminaResult       *result);

/* lamina-sheet-field.c: the 2-D check's page, and the sentence that the
 * first page's warnings carry about it. */
void        sheet_draw_field_page   (SheetContext             *ctx,
                                     const LaminaConstruction *construction,
                                     const LaminaFieldResult  *field);
char       *sheet_dup_field_summary (const LaminaFieldResult  *field);

/* lamina-sheet-moisture.c: the EN ISO 13788 page of a construction with a
 * moisture check, and the sentence the first page carries about it. */
void        sheet_draw_moisture_page   (SheetContext               *ctx,
                                        const LaminaConstruction   *construction,
                                        const LaminaMoistureResult *result);
char       *sheet_dup_moisture_summary (const LaminaConstruction   *construction,
                                        const LaminaMoistureResult *result,
                                        gboolean                    with_page);

const char *sheet_element_label (LaminaElement element);
const char *sheet_status_label  (LaminaStatus  status);

G_END_DECLS
