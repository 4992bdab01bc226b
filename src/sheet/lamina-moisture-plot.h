/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-moisture-plot.h: the pictures of an EN ISO 13788 check, drawn to
 * any cairo context (sheets, PNGs and the window): saturation and actual
 * vapour pressure across the section for one month, and the moisture
 * accumulated at the end of each month. */
#pragma once

#include <cairo.h>

#include "lamina-construction.h"
#include "lamina-moisture.h"

G_BEGIN_DECLS

/* psat (solid) and p (dashed) across the layers that count, for @month
 * (1–12), against thickness (mm) or, when @by_sd, against cumulative sd
 * (m).  Layer boundaries are drawn with the layer numbers of
 * @construction; the planes holding water at the month's end are marked.
 * Everything within x, y, width, height (device units, @font_size the
 * text size). */
void lamina_moisture_plot_draw (cairo_t                    *cr,
                                const LaminaConstruction   *construction,
                                const LaminaMoistureResult *result,
                                int                         month,
                                gboolean                    by_sd,
                                double                      x,
                                double                      y,
                                double                      width,
                                double                      height,
                                double                      font_size);

/* Twelve bars, January first: kg/m² at each month's end, with the limit as
 * a line. */
void lamina_moisture_bars_draw (cairo_t                    *cr,
                                const LaminaMoistureResult *result,
                                double                      x,
                                double                      y,
                                double                      width,
                                double                      height,
                                double                      font_size);

G_END_DECLS
