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
