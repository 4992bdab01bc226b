/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The moisture page of a sheet (EN ISO 13788): a construction with a
 * moisture check continues on a page with the climate and its source, the
 * inside conditions, the surface and interstitial results, the vapour
 * pressure across the section in the critical month, the accumulation
 * over the year and the method's cautions. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "config.h"

#include "lamina-moisture-plot.h"
#include "lamina-sheet-private.h"

#include <glib/gi18n-lib.h>

#define GAP 14.0

static char *
dup_inside (const LaminaMoistureResult *r)
{
  if (r->humidity_class != 0)
    return g_strdup_printf (_("humidity class %d (EN ISO 13788 Annex A), %.1f °C"), r->humidity_class,
                            r->inside_temperature[0]);
  return g_strdup_printf (_("relative humidity %.0f %%, %.1f °C"), 100 * r->inside_humidity,
                          r->inside_temperature[0]);
}

char *
sheet_dup_moisture_summary (const LaminaConstruction   *c,
                            const LaminaMoistureResult *r,
                            gboolean                    with_page)
{
  g_autofree char *surface = NULL, *inter = NULL;

  if (r->critical_month > 0)
    surface = g_strdup_printf (_("surface %s (fRsi %.3f, fRsi,min %.3f in %s)"),
                               r->surface_passes ? _("passes") : _("FAILS"), r->f_rsi, r->f_rsi_min,
                               lamina_month_name (r->critical_month));
  else
    surface = g_strdup (_("surface passes"));
  if (!r->condensation)
    inter = g_strdup (_("no interstitial condensation"));
  else
    inter = g_strdup_printf (_("interstitial condensation up to %.3f kg/m² (%s), %s"), r->max_accumulation,
                             lamina_month_name (r->max_month),
                             r->dries_out ? _("dries out") : _("does NOT dry out"));
  return g_strdup_printf (_("Moisture (EN ISO 13788, climate %s): %s; %s; %s.%s"),
                          c->moisture->climate_data->name ? c->moisture->climate_data->name : c->moisture->climate,
                          lamina_moisture_result_fails (r) ? _("FAILS") : _("passes"), surface, inter,
                          with_page ? _(" Details on the moisture page.") : "");
}

static const char *
get_moisture_method_text (void)
{
  return _("Method. EN ISO 13788:2012, monthly means. Surface: Rsi 0.25 m²·K/W, mould criterion φsi ≤ 0.8, "
           "fRsi = 1 − 0.25·U*. Interstitial: temperatures from the EN ISO 6946 resistances, vapour "
           "pressure against cumulative sd (μ·d or a declared sd), condensation planes by the tangent "
           "construction between layers, the year from the first month with condensation after one "
           "without. Read for this product: a bridged layer by its largest part; layers outside a well "
           "ventilated air layer left out.\n"
           "Cautions. The method ignores liquid transport, moisture storage, built-in moisture, rain, "
           "air leakage and solar gains. A failing or borderline result needs a hygrothermal simulation "
           "(EN 15026) or specialist advice. The climate data must be those of the site; confirm the "
           "result against local building codes and licensed professional practice.");
}

static void
draw_heading (SheetContext             *ctx,
              const LaminaConstruction *c,
              double                   *y)
{
  double w = ctx->right - ctx->left;
  g_autofree char *heading = g_strdup_printf (_("%s — moisture, EN ISO 13788"), c->code ? c->code : c->id);

  /* A job's sheet carries the job's band on each of its pages. */
  if (ctx->options->job != NULL)
    *y = sheet_draw_job_band (ctx, *y);
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_text_line (ctx, SHEET_FONT_SMALL, ctx->options->practice, ctx->left, *y, w * 0.6, PANGO_ALIGN_LEFT);
  sheet_text_line (ctx, SHEET_FONT_SMALL, _("Construction specification, continued"), ctx->left + w * 0.6, *y,
                   w * 0.4, PANGO_ALIGN_RIGHT);
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
  *y += 12;
  sheet_text_line (ctx, SHEET_FONT_CODE, heading, ctx->left, *y, w, PANGO_ALIGN_LEFT);
  *y += 25;
  sheet_rule (ctx, *y, 0.4, 0.6);
  *y += GAP;
}

void
sheet_draw_moisture_page (SheetContext               *ctx,
                          const LaminaConstruction   *c,
                          const LaminaMoistureResult *r)
{
  const LaminaClimate *climate = c->moisture->climate_data;
  double w = ctx->right - ctx->left, y = ctx->top, method_h, plot_h;
  int month = r->condensation && r->max_month > 0 ? r->max_month : MAX (r->critical_month, 1);
  g_autofree char *inside = dup_inside (r);
  g_autofree char *big = NULL, *line1 = NULL, *line2 = NULL, *line3 = NULL, *caption = NULL;
  g_autoptr(GString) warnings = g_string_new (NULL);

  sheet_draw_frame (ctx, c->status == LAMINA_STATUS_DRAFT);
  draw_heading (ctx, c, &y);

  big = g_strdup (lamina_moisture_result_fails (r) ? _("Moisture check: FAILS") : _("Moisture check: passes"));
  sheet_text_line (ctx, SHEET_FONT_BIG, big, ctx->left, y, w, PANGO_ALIGN_LEFT);
  y += 26;
  line1 = g_strdup_printf (_("Climate: %s. Source: %s. Inside: %s."),
                           climate->name ? climate->name : climate->id,
                           climate->source ? climate->source : _("not given"), inside);
  if (r->critical_month > 0)
    line2 = g_strdup_printf (_("Surface (mould, clause 5): fRsi %.3f against fRsi,min %.3f in the critical month, "
                               "%s: %s."), r->f_rsi, r->f_rsi_min, lamina_month_name (r->critical_month),
                             r->surface_passes ? _("passes") : _("FAILS"));
  else
    line2 = g_strdup_printf (_("Surface (mould, clause 5): fRsi %.3f; no month is colder outside than inside."),
                             r->f_rsi);
  if (r->condensation)
    line3 = g_strdup_printf (_("Interstitial (clause 7): condensation from %s; at most %.3f kg/m² at the end of "
                               "%s; %s. Office limit %.2f kg/m²."),
                             lamina_month_name (r->start_month), r->max_accumulation,
                             lamina_month_name (r->max_month),
                             r->dries_out ? _("dries out within the year") : _("does NOT dry out"), r->limit);
  else
    line3 = g_strdup (_("Interstitial (clause 7): no condensation in any month."));
  y += sheet_text (ctx, SHEET_FONT_BODY, line1, ctx->left, y, w, PANGO_ALIGN_LEFT) + 3;
  y += sheet_text (ctx, SHEET_FONT_BODY, line2, ctx->left, y, w, PANGO_ALIGN_LEFT) + 3;
  y += sheet_text (ctx, SHEET_FONT_BODY, line3, ctx->left, y, w, PANGO_ALIGN_LEFT) + GAP;

  for (guint i = 0; i < r->warnings->len; i++)
    {
      const LaminaMoistureWarning *warning = r->warnings->pdata[i];

      if (warning->kind == LAMINA_MOISTURE_WARNING_METHOD)
        continue;   /* said in the method text below */
      g_string_append_printf (warnings, "%s⚠  %s", warnings->len ? "\n" : "", warning->message);
    }
  sheet_text_set (ctx, SHEET_FONT_SMALL, get_moisture_method_text (), w, NULL, &method_h);

  caption = g_strdup_printf (_("Vapour pressure across the section, %s (layers numbered as on the sheet)"),
                             lamina_month_name (month));
  sheet_text_line (ctx, SHEET_FONT_HEADING, caption, ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += 13;
  plot_h = MIN (w * 0.5, ctx->bottom - 24 - method_h - y - 130 - (warnings->len ? 60 : 0));
  if (plot_h > 80)
    {
      lamina_moisture_plot_draw (ctx->cr, c, r, month, FALSE, ctx->left, y, w, plot_h, 8.0);
      y += plot_h + GAP;
    }
  sheet_text_line (ctx, SHEET_FONT_HEADING, _("Moisture accumulated at the end of each month, kg/m²"),
                   ctx->left, y, 0, PANGO_ALIGN_LEFT);
  y += 13;
  lamina_moisture_bars_draw (ctx->cr, r, ctx->left, y, w * 0.6, 90, 8.0);
  y += 90 + GAP;
  if (warnings->len)
    {
      sheet_text_line (ctx, SHEET_FONT_HEADING, _("Warnings"), ctx->left, y, 0, PANGO_ALIGN_LEFT);
      y += 13;
      y += sheet_text (ctx, SHEET_FONT_BODY, warnings->str, ctx->left, y, w, PANGO_ALIGN_LEFT) + GAP;
    }
  cairo_set_source_rgb (ctx->cr, ctx->grey, ctx->grey, ctx->grey);
  sheet_rule (ctx, ctx->bottom - 20 - method_h, 0.4, 0.6);
  sheet_text (ctx, SHEET_FONT_SMALL, get_moisture_method_text (), ctx->left, ctx->bottom - 16 - method_h, w,
              PANGO_ALIGN_LEFT);
  cairo_set_source_rgb (ctx->cr, 0, 0, 0);
  sheet_draw_footer (ctx);
}
