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
/* A U value: lamina_format_u (lamina-calc.h). */
/* "%s mm" with no decimals unless the value has a fraction. */
char     *lamina_text_mm        (double       value);

/* What a user typed is parsed by lamina_number_parse (lamina-number.h). */

/* TRUE for NULL, empty or only white space. */
gboolean  lamina_text_is_blank    (const char  *text);

/* Names for the screen, translated. */
const char *lamina_text_status_name  (LaminaStatus  status);
const char *lamina_text_element_name (LaminaElement element);
const char *lamina_text_heat_flow_name (LaminaHeatFlow heat_flow);
const char *lamina_text_category_name  (LaminaCategory category);

/* An ISO 8601 time from the library (UTC) as the reader's local date and
 * time, "1 Dec 2026, 21:50"; a date alone as "1 Dec 2026"; NULL as "—". */
char       *lamina_text_local_date      (const char   *iso);

G_END_DECLS
