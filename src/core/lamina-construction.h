/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-construction.h: a named construction (a layer build-up).
 *
 * Layers run from the inner surface to the outer surface.  Lengths in the
 * model are in millimetres, as architects give them; the physics converts
 * to metres.  "Not given" is NAN for numbers and NULL for strings. */
#pragma once

#include <glib-object.h>

#include "lamina-climate.h"
#include "lamina-material.h"
#include "lamina-types.h"

G_BEGIN_DECLS

/* A layer is at least a foil (0.01 mm) and at most 10 m thick, mm (common
 * practice). */
#define LAMINA_MIN_THICKNESS 0.01
#define LAMINA_MAX_THICKNESS 10000.0

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
  /* An air part's own faces and ventilation (EN ISO 6946:2017 6.9, Annex
   * D): unventilated or slightly ventilated; ε 0.9 unless given. */
  LaminaAirKind   air;
  double          emissivity_inner;
  double          emissivity_outer;
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
  /* A tapered layer (EN ISO 6946:2017 Annex E): a material layer whose
   * thickness runs from @thickness (thin end) to @thickness_max. */
  LaminaTaper       taper;
  double            thickness_max;     /* mm, or NAN */
  /* Width b of a small or divided air space (Annex D), mm, or NAN. */
  double            air_width;
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
  /* The climate's data as the construction was checked with (like a
   * layer's copy of its material); NULL until resolved from a library or
   * a catalogue.  Its id is @climate. */
  LaminaClimate *climate_data;
  int     line;
} LaminaMoistureSettings;
/* The building a ground floor sits in, EN ISO 13370:2017.  A catalogue
 * construction is the floor's build-up; this says for which plan its U
 * with the ground is stated.  NAN = not given. */
typedef struct
{
  LaminaGroundKind kind;
  double     area;                 /* A, m² */
  double     perimeter;            /* P, exposed perimeter, m */
  double     wall_thickness;       /* w, mm */
  double     soil_conductivity;    /* λ, W/(m·K); NAN: from @soil */
  LaminaSoil soil;
  double     underfloor_height;    /* h, m (suspended) */
  double     vent_area;            /* ε, m² per m of perimeter (suspended) */
  double     underfloor_wall_u;    /* Uw, W/(m²·K) (suspended) */
  double     wind_speed;           /* v, m/s at 10 m (suspended); NAN = 4 */
  double     shielding_factor;     /* fw (suspended); NAN = 0.05 */
  double     depth;                /* z, m below ground (basement) */
  double     basement_wall_resistance; /* Rw, m²·K/W (basement), or NAN */
  LaminaEdge edge;                 /* edge insulation, Annex B (slab) */
  double     edge_size;            /* D, m: width or depth */
  double     edge_thickness;       /* dn, mm */
  double     edge_resistance;      /* Rn, m²·K/W */
  int        line;
} LaminaGround;

/* An unheated space beyond the outer surface, treated as a resistance Ru
 * (EN ISO 6946:2017 6.10). */
typedef struct
{
  LaminaUnheatedKind kind;
  LaminaRoofType     roof;         /* roof space */
  double             inner_area;   /* Ai, m²: between heated and unheated */
  double             outer_area;   /* Ae, m²: unheated space to outside */
  double             outer_u;      /* Ue, W/(m²·K), area-weighted mean */
  double             air_change;   /* n, 1/h */
  double             volume;       /* V, m³ */
  int                line;
} LaminaUnheated;

/* Surface and air-space conditions of EN ISO 6946:2017 Annexes C and D;
 * NAN = the conventional values of Table 7. */
typedef struct
{
  double   wind_speed;             /* v, m/s */
  double   emissivity_inside;      /* ε of the inner surface */
  double   emissivity_outside;     /* ε of the outer surface */
  gboolean air_from_profile;       /* air layers by ΔT of the profile (D.2) */
  int      line;
} LaminaSurfaceConditions;

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

  /* The rest of the method (issue 14): plain values, copied with the
   * construction. */
  gboolean                has_ground;
  LaminaGround            ground;
  LaminaUnheated          unheated;
  LaminaSurfaceConditions surfaces;

  /* Library data: kept by the store, carried by the catalogue XML. */
  LaminaStatus     status;
  int              revision;           /* 0 while not stored */
  char            *modified_by;
  char            *modified_at;        /* ISO 8601 */
  char            *checked_by;
  char            *checked_at;
  char            *approved_by;
  char            *approved_at;
  /* Of the approval in force, from the library's review records (not
   * carried by the XML): the policy it was made under ("four-eyes",
   * "single") and the reason given to approve a result outside the
   * method's scope without a 2-D check; NULL when none. */
  char            *approval_policy;
  char            *approval_reason;
  /* The review record a construction was imported with, in words
   * ("approved in the source library by … on …"): another library's
   * reviewers, not this one's.  Kept with the imported revision (the
   * store's JSON body), dropped by the next edit; not part of the
   * content (lamina_construction_equal_content ignores it). */
  char            *source_review;
  /* A token that changes with every stored state of a revision (the
   * store's JSON body): a draft updated in place keeps its number, so a
   * save names the state it was based on by this.  NULL when unknown. */
  char            *draft_stamp;

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

/* Defaults: a slab on ground with nothing given, no unheated space,
 * conventional surfaces. */
void                lamina_ground_init        (LaminaGround         *ground);
void                lamina_unheated_init      (LaminaUnheated       *unheated);
void                lamina_surface_conditions_init (LaminaSurfaceConditions *surfaces);
gboolean            lamina_surface_conditions_is_default (const LaminaSurfaceConditions *surfaces);
/* TRUE when @layer is tapered (Annex E). */
gboolean            lamina_layer_is_tapered   (const LaminaLayer    *layer);

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
