/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Solving for a target U.  The corrected U of EN ISO 6946:2017 falls as a
 * material or bridged layer thickens (R = d/λ per part, 6.7.1 and 6.7.2);
 * the Annex F corrections depend on the layer's thickness too (F.2 and F.4
 * through R1/RT, F.3 through d0), so the engine itself is the function whose
 * root is sought.  The root is bracketed between the thinnest layer the
 * model accepts and LAMINA_SOLVE_MAX_THICKNESS and bisected: bisection only
 * needs a sign change, which also holds where a correction makes U level
 * off instead of falling. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-solve.h"

#include <glib/gi18n-lib.h>
#include <math.h>

/* Thinnest layer tried, mm. */
#define MIN_THICKNESS 0.01
/* Bisection stops when the bracket is this narrow, mm: far inside the
 * promised LAMINA_SOLVE_TOLERANCE, so U at the result equals the target to
 * about 1e-9 W/(m²·K). */
#define BRACKET_WIDTH 1e-7
#define MAX_STEPS 200

static LaminaLayer *
layer_of (LaminaConstruction *c,
          guint               layer)
{
  return c->layers->pdata[layer - 1];
}

gboolean
lamina_solve_check_layer (const LaminaConstruction *construction,
                          guint                     layer,
                          GError                  **error)
{
  const LaminaLayer *l;

  g_return_val_if_fail (construction != NULL, FALSE);

  if (layer < 1 || layer > construction->layers->len)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("layer %u: the construction has layers 1 to %u (1 is the innermost)"),
                   layer, construction->layers->len);
      return FALSE;
    }
  l = construction->layers->pdata[layer - 1];
  switch (l->kind)
    {
    case LAMINA_LAYER_MATERIAL:
    case LAMINA_LAYER_BRIDGED:
      return TRUE;
    case LAMINA_LAYER_RESISTANCE:
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                   _("layer %u has a declared thermal resistance: its thickness does not change U; "
                     "choose a material or bridged layer"), layer);
      return FALSE;
    case LAMINA_LAYER_AIR:
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                   _("layer %u is an air layer: its resistance does not grow with its thickness "
                     "(EN ISO 6946 Table 8); choose a material or bridged layer"), layer);
      return FALSE;
    case LAMINA_N_LAYER_KINDS:
    default:
      g_assert_not_reached ();
    }
}

/* Corrected U with the layer of @work at @thickness (work is a private copy). */
static gboolean
u_with (LaminaConstruction *work,
        guint               layer,
        double              thickness,
        double             *u,
        GError            **error)
{
  g_autoptr(LaminaResult) r = NULL;

  layer_of (work, layer)->thickness = thickness;
  r = lamina_calculate (work, error);
  if (r == NULL)
    return FALSE;
  if (r->layers[layer - 1].disregarded)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                   _("layer %u lies outside a well ventilated air layer and does not count "
                     "(EN ISO 6946 6.9.4): its thickness does not change U"), layer);
      return FALSE;
    }
  *u = r->u_corrected;
  return TRUE;
}

gboolean
lamina_solve_u_at (const LaminaConstruction *construction,
                   guint                     layer,
                   double                    thickness,
                   double                   *u,
                   GError                  **error)
{
  g_autoptr(LaminaConstruction) work = NULL;

  g_return_val_if_fail (construction != NULL && u != NULL, FALSE);

  if (!lamina_solve_check_layer (construction, layer, error))
    return FALSE;
  work = lamina_construction_copy (construction);
  return u_with (work, layer, thickness, u, error);
}

/* The thinnest the layer may be: recessed fasteners (F.3) need d0 ≥ d1. */
static double
thinnest (const LaminaLayer *layer)
{
  const LaminaCorrections *k = &layer->corrections;

  if (k->has_fasteners && !isnan (k->fastener_penetration))
    return MAX (MIN_THICKNESS, k->fastener_penetration);
  return MIN_THICKNESS;
}

/* The thickest the layer may be: the model's limit, or the thickest air
 * layer EN ISO 6946 covers when the layer has an air part (6.9). */
static double
thickest (const LaminaLayer *layer)
{
  if (layer->kind == LAMINA_LAYER_BRIDGED)
    for (guint p = 0; p < layer->parts->len; p++)
      if (lamina_part_is_air (layer->parts->pdata[p]))
        return LAMINA_AIR_LAYER_MAX_THICKNESS;
  return LAMINA_SOLVE_MAX_THICKNESS;
}

/* The materials of a layer: one for a homogeneous layer, one per part
 * (NULL for an air part) for a bridged layer. */
static guint
n_materials (const LaminaLayer *layer)
{
  return layer->kind == LAMINA_LAYER_BRIDGED ? layer->parts->len : 1;
}

static const LaminaMaterial *
material_at (const LaminaLayer *layer,
             guint              i)
{
  if (layer->kind == LAMINA_LAYER_BRIDGED)
    return ((const LaminaPart *) layer->parts->pdata[i])->material;
  return layer->material;
}

static gboolean
has_stock (const LaminaMaterial *m,
           double                d)
{
  for (guint i = 0; i < m->n_stock_thicknesses; i++)
    if (fabs (m->stock_thicknesses[i] - d) < 1e-9)
      return TRUE;
  return FALSE;
}

/* Is @d offered by every material of @layer that lists stock thicknesses
 * (the stud depth and the batt thickness of a bridged layer alike)? */
static gboolean
offered_by_all (const LaminaLayer *layer,
                double             d)
{
  for (guint i = 0; i < n_materials (layer); i++)
    {
      const LaminaMaterial *m = material_at (layer, i);

      if (m != NULL && m->n_stock_thicknesses > 0 && !has_stock (m, d))
        return FALSE;
    }
  return TRUE;
}

double
lamina_solve_snap (const LaminaLayer *layer,
                   double             thickness,
                   gboolean          *stock)
{
  double best = INFINITY;
  /* A solved thickness a hair above a stock or 10 mm size is that size:
   * the root is exact to far less than this. */
  double wanted = thickness - 1e-6;

  g_return_val_if_fail (layer != NULL, NAN);

  if (layer->kind == LAMINA_LAYER_MATERIAL || layer->kind == LAMINA_LAYER_BRIDGED)
    for (guint l = 0; l < n_materials (layer); l++)
      {
        const LaminaMaterial *m = material_at (layer, l);

        for (guint i = 0; m != NULL && i < m->n_stock_thicknesses; i++)
          {
            double d = m->stock_thicknesses[i];

            if (d >= wanted && d < best && offered_by_all (layer, d))
              best = d;
          }
      }
  if (stock != NULL)
    *stock = isfinite (best);
  if (isfinite (best))
    return best;
  return MAX (LAMINA_SOLVE_SNAP_STEP, ceil (wanted / LAMINA_SOLVE_SNAP_STEP) * LAMINA_SOLVE_SNAP_STEP);
}

gboolean
lamina_solve_thickness (const LaminaConstruction *construction,
                        guint                     layer,
                        double                    target,
                        LaminaSolve              *solve,
                        GError                  **error)
{
  g_autoptr(LaminaConstruction) work = NULL;
  LaminaLayer *l;
  double lo, hi, u_lo, u_hi;

  g_return_val_if_fail (construction != NULL && solve != NULL, FALSE);

  if (!isfinite (target) || target <= 0 || target > 100)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("target U %g W/(m²·K) is not between 0 and 100"), target);
      return FALSE;
    }
  if (!lamina_solve_check_layer (construction, layer, error))
    return FALSE;

  work = lamina_construction_copy (construction);
  l = layer_of (work, layer);
  *solve = (LaminaSolve) { .layer = layer, .target = target, .thickness_before = l->thickness };
  if (!u_with (work, layer, l->thickness, &solve->u_before, error))
    return FALSE;

  lo = thinnest (l);
  hi = thickest (l);
  if (!u_with (work, layer, hi, &u_hi, error) || !u_with (work, layer, lo, &u_lo, error))
    return FALSE;
  if (u_hi > target)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNREACHABLE,
                   _("layer %u: no thickness up to %g mm reaches U = %g W/(m²·K) "
                     "(U is still %.4f W/(m²·K) at %g mm)"),
                   layer, hi, target, u_hi, hi);
      return FALSE;
    }
  if (u_lo <= target)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNREACHABLE,
                   _("layer %u: the target U = %g W/(m²·K) is met even with the layer at "
                     "%g mm (U = %.4f W/(m²·K)); any thickness will do"),
                   layer, target, lo, u_lo);
      return FALSE;
    }

  /* Invariant: U(lo) > target ≥ U(hi). */
  for (guint step = 0; step < MAX_STEPS && hi - lo > BRACKET_WIDTH; step++)
    {
      double mid = 0.5 * (lo + hi), u_mid;

      if (!u_with (work, layer, mid, &u_mid, error))
        return FALSE;
      if (u_mid > target)
        lo = mid;
      else
        {
          hi = mid;
          u_hi = u_mid;
        }
    }
  solve->thickness = hi;
  solve->u = u_hi;

  solve->thickness_snapped = lamina_solve_snap (l, hi, &solve->stock);
  if (solve->thickness_snapped > thickest (l))
    solve->thickness_snapped = thickest (l);
  return u_with (work, layer, solve->thickness_snapped, &solve->u_snapped, error);
}

gboolean
lamina_solve_curve (const LaminaConstruction *construction,
                    guint                     layer,
                    double                    from,
                    double                    to,
                    guint                     n,
                    double                   *thickness,
                    double                   *u,
                    GError                  **error)
{
  g_autoptr(LaminaConstruction) work = NULL;

  g_return_val_if_fail (construction != NULL && n >= 2 && thickness != NULL && u != NULL, FALSE);

  if (!lamina_solve_check_layer (construction, layer, error))
    return FALSE;
  work = lamina_construction_copy (construction);
  from = MAX (from, thinnest (layer_of (work, layer)));
  for (guint i = 0; i < n; i++)
    {
      thickness[i] = from + (to - from) * i / (n - 1);
      if (!u_with (work, layer, thickness[i], &u[i], NULL))
        u[i] = NAN;
    }
  return TRUE;
}
