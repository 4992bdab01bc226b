/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-figure-grid.h: one row of a table of figures (name, value, unit)
 * as the results panel's blocks show them. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* Attaches @name, a value label and @unit as row @row of @grid and
 * returns the value label (borrowed).  A long name (Danish) wraps rather
 * than widen the panel or lose its end; the figure stays on its first
 * line. */
GtkLabel *lamina_figure_grid_attach (GtkGrid    *grid,
                                     int         row,
                                     const char *name,
                                     const char *unit);

G_END_DECLS
