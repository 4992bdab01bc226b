/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-types.h"

#include <string.h>

static const char *const element_names[] = {
  "wall", "roof", "floor", "ceiling", "partition",
};
static const char *const heat_flow_names[] = {
  "upward", "horizontal", "downward",
};
static const char *const outer_side_names[] = {
  "outdoor", "indoor",
};
static const char *const category_names[] = {
  "other", "insulation", "masonry", "concrete", "timber", "board",
  "membrane", "metal", "plaster", "stone", "glass", "air",
};
static const char *const air_kind_names[] = {
  "unventilated", "slightly-ventilated", "well-ventilated",
};
static const char *const status_names[] = {
  "draft", "checked", "approved",
};
static const char *const taper_names[] = {
  "none", "rectangle", "apex-thick", "apex-thin",
};
static const char *const ground_kind_names[] = {
  "slab", "suspended", "basement",
};
static const char *const soil_names[] = {
  "unknown", "clay-silt", "sand-gravel", "rock",
};
static const char *const edge_names[] = {
  "none", "horizontal", "vertical",
};
static const char *const unheated_kind_names[] = {
  "none", "roof-space", "other",
};
static const char *const roof_type_names[] = {
  "tiles-bare", "tiles-felt", "low-emissivity", "boards-felt",
};

G_STATIC_ASSERT (G_N_ELEMENTS (taper_names) == LAMINA_N_TAPERS);
G_STATIC_ASSERT (G_N_ELEMENTS (ground_kind_names) == LAMINA_N_GROUND_KINDS);
G_STATIC_ASSERT (G_N_ELEMENTS (soil_names) == LAMINA_N_SOILS);
G_STATIC_ASSERT (G_N_ELEMENTS (edge_names) == LAMINA_N_EDGES);
G_STATIC_ASSERT (G_N_ELEMENTS (unheated_kind_names) == LAMINA_N_UNHEATED_KINDS);
G_STATIC_ASSERT (G_N_ELEMENTS (roof_type_names) == LAMINA_N_ROOF_TYPES);
G_STATIC_ASSERT (G_N_ELEMENTS (element_names) == LAMINA_N_ELEMENTS);
G_STATIC_ASSERT (G_N_ELEMENTS (heat_flow_names) == LAMINA_N_HEAT_FLOWS);
G_STATIC_ASSERT (G_N_ELEMENTS (outer_side_names) == LAMINA_N_OUTER_SIDES);
G_STATIC_ASSERT (G_N_ELEMENTS (category_names) == LAMINA_N_CATEGORIES);
G_STATIC_ASSERT (G_N_ELEMENTS (air_kind_names) == LAMINA_N_AIR_KINDS);
G_STATIC_ASSERT (G_N_ELEMENTS (status_names) == LAMINA_N_STATUSES);

static gboolean
lookup_name (const char *const *names,
             guint              n_names,
             const char        *name,
             int               *value)
{
  if (name == NULL)
    return FALSE;
  for (guint i = 0; i < n_names; i++)
    {
      if (strcmp (names[i], name) == 0)
        {
          *value = (int) i;
          return TRUE;
        }
    }
  return FALSE;
}

#define DEFINE_NAMES(type, prefix, table, count)                        \
  const char *                                                          \
  prefix##_to_string (type value)                                       \
  {                                                                     \
    g_return_val_if_fail ((guint) value < count, NULL);                 \
    return table[value];                                                \
  }                                                                     \
  gboolean                                                              \
  prefix##_from_string (const char *name,                               \
                        type       *value)                              \
  {                                                                     \
    int v;                                                              \
    if (!lookup_name (table, count, name, &v))                          \
      return FALSE;                                                     \
    *value = (type) v;                                                  \
    return TRUE;                                                        \
  }

DEFINE_NAMES (LaminaElement, lamina_element, element_names, LAMINA_N_ELEMENTS)
DEFINE_NAMES (LaminaHeatFlow, lamina_heat_flow, heat_flow_names, LAMINA_N_HEAT_FLOWS)
DEFINE_NAMES (LaminaOuterSide, lamina_outer_side, outer_side_names, LAMINA_N_OUTER_SIDES)
DEFINE_NAMES (LaminaCategory, lamina_category, category_names, LAMINA_N_CATEGORIES)
DEFINE_NAMES (LaminaAirKind, lamina_air_kind, air_kind_names, LAMINA_N_AIR_KINDS)
DEFINE_NAMES (LaminaStatus, lamina_status, status_names, LAMINA_N_STATUSES)
DEFINE_NAMES (LaminaTaper, lamina_taper, taper_names, LAMINA_N_TAPERS)
DEFINE_NAMES (LaminaGroundKind, lamina_ground_kind, ground_kind_names, LAMINA_N_GROUND_KINDS)
DEFINE_NAMES (LaminaSoil, lamina_soil, soil_names, LAMINA_N_SOILS)
DEFINE_NAMES (LaminaEdge, lamina_edge, edge_names, LAMINA_N_EDGES)
DEFINE_NAMES (LaminaUnheatedKind, lamina_unheated_kind, unheated_kind_names, LAMINA_N_UNHEATED_KINDS)
DEFINE_NAMES (LaminaRoofType, lamina_roof_type, roof_type_names, LAMINA_N_ROOF_TYPES)

LaminaHeatFlow
lamina_element_default_heat_flow (LaminaElement element)
{
  switch (element)
    {
    case LAMINA_ELEMENT_ROOF:
    case LAMINA_ELEMENT_CEILING:
      return LAMINA_HEAT_FLOW_UPWARD;
    case LAMINA_ELEMENT_FLOOR:
      return LAMINA_HEAT_FLOW_DOWNWARD;
    case LAMINA_ELEMENT_WALL:
    case LAMINA_ELEMENT_PARTITION:
    case LAMINA_N_ELEMENTS:
    default:
      return LAMINA_HEAT_FLOW_HORIZONTAL;
    }
}
