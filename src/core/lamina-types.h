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

/* Shape of a tapered layer on plan, EN ISO 6946:2017 Annex E: a
 * rectangle sloping one way, or a triangle whose apex is the thickest or
 * the thinnest point. */
typedef enum
{
  LAMINA_TAPER_NONE,
  LAMINA_TAPER_RECTANGLE,
  LAMINA_TAPER_APEX_THICK,
  LAMINA_TAPER_APEX_THIN,
  LAMINA_N_TAPERS
} LaminaTaper;

/* Ground floors, EN ISO 13370:2017 clause 9. */
typedef enum
{
  LAMINA_GROUND_SLAB,       /* slab on ground (9.1) */
  LAMINA_GROUND_SUSPENDED,  /* suspended floor over a ventilated space (9.3) */
  LAMINA_GROUND_BASEMENT,   /* floor of a heated basement (9.4) */
  LAMINA_N_GROUND_KINDS
} LaminaGroundKind;

/* Soil classes, EN ISO 13370:2017 Table 1 (from memory). */
typedef enum
{
  LAMINA_SOIL_UNKNOWN,      /* λ 2.0 is used, and said so */
  LAMINA_SOIL_CLAY_SILT,    /* 1.5 W/(m·K) */
  LAMINA_SOIL_SAND_GRAVEL,  /* 2.0 */
  LAMINA_SOIL_ROCK,         /* 3.5, homogeneous rock */
  LAMINA_N_SOILS
} LaminaSoil;

/* Edge insulation of a slab on ground, EN ISO 13370:2017 Annex B. */
typedef enum
{
  LAMINA_EDGE_NONE,
  LAMINA_EDGE_HORIZONTAL,
  LAMINA_EDGE_VERTICAL,
  LAMINA_N_EDGES
} LaminaEdge;

/* An unheated space beyond the outer surface, EN ISO 6946:2017 6.10. */
typedef enum
{
  LAMINA_UNHEATED_NONE,
  LAMINA_UNHEATED_ROOF_SPACE,   /* Ru from the table by roof type */
  LAMINA_UNHEATED_OTHER,        /* Ru from areas and air change */
  LAMINA_N_UNHEATED_KINDS
} LaminaUnheatedKind;

/* Roof types of the roof-space table, EN ISO 6946:2017 Table 9 (2007:
 * Table 3), from memory. */
typedef enum
{
  LAMINA_ROOF_TILES_BARE,       /* tiles, no felt, boards or similar: 0.06 */
  LAMINA_ROOF_TILES_FELT,       /* sheeted, or tiles on felt or boards: 0.2 */
  LAMINA_ROOF_LOW_EMISSIVITY,   /* as above, low-emissivity underside: 0.3 */
  LAMINA_ROOF_BOARDS_FELT,      /* roof lined with boards and felt: 0.3 */
  LAMINA_N_ROOF_TYPES
} LaminaRoofType;

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

const char *lamina_taper_to_string       (LaminaTaper     value);
gboolean    lamina_taper_from_string     (const char     *name,
                                          LaminaTaper    *value);
const char *lamina_ground_kind_to_string (LaminaGroundKind value);
gboolean    lamina_ground_kind_from_string (const char       *name,
                                            LaminaGroundKind *value);
const char *lamina_soil_to_string        (LaminaSoil      value);
gboolean    lamina_soil_from_string      (const char     *name,
                                          LaminaSoil     *value);
const char *lamina_edge_to_string        (LaminaEdge      value);
gboolean    lamina_edge_from_string      (const char     *name,
                                          LaminaEdge     *value);
const char *lamina_unheated_kind_to_string (LaminaUnheatedKind value);
gboolean    lamina_unheated_kind_from_string (const char         *name,
                                              LaminaUnheatedKind *value);
const char *lamina_roof_type_to_string   (LaminaRoofType  value);
gboolean    lamina_roof_type_from_string (const char     *name,
                                          LaminaRoofType *value);

/* The heat-flow direction an element takes when none is given: walls and
 * partitions horizontal, roofs and ceilings upward, floors downward. */
LaminaHeatFlow lamina_element_default_heat_flow (LaminaElement element);

G_END_DECLS
