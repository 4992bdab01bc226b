/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-context.c: paper, fonts, text and the page frame shared by
 * every page of a sheet document. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "config.h"

#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <stdlib.h>

/* Only DejaVu is certain on a fresh Debian (fonts-dejavu-core). */
static const struct
{
  const char *family;
  double      size;
} fonts[SHEET_N_FONTS] = {
  [SHEET_FONT_BODY] = { "DejaVu Sans Condensed", 8.0 },
  [SHEET_FONT_BOLD] = { "DejaVu Sans Condensed Bold", 8.0 },
  [SHEET_FONT_SMALL] = { "DejaVu Sans Condensed", 6.6 },
  [SHEET_FONT_LABEL] = { "DejaVu Sans Condensed", 6.2 },
  [SHEET_FONT_HEADING] = { "DejaVu Sans Condensed Bold", 8.6 },
  [SHEET_FONT_TITLE] = { "DejaVu Sans", 14.0 },
  [SHEET_FONT_CODE] = { "DejaVu Sans Bold", 20.0 },
  [SHEET_FONT_BIG] = { "DejaVu Sans Bold", 17.0 },
  [SHEET_FONT_WATERMARK] = { "DejaVu Sans Bold", 120.0 },
};

G_DEFINE_QUARK (lamina-sheet-error-quark, lamina_sheet_error)

void
lamina_sheet_options_init (LaminaSheetOptions *options)
{
  g_return_if_fail (options != NULL);
  *options = (LaminaSheetOptions) { .paper = LAMINA_PAPER_A4 };
}

static const char *const paper_names[LAMINA_N_PAPERS] = { "a4", "a3", "letter" };

const char *
lamina_paper_to_string (LaminaPaper paper)
{
  g_return_val_if_fail (paper < LAMINA_N_PAPERS, NULL);
  return paper_names[paper];
}

gboolean
lamina_paper_from_string (const char  *name,
                          LaminaPaper *paper)
{
  for (guint i = 0; i < LAMINA_N_PAPERS; i++)
    if (name && g_ascii_strcasecmp (name, paper_names[i]) == 0)
      {
        *paper = i;
        return TRUE;
      }
  return FALSE;
}

void
lamina_paper_get_size (LaminaPaper  paper,
                       double      *width,
                       double      *height)
{
  /* ISO 216 in mm, ANSI letter 8.5 × 11 in. */
  const double mm = 72.0 / 25.4;

  switch (paper)
    {
    case LAMINA_PAPER_A3:
      *width = 297 * mm;
      *height = 420 * mm;
      break;
    case LAMINA_PAPER_LETTER:
      *width = 8.5 * 72;
      *height = 11 * 72;
      break;
    case LAMINA_PAPER_A4:
    case LAMINA_N_PAPERS:
    default:
      *width = 210 * mm;
      *height = 297 * mm;
      break;
    }
}

static void
format_print_date (char   *buffer,
                   gsize   size)
{
  /* SOURCE_DATE_EPOCH (reproducible-builds.org) pins the date. */
  const char *epoch = g_getenv ("SOURCE_DATE_EPOCH");
  g_autoptr(GDateTime) now = NULL;
  g_autofree char *text = NULL;

  if (epoch && *epoch)
    now = g_date_time_new_from_unix_utc (g_ascii_strtoll (epoch, NULL, 10));
  if (now == NULL)
    now = g_date_time_new_now_local ();
  text = g_date_time_format (now, "%Y-%m-%d");
  g_strlcpy (buffer, text, size);
}

void
sheet_context_init (SheetContext             *ctx,
                    cairo_t                  *cr,
                    const LaminaSheetOptions *options)
{
  const double mm = 72.0 / 25.4;
  cairo_font_options_t *font_options;
  PangoContext *context;

  *ctx = (SheetContext) { .cr = cr, .options = options };
  lamina_paper_get_size (options->paper, &ctx->width, &ctx->height);
  ctx->left = 20 * mm;
  ctx->right = ctx->width - 14 * mm;
  ctx->top = 13 * mm;
  ctx->bottom = ctx->height - 12 * mm;
  /* Dark enough for small print on an office laser printer. */
  ctx->grey = 0.3;

  ctx->layout = pango_cairo_create_layout (cr);
  context = pango_layout_get_context (ctx->layout);
  pango_cairo_context_set_resolution (context, 72.0);
  /* Unhinted metrics: the same layout on paper, screen and in tests. */
  font_options = cairo_font_options_create ();
  cairo_font_options_set_hint_metrics (font_options, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (font_options, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (context, font_options);
  cairo_font_options_destroy (font_options);
  pango_layout_context_changed (ctx->layout);

  for (guint i = 0; i < SHEET_N_FONTS; i++)
    {
      ctx->fonts[i] = pango_font_description_from_string (fonts[i].family);
      pango_font_description_set_absolute_size (ctx->fonts[i], fonts[i].size * PANGO_SCALE);
    }
  ctx->section = lamina_section_new ();
  lamina_section_layout_init (&ctx->section_layout);
  if (options->printed)
    g_strlcpy (ctx->printed, options->printed, sizeof ctx->printed);
  else
    format_print_date (ctx->printed, sizeof ctx->printed);
}

void
sheet_context_clear (SheetContext *ctx)
{
  g_clear_object (&ctx->layout);
  g_clear_pointer (&ctx->footer, g_free);
  for (guint i = 0; i < SHEET_N_FONTS; i++)
    g_clear_pointer (&ctx->fonts[i], pango_font_description_free);
  g_clear_pointer (&ctx->section, lamina_section_free);
  lamina_section_layout_clear (&ctx->section_layout);
}

void
sheet_text_set (SheetContext *ctx,
                SheetFont     font,
                const char   *text,
                double        width,
                double       *text_width,
                double       *text_height)
{
  PangoRectangle logical;

  pango_layout_set_font_description (ctx->layout, ctx->fonts[font]);
  pango_layout_set_width (ctx->layout, width > 0 ? (int) (width * PANGO_SCALE) : -1);
  pango_layout_set_ellipsize (ctx->layout, PANGO_ELLIPSIZE_NONE);
  pango_layout_set_wrap (ctx->layout, PANGO_WRAP_WORD_CHAR);
  pango_layout_set_alignment (ctx->layout, PANGO_ALIGN_LEFT);
  pango_layout_set_text (ctx->layout, text, -1);
  pango_layout_get_extents (ctx->layout, NULL, &logical);
  if (text_width)
    *text_width = (double) logical.width / PANGO_SCALE;
  if (text_height)
    *text_height = (double) logical.height / PANGO_SCALE;
}

static void
show_aligned (SheetContext   *ctx,
              double          x,
              double          y,
              double          width,
              double          text_width,
              PangoAlignment  align)
{
  if (width <= 0 && align == PANGO_ALIGN_RIGHT)
    x -= text_width;
  else if (width <= 0 && align == PANGO_ALIGN_CENTER)
    x -= text_width / 2;
  else
    pango_layout_set_alignment (ctx->layout, align);
  cairo_move_to (ctx->cr, x, y);
  pango_cairo_show_layout (ctx->cr, ctx->layout);
}

double
sheet_text (SheetContext   *ctx,
            SheetFont       font,
            const char     *text,
            double          x,
            double          y,
            double          width,
            PangoAlignment  align)
{
  double w, h;

  if (text == NULL || *text == '\0')
    return 0.0;
  sheet_text_set (ctx, font, text, width, &w, &h);
  show_aligned (ctx, x, y, width, w, align);
  return h;
}

void
sheet_text_line (SheetContext   *ctx,
                 SheetFont       font,
                 const char     *text,
                 double          x,
                 double          y,
                 double          width,
                 PangoAlignment  align)
{
  double w, h;

  if (text == NULL || *text == '\0')
    return;
  sheet_text_set (ctx, font, text, width, &w, &h);
  pango_layout_set_ellipsize (ctx->layout, PANGO_ELLIPSIZE_END);
  show_aligned (ctx, x, y, width, w, align);
}

void
sheet_rule (SheetContext *ctx,
            double        y,
            double        weight,
            double        grey)
{
  cairo_save (ctx->cr);
  cairo_set_source_rgb (ctx->cr, grey, grey, grey);
  cairo_set_line_width (ctx->cr, weight);
  cairo_move_to (ctx->cr, ctx->left, y);
  cairo_line_to (ctx->cr, ctx->right, y);
  cairo_stroke (ctx->cr);
  cairo_restore (ctx->cr);
}

void
sheet_draw_frame (SheetContext *ctx,
                  gboolean      draft)
{
  cairo_t *cr = ctx->cr;

  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  if (draft)
    {
      double w, h;

      /* A diagonal watermark behind everything, light enough to read
       * through. */
      cairo_save (cr);
      cairo_translate (cr, ctx->width / 2, ctx->height / 2);
      cairo_rotate (cr, -atan2 (ctx->height, ctx->width));
      sheet_text_set (ctx, SHEET_FONT_WATERMARK, _("DRAFT"), 0, &w, &h);
      cairo_set_source_rgb (cr, 0.9, 0.9, 0.9);
      cairo_move_to (cr, -w / 2, -h / 2);
      pango_cairo_show_layout (cr, ctx->layout);
      cairo_restore (cr);
    }
  cairo_set_source_rgb (cr, 0, 0, 0);
}

void
sheet_draw_footer (SheetContext *ctx)
{
  cairo_t *cr = ctx->cr;
  double y = ctx->bottom - 8;
  double third = (ctx->right - ctx->left) / 3;
  g_autofree char *printed = g_strdup_printf (_("Printed %s · Lamina %s"), ctx->printed, PACKAGE_VERSION);
  g_autofree char *page = g_strdup_printf (_("Page %u of %u"), ctx->page, ctx->n_pages);

  g_autofree char *what = NULL;

  /* What the page is, never where the file lives: a path on a sheet sent
   * out names someone's disk. */
  if (ctx->footer == NULL)
    {
      const char *title = ctx->options->title ? ctx->options->title : _("Construction catalogue");
      what = ctx->options->practice ? g_strdup_printf ("%s · %s", ctx->options->practice, title)
                                    : g_strdup (title);
    }
  sheet_rule (ctx, y - 4, 0.5, 0);
  cairo_set_source_rgb (cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_text_line (ctx, SHEET_FONT_SMALL, ctx->footer ? ctx->footer : what,
                   ctx->left, y, third * 1.3, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, printed, ctx->left + third * 1.3, y, third * 0.9, PANGO_ALIGN_CENTER);
  sheet_text_line (ctx, SHEET_FONT_SMALL, page, ctx->left + 2.2 * third, y, third * 0.8, PANGO_ALIGN_RIGHT);
  cairo_set_source_rgb (cr, 0, 0, 0);
}

const char *
sheet_element_label (LaminaElement element)
{
  switch (element)
    {
    case LAMINA_ELEMENT_WALL: return _("Wall");
    case LAMINA_ELEMENT_ROOF: return _("Roof");
    case LAMINA_ELEMENT_FLOOR: return _("Floor");
    case LAMINA_ELEMENT_CEILING: return _("Ceiling");
    case LAMINA_ELEMENT_PARTITION: return _("Partition");
    case LAMINA_N_ELEMENTS:
    default: return "";
    }
}

const char *
sheet_status_label (LaminaStatus status)
{
  switch (status)
    {
    case LAMINA_STATUS_DRAFT: return _("Draft");
    case LAMINA_STATUS_CHECKED: return _("Checked");
    case LAMINA_STATUS_APPROVED: return _("Approved");
    case LAMINA_N_STATUSES:
    default: return "";
    }
}
