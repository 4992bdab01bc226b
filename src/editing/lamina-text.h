/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-text.h: numbers on screen, in the locale's notation (a decimal
 * comma in Danish).  No GTK. */
#pragma once

#include <glib.h>

#include "lamina-types.h"

G_BEGIN_DECLS

/* @value with @decimals decimals in the locale's notation; "–" for NAN. */
char     *lamina_text_number    (double       value,
                                   int          decimals);
/* A U value to two significant figures (common reporting convention). */
char     *lamina_text_u         (double       value);
/* "%s mm" with no decimals unless the value has a fraction. */
char     *lamina_text_mm        (double       value);

/* Parses what a user typed: the locale's decimal separator, or a point,
 * with an optional trailing unit word ("mm", "W/(m·K)") which is ignored.
 * FALSE for empty or malformed text. */
gboolean  lamina_text_parse_number     (const char  *text,
                                   double      *value);

/* TRUE for NULL, empty or only white space. */
gboolean  lamina_text_is_blank    (const char  *text);

/* Names for the screen, translated. */
const char *lamina_text_status_name  (LaminaStatus  status);
const char *lamina_text_element_name (LaminaElement element);
const char *lamina_text_heat_flow_name (LaminaHeatFlow heat_flow);
const char *lamina_text_category_name  (LaminaCategory category);

G_END_DECLS
