/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-calc.h: thermal resistance and transmittance of a construction by
 * EN ISO 6946:2017.  Pure functions of the model; no I/O. */
#pragma once

#include <glib-object.h>

#include "lamina-construction.h"
#include "lamina-error.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_WARNING_RATIO_OUT_OF_RANGE,   /* R'T/R''T > 1.5 (6.7.2.1) */
  LAMINA_WARNING_METAL_BRIDGED_INSULATION, /* outside the scope (clause 1) */
  LAMINA_WARNING_VENT_CLASS,           /* declared class differs from Av */
  LAMINA_WARNING_LAYERS_DISREGARDED,   /* outside a well-ventilated layer */
  LAMINA_WARNING_CORRECTION_SMALL,     /* ΔU < 3 % of U (F.1) */
  LAMINA_WARNING_FASTENER_LOW_CONDUCTIVITY, /* λf < 1: no correction (F.3) */
  LAMINA_WARNING_TARGET_NOT_MET,
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

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaResult, lamina_result_free)

G_END_DECLS
