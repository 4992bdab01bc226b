/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-section-layout.c: the pure geometry of the section drawing. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-section-private.h"

#include <math.h>

LaminaSectionOrientation
lamina_section_orientation_for_element (LaminaElement element)
{
  switch (element)
    {
    case LAMINA_ELEMENT_ROOF:
    case LAMINA_ELEMENT_CEILING:
      return LAMINA_SECTION_UPWARD;
    case LAMINA_ELEMENT_FLOOR:
      return LAMINA_SECTION_DOWNWARD;
    case LAMINA_ELEMENT_WALL:
    case LAMINA_ELEMENT_PARTITION:
    case LAMINA_N_ELEMENTS:
    default:
      return LAMINA_SECTION_ACROSS;
    }
}

LaminaSectionOrientation
lamina_section_orientation_for (const LaminaConstruction *construction)
{
  LaminaSectionOrientation by_element;

  g_return_val_if_fail (construction != NULL, LAMINA_SECTION_ACROSS);

  by_element = lamina_section_orientation_for_element (construction->element);
  if (by_element == LAMINA_SECTION_ACROSS)
    return by_element;
  /* Layers run from the heated side: heat flowing down (a ceiling over a
   * cellar, a floor over an open passage) puts the inside on top, heat
   * flowing up (a roof, a ceiling under a cold loft) puts it below.  A
   * horizontal flow on a horizontal element (a steep roof taken as
   * horizontal, EN ISO 6946 6.8) keeps the element's own way up. */
  switch (construction->heat_flow)
    {
    case LAMINA_HEAT_FLOW_UPWARD:
      return LAMINA_SECTION_UPWARD;
    case LAMINA_HEAT_FLOW_DOWNWARD:
      return LAMINA_SECTION_DOWNWARD;
    case LAMINA_HEAT_FLOW_HORIZONTAL:
    case LAMINA_N_HEAT_FLOWS:
    default:
      return by_element;
    }
}

void
lamina_section_style_init (LaminaSectionStyle *style,
                           double              unit)
{
  g_return_if_fail (style != NULL);

  style->unit = unit > 0 ? unit : 10.0;
  style->scale = 0.0;
  style->dimensions = TRUE;
  style->numbers = TRUE;
  style->sides = TRUE;
  style->temperatures = TRUE;
  style->highlight_layer = -1;
  style->highlight_boundary = -1;
}

void
lamina_section_get_margins (LaminaSectionOrientation  orientation,
                            const LaminaSectionStyle *style,
                            LaminaSectionMargins     *margins)
{
  double u = style->unit;
  double side = 0.6 * u;

  if (orientation == LAMINA_SECTION_ACROSS)
    {
      margins->t_before = style->sides ? LAMINA_SECTION_SIDE_WIDTH * u : side;
      margins->t_after = margins->t_before;
      margins->s_before = style->dimensions ? LAMINA_SECTION_CHAIN_DEPTH * u : side;
      margins->s_after = style->numbers ? LAMINA_SECTION_NUMBER_DEPTH * u : side;
    }
  else
    {
      margins->t_before = style->sides ? LAMINA_SECTION_SIDE_HEIGHT * u : side;
      margins->t_after = margins->t_before;
      margins->s_before = style->dimensions ? LAMINA_SECTION_CHAIN_WIDTH * u : side;
      margins->s_after = style->numbers ? LAMINA_SECTION_NUMBER_DEPTH * u : side;
    }
}

static void
get_axes (LaminaSectionOrientation orientation,
          double                   width,
          double                   height,
          double                  *t_extent,
          double                  *s_extent)
{
  *t_extent = orientation == LAMINA_SECTION_ACROSS ? width : height;
  *s_extent = orientation == LAMINA_SECTION_ACROSS ? height : width;
}

double
lamina_section_layer_drawn_thickness (const LaminaLayer *layer)
{
  return lamina_layer_is_tapered (layer) ? layer->thickness_max : layer->thickness;
}

static double
get_drawn_thickness (const LaminaConstruction *construction)
{
  double total = 0.0;

  for (guint i = 0; i < construction->layers->len; i++)
    total += lamina_section_layer_drawn_thickness (construction->layers->pdata[i]);
  return total;
}

double
lamina_section_fit_scale (const LaminaConstruction *construction,
                          const LaminaSectionStyle *style,
                          double                    width,
                          double                    height)
{
  LaminaSectionOrientation orientation;
  LaminaSectionMargins m;
  double thickness, t_extent, s_extent;

  g_return_val_if_fail (construction != NULL && style != NULL, 0.0);

  orientation = lamina_section_orientation_for (construction);
  lamina_section_get_margins (orientation, style, &m);
  get_axes (orientation, width, height, &t_extent, &s_extent);
  thickness = get_drawn_thickness (construction);
  if (!(thickness > 0))
    return 1.0;
  return MAX (t_extent - m.t_before - m.t_after, 1.0) / thickness;
}

void
lamina_section_layout_init (LaminaSectionLayout *layout)
{
  g_return_if_fail (layout != NULL);
  *layout = (LaminaSectionLayout) { 0 };
}

void
lamina_section_layout_clear (LaminaSectionLayout *layout)
{
  g_return_if_fail (layout != NULL);
  g_free (layout->edges);
  *layout = (LaminaSectionLayout) { 0 };
}

void
lamina_section_layout_compute (LaminaSectionLayout      *layout,
                               const LaminaConstruction *construction,
                               const LaminaSectionStyle *style,
                               double                    x,
                               double                    y,
                               double                    width,
                               double                    height)
{
  LaminaSectionMargins m;
  double t_extent, s_extent, body_t, body_s, t0, s0, pos;
  guint n;

  g_return_if_fail (layout != NULL && construction != NULL && style != NULL);

  n = construction->layers->len;
  if (layout->capacity < n + 1)
    {
      layout->capacity = MAX (n + 1, 16);
      layout->edges = g_renew (double, layout->edges, layout->capacity);
    }
  layout->orientation = lamina_section_orientation_for (construction);
  layout->x = x;
  layout->y = y;
  layout->width = width;
  layout->height = height;
  layout->n_layers = n;
  layout->thickness = get_drawn_thickness (construction);
  layout->scale = style->scale > 0 ? style->scale
                                   : lamina_section_fit_scale (construction, style, width, height);

  lamina_section_get_margins (layout->orientation, style, &m);
  get_axes (layout->orientation, width, height, &t_extent, &s_extent);
  body_t = layout->thickness * layout->scale;
  body_s = MAX (s_extent - m.s_before - m.s_after, 1.0);
  /* Centred along the thickness axis within the space left by the labels. */
  t0 = m.t_before + (t_extent - m.t_before - m.t_after - body_t) / 2;
  s0 = m.s_before;

  if (layout->orientation == LAMINA_SECTION_ACROSS)
    {
      layout->body_x = x + t0;
      layout->body_y = y + s0;
      layout->body_width = body_t;
      layout->body_height = body_s;
    }
  else
    {
      layout->body_x = x + s0;
      layout->body_y = y + t0;
      layout->body_width = body_s;
      layout->body_height = body_t;
    }

  pos = 0.0;
  for (guint i = 0; i <= n; i++)
    {
      layout->edges[i] = lamina_section_layout_t_to_axis (layout, pos);
      if (i < n)
        pos += lamina_section_layer_drawn_thickness (construction->layers->pdata[i]) * layout->scale;
    }
}

double
lamina_section_layout_t_to_axis (const LaminaSectionLayout *layout,
                                 double                     t)
{
  switch (layout->orientation)
    {
    case LAMINA_SECTION_UPWARD:
      return layout->body_y + layout->body_height - t;
    case LAMINA_SECTION_DOWNWARD:
      return layout->body_y + t;
    case LAMINA_SECTION_ACROSS:
    default:
      return layout->body_x + t;
    }
}

void
lamina_section_layout_get_matrix (const LaminaSectionLayout *layout,
                                  cairo_matrix_t            *matrix)
{
  /* Local frame: x = t across the layers from the inner surface,
   * y = s along the strip. */
  switch (layout->orientation)
    {
    case LAMINA_SECTION_UPWARD:
      cairo_matrix_init (matrix, 0, -1, 1, 0, layout->body_x, layout->body_y + layout->body_height);
      break;
    case LAMINA_SECTION_DOWNWARD:
      cairo_matrix_init (matrix, 0, 1, 1, 0, layout->body_x, layout->body_y);
      break;
    case LAMINA_SECTION_ACROSS:
    default:
      cairo_matrix_init (matrix, 1, 0, 0, 1, layout->body_x, layout->body_y);
      break;
    }
}

/* The point's coordinates in the local frame. */
static void
to_local (const LaminaSectionLayout *layout,
          double                     px,
          double                     py,
          double                    *t,
          double                    *s)
{
  cairo_matrix_t matrix;

  lamina_section_layout_get_matrix (layout, &matrix);
  cairo_matrix_invert (&matrix);
  *t = px;
  *s = py;
  cairo_matrix_transform_point (&matrix, t, s);
}

double
lamina_section_layout_s_extent (const LaminaSectionLayout *layout)
{
  return layout->orientation == LAMINA_SECTION_ACROSS ? layout->body_height : layout->body_width;
}

LaminaSectionHit
lamina_section_layout_hit (const LaminaSectionLayout *layout,
                           double                     px,
                           double                     py,
                           double                     tolerance,
                           guint                     *index)
{
  double t, s, best = G_MAXDOUBLE;
  guint best_edge = 0;

  g_return_val_if_fail (layout != NULL, LAMINA_SECTION_HIT_NONE);

  to_local (layout, px, py, &t, &s);
  if (s < -tolerance || s > lamina_section_layout_s_extent (layout) + tolerance || layout->n_layers == 0)
    return LAMINA_SECTION_HIT_NONE;

  for (guint i = 0; i <= layout->n_layers; i++)
    {
      double d = fabs (t - fabs (layout->edges[i] - layout->edges[0]));
      if (d < best)
        {
          best = d;
          best_edge = i;
        }
    }
  if (best <= tolerance)
    {
      if (index)
        *index = best_edge;
      return LAMINA_SECTION_HIT_BOUNDARY;
    }
  for (guint i = 0; i < layout->n_layers; i++)
    {
      double a = fabs (layout->edges[i] - layout->edges[0]);
      double b = fabs (layout->edges[i + 1] - layout->edges[0]);
      if (t >= a && t < b)
        {
          if (index)
            *index = i;
          return LAMINA_SECTION_HIT_LAYER;
        }
    }
  return LAMINA_SECTION_HIT_NONE;
}

double
lamina_section_layout_drag_thickness (const LaminaSectionLayout *layout,
                                      guint                      edge,
                                      double                     px,
                                      double                     py,
                                      double                     minimum)
{
  double t, s, start;

  g_return_val_if_fail (layout != NULL, NAN);
  g_return_val_if_fail (edge >= 1 && edge <= layout->n_layers, NAN);
  g_return_val_if_fail (layout->scale > 0, NAN);

  to_local (layout, px, py, &t, &s);
  start = fabs (layout->edges[edge - 1] - layout->edges[0]);
  return MAX ((t - start) / layout->scale, minimum);
}

void
lamina_section_spread (const double *want,
                       const double *size,
                       guint         n,
                       double        gap,
                       double       *pos,
                       double       *scratch)
{
  double *off = scratch;             /* centre offsets if packed tight */
  double *first = scratch + n;       /* cluster stack: first index … */
  double *start = scratch + 2 * n;   /* … and the first centre */
  guint top = 0;

  if (n == 0)
    return;
  off[0] = 0.0;
  for (guint i = 1; i < n; i++)
    off[i] = off[i - 1] + (size[i - 1] + size[i]) / 2 + gap;

  for (guint i = 0; i < n; i++)
    {
      first[top] = i;
      start[top] = want[i];
      top++;
      while (top >= 2)
        {
          guint fa = (guint) first[top - 2], fb = (guint) first[top - 1];
          guint la = fb - 1, lb = i;
          double end_a = start[top - 2] + off[la] - off[fa];
          double sum = 0.0;

          if (start[top - 1] - end_a >= off[fb] - off[la])
            break;
          for (guint j = fa; j <= lb; j++)
            sum += want[j] - (off[j] - off[fa]);
          top--;
          start[top - 1] = sum / (lb - fa + 1);
        }
    }
  for (guint c = 0; c < top; c++)
    {
      guint f = (guint) first[c], l = c + 1 < top ? (guint) first[c + 1] : n;
      for (guint j = f; j < l; j++)
        pos[j] = start[c] + off[j] - off[f];
    }
}

void
lamina_section_spread_within (const double *want,
                              const double *size,
                              guint         n,
                              double        gap,
                              double        lo,
                              double        hi,
                              double       *pos,
                              double       *scratch)
{
  lamina_section_spread (want, size, n, gap, pos, scratch);
  if (n == 0)
    return;
  /* Pushed in from the ends, then apart again from the first: when the
   * labels fit between @lo and @hi none crosses an end or another. */
  for (guint j = n; j-- > 0;)
    {
      double limit = j + 1 < n ? pos[j + 1] - (size[j] + size[j + 1]) / 2 - gap : hi - size[j] / 2;
      pos[j] = MIN (pos[j], limit);
    }
  for (guint j = 0; j < n; j++)
    {
      double limit = j > 0 ? pos[j - 1] + (size[j - 1] + size[j]) / 2 + gap : lo + size[j] / 2;
      pos[j] = MAX (pos[j], limit);
    }
}

void
lamina_section_layout_chain_labels (const LaminaSectionLayout *layout,
                                    const LaminaSectionStyle  *style,
                                    const double              *extent,
                                    double                    *want,
                                    double                    *pos,
                                    double                    *moved,
                                    double                    *scratch)
{
  double u = style->unit, total = fabs (layout->edges[layout->n_layers] - layout->edges[0]);
  guint n = layout->n_layers;

  for (guint i = 0; i < n; i++)
    want[i] = (fabs (layout->edges[i] - layout->edges[0]) + fabs (layout->edges[i + 1] - layout->edges[0])) / 2;
  /* Kept between the end extension lines; a label too big for its layer
   * goes out beyond the ends of the inner extension lines on a leader. */
  lamina_section_spread_within (want, extent, n, u * LAMINA_SECTION_LABEL_GAP, u * 0.15, total - u * 0.15,
                                pos, scratch);
  for (guint i = 0; i < n; i++)
    {
      double room = fabs (layout->edges[i + 1] - layout->edges[i]);

      moved[i] = fabs (pos[i] - want[i]) > u * 0.1 || room < extent[i] + u * 0.3;
    }
}
