/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-format.h: numbers for sheets and drawings.
 *
 * Formatted with the C library's printf family, which follows LC_NUMERIC
 * (a decimal comma in Danish once setlocale has run); never the
 * locale-independent GLib formatters, which are for files. */
#pragma once

#include <glib.h>

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_FORMAT_SIZE 48

/* @decimals places; a negative number gets a true minus sign (U+2212). */
const char *lamina_format_fixed       (char   *buffer,
                                       double  value,
                                       int     decimals);
/* A thickness in mm: whole millimetres, or one decimal when needed. */
const char *lamina_format_thickness   (char   *buffer,
                                       double  millimetres);
/* A layer's thickness; a tapered layer gives both ends, "60–220". */
const char *lamina_format_layer_thickness (char              *buffer,
                                           const LaminaLayer *layer);
/* A U value: lamina_format_u (lamina-calc.h), the one formatter the
 * window, lamina-cli and the sheets share. */
/* A temperature with one decimal and " °C". */
const char *lamina_format_temperature (char   *buffer,
                                       double  celsius);
/* A percentage with one decimal and " %". */
const char *lamina_format_percent     (char   *buffer,
                                       double  fraction);

G_END_DECLS
