/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-field-draw.h: the picture of a 2-D check (EN ISO 10211): the
 * temperature field of one module in colour, isotherms, the material
 * boundaries and the module outline, the coldest inner surface point, a
 * colour key and the figures.  The module is drawn to scale with the
 * inside at the bottom and the module width across; any cairo target. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "lamina-construction.h"
#include "lamina-field.h"

G_BEGIN_DECLS

/* The colour of a temperature at @fraction (0 = coldest, 1 = warmest) of
 * the range, for the key and for tests. */
void     lamina_field_colour (double  fraction,
                              double *red,
                              double *green,
                              double *blue);

/* The isotherm step, K, for a temperature difference of @range K: a
 * round step giving at most 16 lines. */
double   lamina_field_isotherm_step (double range);

/* Draws into the rectangle (user units); @unit is the text size. */
void     lamina_field_draw  (cairo_t                  *cr,
                             const LaminaConstruction *construction,
                             const LaminaFieldResult  *field,
                             double                    x,
                             double                    y,
                             double                    width,
                             double                    height,
                             double                    unit);

/* @height 0: as tall as the module needs at @width. */
gboolean lamina_field_write_png (const LaminaConstruction *construction,
                                 const LaminaFieldResult  *field,
                                 int                       width,
                                 int                       height,
                                 const char               *path,
                                 GError                  **error);

G_END_DECLS
