/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-construction.h: a named construction (a layer build-up).
 *
 * Layers run from the inner surface to the outer surface.  Lengths in the
 * model are in millimetres, as architects give them; the physics converts
 * to metres.  "Not given" is NAN for numbers and NULL for strings. */
#pragma once

#include <glib-object.h>

#include "lamina-material.h"
#include "lamina-types.h"

G_BEGIN_DECLS

/* One part of a bridged layer: a material (or an air layer) over an area
 * fraction.  The fraction is given directly, or as width / spacing, or left
 * out (both NAN) by exactly one part of the layer, which then takes the
 * remainder.  Parts of different layers that name the same member line up
 * through the construction (the same stud through two layers). */
typedef struct
{
  LaminaMaterial *material;   /* owned; NULL for an air part */
  double          fraction;   /* 0–1, or NAN */
  double          width;      /* mm, or NAN */
  double          spacing;    /* mm, or NAN */
  char           *member;     /* framing member name, or NULL */
  int             line;       /* source line for messages, 0 if none */
} LaminaPart;

/* Corrections to U, EN ISO 6946:2017 Annex F, attached to the layer they
 * concern (the layer with the gaps, penetrated by the fasteners, or the
 * insulation above the waterproofing of an inverted roof). */
typedef struct
{
  gboolean has_air_gaps;
  int      air_gap_level;             /* 0, 1 or 2 (F.2) */

  gboolean has_fasteners;
  double   fastener_conductivity;     /* λf, W/(m·K) */
  double   fastener_cross_section;    /* Af, mm² */
  double   fasteners_per_square_metre;/* nf, 1/m² */
  double   fastener_penetration;      /* d1, mm, NAN = full penetration */

  gboolean has_inverted_roof;
  double   precipitation;             /* p, mm/day over the heating season */
  double   drainage_factor;           /* f */
} LaminaCorrections;

typedef struct
{
  LaminaLayerKind   kind;
  double            thickness;         /* d, mm */
  LaminaMaterial   *material;          /* owned; kind MATERIAL */
  double            resistance;        /* declared R, m²·K/W; kind RESISTANCE */
  LaminaAirKind     air;               /* kind AIR */
  double            vent_area;         /* Av, mm² per m or per m², or NAN */
  double            emissivity_inner;  /* ε of the face towards the inside */
  double            emissivity_outer;  /* ε of the face towards the outside */
  GPtrArray        *parts;             /* LaminaPart*, kind BRIDGED */
  LaminaCorrections corrections;
  double            sd;                /* declared sd, m (membranes, foils), or NAN: μ·d */
  char             *note;
  int               line;
} LaminaLayer;

/* A construction's moisture check by EN ISO 13788 (lamina-moisture.h): the
 * climate it is checked for and the inside conditions, either a humidity
 * class (Annex A) or a fixed relative humidity. */
typedef struct
{
  char   *climate;                     /* a LaminaClimate id */
  int     humidity_class;              /* 1–5, or 0 when inside_humidity is given */
  double  inside_humidity;             /* φi 0–1, or NAN */
  double  inside_temperature;          /* θi °C, or NAN: the construction's */
  int     line;
} LaminaMoistureSettings;

typedef struct
{
  char            *id;
  char            *code;               /* the office's short reference */
  char            *name;
  LaminaElement    element;
  LaminaHeatFlow   heat_flow;
  LaminaOuterSide  outer_side;
  char            *description;
  GPtrArray       *tags;               /* char* */
  GPtrArray       *layers;             /* LaminaLayer* */
  double           target_u;           /* W/(m²·K), or NAN */
  double           inside_temperature; /* °C, design condition */
  double           outside_temperature;/* °C, design condition */
  char            *notes;
  LaminaMoistureSettings *moisture;    /* owned; NULL: no moisture check */

  /* Library data: kept by the store, carried by the catalogue XML. */
  LaminaStatus     status;
  int              revision;           /* 0 while not stored */
  char            *modified_by;
  char            *modified_at;        /* ISO 8601 */
  char            *checked_by;
  char            *checked_at;
  char            *approved_by;
  char            *approved_at;

  int              line;
} LaminaConstruction;

#define LAMINA_DEFAULT_INSIDE_TEMPERATURE   20.0
#define LAMINA_DEFAULT_OUTSIDE_TEMPERATURE (-10.0)
#define LAMINA_DEFAULT_EMISSIVITY            0.9

#define LAMINA_TYPE_CONSTRUCTION (lamina_construction_get_type ())
GType               lamina_construction_get_type (void) G_GNUC_CONST;

LaminaPart         *lamina_part_new           (LaminaMaterial       *material,
                                               double                fraction);
LaminaPart         *lamina_part_new_framing   (LaminaMaterial       *material,
                                               double                width,
                                               double                spacing,
                                               const char           *member);
LaminaPart         *lamina_part_copy          (const LaminaPart     *part);
void                lamina_part_free          (LaminaPart           *part);
gboolean            lamina_part_is_air        (const LaminaPart     *part);
/* The part's own fraction, NAN for the remainder part. */
double              lamina_part_get_given_fraction (const LaminaPart *part);

/* The constructors take ownership of @material. */
LaminaLayer        *lamina_layer_new_material (double                thickness,
                                               LaminaMaterial       *material);
LaminaLayer        *lamina_layer_new_resistance (double              thickness,
                                                 double              resistance);
LaminaLayer        *lamina_layer_new_air      (double                thickness,
                                               LaminaAirKind         air);
LaminaLayer        *lamina_layer_new_bridged  (double                thickness);
void                lamina_layer_add_part     (LaminaLayer          *layer,
                                               LaminaPart           *part);
LaminaLayer        *lamina_layer_copy         (const LaminaLayer    *layer);
void                lamina_layer_free         (LaminaLayer          *layer);
gboolean            lamina_layer_equal        (const LaminaLayer    *a,
                                               const LaminaLayer    *b);
/* Resolved fraction of part @index (the remainder part gets 1 − Σ others). */
double              lamina_layer_get_part_fraction (const LaminaLayer *layer,
                                                    guint              index);
/* A name for messages and tables: the material, "air layer", … */
const char         *lamina_layer_get_label    (const LaminaLayer    *layer);

LaminaConstruction *lamina_construction_new   (const char           *id,
                                               const char           *name,
                                               LaminaElement         element);
LaminaConstruction *lamina_construction_copy  (const LaminaConstruction *construction);
void                lamina_construction_free  (LaminaConstruction   *construction);
void                lamina_construction_add_layer (LaminaConstruction *construction,
                                                   LaminaLayer        *layer);
void                lamina_construction_add_tag   (LaminaConstruction *construction,
                                                   const char         *tag);
LaminaMoistureSettings *lamina_moisture_settings_new  (const char                   *climate);
LaminaMoistureSettings *lamina_moisture_settings_copy (const LaminaMoistureSettings *settings);
void                lamina_moisture_settings_free (LaminaMoistureSettings *settings);
gboolean            lamina_moisture_settings_equal (const LaminaMoistureSettings *a,
                                                    const LaminaMoistureSettings *b);
/* Takes ownership of @settings (NULL removes the check). */
void                lamina_construction_set_moisture (LaminaConstruction     *construction,
                                                      LaminaMoistureSettings *settings);
/* Sum of the layer thicknesses, mm. */
double              lamina_construction_get_thickness (const LaminaConstruction *construction);
/* Same build-up, names, conditions and descriptive data; ignores the
 * library data (status, revision, who and when) and source lines. */
gboolean            lamina_construction_equal_content (const LaminaConstruction *a,
                                                       const LaminaConstruction *b);

/* Checks every value the method needs and names the layer, part and field
 * of the first one that is wrong (LAMINA_CALC_ERROR_INVALID).  @line, if
 * not NULL, receives the source line of the offending item (0 if none). */
gboolean            lamina_construction_validate (const LaminaConstruction *construction,
                                                  int                      *line,
                                                  GError                  **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaPart, lamina_part_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaLayer, lamina_layer_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaConstruction, lamina_construction_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaMoistureSettings, lamina_moisture_settings_free)

G_END_DECLS
