/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-catalogue.c: the cover and the linked index of a
 * catalogue. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>

#include "lamina-sheet-format.h"

#define INDEX_ROW 14.0

void
sheet_draw_cover (SheetContext *ctx,
                  guint         n)
{
  double w = ctx->right - ctx->left, y = ctx->top + (ctx->bottom - ctx->top) * 0.28;
  const char *title = ctx->options->title ? ctx->options->title : _("Construction catalogue");
  g_autofree char *count = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "%u construction",
                                                         "%u constructions", n), n);
  g_autofree char *printed = g_strdup_printf (_("Printed %s"), ctx->printed);

  g_clear_pointer (&ctx->footer, g_free);
  sheet_draw_frame (ctx, FALSE);
  cairo_set_line_width (ctx->cr, 2.0);
  cairo_move_to (ctx->cr, ctx->left, y - 14);
  cairo_line_to (ctx->cr, ctx->left + 60, y - 14);
  cairo_stroke (ctx->cr);
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
  y += sheet_text (ctx, SHEET_FONT_HEADING, ctx->options->practice, ctx->left, y, w, PANGO_ALIGN_LEFT) + 6;
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
  y += sheet_text (ctx, SHEET_FONT_CODE, title, ctx->left, y, w, PANGO_ALIGN_LEFT) + 10;
  y += sheet_text (ctx, SHEET_FONT_TITLE, _("Thermal transmittance of building elements by EN ISO 6946:2017"),
                   ctx->left, y, w * 0.8, PANGO_ALIGN_LEFT) + 24;
  y += sheet_text (ctx, SHEET_FONT_BODY, count, ctx->left, y, w, PANGO_ALIGN_LEFT) + 2;
  sheet_text (ctx, SHEET_FONT_BODY, printed, ctx->left, y, w, PANGO_ALIGN_LEFT);

  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_text (ctx, SHEET_FONT_SMALL,
              _("Each sheet states the design values and conditions it was calculated for. A sheet marked "
                "DRAFT has not been reviewed. The figures do not replace the check of the design against "
                "product declarations, the local building code and licensed professional practice."),
              ctx->left, ctx->bottom - 70, w * 0.7, PANGO_ALIGN_LEFT);
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
  sheet_draw_footer (ctx);
}

/* Tag attributes are parsed by cairo in the C locale: no decimal comma. */
static char *
dup_link_attributes (double x,
                     double y,
                     double width,
                     double height,
                     guint  sheet)
{
  char a[G_ASCII_DTOSTR_BUF_SIZE], b[G_ASCII_DTOSTR_BUF_SIZE];
  char c[G_ASCII_DTOSTR_BUF_SIZE], d[G_ASCII_DTOSTR_BUF_SIZE];

  return g_strdup_printf ("rect=[%s %s %s %s] dest='sheet-%u'",
                          g_ascii_formatd (a, sizeof a, "%.2f", x), g_ascii_formatd (b, sizeof b, "%.2f", y),
                          g_ascii_formatd (c, sizeof c, "%.2f", width),
                          g_ascii_formatd (d, sizeof d, "%.2f", height), sheet);
}

guint
sheet_index_rows_per_page (const SheetContext *ctx,
                           gboolean            first_page)
{
  double top = ctx->top + (first_page ? 60 : 30);

  return (guint) ((ctx->bottom - 30 - top) / INDEX_ROW);
}

guint
sheet_draw_index (SheetContext          *ctx,
                  const SheetIndexEntry *entries,
                  guint                  n,
                  guint                  first,
                  guint                  first_sheet_page)
{
  cairo_t *cr = ctx->cr;
  double w = ctx->right - ctx->left, y = ctx->top;
  double x_name = ctx->left + 56, x_element = ctx->right - 236, x_status = ctx->right - 178;
  double x_u = ctx->right - 96;
  double x_d = ctx->right - 56, x_page = ctx->right;
  guint rows = sheet_index_rows_per_page (ctx, first == 0), i;

  g_clear_pointer (&ctx->footer, g_free);
  sheet_draw_frame (ctx, FALSE);
  if (first == 0)
    {
      y += sheet_text (ctx, SHEET_FONT_CODE, _("Index"), ctx->left, y, w, PANGO_ALIGN_LEFT) + 16;
    }
  cairo_set_source_rgb (cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("CODE"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("NAME"), x_name, y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("ELEMENT"), x_element, y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("STATUS"), x_status, y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("U  W/(m²·K)"), x_u, y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("d  mm"), x_d, y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("PAGE"), x_page, y, 0, PANGO_ALIGN_RIGHT);
  cairo_set_source_rgb (cr, 0, 0, 0);
  y += 10;
  sheet_rule (ctx, y, 0.6, 0);
  y += 3;

  for (i = 0; i < rows && first + i < n; i++)
    {
      const SheetIndexEntry *e = &entries[first + i];
      char u[LAMINA_FORMAT_SIZE], d[LAMINA_FORMAT_SIZE], page[16];
      g_autofree char *link = NULL;

      g_snprintf (page, sizeof page, "%u", e->page);
      link = dup_link_attributes (ctx->left, y - 2, w, INDEX_ROW, first + i + 1);
      cairo_tag_begin (cr, CAIRO_TAG_LINK, link);
      sheet_text_line (ctx, SHEET_FONT_BOLD, e->code, ctx->left, y, x_name - ctx->left - 6, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_BODY, e->name, x_name, y, x_element - x_name - 8, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_BODY, sheet_element_label (e->element), x_element, y,
                       x_status - x_element - 4, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_BODY, sheet_status_label (e->status), x_status, y,
                       x_u - x_status - 40, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_BODY, lamina_format_u (u, e->u), x_u, y, 0, PANGO_ALIGN_RIGHT);
      sheet_text_line (ctx, SHEET_FONT_BODY, lamina_format_thickness (d, e->thickness), x_d, y, 0,
                       PANGO_ALIGN_RIGHT);
      sheet_text_line (ctx, SHEET_FONT_BODY, page, x_page, y, 0, PANGO_ALIGN_RIGHT);
      cairo_tag_end (cr, CAIRO_TAG_LINK);
      y += INDEX_ROW;
      sheet_rule (ctx, y - 3, 0.25, 0.75);
    }
  sheet_draw_footer (ctx);
  return i;
}
