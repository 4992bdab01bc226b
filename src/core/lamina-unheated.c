/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Unheated spaces as a thermal resistance Ru, EN ISO 6946:2017 6.10
 * (2007: 5.4), from memory.  The space is treated as one homogeneous
 * layer outside the element; Rse still applies beyond it. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc.h"

#include <math.h>

/* 6.10.2, Table 9 (2007: Table 3): Ru of a naturally ventilated roof space
 * above a flat, insulated ceiling, m²·K/W.  Includes the ventilated space
 * and the pitched roof, not Rse. */
static const double roof_space_ru[LAMINA_N_ROOF_TYPES] = {
  0.06,   /* tiled roof with no felt, boards or similar */
  0.2,    /* sheeted roof, or tiles on felt or boards */
  0.3,    /* as above with a low-emissivity surface at the roof underside */
  0.3,    /* roof lined with boards and felt */
};

/* Air: ρc = 0.33 W·h/(m³·K). */
#define AIR_HEAT_CAPACITY 0.33

double
lamina_roof_space_resistance (LaminaRoofType roof)
{
  g_return_val_if_fail ((guint) roof < LAMINA_N_ROOF_TYPES, NAN);
  return roof_space_ru[roof];
}

/* 6.10.3: Ru = Ai / (Σ Ae,k Ue,k + 0.33 n V) */
double
lamina_unheated_space_resistance (double inner_area,
                                  double outer_area,
                                  double outer_u,
                                  double air_change,
                                  double volume)
{
  return inner_area / (outer_area * outer_u + AIR_HEAT_CAPACITY * air_change * volume);
}

double
lamina_unheated_resistance (const LaminaUnheated *unheated)
{
  switch (unheated->kind)
    {
    case LAMINA_UNHEATED_ROOF_SPACE:
      return lamina_roof_space_resistance (unheated->roof);
    case LAMINA_UNHEATED_OTHER:
      return lamina_unheated_space_resistance (unheated->inner_area, unheated->outer_area,
                                               unheated->outer_u, unheated->air_change,
                                               unheated->volume);
    case LAMINA_UNHEATED_NONE:
    case LAMINA_N_UNHEATED_KINDS:
    default:
      return 0.0;
    }
}
