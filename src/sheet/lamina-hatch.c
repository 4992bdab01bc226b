/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-hatch.c: drafting patterns per material category.
 *
 * The patterns follow general section-drawing practice (common practice,
 * no single standard): insulation as a soft batt wave from face to face,
 * masonry as 45° lines, stone as a 45° cross-hatch, concrete as stipple
 * with aggregate triangles, plaster and render as a fine stipple, timber
 * along the grain as wavy grain lines and a member cut across as a cross,
 * boards as dense fine lines along the layer, membranes as a heavy dashed
 * line, metal solid black, glass a light tone with glints, air blank. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-hatch.h"

#include <math.h>

/* Line weights as fractions of the unit (the text size). */
#define FINE   0.045
#define MEDIUM 0.075
#define HEAVY  0.32

typedef struct
{
  double x0, y0, x1, y1; /* the visible part of the rectangle */
} Box;

static gboolean
get_visible_box (cairo_t *cr,
                 double   x,
                 double   y,
                 double   width,
                 double   height,
                 Box     *box)
{
  double cx0, cy0, cx1, cy1;

  cairo_clip_extents (cr, &cx0, &cy0, &cx1, &cy1);
  box->x0 = MAX (x, cx0);
  box->y0 = MAX (y, cy0);
  box->x1 = MIN (x + width, cx1);
  box->y1 = MIN (y + height, cy1);
  return box->x1 > box->x0 && box->y1 > box->y0;
}

/* A small deterministic generator (a 32-bit LCG, Numerical Recipes'
 * constants) so that a drawing is the same on every run. */
static double
next_random (guint32 *state)
{
  *state = *state * 1664525u + 1013904223u;
  return (*state >> 8) / 16777216.0;
}

static void
stroke_diagonals (cairo_t   *cr,
                  const Box *box,
                  double     pitch,
                  double     direction)
{
  /* Lines x ∓ y = c, pitch measured square to the lines. */
  double step = pitch * G_SQRT2;
  double h = box->y1 - box->y0;
  double c0 = direction > 0 ? box->x0 - h : box->x0;
  double c1 = direction > 0 ? box->x1 : box->x1 + h;

  c0 = floor (c0 / step) * step;
  for (double c = c0; c <= c1; c += step)
    {
      cairo_move_to (cr, c, box->y0);
      cairo_line_to (cr, c + direction * h, box->y1);
    }
  cairo_stroke (cr);
}

static void
fill_stipple (cairo_t   *cr,
              const Box *box,
              double     unit,
              double     density,
              double     dot,
              guint      seed)
{
  /* Cells anchored to the page so that the pattern does not swim when a
   * neighbouring layer changes. */
  double cell = unit * 0.5;
  int i0 = (int) floor (box->x0 / cell), i1 = (int) ceil (box->x1 / cell);
  int j0 = (int) floor (box->y0 / cell), j1 = (int) ceil (box->y1 / cell);

  for (int j = j0; j < j1; j++)
    for (int i = i0; i < i1; i++)
      {
        guint32 state = ((guint32) i * 73856093u) ^ ((guint32) j * 19349663u) ^ (seed * 83492791u);
        double px, py;

        next_random (&state);
        if (next_random (&state) > density)
          continue;
        px = (i + next_random (&state)) * cell;
        py = (j + next_random (&state)) * cell;
        if (px < box->x0 || px > box->x1 - dot || py < box->y0 || py > box->y1 - dot)
          continue;
        cairo_rectangle (cr, px, py, dot, dot);
      }
  cairo_fill (cr);
}

static void
stroke_aggregate (cairo_t   *cr,
                  const Box *box,
                  double     unit,
                  guint      seed)
{
  double cell = unit * 1.6;
  int i0 = (int) floor (box->x0 / cell), i1 = (int) ceil (box->x1 / cell);
  int j0 = (int) floor (box->y0 / cell), j1 = (int) ceil (box->y1 / cell);
  double r = unit * 0.28;

  for (int j = j0; j < j1; j++)
    for (int i = i0; i < i1; i++)
      {
        guint32 state = (guint32) (i * 2654435761u) ^ (guint32) (j * 40503u) ^ (seed * 97u);
        double cx, cy, a;

        next_random (&state);
        if (next_random (&state) > 0.55)
          continue;
        cx = (i + 0.2 + 0.6 * next_random (&state)) * cell;
        cy = (j + 0.2 + 0.6 * next_random (&state)) * cell;
        if (cx - r < box->x0 || cx + r > box->x1 || cy - r < box->y0 || cy + r > box->y1)
          continue;
        a = next_random (&state) * 2 * G_PI;
        cairo_move_to (cr, cx + r * cos (a), cy + r * sin (a));
        cairo_line_to (cr, cx + r * cos (a + 2.1), cy + r * sin (a + 2.1));
        cairo_line_to (cr, cx + r * 0.8 * cos (a + 4.3), cy + r * 0.8 * sin (a + 4.3));
        cairo_close_path (cr);
      }
  cairo_stroke (cr);
}

static void
stroke_batt (cairo_t   *cr,
             double     x,
             double     width,
             const Box *box,
             double     unit)
{
  /* A sine-like wave touching both faces, its period tied to the
   * thickness so that a batt reads as a batt at any scale. */
  double margin = MIN (width * 0.06, unit * 0.25);
  double a = x + margin, b = x + width - margin;
  double half = CLAMP (width * 0.3, unit * 0.3, unit * 8);
  double y = floor (box->y0 / (2 * half)) * 2 * half;
  gboolean left = TRUE;

  cairo_move_to (cr, a, y);
  for (; y < box->y1; y += half, left = !left)
    {
      double from = left ? a : b, to = left ? b : a;
      cairo_curve_to (cr, from, y + half * 0.36, to, y + half * 0.64, to, y + half);
    }
  cairo_stroke (cr);
}

static void
stroke_grain (cairo_t   *cr,
              double     x,
              double     width,
              const Box *box,
              double     unit)
{
  int n = MAX (1, (int) floor (width / (unit * 0.7)));
  double gap = width / (n + 1);
  double period = unit * 5;
  double amp = MIN (gap * 0.3, unit * 0.18);

  for (int k = 1; k <= n; k++)
    {
      double lx = x + k * gap;
      double phase = k * 1.7;
      double y = floor (box->y0 / period) * period;

      cairo_move_to (cr, lx + amp * sin (phase), y);
      for (; y < box->y1; y += period / 4)
        cairo_line_to (cr, lx + amp * sin (phase + (y + period / 4) / period * 2 * G_PI),
                       y + period / 4);
    }
  cairo_stroke (cr);
}

static void
stroke_parallel (cairo_t   *cr,
                 double     x,
                 double     width,
                 const Box *box,
                 double     pitch)
{
  int n = MAX (1, (int) floor (width / pitch) - 1);
  double gap = width / (n + 1);

  for (int k = 1; k <= n; k++)
    {
      cairo_move_to (cr, x + k * gap, box->y0);
      cairo_line_to (cr, x + k * gap, box->y1);
    }
  cairo_stroke (cr);
}

static void
draw_membrane (cairo_t   *cr,
               double     x,
               double     width,
               const Box *box,
               double     unit)
{
  double dash[2] = { unit * 0.9, unit * 0.35 };
  double mid = x + width / 2;

  cairo_save (cr);
  cairo_set_line_width (cr, unit * HEAVY);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  cairo_set_dash (cr, dash, 2, fmod (box->y0, dash[0] + dash[1]));
  cairo_move_to (cr, mid, box->y0);
  cairo_line_to (cr, mid, box->y1);
  cairo_stroke (cr);
  cairo_restore (cr);
}

static void
draw_cross (cairo_t *cr,
            double   x,
            double   y,
            double   width,
            double   height)
{
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, x + width, y + height);
  cairo_move_to (cr, x + width, y);
  cairo_line_to (cr, x, y + height);
  cairo_stroke (cr);
}

static void
draw_glass (cairo_t   *cr,
            const Box *box,
            double     unit)
{
  double step = unit * 4;

  cairo_set_source_rgb (cr, 0.86, 0.86, 0.86);
  cairo_rectangle (cr, box->x0, box->y0, box->x1 - box->x0, box->y1 - box->y0);
  cairo_fill (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  for (double y = floor (box->y0 / step) * step; y < box->y1; y += step)
    {
      double w = box->x1 - box->x0;
      cairo_move_to (cr, box->x0 + w * 0.2, y + unit);
      cairo_line_to (cr, box->x0 + w * 0.8, y + unit * 0.4);
    }
  cairo_stroke (cr);
}

static void
stroke_crosses (cairo_t   *cr,
                const Box *box,
                double     unit)
{
  double step = unit * 1.5, r = unit * 0.2;

  for (double y = floor (box->y0 / step) * step + step / 2; y < box->y1; y += step)
    for (double x = floor (box->x0 / step) * step + step / 2; x < box->x1; x += step)
      {
        cairo_move_to (cr, x - r, y);
        cairo_line_to (cr, x + r, y);
        cairo_move_to (cr, x, y - r);
        cairo_line_to (cr, x, y + r);
      }
  cairo_stroke (cr);
}

static void
set_pen (cairo_t *cr,
         double   unit)
{
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, unit * FINE);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
}

static void draw_pattern (cairo_t        *cr,
                          LaminaCategory  category,
                          LaminaHatchUse  use,
                          double          x,
                          double          y,
                          double          width,
                          double          height,
                          const Box      *box,
                          double          unit,
                          guint           seed);

/* On a raster target, the rectangle rounded to whole device pixels (a
 * pixel-aligned clip is a cheap region; a fractional one is a mask). */
static void
get_snapped_device_box (cairo_t *cr,
                        double   x,
                        double   y,
                        double   width,
                        double   height,
                        Box     *device)
{
  double x0 = x, y0 = y, x1 = x + width, y1 = y + height;

  cairo_user_to_device (cr, &x0, &y0);
  cairo_user_to_device (cr, &x1, &y1);
  x0 = round (x0), y0 = round (y0), x1 = round (x1), y1 = round (y1);
  if (x0 == x1 && width > 0)
    x1 += 1;
  *device = (Box) { x0, y0, x1, y1 };
}

static void
add_snapped_rectangle (cairo_t *cr,
                       double   x,
                       double   y,
                       double   width,
                       double   height)
{
  Box d;

  if (cairo_surface_get_type (cairo_get_target (cr)) != CAIRO_SURFACE_TYPE_IMAGE)
    {
      cairo_rectangle (cr, x, y, width, height);
      return;
    }
  get_snapped_device_box (cr, x, y, width, height, &d);
  cairo_device_to_user (cr, &d.x0, &d.y0);
  cairo_device_to_user (cr, &d.x1, &d.y1);
  cairo_rectangle (cr, MIN (d.x0, d.x1), MIN (d.y0, d.y1), fabs (d.x1 - d.x0), fabs (d.y1 - d.y0));
}

/* Tiles */

/* Enough for every hatched layer of a large build-up plus the tiles of a
 * layer being dragged; the least recently used goes first. */
#define N_TILES 24

typedef struct
{
  LaminaCategory   category;
  double           unit;
  double           pixels;   /* device pixels per unit; 0 for vector */
  int              width;    /* strips: the layer in device pixels; 0 for areas */
  guint64          used;     /* when last used (the cache's clock) */
  cairo_pattern_t *pattern;
} Tile;

struct _LaminaHatchCache
{
  Tile    tiles[N_TILES];
  guint64 clock;
};

LaminaHatchCache *
lamina_hatch_cache_new (void)
{
  return g_new0 (LaminaHatchCache, 1);
}

void
lamina_hatch_cache_free (LaminaHatchCache *cache)
{
  if (cache == NULL)
    return;
  for (guint i = 0; i < N_TILES; i++)
    g_clear_pointer (&cache->tiles[i].pattern, cairo_pattern_destroy);
  g_free (cache);
}

/* The period of each area pattern, in units: a whole number of its
 * stipple cells or line pitches, so that the tile repeats seamlessly. */
static double
get_tile_period (LaminaCategory category)
{
  switch (category)
    {
    case LAMINA_CATEGORY_MASONRY:
      return 0.55 * G_SQRT2 * 2;
    case LAMINA_CATEGORY_STONE:
      return 0.8 * G_SQRT2 * 2;
    case LAMINA_CATEGORY_CONCRETE:
      return 8.0;
    case LAMINA_CATEGORY_PLASTER:
      return 6.0;
    case LAMINA_CATEGORY_OTHER:
      return 3.0;
    case LAMINA_CATEGORY_INSULATION:
    case LAMINA_CATEGORY_TIMBER:
    case LAMINA_CATEGORY_BOARD:
    case LAMINA_CATEGORY_MEMBRANE:
    case LAMINA_CATEGORY_METAL:
    case LAMINA_CATEGORY_GLASS:
    case LAMINA_CATEGORY_AIR:
    case LAMINA_N_CATEGORIES:
    default:
      return 0.0;
    }
}

/* The patterns drawn from face to face of a layer (the batt wave, the
 * grain, the board lines) depend on its width but repeat along it: their
 * period in user units for a layer @width wide, or 0 for the others. */
static double
get_strip_period (LaminaCategory category,
                  LaminaHatchUse use,
                  double         width,
                  double         unit)
{
  switch (category)
    {
    case LAMINA_CATEGORY_INSULATION:
      /* Two half waves of stroke_batt. */
      return 2 * CLAMP (width * 0.3, unit * 0.3, unit * 8);
    case LAMINA_CATEGORY_TIMBER:
      /* One wave of stroke_grain; a member cut across is one cross. */
      return use == LAMINA_HATCH_LAYER ? unit * 5 : 0.0;
    case LAMINA_CATEGORY_BOARD:
      /* Straight lines: any period. */
      return unit * 2;
    default:
      /* The area patterns have square tiles (get_tile_period); the rest
       * are cheap as paths. */
      return 0.0;
    }
}

static cairo_pattern_t *
create_tile (cairo_t        *cr,
             LaminaCategory  category,
             double          unit,
             double          pixels)
{
  double period = get_tile_period (category) * unit;
  cairo_surface_t *surface;
  cairo_pattern_t *pattern;
  cairo_matrix_t matrix;
  cairo_t *tile;
  Box box;

  if (pixels > 0)
    {
      /* A whole number of device pixels per period; the content is
       * stretched by well under a pixel to fit. */
      int size = MAX (2, (int) round (period * pixels));
      /* Opaque ARGB32 like the usual target, so that filling is a plain
       * copy of tile rows (pixman, SRC). */
      surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, size, size);
      tile = cairo_create (surface);
      cairo_set_source_rgb (tile, 1, 1, 1);
      cairo_paint (tile);
      cairo_scale (tile, size / period, size / period);
      cairo_matrix_init_scale (&matrix, pixels, pixels);
    }
  else
    {
      cairo_rectangle_t extents = { 0, 0, period, period };
      surface = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, &extents);
      tile = cairo_create (surface);
      cairo_matrix_init_identity (&matrix);
    }
  /* Drawn over three periods and clipped to the middle one: lines and
   * dots that cross an edge come back on the other side. */
  box = (Box) { -period, -period, 2 * period, 2 * period };
  cairo_rectangle (tile, 0, 0, period, period);
  cairo_clip (tile);
  set_pen (tile, unit);
  if (category == LAMINA_CATEGORY_CONCRETE || category == LAMINA_CATEGORY_PLASTER)
    box = (Box) { 0, 0, period, period };
  draw_pattern (tile, category, LAMINA_HATCH_LAYER, 0, 0, period, period, &box, unit, 1);
  cairo_destroy (tile);

  pattern = cairo_pattern_create_for_surface (surface);
  cairo_surface_destroy (surface);
  cairo_pattern_set_extend (pattern, CAIRO_EXTEND_REPEAT);
  cairo_pattern_set_matrix (pattern, &matrix);
  if (pixels > 0)
    cairo_pattern_set_filter (pattern, CAIRO_FILTER_NEAREST);
  return pattern;
}

/* A strip tile: the whole width of a layer @width_px device pixels wide
 * by one period along it, drawn as the paths would be for a layer starting
 * at 0.  Raster only: on a vector target the strokes stay paths. */
static cairo_pattern_t *
create_strip_tile (LaminaCategory category,
                   LaminaHatchUse use,
                   int            width_px,
                   double         unit,
                   double         pixels)
{
  double width = width_px / pixels;
  double period = get_strip_period (category, use, width, unit);
  int size = MAX (2, (int) round (period * pixels));
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, width_px, size);
  cairo_t *tile = cairo_create (surface);
  cairo_pattern_t *pattern;
  Box box = { 0, -period, width, 2 * period };

  cairo_set_source_rgb (tile, 1, 1, 1);
  cairo_paint (tile);
  cairo_scale (tile, pixels, size / period);
  cairo_rectangle (tile, 0, 0, width, period);
  cairo_clip (tile);
  set_pen (tile, unit);
  draw_pattern (tile, category, use, 0, 0, width, period, &box, unit, 1);
  cairo_destroy (tile);

  pattern = cairo_pattern_create_for_surface (surface);
  cairo_surface_destroy (surface);
  cairo_pattern_set_extend (pattern, CAIRO_EXTEND_REPEAT);
  cairo_pattern_set_filter (pattern, CAIRO_FILTER_NEAREST);
  return pattern;
}

static Tile *
lookup_tile (LaminaHatchCache *cache,
             LaminaCategory    category,
             double            unit,
             double            pixels,
             int               width)
{
  Tile *oldest = &cache->tiles[0];

  cache->clock++;
  for (guint i = 0; i < N_TILES; i++)
    {
      Tile *t = &cache->tiles[i];

      if (t->pattern && t->category == category && t->unit == unit && t->pixels == pixels &&
          t->width == width)
        {
          t->used = cache->clock;
          return t;
        }
      if (t->used < oldest->used)
        oldest = t;
    }
  g_clear_pointer (&oldest->pattern, cairo_pattern_destroy);
  *oldest = (Tile) { category, unit, pixels, width, cache->clock, NULL };
  return oldest;
}

/* Where user axis (ux, uy) lands on the device: which device axis (0 = x,
 * 1 = y) and in which direction.  FALSE unless a quarter turn. */
static gboolean
get_device_axis (cairo_t *cr,
                 double   ux,
                 double   uy,
                 int     *axis,
                 double  *sign)
{
  cairo_user_to_device_distance (cr, &ux, &uy);
  if (fabs (uy) < 1e-9 && fabs (ux) > 1e-9)
    *axis = 0, *sign = ux > 0 ? 1 : -1;
  else if (fabs (ux) < 1e-9 && fabs (uy) > 1e-9)
    *axis = 1, *sign = uy > 0 ? 1 : -1;
  else
    return FALSE;
  return TRUE;
}

/* Fills the visible part of a layer (x, width) with its strip tile on an
 * image surface, pixel for pixel where the paths would be drawn. */
/* Where a strip tile goes: FALSE when the layer gets paths instead. */
typedef struct
{
  double pixels;   /* device pixels per user unit */
  double d0;       /* the inner face, rounded to a device pixel */
  int    px_width; /* the layer across, in device pixels */
  int    ax, ay;   /* the device axes across and along */
  double sx, sy;   /* and their directions */
} StripPlace;

static gboolean
get_strip_place (cairo_t        *cr,
                 LaminaCategory  category,
                 LaminaHatchUse  use,
                 double          x,
                 double          width,
                 double          unit,
                 StripPlace     *place)
{
  double from[2] = { x, 0 }, to[2] = { x + width, 0 };
  double dx = 1, dy = 0, px_width;

  if (get_strip_period (category, use, width, unit) <= 0 ||
      cairo_surface_get_type (cairo_get_target (cr)) != CAIRO_SURFACE_TYPE_IMAGE ||
      !get_device_axis (cr, 1, 0, &place->ax, &place->sx) ||
      !get_device_axis (cr, 0, 1, &place->ay, &place->sy) || place->ax == place->ay)
    return FALSE;
  cairo_user_to_device_distance (cr, &dx, &dy);
  place->pixels = hypot (dx, dy);
  cairo_user_to_device (cr, &from[0], &from[1]);
  cairo_user_to_device (cr, &to[0], &to[1]);
  /* The layer's faces rounded to pixels, as add_snapped_rectangle does. */
  place->d0 = round (from[place->ax]);
  px_width = fabs (round (to[place->ax]) - place->d0);
  /* Too thin for a pattern to show, or absurdly wide: paths. */
  if (px_width < 2 || px_width > 8192)
    return FALSE;
  place->px_width = (int) px_width;
  return TRUE;
}

static gboolean
fill_from_strip (cairo_t          *cr,
                 LaminaHatchCache *cache,
                 LaminaCategory    category,
                 LaminaHatchUse    use,
                 double            x,
                 double            width,
                 const Box        *box,
                 double            unit)
{
  double origin[2] = { 0, 0 };
  cairo_matrix_t matrix;
  StripPlace p;
  Tile *tile;

  if (!get_strip_place (cr, category, use, x, width, unit, &p))
    return FALSE;
  cairo_user_to_device (cr, &origin[0], &origin[1]);
  tile = lookup_tile (cache, category, unit, p.pixels, p.px_width | (use << 16));
  if (tile->pattern == NULL)
    tile->pattern = create_strip_tile (category, use, p.px_width, unit, p.pixels);
  /* pattern = ±(device − the snapped inner face) across, and the device
   * position on a whole-pixel offset along (rows anchored at y = 0). */
  cairo_matrix_init (&matrix, p.pixels, 0, 0, p.pixels,
                     p.sx * (origin[p.ax] - p.d0), p.sy * (origin[p.ay] - round (origin[p.ay])));
  cairo_pattern_set_matrix (tile->pattern, &matrix);
  cairo_set_source (cr, tile->pattern);
  cairo_set_operator (cr, CAIRO_OPERATOR_SOURCE);
  add_snapped_rectangle (cr, x, box->y0, width, box->y1 - box->y0);
  cairo_fill (cr);
  return TRUE;
}

/* Whether an area tile fills the box: FALSE for paths.  @pixels: device
 * pixels per user unit on an image surface, 0 for a vector tile. */
static gboolean
get_area_tile_pixels (cairo_t        *cr,
                      LaminaCategory  category,
                      double         *pixels)
{
  cairo_surface_type_t type = cairo_surface_get_type (cairo_get_target (cr));
  double dx = 1, dy = 0;

  *pixels = 0.0;
  if (get_tile_period (category) <= 0)
    return FALSE;
  /* cairo 1.16's SVG surface leaks what it copies of a recording-surface
   * pattern (seen under LeakSanitizer on every SVG export): an SVG gets
   * the hatch as plain paths, which suits a drawing program better anyway. */
  if (type == CAIRO_SURFACE_TYPE_SVG)
    return FALSE;
  if (type == CAIRO_SURFACE_TYPE_IMAGE)
    {
      cairo_user_to_device_distance (cr, &dx, &dy);
      *pixels = hypot (dx, dy);
      /* Only quarter turns keep a pixel tile crisp. */
      if (fabs (dx) > 1e-6 && fabs (dy) > 1e-6)
        return FALSE;
    }
  return TRUE;
}

static gboolean
fill_from_tile (cairo_t          *cr,
                LaminaHatchCache *cache,
                LaminaCategory    category,
                const Box        *box,
                double            unit)
{
  double pixels;
  Tile *tile;

  if (!get_area_tile_pixels (cr, category, &pixels))
    return FALSE;
  tile = lookup_tile (cache, category, unit, pixels, 0);
  if (tile->pattern == NULL)
    tile->pattern = create_tile (cr, category, unit, pixels);
  if (pixels > 0)
    {
      cairo_matrix_t matrix;
      double ox = 0, oy = 0, x0 = box->x0, y0 = box->y0, x1 = box->x1, y1 = box->y1;

      /* One tile pixel on one device pixel at a whole-pixel offset, and a
       * fill snapped to pixels: pixman then copies rows of the tile. */
      cairo_user_to_device (cr, &ox, &oy);
      cairo_matrix_init (&matrix, pixels, 0, 0, pixels, ox - floor (ox), oy - floor (oy));
      cairo_pattern_set_matrix (tile->pattern, &matrix);
      cairo_set_source (cr, tile->pattern);
      cairo_set_operator (cr, CAIRO_OPERATOR_SOURCE);
      add_snapped_rectangle (cr, x0, y0, x1 - x0, y1 - y0);
    }
  else
    {
      cairo_set_source (cr, tile->pattern);
      cairo_rectangle (cr, box->x0, box->y0, box->x1 - box->x0, box->y1 - box->y0);
    }
  cairo_fill (cr);
  return TRUE;
}

void
lamina_hatch_fill (cairo_t          *cr,
                   LaminaHatchCache *cache,
                   LaminaCategory    category,
                   LaminaHatchUse  use,
                   double          x,
                   double          y,
                   double          width,
                   double          height,
                   double          unit,
                   guint           seed)
{
  Box box;

  g_return_if_fail (cr != NULL);

  if (width < 0 || height <= 0)
    return;
  cairo_save (cr);
  /* Tiles need no clip: a clip that is not on whole pixels would send
   * every later fill through a mask. */
  if (cache && get_visible_box (cr, x, y, width, height, &box) &&
      (fill_from_tile (cr, cache, category, &box, unit) ||
       fill_from_strip (cr, cache, category, use, x, width, &box, unit)))
    {
      cairo_restore (cr);
      return;
    }
  if (category == LAMINA_CATEGORY_MEMBRANE)
    {
      /* A foil is far thinner than its symbol: let the line overhang. */
      double half = MAX (width, unit * HEAVY) / 2;
      add_snapped_rectangle (cr, x + width / 2 - half, y, 2 * half, height);
    }
  else
    add_snapped_rectangle (cr, x, y, width, height);
  cairo_clip (cr);
  if (!get_visible_box (cr, x - unit, y, width + 2 * unit, height, &box))
    {
      cairo_restore (cr);
      return;
    }
  set_pen (cr, unit);
  draw_pattern (cr, category, use, x, y, width, height, &box, unit, seed);
  cairo_restore (cr);
}

gboolean
lamina_hatch_fill_get_covered (cairo_t          *cr,
                               LaminaHatchCache *cache,
                               LaminaCategory    category,
                               LaminaHatchUse    use,
                               double            x,
                               double            y,
                               double            width,
                               double            height,
                               double            unit,
                               double           *device_x0,
                               double           *device_y0,
                               double           *device_x1,
                               double           *device_y1)
{
  double pixels;
  StripPlace place;
  Box box, d;

  g_return_val_if_fail (cr != NULL, FALSE);

  /* The same choices as lamina_hatch_fill makes, in the same order. */
  if (cache == NULL || width < 0 || height <= 0 ||
      cairo_surface_get_type (cairo_get_target (cr)) != CAIRO_SURFACE_TYPE_IMAGE ||
      !get_visible_box (cr, x, y, width, height, &box))
    return FALSE;
  if (get_tile_period (category) > 0)
    {
      if (!get_area_tile_pixels (cr, category, &pixels))
        return FALSE;
      get_snapped_device_box (cr, box.x0, box.y0, box.x1 - box.x0, box.y1 - box.y0, &d);
    }
  else if (get_strip_place (cr, category, use, x, width, unit, &place))
    get_snapped_device_box (cr, x, box.y0, width, box.y1 - box.y0, &d);
  else
    return FALSE;
  *device_x0 = MIN (d.x0, d.x1);
  *device_y0 = MIN (d.y0, d.y1);
  *device_x1 = MAX (d.x0, d.x1);
  *device_y1 = MAX (d.y0, d.y1);
  return TRUE;
}

static void
draw_pattern (cairo_t        *cr,
              LaminaCategory  category,
              LaminaHatchUse  use,
              double          x,
              double          y,
              double          width,
              double          height,
              const Box      *box_in,
              double          unit,
              guint           seed)
{
  Box box = *box_in;

  switch (category)
    {
    case LAMINA_CATEGORY_INSULATION:
      cairo_set_line_width (cr, unit * MEDIUM);
      stroke_batt (cr, x, width, &box, unit);
      break;
    case LAMINA_CATEGORY_MASONRY:
      stroke_diagonals (cr, &box, unit * 0.55, 1);
      break;
    case LAMINA_CATEGORY_STONE:
      stroke_diagonals (cr, &box, unit * 0.8, 1);
      stroke_diagonals (cr, &box, unit * 0.8, -1);
      break;
    case LAMINA_CATEGORY_CONCRETE:
      fill_stipple (cr, &box, unit, 0.55, unit * 0.09, seed);
      stroke_aggregate (cr, &box, unit, seed);
      break;
    case LAMINA_CATEGORY_PLASTER:
      fill_stipple (cr, &box, unit * 0.6, 0.7, unit * 0.07, seed);
      break;
    case LAMINA_CATEGORY_TIMBER:
      if (use == LAMINA_HATCH_MEMBER)
        {
          cairo_set_line_width (cr, unit * MEDIUM);
          draw_cross (cr, x, y, width, height);
        }
      else
        stroke_grain (cr, x, width, &box, unit);
      break;
    case LAMINA_CATEGORY_BOARD:
      stroke_parallel (cr, x, width, &box, unit * 0.3);
      break;
    case LAMINA_CATEGORY_MEMBRANE:
      draw_membrane (cr, x, width, &box, unit);
      break;
    case LAMINA_CATEGORY_METAL:
      cairo_rectangle (cr, box.x0, box.y0, box.x1 - box.x0, box.y1 - box.y0);
      cairo_fill (cr);
      break;
    case LAMINA_CATEGORY_GLASS:
      draw_glass (cr, &box, unit);
      break;
    case LAMINA_CATEGORY_AIR:
      break;
    case LAMINA_CATEGORY_OTHER:
    case LAMINA_N_CATEGORIES:
    default:
      stroke_crosses (cr, &box, unit);
      break;
    }
}
