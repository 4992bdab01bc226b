/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-moisture.h: surface and interstitial condensation of a
 * construction by EN ISO 13788:2012 (monthly method).  Pure functions of the
 * model; no I/O.
 *
 * Readings fixed for the product (the standard leaves them to the user):
 * - a bridged layer enters through its largest part, for R and for sd;
 * - a well ventilated air layer and every layer outside it are dropped, with
 *   Rse = Rsi and the external vapour pressure at that air layer
 *   (EN ISO 6946:2017 6.9.4 for the thermal side);
 * - only the planes between layers are tested for condensation (not the
 *   surfaces, which the surface check covers, nor planes inside a layer). */
#pragma once

#include <glib-object.h>

#include "lamina-calc.h"
#include "lamina-climate.h"

G_BEGIN_DECLS

/* Common practice: an office limit on the largest accumulation in a year
 * that still dries out. */
#define LAMINA_MOISTURE_DEFAULT_LIMIT 0.5      /* kg/m² */
/* The largest limit an office may set: a guard against a slip of the
 * keyboard, not a physical bound. */
#define LAMINA_MOISTURE_LIMIT_MAX     1000.0   /* kg/m² */
/* TRUE for a limit an office may set: above 0, at most the maximum. */
#define LAMINA_MOISTURE_LIMIT_IS_VALID(limit) ((limit) > 0 && (limit) <= LAMINA_MOISTURE_LIMIT_MAX)
/* EN ISO 13788:2012 5.2: the surface criterion φsi ≤ 0.8 for mould, with
 * Rsi = 0.25 m²·K/W for the surface check (4.3, from memory). */
#define LAMINA_MOISTURE_MOULD_HUMIDITY 0.8
#define LAMINA_MOISTURE_SURFACE_RSI    0.25
/* δ0, the vapour permeability of still air, kg/(m·s·Pa) (EN ISO 13788:2012
 * 3.1/4.1, from memory: 2×10⁻¹⁰). */
#define LAMINA_VAPOUR_PERMEABILITY_AIR 2e-10

typedef enum
{
  LAMINA_MOISTURE_WARNING_SURFACE,          /* fRsi below fRsi,min */
  LAMINA_MOISTURE_WARNING_CONDENSATION,     /* interstitial condensation occurs */
  LAMINA_MOISTURE_WARNING_NOT_DRYING,       /* still wet after the 12 months */
  LAMINA_MOISTURE_WARNING_OVER_LIMIT,       /* the maximum exceeds the office limit */
  LAMINA_MOISTURE_WARNING_LAYERS_DROPPED,   /* outside a well ventilated layer */
  LAMINA_MOISTURE_WARNING_METHOD,           /* the method's limits: always given */
} LaminaMoistureWarningKind;

typedef struct
{
  LaminaMoistureWarningKind kind;
  char                     *message;  /* full sentence, translated */
} LaminaMoistureWarning;

/* One month of the interstitial calculation along the section.  Point j
 * (0…n_points−1) is the inner surface (0), the planes between the layers
 * that count, and the outer surface (last). */
typedef struct
{
  double *temperature;   /* °C at each point */
  double *saturation;    /* psat, Pa */
  double *pressure;      /* actual vapour pressure, Pa */
  double *accumulation;  /* kg/m² at each point at the month's end */
} LaminaMoistureMonth;

typedef struct
{
  /* Inputs as used. */
  double   inside_temperature[LAMINA_MONTHS];  /* θi, °C */
  double   outside_temperature[LAMINA_MONTHS]; /* θe */
  double   inside_pressure[LAMINA_MONTHS];     /* pi, Pa */
  double   outside_pressure[LAMINA_MONTHS];    /* pe */
  int      humidity_class;                     /* 0 for a fixed φi */
  double   inside_humidity;                    /* φi or NAN */
  double   limit;                              /* kg/m² */

  /* Surface (clause 5). */
  double   f_rsi;                              /* 1 − 0.25·U* */
  double   u_star;                             /* W/(m²·K) with Rsi = 0.25 */
  double   f_rsi_min_month[LAMINA_MONTHS];     /* NAN where θe ≥ θi */
  double   f_rsi_min;                          /* of the critical month; NAN if none */
  int      critical_month;                     /* 1–12, 0 if none */
  gboolean surface_passes;

  /* Interstitial (clause 7). */
  gboolean condensation;
  double   accumulation[LAMINA_MONTHS];        /* kg/m², all planes, at month's end */
  double   max_accumulation;
  int      max_month;                          /* 1–12, 0 if none */
  int      start_month;                        /* 1–12, 0 if none */
  gboolean dries_out;
  gboolean over_limit;

  /* The section as calculated: layers that count, points between them. */
  guint    n_layers;                           /* layers that count */
  guint    n_points;                           /* n_layers + 1 */
  guint   *layer_index;                        /* 0-based construction layer of each */
  double  *position;                           /* mm from the inner surface */
  double  *sd;                                 /* cumulative sd, m */
  double  *resistance;                         /* R of each layer that counts */
  double   rsi, rse;
  LaminaMoistureMonth months[LAMINA_MONTHS];

  GPtrArray *warnings;                         /* LaminaMoistureWarning* */
} LaminaMoistureResult;

#define LAMINA_TYPE_MOISTURE_RESULT (lamina_moisture_result_get_type ())
GType                 lamina_moisture_result_get_type (void) G_GNUC_CONST;
LaminaMoistureResult *lamina_moisture_result_copy (const LaminaMoistureResult *result);
void                  lamina_moisture_result_free (LaminaMoistureResult       *result);
gboolean              lamina_moisture_result_has_warning (const LaminaMoistureResult *result,
                                                          LaminaMoistureWarningKind   kind);
/* Fails on the surface, or wet at the year's end, or above the limit. */
gboolean              lamina_moisture_result_fails (const LaminaMoistureResult *result);

/* Checks @construction (which must carry moisture settings) for @climate,
 * whose id must be the one the settings name.  @limit is the office's limit
 * on the largest accumulation, kg/m² (NAN: the default).  Returns NULL with
 * @error set (LAMINA_CALC_ERROR) when a value the method needs is missing,
 * naming the layer and material. */
LaminaMoistureResult *lamina_moisture_calculate (const LaminaConstruction *construction,
                                                 const LaminaClimate      *climate,
                                                 double                    limit,
                                                 GError                  **error);

/* The same with the climate data the construction carries
 * (settings->climate_data); INVALID when it has none. */
LaminaMoistureResult *lamina_moisture_calculate_own (const LaminaConstruction *construction,
                                                     double                    limit,
                                                     GError                  **error);

/* EN ISO 13788:2012 Annex E (E.1, E.2; from memory): saturated vapour
 * pressure, Pa, over water (θ ≥ 0 °C) and over ice (θ < 0 °C). */
double                lamina_saturation_pressure (double temperature);
/* Its inverse: the temperature at which psat = @pressure (Pa). */
double                lamina_saturation_temperature (double pressure);
/* EN ISO 13788:2012 Annex A: the internal vapour pressure excess Δp, Pa, of
 * humidity class @humidity_class (1–5) at mean external temperature @θe. */
double                lamina_humidity_class_excess (int    humidity_class,
                                                    double outside_temperature);

/* The interstitial (Glaser) calculation of one month on a given section:
 * cumulative sd @sd and psat @saturation at @n points, pi and pe at the
 * ends.  @accumulation (kg/m², length @n) holds the moisture at each plane at
 * the month's start and receives it at its end; @pressure receives the
 * vapour pressure line.  @seconds is the month's length.  Returns TRUE when
 * any plane takes up moisture this month. */
gboolean              lamina_glaser_month (guint         n,
                                           const double *sd,
                                           const double *saturation,
                                           double        inside_pressure,
                                           double        outside_pressure,
                                           double        seconds,
                                           double       *accumulation,
                                           double       *pressure);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaMoistureResult, lamina_moisture_result_free)

G_END_DECLS
