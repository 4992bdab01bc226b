/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-page.c: the specification sheet of one construction.
 *
 * From the top: header (practice, code, name, review), the section
 * drawing, the layer table, the results with the target, warnings, the
 * corrections that make up ΔU, notes, and at the foot the method
 * statement and the cautions.  The section
 * takes whatever height the other blocks leave. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "lamina-design.h"
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
    return "\xe2\x80\x94";
  memcpy (buffer, iso, 10);
  buffer[10] = '\0';
  return buffer;
}

/* Header */

static void
draw_field (SheetContext *ctx,
            const char   *label,
            const char   *value,
            const char   *when,
            double        x,
            double        y,
            double        width)
{
  char date[16];

  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, label, x, y, width - 4, PANGO_ALIGN_LEFT);
  set_black (ctx);
  sheet_text_line (ctx, SHEET_FONT_BODY, value && *value ? value : "\xe2\x80\x94",
                   x, y + 8, width - 4, PANGO_ALIGN_LEFT);
  if (when && value && *value)
    {
      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, date_part (when, date), x, y + 18, width - 4, PANGO_ALIGN_LEFT);
      set_black (ctx);
    }
}

/* Under which review policy the approval was made, and the reason given
 * to approve a result outside the method's scope without a 2-D check:
 * what the stamp means, on the sheet that carries it. */
static double
draw_approval_note (SheetContext             *ctx,
                    const LaminaConstruction *c,
                    double                    y,
                    double                    w)
{
  g_autofree char *text = NULL;

  /* Imported: the review was another library's, not this one's. */
  if (c->source_review != NULL)
    {
      text = c->status == LAMINA_STATUS_APPROVED
        ? g_strdup_printf (_("Approved elsewhere, not by this library's reviewers: %s."), c->source_review)
        : g_strdup_printf (_("Imported; not reviewed in this library (%s)."), c->source_review);
      return y + sheet_text (ctx, SHEET_FONT_SMALL, text, ctx->left, y, w, PANGO_ALIGN_LEFT) + 4;
    }
  if (c->status != LAMINA_STATUS_APPROVED || c->approval_policy == NULL)
    return y;
  if (g_strcmp0 (c->approval_policy, "single") == 0)
    text = g_strdup (_("Approved under the single-reviewer policy: the author may have checked and approved it."));
  else
    text = g_strdup (_("Approved under the four-eyes policy: checked and approved by others than the author."));
  if (c->approval_reason != NULL)
    {
      g_autofree char *both = g_strdup_printf (_("%s Outside the scope of EN ISO 6946 and approved without a 2-D "
                                                 "check (EN ISO 10211); reason given: %s"),
                                               text, c->approval_reason);
      g_free (text);
      text = g_steal_pointer (&both);
    }
  return y + sheet_text (ctx, SHEET_FONT_SMALL, text, ctx->left, y, w, PANGO_ALIGN_LEFT) + 4;
}

/* Every page of a draft's sheet says so at the top. */
static double
draw_draft_bar (SheetContext *ctx,
                double        y)
{
  cairo_t *cr = ctx->cr;
  double w = ctx->right - ctx->left;

  cairo_set_source_rgb (cr, 0.15, 0.15, 0.15);
  cairo_rectangle (cr, ctx->left, y, w, 15);
  cairo_fill (cr);
  cairo_set_source_rgb (cr, 1, 1, 1);
  sheet_text_line (ctx, SHEET_FONT_BOLD, _("DRAFT — not reviewed, not for construction"),
                   ctx->left + 6, y + 3, w - 12, PANGO_ALIGN_LEFT);
  cairo_set_source_rgb (cr, 0, 0, 0);
  return y + 15 + 6;
}

/* The practice and what the page is, small, above the title. */
static double
draw_practice_line (SheetContext *ctx,
                    double        y)
{
  double w = ctx->right - ctx->left;

  set_grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, ctx->options->practice, ctx->left, y, w * 0.6, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, _("Construction specification"), ctx->left + w * 0.6, y,
                   w * 0.4, PANGO_ALIGN_RIGHT);
  set_black (ctx);
  return y + 12;
}

static double
draw_header (SheetContext             *ctx,
             const LaminaConstruction *c)
{
  cairo_t *cr = ctx->cr;
  double w = ctx->right - ctx->left, y = ctx->top, col = w / 6;
  gboolean draft = c->status == LAMINA_STATUS_DRAFT;
  char revision[16], date[16];

  if (draft)
    y = draw_draft_bar (ctx, y);
  if (ctx->options->job != NULL)
    y = sheet_draw_job_band (ctx, y);
  y = draw_practice_line (ctx, y);
  if (ctx->dest)
    cairo_tag_begin (cr, CAIRO_TAG_DEST, ctx->dest);
  sheet_text_line (ctx, SHEET_FONT_CODE, c->code ? c->code : c->id, ctx->left, y, w, PANGO_ALIGN_LEFT);
  if (ctx->dest)
    cairo_tag_end (cr, CAIRO_TAG_DEST);
  y += 25;
  y += sheet_text (ctx, SHEET_FONT_TITLE, c->name, ctx->left, y, w, PANGO_ALIGN_LEFT) + 8;

  /* The same six columns whatever the status: a reader finds the review
   * in the same place on every sheet, a dash where it has not happened. */
  sheet_rule (ctx, y, 0.4, 0.6);
  y += 4;
  g_snprintf (revision, sizeof revision, "%d", c->revision);
  draw_field (ctx, _("ELEMENT"), sheet_element_label (c->element), NULL, ctx->left, y, col);
  draw_field (ctx, _("REVISION"), c->revision > 0 ? revision : NULL, NULL, ctx->left + col, y, col);
  draw_field (ctx, _("STATUS"), sheet_status_label (c->status), NULL, ctx->left + 2 * col, y, col);
  draw_field (ctx, _("CHECKED BY"), c->checked_by, c->checked_at, ctx->left + 3 * col, y, col);
  draw_field (ctx, _("APPROVED BY"), c->approved_by, c->approved_at, ctx->left + 4 * col, y, col);
  draw_field (ctx, _("REVISION DATE"), c->modified_at ? date_part (c->modified_at, date) : NULL, NULL,
              ctx->left + 5 * col, y, col);
  y += 29;
  y = draw_approval_note (ctx, c, y, w);
  sheet_rule (ctx, y, 0.4, 0.6);
  return y + GAP;
}

static char *
dup_footer (SheetContext             *ctx,
            const LaminaConstruction *c)
{
  GString *text = g_string_new (NULL);
  char date[16];

  if (ctx->options->practice)
    g_string_append_printf (text, "%s · ", ctx->options->practice);
  g_string_append (text, c->code ? c->code : c->id);
  if (c->revision > 0)
    {
      g_string_append (text, " · ");
      g_string_append_printf (text, _("revision %d"), c->revision);
    }
  if (c->modified_at)
    g_string_append_printf (text, " · %s", date_part (c->modified_at, date));
  return g_string_free (text, FALSE);
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

/* The row pitch for @text wrapped to @width: long names take more lines
 * rather than an ellipsis. */
static double
get_wrapped_pitch (SheetContext *ctx,
                   SheetFont     font,
                   const char   *text,
                   double        width,
                   double        pitch)
{
  double one, h;

  sheet_text_set (ctx, font, "Ag", 0, NULL, &one);
  sheet_text_set (ctx, font, text, width, NULL, &h);
  return pitch + MAX (h - one, 0);
}

static char *
dup_part_label (const LaminaLayer *layer,
                guint              k)
{
  const LaminaPart *part = layer->parts->pdata[k];
  const char *name = part->material ? part->material->name : _("air");
  char f[LAMINA_FORMAT_SIZE];

  lamina_format_percent (f, lamina_layer_get_part_fraction (layer, k));
  if (part->width > 0 && part->spacing > 0)
    {
      char wd[LAMINA_FORMAT_SIZE], sp[LAMINA_FORMAT_SIZE];
      return g_strdup_printf (_("%s, %s mm at %s mm (%s)"), name, lamina_format_thickness (wd, part->width),
                              lamina_format_thickness (sp, part->spacing), f);
    }
  return g_strdup_printf ("%s (%s)", name, f);
}

static double
measure_layer_table (SheetContext             *ctx,
                     const LaminaConstruction *c)
{
  Columns col;
  double height = 14 + ROW + ROW + 4;

  get_columns (ctx, &col);
  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      height += get_wrapped_pitch (ctx, SHEET_FONT_BODY, lamina_layer_get_label (layer),
                                   col.category - col.name - 6, ROW);
      if (layer->kind == LAMINA_LAYER_BRIDGED && layer->parts)
        for (guint k = 0; k < layer->parts->len; k++)
          {
            g_autofree char *label = dup_part_label (layer, k);
            height += get_wrapped_pitch (ctx, SHEET_FONT_SMALL, label, col.category - col.name - 16, SUBROW);
          }
    }
  return height;
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

static const char *
get_category_label (const LaminaLayer *layer)
{
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      return layer->material ? lamina_category_to_string (layer->material->category) : "";
    case LAMINA_LAYER_AIR:
      switch (layer->air)
        {
        case LAMINA_AIR_UNVENTILATED: return _("still air");
        case LAMINA_AIR_SLIGHTLY_VENTILATED: return _("slightly ventilated");
        case LAMINA_AIR_WELL_VENTILATED: return _("well ventilated");
        default: return _("air");
        }
    case LAMINA_LAYER_BRIDGED:
      return _("bridged");
    case LAMINA_LAYER_RESISTANCE:
    case LAMINA_N_LAYER_KINDS:
    default:
      return "";
    }
}

static double
draw_parts (SheetContext      *ctx,
            const Columns     *col,
            const LaminaLayer *layer,
            double             y)
{
  char l[LAMINA_FORMAT_SIZE], r[LAMINA_FORMAT_SIZE];

  for (guint k = 0; k < layer->parts->len; k++)
    {
      const LaminaPart *part = layer->parts->pdata[k];
      g_autofree char *label = dup_part_label (layer, k);
      double width = col->category - col->name - 16;

      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, "\xe2\x80\x94", col->name + 2, y, 0, PANGO_ALIGN_LEFT);
      sheet_text (ctx, SHEET_FONT_SMALL, label, col->name + 12, y, width, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_SMALL,
                       part->material ? lamina_category_to_string (part->material->category) : _("air"),
                       col->category, y, col->thickness - col->category - 28, PANGO_ALIGN_LEFT);
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
      y += get_wrapped_pitch (ctx, SHEET_FONT_SMALL, label, width, SUBROW);
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
      const char *label = lamina_layer_get_label (layer);
      double name_width = col.category - col.name - 6;
      char no[16];

      g_snprintf (no, sizeof no, "%u", i + 1);
      sheet_text_line (ctx, SHEET_FONT_BOLD, no, col.no, y, 0, PANGO_ALIGN_RIGHT);
      sheet_text (ctx, SHEET_FONT_BODY, label, col.name, y, name_width, PANGO_ALIGN_LEFT);
      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, get_category_label (layer), col.category, y + 1,
                       col.thickness - col.category - 28, PANGO_ALIGN_LEFT);
      set_black (ctx);
      if (layer->kind == LAMINA_LAYER_MATERIAL && layer->material)
        format_lambda (l, layer->material->conductivity);
      else
        g_strlcpy (l, "\xe2\x80\x93", sizeof l);
      if (lr->disregarded)
        g_strlcpy (r, _("disregarded"), sizeof r);
      else
        lamina_format_fixed (r, lr->resistance, 3);
      draw_number_cells (ctx, &col, SHEET_FONT_BODY, y, lamina_format_layer_thickness (d, layer), l, r);
      y += get_wrapped_pitch (ctx, SHEET_FONT_BODY, label, name_width, ROW);
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

typedef struct
{
  const char *symbol;
  const char *label;
  char        value[LAMINA_FORMAT_SIZE];
  const char *unit;
} ValueRow;

#define N_VALUE_ROWS 6
#define SYMBOL_WIDTH 22.0
#define VALUE_WIDTH  38.0

/* The widths a column of value rows needs: labels and units as long as
 * their longest text, so that none is cut. */
static void
measure_value_rows (SheetContext   *ctx,
                    const ValueRow *rows,
                    double         *label_width,
                    double         *unit_width)
{
  *label_width = *unit_width = 0;
  for (guint i = 0; i < N_VALUE_ROWS; i++)
    {
      double w;

      sheet_text_set (ctx, SHEET_FONT_SMALL, rows[i].label, 0, &w, NULL);
      *label_width = MAX (*label_width, w);
      sheet_text_set (ctx, SHEET_FONT_SMALL, rows[i].unit, 0, &w, NULL);
      *unit_width = MAX (*unit_width, w);
    }
  *label_width += 4;
}

static double
draw_value_rows (SheetContext   *ctx,
                 const ValueRow *rows,
                 double          x,
                 double          y,
                 double          label_width,
                 double          unit_width)
{
  double value_right = x + SYMBOL_WIDTH + label_width + VALUE_WIDTH;

  for (guint i = 0; i < N_VALUE_ROWS; i++, y += ROW)
    {
      sheet_text_line (ctx, SHEET_FONT_BOLD, rows[i].symbol, x, y, 0, PANGO_ALIGN_LEFT);
      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, rows[i].label, x + SYMBOL_WIDTH, y + 1, label_width,
                       PANGO_ALIGN_LEFT);
      set_black (ctx);
      sheet_text_line (ctx, SHEET_FONT_BODY, rows[i].value, value_right, y, 0, PANGO_ALIGN_RIGHT);
      set_grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, rows[i].unit, value_right + 3, y + 1, unit_width + 2,
                       PANGO_ALIGN_LEFT);
      set_black (ctx);
    }
  return value_right + 3 + unit_width;
}

static const char *
get_u_box_label (const LaminaResult *r)
{
  if (r->has_ground)
    return _("WITH THE GROUND, EN ISO 13370, THIS PLAN");
  if (r->tapered)
    return _("AREA-AVERAGE, TAPERED LAYER, CORRECTED");
  return _("THERMAL TRANSMITTANCE, CORRECTED");
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
  sheet_text_line (ctx, SHEET_FONT_LABEL, get_u_box_label (r), x + 8, y + 6, width - 16, PANGO_ALIGN_LEFT);
  set_black (ctx);
  /* A ground floor is stated with the ground (EN ISO 13370) for its plan. */
  big = g_strdup_printf ("U = %s", lamina_format_u (u, r->has_ground ? r->ground.u : r->u_corrected));
  sheet_text_line (ctx, SHEET_FONT_BIG, big, x + 8, y + 15, width - 16, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, "W/(m²·K)", x + 8, y + 37, width - 16, PANGO_ALIGN_LEFT);
  if (r->has_target)
    {
      /* The target as it was set (0.175 is not 0.18), and a U that misses
       * it with the digits that show the miss. */
      g_snprintf (t, sizeof t, "%g", c->target_u);
      /* Outside the method's scope (metal bridging, a wide gap between the
       * limits) the target is not shown as met until a 2-D check is. */
      if (r->target_met && lamina_field_is_advised (r) && ctx->field == NULL)
        target = g_strdup_printf (_("⚠ U ≤ %s by EN ISO 6946 only"), t);
      else if (r->target_met)
        target = g_strdup_printf (_("✓ Meets the target U ≤ %s"), t);
      else
        target = g_strdup_printf (_("✗ U %s > target %s"),
                                  lamina_format_u_against (u, r->u_corrected, c->target_u), t);
    }
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

static const char *
get_heat_flow_label (LaminaHeatFlow heat_flow)
{
  switch (heat_flow)
    {
    case LAMINA_HEAT_FLOW_UPWARD: return _("inside, heat flow upward");
    case LAMINA_HEAT_FLOW_DOWNWARD: return _("inside, heat flow downward");
    case LAMINA_HEAT_FLOW_HORIZONTAL:
    case LAMINA_N_HEAT_FLOWS:
    default: return _("inside, heat flow horizontal");
    }
}

static double
draw_results (SheetContext             *ctx,
              const LaminaConstruction *c,
              const LaminaResult       *r,
              double                    y)
{
  const char *rk = "m²·K/W", *uk = "W/(m²·K)";
  g_autofree char *e_label = g_strdup_printf (g_dngettext (GETTEXT_PACKAGE, "relative error e, %u section",
                                                           "relative error e, %u sections", r->n_sections),
                                              r->n_sections);
  ValueRow left[N_VALUE_ROWS] = {
    { "Rsi", get_heat_flow_label (r->heat_flow), "", rk },
    { "Rse", _("outside surface"), "", rk },
    { "R′T", _("upper limit"), "", rk },
    { "R″T", _("lower limit"), "", rk },
    { "RT", _("total, (R′T + R″T)/2"), "", rk },
    { "e", e_label, "", "" },
  };
  ValueRow right[N_VALUE_ROWS] = {
    { "U", r->tapered ? _("area mean, Annex E") : _("1/RT"), "", uk },
    { "ΔU", _("corrections"), "", uk },
    { "Uc", _("U + ΔU"), "", uk },
    { "θsi", _("inner surface"), "", "" },
    { "θi", _("inside, design"), "", "" },
    { "θe", _("outside, design"), "", "" },
  };
  double lw1, uw1, lw2, uw2, x2, end;

  lamina_format_fixed (left[0].value, r->rsi, 2);
  lamina_format_fixed (left[1].value, r->rse, 2);
  lamina_format_fixed (left[2].value, r->r_upper, 3);
  lamina_format_fixed (left[3].value, r->r_lower, 3);
  lamina_format_fixed (left[4].value, r->r_total, 3);
  lamina_format_percent (left[5].value, r->relative_error);
  lamina_format_u (right[0].value, r->u);
  lamina_format_fixed (right[1].value, r->delta_u, 3);
  lamina_format_u (right[2].value, r->u_corrected);
  lamina_format_temperature (right[3].value, r->surface_temperature_inner);
  lamina_format_temperature (right[4].value, r->inside_temperature);
  lamina_format_temperature (right[5].value, r->outside_temperature);

  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Results, EN ISO 6946:2017"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += 14;
  measure_value_rows (ctx, left, &lw1, &uw1);
  measure_value_rows (ctx, right, &lw2, &uw2);
  x2 = draw_value_rows (ctx, left, ctx->left, y, lw1, uw1) + 10;
  end = draw_value_rows (ctx, right, x2, y, lw2, uw2) + 10;
  draw_u_box (ctx, c, r, end, y, ctx->right - end);
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

      if (lamina_warning_kind_is_note (warning->kind))
        continue;
      if (text->len)
        g_string_append_c (text, '\n');
      /* The engine's sentences name the layer themselves. */
      g_string_append (text, "⚠  ");
      g_string_append (text, warning->message);
    }
  return g_string_free (text, FALSE);
}

/* The description, the notes, then what the method did as a matter of
 * course (layers disregarded, a small correction). */
static char *
dup_notes_text (const LaminaConstruction *c,
                const LaminaResult       *r)
{
  GString *text = g_string_new (NULL);

  if (c->description && *c->description)
    g_string_append (text, c->description);
  if (c->notes && *c->notes)
    g_string_append_printf (text, "%s%s", text->len ? "\n" : "", c->notes);
  for (guint i = 0; i < r->warnings->len; i++)
    {
      const LaminaWarning *warning = r->warnings->pdata[i];

      /* The method block says these with their figures. */
      if (warning->kind == LAMINA_WARNING_TAPERED || warning->kind == LAMINA_WARNING_UNHEATED_SPACE)
        continue;
      if (lamina_warning_kind_is_note (warning->kind))
        g_string_append_printf (text, "%s%s", text->len ? "\n" : "", warning->message);
    }
  return g_string_free (text, FALSE);
}

/* The method and cautions at the foot: the common part, then one sentence
 * for each further method that applies to this sheet (EN ISO 13788 when
 * a moisture check is on it, EN ISO 13370 for a floor on the ground). */
static char *
dup_method_text (const LaminaConstruction *c,
                 gboolean                  moisture_checked)
{
  GString *text = g_string_new (NULL);

  g_string_append (text,
                   _("Method. Thermal resistance and transmittance by EN ISO 6946:2017: surface resistances "
                     "by Table 7 for the stated direction of heat flow, air layers by 6.9, bridged layers by the "
                     "combined method (upper and lower limit, 6.7.2), corrections to U by Annex F. U is given to "
                     "two significant figures; intermediate values are unrounded.\n"
                     "Cautions. The results hold for the stated design values and conditions only. Check the "
                     "design values against the product declarations, and the construction against the local "
                     "building code and licensed professional practice."));
  g_string_append_c (text, ' ');
  if (moisture_checked)
    g_string_append (text,
                     _("The condensation risk is assessed by the monthly method of EN ISO 13788, which "
                       "ignores liquid transport, rain and air leakage: a borderline result needs EN 15026 "
                       "or specialist advice. Linear thermal bridges (EN ISO 10211) are not covered."));
  else
    g_string_append (text,
                     _("This sheet is not a condensation risk assessment (EN ISO 13788) and does not cover "
                       "linear thermal bridges (EN ISO 10211)."));
  if (c->has_ground)
    {
      g_string_append_c (text, ' ');
      g_string_append (text,
                       _("A ground floor's U with the ground (EN ISO 13370) holds for the stated plan; use "
                         "the table by B′ for another building and confirm the soil."));
    }
  return g_string_free (text, FALSE);
}

/* The text blocks flow down the page and on to continuation pages: a
 * block too long for what is left of a page goes on at the top of the
 * next, never cut.  Every page keeps the method and cautions at its foot
 * and the footer. */
typedef struct
{
  SheetContext             *ctx;
  const LaminaConstruction *c;
  const char               *foot;     /* the method and cautions */
  double                    foot_h;
} SheetFlow;

static double
flow_bottom (const SheetFlow *flow)
{
  return flow->ctx->bottom - 24 - flow->foot_h;
}

static void
finish_page (const SheetFlow *flow)
{
  SheetContext *ctx = flow->ctx;

  set_grey (ctx);
  sheet_rule (ctx, ctx->bottom - 20 - flow->foot_h, 0.4, 0.6);
  sheet_text (ctx, SHEET_FONT_SMALL, flow->foot, ctx->left, ctx->bottom - 16 - flow->foot_h,
              ctx->right - ctx->left, PANGO_ALIGN_LEFT);
  set_black (ctx);
  sheet_draw_footer (ctx);
}

/* Ends the page and starts the next with a short header naming the
 * construction; returns the y where the text goes on. */
static double
next_page (const SheetFlow *flow)
{
  SheetContext *ctx = flow->ctx;
  const LaminaConstruction *c = flow->c;
  double w = ctx->right - ctx->left, y = ctx->top;
  g_autofree char *title = NULL;

  finish_page (flow);
  cairo_show_page (ctx->cr);
  ctx->page++;
  ctx->dest = NULL;    /* the sheet's link target is its first page */
  sheet_draw_frame (ctx, c->status == LAMINA_STATUS_DRAFT);
  if (c->status == LAMINA_STATUS_DRAFT)
    y = draw_draft_bar (ctx, y);
  y = draw_practice_line (ctx, y);
  /* TRANSLATORS: the heading of a sheet's continuation page: code, name */
  title = g_strdup_printf (_("%s  %s (continued)"), c->code ? c->code : c->id, c->name);
  sheet_text_line (ctx, SHEET_FONT_HEADING, title, ctx->left, y, w, PANGO_ALIGN_LEFT);
  y += 16;
  sheet_rule (ctx, y, 0.4, 0.6);
  return y + GAP;
}

static double
flow_block (const SheetFlow *flow,
            const char      *heading,
            const char      *text,
            double           y)
{
  SheetContext *ctx = flow->ctx;
  g_autoptr(PangoLayout) block = NULL;
  PangoLayoutIter *iter;
  double top;
  int lead = 0, offset = 0, first, last;

  if (text == NULL || *text == '\0')
    return y;
  sheet_text_set (ctx, SHEET_FONT_BODY, text, ctx->right - ctx->left, NULL, NULL);
  /* A copy: the page furniture of a page break reuses the context's layout. */
  block = pango_layout_copy (ctx->layout);
  /* The heading keeps its first two lines with it. */
  iter = pango_layout_get_iter (block);
  if (pango_layout_get_line_count (block) > 1)
    pango_layout_iter_next_line (iter);
  pango_layout_iter_get_line_yrange (iter, NULL, &lead);
  pango_layout_iter_free (iter);
  if (y + 13 + (double) lead / PANGO_SCALE > flow_bottom (flow) + 1)
    y = next_page (flow);
  sheet_text_line (ctx, SHEET_FONT_HEADING, heading, ctx->left, y, 0, PANGO_ALIGN_LEFT);
  top = y + 13;
  y = top;
  iter = pango_layout_get_iter (block);
  do
    {
      PangoRectangle logical;

      pango_layout_iter_get_line_yrange (iter, &first, &last);
      pango_layout_iter_get_line_extents (iter, NULL, &logical);
      /* A point of slack: the break is for real overflow, not rounding. */
      if (first > offset && top + (double) (last - offset) / PANGO_SCALE > flow_bottom (flow) + 1)
        {
          g_autofree char *again = NULL;

          top = next_page (flow);
          offset = first;
          /* TRANSLATORS: a block's heading again where it goes on over a page, e.g. "Notes (continued)" */
          again = g_strdup_printf (_("%s (continued)"), heading);
          sheet_text_line (ctx, SHEET_FONT_HEADING, again, ctx->left, top, 0, PANGO_ALIGN_LEFT);
          top += 13;
        }
      cairo_move_to (ctx->cr, ctx->left + (double) logical.x / PANGO_SCALE,
                     top + (double) (pango_layout_iter_get_baseline (iter) - offset) / PANGO_SCALE);
      pango_cairo_show_layout_line (ctx->cr, pango_layout_iter_get_line_readonly (iter));
      y = top + (double) (last - offset) / PANGO_SCALE;
    }
  while (pango_layout_iter_next_line (iter));
  pango_layout_iter_free (iter);
  return y + GAP;
}

void
sheet_draw_page (SheetContext             *ctx,
                 const LaminaConstruction *c,
                 const LaminaResult       *result)
{
  g_autofree char *warnings = dup_warnings_text (result);
  g_autofree char *notes = dup_notes_text (c, result);
  g_autofree char *field_summary = ctx->field ? sheet_dup_field_summary (ctx->field) : NULL;
  g_autofree char *corrections = sheet_dup_corrections_text (c, result);
  g_autofree char *dynamic = lamina_dynamic_dup_text (c, result);
  g_autofree char *method = sheet_dup_method_text (c, result);
  g_autofree char *foot = dup_method_text (c, ctx->moisture != NULL);
  double table_h, warn_h = 0, notes_h = 0, corr_h = 0, dyn_h, method_h, y, section_h, room;
  double ground_h = sheet_measure_ground (ctx, c, result), applied_h = 0;
  double page_h = ctx->bottom - ctx->top;
  SheetFlow flow = { ctx, c, foot, 0 };

  if (field_summary != NULL)
    {
      char *joined = g_strconcat (warnings, *warnings ? "\n" : "", "→  ", field_summary, NULL);
      g_free (warnings);
      warnings = joined;
    }
  if (ctx->moisture != NULL)
    {
      g_autofree char *summary = sheet_dup_moisture_summary (c, ctx->moisture, ctx->moisture_page);
      /* A failed check is a warning like the engine's (mould, lasting
       * condensation), not a plain note. */
      char *joined = g_strconcat (warnings, *warnings ? "\n" : "",
                                  lamina_moisture_result_fails (ctx->moisture) ? "⚠  " : "→  ", summary, NULL);

      g_free (warnings);
      warnings = joined;
    }
  if (ctx->job_line != NULL)
    {
      g_autofree char *criteria = sheet_job_dup_criteria_text (ctx);
      char *joined = criteria ? g_strconcat (warnings, *warnings ? "\n" : "", "→  ", criteria, NULL) : NULL;

      if (joined != NULL)
        {
          g_free (warnings);
          warnings = joined;
        }
    }
  g_free (ctx->footer);
  ctx->footer = dup_footer (ctx, c);
  sheet_draw_frame (ctx, c->status == LAMINA_STATUS_DRAFT);
  y = draw_header (ctx, c);

  table_h = measure_layer_table (ctx, c);
  if (*warnings)
    warn_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, warnings) + GAP;
  if (corrections)
    corr_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, corrections) + GAP;
  if (*notes)
    notes_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, notes) + GAP;
  dyn_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, dynamic) + GAP;
  if (method)
    applied_h = 13 + measure_paragraph (ctx, SHEET_FONT_BODY, method) + GAP;
  method_h = measure_paragraph (ctx, SHEET_FONT_SMALL, foot);
  flow.foot_h = method_h;

  /* The section takes the height left, within bounds: on a full page
   * (a draft's band, a job's band and its criteria, many warnings) it
   * gives way down to 17 % of the page before the text below is cut. */
  room = ctx->bottom - 24 - method_h - y - table_h - RESULTS_HEIGHT - warn_h - corr_h - dyn_h - notes_h
         - ground_h - applied_h - 2 * GAP - 6;
  section_h = CLAMP (room, page_h * 0.17, page_h * 0.4);
  y = draw_section (ctx, c, result, y, section_h);
  y = draw_layer_table (ctx, c, result, y);
  y = draw_results (ctx, c, result, y);
  y = sheet_draw_ground (ctx, c, result, y);
  y = flow_block (&flow, _("Method for this construction"), method, y);
  y = flow_block (&flow, _("Warnings"), warnings, y);
  y = flow_block (&flow, _("Corrections to U, EN ISO 6946:2017 Annex F"), corrections, y);
  y = flow_block (&flow, _("Dynamic thermal characteristics, EN ISO 13786:2017"), dynamic, y);
  flow_block (&flow, _("Notes"), notes, y);
  finish_page (&flow);
}

guint
sheet_count_pages (const LaminaSheetOptions   *options,
                   const LaminaConstruction   *c,
                   const LaminaResult         *result,
                   const LaminaFieldResult    *field,
                   const LaminaMoistureResult *moisture,
                   const LaminaJobLine        *job_line)
{
  /* The same drawing on a pixel of its own: the sheet's text is laid out
   * with unhinted metrics at 72 dpi, so the breaks fall as in the PDF. */
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_A8, 1, 1);
  cairo_t *cr = cairo_create (surface);
  SheetContext dry;
  guint pages;

  sheet_context_init (&dry, cr, options);
  dry.page = dry.n_pages = 1;
  dry.field = field;
  dry.moisture = moisture;
  dry.moisture_page = moisture != NULL;
  dry.job_line = job_line;
  sheet_draw_page (&dry, c, result);
  pages = dry.page;
  sheet_context_clear (&dry);
  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  return pages;
}
