/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The vapour-pressure plot and the accumulation bars of an EN ISO 13788
 * check (the usual Glaser picture: psat and p against thickness or sd). */
#define G_LOG_DOMAIN "lamina-sheet"

#include "config.h"

#include "lamina-moisture-plot.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <pango/pangocairo.h>

/* Points per layer for the psat curve: temperature is linear across a
 * layer (and so against sd within it), psat is not. */
#define SAMPLES 12

static void
draw_label (cairo_t    *cr,
            const char *text,
            double      x,
            double      y,
            double      size,
            double      align)   /* 0 left, 0.5 centre, 1 right of x */
{
  g_autoptr(PangoLayout) layout = pango_cairo_create_layout (cr);
  PangoFontDescription *font = pango_font_description_from_string ("DejaVu Sans");
  int w, h;

  pango_font_description_set_absolute_size (font, size * PANGO_SCALE);
  pango_layout_set_font_description (layout, font);
  pango_font_description_free (font);
  pango_layout_set_text (layout, text, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  cairo_move_to (cr, x - align * w, y - h / 2.0);
  pango_cairo_show_layout (cr, layout);
}

/* A "nice" step for about @n ticks over @span. */
static double
nice_step (double span,
           int    n)
{
  double raw = span / n, mag = pow (10, floor (log10 (raw))), f = raw / mag;

  return mag * (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10);
}

typedef struct
{
  double x0, y0, w, h;   /* plot area */
  double xmax, ymax;     /* data range */
} Frame;

static double
fx (const Frame *f,
    double       v)
{
  return f->x0 + f->w * v / f->xmax;
}

static double
fy (const Frame *f,
    double       v)
{
  return f->y0 + f->h - f->h * v / f->ymax;
}

static void
draw_axes (cairo_t     *cr,
           const Frame *f,
           gboolean     by_sd,
           double       size)
{
  double step = nice_step (f->ymax, 5);
  char text[32];

  cairo_set_line_width (cr, 0.5);
  cairo_set_source_rgb (cr, 0.8, 0.8, 0.8);
  for (double v = step; v <= f->ymax + 1e-9; v += step)
    {
      cairo_move_to (cr, f->x0, fy (f, v));
      cairo_line_to (cr, f->x0 + f->w, fy (f, v));
    }
  cairo_stroke (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  for (double v = 0; v <= f->ymax + 1e-9; v += step)
    {
      g_snprintf (text, sizeof text, "%.0f", v);
      draw_label (cr, text, f->x0 - 3, fy (f, v), size, 1.0);
    }
  cairo_set_line_width (cr, 0.8);
  cairo_rectangle (cr, f->x0, f->y0, f->w, f->h);
  cairo_stroke (cr);
  draw_label (cr, _("Pa"), f->x0 - 3, f->y0 - size, size, 1.0);
  /* The ticks are the layers' numbers, so the axis names what sets their
   * widths rather than a unit no tick shows. */
  draw_label (cr, by_sd ? _("layers, to scale of their sd (inside → outside)")
                        : _("layers, to scale of their thickness (inside → outside)"),
              f->x0 + f->w / 2, f->y0 + f->h + 2.6 * size, size, 0.5);
}

/* psat across layer i, sampled; position by thickness or sd. */
static void
path_saturation (cairo_t                    *cr,
                 const Frame                *f,
                 const LaminaMoistureResult *r,
                 const LaminaMoistureMonth  *m,
                 const double               *axis)
{
  for (guint i = 0; i < r->n_layers; i++)
    for (int k = 0; k <= SAMPLES; k++)
      {
        double t = (double) k / SAMPLES;
        double pos = axis[i] + t * (axis[i + 1] - axis[i]);
        double theta = m->temperature[i] + t * (m->temperature[i + 1] - m->temperature[i]);
        double p = lamina_saturation_pressure (theta);

        if (i == 0 && k == 0)
          cairo_move_to (cr, fx (f, pos), fy (f, p));
        else
          cairo_line_to (cr, fx (f, pos), fy (f, p));
      }
}

void
lamina_moisture_plot_draw (cairo_t                    *cr,
                           const LaminaConstruction   *c,
                           const LaminaMoistureResult *r,
                           int                         month,
                           gboolean                    by_sd,
                           double                      x,
                           double                      y,
                           double                      width,
                           double                      height,
                           double                      size)
{
  const LaminaMoistureMonth *m;
  const double *axis;
  Frame f;
  double ymax = 0;
  static const double dash[] = { 4.0, 2.5 };

  g_return_if_fail (month >= 1 && month <= LAMINA_MONTHS);
  m = &r->months[month - 1];
  axis = by_sd ? r->sd : r->position;
  for (guint j = 0; j < r->n_points; j++)
    ymax = MAX (ymax, MAX (m->saturation[j], m->pressure[j]));
  f.x0 = x + 4.5 * size;
  f.y0 = y + 1.5 * size;
  f.w = width - 4.5 * size - size;
  f.h = height - 1.5 * size - 4.2 * size;
  f.xmax = axis[r->n_points - 1] > 0 ? axis[r->n_points - 1] : 1;
  f.ymax = nice_step (ymax * 1.1, 5) * ceil (ymax * 1.1 / nice_step (ymax * 1.1, 5));
  if (f.w < 20 || f.h < 20 || f.ymax <= 0)
    return;

  cairo_save (cr);
  draw_axes (cr, &f, by_sd, size);

  /* layer boundaries and numbers (the construction's numbering) */
  cairo_set_line_width (cr, 0.4);
  for (guint i = 0; i < r->n_layers; i++)
    {
      char number[16];

      cairo_set_source_rgb (cr, 0.6, 0.6, 0.6);
      if (i > 0)
        {
          cairo_move_to (cr, fx (&f, axis[i]), f.y0);
          cairo_line_to (cr, fx (&f, axis[i]), f.y0 + f.h);
          cairo_stroke (cr);
        }
      cairo_set_source_rgb (cr, 0.35, 0.35, 0.35);
      g_snprintf (number, sizeof number, "%u", r->layer_index[i] + 1);
      if (fx (&f, axis[i + 1]) - fx (&f, axis[i]) > size)
        draw_label (cr, number, (fx (&f, axis[i]) + fx (&f, axis[i + 1])) / 2, f.y0 + f.h + 0.8 * size,
                    size * 0.9, 0.5);
    }

  /* psat: solid; p: dashed */
  cairo_set_source_rgb (cr, 0.75, 0.1, 0.1);
  cairo_set_line_width (cr, 1.4);
  path_saturation (cr, &f, r, m, axis);
  cairo_stroke (cr);
  cairo_set_source_rgb (cr, 0.05, 0.25, 0.7);
  cairo_set_dash (cr, dash, 2, 0);
  for (guint j = 0; j < r->n_points; j++)
    {
      if (j == 0)
        cairo_move_to (cr, fx (&f, axis[j]), fy (&f, m->pressure[j]));
      else
        cairo_line_to (cr, fx (&f, axis[j]), fy (&f, m->pressure[j]));
    }
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);

  /* planes holding water at the month's end */
  for (guint j = 1; j + 1 < r->n_points; j++)
    if (m->accumulation[j] > 0)
      {
        cairo_arc (cr, fx (&f, axis[j]), fy (&f, m->pressure[j]), size * 0.35, 0, 2 * G_PI);
        cairo_fill (cr);
      }

  /* legend */
  {
    double lx = f.x0 + f.w - 12.0 * size, ly = f.y0 + 0.9 * size;

    cairo_set_line_width (cr, 1.4);
    cairo_set_source_rgb (cr, 0.75, 0.1, 0.1);
    cairo_move_to (cr, lx, ly);
    cairo_line_to (cr, lx + 1.8 * size, ly);
    cairo_stroke (cr);
    cairo_set_source_rgb (cr, 0, 0, 0);
    draw_label (cr, _("saturation psat"), lx + 2.2 * size, ly, size * 0.9, 0);
    ly += 1.3 * size;
    cairo_set_source_rgb (cr, 0.05, 0.25, 0.7);
    cairo_set_dash (cr, dash, 2, 0);
    cairo_move_to (cr, lx, ly);
    cairo_line_to (cr, lx + 1.8 * size, ly);
    cairo_stroke (cr);
    cairo_set_dash (cr, NULL, 0, 0);
    cairo_set_source_rgb (cr, 0, 0, 0);
    draw_label (cr, _("vapour pressure p"), lx + 2.2 * size, ly, size * 0.9, 0);
  }
  cairo_restore (cr);
}

void
lamina_moisture_bars_draw (cairo_t                    *cr,
                           const LaminaMoistureResult *r,
                           double                      x,
                           double                      y,
                           double                      width,
                           double                      height,
                           double                      size)
{
  static const char *initials[LAMINA_MONTHS] = {
    N_("J"), N_("F"), N_("M"), N_("A"), N_("M"), N_("J"), N_("J"), N_("A"), N_("S"), N_("O"), N_("N"), N_("D"),
  };
  Frame f;
  double top = MAX (r->max_accumulation, r->limit) * 1.15, step;
  char text[32];

  f.x0 = x + 4.5 * size;
  f.y0 = y + 1.5 * size;
  f.w = width - 4.5 * size - size;
  f.h = height - 1.5 * size - 2 * size;
  if (f.w < 20 || f.h < 10)
    return;
  step = nice_step (top, 3);
  f.ymax = step * ceil (top / step);
  f.xmax = LAMINA_MONTHS;

  cairo_save (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, 0.8);
  cairo_move_to (cr, f.x0, f.y0);
  cairo_line_to (cr, f.x0, f.y0 + f.h);
  cairo_line_to (cr, f.x0 + f.w, f.y0 + f.h);
  cairo_stroke (cr);
  for (double v = 0; v <= f.ymax + 1e-9; v += step)
    {
      g_snprintf (text, sizeof text, "%.2g", v);
      draw_label (cr, text, f.x0 - 3, fy (&f, v), size, 1.0);
    }
  draw_label (cr, _("kg/m²"), f.x0 - 3, f.y0 - size, size, 1.0);
  for (int mth = 0; mth < LAMINA_MONTHS; mth++)
    {
      double bx = fx (&f, mth + 0.15), bw = f.w / LAMINA_MONTHS * 0.7;

      if (r->accumulation[mth] > 0)
        {
          cairo_set_source_rgb (cr, 0.05, 0.25, 0.7);
          cairo_rectangle (cr, bx, fy (&f, r->accumulation[mth]), bw, f.y0 + f.h - fy (&f, r->accumulation[mth]));
          cairo_fill (cr);
        }
      cairo_set_source_rgb (cr, 0, 0, 0);
      draw_label (cr, _(initials[mth]), bx + bw / 2, f.y0 + f.h + 0.8 * size, size, 0.5);
    }
  /* the office limit */
  cairo_set_source_rgb (cr, 0.75, 0.1, 0.1);
  cairo_set_line_width (cr, 1.0);
  cairo_move_to (cr, f.x0, fy (&f, r->limit));
  cairo_line_to (cr, f.x0 + f.w, fy (&f, r->limit));
  cairo_stroke (cr);
  g_snprintf (text, sizeof text, _("limit %.2g"), r->limit);
  draw_label (cr, text, f.x0 + f.w, fy (&f, r->limit) - 0.7 * size, size * 0.9, 1.0);
  cairo_restore (cr);
}
