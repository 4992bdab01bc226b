/* SPDX-License-Identifier: GPL-3.0-or-later */
/* EN ISO 13786:2017, dynamic thermal characteristics (clause numbers from
 * memory):
 *
 *   6.3   heat transfer matrix of a homogeneous layer, penetration depth
 *         δ = √(λT / (πρc)), ξ = d/δ
 *   6.4   surface resistances and air layers as pure resistances,
 *         Z = [1  −R; 0  1]; the element's matrix is the product from the
 *         inner surface outwards, Z = Zse · ZN ⋯ Z1 · Zsi
 *   7     Y11 = −Z11/Z12, Y22 = −Z22/Z12, Y12 = −1/Z12 (with Rsi and Rse);
 *         f = |Y12|/U; time shift from arg Y12; areal heat capacities
 *         κ1 = T/2π · |(Z11 − 1)/Z12|, κ2 = T/2π · |(Z22 − 1)/Z12| from
 *         the matrix surface to surface
 *
 * The standard's closed form of the layer matrix, written with real
 * functions of ξ, is the complex form used here with k = (1 + i)/δ:
 * Z11 = Z22 = cosh kd, Z12 = −sinh kd / (λk), Z21 = −λk sinh kd.
 *
 * Bridged layers: EN ISO 13786 treats plane homogeneous layers.  A bridged
 * layer is taken as a homogeneous layer with its lower-limit equivalent
 * resistance (EN ISO 6946 6.7.2.3, as in the layer results) and the
 * area-weighted heat capacity ρc = Σ fj ρj cj of its parts (air parts
 * carry none): an approximation the result says it made. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-dynamic.h"

#include <glib/gi18n-lib.h>
#include <math.h>

#define SECONDS_PER_HOUR 3600.0

LaminaHeatMatrix
lamina_heat_matrix_resistance (double resistance)
{
  return (LaminaHeatMatrix) { 1.0, -resistance, 0.0, 1.0 };
}

LaminaHeatMatrix
lamina_heat_matrix_layer (double thickness,
                          double conductivity,
                          double density,
                          double specific_heat,
                          double period_s)
{
  double heat_capacity = density * specific_heat;
  double depth;
  double complex k, kd, s;

  if (!(heat_capacity > 0.0))
    return lamina_heat_matrix_resistance (thickness / conductivity);
  depth = sqrt (conductivity * period_s / (G_PI * heat_capacity));
  k = (1.0 + I) / depth;
  kd = k * thickness;
  s = csinh (kd);
  return (LaminaHeatMatrix) { ccosh (kd), -s / (conductivity * k), -conductivity * k * s, ccosh (kd) };
}

LaminaHeatMatrix
lamina_heat_matrix_multiply (const LaminaHeatMatrix *a,
                             const LaminaHeatMatrix *b)
{
  return (LaminaHeatMatrix) {
    a->z11 * b->z11 + a->z12 * b->z21,
    a->z11 * b->z12 + a->z12 * b->z22,
    a->z21 * b->z11 + a->z22 * b->z21,
    a->z21 * b->z12 + a->z22 * b->z22,
  };
}

double complex
lamina_heat_matrix_det (const LaminaHeatMatrix *m)
{
  return m->z11 * m->z22 - m->z12 * m->z21;
}

static gboolean
need_heat_capacity (const LaminaMaterial *m,
                    guint                 layer,
                    GError              **error)
{
  const char *missing = NULL;

  if (isnan (m->density))
    missing = _("density");
  else if (isnan (m->specific_heat))
    missing = _("specific heat capacity");
  if (missing == NULL)
    return TRUE;
  g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
               _("dynamic properties (EN ISO 13786) left out: material “%s” in layer %u has no %s"),
               m->name != NULL ? m->name : m->id, layer, missing);
  return FALSE;
}

/* ρc of a bridged layer, area-weighted over its parts. */
static gboolean
bridged_heat_capacity (const LaminaLayer *layer,
                       guint              number,
                       double            *heat_capacity,
                       GError           **error)
{
  *heat_capacity = 0.0;
  for (guint p = 0; p < layer->parts->len; p++)
    {
      const LaminaPart *part = layer->parts->pdata[p];

      if (lamina_part_is_air (part))
        continue;
      if (!need_heat_capacity (part->material, number, error))
        return FALSE;
      *heat_capacity += lamina_layer_get_part_fraction (layer, p)
                        * part->material->density * part->material->specific_heat;
    }
  return TRUE;
}

static gboolean
layer_matrix (const LaminaLayer       *layer,
              const LaminaLayerResult *lr,
              guint                    number,
              double                   period_s,
              LaminaHeatMatrix        *z,
              GError                 **error)
{
  double d = layer->thickness / 1000.0;
  double rc;

  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      if (!need_heat_capacity (layer->material, number, error))
        return FALSE;
      *z = lamina_heat_matrix_layer (d, layer->material->conductivity, layer->material->density,
                                     layer->material->specific_heat, period_s);
      return TRUE;
    case LAMINA_LAYER_BRIDGED:
      if (!bridged_heat_capacity (layer, number, &rc, error))
        return FALSE;
      /* λeq = d / R''eq; ρc as one homogeneous material of unit c. */
      *z = lamina_heat_matrix_layer (d, d / lr->resistance, rc, 1.0, period_s);
      return TRUE;
    case LAMINA_LAYER_RESISTANCE:
    case LAMINA_LAYER_AIR:
      *z = lamina_heat_matrix_resistance (lr->resistance);
      return TRUE;
    case LAMINA_N_LAYER_KINDS:
    default:
      g_assert_not_reached ();
    }
}

gboolean
lamina_dynamic_matrix (const LaminaConstruction *construction,
                       const LaminaResult       *result,
                       double                    period_hours,
                       gboolean                  with_surfaces,
                       LaminaHeatMatrix         *matrix,
                       gboolean                 *bridged,
                       GError                  **error)
{
  double period_s = period_hours * SECONDS_PER_HOUR;
  LaminaHeatMatrix z = lamina_heat_matrix_resistance (with_surfaces ? result->rsi : 0.0);

  g_return_val_if_fail (construction != NULL && result != NULL && matrix != NULL, FALSE);
  g_return_val_if_fail (result->n_layers == construction->layers->len, FALSE);

  if (bridged != NULL)
    *bridged = FALSE;
  for (guint i = 0; i < result->n_layers; i++)
    {
      const LaminaLayer *layer = construction->layers->pdata[i];
      LaminaHeatMatrix zl;

      if (result->layers[i].disregarded)
        break;
      if (!layer_matrix (layer, &result->layers[i], i + 1, period_s, &zl, error))
        return FALSE;
      if (bridged != NULL && layer->kind == LAMINA_LAYER_BRIDGED)
        *bridged = TRUE;
      z = lamina_heat_matrix_multiply (&zl, &z);
    }
  if (with_surfaces)
    {
      LaminaHeatMatrix zse = lamina_heat_matrix_resistance (result->rse);
      z = lamina_heat_matrix_multiply (&zse, &z);
    }
  *matrix = z;
  return TRUE;
}

/* A phase as hours in [0, period). */
static double
phase_hours (double phase,
             double period)
{
  double h = phase * period / (2.0 * G_PI);

  h = fmod (h, period);
  if (h < 0)
    h += period;
  /* fmod of a value a hair below a whole period. */
  return h >= period ? 0.0 : h;
}

gboolean
lamina_dynamic_calculate (const LaminaConstruction *construction,
                          const LaminaResult       *result,
                          double                    period_hours,
                          LaminaDynamic            *dynamic,
                          GError                  **error)
{
  LaminaHeatMatrix zee, zss;
  double complex y11, y12, y22;
  double r = result->rsi + result->rse;
  double omega_inv = period_hours * SECONDS_PER_HOUR / (2.0 * G_PI);

  g_return_val_if_fail (dynamic != NULL, FALSE);

  *dynamic = (LaminaDynamic) { .period = period_hours };
  if (!lamina_dynamic_matrix (construction, result, period_hours, TRUE, &zee,
                              &dynamic->bridged_equivalent, error)
      || !lamina_dynamic_matrix (construction, result, period_hours, FALSE, &zss, NULL, error))
    return FALSE;

  y11 = -zee.z11 / zee.z12;
  y22 = -zee.z22 / zee.z12;
  y12 = -1.0 / zee.z12;
  for (guint i = 0; i < result->n_layers && !result->layers[i].disregarded; i++)
    r += result->layers[i].resistance;

  dynamic->u = 1.0 / r;
  dynamic->periodic_transmittance = cabs (y12);
  dynamic->decrement_factor = cabs (y12) / dynamic->u;
  /* Positive = the inner peak comes after the outer one. */
  dynamic->time_shift = phase_hours (-carg (y12), period_hours);
  dynamic->admittance_inner = cabs (y11);
  dynamic->admittance_inner_shift = phase_hours (carg (y11), period_hours);
  dynamic->admittance_outer = cabs (y22);
  dynamic->areal_heat_capacity_inner = omega_inv * cabs ((zss.z11 - 1.0) / zss.z12);
  dynamic->areal_heat_capacity_outer = omega_inv * cabs ((zss.z22 - 1.0) / zss.z12);
  return TRUE;
}
