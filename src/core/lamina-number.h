/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-number.h: parsing the numbers people type into fields.
 *
 * One parser for every user-typed number (window entries, and anything
 * else that reads a number a person wrote), so that every field refuses
 * the same things with the same kind of message: the field's name, what
 * was typed and the allowed range, e.g.
 *   “thickness: “0” is outside the allowed range above 0 to 10000 mm”.
 * The ranges are those lamina_construction_validate applies
 * (lamina-validate.c), so a value the entry accepts is never refused
 * later by the engine.  No GTK. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef enum
{
  LAMINA_FIELD_THICKNESS,            /* mm, above 0 to 10000 */
  LAMINA_FIELD_CONDUCTIVITY,         /* λ, W/(m·K), above 0 to 1000 */
  LAMINA_FIELD_FRACTION,             /* area fraction, above 0 to 1 */
  LAMINA_FIELD_PERCENTAGE,           /* area fraction as %, above 0 to 100 */
  LAMINA_FIELD_INSIDE_TEMPERATURE,   /* °C, −60 to 60 */
  LAMINA_FIELD_OUTSIDE_TEMPERATURE,  /* °C, −60 to 60 */
  LAMINA_FIELD_TARGET_U,             /* W/(m²·K), above 0 to 10 */
  LAMINA_FIELD_U_FILTER,             /* a U bound in a search, 0 to 10 */
  LAMINA_FIELD_THERMAL_RESISTANCE,   /* m²·K/W, 0 to 100 */
  LAMINA_FIELD_EMISSIVITY,           /* above 0 to 1 */
  LAMINA_FIELD_DENSITY,              /* kg/m³, above 0 to 25000 */
  LAMINA_FIELD_SPECIFIC_HEAT,        /* J/(kg·K), above 0 to 10000 */
  LAMINA_FIELD_VAPOUR_RESISTANCE,    /* μ, 1 to 10000000 (dimensionless) */
  LAMINA_FIELD_SPACING,              /* framing spacing, mm, above 0 to 100000 */
  LAMINA_FIELD_WIDTH,                /* framing member width, mm, above 0 to 100000 */
  LAMINA_FIELD_VENT_AREA,            /* air layer openings, mm² per m, 0 to 1000000 */
  LAMINA_FIELD_AIR_GAP_LEVEL,        /* EN ISO 6946 Annex F level, 0 to 2 */
  LAMINA_FIELD_FASTENER_AREA,        /* fastener cross-section, mm², above 0 to 10000 */
  LAMINA_FIELD_FASTENER_COUNT,       /* fasteners per m², above 0 to 1000 */
  LAMINA_FIELD_PRECIPITATION,        /* mm/day, 0 to 100 */
  LAMINA_FIELD_DRAINAGE_FACTOR,      /* inverted roof f, 0 to 1 */
  LAMINA_FIELD_AREA,                 /* a job entry's area, m², 0 to 1000000 */
  LAMINA_FIELD_LENGTH,               /* a length in m (perimeter, B′, junction), above 0 to 100000 */
  LAMINA_FIELD_PSI,                  /* ψ, W/(m·K), −10 to 10 */
  LAMINA_FIELD_TEMPERATURE_FACTOR,   /* fRsi, 0 to 1 */
  LAMINA_FIELD_RELATIVE_HUMIDITY,    /* %, 0 to 100 */
  LAMINA_FIELD_MOISTURE_LIMIT,       /* kg/m², above 0 to 1000 (LAMINA_MOISTURE_LIMIT_MAX) */
  LAMINA_N_FIELDS
} LaminaNumberField;

typedef struct
{
  const char *name;      /* untranslated, for N_() */
  const char *unit;      /* "" when dimensionless */
  double      min;
  double      max;
  gboolean    open_min;  /* (min, max] rather than [min, max] */
} LaminaNumberRange;

const LaminaNumberRange *lamina_number_field_get_range (LaminaNumberField field);

/* Parses @text for @field.  Accepts surrounding blanks, a decimal comma
 * or point, a Unicode minus (U+2212), and the field's unit after the
 * number ("100 mm", "0,035 W/(m·K)", "15 %", "20 °C").  Refuses an empty
 * text, anything else after the number, grouping separators, NaN and
 * infinities, and values outside the field's range, with a
 * LAMINA_CALC_ERROR_INVALID naming the field and the range.  @value is
 * untouched on error. */
gboolean lamina_number_parse (LaminaNumberField   field,
                              const char         *text,
                              double             *value,
                              GError            **error);

/* "above 0 to 10000 mm": the allowed range of @field, for messages and
 * tooltips. */
char    *lamina_number_dup_range_text (LaminaNumberField field);

G_END_DECLS
