/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-sheet-format.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include "lamina-calc.h"

#define MINUS "\xe2\x88\x92"

static const char *
lamina_format_fixed_n (char   *buffer,
                       gsize   size,
                       double  value,
                       int     decimals)
{
  char digits[32];

  if (!isfinite (value))
    {
      g_strlcpy (buffer, "\xe2\x80\x93", size); /* en dash: no value */
      return buffer;
    }
  snprintf (digits, sizeof digits, "%.*f", CLAMP (decimals, 0, 6), value);
  if (digits[0] == '-')
    {
      /* "-0.0" is not worth a sign. */
      gboolean zero = strspn (digits + 1, "0.,") == strlen (digits + 1);
      g_strlcpy (buffer, zero ? "" : MINUS, size);
      g_strlcat (buffer, digits + 1, size);
    }
  else
    g_strlcpy (buffer, digits, size);
  return buffer;
}

const char *
lamina_format_fixed (char   *buffer,
                     double  value,
                     int     decimals)
{
  return lamina_format_fixed_n (buffer, LAMINA_FORMAT_SIZE, value, decimals);
}

const char *
lamina_format_thickness (char   *buffer,
                         double  millimetres)
{
  double whole = round (millimetres);

  return lamina_format_fixed (buffer, millimetres, fabs (millimetres - whole) < 0.05 ? 0 : 1);
}

const char *
lamina_format_temperature (char   *buffer,
                           double  celsius)
{
  char number[LAMINA_FORMAT_SIZE - 8];

  lamina_format_fixed_n (number, sizeof number, celsius, 1);
  g_strlcpy (buffer, number, LAMINA_FORMAT_SIZE);
  g_strlcat (buffer, "\xc2\xa0°C", LAMINA_FORMAT_SIZE);
  return buffer;
}

const char *
lamina_format_percent (char   *buffer,
                       double  fraction)
{
  char number[LAMINA_FORMAT_SIZE - 8];

  lamina_format_fixed_n (number, sizeof number, fraction * 100, 1);
  g_strlcpy (buffer, number, LAMINA_FORMAT_SIZE);
  g_strlcat (buffer, "\xc2\xa0%", LAMINA_FORMAT_SIZE);
  return buffer;
}

const char *
lamina_format_layer_thickness (char              *buffer,
                               const LaminaLayer *layer)
{
  char thin[LAMINA_FORMAT_SIZE], thick[LAMINA_FORMAT_SIZE];

  if (!lamina_layer_is_tapered (layer))
    return lamina_format_thickness (buffer, layer->thickness);
  g_snprintf (buffer, LAMINA_FORMAT_SIZE, "%s–%s", lamina_format_thickness (thin, layer->thickness),
              lamina_format_thickness (thick, layer->thickness_max));
  return buffer;
}
