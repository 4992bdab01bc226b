/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-sheet-dynamic.c: the dynamic characteristics of EN ISO 13786:2017
 * as a paragraph for the sheet, the comparison and the window. */
#define G_LOG_DOMAIN "lamina-sheet"

#include "lamina-design.h"

#include <glib/gi18n-lib.h>

#include "lamina-sheet-format.h"

char *
lamina_dynamic_dup_text (const LaminaConstruction *c,
                         const LaminaResult       *r)
{
  g_autoptr(GError) error = NULL;
  char y12[LAMINA_FORMAT_SIZE], f[LAMINA_FORMAT_SIZE], shift[LAMINA_FORMAT_SIZE];
  char y11[LAMINA_FORMAT_SIZE], k1[LAMINA_FORMAT_SIZE], k2[LAMINA_FORMAT_SIZE];
  LaminaDynamic d;
  GString *text;

  g_return_val_if_fail (c != NULL && r != NULL, NULL);

  if (!lamina_dynamic_calculate (c, r, LAMINA_DYNAMIC_PERIOD_HOURS, &d, &error))
    return g_strdup_printf (_("Not given: %s."), error->message);
  text = g_string_new (NULL);
  g_string_append_printf (text,
                          _("Periodic thermal transmittance |Y12| = %s W/(m²·K), decrement factor f = %s, "
                            "time shift %s h; internal admittance |Y11| = %s W/(m²·K); areal heat "
                            "capacity inside κ1 = %s, outside κ2 = %s kJ/(m²·K)."),
                          lamina_format_fixed (y12, d.periodic_transmittance, 3),
                          lamina_format_fixed (f, d.decrement_factor, 2),
                          lamina_format_fixed (shift, d.time_shift, 1),
                          lamina_format_fixed (y11, d.admittance_inner, 2),
                          lamina_format_fixed (k1, d.areal_heat_capacity_inner / 1000.0, 1),
                          lamina_format_fixed (k2, d.areal_heat_capacity_outer / 1000.0, 1));
  g_string_append (text, " ");
  g_string_append (text, _("Sinusoidal variation over 24 h; |Y12|, f, the time shift (lag of the inside) and "
                           "|Y11| with Rsi and Rse, κ1 and κ2 from surface to surface."));
  if (d.bridged_equivalent)
    {
      g_string_append (text, " ");
      g_string_append (text, _("Bridged layers are taken by their lower-limit equivalent resistance and "
                               "area-weighted heat capacity: an approximation outside the standard's "
                               "plane layers."));
    }
  return g_string_free (text, FALSE);
}
