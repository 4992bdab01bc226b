/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-page.c: the specification sheet of one construction.
 *
 * From the top: header (practice, code, name, library data), the section
 * drawing, the layer table, the results with the target, warnings, notes,
 * and at the foot the method statement and the cautions.  The section
 * takes whatever height the other blocks leave. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "lamina-sheet-format.h"

#define ROW     11.5   /* table row pitch, pt */
#define SUBROW   9.5
#define GAP     14.0   /* between blocks */

typedef struct
{
  double no, name, category, thickness, lambda, resistance, end;
} Columns;

static void
get_columns (const SheetContext *ctx,
             Columns            *c)
{
  c->end = ctx->right;
  c->resistance = c->end;           /* right edges of the number columns */
  c->lambda = c->end - 62;
  c->thickness = c->end - 124;
  c->category = c->end - 220;       /* left edge */
  c->no = ctx->left + 14;           /* right edge */
  c->name = ctx->left + 24;         /* left edge */
}

static void
set_grey (SheetContext *ctx)
{
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
}

static void
set_black (SheetContext *ctx)
{
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
}

static const char *
date_part (const char *iso,
           char       *buffer)
{
  if (iso == NULL || strlen (iso) < 10)
    return "\xe2\x80\x93";
  memcpy (buffer, iso, 10);
  buffer[10] = '\0';
  return buffer;
}

/* Header */

static void
draw_field (SheetContext *ctx,
            const char   *label,
            const char   *value,
            double        x,
            double        y,
            double        width)
{
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, label, x, y, width - 4, PANGO_ALIGN_LEFT);
  set_black (ctx);
  sheet_text_line (ctx, SHEET_FONT_BODY, value && *value ? value : "\xe2\x80\x93",
                   x, y + 8, width - 4, PANGO_ALIGN_LEFT);
}

static double
draw_header (SheetContext             *ctx,
             const LaminaConstruction *c)
{
  cairo_t *cr = ctx->cr;
  double w = ctx->right - ctx->left, y = ctx->top, col = w / 6;
  gboolean draft = c->status == LAMINA_STATUS_DRAFT;
  char revision[16], date[16];
  const char *reviewer = c->approved_by ? c->approved_by : c->checked_by;
  const char *when = c->approved_at ? c->approved_at : c->checked_at ? c->checked_at : c->modified_at;

  if (draft)
    {
      cairo_set_source_rgb (cr, 0.15, 0.15, 0.15);
      cairo_rectangle (cr, ctx->left, y, w, 15);
      cairo_fill (cr);
      cairo_set_source_rgb (cr, 1, 1, 1);
      sheet_text_line (ctx, SHEET_FONT_BOLD, _("DRAFT — not reviewed, not for construction"),
                       ctx->left + 6, y + 3, w - 12, PANGO_ALIGN_LEFT);
      y += 15 + 6;
    }
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, ctx->options->practice, ctx->left, y, w * 0.6, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, _("Construction specification"), ctx->left + w * 0.6, y,
                   w * 0.4, PANGO_ALIGN_RIGHT);
  set_black (ctx);
  y += 12;
  if (ctx->dest)
    cairo_tag_begin (cr, CAIRO_TAG_DEST, ctx->dest);
  sheet_text_line (ctx, SHEET_FONT_CODE, c->code ? c->code : c->id, ctx->left, y, w, PANGO_ALIGN_LEFT);
  if (ctx->dest)
    cairo_tag_end (cr, CAIRO_TAG_DEST);
  y += 25;
  y += sheet_text (ctx, SHEET_FONT_TITLE, c->name, ctx->left, y, w, PANGO_ALIGN_LEFT) + 8;

  sheet_rule (ctx, y, 0.4, 0.6);
  y += 4;
  g_snprintf (revision, sizeof revision, "%d", c->revision);
  draw_field (ctx, _("ELEMENT"), sheet_element_label (c->element), ctx->left, y, col);
  draw_field (ctx, _("REVISION"), c->revision > 0 ? revision : NULL, ctx->left + col, y, col);
  draw_field (ctx, _("STATUS"), sheet_status_label (c->status), ctx->left + 2 * col, y, col);
  draw_field (ctx, _("CHECKED BY"), c->checked_by, ctx->left + 3 * col, y, col);
  draw_field (ctx, c->approved_by ? _("APPROVED BY") : _("REVIEWER"),
              reviewer, ctx->left + 4 * col, y, col);
  draw_field (ctx, _("DATE"), date_part (when, date), ctx->left + 5 * col, y, col);
  y += 22;
  sheet_rule (ctx, y, 0.4, 0.6);
  return y + GAP;
}

/* Section */

static double
draw_section (SheetContext             *ctx,
              const LaminaConstruction *c,
              const LaminaResult       *result,
              double                    y,
              double                    height)
{
  const double pt_per_mm = 72.0 / 25.4;
  static const int ratios[] = { 1, 2, 5, 10, 20, 25, 50, 100, 200 };
  LaminaSectionStyle style;
  double w = ctx->right - ctx->left, fit;
  int ratio = ratios[G_N_ELEMENTS (ratios) - 1];
  g_autofree char *caption = NULL;
  g_autofree char *paper = g_ascii_strup (lamina_paper_to_string (ctx->options->paper), -1);

  lamina_section_style_init (&style, 7.0);
  fit = lamina_section_fit_scale (c, &style, w, height - 14);
  /* The largest drafting scale that fits: 1:5, 1:10 … */
  for (guint i = 0; i < G_N_ELEMENTS (ratios); i++)
    if (pt_per_mm / ratios[i] <= fit)
      {
        ratio = ratios[i];
        break;
      }
  style.scale = pt_per_mm / ratio;

  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Section"), ctx->left, y, w / 2, PANGO_ALIGN_LEFT);
  caption = g_strdup_printf (_("Scale 1:%d on %s · dimensions in mm · inside to outside"),
                             ratio, paper);
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, caption, ctx->left + w / 3, y + 1, w * 2 / 3, PANGO_ALIGN_RIGHT);
  set_black (ctx);

  lamina_section_layout_compute (&ctx->section_layout, c, &style, ctx->left, y + 14, w, height - 14);
  lamina_section_draw (ctx->section, ctx->cr, &ctx->section_layout, c, result, &style);
  return y + height + GAP;
}

/* Layer table */

static guint
count_table_rows (const LaminaConstruction *c,
                  double                   *height)
{
  guint rows = c->layers->len, subrows = 0;

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      if (layer->kind == LAMINA_LAYER_BRIDGED && layer->parts)
        subrows += layer->parts->len;
    }
  *height = 14 + ROW + rows * ROW + subrows * SUBROW + ROW + 4;
  return rows;
}

static void
draw_number_cells (SheetContext  *ctx,
                   const Columns *col,
                   SheetFont      font,
                   double         y,
                   const char    *thickness,
                   const char    *lambda,
                   const char    *resistance)
{
  sheet_text_line (ctx, font, thickness, col->thickness, y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, font, lambda, col->lambda, y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, font, resistance, col->resistance, y, 0, PANGO_ALIGN_RIGHT);
}

static const char *
format_lambda (char   *buffer,
               double  lambda)
{
  return lamina_format_fixed (buffer, lambda, lambda >= 10 ? 0 : lambda >= 1 ? 2 : 3);
}

static double
draw_parts (SheetContext      *ctx,
            const Columns     *col,
            const LaminaLayer *layer,
            double             y)
{
  char l[LAMINA_FORMAT_SIZE], r[LAMINA_FORMAT_SIZE], f[LAMINA_FORMAT_SIZE];

  for (guint k = 0; k < layer->parts->len; k++)
    {
      const LaminaPart *part = layer->parts->pdata[k];
      double fraction = lamina_layer_get_part_fraction (layer, k);
      const char *name = part->material ? part->material->name : _("air");
      g_autofree char *label = NULL;

      lamina_format_percent (f, fraction);
      if (part->width > 0 && part->spacing > 0)
        {
          char wd[LAMINA_FORMAT_SIZE], sp[LAMINA_FORMAT_SIZE];
          label = g_strdup_printf (_("%s, %s mm at %s mm (%s)"), name, lamina_format_thickness (wd, part->width),
                                   lamina_format_thickness (sp, part->spacing), f);
        }
      else
        label = g_strdup_printf ("%s (%s)", name, f);
      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, "\xe2\x80\x94", col->name + 2, y, 0, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_SMALL, label, col->name + 12, y, col->category - col->name - 16,
                       PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_SMALL,
                       part->material ? lamina_category_to_string (part->material->category) : "air",
                       col->category, y, col->thickness - col->category - 50, PANGO_ALIGN_LEFT);
      if (part->material)
        {
          format_lambda (l, part->material->conductivity);
          lamina_format_fixed (r, layer->thickness / 1000.0 / part->material->conductivity, 3);
        }
      else
        {
          g_strlcpy (l, "\xe2\x80\x93", sizeof l);
          g_strlcpy (r, "\xe2\x80\x93", sizeof r);
        }
      draw_number_cells (ctx, col, SHEET_FONT_SMALL, y, "", l, r);
      set_black (ctx);
      y += SUBROW;
    }
  return y;
}

static double
draw_layer_table (SheetContext             *ctx,
                  const LaminaConstruction *c,
                  const LaminaResult       *result,
                  double                    y)
{
  Columns col;
  char d[LAMINA_FORMAT_SIZE], l[LAMINA_FORMAT_SIZE], r[LAMINA_FORMAT_SIZE];

  get_columns (ctx, &col);
  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Layers, inside to outside"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += 14;
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("NO."), col.no, y, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("MATERIAL"), col.name, y, 0, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("CATEGORY"), col.category, y, 0, PANGO_ALIGN_LEFT);
  draw_number_cells (ctx, &col, SHEET_FONT_LABEL, y, _("d  mm"), _("λ  W/(m·K)"), _("R  m²·K/W"));
  set_black (ctx);
  y += ROW - 2;
  sheet_rule (ctx, y, 0.6, 0);
  y += 2.5;

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      const LaminaLayerResult *lr = &result->layers[i];
      char no[16];
      const char *category = "";

      g_snprintf (no, sizeof no, "%u", i + 1);
      sheet_text_line (ctx, SHEET_FONT_BOLD, no, col.no, y, 0, PANGO_ALIGN_RIGHT);
      sheet_text_line (ctx, SHEET_FONT_BODY, lamina_layer_get_label (layer), col.name, y,
                       col.category - col.name - 6, PANGO_ALIGN_LEFT);
      if (layer->kind == LAMINA_LAYER_MATERIAL && layer->material)
        category = lamina_category_to_string (layer->material->category);
      else if (layer->kind == LAMINA_LAYER_AIR)
        category = lamina_air_kind_to_string (layer->air);
      else if (layer->kind == LAMINA_LAYER_BRIDGED)
        category = _("bridged");
      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, category, col.category, y + 1,
                       col.thickness - col.category - 50, PANGO_ALIGN_LEFT);
      set_black (ctx);
      if (layer->kind == LAMINA_LAYER_MATERIAL && layer->material)
        format_lambda (l, layer->material->conductivity);
      else
        g_strlcpy (l, "\xe2\x80\x93", sizeof l);
      if (lr->disregarded)
        g_strlcpy (r, _("disregarded"), sizeof r);
      else
        lamina_format_fixed (r, lr->resistance, 3);
      draw_number_cells (ctx, &col, SHEET_FONT_BODY, y, lamina_format_thickness (d, layer->thickness), l, r);
      y += ROW;
      if (layer->kind == LAMINA_LAYER_BRIDGED && layer->parts)
        y = draw_parts (ctx, &col, layer, y - 1);
      sheet_rule (ctx, y - 2.5, 0.25, 0.75);
    }
  sheet_rule (ctx, y - 2.5, 0.6, 0);
  sheet_text_line (ctx, SHEET_FONT_BOLD, _("Total"), col.name, y, 0, PANGO_ALIGN_LEFT);
  draw_number_cells (ctx, &col, SHEET_FONT_BOLD, y, lamina_format_thickness (d, result->thickness), "", "");
  return y + ROW + GAP;
}

/* Results */

#define RESULTS_HEIGHT (14 + 6 * ROW + GAP)

static void
draw_value_row (SheetContext *ctx,
                double        x,
                double        y,
                double        width,
                const char   *symbol,
                const char   *label,
                const char   *value,
                const char   *unit)
{
  sheet_text_line (ctx, SHEET_FONT_BOLD, symbol, x, y, 0, PANGO_ALIGN_LEFT);
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, label, x + 22, y + 1, width * 0.78 - 56, PANGO_ALIGN_LEFT);
  set_black (ctx);
  sheet_text_line (ctx, SHEET_FONT_BODY, value, x + width * 0.78, y, 0, PANGO_ALIGN_RIGHT);
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, unit, x + width * 0.8, y + 1, width * 0.2, PANGO_ALIGN_LEFT);
  set_black (ctx);
}

static void
draw_u_box (SheetContext             *ctx,
            const LaminaConstruction *c,
            const LaminaResult       *r,
            double                    x,
            double                    y,
            double                    width)
{
  cairo_t *cr = ctx->cr;
  char u[LAMINA_FORMAT_SIZE], t[LAMINA_FORMAT_SIZE];
  g_autofree char *big = NULL;
  g_autofree char *target = NULL;
  double h = 6 * ROW;

  cairo_set_line_width (cr, 0.8);
  cairo_rectangle (cr, x, y, width, h);
  cairo_stroke (cr);
  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("THERMAL TRANSMITTANCE, CORRECTED"), x + 8, y + 6, width - 16,
                   PANGO_ALIGN_LEFT);
  set_black (ctx);
  big = g_strdup_printf ("U = %s", lamina_format_u (u, r->u_corrected));
  sheet_text_line (ctx, SHEET_FONT_BIG, big, x + 8, y + 15, width - 16, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, "W/(m²·K)", x + 8, y + 37, width - 16, PANGO_ALIGN_LEFT);
  if (r->has_target)
    target = g_strdup_printf (r->target_met ? _("✓ Meets the target U ≤ %s") : _("✗ Exceeds the target U ≤ %s"),
                              lamina_format_u (t, c->target_u));
  else
    target = g_strdup (_("No target U set"));
  if (r->has_target && !r->target_met)
    {
      cairo_rectangle (cr, x, y + h - 17, width, 17);
      cairo_fill (cr);
      cairo_set_source_rgb (cr, 1, 1, 1);
    }
  sheet_text_line (ctx, r->has_target ? SHEET_FONT_BOLD : SHEET_FONT_BODY, target, x + 8, y + h - 13.5,
                   width - 16, PANGO_ALIGN_LEFT);
  set_black (ctx);
}

static double
draw_results (SheetContext             *ctx,
              const LaminaConstruction *c,
              const LaminaResult       *r,
              double                    y)
{
  double w = ctx->right - ctx->left, col = w * 0.36, x2 = ctx->left + col + 12;
  char v[LAMINA_FORMAT_SIZE], h[LAMINA_FORMAT_SIZE];
  const char *rk = "m²·K/W", *uk = "W/(m²·K)";
  g_autofree char *rsi_label = g_strdup_printf (_("inside, heat flow %s"),
                                                lamina_heat_flow_to_string (r->heat_flow));
  g_autofree char *e_label = NULL;

  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Results, EN ISO 6946:2017"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += 14;
  draw_value_row (ctx, ctx->left, y, col, "Rsi", rsi_label, lamina_format_fixed (v, r->rsi, 2), rk);
  draw_value_row (ctx, ctx->left, y + ROW, col, "Rse", _("outside surface"), lamina_format_fixed (v, r->rse, 2), rk);
  draw_value_row (ctx, ctx->left, y + 2 * ROW, col, "R′T", _("upper limit"), lamina_format_fixed (v, r->r_upper, 3), rk);
  draw_value_row (ctx, ctx->left, y + 3 * ROW, col, "R″T", _("lower limit"), lamina_format_fixed (v, r->r_lower, 3), rk);
  draw_value_row (ctx, ctx->left, y + 4 * ROW, col, "RT", _("total, (R′T + R″T)/2"), lamina_format_fixed (v, r->r_total, 3), rk);
  e_label = g_strdup_printf (_("relative error e, %u section(s)"), r->n_sections);
  draw_value_row (ctx, ctx->left, y + 5 * ROW, col, "e", e_label, lamina_format_percent (v, r->relative_error), "");

  draw_value_row (ctx, x2, y, col * 0.8, "U", _("1/RT"), lamina_format_u (v, r->u), uk);
  draw_value_row (ctx, x2, y + ROW, col * 0.8, "ΔU", _("corrections"), lamina_format_fixed (v, r->delta_u, 3), uk);
  draw_value_row (ctx, x2, y + 2 * ROW, col * 0.8, "Uc", _("U + ΔU"), lamina_format_u (v, r->u_corrected), uk);
  draw_value_row (ctx, x2, y + 3 * ROW, col * 0.8, "θsi", _("inner surface"),
                  lamina_format_temperature (h, r->surface_temperature_inner), "");
  draw_value_row (ctx, x2, y + 4 * ROW, col * 0.8, "θi", _("inside, design"),
                  lamina_format_temperature (h, r->inside_temperature), "");
  draw_value_row (ctx, x2, y + 5 * ROW, col * 0.8, "θe", _("outside, design"),
                  lamina_format_temperature (h, r->outside_temperature), "");

  draw_u_box (ctx, c, r, ctx->right - w * 0.3, y, w * 0.3);
  return y + 6 * ROW + GAP;
}

/* Text blocks */

static double
measure_paragraph (SheetContext *ctx,
                   SheetFont     font,
                   const char   *text)
{
  double w, h;

  sheet_text_set (ctx, font, text, ctx->right - ctx->left, &w, &h);
  return h;
}

static char *
dup_warnings_text (const LaminaResult *r)
{
  GString *text = g_string_new (NULL);

  for (guint i = 0; i < r->warnings->len; i++)
    {
      const LaminaWarning *warning = r->warnings->pdata[i];
      if (text->len)
        g_string_append_c (text, '\n');
      /* The engine's sentences name the layer themselves. */
      g_string_append (text, "⚠  ");
      g_string_append (text, warning->message);
    }
  return g_string_free (text, FALSE);
}

static char *
dup_notes_text (const LaminaConstruction *c)
{
  if (c->description && c->notes)
    return g_strconcat (c->description, "\n", c->notes, NULL);
  return g_strdup (c->description ? c->description : c->notes);
}

static const char *
get_method_text (void)
{
  return _("Method. Thermal resistance and transmittance by EN ISO 6946:2017: surface resistances "
           "by Table 7 for the stated direction of heat flow, air layers by 6.9, bridged layers by the "
           "combined method (upper and lower limit, 6.7.2), corrections to U by Annex F. U is given to "
           "two significant figures; intermediate values are unrounded.\n"
           "Cautions. The results hold for the stated design values and conditions only. Check the "
           "design values against the product declarations, and the construction against the local "
           "building code and licensed professional practice. This sheet is not a condensation risk "
           "assessment (EN ISO 13788) and covers neither heat transfer via the ground (EN ISO 13370) "
           "nor linear thermal bridges (EN ISO 10211).");
}

static double
draw_block (SheetContext *ctx,
            const char   *heading,
            const char   *text,
            double        y,
            double        max_height)
{
  double w = ctx->right - ctx->left, h;

  if (text == NULL || *text == '\0')
    return y;
  sheet_text_line (ctx, SHEET_FONT_HEADING, heading, ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += 13;
  sheet_text_set (ctx, SHEET_FONT_BODY, text, w, NULL, &h);
  /* Too long for the page: cut with an ellipsis; the library keeps it all. */
  /* A point of slack: the cut is for real overflow, not rounding. */
  pango_layout_set_height (ctx->layout, (int) ((MAX (max_height, 10) + 1) * PANGO_SCALE));
  pango_layout_set_ellipsize (ctx->layout, PANGO_ELLIPSIZE_END);
  cairo_move_to (ctx->cr, ctx->left, y);
  pango_cairo_show_layout (ctx->cr, ctx->layout);
  pango_layout_set_height (ctx->layout, -1);
  return y + MIN (h, MAX (max_height, 10)) + GAP;
}

void
sheet_draw_page (SheetContext             *ctx,
                 const LaminaConstruction *c,
                 const LaminaResult       *result)
{
  g_autofree char *warnings = dup_warnings_text (result);
  g_autofree char *notes = dup_notes_text (c);
  double table_h, warn_h = 0, notes_h = 0, method_h, y, section_h, room;
  double page_h = ctx->bottom - ctx->top;

  sheet_draw_frame (ctx, c->status == LAMINA_STATUS_DRAFT);
  y = draw_header (ctx, c);

  count_table_rows (c, &table_h);
  if (*warnings)
    warn_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, warnings) + GAP;
  if (notes && *notes)
    notes_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, notes) + GAP;
  method_h = measure_paragraph (ctx, SHEET_FONT_SMALL, get_method_text ());

  /* The section takes the height left, within bounds. */
  room = ctx->bottom - 24 - method_h - y - table_h - RESULTS_HEIGHT - warn_h - notes_h - 2 * GAP - 6;
  section_h = CLAMP (room, page_h * 0.2, page_h * 0.4);
  y = draw_section (ctx, c, result, y, section_h);
  y = draw_layer_table (ctx, c, result, y);
  y = draw_results (ctx, c, result, y);
  room = ctx->bottom - 24 - method_h - y;
  if (*warnings)
    y = draw_block (ctx, _("Warnings"), warnings, y, room - 13 - GAP - (notes_h > 0 ? 40 : 0));
  if (notes && *notes)
    y = draw_block (ctx, _("Notes"), notes, y, ctx->bottom - 24 - method_h - y - 13 - GAP);

  set_grey (ctx);
  sheet_rule (ctx, ctx->bottom - 20 - method_h, 0.4, 0.6);
  sheet_text (ctx, SHEET_FONT_SMALL, get_method_text (), ctx->left, ctx->bottom - 16 - method_h,
              ctx->right - ctx->left, PANGO_ALIGN_LEFT);
  set_black (ctx);
  sheet_draw_footer (ctx);
}
