/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-calc.h: thermal resistance and transmittance of a construction by
 * EN ISO 6946:2017.  Pure functions of the model; no I/O. */
#pragma once

#include <glib-object.h>

#include "lamina-construction.h"
#include "lamina-error.h"
#include "lamina-ground.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_WARNING_RATIO_OUT_OF_RANGE,   /* R'T/R''T > 1.5 (6.7.2.1) */
  LAMINA_WARNING_METAL_BRIDGED_INSULATION, /* outside the scope (clause 1) */
  LAMINA_WARNING_VENT_CLASS,           /* declared class differs from Av */
  LAMINA_WARNING_LAYERS_DISREGARDED,   /* outside a well-ventilated layer */
  LAMINA_WARNING_CORRECTION_SMALL,     /* ΔU < 3 % of U (F.1) */
  LAMINA_WARNING_FASTENER_LOW_CONDUCTIVITY, /* no fastener correction (F.3): λf < 1,
                                             * or ties across an empty cavity */
  LAMINA_WARNING_TARGET_NOT_MET,
  LAMINA_WARNING_SOIL_ASSUMED,         /* λ of unknown soil (EN ISO 13370) */
  LAMINA_WARNING_GROUND,               /* U with the ground for one plan */
  LAMINA_WARNING_TAPERED,              /* U is the area mean (Annex E) */
  LAMINA_WARNING_UNHEATED_SPACE,       /* Ru included (6.10) */
} LaminaWarningKind;

typedef struct
{
  LaminaWarningKind kind;
  int               layer;     /* 1-based layer number, 0 for the whole */
  char             *message;   /* full sentence, translated */
} LaminaWarning;

typedef struct
{
  double   thickness;          /* mm */
  double   resistance;         /* m²·K/W; equivalent (lower-limit) R if bridged */
  gboolean bridged;
  gboolean disregarded;        /* outside a well-ventilated air layer */
  double   temperature_inner;  /* °C at the inner face, design conditions */
  double   temperature_outer;  /* °C at the outer face */
  /* This layer's share of the Annex F corrections, W/(m²·K) (0 when it
   * has none): the sheet itemises ΔU by layer. */
  double   delta_u_air_gaps;
  double   delta_u_fasteners;
  double   delta_u_inverted_roof;
} LaminaLayerResult;

typedef struct
{
  LaminaHeatFlow     heat_flow;
  double             rsi;           /* m²·K/W */
  double             rse;
  double             r_upper;       /* R'T, includes Rsi and Rse */
  double             r_lower;       /* R''T */
  double             r_total;       /* RT */
  double             relative_error;/* e = (R'T − R''T) / (2 RT) */
  double             u;             /* 1 / RT, W/(m²·K) */
  double             delta_u_air_gaps;
  double             delta_u_fasteners;
  double             delta_u_inverted_roof;
  double             delta_u;       /* sum of the three */
  double             u_corrected;   /* U + ΔU */
  double             thickness;     /* mm, all layers */
  guint              n_sections;    /* parallel heat-flow sections */
  double             surface_temperature_inner; /* °C */
  double             surface_temperature_outer;
  double             inside_temperature;
  double             outside_temperature;
  gboolean           has_target;
  gboolean           target_met;    /* u_corrected ≤ target_u */
  guint              n_layers;
  LaminaLayerResult *layers;
  GPtrArray         *warnings;      /* LaminaWarning* */

  /* Annex E: with a tapered layer, r_upper, r_lower, r_total and the
   * temperatures are those at its thin end (RT = R0) and u is the area
   * mean over the plan. */
  gboolean           tapered;
  guint              tapered_layer; /* 1-based */
  double             tapered_r0;
  double             tapered_r1;
  double             u_thin_end;    /* 1/R0 */
  double             u_thick_end;   /* 1/(R0 + R1) */
  /* 6.10: Ru of the unheated space outside, included in the totals. */
  double             r_unheated;
  /* Annex D: air layers taken at the ΔT of the temperature profile. */
  guint              air_iterations;
  /* EN ISO 13370: the floor with the ground for the stated plan. */
  gboolean           has_ground;
  LaminaGroundResult ground;
} LaminaResult;

#define LAMINA_TYPE_RESULT (lamina_result_get_type ())
GType         lamina_result_get_type (void) G_GNUC_CONST;
LaminaResult *lamina_result_copy     (const LaminaResult *result);
void          lamina_result_free     (LaminaResult       *result);
gboolean      lamina_result_has_warning (const LaminaResult *result,
                                         LaminaWarningKind   kind);
/* TRUE for what the method does as a matter of course and only needs
 * saying (layers disregarded outside a well-ventilated layer, a small or
 * no fastener correction): shown under "Notes", not "Warnings". */
gboolean      lamina_warning_kind_is_note (LaminaWarningKind kind);

/* Validates @construction and calculates it.  Returns NULL with @error set
 * (LAMINA_CALC_ERROR) when a value is invalid or the construction is
 * outside what the method covers. */
LaminaResult *lamina_calculate       (const LaminaConstruction *construction,
                                      GError                  **error);

/* EN ISO 6946:2017 6.8, Table 7: conventional surface resistances. */
double        lamina_surface_resistance_inside  (LaminaHeatFlow heat_flow);
double        lamina_surface_resistance_outside (LaminaHeatFlow heat_flow);

/* EN ISO 6946:2017 Annex C: surface resistance from the coefficients,
 * Rs = 1 / (hc + ε·hr0), hr0 = 4σTm³ (Tm in K). */
double        lamina_radiative_coefficient      (double         mean_temperature);
double        lamina_surface_resistance_from_coefficients (double hc,
                                                           double emissivity,
                                                           double mean_temperature);

/* The thickest air layer EN ISO 6946:2017 6.9 covers, mm. */
#define LAMINA_AIR_LAYER_MAX_THICKNESS 300.0

/* EN ISO 6946:2017 6.9.2, Table 8: an unventilated air layer with both
 * faces of emissivity ≥ 0.8; linear interpolation by thickness (mm). */
double        lamina_air_layer_resistance_table (double         thickness,
                                                 LaminaHeatFlow heat_flow);
/* EN ISO 6946:2017 Annex D (D.2): Rg = 1 / (ha + E·hr0) with the
 * intersurface emittance E = 1 / (1/ε1 + 1/ε2 − 1); ΔT ≤ 5 K, Tm 10 °C. */
double        lamina_air_layer_resistance_formula (double         thickness,
                                                   LaminaHeatFlow heat_flow,
                                                   double         emissivity_1,
                                                   double         emissivity_2);
/* The resistance of an unventilated air layer: the table when both faces
 * have ε ≥ 0.8, the annex formula otherwise.  Thickness above 300 mm is
 * refused (LAMINA_CALC_ERROR_UNSUPPORTED). */
gboolean      lamina_air_layer_resistance       (double         thickness,
                                                 LaminaHeatFlow heat_flow,
                                                 double         emissivity_1,
                                                 double         emissivity_2,
                                                 double        *resistance,
                                                 GError       **error);

/* As lamina_air_layer_resistance() for a space of width @width (mm, NAN
 * for a wide layer): below 10 times its thickness Annex D's small-space
 * formula applies (D.3). */
gboolean      lamina_air_layer_resistance_sized (double         thickness,
                                                 double         width,
                                                 LaminaHeatFlow heat_flow,
                                                 double         emissivity_1,
                                                 double         emissivity_2,
                                                 double        *resistance,
                                                 GError       **error);
/* Annex D in full: thickness and width in mm (width NAN: a wide layer),
 * ΔT across the space in K (NAN or ≤ 5: the ΔT ≤ 5 K coefficients) and
 * its mean temperature in °C. */
double        lamina_air_space_resistance       (double         thickness,
                                                 LaminaHeatFlow heat_flow,
                                                 double         emissivity_1,
                                                 double         emissivity_2,
                                                 double         width,
                                                 double         delta_t,
                                                 double         mean_temperature);

/* Annex C: Rsi from hci by flow direction and the surface emissivity, hr0
 * at 20 °C; Rse from hce = 4 + 4v and the emissivity, hr0 at 0 °C. */
double        lamina_surface_resistance_inside_annex  (LaminaHeatFlow heat_flow,
                                                       double         emissivity);
double        lamina_surface_resistance_outside_annex (double         wind_speed,
                                                       double         emissivity);
/* The construction's Rsi and Rse: Table 7, or Annex C when it states its
 * own wind speed or emissivities; Rse = Rsi towards another indoor space. */
void          lamina_surface_resistances        (const LaminaConstruction *construction,
                                                 double                   *rsi,
                                                 double                   *rse);

/* EN ISO 6946:2017 Annex E: area-mean U of one tapered area, R0 the rest
 * of the element with Rsi, Rse and the thin end, R1 the wedge alone. */
double        lamina_tapered_u                  (LaminaTaper    shape,
                                                 double         r0,
                                                 double         r1);
typedef struct
{
  LaminaTaper shape;
  double      area;     /* m² */
  double      r0;
  double      r1;
} LaminaTaperArea;
/* E.4: several areas combined by area. */
double        lamina_tapered_u_combined         (const LaminaTaperArea *areas,
                                                 guint                  n_areas);

/* EN ISO 6946:2017 6.10: Ru of a roof space by roof type (Table 9), of
 * another unheated space from its areas and air change, and of the
 * construction's unheated space (0 for none). */
double        lamina_roof_space_resistance      (LaminaRoofType roof);
double        lamina_unheated_space_resistance  (double         inner_area,
                                                 double         outer_area,
                                                 double         outer_u,
                                                 double         air_change,
                                                 double         volume);
double        lamina_unheated_resistance        (const LaminaUnheated *unheated);

/* EN ISO 13370 for a catalogue floor: U with the ground at the B′ of
 * lamina_ground_table_b_prime (2, 4, 6, 8, 10, 15, 20 m), for the sheet and
 * the window, from a result that has_ground. */
#define LAMINA_GROUND_TABLE_ROWS 7
extern const double lamina_ground_table_b_prime[LAMINA_GROUND_TABLE_ROWS];
void          lamina_result_ground_table        (const LaminaConstruction *construction,
                                                 const LaminaResult       *result,
                                                 double                    u[LAMINA_GROUND_TABLE_ROWS]);

/* Display rounding: a U to two significant figures (common practice
 * for reporting U; intermediate values stay unrounded). */
double        lamina_round_significant          (double value,
                                                 int    digits);

/* Room for lamina_format_u's text. */
#define LAMINA_U_TEXT_SIZE 32
/* The one way a U is written for people (window, lamina-cli, sheets): two
 * significant figures with the trailing zero kept ("0.20", not "0.2";
 * "0.095", "1.2", "12"), in the C library's LC_NUMERIC notation (a
 * decimal comma in Danish once setlocale has run).  "0.00" for 0 and
 * two decimals for a negative value; an en dash for NaN or infinity.
 * Writes into @buffer (LAMINA_U_TEXT_SIZE bytes) and returns it. */
const char   *lamina_format_u                   (char   *buffer,
                                                 double  u);
/* A U beside a limit: two significant figures, or as many more (up to
 * six) as it takes to show on which side of @limit it lies ("0.1801"
 * against 0.18, never "0.18 exceeds 0.18").  Same notation as above. */
const char   *lamina_format_u_against           (char   *buffer,
                                                 double  u,
                                                 double  limit);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaResult, lamina_result_free)

G_END_DECLS
