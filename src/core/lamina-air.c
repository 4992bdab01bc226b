/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Unventilated air layers, EN ISO 6946:2017 6.9.2 (Table 8) and Annex D. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc.h"

#include <glib/gi18n-lib.h>
#include <math.h>

/* The method covers air layers up to 0.3 m thick (6.9.1). */
#define MAX_AIR_THICKNESS LAMINA_AIR_LAYER_MAX_THICKNESS
/* Table 8 applies to faces of emissivity not below 0.8. */
#define HIGH_EMISSIVITY 0.8
/* Annex D works at a mean temperature of 10 °C with ΔT ≤ 5 K. */
#define AIR_MEAN_TEMPERATURE 10.0

/* EN ISO 6946:2017 Table 8, m²·K/W: rows by thickness in mm, columns by
 * LaminaHeatFlow (upward, horizontal, downward). */
static const double table_thickness[] = { 0, 5, 7, 10, 15, 25, 50, 100, 300 };
static const double table_resistance[][LAMINA_N_HEAT_FLOWS] = {
  { 0.00, 0.00, 0.00 },
  { 0.11, 0.11, 0.11 },
  { 0.13, 0.13, 0.13 },
  { 0.15, 0.15, 0.15 },
  { 0.16, 0.17, 0.17 },
  { 0.16, 0.18, 0.19 },
  { 0.16, 0.18, 0.21 },
  { 0.16, 0.18, 0.22 },
  { 0.16, 0.18, 0.23 },
};
G_STATIC_ASSERT (G_N_ELEMENTS (table_thickness) == G_N_ELEMENTS (table_resistance));

double
lamina_air_layer_resistance_table (double         thickness,
                                   LaminaHeatFlow heat_flow)
{
  const guint n = G_N_ELEMENTS (table_thickness);

  g_return_val_if_fail ((guint) heat_flow < LAMINA_N_HEAT_FLOWS, NAN);

  if (!(thickness > 0))
    return 0.0;
  if (thickness >= table_thickness[n - 1])
    return table_resistance[n - 1][heat_flow];
  for (guint i = 1; i < n; i++)
    {
      if (thickness <= table_thickness[i])
        {
          double d0 = table_thickness[i - 1], d1 = table_thickness[i];
          double r0 = table_resistance[i - 1][heat_flow], r1 = table_resistance[i][heat_flow];

          return r0 + (r1 - r0) * (thickness - d0) / (d1 - d0);
        }
    }
  g_assert_not_reached ();
}

/* D.2: the convective coefficient ha across the layer for ΔT ≤ 5 K;
 * d in metres.  0.025/d is conduction through still air. */
static double
air_convective_coefficient (double         d,
                            LaminaHeatFlow heat_flow)
{
  double conduction = 0.025 / d;

  switch (heat_flow)
    {
    case LAMINA_HEAT_FLOW_UPWARD:
      return MAX (1.95, conduction);
    case LAMINA_HEAT_FLOW_DOWNWARD:
      return MAX (0.12 * pow (d, -0.44), conduction);
    case LAMINA_HEAT_FLOW_HORIZONTAL:
    case LAMINA_N_HEAT_FLOWS:
    default:
      return MAX (1.25, conduction);
    }
}

double
lamina_air_layer_resistance_formula (double         thickness,
                                     LaminaHeatFlow heat_flow,
                                     double         emissivity_1,
                                     double         emissivity_2)
{
  double d = thickness / 1000.0;
  double emittance, hr;

  g_return_val_if_fail (thickness > 0, NAN);

  /* D.2: intersurface emittance between two parallel faces. */
  emittance = 1.0 / (1.0 / emissivity_1 + 1.0 / emissivity_2 - 1.0);
  hr = emittance * lamina_radiative_coefficient (AIR_MEAN_TEMPERATURE);
  return 1.0 / (air_convective_coefficient (d, heat_flow) + hr);
}

gboolean
lamina_air_layer_resistance (double         thickness,
                             LaminaHeatFlow heat_flow,
                             double         emissivity_1,
                             double         emissivity_2,
                             double        *resistance,
                             GError       **error)
{
  if (thickness > MAX_AIR_THICKNESS)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                   _("an air layer %g mm thick is outside EN ISO 6946 (6.9: at most %g mm); "
                     "treat the space as an unheated space or calculate it numerically"),
                   thickness, MAX_AIR_THICKNESS);
      return FALSE;
    }
  if (emissivity_1 >= HIGH_EMISSIVITY && emissivity_2 >= HIGH_EMISSIVITY)
    *resistance = lamina_air_layer_resistance_table (thickness, heat_flow);
  else
    *resistance = lamina_air_layer_resistance_formula (thickness, heat_flow,
                                                       emissivity_1, emissivity_2);
  return TRUE;
}
