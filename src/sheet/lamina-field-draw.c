/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The picture of a 2-D check: colour field, isotherms, outlines, key. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-field-draw.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <pango/pangocairo.h>

/* The palette, cold to warm: night blue, lake, sage, straw, clay. */
static const double palette[][3] = {
  { 0.13, 0.15, 0.38 },
  { 0.16, 0.38, 0.62 },
  { 0.29, 0.62, 0.66 },
  { 0.62, 0.79, 0.62 },
  { 0.95, 0.87, 0.58 },
  { 0.93, 0.62, 0.36 },
  { 0.72, 0.29, 0.22 },
};
/* The largest raster drawn for the field, pixels per side. */
#define MAX_RASTER 2400

void
lamina_field_colour (double  fraction,
                     double *red,
                     double *green,
                     double *blue)
{
  const guint n = G_N_ELEMENTS (palette) - 1;
  double f = CLAMP (isnan (fraction) ? 0.0 : fraction, 0.0, 1.0) * n;
  guint k = MIN ((guint) f, n - 1);
  double t = f - k;

  *red = palette[k][0] + (palette[k + 1][0] - palette[k][0]) * t;
  *green = palette[k][1] + (palette[k + 1][1] - palette[k][1]) * t;
  *blue = palette[k][2] + (palette[k + 1][2] - palette[k][2]) * t;
}

double
lamina_field_isotherm_step (double range)
{
  static const double steps[] = { 0.1, 0.2, 0.25, 0.5, 1, 2, 2.5, 5, 10, 20, 25, 50 };

  for (guint k = 0; k < G_N_ELEMENTS (steps); k++)
    if (range / steps[k] <= 16.0)
      return steps[k];
  return 100.0;
}

typedef struct
{
  cairo_t *cr;
  double   unit;
} Painter;

/* Text with its anchor: @ax, @ay in 0–1 of the text's box. */
static void
text (Painter    *p,
      const char *string,
      double      x,
      double      y,
      double      ax,
      double      ay,
      gboolean    bold)
{
  PangoLayout *layout = pango_cairo_create_layout (p->cr);
  PangoFontDescription *font = pango_font_description_from_string (bold ? "DejaVu Sans Condensed Bold"
                                                                        : "DejaVu Sans Condensed");
  PangoRectangle logical;

  pango_font_description_set_absolute_size (font, p->unit * PANGO_SCALE);
  pango_layout_set_font_description (layout, font);
  pango_layout_set_text (layout, string, -1);
  pango_layout_get_extents (layout, NULL, &logical);
  cairo_move_to (p->cr, x - ax * logical.width / PANGO_SCALE, y - ay * logical.height / PANGO_SCALE);
  pango_cairo_show_layout (p->cr, layout);
  pango_font_description_free (font);
  g_object_unref (layout);
}

typedef struct
{
  double x, y, w, h;        /* the body on the target */
  double mw, mh;            /* the module in metres */
} Frame;

static double
frame_x (const Frame *f,
         double       x)
{
  return f->x + x / f->mw * f->w;
}

static double
frame_y (const Frame *f,
         double       y)
{
  return f->y + f->h - y / f->mh * f->h;
}

/* The colour field as an image, at the target's resolution. */
static void
paint_field (cairo_t                   *cr,
             const LaminaFieldSolution *s,
             const Frame               *f,
             double                     t_low,
             double                     t_high)
{
  double dx = f->w, dy = f->h;
  int rw, rh, stride;
  cairo_surface_t *image;
  guint32 *pixels;
  g_autofree guint *col = NULL, *row = NULL;
  g_autofree double *fx = NULL, *fy = NULL;

  cairo_user_to_device_distance (cr, &dx, &dy);
  rw = CLAMP ((int) ceil (fabs (dx)), 1, MAX_RASTER);
  rh = CLAMP ((int) ceil (fabs (dy)), 1, MAX_RASTER);
  image = cairo_image_surface_create (CAIRO_FORMAT_RGB24, rw, rh);
  stride = cairo_image_surface_get_stride (image) / 4;
  pixels = (guint32 *) cairo_image_surface_get_data (image);
  col = g_new (guint, rw);
  fx = g_new (double, rw);
  row = g_new (guint, rh);
  fy = g_new (double, rh);

  /* The cell and the position in it of every column and row. */
  for (int c = 0, i = 0; c < rw; c++)
    {
      double x = (c + 0.5) / rw * f->mw;
      while (i + 2 < (int) s->nx && s->x[i + 1] < x)
        i++;
      col[c] = (guint) i;
      fx[c] = CLAMP ((x - s->x[i]) / (s->x[i + 1] - s->x[i]), 0.0, 1.0);
    }
  for (int r = 0, j = 0; r < rh; r++)
    {
      double y = (1.0 - (r + 0.5) / rh) * f->mh;
      j = 0;
      /* rows run downwards, y upwards: search from the bottom each time */
      while (j + 2 < (int) s->ny && s->y[j + 1] < y)
        j++;
      row[r] = (guint) j;
      fy[r] = CLAMP ((y - s->y[j]) / (s->y[j + 1] - s->y[j]), 0.0, 1.0);
    }
  cairo_surface_flush (image);
  for (int r = 0; r < rh; r++)
    for (int c = 0; c < rw; c++)
      {
        gsize p = (gsize) row[r] * s->nx + col[c];
        double a = fx[c], b = fy[r], t, red, green, blue;

        t = (1 - b) * ((1 - a) * s->t[p] + a * s->t[p + 1])
            + b * ((1 - a) * s->t[p + s->nx] + a * s->t[p + s->nx + 1]);
        lamina_field_colour ((t - t_low) / (t_high - t_low), &red, &green, &blue);
        pixels[(gsize) r * stride + c] = ((guint32) (red * 255 + 0.5) << 16)
                                         | ((guint32) (green * 255 + 0.5) << 8)
                                         | (guint32) (blue * 255 + 0.5);
      }
  cairo_surface_mark_dirty (image);

  cairo_save (cr);
  cairo_rectangle (cr, f->x, f->y, f->w, f->h);
  cairo_clip (cr);
  cairo_translate (cr, f->x, f->y);
  cairo_scale (cr, f->w / rw, f->h / rh);
  cairo_set_source_surface (cr, image, 0, 0);
  cairo_pattern_set_filter (cairo_get_source (cr), CAIRO_FILTER_BILINEAR);
  cairo_paint (cr);
  cairo_restore (cr);
  cairo_surface_destroy (image);
}

/* Marching squares over the node grid: one segment per crossed cell. */
static void
trace_isotherm (cairo_t                   *cr,
                const LaminaFieldSolution *s,
                const Frame               *f,
                double                     level)
{
  for (guint j = 0; j + 1 < s->ny; j++)
    for (guint i = 0; i + 1 < s->nx; i++)
      {
        const double *t = s->t;
        gsize p = (gsize) j * s->nx + i;
        double c[4] = { t[p], t[p + 1], t[p + s->nx + 1], t[p + s->nx] };
        double cx[4] = { s->x[i], s->x[i + 1], s->x[i + 1], s->x[i] };
        double cy[4] = { s->y[j], s->y[j], s->y[j + 1], s->y[j + 1] };
        double px[4], py[4];
        guint n = 0;

        for (guint e = 0; e < 4; e++)
          {
            double a = c[e], b = c[(e + 1) % 4];
            if ((a < level) != (b < level))
              {
                double w = (level - a) / (b - a);
                px[n] = cx[e] + w * (cx[(e + 1) % 4] - cx[e]);
                py[n] = cy[e] + w * (cy[(e + 1) % 4] - cy[e]);
                n++;
              }
          }
        /* Two crossings: one segment; four (a saddle): pair them by the
         * side of the cell's mean. */
        for (guint k = 0; k + 1 < n; k += 2)
          {
            guint a = k, b = k + 1;
            if (n == 4 && k == 0 && ((c[0] + c[1] + c[2] + c[3]) / 4 < level) == (c[0] < level))
              b = 3;
            if (n == 4 && k == 2 && ((c[0] + c[1] + c[2] + c[3]) / 4 < level) == (c[0] < level))
              a = 1, b = 2;
            cairo_move_to (cr, frame_x (f, px[a]), frame_y (f, py[a]));
            cairo_line_to (cr, frame_x (f, px[b]), frame_y (f, py[b]));
          }
      }
}

static void
draw_isotherms (cairo_t                   *cr,
                const LaminaFieldSolution *s,
                const Frame               *f,
                double                     t_low,
                double                     t_high,
                double                     step,
                double                     unit)
{
  cairo_save (cr);
  cairo_rectangle (cr, f->x, f->y, f->w, f->h);
  cairo_clip (cr);
  cairo_set_line_width (cr, MAX (0.06 * unit, 0.5));
  cairo_set_source_rgba (cr, 0.1, 0.1, 0.12, 0.55);
  for (double level = ceil (t_low / step) * step; level <= t_high + 1e-9; level += step)
    {
      if (level <= t_low + 1e-9 || level >= t_high - 1e-9)
        continue;
      trace_isotherm (cr, s, f, level);
      cairo_stroke (cr);
    }
  cairo_restore (cr);
}

/* Material boundaries, then the module outline. */
static void
draw_outlines (cairo_t                 *cr,
               const LaminaFieldResult *field,
               const Frame             *f,
               double                   unit)
{
  cairo_set_line_width (cr, MAX (0.05 * unit, 0.4));
  cairo_set_source_rgba (cr, 1, 1, 1, 0.7);
  for (guint k = 0; k < field->n_regions; k++)
    {
      const LaminaFieldRegion *r = &field->regions[k];
      double x0 = frame_x (f, r->x0 / 1000.0), x1 = frame_x (f, r->x1 / 1000.0);
      double y0 = frame_y (f, r->y0 / 1000.0), y1 = frame_y (f, r->y1 / 1000.0);
      cairo_rectangle (cr, x0, y1, x1 - x0, y0 - y1);
    }
  cairo_stroke (cr);
  cairo_set_line_width (cr, MAX (0.14 * unit, 1.0));
  cairo_set_source_rgb (cr, 0.1, 0.1, 0.1);
  cairo_rectangle (cr, f->x, f->y, f->w, f->h);
  cairo_stroke (cr);
}

/* The coldest point of the inner surface, with its figures. */
static void
draw_coldest_point (Painter                 *p,
                    const LaminaFieldResult *field,
                    const Frame             *f,
                    gboolean                 narrow)
{
  cairo_t *cr = p->cr;
  double unit = p->unit;
  double cx = frame_x (f, field->min_inner_surface_position / 1000.0), cy = f->y + f->h;
  g_autofree char *coldest = NULL;

  cairo_arc (cr, cx, cy, 0.45 * unit, 0, 2 * G_PI);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_fill_preserve (cr);
  cairo_set_source_rgb (cr, 0.1, 0.1, 0.1);
  cairo_set_line_width (cr, MAX (0.1 * unit, 0.8));
  cairo_stroke (cr);
  /* TRANSLATORS: the coldest inner surface temperature and its temperature factor */
  coldest = g_strdup_printf (_("θsi,min %.1f °C · fRsi %.2f (Rsi 0.25: %.2f)"),
                             field->min_inner_surface_temperature, field->f_rsi, field->f_rsi_mould);
  if (narrow)
    text (p, coldest, f->x, cy + 0.8 * unit, 0.0, 0.0, FALSE);
  else
    text (p, coldest, CLAMP (cx, f->x + 12 * unit, f->x + f->w - 12 * unit), cy + 0.8 * unit, 0.5, 0.0, FALSE);
}

/* Sides, module and the title with both U. */
static void
draw_captions (Painter                  *p,
               const LaminaConstruction *construction,
               const LaminaFieldResult  *field,
               const Frame              *f,
               double                    x,
               double                    y,
               gboolean                  narrow)
{
  double unit = p->unit;
  g_autofree char *title = NULL, *outside = NULL, *inside = NULL, *module = NULL;

  outside = g_strdup_printf (_("outside %.0f °C, Rse %.2f"), field->outside_temperature, field->rse);
  inside = g_strdup_printf (_("inside %.0f °C, Rsi %.2f"), field->inside_temperature, field->rsi);
  text (p, outside, f->x, f->y - 0.3 * unit, 0.0, 1.0, FALSE);
  text (p, inside, f->x, f->y + f->h + 2.3 * unit, 0.0, 0.0, FALSE);
  /* TRANSLATORS: module width in mm, grid cells */
  module = g_strdup_printf (_("module %.0f mm · %u cells"), field->module_width, field->cells);
  if (narrow)
    text (p, module, f->x, f->y + f->h + 3.7 * unit, 0.0, 0.0, FALSE);
  else
    text (p, module, f->x + f->w, f->y + f->h + 2.3 * unit, 1.0, 0.0, FALSE);
  if (narrow)
    title = g_strdup_printf (_("U %.3f (2-D) · %.3f (EN ISO 6946)"), field->u, field->u_6946);
  else
    title = g_strdup_printf (_("%s — 2-D check (EN ISO 10211): U %.3f W/(m²·K); EN ISO 6946: %.3f"),
                             construction->code ? construction->code : construction->id, field->u, field->u_6946);
  text (p, title, x + unit, y + 0.4 * unit, 0.0, 0.0, TRUE);
}

/* The colour key beside the module, with the isotherm levels. */
static void
draw_key (Painter     *p,
          const Frame *f,
          double       key_x,
          double       t_low,
          double       t_high,
          double       step)
{
  cairo_t *cr = p->cr;
  double unit = p->unit, key_y = f->y, key_h = f->h, label_step = step;

  for (int k = 0; k < 100; k++)
    {
      double red, green, blue;
      lamina_field_colour ((k + 0.5) / 100.0, &red, &green, &blue);
      cairo_set_source_rgb (cr, red, green, blue);
      cairo_rectangle (cr, key_x, key_y + key_h * (1.0 - (k + 1) / 100.0), 1.2 * unit, key_h / 100.0 + 0.5);
      cairo_fill (cr);
    }
  cairo_set_source_rgb (cr, 0.1, 0.1, 0.1);
  cairo_set_line_width (cr, MAX (0.05 * unit, 0.5));
  cairo_rectangle (cr, key_x, key_y, 1.2 * unit, key_h);
  cairo_stroke (cr);
  while ((t_high - t_low) / label_step > 8.0)
    label_step *= 2;
  for (double level = ceil (t_low / label_step) * label_step; level <= t_high + 1e-9; level += label_step)
    {
      g_autofree char *label = g_strdup_printf ("%g °C", fabs (level) < 1e-9 ? 0.0 : level);
      double ly = key_y + key_h * (1.0 - (level - t_low) / (t_high - t_low));
      cairo_move_to (cr, key_x + 1.2 * unit, ly);
      cairo_line_to (cr, key_x + 1.6 * unit, ly);
      cairo_stroke (cr);
      text (p, label, key_x + 1.8 * unit, ly, 0.0, 0.5, FALSE);
    }
}

void
lamina_field_draw (cairo_t                  *cr,
                   const LaminaConstruction *construction,
                   const LaminaFieldResult  *field,
                   double                    x,
                   double                    y,
                   double                    width,
                   double                    height,
                   double                    unit)
{
  const LaminaFieldSolution *s = field->field;
  Painter p = { cr, unit };
  Frame f;
  double t_low = field->outside_temperature, t_high = field->inside_temperature;
  /* Narrow (a side panel): the labels under the module stack up. */
  gboolean narrow = width < 45 * unit;
  double key_w = 6 * unit, top = 3.2 * unit, bottom = (narrow ? 5.8 : 4.4) * unit, room_w, room_h, scale, step;

  if (t_high < t_low)
    {
      double swap = t_low;
      t_low = t_high;
      t_high = swap;
    }
  if (t_high - t_low < 1e-9)
    t_high = t_low + 1.0;

  f.mw = s->x[s->nx - 1];
  f.mh = s->y[s->ny - 1];
  room_w = width - key_w - 2 * unit;
  room_h = height - top - bottom;
  scale = MIN (room_w / f.mw, room_h / f.mh);
  f.w = f.mw * scale;
  f.h = f.mh * scale;
  f.x = x + unit + (room_w - f.w) / 2;
  f.y = y + top + (room_h - f.h) / 2;

  cairo_save (cr);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_rectangle (cr, x, y, width, height);
  cairo_fill (cr);
  paint_field (cr, s, &f, t_low, t_high);
  step = lamina_field_isotherm_step (t_high - t_low);
  draw_isotherms (cr, s, &f, t_low, t_high, step, unit);
  draw_outlines (cr, field, &f, unit);
  draw_coldest_point (&p, field, &f, narrow);
  draw_captions (&p, construction, field, &f, x, y, narrow);
  draw_key (&p, &f, x + width - key_w + 0.5 * unit, t_low, t_high, step);
  cairo_restore (cr);
}

gboolean
lamina_field_write_png (const LaminaConstruction *construction,
                        const LaminaFieldResult  *field,
                        int                       width,
                        int                       height,
                        const char               *path,
                        GError                  **error)
{
  double unit = MAX (11.0, width / 85.0);
  cairo_surface_t *surface;
  cairo_t *cr;
  cairo_status_t status;

  /* Height 0: as tall as the module drawn across the width needs. */
  if (height <= 0)
    {
      double body = (width - 8.0 * unit) * field->thickness / field->module_width;
      height = (int) CLAMP (ceil (body + 7.6 * unit), 6 * unit, 2.0 * width);
    }
  surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, width, height);
  cr = cairo_create (surface);
  lamina_field_draw (cr, construction, field, 0, 0, width, height, unit);
  cairo_destroy (cr);
  status = cairo_surface_write_to_png (surface, path);
  cairo_surface_destroy (surface);
  if (status != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, G_FILE_ERROR, G_FILE_ERROR_FAILED, _("%s: cannot write the PNG: %s"), path,
                   cairo_status_to_string (status));
      return FALSE;
    }
  return TRUE;
}
