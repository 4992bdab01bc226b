/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-hatch.h: the hatch pattern of each material category.
 *
 * A hatch fills a rectangle in section-local coordinates: x runs across
 * the layer (its thickness), y along it.  The caller sets the transform
 * that maps this frame onto the page.  Every pattern is black on white,
 * deterministic (no randomness beyond a fixed seed) and drawn as plain
 * paths, so that it stays vector in a PDF and cheap on screen. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "lamina-types.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_HATCH_LAYER,  /* a whole layer: timber is drawn along the grain */
  LAMINA_HATCH_MEMBER, /* a framing member cut across: timber gets the cross */
} LaminaHatchUse;

/* Tiles of the area patterns (masonry, stone, concrete, plaster, other),
 * drawn once and reused: image tiles at device resolution for raster
 * targets, recording surfaces (one PDF form per document) otherwise.
 * On raster targets the face-to-face patterns (insulation, timber along
 * the grain, boards) get a tile as wide as the layer and one period long,
 * kept per width in device pixels; on vector targets they stay paths. */
typedef struct _LaminaHatchCache LaminaHatchCache;

LaminaHatchCache *lamina_hatch_cache_new  (void);
void              lamina_hatch_cache_free (LaminaHatchCache *cache);

/* Fills (x, y, width, height) with the pattern of @category.  @unit is the
 * pattern pitch in user units (the section's text size); @seed varies the
 * stipple between layers.  The rectangle is clipped; the outline is not
 * drawn.  @cache may be NULL (everything drawn as paths). */
void lamina_hatch_fill (cairo_t          *cr,
                        LaminaHatchCache *cache,
                        LaminaCategory  category,
                        LaminaHatchUse  use,
                        double          x,
                        double          y,
                        double          width,
                        double          height,
                        double          unit,
                        guint           seed);

/* Whether lamina_hatch_fill with the same arguments would copy an opaque
 * tile over every pixel of a device rectangle (on an image surface),
 * and which: (x0, y0) … (x1, y1) in whole device pixels.  Nothing drawn
 * beneath those pixels before the fill can show.  FALSE when the fill
 * draws paths (which leave the background between the lines). */
gboolean lamina_hatch_fill_get_covered (cairo_t          *cr,
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
                                        double           *device_y1);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaHatchCache, lamina_hatch_cache_free)

G_END_DECLS
