/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The 2-D check page of a sheet (EN ISO 10211): where EN ISO 6946 does not
 * apply, the sheet continues on a page with the U of one module calculated
 * numerically, the coldest inner surface point, the temperature field and
 * a statement of the method. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "config.h"

#include "lamina-field-draw.h"
#include "lamina-sheet-format.h"
#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>

#define GAP 14.0

char *
sheet_dup_field_summary (const LaminaFieldResult *f)
{
  char u[LAMINA_FORMAT_SIZE], u6946[LAMINA_FORMAT_SIZE];

  return g_strdup_printf (_("2-D check (EN ISO 10211), next page: U = %s W/(m²·K) from one module "
                            "calculated numerically; it replaces the EN ISO 6946 figure of %s W/(m²·K), "
                            "which is outside its method's scope here."),
                          lamina_format_u (u, f->u), lamina_format_u (u6946, f->u_6946));
}

static const char *
get_field_method_text (void)
{
  /* xgettext:no-c-format (the "%" below is a per cent sign, not a directive) */
  return _("Method. Two-dimensional steady-state heat conduction by EN ISO 10211:2017 for one repeating "
           "module of the build-up, as wide as the largest member spacing, the members centred and "
           "lined up through their layers, the module edges adiabatic (lines of symmetry). Surface "
           "resistances as for U (EN ISO 6946 Table 7); layers crossing the section and air layers by "
           "equivalent conductivities (stated below). Finite volumes on a grid with lines on every "
           "material boundary, refined until U changes by less than 0.1 % on halving the grid; the "
           "solver is validated against the reference cases of EN ISO 10211 Annex C. U includes the "
           "corrections of EN ISO 6946 Annex F. fRsi = (θsi − θe)/(θi − θe); the mould criterion of "
           "EN ISO 13788 uses Rsi 0.25.\n"
           "Cautions. The check covers the repeating module only, not junctions, openings or point "
           "fixings. Confirm the design values against the product declarations and the result "
           "against local building codes and licensed professional practice.");
}

void
sheet_draw_field_page (SheetContext             *ctx,
                       const LaminaConstruction *c,
                       const LaminaFieldResult  *f)
{
  double w = ctx->right - ctx->left, y = ctx->top, method_h, notes_h = 0, picture_h;
  char value[LAMINA_FORMAT_SIZE];
  g_autofree char *heading = NULL, *big = NULL, *line1 = NULL, *line2 = NULL, *line3 = NULL, *line4 = NULL;
  g_autoptr(GString) notes = g_string_new (NULL);

  sheet_draw_frame (ctx, c->status == LAMINA_STATUS_DRAFT);
  /* A job's sheet carries the job's band on each of its pages. */
  if (ctx->options->job != NULL)
    y = sheet_draw_job_band (ctx, y);
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_text_line (ctx, SHEET_FONT_SMALL, ctx->options->practice, ctx->left, y, w * 0.6, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, _("Construction specification, continued"), ctx->left + w * 0.6, y,
                   w * 0.4, PANGO_ALIGN_RIGHT);
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
  y += 12;
  heading = g_strdup_printf (_("%s — 2-D check, EN ISO 10211"), c->code ? c->code : c->id);
  sheet_text_line (ctx, SHEET_FONT_CODE, heading, ctx->left, y, w, PANGO_ALIGN_LEFT);
  y += 25;
  sheet_rule (ctx, y, 0.4, 0.6);
  y += GAP;

  big = g_strdup_printf ("U = %s W/(m²·K)", lamina_format_u (value, f->u));
  sheet_text_line (ctx, SHEET_FONT_BIG, big, ctx->left, y, w, PANGO_ALIGN_LEFT);
  y += 26;
  line1 = g_strdup_printf (_("EN ISO 6946 for comparison: %s W/(m²·K). Heat flow %.2f W/m per module at "
                             "%.0f °C inside and %.0f °C outside."),
                           lamina_format_u (value, f->u_6946), f->heat_flow, f->inside_temperature,
                           f->outside_temperature);
  line2 = g_strdup_printf (_("Coldest inner surface point: %.1f °C, %.0f mm across the module; fRsi %.2f "
                             "(Rsi %.2f). With Rsi 0.25 (mould criterion): %.1f °C, fRsi %.2f."),
                           f->min_inner_surface_temperature, f->min_inner_surface_position, f->f_rsi, f->rsi,
                           f->min_inner_surface_temperature_mould, f->f_rsi_mould);
  line3 = g_strdup_printf (_("Module %.0f mm wide and %.1f mm thick; %u cells on the finest grid; the last "
                             "halving of the grid changed U by %.3f %%%s."),
                           f->module_width, f->thickness, f->cells, 100.0 * f->refinement.change,
                           f->refinement.converged ? "" : _(" (NOT below 0.1 %)"));
  line4 = g_strdup_printf (_("Rsi %.2f, Rse %.2f m²·K/W."), f->rsi, f->rse);
  y += sheet_text (ctx, SHEET_FONT_BODY, line1, ctx->left, y, w, PANGO_ALIGN_LEFT) + 3;
  y += sheet_text (ctx, SHEET_FONT_BODY, line2, ctx->left, y, w, PANGO_ALIGN_LEFT) + 3;
  y += sheet_text (ctx, SHEET_FONT_BODY, line3, ctx->left, y, w, PANGO_ALIGN_LEFT) + 3;
  y += sheet_text (ctx, SHEET_FONT_BODY, line4, ctx->left, y, w, PANGO_ALIGN_LEFT) + GAP;

  for (guint k = 0; k < f->notes->len; k++)
    g_string_append_printf (notes, "%s%s", k ? "\n" : "", (const char *) f->notes->pdata[k]);
  sheet_text_set (ctx, SHEET_FONT_BODY, notes->str, w, NULL, &notes_h);
  sheet_text_set (ctx, SHEET_FONT_SMALL, get_field_method_text (), w, NULL, &method_h);

  /* The picture takes what is left, at most as tall as it is wide. */
  picture_h = MIN (ctx->bottom - 24 - method_h - notes_h - 13 - 2 * GAP - y, w * 0.75);
  if (picture_h > 80)
    {
      double needed = (w - 8 * 9.0) * f->thickness / f->module_width + 7.6 * 9.0;
      picture_h = MIN (picture_h, MAX (needed, 120));
      lamina_field_draw (ctx->cr, c, f, ctx->left, y, w, picture_h, 9.0);
      y += picture_h + GAP;
    }
  if (notes->len)
    {
      sheet_text_line (ctx, SHEET_FONT_HEADING, _("How the build-up was modelled"), ctx->left, y, 0,
                       PANGO_ALIGN_LEFT);
      y += 13;
      y += sheet_text (ctx, SHEET_FONT_BODY, notes->str, ctx->left, y, w, PANGO_ALIGN_LEFT) + GAP;
    }
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_rule (ctx, ctx->bottom - 20 - method_h, 0.4, 0.6);
  sheet_text (ctx, SHEET_FONT_SMALL, get_field_method_text (), ctx->left, ctx->bottom - 16 - method_h, w,
              PANGO_ALIGN_LEFT);
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
  sheet_draw_footer (ctx);
}
