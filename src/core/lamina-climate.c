/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-climate.h"
#include "lamina-error.h"

#include <glib/gi18n-lib.h>
#include <math.h>

G_DEFINE_BOXED_TYPE (LaminaClimate, lamina_climate, lamina_climate_copy, lamina_climate_free)

LaminaClimate *
lamina_climate_new (const char *id,
                    const char *name)
{
  LaminaClimate *climate = g_new0 (LaminaClimate, 1);

  climate->id = g_strdup (id);
  climate->name = g_strdup (name);
  for (int m = 0; m < LAMINA_MONTHS; m++)
    climate->temperature[m] = climate->humidity[m] = NAN;
  return climate;
}

LaminaClimate *
lamina_climate_copy (const LaminaClimate *climate)
{
  LaminaClimate *copy;

  g_return_val_if_fail (climate != NULL, NULL);

  copy = g_memdup2 (climate, sizeof *climate);
  copy->id = g_strdup (climate->id);
  copy->name = g_strdup (climate->name);
  copy->source = g_strdup (climate->source);
  return copy;
}

void
lamina_climate_free (LaminaClimate *climate)
{
  if (climate == NULL)
    return;
  g_free (climate->id);
  g_free (climate->name);
  g_free (climate->source);
  g_free (climate);
}

static gboolean
same_value (double a,
            double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

gboolean
lamina_climate_equal (const LaminaClimate *a,
                      const LaminaClimate *b)
{
  if (a == b)
    return TRUE;
  if (a == NULL || b == NULL
      || g_strcmp0 (a->id, b->id) != 0
      || g_strcmp0 (a->name, b->name) != 0
      || g_strcmp0 (a->source, b->source) != 0)
    return FALSE;
  for (int m = 0; m < LAMINA_MONTHS; m++)
    if (!same_value (a->temperature[m], b->temperature[m])
        || !same_value (a->humidity[m], b->humidity[m]))
      return FALSE;
  return TRUE;
}

gboolean
lamina_climate_validate (const LaminaClimate *climate,
                         GError             **error)
{
  g_return_val_if_fail (climate != NULL, FALSE);

  if (climate->id == NULL || climate->id[0] == '\0')
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID, _("a climate needs an id"));
      return FALSE;
    }
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      double t = climate->temperature[m], h = climate->humidity[m];

      if (!isfinite (t) || t < -60 || t > 60)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                       _("climate “%s”, month %d: temperature %g is outside the allowed range -60 to 60 °C"),
                       climate->id, m + 1, t);
          return FALSE;
        }
      if (!isfinite (h) || h < 0 || h > 1)
        {
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                       _("climate “%s”, month %d: relative humidity %g is outside the allowed range 0 to 1"),
                       climate->id, m + 1, h);
          return FALSE;
        }
    }
  return TRUE;
}

int
lamina_month_days (int month)
{
  static const int days[LAMINA_MONTHS] = { 31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31 };

  g_return_val_if_fail (month >= 1 && month <= LAMINA_MONTHS, 30);
  return days[month - 1];
}

const char *
lamina_month_name (int month)
{
  static const char *names[LAMINA_MONTHS] = {
    N_("January"), N_("February"), N_("March"), N_("April"), N_("May"), N_("June"),
    N_("July"), N_("August"), N_("September"), N_("October"), N_("November"), N_("December"),
  };

  g_return_val_if_fail (month >= 1 && month <= LAMINA_MONTHS, "");
  return _(names[month - 1]);
}
