/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-types.h: the enumerations of the construction model and their
 * names in the catalogue vocabulary. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

typedef enum
{
  LAMINA_ELEMENT_WALL,
  LAMINA_ELEMENT_ROOF,
  LAMINA_ELEMENT_FLOOR,
  LAMINA_ELEMENT_CEILING,
  LAMINA_ELEMENT_PARTITION,
  LAMINA_N_ELEMENTS
} LaminaElement;

/* Direction of heat flow, EN ISO 6946:2017 6.8 (Table 7): "horizontal"
 * covers flow within ±30° of the horizontal plane. */
typedef enum
{
  LAMINA_HEAT_FLOW_UPWARD,
  LAMINA_HEAT_FLOW_HORIZONTAL,
  LAMINA_HEAT_FLOW_DOWNWARD,
  LAMINA_N_HEAT_FLOWS
} LaminaHeatFlow;

/* What the outer surface faces. */
typedef enum
{
  LAMINA_OUTER_SIDE_OUTDOOR,
  LAMINA_OUTER_SIDE_INDOOR,
  LAMINA_N_OUTER_SIDES
} LaminaOuterSide;

/* Material categories: used for drawing (hatch patterns), grouping and a
 * few method checks (insulation bridged by metal). */
typedef enum
{
  LAMINA_CATEGORY_OTHER,
  LAMINA_CATEGORY_INSULATION,
  LAMINA_CATEGORY_MASONRY,
  LAMINA_CATEGORY_CONCRETE,
  LAMINA_CATEGORY_TIMBER,
  LAMINA_CATEGORY_BOARD,
  LAMINA_CATEGORY_MEMBRANE,
  LAMINA_CATEGORY_METAL,
  LAMINA_CATEGORY_PLASTER,
  LAMINA_CATEGORY_STONE,
  LAMINA_CATEGORY_GLASS,
  LAMINA_CATEGORY_AIR,
  LAMINA_N_CATEGORIES
} LaminaCategory;

/* Air layer ventilation classes, EN ISO 6946:2017 6.9. */
typedef enum
{
  LAMINA_AIR_UNVENTILATED,
  LAMINA_AIR_SLIGHTLY_VENTILATED,
  LAMINA_AIR_WELL_VENTILATED,
  LAMINA_N_AIR_KINDS
} LaminaAirKind;

typedef enum
{
  LAMINA_LAYER_MATERIAL,   /* homogeneous, R = d/λ */
  LAMINA_LAYER_RESISTANCE, /* declared thermal resistance */
  LAMINA_LAYER_AIR,        /* air layer */
  LAMINA_LAYER_BRIDGED,    /* inhomogeneous: made of parts */
  LAMINA_N_LAYER_KINDS
} LaminaLayerKind;

/* Review status of a construction in the office library. */
typedef enum
{
  LAMINA_STATUS_DRAFT,
  LAMINA_STATUS_CHECKED,
  LAMINA_STATUS_APPROVED,
  LAMINA_N_STATUSES
} LaminaStatus;

/* Names as used in the catalogue XML (urn:x-lamina:catalogue:1), the CLI
 * and JSON.  _from_string returns FALSE for an unknown name. */
const char *lamina_element_to_string     (LaminaElement   value);
gboolean    lamina_element_from_string   (const char     *name,
                                          LaminaElement  *value);
const char *lamina_heat_flow_to_string   (LaminaHeatFlow  value);
gboolean    lamina_heat_flow_from_string (const char     *name,
                                          LaminaHeatFlow *value);
const char *lamina_outer_side_to_string  (LaminaOuterSide value);
gboolean    lamina_outer_side_from_string (const char      *name,
                                           LaminaOuterSide *value);
const char *lamina_category_to_string    (LaminaCategory  value);
gboolean    lamina_category_from_string  (const char     *name,
                                          LaminaCategory *value);
const char *lamina_air_kind_to_string    (LaminaAirKind   value);
gboolean    lamina_air_kind_from_string  (const char     *name,
                                          LaminaAirKind  *value);
const char *lamina_status_to_string      (LaminaStatus    value);
gboolean    lamina_status_from_string    (const char     *name,
                                          LaminaStatus   *value);

/* The heat-flow direction an element takes when none is given: walls and
 * partitions horizontal, roofs and ceilings upward, floors downward. */
LaminaHeatFlow lamina_element_default_heat_flow (LaminaElement element);

G_END_DECLS
