/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-compare.c: two build-ups side by side on one page — the
 * sheet a client gets when choosing between options.  Both sections at
 * one drafting scale, each layer list, then every figure of A and B with
 * B − A, the warnings of both, and the method and cautions. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-design.h"
#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#include "lamina-sheet-format.h"

#define ROW  11.5
#define SUB   9.5
#define GAP  12.0

/* Rows */

static LaminaComparisonRow *
add_row (GPtrArray  *rows,
         const char *label,
         const char *unit)
{
  LaminaComparisonRow *row = g_new0 (LaminaComparisonRow, 1);

  row->label = label;
  row->unit = unit;
  g_ptr_array_add (rows, row);
  return row;
}

/* A number row: the values with @decimals places and B − A signed. */
static void
add_number (GPtrArray  *rows,
            const char *label,
            const char *unit,
            double      a,
            double      b,
            int         decimals)
{
  LaminaComparisonRow *row = add_row (rows, label, unit);
  double step = pow (10, -decimals);
  /* The difference of the shown values, so that the columns add up. */
  double diff = round (b / step) * step - round (a / step) * step;

  lamina_format_fixed (row->a, a, decimals);
  lamina_format_fixed (row->b, b, decimals);
  if (isnan (a) || isnan (b))
    g_strlcpy (row->difference, "—", sizeof row->difference);
  else
    {
      lamina_format_fixed (row->difference, fabs (diff) < step / 2 ? 0.0 : diff, decimals);
      /* A plus sign for growth; lamina_format_fixed signs negatives. */
      if (diff >= step / 2)
        {
          char plus[sizeof row->difference];
          g_snprintf (plus, sizeof plus, "+%s", row->difference);
          g_strlcpy (row->difference, plus, sizeof row->difference);
        }
    }
  if (isnan (a))
    g_strlcpy (row->a, "—", sizeof row->a);
  if (isnan (b))
    g_strlcpy (row->b, "—", sizeof row->b);
}

static void
add_text (GPtrArray  *rows,
          const char *label,
          const char *a,
          const char *b)
{
  LaminaComparisonRow *row = add_row (rows, label, "");

  g_strlcpy (row->a, a, sizeof row->a);
  g_strlcpy (row->b, b, sizeof row->b);
}

static const char *
target_text (const LaminaConstruction *c,
             const LaminaResult       *r,
             char                     *buffer)
{
  char t[LAMINA_U_TEXT_SIZE];

  if (!r->has_target)
    return _("none set");
  g_snprintf (buffer, LAMINA_FORMAT_SIZE, r->target_met ? _("≤ %s met") : _("≤ %s NOT met"),
              lamina_format_u (t, c->target_u));
  return buffer;
}

/* Mass per area Σ ρ d (bridged layers area-weighted), NAN when a density
 * is missing: what tells a heavy option from a light one. */
static double
areal_mass (const LaminaConstruction *c,
            const LaminaResult       *r)
{
  double m = 0;

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *l = c->layers->pdata[i];
      double d = l->thickness / 1000.0;

      if (r->layers[i].disregarded || l->kind == LAMINA_LAYER_AIR || l->kind == LAMINA_LAYER_RESISTANCE)
        continue;
      if (l->kind == LAMINA_LAYER_MATERIAL)
        m += l->material->density * d;
      else
        for (guint p = 0; p < l->parts->len; p++)
          {
            const LaminaPart *part = l->parts->pdata[p];
            if (part->material != NULL)
              m += lamina_layer_get_part_fraction (l, p) * part->material->density * d;
          }
    }
  return m;
}

GPtrArray *
lamina_comparison_rows (const LaminaConstruction *a,
                        const LaminaResult       *ra,
                        const LaminaConstruction *b,
                        const LaminaResult       *rb)
{
  GPtrArray *rows = g_ptr_array_new_with_free_func (g_free);
  const char *rk = "m²·K/W", *uk = "W/(m²·K)";
  char ta[LAMINA_FORMAT_SIZE], tb[LAMINA_FORMAT_SIZE], na[16], nb[16];
  LaminaDynamic da, db;
  gboolean dyn_a, dyn_b;

  g_return_val_if_fail (a != NULL && ra != NULL && b != NULL && rb != NULL, NULL);

  g_snprintf (na, sizeof na, "%u", a->layers->len);
  g_snprintf (nb, sizeof nb, "%u", b->layers->len);
  add_text (rows, _("Element"), sheet_element_label (a->element), sheet_element_label (b->element));
  add_text (rows, _("Layers"), na, nb);
  add_number (rows, _("Total thickness"), "mm", ra->thickness, rb->thickness, 1);
  add_number (rows, _("Mass per area"), "kg/m²", areal_mass (a, ra), areal_mass (b, rb), 0);
  add_number (rows, _("Upper limit R′T"), rk, ra->r_upper, rb->r_upper, 3);
  add_number (rows, _("Lower limit R″T"), rk, ra->r_lower, rb->r_lower, 3);
  add_number (rows, _("Total resistance RT"), rk, ra->r_total, rb->r_total, 3);
  add_number (rows, _("U = 1/RT"), uk, ra->u, rb->u, 3);
  add_number (rows, _("Corrections ΔU"), uk, ra->delta_u, rb->delta_u, 3);
  add_number (rows, _("Corrected U"), uk, ra->u_corrected, rb->u_corrected, 3);
  add_text (rows, _("Target U"), target_text (a, ra, ta), target_text (b, rb, tb));
  add_number (rows, _("Inner surface temperature θsi"), "°C", ra->surface_temperature_inner,
              rb->surface_temperature_inner, 1);

  dyn_a = lamina_dynamic_calculate (a, ra, LAMINA_DYNAMIC_PERIOD_HOURS, &da, NULL);
  dyn_b = lamina_dynamic_calculate (b, rb, LAMINA_DYNAMIC_PERIOD_HOURS, &db, NULL);
  if (!dyn_a)
    da = (LaminaDynamic) { NAN, NAN, NAN, NAN, NAN, NAN, NAN, NAN, NAN, NAN, FALSE };
  if (!dyn_b)
    db = (LaminaDynamic) { NAN, NAN, NAN, NAN, NAN, NAN, NAN, NAN, NAN, NAN, FALSE };
  add_number (rows, _("Periodic transmittance |Y12|"), uk, da.periodic_transmittance, db.periodic_transmittance, 3);
  add_number (rows, _("Decrement factor f"), "", da.decrement_factor, db.decrement_factor, 2);
  add_number (rows, _("Time shift"), "h", da.time_shift, db.time_shift, 1);
  add_number (rows, _("Internal admittance |Y11|"), uk, da.admittance_inner, db.admittance_inner, 2);
  add_number (rows, _("Areal heat capacity κ1, inside"), "kJ/(m²·K)", da.areal_heat_capacity_inner / 1000,
              db.areal_heat_capacity_inner / 1000, 1);
  add_number (rows, _("Areal heat capacity κ2, outside"), "kJ/(m²·K)", da.areal_heat_capacity_outer / 1000,
              db.areal_heat_capacity_outer / 1000, 1);
  return rows;
}

/* The page */

typedef struct
{
  const LaminaConstruction *c;
  LaminaResult             *r;
  const char               *label;
  const char               *letter;
} Side;

static void
grey (SheetContext *ctx)
{
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
}

static void
black (SheetContext *ctx)
{
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
}

static char *
dup_side_label (const Side *s)
{
  const LaminaConstruction *c = s->c;

  if (s->label != NULL)
    return g_strdup (s->label);
  if (c->revision > 0)
    return g_strdup_printf (_("revision %d, %s"), c->revision, sheet_status_label (c->status));
  return g_strdup (sheet_status_label (c->status));
}

static double
draw_side_heading (SheetContext *ctx,
                   const Side   *s,
                   double        x,
                   double        y,
                   double        w)
{
  g_autofree char *code = g_strdup_printf ("%s  %s", s->letter, s->c->code ? s->c->code : s->c->id);
  g_autofree char *label = dup_side_label (s);
  double h;

  sheet_text_line (ctx, SHEET_FONT_CODE, code, x, y, w, PANGO_ALIGN_LEFT);
  y += 22;
  h = sheet_text (ctx, SHEET_FONT_BOLD, s->c->name, x, y, w, PANGO_ALIGN_LEFT);
  y += MIN (h, 24) + 2;
  grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, label, x, y, w, PANGO_ALIGN_LEFT);
  black (ctx);
  return y + 10;
}

/* The largest drafting ratio 1:n at which both sections fit. */
static int
common_ratio (SheetContext             *ctx,
              const Side               *sides,
              const LaminaSectionStyle *style,
              double                    w,
              double                    h)
{
  static const int ratios[] = { 1, 2, 5, 10, 20, 25, 50, 100, 200 };
  const double pt_per_mm = 72.0 / 25.4;
  double fit = MIN (lamina_section_fit_scale (sides[0].c, style, w, h),
                    lamina_section_fit_scale (sides[1].c, style, w, h));

  for (guint i = 0; i < G_N_ELEMENTS (ratios); i++)
    if (pt_per_mm / ratios[i] <= fit)
      return ratios[i];
  return ratios[G_N_ELEMENTS (ratios) - 1];
}

static char *
dup_layer_line (const LaminaLayer *l,
                guint              number)
{
  char d[LAMINA_FORMAT_SIZE];
  g_autoptr(GString) name = g_string_new (NULL);

  if (l->kind == LAMINA_LAYER_BRIDGED)
    for (guint p = 0; p < l->parts->len; p++)
      {
        const LaminaPart *part = l->parts->pdata[p];
        g_string_append_printf (name, "%s%s", p ? " / " : "", part->material ? part->material->name : _("air"));
      }
  else
    g_string_append (name, lamina_layer_get_label (l));
  lamina_format_thickness (d, l->thickness);
  return g_strdup_printf ("%u\t%s\t%s", number, name->str, d);
}

static void
draw_layer_list (SheetContext *ctx,
                 const Side   *s,
                 double        x,
                 double        y,
                 double        w,
                 guint         max_rows)
{
  guint n = MIN (s->c->layers->len, max_rows);

  for (guint i = 0; i < n; i++, y += SUB)
    {
      g_autofree char *line = dup_layer_line (s->c->layers->pdata[i], i + 1);
      g_auto(GStrv) cells = g_strsplit (line, "\t", 3);

      grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, cells[0], x, y, 12, PANGO_ALIGN_RIGHT);
      black (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, cells[1], x + 16, y, w - 16 - 40, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_SMALL, cells[2], x + w, y, 0, PANGO_ALIGN_RIGHT);
    }
  if (s->c->layers->len > max_rows)
    sheet_text_line (ctx, SHEET_FONT_SMALL, "…", x + 16, y, w, PANGO_ALIGN_LEFT);
}

static double
draw_figures (SheetContext *ctx,
              GPtrArray    *rows,
              double        y)
{
  double w = ctx->right - ctx->left;
  double c_a = ctx->left + w * 0.55, c_b = ctx->left + w * 0.70, c_d = ctx->left + w * 0.85;

  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Figures"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
  grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_LABEL, "A", c_a, y + 2, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, "B", c_b, y + 2, 0, PANGO_ALIGN_RIGHT);
  sheet_text_line (ctx, SHEET_FONT_LABEL, _("B − A"), c_d, y + 2, 0, PANGO_ALIGN_RIGHT);
  black (ctx);
  y += 14;
  sheet_rule (ctx, y - 2, 0.4, 0.6);
  for (guint i = 0; i < rows->len; i++, y += ROW)
    {
      const LaminaComparisonRow *row = rows->pdata[i];

      if (i % 2 == 1)
        {
          cairo_set_source_rgb (ctx->cr, 0.95, 0.95, 0.95);
          cairo_rectangle (ctx->cr, ctx->left, y - 1.5, w, ROW);
          cairo_fill (ctx->cr);
          black (ctx);
        }
      sheet_text_line (ctx, SHEET_FONT_BODY, row->label, ctx->left, y, w * 0.42, PANGO_ALIGN_LEFT);
      sheet_text_line (ctx, SHEET_FONT_BODY, row->a, c_a, y, 0, PANGO_ALIGN_RIGHT);
      sheet_text_line (ctx, SHEET_FONT_BODY, row->b, c_b, y, 0, PANGO_ALIGN_RIGHT);
      sheet_text_line (ctx, SHEET_FONT_BOLD, row->difference, c_d, y, 0, PANGO_ALIGN_RIGHT);
      grey (ctx);
      sheet_text_line (ctx, SHEET_FONT_SMALL, row->unit, c_d + 8, y + 1, ctx->right - c_d - 8, PANGO_ALIGN_LEFT);
      black (ctx);
    }
  return y + GAP;
}

static char *
dup_notes (const Side *sides)
{
  GString *text = g_string_new (NULL);

  for (guint k = 0; k < 2; k++)
    {
      const LaminaResult *r = sides[k].r;
      LaminaDynamic d;
      g_autoptr(GError) error = NULL;

      for (guint i = 0; i < r->warnings->len; i++)
        {
          const LaminaWarning *w = r->warnings->pdata[i];
          g_string_append_printf (text, "%s%s: %s", text->len ? "\n" : "", sides[k].letter, w->message);
        }
      if (!lamina_dynamic_calculate (sides[k].c, r, LAMINA_DYNAMIC_PERIOD_HOURS, &d, &error))
        g_string_append_printf (text, "%s%s: %s", text->len ? "\n" : "", sides[k].letter, error->message);
      else if (d.bridged_equivalent)
        g_string_append_printf (text, "%s%s: %s", text->len ? "\n" : "", sides[k].letter,
                                _("dynamic figures take bridged layers by their lower-limit equivalent "
                                  "(an approximation)."));
    }
  return g_string_free (text, FALSE);
}

static const char *
get_cautions (void)
{
  return _("Method. R and U by EN ISO 6946:2017 (surface resistances by Table 7, bridged layers by the upper "
           "and lower limits, corrections by Annex F); dynamic characteristics by EN ISO 13786:2017 for a "
           "24 h period. B − A is the difference of the figures as shown.\n"
           "Cautions. Both options hold for the stated design values and conditions only. Before choosing, "
           "check the design values against the product declarations, the construction against the local "
           "building code, moisture safety (EN ISO 13788) and licensed professional practice. A draft is not "
           "for construction.");
}

static void
draw_page (SheetContext *ctx,
           Side         *sides)
{
  const double w = ctx->right - ctx->left, col = (w - 18) / 2;
  gboolean draft = sides[0].c->status == LAMINA_STATUS_DRAFT || sides[1].c->status == LAMINA_STATUS_DRAFT;
  g_autoptr(GPtrArray) rows = lamina_comparison_rows (sides[0].c, sides[0].r, sides[1].c, sides[1].r);
  g_autofree char *notes = dup_notes (sides);
  g_autofree char *caption = NULL;
  g_autofree char *paper = g_ascii_strup (lamina_paper_to_string (ctx->options->paper), -1);
  LaminaSectionStyle style;
  double y = ctx->top, y_heads = 0, method_h, section_h, notes_h;
  guint list_rows;
  int ratio;

  sheet_draw_frame (ctx, draft);
  if (draft)
    {
      cairo_set_source_rgb (ctx->cr, 0.15, 0.15, 0.15);
      cairo_rectangle (ctx->cr, ctx->left, y, w, 15);
      cairo_fill (ctx->cr);
      cairo_set_source_rgb (ctx->cr, 1, 1, 1);
      sheet_text_line (ctx, SHEET_FONT_BOLD, _("Includes a DRAFT — not reviewed, not for construction"),
                       ctx->left + 6, y + 3, w - 12, PANGO_ALIGN_LEFT);
      black (ctx);
      y += 21;
    }
  grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, ctx->options->practice, ctx->left, y, w * 0.6, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, _("Comparison of two build-ups"), ctx->left + w * 0.6, y, w * 0.4,
                   PANGO_ALIGN_RIGHT);
  black (ctx);
  y += 14;
  for (guint k = 0; k < 2; k++)
    y_heads = MAX (y_heads, draw_side_heading (ctx, &sides[k], ctx->left + k * (col + 18), y, col));
  y = y_heads;
  sheet_rule (ctx, y, 0.4, 0.6);
  y += 6;

  /* Room: the figures, the layer lists, the notes and the cautions first;
   * the sections take the rest, within bounds. */
  method_h = 0;
  sheet_text_set (ctx, SHEET_FONT_SMALL, get_cautions (), w, NULL, &method_h);
  notes_h = 0;
  if (*notes)
    sheet_text_set (ctx, SHEET_FONT_SMALL, notes, w, NULL, &notes_h);
  notes_h = MIN (notes_h, 80);
  list_rows = MIN (MAX (sides[0].c->layers->len, sides[1].c->layers->len), 14);
  section_h = ctx->bottom - 24 - method_h - y - 14 - list_rows * SUB - GAP - (14 + rows->len * ROW + GAP)
              - (*notes ? notes_h + 13 + GAP : 0) - 8;
  section_h = CLAMP (section_h, 120, 300);

  lamina_section_style_init (&style, 6.5);
  ratio = common_ratio (ctx, sides, &style, col, section_h);
  style.scale = 72.0 / 25.4 / ratio;
  caption = g_strdup_printf (_("Both sections at 1:%d on %s · dimensions in mm · inside to outside"), ratio, paper);
  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Sections"), ctx->left, y, w / 3, PANGO_ALIGN_LEFT);
  grey (ctx);
  sheet_text_line (ctx, SHEET_FONT_SMALL, caption, ctx->left + w / 3, y + 1, w * 2 / 3, PANGO_ALIGN_RIGHT);
  black (ctx);
  y += 14;
  for (guint k = 0; k < 2; k++)
    {
      double x = ctx->left + k * (col + 18);

      lamina_section_layout_compute (&ctx->section_layout, sides[k].c, &style, x, y, col, section_h);
      lamina_section_draw (ctx->section, ctx->cr, &ctx->section_layout, sides[k].c, sides[k].r, &style);
      draw_layer_list (ctx, &sides[k], x, y + section_h + 4, col, list_rows);
    }
  y += section_h + 4 + list_rows * SUB + GAP;

  y = draw_figures (ctx, rows, y);
  if (*notes)
    {
      sheet_text_line (ctx, SHEET_FONT_HEADING, _("Warnings and notes"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
      y += 13;
      sheet_text_set (ctx, SHEET_FONT_SMALL, notes, w, NULL, NULL);
      pango_layout_set_height (ctx->layout, (int) (notes_h * PANGO_SCALE) + PANGO_SCALE);
      pango_layout_set_ellipsize (ctx->layout, PANGO_ELLIPSIZE_END);
      cairo_move_to (ctx->cr, ctx->left, y);
      pango_cairo_show_layout (ctx->cr, ctx->layout);
      pango_layout_set_height (ctx->layout, -1);
      pango_layout_set_ellipsize (ctx->layout, PANGO_ELLIPSIZE_NONE);
    }

  grey (ctx);
  sheet_rule (ctx, ctx->bottom - 20 - method_h, 0.4, 0.6);
  sheet_text (ctx, SHEET_FONT_SMALL, get_cautions (), ctx->left, ctx->bottom - 16 - method_h, w,
              PANGO_ALIGN_LEFT);
  black (ctx);
  g_free (ctx->footer);
  ctx->footer = g_strdup_printf ("%s%s%s: %s / %s", ctx->options->practice ? ctx->options->practice : "",
                                 ctx->options->practice ? " · " : "", _("comparison"),
                                 sides[0].c->code ? sides[0].c->code : sides[0].c->id,
                                 sides[1].c->code ? sides[1].c->code : sides[1].c->id);
  sheet_draw_footer (ctx);
}

typedef struct
{
  Side sides[2];
} Comparison;

static gboolean
comparison_init (Comparison               *cmp,
                 const LaminaConstruction *a,
                 const char               *label_a,
                 const LaminaConstruction *b,
                 const char               *label_b,
                 GError                  **error)
{
  const LaminaConstruction *cs[2] = { a, b };

  cmp->sides[0] = (Side) { a, NULL, label_a, "A" };
  cmp->sides[1] = (Side) { b, NULL, label_b, "B" };
  for (guint k = 0; k < 2; k++)
    {
      g_autoptr(GError) local = NULL;

      cmp->sides[k].r = lamina_calculate (cs[k], &local);
      if (cmp->sides[k].r == NULL)
        {
          g_set_error (error, LAMINA_SHEET_ERROR, LAMINA_SHEET_ERROR_INVALID, "%s: %s",
                       cs[k]->code ? cs[k]->code : cs[k]->id, local->message);
          return FALSE;
        }
    }
  return TRUE;
}

static void
comparison_clear (Comparison *cmp)
{
  for (guint k = 0; k < 2; k++)
    g_clear_pointer (&cmp->sides[k].r, lamina_result_free);
}

static gboolean
paint_cb (SheetContext *ctx,
          gpointer      user_data,
          GError      **error)
{
  Comparison *cmp = user_data;

  ctx->page = ctx->n_pages = 1;
  draw_page (ctx, cmp->sides);
  return TRUE;
}

gboolean
lamina_comparison_draw_page (cairo_t                  *cr,
                             const LaminaSheetOptions *options,
                             const LaminaConstruction *a,
                             const char               *label_a,
                             const LaminaConstruction *b,
                             const char               *label_b,
                             GError                  **error)
{
  Comparison cmp = { 0 };
  SheetContext ctx;
  gboolean ok;

  g_return_val_if_fail (cr != NULL && options != NULL && a != NULL && b != NULL, FALSE);

  ok = comparison_init (&cmp, a, label_a, b, label_b, error);
  if (ok)
    {
      sheet_context_init (&ctx, cr, options);
      paint_cb (&ctx, &cmp, NULL);
      sheet_context_clear (&ctx);
    }
  comparison_clear (&cmp);
  return ok;
}

gboolean
lamina_comparison_write_pdf (const char               *path,
                             gboolean                  overwrite,
                             const LaminaSheetOptions *options,
                             const LaminaConstruction *a,
                             const char               *label_a,
                             const LaminaConstruction *b,
                             const char               *label_b,
                             GError                  **error)
{
  Comparison cmp = { 0 };
  g_autofree char *title = NULL;
  gboolean ok;

  g_return_val_if_fail (path != NULL && options != NULL && a != NULL && b != NULL, FALSE);

  ok = comparison_init (&cmp, a, label_a, b, label_b, error);
  if (ok)
    {
      title = g_strdup_printf (_("Comparison: %s and %s"), a->code ? a->code : a->id, b->code ? b->code : b->id);
      ok = sheet_write_single_page (path, overwrite, options, title, paint_cb, &cmp, error);
    }
  comparison_clear (&cmp);
  return ok;
}
