/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-solve-chart.c: U against one layer's thickness, with the target.
 * The window shows it beside "Meet target"; tests render it to PNG.  The
 * curve is the engine's own corrected U (lamina_solve_curve), so what the
 * chart shows is what the solver solved. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-design.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <pango/pangocairo.h>

#include "lamina-sheet-format.h"

#define N_SAMPLES 121

typedef struct
{
  cairo_t     *cr;
  PangoLayout *layout;
  double       unit;
  double       left, top, right, bottom;   /* plot area */
  double       x_max, y_max;
} Chart;

/* 1, 2 or 5 × 10ⁿ, the smallest such step giving at most @n intervals. */
static double
nice_step (double range,
           int    n)
{
  double raw = range / n, p = pow (10, floor (log10 (raw)));

  if (raw <= p)
    return p;
  if (raw <= 2 * p)
    return 2 * p;
  if (raw <= 5 * p)
    return 5 * p;
  return 10 * p;
}

static double
to_x (const Chart *ch,
      double       d)
{
  return ch->left + (ch->right - ch->left) * d / ch->x_max;
}

static double
to_y (const Chart *ch,
      double       u)
{
  return ch->bottom - (ch->bottom - ch->top) * u / ch->y_max;
}

/* Text with its anchor at (x, y): @ax, @ay 0 = left/top, 0.5 = centre,
 * 1 = right/bottom. */
static void
draw_text (Chart      *ch,
           const char *text,
           double      x,
           double      y,
           double      ax,
           double      ay)
{
  int w, h;

  pango_layout_set_text (ch->layout, text, -1);
  pango_layout_get_size (ch->layout, &w, &h);
  cairo_move_to (ch->cr, x - ax * w / PANGO_SCALE, y - ay * h / PANGO_SCALE);
  pango_cairo_show_layout (ch->cr, ch->layout);
}

static void
draw_axes (Chart *ch,
           guint  layer)
{
  cairo_t *cr = ch->cr;
  double sx = nice_step (ch->x_max, 6), sy = nice_step (ch->y_max, 5);
  char buf[LAMINA_FORMAT_SIZE];
  g_autofree char *x_title = g_strdup_printf (_("thickness of layer %u, mm"), layer);

  cairo_set_line_width (cr, ch->unit / 14);
  for (double d = 0; d <= ch->x_max + 1e-9; d += sx)
    {
      cairo_set_source_rgb (cr, 0.85, 0.85, 0.85);
      cairo_move_to (cr, to_x (ch, d), ch->top);
      cairo_line_to (cr, to_x (ch, d), ch->bottom);
      cairo_stroke (cr);
      cairo_set_source_rgb (cr, 0.3, 0.3, 0.3);
      draw_text (ch, lamina_format_thickness (buf, d), to_x (ch, d), ch->bottom + ch->unit * 0.3, 0.5, 0);
    }
  for (double u = 0; u <= ch->y_max + 1e-9; u += sy)
    {
      cairo_set_source_rgb (cr, 0.85, 0.85, 0.85);
      cairo_move_to (cr, ch->left, to_y (ch, u));
      cairo_line_to (cr, ch->right, to_y (ch, u));
      cairo_stroke (cr);
      cairo_set_source_rgb (cr, 0.3, 0.3, 0.3);
      draw_text (ch, lamina_format_fixed (buf, u, sy < 0.1 ? 2 : 1), ch->left - ch->unit * 0.4, to_y (ch, u),
                 1, 0.5);
    }
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, ch->unit / 10);
  cairo_rectangle (cr, ch->left, ch->top, ch->right - ch->left, ch->bottom - ch->top);
  cairo_stroke (cr);
  draw_text (ch, x_title, (ch->left + ch->right) / 2, ch->bottom + ch->unit * 1.6, 0.5, 0);
  draw_text (ch, _("U, W/(m²·K)"), ch->left, ch->top - ch->unit * 0.3, 0, 1);
}

static void
draw_curve (Chart                    *ch,
            const LaminaConstruction *c,
            guint                     layer)
{
  double d[N_SAMPLES], u[N_SAMPLES];
  gboolean started = FALSE;

  if (!lamina_solve_curve (c, layer, 0, ch->x_max, N_SAMPLES, d, u, NULL))
    return;
  cairo_save (ch->cr);
  cairo_rectangle (ch->cr, ch->left, ch->top, ch->right - ch->left, ch->bottom - ch->top);
  cairo_clip (ch->cr);
  for (guint i = 0; i < N_SAMPLES; i++)
    {
      if (isnan (u[i]))
        {
          started = FALSE;
          continue;
        }
      if (started)
        cairo_line_to (ch->cr, to_x (ch, d[i]), to_y (ch, u[i]));
      else
        cairo_move_to (ch->cr, to_x (ch, d[i]), to_y (ch, u[i]));
      started = TRUE;
    }
  cairo_set_source_rgb (ch->cr, 0, 0, 0);
  cairo_set_line_width (ch->cr, ch->unit / 6);
  cairo_stroke (ch->cr);
  cairo_restore (ch->cr);
}

/* A vertical mark from the curve down to the axis, labelled at the top. */
static void
draw_mark (Chart      *ch,
           double      d,
           double      u,
           const char *label,
           double      grey,
           double      label_row)
{
  cairo_t *cr = ch->cr;
  double dash[] = { ch->unit / 3, ch->unit / 4 };

  cairo_set_source_rgb (cr, grey, grey, grey);
  cairo_set_line_width (cr, ch->unit / 10);
  cairo_set_dash (cr, dash, 2, 0);
  cairo_move_to (cr, to_x (ch, d), to_y (ch, u));
  cairo_line_to (cr, to_x (ch, d), ch->bottom);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
  cairo_arc (cr, to_x (ch, d), to_y (ch, u), ch->unit / 3, 0, 2 * G_PI);
  cairo_fill (cr);
  draw_text (ch, label, to_x (ch, d) + ch->unit * 0.4, ch->top + ch->unit * (0.2 + 1.2 * label_row), 0, 0);
}

void
lamina_solve_chart_draw (cairo_t                  *cr,
                         double                    x,
                         double                    y,
                         double                    width,
                         double                    height,
                         double                    unit,
                         const LaminaConstruction *c,
                         const LaminaSolve        *s)
{
  Chart ch = { cr, NULL, unit };
  g_autoptr(PangoFontDescription) font = pango_font_description_from_string ("DejaVu Sans");
  char t[LAMINA_FORMAT_SIZE], d1[LAMINA_FORMAT_SIZE], d2[LAMINA_FORMAT_SIZE], d3[LAMINA_FORMAT_SIZE];
  char u2[LAMINA_U_TEXT_SIZE];
  g_autofree char *target = NULL, *now = NULL, *exact = NULL, *build = NULL;
  double dash[] = { unit / 2, unit / 4 };

  g_return_if_fail (cr != NULL && c != NULL);

  cairo_save (cr);
  ch.layout = pango_cairo_create_layout (cr);
  pango_font_description_set_absolute_size (font, unit * PANGO_SCALE);
  pango_layout_set_font_description (ch.layout, font);
  ch.left = x + unit * 4;
  ch.right = x + width - unit;
  ch.top = y + unit * 1.8;
  ch.bottom = y + height - unit * 3.2;

  if (s == NULL || ch.right <= ch.left || ch.bottom <= ch.top)
    {
      cairo_rectangle (cr, x, y, width, height);
      cairo_set_source_rgb (cr, 0.6, 0.6, 0.6);
      cairo_set_line_width (cr, unit / 10);
      cairo_stroke (cr);
      g_object_unref (ch.layout);
      cairo_restore (cr);
      return;
    }
  ch.x_max = MAX (MAX (s->thickness_snapped, s->thickness_before) * 1.5, 20);
  ch.x_max = ceil (ch.x_max / nice_step (ch.x_max, 6)) * nice_step (ch.x_max, 6);
  ch.y_max = MAX (s->target * 2.5, s->u_before * 1.25);
  ch.y_max = ceil (ch.y_max / nice_step (ch.y_max, 5)) * nice_step (ch.y_max, 5);

  draw_axes (&ch, s->layer);
  draw_curve (&ch, c, s->layer);

  /* The target across the plot. */
  cairo_set_source_rgb (cr, 0.7, 0.1, 0.1);
  cairo_set_line_width (cr, unit / 7);
  cairo_set_dash (cr, dash, 2, 0);
  cairo_move_to (cr, ch.left, to_y (&ch, s->target));
  cairo_line_to (cr, ch.right, to_y (&ch, s->target));
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
  target = g_strdup_printf (_("target U = %s"), lamina_format_fixed (t, s->target, 3));
  draw_text (&ch, target, ch.right - unit * 0.3, to_y (&ch, s->target) - unit * 0.2, 1, 1);

  now = g_strdup_printf (_("now %s mm"), lamina_format_thickness (d1, s->thickness_before));
  exact = g_strdup_printf (_("exact %s mm"), lamina_format_fixed (d2, s->thickness, 1));
  build = g_strdup_printf (_("build %s mm, U = %s"), lamina_format_thickness (d3, s->thickness_snapped),
                           lamina_format_u (u2, s->u_snapped));
  draw_mark (&ch, s->thickness_before, s->u_before, now, 0.55, 0);
  draw_mark (&ch, s->thickness, s->u, exact, 0.1, 1);
  draw_mark (&ch, s->thickness_snapped, s->u_snapped, build, 0.1, 2);

  g_object_unref (ch.layout);
  cairo_restore (cr);
}

gboolean
lamina_solve_chart_write_png (const LaminaConstruction *c,
                              const LaminaSolve        *s,
                              int                       width,
                              int                       height,
                              const char               *path,
                              GError                  **error)
{
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, width, height);
  cairo_t *cr = cairo_create (surface);
  cairo_status_t status;

  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  lamina_solve_chart_draw (cr, 0, 0, width, height, MAX (8.0, height / 28.0), c, s);
  cairo_destroy (cr);
  status = cairo_surface_write_to_png (surface, path);
  cairo_surface_destroy (surface);
  if (status != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, LAMINA_SHEET_ERROR, LAMINA_SHEET_ERROR_IO, "%s: %s", path,
                   cairo_status_to_string (status));
      return FALSE;
    }
  return TRUE;
}
