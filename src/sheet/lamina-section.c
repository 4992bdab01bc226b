/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-section.c: the painter of the section drawing. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-section-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>
#include <cairo-svg.h>
#include <pango/pangocairo.h>

#include "lamina-cairo-output.h"
#include "lamina-hatch.h"
#include "lamina-sheet-format.h"

#define OUTLINE 0.14
#define LINE    0.09
#define FINE    0.045
/* A dimension moved off its layer: how far out from the chain, in units. */
#define LEADER_OUT 1.05

struct _LaminaSection
{
  /* owned */
  PangoContext         *context;
  GHashTable           *texts;     /* "face size alignment text" → PangoLayout */
  GString              *key;       /* scratch for looking up texts */
  double                device[5]; /* the CTM's linear part and the font options'
                                      hash the texts were laid out for */
  PangoFontDescription *font;
  PangoFontDescription *font_bold;
  double               *scratch;   /* 8 × capacity doubles */
  guint                 capacity;
  GPtrArray            *members;   /* borrowed member names, per draw */
  LaminaHatchCache     *hatches;
  /* borrowed */
  PangoLayout          *layout;    /* the current text, from texts */
  PangoAlignment        alignment; /* for the next texts */
};

/* Texts laid out once and reused while the fonts and the device transform
 * stay the same: shaping dominates a frame that is mostly numbers. */
#define MAX_TEXTS 512

typedef enum
{
  TEXT_REGULAR,
  TEXT_BOLD,
} TextFace;

LaminaSection *
lamina_section_new (void)
{
  LaminaSection *self = g_new0 (LaminaSection, 1);

  self->context = pango_font_map_create_context (pango_cairo_font_map_get_default ());
  pango_cairo_context_set_resolution (self->context, 72.0);
  self->texts = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_object_unref);
  self->key = g_string_sized_new (64);
  self->alignment = PANGO_ALIGN_LEFT;
  self->font = pango_font_description_from_string ("DejaVu Sans Condensed");
  self->font_bold = pango_font_description_from_string ("DejaVu Sans Condensed Bold");
  self->members = g_ptr_array_new ();
  self->hatches = lamina_hatch_cache_new ();
  return self;
}

void
lamina_section_free (LaminaSection *self)
{
  if (self == NULL)
    return;
  g_hash_table_unref (self->texts);
  g_string_free (self->key, TRUE);
  g_clear_object (&self->context);
  pango_font_description_free (self->font);
  pango_font_description_free (self->font_bold);
  g_ptr_array_unref (self->members);
  lamina_hatch_cache_free (self->hatches);
  g_free (self->scratch);
  g_free (self);
}

static void
reserve_scratch (LaminaSection *self,
                 guint          n)
{
  if (self->capacity >= n)
    return;
  self->capacity = MAX (n, 32);
  self->scratch = g_renew (double, self->scratch, 8 * self->capacity);
}

/* Text */

static void
set_text (LaminaSection *self,
          const char    *text,
          TextFace       face,
          double         size,
          double        *width,
          double        *height)
{
  PangoRectangle logical;

  g_string_printf (self->key, "%d %a %d %s", face, size, self->alignment, text);
  self->layout = g_hash_table_lookup (self->texts, self->key->str);
  if (self->layout == NULL)
    {
      PangoFontDescription *font = face == TEXT_BOLD ? self->font_bold : self->font;

      if (g_hash_table_size (self->texts) >= MAX_TEXTS)
        g_hash_table_remove_all (self->texts);
      self->layout = pango_layout_new (self->context);
      pango_font_description_set_absolute_size (font, size * PANGO_SCALE);
      pango_layout_set_font_description (self->layout, font);
      pango_layout_set_alignment (self->layout, self->alignment);
      pango_layout_set_text (self->layout, text, -1);
      g_hash_table_insert (self->texts, g_strdup (self->key->str), self->layout);
    }
  pango_layout_get_extents (self->layout, NULL, &logical);
  *width = (double) logical.width / PANGO_SCALE;
  *height = (double) logical.height / PANGO_SCALE;
}

/* pango_cairo_update_context () marks the context changed on every call,
 * which would lay every text out again: call it only when the device
 * transform (its linear part: pango ignores the offset) or the font
 * options differ from those the cached texts were laid out for. */
static void
update_context (LaminaSection *self,
                cairo_t       *cr)
{
  cairo_font_options_t *options = cairo_font_options_create ();
  cairo_font_options_t *own = cairo_font_options_create ();
  cairo_matrix_t ctm;
  double device[5];

  cairo_surface_get_font_options (cairo_get_target (cr), options);
  cairo_get_font_options (cr, own);
  cairo_font_options_merge (options, own);
  cairo_get_matrix (cr, &ctm);
  device[0] = ctm.xx, device[1] = ctm.yx, device[2] = ctm.xy, device[3] = ctm.yy;
  device[4] = (double) cairo_font_options_hash (options);
  cairo_font_options_destroy (own);
  cairo_font_options_destroy (options);
  if (g_hash_table_size (self->texts) > 0 && memcmp (device, self->device, sizeof device) == 0)
    return;
  pango_cairo_update_context (cr, self->context);
  g_hash_table_remove_all (self->texts);
  memcpy (self->device, device, sizeof device);
}

/* Draws @text with its anchor (ax, ay: fractions of its box) at (x, y) in
 * user space. */
static void
draw_text (LaminaSection *self,
           cairo_t       *cr,
           const char    *text,
           TextFace       face,
           double         size,
           double         x,
           double         y,
           double         ax,
           double         ay)
{
  double w, h;

  set_text (self, text, face, size, &w, &h);
  cairo_move_to (cr, x - ax * w, y - ay * h);
  pango_cairo_show_layout (cr, self->layout);
}

static void
measure_text (LaminaSection *self,
              const char    *text,
              double         size,
              double        *width,
              double        *height)
{
  set_text (self, text, TEXT_REGULAR, size, width, height);
}

/* Geometry helpers */

static void
map_point (const LaminaSectionLayout *layout,
           double                     t,
           double                     s,
           double                    *x,
           double                    *y)
{
  cairo_matrix_t matrix;

  lamina_section_layout_get_matrix (layout, &matrix);
  *x = t;
  *y = s;
  cairo_matrix_transform_point (&matrix, x, y);
}

static double
edge_t (const LaminaSectionLayout *layout,
        guint                      i)
{
  return fabs (layout->edges[i] - layout->edges[0]);
}

static LaminaCategory
get_part_category (const LaminaPart *part)
{
  return part->material ? part->material->category : LAMINA_CATEGORY_AIR;
}

static LaminaCategory
get_layer_category (const LaminaLayer *layer)
{
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      return layer->material ? layer->material->category : LAMINA_CATEGORY_OTHER;
    case LAMINA_LAYER_AIR:
      return LAMINA_CATEGORY_AIR;
    case LAMINA_LAYER_RESISTANCE:
    case LAMINA_LAYER_BRIDGED:
    case LAMINA_N_LAYER_KINDS:
    default:
      return LAMINA_CATEGORY_OTHER;
    }
}

/* The member phase keeps parts of the same named member in line from one
 * layer to the next. */
static guint
get_member_phase (LaminaSection    *self,
                  const LaminaPart *part,
                  guint             unnamed_index)
{
  if (part->member == NULL)
    return unnamed_index;
  for (guint i = 0; i < self->members->len; i++)
    if (g_strcmp0 (self->members->pdata[i], part->member) == 0)
      return i;
  g_ptr_array_add (self->members, part->member);
  return self->members->len - 1;
}

/* Layers, in the local frame (x = t, y = s) */

static void
draw_air_label (LaminaSection             *self,
                cairo_t                   *cr,
                const LaminaSectionLayout *layout,
                const LaminaLayer         *layer,
                double                     t0,
                double                     t1,
                double                     length,
                double                     unit)
{
  const char *text = layer->air == LAMINA_AIR_UNVENTILATED ? _("air") : _("ventilated air");
  double w, h, size = unit * 0.8;
  cairo_matrix_t matrix;

  if (t1 - t0 < size * 1.3)
    return;
  set_text (self, text, TEXT_REGULAR, size, &w, &h);
  if (w > length * 0.8)
    return;
  /* Written along the layer and always the right way up: undo the local
   * frame's turn (or mirror, for a section with the inside on top), then
   * turn a wall's vertical layer to read from the bottom. */
  cairo_save (cr);
  cairo_translate (cr, (t0 + t1) / 2, length / 2);
  lamina_section_layout_get_matrix (layout, &matrix);
  matrix.x0 = matrix.y0 = 0;
  cairo_matrix_invert (&matrix);
  cairo_transform (cr, &matrix);
  if (layout->orientation == LAMINA_SECTION_ACROSS)
    cairo_rotate (cr, -G_PI / 2);
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_move_to (cr, -w / 2, -h / 2);
  pango_cairo_show_layout (cr, self->layout);
  cairo_restore (cr);
}

static void
draw_members (LaminaSection     *self,
              cairo_t           *cr,
              const LaminaLayer *layer,
              guint              bulk,
              double             t0,
              double             t1,
              double             length,
              double             scale,
              double             unit,
              guint              seed)
{
  guint unnamed = 0;

  for (guint k = 0; k < layer->parts->len; k++)
    {
      const LaminaPart *part = layer->parts->pdata[k];
      double fraction = lamina_layer_get_part_fraction (layer, k);
      double spacing, width, phase, first;
      guint n_phase;

      if (k == bulk || !(fraction > 0))
        continue;
      if (part->spacing > 0 && part->width > 0)
        {
          spacing = part->spacing * scale;
          width = part->width * scale;
        }
      else
        {
          /* Fraction only: a representative 600 mm spacing (common practice
           * for studs and rafters), closer if the strip is short. */
          spacing = MIN (600.0 * scale, length / 2.5);
          width = fraction * spacing;
        }
      /* A thin steel web would vanish at drawing scale. */
      width = MAX (width, unit * 0.3);
      if (spacing < width + unit * 0.5)
        spacing = width + unit * 0.5;
      n_phase = get_member_phase (self, part, unnamed++);
      phase = n_phase * spacing * 0.37;
      first = fmod (length / 2 + phase - width / 2, spacing);
      if (first > 0)
        first -= spacing;
      /* A member cut by either end of the strip shows only its part inside. */
      cairo_save (cr);
      cairo_rectangle (cr, t0 - unit, 0, t1 - t0 + 2 * unit, length);
      cairo_clip (cr);
      for (double s = first; s < length; s += spacing)
        {
          cairo_rectangle (cr, t0, s, t1 - t0, width);
          cairo_set_source_rgb (cr, 1, 1, 1);
          cairo_fill (cr);
          lamina_hatch_fill (cr, self->hatches, get_part_category (part), LAMINA_HATCH_MEMBER,
                             t0, s, t1 - t0, width, unit, seed + k);
          cairo_set_source_rgb (cr, 0, 0, 0);
          cairo_set_line_width (cr, unit * LINE);
          cairo_rectangle (cr, t0, s, t1 - t0, width);
          cairo_stroke (cr);
        }
      cairo_restore (cr);
    }
}

/* The part with the largest fraction of a bridged layer fills the layer;
 * the others are the framing members drawn over it.  −1 for a layer of
 * one material. */
static int
get_bulk_part (const LaminaLayer *layer)
{
  guint bulk = 0;
  double most = -1;

  if (layer->kind != LAMINA_LAYER_BRIDGED || layer->parts == NULL || layer->parts->len == 0)
    return -1;
  for (guint k = 0; k < layer->parts->len; k++)
    {
      double f = lamina_layer_get_part_fraction (layer, k);
      if (f > most)
        {
          most = f;
          bulk = k;
        }
    }
  return (int) bulk;
}

/* What fills the whole layer. */
static LaminaCategory
get_fill_category (const LaminaLayer *layer)
{
  int bulk = get_bulk_part (layer);

  return bulk >= 0 ? get_part_category (layer->parts->pdata[bulk]) : get_layer_category (layer);
}

static void
draw_layer (LaminaSection     *self,
            cairo_t           *cr,
            const LaminaLayer *layer,
            guint              index,
            double             t0,
            double             t1,
            double             length,
            double             scale,
            double             unit)
{
  int bulk = get_bulk_part (layer);

  lamina_hatch_fill (cr, self->hatches, get_fill_category (layer), LAMINA_HATCH_LAYER,
                     t0, 0, t1 - t0, length, unit, index * 7);
  if (bulk >= 0)
    draw_members (self, cr, layer, (guint) bulk, t0, t1, length, scale, unit, index * 7);
}

/* The white ground of the body, without the pixels that the layers' own
 * fills will cover with opaque tiles anyway: on a raster target that is
 * nearly all of them, and painting them twice took as long as the tiles.
 * The holes are on whole device pixels, so every pixel outside them is
 * covered exactly as by the plain rectangle. */
static void
fill_ground (LaminaSection             *self,
             cairo_t                   *cr,
             const LaminaSectionLayout *layout,
             const LaminaConstruction  *construction,
             double                     total,
             double                     length,
             double                     unit,
             gboolean                   tapered)
{
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_rectangle (cr, 0, 0, total, length);
  /* A wedge's layers are drawn in frames of their own: keep it simple. */
  for (guint i = 0; !tapered && i < layout->n_layers; i++)
    {
      double t0 = edge_t (layout, i), t1 = edge_t (layout, i + 1);
      double x0, y0, x1, y1;

      if (!lamina_hatch_fill_get_covered (cr, self->hatches, get_fill_category (construction->layers->pdata[i]),
                                          LAMINA_HATCH_LAYER, t0, 0, t1 - t0, length, unit,
                                          &x0, &y0, &x1, &y1))
        continue;
      cairo_device_to_user (cr, &x0, &y0);
      cairo_device_to_user (cr, &x1, &y1);
      cairo_rectangle (cr, MIN (x0, x1), MIN (y0, y1), fabs (x1 - x0), fabs (y1 - y0));
    }
  /* Where two holes overlap the ground comes back; the later tile covers
   * it again. */
  cairo_set_fill_rule (cr, CAIRO_FILL_RULE_EVEN_ODD);
  cairo_fill (cr);
  cairo_set_fill_rule (cr, CAIRO_FILL_RULE_WINDING);
}

/* A tapered layer (Annex E) is drawn as a wedge: at its full thickness at
 * s = 0 (beside the dimension chain), at its thin end at s = length.  The
 * layers outside it follow its slope, a shear of the local frame. */
static int
find_tapered (const LaminaConstruction *construction)
{
  for (guint i = 0; i < construction->layers->len; i++)
    if (lamina_layer_is_tapered (construction->layers->pdata[i]))
      return (int) i;
  return -1;
}

static double
get_taper_drop (const LaminaSectionLayout *layout,
                const LaminaConstruction  *construction,
                int                        tapered)
{
  const LaminaLayer *layer;

  if (tapered < 0)
    return 0.0;
  layer = construction->layers->pdata[tapered];
  return (layer->thickness_max - layer->thickness) * layout->scale;
}

/* Enters the frame of layer or edge @i: sheared beyond the wedge, clipped
 * to the wedge for the tapered layer itself (@clip). */
static void
push_taper_frame (cairo_t                   *cr,
                  const LaminaSectionLayout *layout,
                  int                        tapered,
                  double                     drop,
                  guint                      i,
                  gboolean                   beyond,
                  double                     length)
{
  cairo_save (cr);
  if (tapered < 0)
    return;
  if (beyond && (int) i > tapered)
    {
      cairo_matrix_t shear;

      cairo_matrix_init (&shear, 1, 0, -drop / length, 1, 0, 0);
      cairo_transform (cr, &shear);
    }
  else if (!beyond && (int) i == tapered)
    {
      double t0 = edge_t (layout, i), t1 = edge_t (layout, i + 1);

      cairo_move_to (cr, t0, 0);
      cairo_line_to (cr, t1, 0);
      cairo_line_to (cr, t1 - drop, length);
      cairo_line_to (cr, t0, length);
      cairo_close_path (cr);
      cairo_clip (cr);
    }
}

static void
draw_body (LaminaSection             *self,
           cairo_t                   *cr,
           const LaminaSectionLayout *layout,
           const LaminaConstruction  *construction,
           const LaminaResult        *result,
           const LaminaSectionStyle  *style)
{
  double length = lamina_section_layout_s_extent (layout);
  double total = edge_t (layout, layout->n_layers);
  double u = style->unit;
  int tapered = find_tapered (construction);
  double drop = get_taper_drop (layout, construction, tapered);

  fill_ground (self, cr, layout, construction, total, length, u, tapered >= 0);

  g_ptr_array_set_size (self->members, 0);
  for (guint i = 0; i < layout->n_layers; i++)
    {
      const LaminaLayer *layer = construction->layers->pdata[i];
      double t0 = edge_t (layout, i), t1 = edge_t (layout, i + 1);

      push_taper_frame (cr, layout, tapered, drop, i, TRUE, length);
      push_taper_frame (cr, layout, tapered, drop, i, FALSE, length);
      draw_layer (self, cr, layer, i, t0, t1, length, layout->scale, u);
      if (result && i < result->n_layers && result->layers[i].disregarded)
        {
          cairo_set_source_rgba (cr, 1, 1, 1, 0.6);
          cairo_rectangle (cr, t0, 0, t1 - t0, length);
          cairo_fill (cr);
        }
      /* Over the veil of a disregarded layer: a label must print dark. */
      if (layer->kind == LAMINA_LAYER_AIR)
        draw_air_label (self, cr, layout, layer, t0, t1, length, u);
      if ((int) i == style->highlight_layer)
        {
          cairo_set_source_rgba (cr, 0.16, 0.42, 0.85, 0.16);
          cairo_rectangle (cr, t0, 0, t1 - t0, length);
          cairo_fill (cr);
        }
      cairo_restore (cr);
      cairo_restore (cr);
    }

  /* Faces: heavy at the surfaces, medium between layers; thin ends where
   * the strip is cut.  Beyond a wedge the faces slope with it. */
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  cairo_set_line_width (cr, u * LINE);
  for (guint i = 1; i < layout->n_layers; i++)
    {
      double shift = tapered >= 0 && (int) i > tapered ? drop : 0.0;

      cairo_move_to (cr, edge_t (layout, i), 0);
      cairo_line_to (cr, edge_t (layout, i) - shift, length);
    }
  cairo_stroke (cr);
  cairo_set_line_width (cr, u * FINE);
  cairo_move_to (cr, 0, 0);
  cairo_line_to (cr, total, 0);
  cairo_move_to (cr, 0, length);
  cairo_line_to (cr, total - drop, length);
  cairo_stroke (cr);
  cairo_set_line_width (cr, u * OUTLINE);
  cairo_move_to (cr, 0, 0);
  cairo_line_to (cr, 0, length);
  cairo_move_to (cr, total, 0);
  cairo_line_to (cr, total - drop, length);
  cairo_stroke (cr);

  if (style->highlight_boundary >= 0 && (guint) style->highlight_boundary <= layout->n_layers)
    {
      double t = edge_t (layout, style->highlight_boundary);
      cairo_set_source_rgb (cr, 0.12, 0.38, 0.85);
      cairo_set_line_width (cr, u * 0.25);
      cairo_move_to (cr, t, 0);
      cairo_line_to (cr, t, length);
      cairo_stroke (cr);
    }
}

/* Where the temperature @celsius sits along the strip. */
static double
temperature_s (const LaminaResult *result,
               double              celsius,
               double              length)
{
  double hi = MAX (result->inside_temperature, result->outside_temperature);
  double lo = MIN (result->inside_temperature, result->outside_temperature);
  double span = hi - lo > 1e-9 ? hi - lo : 1.0;

  return length * (0.15 + 0.7 * (hi - celsius) / span);
}

static void
draw_profile (cairo_t                   *cr,
              const LaminaSectionLayout *layout,
              const LaminaResult        *result,
              const LaminaSectionStyle  *style)
{
  double length = lamina_section_layout_s_extent (layout);
  double u = style->unit;

  cairo_new_path (cr);
  cairo_move_to (cr, 0, temperature_s (result, result->surface_temperature_inner, length));
  for (guint i = 0; i < layout->n_layers && i < result->n_layers; i++)
    cairo_line_to (cr, edge_t (layout, i + 1),
                   temperature_s (result, result->layers[i].temperature_outer, length));
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
  /* A white halo keeps the line legible over any hatch. */
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_set_line_width (cr, u * 0.42);
  cairo_stroke_preserve (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, u * 0.16);
  cairo_stroke (cr);
}

/* Annotations, in user space */

/* Anchor of a label placed outward along local direction (dt, ds). */
static void
get_anchor (const LaminaSectionLayout *layout,
            double                     dt,
            double                     ds,
            double                    *ax,
            double                    *ay)
{
  cairo_matrix_t matrix;

  lamina_section_layout_get_matrix (layout, &matrix);
  cairo_matrix_transform_distance (&matrix, &dt, &ds);
  *ax = dt > 1e-9 ? 0.0 : dt < -1e-9 ? 1.0 : 0.5;
  *ay = ds > 1e-9 ? 0.0 : ds < -1e-9 ? 1.0 : 0.5;
}

static void
draw_label_at (LaminaSection             *self,
               cairo_t                   *cr,
               const LaminaSectionLayout *layout,
               const char                *text,
               TextFace                   face,
               double                     size,
               double                     t,
               double                     s,
               double                     dt,
               double                     ds)
{
  double x, y, ax, ay;

  map_point (layout, t, s, &x, &y);
  get_anchor (layout, dt, ds, &ax, &ay);
  draw_text (self, cr, text, face, size, x, y, ax, ay);
}

/* Wanted centres along t, label extents along t, spread positions. */
static void
spread_labels (LaminaSection             *self,
               const LaminaSectionLayout *layout,
               guint                      n,
               double                     gap)
{
  double *want = self->scratch, *size = want + self->capacity, *pos = size + self->capacity;

  lamina_section_spread (want, size, n, gap, pos, pos + self->capacity);
}

void
lamina_section_measure_chain_labels (LaminaSection             *self,
                                     const LaminaSectionLayout *layout,
                                     const LaminaConstruction  *construction,
                                     const LaminaSectionStyle  *style,
                                     double                    *extent)
{
  gboolean across = layout->orientation == LAMINA_SECTION_ACROSS;
  char text[LAMINA_FORMAT_SIZE];

  for (guint i = 0; i < layout->n_layers; i++)
    {
      double w, h;

      lamina_format_layer_thickness (text, construction->layers->pdata[i]);
      measure_text (self, text, style->unit * 0.85, &w, &h);
      /* Across the chain a label takes its width; beside it (a floor or
       * roof) its height, less the line gap below the digits. */
      extent[i] = across ? w : h * 0.8;
    }
}

static void
draw_chain (LaminaSection             *self,
            cairo_t                   *cr,
            const LaminaSectionLayout *layout,
            const LaminaConstruction  *construction,
            const LaminaSectionStyle  *style)
{
  double u = style->unit, size = u * 0.85;
  double chain = -1.6 * u, outer = layout->orientation == LAMINA_SECTION_ACROSS ? -4.2 * u : -5.6 * u;
  double *want = self->scratch, *extent = want + self->capacity, *pos = extent + self->capacity;
  /* The spread's scratch takes 3 × capacity after pos; the flags follow. */
  double *moved = pos + 4 * self->capacity;
  guint n = layout->n_layers;
  char text[LAMINA_FORMAT_SIZE];
  cairo_matrix_t matrix;

  lamina_section_measure_chain_labels (self, layout, construction, style, extent);
  lamina_section_layout_chain_labels (layout, style, extent, want, pos, moved, pos + self->capacity);

  /* Lines in the local frame. */
  cairo_save (cr);
  lamina_section_layout_get_matrix (layout, &matrix);
  cairo_transform (cr, &matrix);
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, u * FINE);
  for (guint i = 0; i <= n; i++)
    {
      double t = edge_t (layout, i);
      gboolean end = i == 0 || i == n;
      cairo_move_to (cr, t, -0.35 * u);
      cairo_line_to (cr, t, (end ? outer : chain) - 0.45 * u);
    }
  cairo_move_to (cr, -0.5 * u, chain);
  cairo_line_to (cr, edge_t (layout, n) + 0.5 * u, chain);
  cairo_move_to (cr, -0.5 * u, outer);
  cairo_line_to (cr, edge_t (layout, n) + 0.5 * u, outer);
  cairo_stroke (cr);
  cairo_set_line_width (cr, u * LINE * 1.6);
  for (guint i = 0; i <= n; i++)
    {
      double t = edge_t (layout, i);
      cairo_move_to (cr, t - 0.3 * u, chain + 0.3 * u);
      cairo_line_to (cr, t + 0.3 * u, chain - 0.3 * u);
      if (i == 0 || i == n)
        {
          cairo_move_to (cr, t - 0.3 * u, outer + 0.3 * u);
          cairo_line_to (cr, t + 0.3 * u, outer - 0.3 * u);
        }
    }
  cairo_stroke (cr);
  cairo_set_line_width (cr, u * FINE);
  for (guint i = 0; i < n; i++)
    if (moved[i])
      {
        cairo_move_to (cr, want[i], chain);
        cairo_line_to (cr, want[i], chain - 0.5 * u);
        cairo_line_to (cr, pos[i], chain - LEADER_OUT * u + 0.1 * u);
      }
  cairo_stroke (cr);
  cairo_restore (cr);

  for (guint i = 0; i < n; i++)
    {
      lamina_format_layer_thickness (text, construction->layers->pdata[i]);
      draw_label_at (self, cr, layout, text, TEXT_REGULAR, size,
                     pos[i], chain - (moved[i] ? LEADER_OUT : 0.2) * u, 0, -1);
    }
  lamina_format_thickness (text, layout->thickness);
  draw_label_at (self, cr, layout, text, TEXT_BOLD, size,
                 edge_t (layout, n) / 2, outer - 0.2 * u, 0, -1);
}

static void
draw_numbers (LaminaSection             *self,
              cairo_t                   *cr,
              const LaminaSectionLayout *layout,
              const LaminaSectionStyle  *style)
{
  double u = style->unit, r = 0.7 * u, length = lamina_section_layout_s_extent (layout);
  double *want = self->scratch, *extent = want + self->capacity, *pos = extent + self->capacity;
  double ring = length + 2.1 * u, dot = length - MIN (0.8 * u, length * 0.1);
  guint n = layout->n_layers;
  cairo_matrix_t matrix;

  for (guint i = 0; i < n; i++)
    {
      want[i] = (edge_t (layout, i) + edge_t (layout, i + 1)) / 2;
      extent[i] = 2 * r;
    }
  spread_labels (self, layout, n, u * 0.2);

  cairo_save (cr);
  lamina_section_layout_get_matrix (layout, &matrix);
  cairo_transform (cr, &matrix);
  cairo_set_line_width (cr, u * FINE);
  for (guint i = 0; i < n; i++)
    {
      cairo_new_sub_path (cr);
      cairo_arc (cr, want[i], dot, u * 0.12, 0, 2 * G_PI);
      cairo_fill (cr);
      cairo_move_to (cr, want[i], dot);
      cairo_line_to (cr, want[i], length + 0.5 * u);
      cairo_line_to (cr, pos[i], ring - r);
      cairo_stroke (cr);
      cairo_new_sub_path (cr);
      cairo_arc (cr, pos[i], ring, r, 0, 2 * G_PI);
      cairo_set_source_rgb (cr, 1, 1, 1);
      cairo_fill_preserve (cr);
      cairo_set_source_rgb (cr, 0, 0, 0);
      cairo_stroke (cr);
    }
  cairo_restore (cr);

  for (guint i = 0; i < n; i++)
    {
      char text[16];
      double x, y;

      g_snprintf (text, sizeof text, "%u", i + 1);
      map_point (layout, pos[i], ring, &x, &y);
      draw_text (self, cr, text, TEXT_BOLD, u * 0.8, x, y, 0.5, 0.5);
    }
}

static void
draw_sides (LaminaSection             *self,
            cairo_t                   *cr,
            const LaminaSectionLayout *layout,
            const LaminaConstruction  *construction,
            const LaminaResult        *result,
            const LaminaSectionStyle  *style)
{
  LaminaSectionMargins m;
  double u = style->unit, length = lamina_section_layout_s_extent (layout);
  double total = edge_t (layout, layout->n_layers);
  const char *sep = layout->orientation == LAMINA_SECTION_ACROSS ? "\n" : "  ";
  const char *outer_name = construction->outer_side == LAMINA_OUTER_SIDE_INDOOR
                           ? _("adjacent space") : _("outside");
  char temp[LAMINA_FORMAT_SIZE];
  g_autofree char *inside = NULL;
  g_autofree char *outside = NULL;
  double inside_t = result ? result->inside_temperature : construction->inside_temperature;
  double outside_t = result ? result->outside_temperature : construction->outside_temperature;

  lamina_section_get_margins (layout->orientation, style, &m);
  inside = g_strconcat (_("inside"), sep, lamina_format_temperature (temp, inside_t), NULL);
  outside = g_strconcat (outer_name, sep, lamina_format_temperature (temp, outside_t), NULL);
  /* Beside a wall the label column is narrow: a two-word name such as
   * "adjacent space" goes on two lines rather than past the edge. */
  if (layout->orientation == LAMINA_SECTION_ACROSS)
    {
      char *space = strchr (outside, ' ');
      char *newline = strchr (outside, '\n');

      if (space != NULL && newline != NULL && space < newline)
        *space = '\n';
    }

  self->alignment = PANGO_ALIGN_CENTER;
  draw_label_at (self, cr, layout, inside, TEXT_BOLD, u, -m.t_before / 2, length / 2, 0, 0);
  draw_label_at (self, cr, layout, outside, TEXT_BOLD, u, total + m.t_after / 2, length / 2, 0, 0);
  self->alignment = PANGO_ALIGN_LEFT;

  if (result && style->temperatures)
    {
      double si = temperature_s (result, result->surface_temperature_inner, length);
      double se = temperature_s (result, result->surface_temperature_outer, length);

      draw_label_at (self, cr, layout, lamina_format_temperature (temp, result->surface_temperature_inner),
                     TEXT_REGULAR, u * 0.8, -0.4 * u, si, -1, 0);
      draw_label_at (self, cr, layout, lamina_format_temperature (temp, result->surface_temperature_outer),
                     TEXT_REGULAR, u * 0.8, total + 0.4 * u, se, 1, 0);
    }
}

void
lamina_section_draw (LaminaSection             *self,
                     cairo_t                   *cr,
                     const LaminaSectionLayout *layout,
                     const LaminaConstruction  *construction,
                     const LaminaResult        *result,
                     const LaminaSectionStyle  *style)
{
  cairo_matrix_t matrix;

  g_return_if_fail (self != NULL && cr != NULL && layout != NULL);
  g_return_if_fail (construction != NULL && style != NULL);
  g_return_if_fail (layout->n_layers == construction->layers->len);

  if (layout->n_layers == 0)
    return;
  reserve_scratch (self, layout->n_layers + 1);
  update_context (self, cr);

  cairo_save (cr);
  lamina_section_layout_get_matrix (layout, &matrix);
  cairo_transform (cr, &matrix);
  draw_body (self, cr, layout, construction, result, style);
  if (result && style->temperatures && result->n_layers == layout->n_layers)
    draw_profile (cr, layout, result, style);
  cairo_restore (cr);

  cairo_save (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  if (style->dimensions)
    draw_chain (self, cr, layout, construction, style);
  if (style->numbers)
    draw_numbers (self, cr, layout, style);
  if (style->sides)
    draw_sides (self, cr, layout, construction, result, style);
  cairo_restore (cr);
}

static void
render_whole (LaminaSection            *painter,
              cairo_t                  *cr,
              const LaminaConstruction *construction,
              const LaminaResult       *result,
              int                       width,
              int                       height)
{
  LaminaSectionLayout layout;
  LaminaSectionStyle style;

  lamina_section_style_init (&style, CLAMP (MIN (width, height) / 38.0, 9.0, 20.0));
  lamina_section_layout_init (&layout);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  lamina_section_layout_compute (&layout, construction, &style, 0, 0, width, height);
  lamina_section_draw (painter, cr, &layout, construction, result, &style);
  lamina_section_layout_clear (&layout);
}

/* One writer for both formats: an image surface streamed as PNG, or an
 * SVG surface, whose write errors show only once it is finished; both
 * through the safe writer ("-" = standard output). */
static gboolean
write_file (const LaminaConstruction *construction,
            const LaminaResult       *result,
            int                       width,
            int                       height,
            const char               *path,
            gboolean                  overwrite,
            gboolean                  svg,
            GError                  **error)
{
  /* The painter outlives the surface, so that nothing it cached for the
   * drawing is destroyed before the surface is finished.  (Hatch tiles,
   * whose early destruction leaked in cairo's SVG output, are no longer
   * used on SVG targets at all: see fill_from_tile.) */
  g_autoptr(LaminaSection) painter = lamina_section_new ();
  LaminaFileWriter *writer;
  cairo_surface_t *surface;
  cairo_status_t status;
  cairo_t *cr;

  g_return_val_if_fail (construction != NULL && path != NULL, FALSE);
  g_return_val_if_fail (width > 0 && height > 0, FALSE);

  writer = lamina_cairo_output_open (path, overwrite, error);
  if (writer == NULL)
    return FALSE;
  if (svg)
    {
      surface = cairo_svg_surface_create_for_stream (lamina_cairo_output_write_cb, writer, width, height);
      /* Pixel units: a drawing program takes the size the PNG has. */
      cairo_svg_surface_set_document_unit (surface, CAIRO_SVG_UNIT_PX);
    }
  else
    surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, width, height);
  cr = cairo_create (surface);
  render_whole (painter, cr, construction, result, width, height);
  cairo_destroy (cr);
  if (svg)
    {
      cairo_surface_finish (surface);
      status = cairo_surface_status (surface);
    }
  else
    status = cairo_surface_write_to_png_stream (surface, lamina_cairo_output_write_cb, writer);
  cairo_surface_destroy (surface);
  return lamina_cairo_output_close (writer, TRUE, status, error);
}

gboolean
lamina_section_write_png (const LaminaConstruction *construction,
                          const LaminaResult       *result,
                          int                       width,
                          int                       height,
                          const char               *path,
                          gboolean                  overwrite,
                          GError                  **error)
{
  return write_file (construction, result, width, height, path, overwrite, FALSE, error);
}

gboolean
lamina_section_write_svg (const LaminaConstruction *construction,
                          const LaminaResult       *result,
                          int                       width,
                          int                       height,
                          const char               *path,
                          gboolean                  overwrite,
                          GError                  **error)
{
  return write_file (construction, result, width, height, path, overwrite, TRUE, error);
}
