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

/* D.2: the convective coefficient ha across the layer; d in metres.  For
 * ΔT ≤ 5 K (or not known: NAN) the constants, above it the ΔT terms:
 * horizontal 0.73 ΔT^⅓, upward 1.14 ΔT^⅓, downward 0.09 ΔT^0.187 d^−0.44
 * (from memory).  0.025/d is conduction through still air. */
static double
air_convective_coefficient (double         d,
                            LaminaHeatFlow heat_flow,
                            double         delta_t)
{
  double conduction = 0.025 / d;
  gboolean large = delta_t > 5.0;

  switch (heat_flow)
    {
    case LAMINA_HEAT_FLOW_UPWARD:
      return MAX (large ? 1.14 * cbrt (delta_t) : 1.95, conduction);
    case LAMINA_HEAT_FLOW_DOWNWARD:
      return MAX ((large ? 0.09 * pow (delta_t, 0.187) : 0.12) * pow (d, -0.44), conduction);
    case LAMINA_HEAT_FLOW_HORIZONTAL:
    case LAMINA_N_HEAT_FLOWS:
    default:
      return MAX (large ? 0.73 * cbrt (delta_t) : 1.25, conduction);
    }
}

/* D.3: a small or divided space (width b < 10 d) sees its own side walls:
 * hr = hr0 / (1/ε1 + 1/ε2 − 2 + 2 / (1 + √(1 + d²/b²) − d/b)). */
static gboolean
is_small_space (double d,
                double b)
{
  return !isnan (b) && b > 0 && b < 10.0 * d;
}

double
lamina_air_space_resistance (double         thickness,
                             LaminaHeatFlow heat_flow,
                             double         emissivity_1,
                             double         emissivity_2,
                             double         width,
                             double         delta_t,
                             double         mean_temperature)
{
  double d = thickness / 1000.0, b = width / 1000.0;
  double hr0, hr;

  g_return_val_if_fail (thickness > 0, NAN);

  hr0 = lamina_radiative_coefficient (isnan (mean_temperature) ? AIR_MEAN_TEMPERATURE : mean_temperature);
  if (is_small_space (d, b))
    hr = hr0 / (1.0 / emissivity_1 + 1.0 / emissivity_2 - 2.0
                + 2.0 / (1.0 + sqrt (1.0 + d * d / (b * b)) - d / b));
  else
    /* D.2: intersurface emittance between two parallel faces. */
    hr = hr0 / (1.0 / emissivity_1 + 1.0 / emissivity_2 - 1.0);
  return 1.0 / (air_convective_coefficient (d, heat_flow, delta_t) + hr);
}

double
lamina_air_layer_resistance_formula (double         thickness,
                                     LaminaHeatFlow heat_flow,
                                     double         emissivity_1,
                                     double         emissivity_2)
{
  return lamina_air_space_resistance (thickness, heat_flow, emissivity_1, emissivity_2,
                                      NAN, NAN, AIR_MEAN_TEMPERATURE);
}

gboolean
lamina_air_layer_resistance (double         thickness,
                             LaminaHeatFlow heat_flow,
                             double         emissivity_1,
                             double         emissivity_2,
                             double        *resistance,
                             GError       **error)
{
  return lamina_air_layer_resistance_sized (thickness, NAN, heat_flow, emissivity_1, emissivity_2,
                                            resistance, error);
}

gboolean
lamina_air_layer_resistance_sized (double         thickness,
                                   double         width,
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
  if (emissivity_1 >= HIGH_EMISSIVITY && emissivity_2 >= HIGH_EMISSIVITY
      && !is_small_space (thickness, width))
    *resistance = lamina_air_layer_resistance_table (thickness, heat_flow);
  else
    *resistance = lamina_air_space_resistance (thickness, heat_flow, emissivity_1, emissivity_2,
                                               width, NAN, AIR_MEAN_TEMPERATURE);
  return TRUE;
}
