/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-section.h: the section drawing of a construction, on any cairo
 * surface (screen, PNG, PDF).
 *
 * Orientation: walls and partitions are drawn as a plan section with the
 * layers left → right from inside to outside; roofs, ceilings and floors as
 * a vertical section with the heated side where it is in the building: the
 * inside at the bottom when the heat flows up, at the top when it flows
 * down (a ceiling over a cellar).  The layers are to scale along the thickness
 * axis; the body is a strip of the construction whose length fills the
 * rectangle.  Around the body: inside/outside with the design
 * temperatures, a dimension chain (each thickness and the total) on one
 * side, the layer numbers keyed to the layer table on the other, and
 * optionally the temperature profile across the body.
 *
 * The geometry is pure (LaminaSectionLayout): the window uses the same
 * functions for hit-testing and drag-to-resize as the painter uses to
 * draw, and the tests check pixels against them. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "lamina-calc.h"
#include "lamina-construction.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_SECTION_ACROSS,   /* thickness left → right, inside on the left */
  LAMINA_SECTION_UPWARD,   /* thickness bottom → top, inside at the bottom */
  LAMINA_SECTION_DOWNWARD, /* thickness top → bottom, inside at the top */
} LaminaSectionOrientation;

typedef struct
{
  double   unit;              /* text size in user units (pt, px); sets every
                                 margin, pitch and line weight */
  double   scale;             /* user units per mm of construction; 0 = fit */
  gboolean dimensions;        /* the dimension chain */
  gboolean numbers;           /* layer numbers */
  gboolean sides;             /* inside / outside labels */
  gboolean temperatures;      /* temperature profile (needs a result) */
  int      highlight_layer;   /* 0-based, or −1 */
  int      highlight_boundary;/* 0 … n_layers, or −1 */
} LaminaSectionStyle;

/* Geometry of one drawing.  edges[i] is the position along the thickness
 * axis (x for ACROSS, y otherwise) of the inner face of layer i;
 * edges[n_layers] is the outer surface.  For UPWARD the positions
 * decrease (the inside is at the bottom). */
typedef struct
{
  LaminaSectionOrientation orientation;
  double  x, y, width, height;                      /* the whole drawing */
  double  body_x, body_y, body_width, body_height;  /* the layers */
  double  scale;                                    /* user units per mm */
  double  thickness;                                /* mm */
  guint   n_layers;
  double *edges;                                    /* n_layers + 1 */
  /* private */
  guint   capacity;
} LaminaSectionLayout;

typedef enum
{
  LAMINA_SECTION_HIT_NONE,
  LAMINA_SECTION_HIT_LAYER,    /* index: the layer (0-based) */
  LAMINA_SECTION_HIT_BOUNDARY, /* index: the edge (1 … n_layers − 1 between
                                  layers; 0 and n_layers the surfaces) */
} LaminaSectionHit;

typedef struct _LaminaSection LaminaSection;

/* The element's usual way up (its default direction of heat flow). */
LaminaSectionOrientation lamina_section_orientation_for_element (LaminaElement element);
/* The way the construction is drawn: by its element and, for horizontal
 * elements, by its direction of heat flow. */
LaminaSectionOrientation lamina_section_orientation_for (const LaminaConstruction *construction);

void     lamina_section_style_init   (LaminaSectionStyle        *style,
                                      double                     unit);

void     lamina_section_layout_init  (LaminaSectionLayout       *layout);
void     lamina_section_layout_clear (LaminaSectionLayout       *layout);
/* Lays out @construction in the rectangle.  Reuses the layout's memory:
 * called per frame it allocates only when the layer count grows. */
void     lamina_section_layout_compute (LaminaSectionLayout      *layout,
                                        const LaminaConstruction *construction,
                                        const LaminaSectionStyle *style,
                                        double                    x,
                                        double                    y,
                                        double                    width,
                                        double                    height);
/* The largest scale (user units per mm) at which the construction fits in
 * the rectangle with its annotations. */
double   lamina_section_fit_scale    (const LaminaConstruction *construction,
                                      const LaminaSectionStyle *style,
                                      double                    width,
                                      double                    height);
/* Boundaries win over layers within @tolerance user units. */
LaminaSectionHit lamina_section_layout_hit (const LaminaSectionLayout *layout,
                                            double                     px,
                                            double                     py,
                                            double                     tolerance,
                                            guint                     *index);
/* Thickness in mm that layer @edge − 1 takes when boundary @edge is
 * dragged to the point (px, py), the outer layers keeping theirs; never
 * below @minimum mm.  For the outer surface @edge = n_layers. */
double   lamina_section_layout_drag_thickness (const LaminaSectionLayout *layout,
                                               guint                      edge,
                                               double                     px,
                                               double                     py,
                                               double                     minimum);

/* The painter keeps text layouts and scratch memory between frames. */
LaminaSection *lamina_section_new    (void);
void           lamina_section_free   (LaminaSection            *self);
/* Draws with a layout from lamina_section_layout_compute for the same
 * construction.  @result (from lamina_calculate, may be NULL) gives the
 * temperature profile. */
void           lamina_section_draw   (LaminaSection             *self,
                                      cairo_t                   *cr,
                                      const LaminaSectionLayout *layout,
                                      const LaminaConstruction  *construction,
                                      const LaminaResult        *result,
                                      const LaminaSectionStyle  *style);

/* Renders a whole section to a PNG file of @width × @height pixels on
 * white, through lamina-file.h's safe writer ("-" = standard output). */
gboolean       lamina_section_write_png (const LaminaConstruction *construction,
                                         const LaminaResult       *result,
                                         int                       width,
                                         int                       height,
                                         const char               *path,
                                         gboolean                  overwrite,
                                         GError                  **error);

/* The same drawing as an SVG of @width × @height px, for the office's
 * drawings: lines and text stay vectors. */
gboolean       lamina_section_write_svg (const LaminaConstruction *construction,
                                         const LaminaResult       *result,
                                         int                       width,
                                         int                       height,
                                         const char               *path,
                                         gboolean                  overwrite,
                                         GError                  **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaSection, lamina_section_free)

G_END_DECLS
