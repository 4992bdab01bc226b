/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-number.c: one parser for the numbers people type into fields,
 * with messages that name the field and the allowed range. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-number.h"
#include "lamina-error.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

/* Longer than any number a person types; refusing it early keeps the
 * message (which quotes the text) readable. */
#define MAX_TEXT 64

/* The ranges follow lamina_construction_validate (lamina-validate.c) and
 * lamina_material checks; density, specific heat and μ bounds are wide
 * "common practice" plausibility limits (EN ISO 10456 Table 3 spans
 * about 10–21000 kg/m³, 840–2000 J/(kg·K) and μ 1–1000000). */
static const LaminaNumberRange ranges[LAMINA_N_FIELDS] = {
  [LAMINA_FIELD_THICKNESS]           = { N_("thickness"), "mm", 0, 10000, TRUE },
  [LAMINA_FIELD_CONDUCTIVITY]        = { N_("thermal conductivity λ"), "W/(m·K)", 0, 1000, TRUE },
  [LAMINA_FIELD_FRACTION]            = { N_("fraction"), "", 0, 1, TRUE },
  [LAMINA_FIELD_PERCENTAGE]          = { N_("percentage"), "%", 0, 100, TRUE },
  [LAMINA_FIELD_INSIDE_TEMPERATURE]  = { N_("inside temperature"), "°C", -60, 60, FALSE },
  [LAMINA_FIELD_OUTSIDE_TEMPERATURE] = { N_("outside temperature"), "°C", -60, 60, FALSE },
  [LAMINA_FIELD_TARGET_U]            = { N_("target U"), "W/(m²·K)", 0, 10, TRUE },
  [LAMINA_FIELD_U_FILTER]            = { N_("U"), "W/(m²·K)", 0, 10, FALSE },
  [LAMINA_FIELD_THERMAL_RESISTANCE]  = { N_("thermal resistance"), "m²·K/W", 0, 100, FALSE },
  [LAMINA_FIELD_EMISSIVITY]          = { N_("emissivity"), "", 0, 1, TRUE },
  [LAMINA_FIELD_DENSITY]             = { N_("density"), "kg/m³", 0, 25000, TRUE },
  [LAMINA_FIELD_SPECIFIC_HEAT]       = { N_("specific heat"), "J/(kg·K)", 0, 10000, TRUE },
  [LAMINA_FIELD_VAPOUR_RESISTANCE]   = { N_("vapour resistance factor μ"), "", 1, 10000000, FALSE },
  [LAMINA_FIELD_SPACING]             = { N_("spacing"), "mm", 0, 100000, TRUE },
  [LAMINA_FIELD_WIDTH]               = { N_("width"), "mm", 0, 100000, TRUE },
  [LAMINA_FIELD_VENT_AREA]           = { N_("vent area"), "mm²", 0, 1e6, FALSE },
  [LAMINA_FIELD_AIR_GAP_LEVEL]       = { N_("air gap level"), "", 0, 2, FALSE },
  [LAMINA_FIELD_FASTENER_AREA]       = { N_("fastener cross-section"), "mm²", 0, 10000, TRUE },
  [LAMINA_FIELD_FASTENER_COUNT]      = { N_("fasteners per square metre"), "1/m²", 0, 1000, TRUE },
  [LAMINA_FIELD_PRECIPITATION]       = { N_("precipitation"), "mm/day", 0, 100, FALSE },
  [LAMINA_FIELD_DRAINAGE_FACTOR]     = { N_("drainage factor"), "", 0, 1, FALSE },
  [LAMINA_FIELD_AREA]                = { N_("area"), "m²", 0, 1e6, FALSE },
  [LAMINA_FIELD_LENGTH]              = { N_("length"), "m", 0, 1e5, TRUE },
  [LAMINA_FIELD_PSI]                 = { N_("linear thermal transmittance ψ"), "W/(m·K)", -10, 10, FALSE },
  [LAMINA_FIELD_TEMPERATURE_FACTOR]  = { N_("temperature factor fRsi"), "", 0, 1, FALSE },
  [LAMINA_FIELD_RELATIVE_HUMIDITY]   = { N_("relative humidity"), "%", 0, 100, FALSE },
  [LAMINA_FIELD_MOISTURE_LIMIT]      = { N_("moisture limit"), "kg/m²", 0, 1000, TRUE },
};

/* Other spellings of a unit that people type (ASCII forms). */
static const struct
{
  const char *unit;
  const char *alias;
} unit_aliases[] = {
  { "W/(m·K)", "W/mK" }, { "W/(m·K)", "W/(mK)" }, { "W/(m·K)", "W/(m.K)" },
  { "W/(m·K)", "W/m·K" },
  { "W/(m²·K)", "W/m2K" }, { "W/(m²·K)", "W/(m2K)" }, { "W/(m²·K)", "W/(m2.K)" },
  { "W/(m²·K)", "W/m²K" },
  { "m²·K/W", "m2K/W" }, { "m²·K/W", "m²K/W" },
  { "°C", "C" }, { "°C", "℃" },
  { "kg/m³", "kg/m3" },
  { "mm²", "mm2" }, { "1/m²", "1/m2" },
  { "J/(kg·K)", "J/kgK" }, { "J/(kg·K)", "J/(kgK)" },
};

const LaminaNumberRange *
lamina_number_field_get_range (LaminaNumberField field)
{
  g_return_val_if_fail ((guint) field < LAMINA_N_FIELDS, NULL);
  return &ranges[field];
}

char *
lamina_number_dup_range_text (LaminaNumberField field)
{
  const LaminaNumberRange *r = lamina_number_field_get_range (field);

  g_return_val_if_fail (r != NULL, NULL);
  return g_strdup_printf ("%s%g to %g%s%s", r->open_min ? _("above ") : "", r->min, r->max,
                          *r->unit ? " " : "", r->unit);
}

static gboolean
unit_matches (const LaminaNumberRange *r,
              const char              *text)
{
  if (*r->unit == '\0')
    return FALSE;
  if (strcmp (text, r->unit) == 0)
    return TRUE;
  for (guint i = 0; i < G_N_ELEMENTS (unit_aliases); i++)
    if (strcmp (unit_aliases[i].unit, r->unit) == 0 && strcmp (unit_aliases[i].alias, text) == 0)
      return TRUE;
  return FALSE;
}

/* Copies the number at the start of @s into @out (ASCII, decimal point)
 * and returns the length consumed, or 0 when @s starts with no number:
 * [sign] digits [(.|,) digits] [(e|E) [sign] digits].  Hex, "inf" and
 * "nan", which strtod would take, are not numbers here. */
static gsize
scan_number (const char *s,
             GString    *out)
{
  const char *p = s;
  gsize digits = 0;

  if (g_str_has_prefix (p, "−"))   /* U+2212 MINUS SIGN */
    {
      g_string_append_c (out, '-');
      p += strlen ("−");
    }
  else if (*p == '-' || *p == '+')
    g_string_append_c (out, *p++);
  for (; g_ascii_isdigit (*p); p++, digits++)
    g_string_append_c (out, *p);
  if ((*p == '.' || *p == ',') && (digits > 0 || g_ascii_isdigit (p[1])))
    {
      g_string_append_c (out, '.');
      for (p++; g_ascii_isdigit (*p); p++, digits++)
        g_string_append_c (out, *p);
    }
  if (digits == 0)
    return 0;
  if ((*p == 'e' || *p == 'E')
      && (g_ascii_isdigit (p[1])
          || ((p[1] == '-' || p[1] == '+') && g_ascii_isdigit (p[2]))))
    {
      g_string_append_c (out, 'e');
      p++;
      if (*p == '-' || *p == '+')
        g_string_append_c (out, *p++);
      for (gsize n = 0; g_ascii_isdigit (*p); p++, n++)
        if (n < 6)   /* 1e999999 is already out of every range */
          g_string_append_c (out, *p);
    }
  return (gsize) (p - s);
}

static gboolean
fail (GError                  **error,
      LaminaNumberField         field,
      const char               *fmt,
      ...) G_GNUC_PRINTF (3, 4);

static gboolean
fail (GError            **error,
      LaminaNumberField   field,
      const char         *fmt,
      ...)
{
  g_autofree char *what = NULL, *range = lamina_number_dup_range_text (field);
  va_list args;

  va_start (args, fmt);
  what = g_strdup_vprintf (fmt, args);
  va_end (args);
  g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
               _("%s: %s (allowed: %s)"), _(ranges[field].name), what, range);
  return FALSE;
}

gboolean
lamina_number_parse (LaminaNumberField   field,
                     const char         *text,
                     double             *value,
                     GError            **error)
{
  const LaminaNumberRange *r;
  g_autofree char *copy = NULL;
  g_autoptr(GString) number = g_string_new (NULL);
  const char *rest;
  gsize used;
  double parsed;

  g_return_val_if_fail ((guint) field < LAMINA_N_FIELDS, FALSE);
  g_return_val_if_fail (value != NULL, FALSE);
  r = &ranges[field];

  if (text == NULL || *text == '\0')
    return fail (error, field, _("nothing typed"));
  if (strlen (text) > MAX_TEXT)
    return fail (error, field, _("more than %d characters typed"), MAX_TEXT);
  if (!g_utf8_validate (text, -1, NULL))
    return fail (error, field, _("the text is not valid UTF-8"));
  copy = g_strstrip (g_strdup (text));
  if (*copy == '\0')
    return fail (error, field, _("nothing typed"));
  used = scan_number (copy, number);
  if (used == 0)
    return fail (error, field, _("“%s” is not a number"), copy);
  rest = copy + used;
  while (*rest == ' ')
    rest++;
  if (*rest != '\0' && !unit_matches (r, rest))
    {
      if (*r->unit)
        return fail (error, field, _("“%s”: unexpected “%s” after the number (the unit is %s)"),
                     copy, rest, r->unit);
      return fail (error, field, _("“%s”: unexpected “%s” after the number"), copy, rest);
    }
  parsed = g_ascii_strtod (number->str, NULL);
  if (!isfinite (parsed)
      || (r->open_min ? parsed <= r->min : parsed < r->min)
      || parsed > r->max)
    return fail (error, field, _("“%s” is out of range"), copy);
  *value = parsed;
  return TRUE;
}
