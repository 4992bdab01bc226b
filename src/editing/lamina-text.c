/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-text.h"

#include <glib/gi18n.h>
#include <locale.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "lamina-calc.h"

char *
lamina_text_number (double value,
                      int    decimals)
{
  if (isnan (value))
    return g_strdup ("–");
  /* printf follows LC_NUMERIC, which gtk_init sets from the environment. */
  return g_strdup_printf ("%.*f", decimals, value);
}

char *
lamina_text_mm (double value)
{
  if (isnan (value))
    return g_strdup ("–");
  if (fabs (value - round (value)) < 1e-6)
    return g_strdup_printf ("%.0f mm", value);
  return g_strdup_printf ("%.1f mm", value);
}

gboolean
lamina_text_is_blank (const char *text)
{
  if (text == NULL)
    return TRUE;
  for (; *text; text = g_utf8_next_char (text))
    if (!g_unichar_isspace (g_utf8_get_char (text)))
      return FALSE;
  return TRUE;
}

const char *
lamina_text_status_name (LaminaStatus status)
{
  switch (status)
    {
    case LAMINA_STATUS_CHECKED:
      return C_("status", "Checked");
    case LAMINA_STATUS_APPROVED:
      return C_("status", "Approved");
    case LAMINA_STATUS_DRAFT:
    default:
      return C_("status", "Draft");
    }
}

const char *
lamina_text_element_name (LaminaElement element)
{
  switch (element)
    {
    case LAMINA_ELEMENT_ROOF:
      return _("Roof");
    case LAMINA_ELEMENT_FLOOR:
      return _("Floor");
    case LAMINA_ELEMENT_CEILING:
      return _("Ceiling");
    case LAMINA_ELEMENT_PARTITION:
      return _("Partition");
    case LAMINA_ELEMENT_WALL:
    default:
      return _("Wall");
    }
}

const char *
lamina_text_heat_flow_name (LaminaHeatFlow heat_flow)
{
  switch (heat_flow)
    {
    case LAMINA_HEAT_FLOW_UPWARD:
      return C_("heat flow", "Upward");
    case LAMINA_HEAT_FLOW_DOWNWARD:
      return C_("heat flow", "Downward");
    case LAMINA_HEAT_FLOW_HORIZONTAL:
    default:
      return C_("heat flow", "Horizontal");
    }
}

const char *
lamina_text_category_name (LaminaCategory category)
{
  switch (category)
    {
    case LAMINA_CATEGORY_INSULATION: return C_("category", "Insulation");
    case LAMINA_CATEGORY_MASONRY: return C_("category", "Masonry");
    case LAMINA_CATEGORY_CONCRETE: return C_("category", "Concrete");
    case LAMINA_CATEGORY_TIMBER: return C_("category", "Timber");
    case LAMINA_CATEGORY_BOARD: return C_("category", "Board");
    case LAMINA_CATEGORY_MEMBRANE: return C_("category", "Membrane");
    case LAMINA_CATEGORY_METAL: return C_("category", "Metal");
    case LAMINA_CATEGORY_PLASTER: return C_("category", "Plaster");
    case LAMINA_CATEGORY_STONE: return C_("category", "Stone");
    case LAMINA_CATEGORY_GLASS: return C_("category", "Glass");
    case LAMINA_CATEGORY_AIR: return C_("category", "Air");
    case LAMINA_CATEGORY_OTHER:
    case LAMINA_N_CATEGORIES:
    default: return C_("category", "Other");
    }
}

char *
lamina_text_local_date (const char *iso)
{
  g_autoptr(GTimeZone) utc = g_time_zone_new_utc ();
  g_autoptr(GDateTime) when = NULL;
  g_autoptr(GDateTime) local = NULL;

  if (iso == NULL || *iso == '\0')
    return g_strdup ("\xe2\x80\x94");
  /* A date alone (a review date typed as YYYY-MM-DD) has no time to show. */
  if (strlen (iso) == 10)
    {
      g_autofree char *noon = g_strconcat (iso, "T12:00:00Z", NULL);

      when = g_date_time_new_from_iso8601 (noon, utc);
      /* Translators: a date as in "1 Dec 2026" (strftime format) */
      return when ? g_date_time_format (when, C_("date", "%-d %b %Y")) : g_strdup (iso);
    }
  when = g_date_time_new_from_iso8601 (iso, utc);
  if (when == NULL)
    return g_strdup (iso);
  local = g_date_time_to_local (when);
  /* Translators: a date and local time as in "1 Dec 2026, 21:50" (strftime format) */
  return g_date_time_format (local, C_("date", "%-d %b %Y, %H:%M"));
}
