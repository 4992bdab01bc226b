/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-dynamic.h: dynamic thermal characteristics by EN ISO 13786:2017,
 * the heat transfer matrix method for a sinusoidal temperature variation
 * (period 24 h unless given).  Pure functions of the model. */
#pragma once

#include <complex.h>

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_DYNAMIC_PERIOD_HOURS 24.0

/* A 2×2 heat transfer matrix: (θ, q) on one side of a layer from (θ, q)
 * on the other, temperatures and heat flow densities as complex
 * amplitudes.  Layers are taken from the inner to the outer side. */
typedef struct
{
  double complex z11, z12, z21, z22;
} LaminaHeatMatrix;

/* EN ISO 13786:2017 6.3 (from memory): a homogeneous layer of @thickness m,
 * λ W/(m·K), ρ kg/m³, c J/(kg·K), for a period of @period_s seconds.  A
 * layer without heat capacity (ρc = 0) is a pure resistance d/λ. */
LaminaHeatMatrix lamina_heat_matrix_layer      (double thickness,
                                                double conductivity,
                                                double density,
                                                double specific_heat,
                                                double period_s);
/* A resistance without heat capacity (surface, air layer, membrane). */
LaminaHeatMatrix lamina_heat_matrix_resistance (double resistance);
/* @a · @b (apply @b first, then @a). */
LaminaHeatMatrix lamina_heat_matrix_multiply   (const LaminaHeatMatrix *a,
                                                const LaminaHeatMatrix *b);
double complex   lamina_heat_matrix_det        (const LaminaHeatMatrix *m);

typedef struct
{
  double   period;                      /* h */
  double   periodic_transmittance;      /* |Y12|, W/(m²·K) */
  double   time_shift;                  /* h in [0, period): lag of Y12 */
  double   decrement_factor;            /* f = |Y12| / U */
  double   admittance_inner;            /* |Y11|, W/(m²·K) */
  double   admittance_inner_shift;      /* h: lead of Y11 */
  double   admittance_outer;            /* |Y22|, W/(m²·K) */
  double   areal_heat_capacity_inner;   /* κ1, J/(m²·K) */
  double   areal_heat_capacity_outer;   /* κ2, J/(m²·K) */
  double   u;                           /* steady-state U of the same layers */
  gboolean bridged_equivalent;          /* a bridged layer was averaged */
} LaminaDynamic;

/* The matrix of the layers that count (those inside a well ventilated air
 * layer are left out, as by EN ISO 6946 6.9.4), with Rsi and Rse of
 * @result when @with_surfaces.  Needs the density and specific heat of
 * every material: LAMINA_CALC_ERROR_INVALID naming the first one without. */
gboolean lamina_dynamic_matrix    (const LaminaConstruction *construction,
                                   const LaminaResult       *result,
                                   double                    period_hours,
                                   gboolean                  with_surfaces,
                                   LaminaHeatMatrix         *matrix,
                                   gboolean                 *bridged,
                                   GError                  **error);

/* The dynamic characteristics of @construction, whose EN ISO 6946 result
 * is @result. */
gboolean lamina_dynamic_calculate (const LaminaConstruction *construction,
                                   const LaminaResult       *result,
                                   double                    period_hours,
                                   LaminaDynamic            *dynamic,
                                   GError                  **error);

G_END_DECLS
