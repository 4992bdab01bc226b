/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tapered layers, EN ISO 6946:2017 Annex E (formulas from memory).
 *
 * R0 is the design resistance of the rest of the element, both surface
 * resistances and the thin end of the tapered layer included; R1 is the
 * resistance the wedge adds at its thickest point.  Over the plan the
 * resistance runs linearly from R0 to R0 + R1, and U is the area mean of
 * 1/R:
 *   E.2 rectangle:               U = (1/R1) ln (1 + R1/R0)
 *   E.3 triangle, thick apex:    U = (2/R1) [(1 + R0/R1) ln (1 + R1/R0) − 1]
 *   E.3 triangle, thin apex:     U = (2/R1) [1 − (R0/R1) ln (1 + R1/R0)]
 *   E.4 several areas:           U = Σ Ui Ai / Σ Ai */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc.h"

#include <math.h>

/* Below this R1/R0 the closed forms lose digits to cancellation; the
 * integral is then taken by Gauss–Legendre quadrature, exact to far more
 * digits for a nearly constant integrand. */
#define SMALL_RATIO 1e-3

/* Weight of the plan at position s (0 at the thin end, 1 at the thick). */
static double
plan_weight (LaminaTaper shape,
             double      s)
{
  switch (shape)
    {
    case LAMINA_TAPER_APEX_THICK:
      return 2.0 * (1.0 - s);   /* the triangle narrows to the thick apex */
    case LAMINA_TAPER_APEX_THIN:
      return 2.0 * s;           /* the thin apex is where s = 0 */
    case LAMINA_TAPER_RECTANGLE:
    case LAMINA_TAPER_NONE:
    case LAMINA_N_TAPERS:
    default:
      return 1.0;
    }
}

static double
quadrature_u (LaminaTaper shape,
              double      r0,
              double      r1)
{
  /* 5-point Gauss–Legendre on [0, 1]. */
  static const double x[] = { 0.0, -0.5384693101056831, 0.5384693101056831,
                              -0.9061798459386640, 0.9061798459386640 };
  static const double w[] = { 0.5688888888888889, 0.4786286704993665, 0.4786286704993665,
                              0.2369268850561891, 0.2369268850561891 };
  double u = 0.0;

  for (guint i = 0; i < G_N_ELEMENTS (x); i++)
    {
      double s = 0.5 * (x[i] + 1.0);
      u += 0.5 * w[i] * plan_weight (shape, s) / (r0 + r1 * s);
    }
  return u;
}

double
lamina_tapered_u (LaminaTaper shape,
                  double      r0,
                  double      r1)
{
  double ln;

  g_return_val_if_fail (r0 > 0 && r1 >= 0, NAN);

  if (r1 < SMALL_RATIO * r0)
    return quadrature_u (shape, r0, r1);
  ln = log1p (r1 / r0);
  switch (shape)
    {
    case LAMINA_TAPER_APEX_THICK:
      return 2.0 / r1 * ((1.0 + r0 / r1) * ln - 1.0);
    case LAMINA_TAPER_APEX_THIN:
      return 2.0 / r1 * (1.0 - r0 / r1 * ln);
    case LAMINA_TAPER_RECTANGLE:
    case LAMINA_TAPER_NONE:
    case LAMINA_N_TAPERS:
    default:
      return ln / r1;
    }
}

double
lamina_tapered_u_combined (const LaminaTaperArea *areas,
                           guint                  n_areas)
{
  double sum = 0.0, area = 0.0;

  for (guint i = 0; i < n_areas; i++)
    {
      sum += areas[i].area * lamina_tapered_u (areas[i].shape, areas[i].r0, areas[i].r1);
      area += areas[i].area;
    }
  return area > 0 ? sum / area : NAN;
}
