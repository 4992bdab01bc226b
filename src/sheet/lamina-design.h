/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-design.h: design aids drawn by the sheet code, so that the
 * window, lamina-cli and the tests share one drawing: the dynamic
 * characteristics (EN ISO 13786) as text, the chart of U against one
 * layer's thickness with the target, and two build-ups side by side. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "lamina-dynamic.h"
#include "lamina-sheet.h"
#include "lamina-solve.h"

G_BEGIN_DECLS

/* The dynamic figures in a paragraph, in the locale's number format, or
 * why they are left out (a material without density or specific heat). */
char      *lamina_dynamic_dup_text   (const LaminaConstruction *construction,
                                      const LaminaResult       *result);

/* U against the thickness of layer @solve->layer from 0 to beyond the
 * solved and the current thickness, with the target line and marks at the
 * current, exact and snapped thicknesses, in the rectangle given in user
 * units; @unit is the text size.  Draws nothing for a NULL @solve but the
 * frame. */
void       lamina_solve_chart_draw   (cairo_t                  *cr,
                                      double                    x,
                                      double                    y,
                                      double                    width,
                                      double                    height,
                                      double                    unit,
                                      const LaminaConstruction *construction,
                                      const LaminaSolve        *solve);
gboolean   lamina_solve_chart_write_png (const LaminaConstruction *construction,
                                         const LaminaSolve        *solve,
                                         int                       width,
                                         int                       height,
                                         const char               *path,
                                         GError                  **error);

/* One figure of a comparison, formatted; @difference is B − A, empty
 * where a difference means nothing. */
typedef struct
{
  const char *label;
  const char *unit;
  char        a[48];
  char        b[48];
  char        difference[48];
} LaminaComparisonRow;

/* Every figure of the two results (EN ISO 6946, the target, EN ISO 13786
 * where both have it) as rows (LaminaComparisonRow*, owned). */
GPtrArray *lamina_comparison_rows    (const LaminaConstruction *a,
                                      const LaminaResult       *result_a,
                                      const LaminaConstruction *b,
                                      const LaminaResult       *result_b);

/* The one-page comparison at the paper size of @options, in points, on
 * any cairo context (a PDF page, or scaled for a preview).  @label_a and
 * @label_b say what each side is ("approved revision 3", "as edited");
 * NULL gives code, revision and status. */
gboolean   lamina_comparison_draw_page (cairo_t                  *cr,
                                        const LaminaSheetOptions *options,
                                        const LaminaConstruction *a,
                                        const char               *label_a,
                                        const LaminaConstruction *b,
                                        const char               *label_b,
                                        GError                  **error);
/* The same page as a one-page PDF, written atomically like the sheets. */
gboolean   lamina_comparison_write_pdf (const char               *path,
                                        gboolean                  overwrite,
                                        const LaminaSheetOptions *options,
                                        const LaminaConstruction *a,
                                        const char               *label_a,
                                        const LaminaConstruction *b,
                                        const char               *label_b,
                                        GError                  **error);

G_END_DECLS
