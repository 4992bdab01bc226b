/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The calculation of EN ISO 6946:2017 for one construction.
 *
 *   6.7.1   homogeneous layers, R = d / λ (or a declared R)
 *   6.8     surface resistances (Table 7); Rse = Rsi on a face to indoors
 *   6.9     air layers: unventilated (6.9.2, Table 8 / Annex D), slightly
 *           ventilated (6.9.3, interpolation by vent area) and well
 *           ventilated (6.9.4, outer layers disregarded, Rse = Rsi)
 *   6.7.2   bridged layers: upper limit R'T, lower limit R''T, their mean
 *           and the maximum relative error
 *   Annex F corrections for air gaps, mechanical fasteners, inverted roofs
 *   Annex C surface resistances from wind speed and emissivity
 *   Annex D air layers at the ΔT of the temperature profile (iterated),
 *           small or divided spaces, air parts with their own faces
 *   Annex E tapered layers: the area-mean U over the plan
 *   6.10    an unheated space outside as the resistance Ru
 * and, for ground floors, EN ISO 13370 (lamina-ground.c). */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-calc-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>

/* 6.9.3: vent opening areas in mm² per m (vertical) or per m² (horizontal). */
#define VENT_UNVENTILATED_MAX   500.0
#define VENT_WELL_VENTILATED_MIN 1500.0
/* 6.7.2.1: the upper/lower-limit method holds for R'T/R''T ≤ 1.5. */
#define MAX_LIMIT_RATIO 1.5
/* Annex F.1: a total correction below 3 % of U may be left out. */
#define SMALL_CORRECTION 0.03
/* F.4: x, W·day/(m²·K·mm), for inverted roofs. */
#define INVERTED_ROOF_X 0.04
/* F.3: α for fasteners that pass right through the insulation. */
#define FASTENER_ALPHA 0.8
/* F.3: no correction for fasteners with λ below 1 W/(m·K). */
#define FASTENER_MIN_CONDUCTIVITY 1.0
/* Metal for the scope check: a metal category or λ of 10 W/(m·K) and up
 * (common practice: the least conductive structural metals, stainless
 * steels, are about 15–17 W/(m·K), EN ISO 10456 Table 3). */
#define METAL_MIN_CONDUCTIVITY 10.0
#define INSULATING_MAX_CONDUCTIVITY 0.1

/* Annex D by the temperature profile: stop when no air layer's R moves by
 * more than this, m²·K/W; a handful of rounds suffice in practice. */
#define AIR_ITERATION_TOLERANCE 1e-7
#define AIR_ITERATION_MAX 50

/* F.2, Table F.1: ΔU'' by level of air gaps. */
static const double air_gap_delta_u[] = { 0.00, 0.01, 0.04 };

typedef struct
{
  const LaminaConstruction *c;
  guint           n;
  double          rsi;
  double          rse;
  double          ru;         /* 6.10: unheated space outside, or 0 */
  double         *r;          /* per layer; equivalent R for bridged layers */
  double        **part_r;     /* per bridged layer, per part */
  LaminaAirKind  *air;        /* effective ventilation class of air layers */
  guint          *bridged;    /* indices of bridged layers */
  guint           n_bridged;
  LaminaSections  sections;
  LaminaScratch  *scratch;
} Calc;

LaminaAirKind
lamina_air_layer_effective_kind (const LaminaLayer *layer)
{
  if (isnan (layer->vent_area))
    return layer->air;
  if (layer->vent_area <= VENT_UNVENTILATED_MAX)
    return LAMINA_AIR_UNVENTILATED;
  if (layer->vent_area >= VENT_WELL_VENTILATED_MIN)
    return LAMINA_AIR_WELL_VENTILATED;
  return LAMINA_AIR_SLIGHTLY_VENTILATED;
}

static gboolean
prefix_error (GError **error,
              guint    layer,
              int      part)
{
  if (error != NULL && *error != NULL)
    {
      if (part > 0)
        g_prefix_error (error, _("layer %u, part %d: "), layer, part);
      else
        g_prefix_error (error, _("layer %u: "), layer);
    }
  return FALSE;
}

/* 6.9.2 / Annex D: an air layer or part at the ΔT and mean temperature
 * given (NAN on the first pass: the conventional ΔT ≤ 5 K, 10 °C). */
static gboolean
air_resistance (const Calc     *calc,
                LaminaHeatFlow  flow,
                double          thickness,
                double          width,
                double          emissivity_1,
                double          emissivity_2,
                double          delta_t,
                double          mean_temperature,
                double         *r,
                GError        **error)
{
  if (!lamina_air_layer_resistance_sized (thickness, width, flow, emissivity_1, emissivity_2, r, error))
    return FALSE;
  if (calc->c->surfaces.air_from_profile)
    *r = lamina_air_space_resistance (thickness, flow, emissivity_1, emissivity_2, width,
                                      delta_t, mean_temperature);
  return TRUE;
}

/* An air part of a bridged layer, with its own faces.  6.9.3 (from
 * memory): a slightly ventilated cavity counts half its unventilated R. */
static gboolean
part_air_resistance (const Calc        *calc,
                     LaminaHeatFlow     flow,
                     const LaminaLayer *layer,
                     const LaminaPart  *part,
                     double             delta_t,
                     double             mean_temperature,
                     double            *r,
                     GError           **error)
{
  if (!air_resistance (calc, flow, layer->thickness, NAN, part->emissivity_inner, part->emissivity_outer,
                       delta_t, mean_temperature, r, error))
    return FALSE;
  if (part->air == LAMINA_AIR_SLIGHTLY_VENTILATED)
    *r /= 2.0;
  return TRUE;
}

/* Resistance of each layer and part, with air layers taken as unventilated. */
static gboolean
resolve_layers (Calc                     *calc,
                LaminaHeatFlow            flow,
                GError                  **error)
{
  const LaminaConstruction *c = calc->c;

  for (guint i = 0; i < calc->n; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      double d = layer->thickness / 1000.0;

      switch (layer->kind)
        {
        case LAMINA_LAYER_MATERIAL:
          calc->r[i] = d / layer->material->conductivity;
          break;
        case LAMINA_LAYER_RESISTANCE:
          calc->r[i] = layer->resistance;
          break;
        case LAMINA_LAYER_AIR:
          calc->air[i] = lamina_air_layer_effective_kind (layer);
          if (!air_resistance (calc, flow, layer->thickness, layer->air_width, layer->emissivity_inner,
                               layer->emissivity_outer, NAN, NAN, &calc->r[i], error))
            return prefix_error (error, i + 1, 0);
          break;
        case LAMINA_LAYER_BRIDGED:
          {
            double conductance = 0.0;

            calc->part_r[i] = lamina_scratch_alloc (calc->scratch, sizeof (double) * layer->parts->len);
            for (guint p = 0; p < layer->parts->len; p++)
              {
                const LaminaPart *part = layer->parts->pdata[p];
                double rp;

                if (lamina_part_is_air (part))
                  {
                    if (!part_air_resistance (calc, flow, layer, part, NAN, NAN, &rp, error))
                      return prefix_error (error, i + 1, (int) p + 1);
                  }
                else
                  rp = d / part->material->conductivity;
                calc->part_r[i][p] = rp;
                conductance += lamina_layer_get_part_fraction (layer, p) / rp;
              }
            /* 6.7.2.3: the equivalent resistance of the bridged layer. */
            calc->r[i] = 1.0 / conductance;
            calc->bridged[calc->n_bridged++] = i;
          }
          break;
        case LAMINA_N_LAYER_KINDS:
        default:
          g_assert_not_reached ();
        }
    }
  return TRUE;
}

/* Upper and lower limits over layers [0, n) with the given Rse, all air
 * layers in the range unventilated. */
static void
plain_limits (const Calc *calc,
              guint       n,
              double      rse,
              double     *upper,
              double     *lower)
{
  double homogeneous = calc->rsi + rse;
  double conductance = 0.0;
  gboolean any_bridged = FALSE;

  for (guint i = 0; i < n; i++)
    homogeneous += calc->r[i];
  *lower = homogeneous;

  for (guint k = 0; k < calc->n_bridged; k++)
    any_bridged |= calc->bridged[k] < n;
  if (!any_bridged)
    {
      *upper = homogeneous;
      return;
    }

  /* 6.7.2.2: each section in series, the sections in parallel. */
  for (guint k = 0; k < calc->n_bridged; k++)
    if (calc->bridged[k] < n)
      homogeneous -= calc->r[calc->bridged[k]];
  for (guint s = 0; s < calc->sections.n_sections; s++)
    {
      const guint8 *choice = calc->sections.choice + (gsize) s * calc->n;
      double r = homogeneous;

      for (guint k = 0; k < calc->n_bridged; k++)
        {
          guint i = calc->bridged[k];
          if (i < n)
            r += calc->part_r[i][choice[i]];
        }
      conductance += calc->sections.fraction[s] / r;
    }
  *upper = 1.0 / conductance;
}

/* Limits over layers [0, n), applying the ventilation rules to the innermost
 * ventilated air layer and recursing for the ones beyond it. */
static void
compute_limits (Calc   *calc,
                guint   n,
                double  rse,
                double *upper,
                double *lower)
{
  for (guint i = 0; i < n; i++)
    {
      const LaminaLayer *layer = calc->c->layers->pdata[i];

      if (layer->kind != LAMINA_LAYER_AIR)
        continue;
      if (calc->air[i] == LAMINA_AIR_WELL_VENTILATED)
        {
          /* 6.9.4: disregard the layer and all outside it; Rse = Rsi. */
          plain_limits (calc, i, calc->rsi, upper, lower);
          return;
        }
      if (calc->air[i] == LAMINA_AIR_SLIGHTLY_VENTILATED)
        {
          /* 6.9.3: RT = (1500 − Av)/1000 · RT,u + (Av − 500)/1000 · RT,v */
          double av = layer->vent_area;
          double wu = (VENT_WELL_VENTILATED_MIN - av) / 1000.0;
          double wv = (av - VENT_UNVENTILATED_MAX) / 1000.0;
          double uu, lu, uv, lv;

          calc->air[i] = LAMINA_AIR_UNVENTILATED;
          compute_limits (calc, n, rse, &uu, &lu);
          calc->air[i] = LAMINA_AIR_SLIGHTLY_VENTILATED;
          plain_limits (calc, i, calc->rsi, &uv, &lv);
          *upper = wu * uu + wv * uv;
          *lower = wu * lu + wv * lv;
          return;
        }
    }
  plain_limits (calc, n, rse, upper, lower);
}

static gboolean
is_metal (const LaminaMaterial *m)
{
  return m != NULL && (m->category == LAMINA_CATEGORY_METAL
                       || m->conductivity >= METAL_MIN_CONDUCTIVITY);
}

/* Insulating for the scope check by what it does, whatever its category:
 * λ ≤ 0.1 W/(m·K) (common practice; insulation products are declared at
 * 0.02–0.05, and a light timber or an insulating block is not bridged by
 * metal in a way the limits method misses by much). */
static gboolean
is_insulating (const LaminaMaterial *m)
{
  return m != NULL && (m->category == LAMINA_CATEGORY_INSULATION
                       || m->conductivity <= INSULATING_MAX_CONDUCTIVITY);
}

gboolean
lamina_layer_metal_bridges_insulation (const LaminaLayer *layer)
{
  gboolean metal = FALSE, insulation = FALSE;

  for (guint p = 0; p < layer->parts->len; p++)
    {
      const LaminaMaterial *m = ((LaminaPart *) layer->parts->pdata[p])->material;

      if (is_metal (m))
        metal = TRUE;
      else if (is_insulating (m))
        insulation = TRUE;
    }
  return metal && insulation;
}

static void
check_scope (const Calc   *calc,
             LaminaResult *result)
{
  for (guint k = 0; k < calc->n_bridged; k++)
    {
      const LaminaLayer *layer = calc->c->layers->pdata[calc->bridged[k]];

      if (lamina_layer_metal_bridges_insulation (layer))
        lamina_result_add_warning (result, LAMINA_WARNING_METAL_BRIDGED_INSULATION, (int) calc->bridged[k] + 1,
                                   g_strdup_printf (_("Layer %u: insulation bridged by metal is outside the scope of "
                                                      "EN ISO 6946; a numerical calculation to EN ISO 10211 is needed."),
                                                    calc->bridged[k] + 1));
    }
  if (calc->n_bridged > 0 && result->r_upper / result->r_lower > MAX_LIMIT_RATIO)
    lamina_result_add_warning (result, LAMINA_WARNING_RATIO_OUT_OF_RANGE, 0,
                               g_strdup_printf (_("R'T/R''T is %.2f, above the %.1f for which the upper and lower "
                                                  "limit method holds (EN ISO 6946 6.7.2.1); a numerical "
                                                  "calculation to EN ISO 10211 is needed."),
                                                result->r_upper / result->r_lower, MAX_LIMIT_RATIO));
}

static guint
find_cut (const Calc *calc)
{
  for (guint i = 0; i < calc->n; i++)
    if (((LaminaLayer *) calc->c->layers->pdata[i])->kind == LAMINA_LAYER_AIR
        && calc->air[i] == LAMINA_AIR_WELL_VENTILATED)
      return i;
  return calc->n;
}

static void
note_ventilation (const Calc   *calc,
                  guint         cut,
                  LaminaResult *result)
{
  for (guint i = 0; i < calc->n; i++)
    {
      const LaminaLayer *layer = calc->c->layers->pdata[i];

      if (layer->kind == LAMINA_LAYER_AIR && calc->air[i] != layer->air)
        lamina_result_add_warning (result, LAMINA_WARNING_VENT_CLASS, (int) i + 1,
                                   g_strdup_printf (_("Layer %u: a vent area of %g mm² makes this air layer %s "
                                                      "(EN ISO 6946 6.9), not %s as declared; calculated as %s."),
                                                    i + 1, layer->vent_area,
                                                    lamina_air_kind_to_string (calc->air[i]),
                                                    lamina_air_kind_to_string (layer->air),
                                                    lamina_air_kind_to_string (calc->air[i])));
    }
  if (cut < calc->n)
    lamina_result_add_warning (result, LAMINA_WARNING_LAYERS_DISREGARDED, (int) cut + 1,
                               g_strdup_printf (_("Layer %u is a well ventilated air layer: it and the layers outside "
                                                  "it are disregarded and Rse is taken as Rsi (EN ISO 6946 6.9.4)."),
                                                cut + 1));
}

static void
fill_layers (const Calc   *calc,
             guint         cut,
             double        rse,
             LaminaResult *result)
{
  double total = calc->rsi + rse + (cut == calc->n ? calc->ru : 0.0), cumulative = calc->rsi;
  double ti = calc->c->inside_temperature, te = calc->c->outside_temperature;

  for (guint i = 0; i < cut; i++)
    total += calc->r[i];

  result->surface_temperature_inner = ti - (ti - te) * cumulative / total;
  for (guint i = 0; i < calc->n; i++)
    {
      const LaminaLayer *layer = calc->c->layers->pdata[i];
      LaminaLayerResult *lr = &result->layers[i];

      lr->thickness = layer->thickness;
      lr->bridged = layer->kind == LAMINA_LAYER_BRIDGED;
      lr->disregarded = i >= cut;
      if (lr->disregarded)
        {
          lr->resistance = 0.0;
          lr->temperature_inner = lr->temperature_outer = te;
          continue;
        }
      lr->resistance = calc->r[i];
      lr->temperature_inner = ti - (ti - te) * cumulative / total;
      cumulative += calc->r[i];
      lr->temperature_outer = ti - (ti - te) * cumulative / total;
      result->surface_temperature_outer = lr->temperature_outer;
    }
}

/* The resistance of layer @i ignoring thermal bridging: for a bridged
 * layer, the path through its main part (the largest area fraction). */
static double
unbridged_resistance (const Calc *calc,
                      guint       i)
{
  const LaminaLayer *layer = calc->c->layers->pdata[i];
  double best = -1.0, r = calc->r[i];

  if (layer->kind != LAMINA_LAYER_BRIDGED)
    return r;
  for (guint p = 0; p < layer->parts->len; p++)
    {
      double f = lamina_layer_get_part_fraction (layer, p);

      if (f > best)
        {
          best = f;
          r = calc->part_r[i][p];
        }
    }
  return r;
}

/* F.3: RT,h, the total resistance of the component ignoring thermal
 * bridging, over the layers that count. */
static double
total_unbridged_resistance (const Calc         *calc,
                            guint               cut,
                            const LaminaResult *result)
{
  double total = result->rsi + result->rse + (cut == calc->n ? calc->ru : 0.0);

  for (guint i = 0; i < cut; i++)
    total += unbridged_resistance (calc, i);
  return total;
}

/* F.3: ΔUf = α λf Af nf / d0 · (R1 / RT,h)², R1 the insulation layer's
 * resistance, both ignoring thermal bridging.  None for ties across an
 * empty cavity (they bridge an air layer only) nor for λf below 1. */
static void
correct_fasteners (const Calc   *calc,
                   guint         i,
                   double        rt_h,
                   LaminaResult *result)
{
  const LaminaLayer *layer = calc->c->layers->pdata[i];
  const LaminaCorrections *k = &layer->corrections;
  double d0, alpha, share;

  if (layer->kind == LAMINA_LAYER_AIR)
    {
      lamina_result_add_warning (result, LAMINA_WARNING_FASTENER_LOW_CONDUCTIVITY, (int) i + 1,
                                 g_strdup_printf (_("Layer %u: ties across an empty cavity bridge only an air "
                                                    "layer and need no correction (EN ISO 6946 F.3)."), i + 1));
      return;
    }
  if (k->fastener_conductivity < FASTENER_MIN_CONDUCTIVITY)
    {
      lamina_result_add_warning (result, LAMINA_WARNING_FASTENER_LOW_CONDUCTIVITY, (int) i + 1,
                                 g_strdup_printf (_("Layer %u: fasteners with λ below 1 W/(m·K) need no "
                                                    "correction (EN ISO 6946 F.3)."), i + 1));
      return;
    }
  d0 = layer->thickness / 1000.0;
  alpha = isnan (k->fastener_penetration) ? FASTENER_ALPHA
                                          : FASTENER_ALPHA * k->fastener_penetration / layer->thickness;
  share = unbridged_resistance (calc, i) / rt_h;
  result->layers[i].delta_u_fasteners = alpha * k->fastener_conductivity * k->fastener_cross_section * 1e-6
                                        * k->fasteners_per_square_metre / d0 * share * share;
}

/* Annex F: ΔU for the corrections on the layers that count. */
static void
apply_corrections (const Calc   *calc,
                   guint         cut,
                   LaminaResult *result)
{
  double rt = result->r_total;
  double rt_h = total_unbridged_resistance (calc, cut, result);

  for (guint i = 0; i < calc->n; i++)
    {
      const LaminaLayer *layer = calc->c->layers->pdata[i];
      const LaminaCorrections *k = &layer->corrections;
      double share = calc->r[i] / rt;

      if (!k->has_air_gaps && !k->has_fasteners && !k->has_inverted_roof)
        continue;
      if (i >= cut)
        {
          lamina_result_add_warning (result, LAMINA_WARNING_LAYERS_DISREGARDED, (int) i + 1,
                                     g_strdup_printf (_("Layer %u: its corrections are not applied because the "
                                                        "layer is disregarded."), i + 1));
          continue;
        }
      /* F.2: ΔUg = ΔU'' (R1 / RT)² */
      if (k->has_air_gaps)
        result->layers[i].delta_u_air_gaps = air_gap_delta_u[k->air_gap_level] * share * share;
      if (k->has_fasteners)
        correct_fasteners (calc, i, rt_h, result);
      /* F.4: ΔUr = p f x (R1 / RT)² */
      if (k->has_inverted_roof)
        result->layers[i].delta_u_inverted_roof = k->precipitation * k->drainage_factor * INVERTED_ROOF_X
                                                  * share * share;
      result->delta_u_air_gaps += result->layers[i].delta_u_air_gaps;
      result->delta_u_fasteners += result->layers[i].delta_u_fasteners;
      result->delta_u_inverted_roof += result->layers[i].delta_u_inverted_roof;
    }
  result->delta_u = result->delta_u_air_gaps + result->delta_u_fasteners + result->delta_u_inverted_roof;
  result->u_corrected = result->u + result->delta_u;
  if (result->delta_u > 0 && result->delta_u < SMALL_CORRECTION * result->u)
    lamina_result_add_warning (result, LAMINA_WARNING_CORRECTION_SMALL, 0,
                               g_strdup_printf (_("The total correction ΔU = %.4f W/(m²·K) is under 3 %% of U and "
                                                  "may be left out (EN ISO 6946 F.1); it is included here."),
                                                result->delta_u));
}

static void
check_target (const LaminaConstruction *c,
              LaminaResult             *result)
{
  /* A ground floor's target is for its U with the ground. */
  double u = result->has_ground ? result->ground.u : result->u_corrected;

  if (isnan (c->target_u))
    return;
  result->has_target = TRUE;
  result->target_met = u <= c->target_u;
  if (!result->target_met)
    {
      char text[LAMINA_U_TEXT_SIZE];

      /* "U 0.1801 exceeds the target 0.18": as many digits as show the miss;
       * the target as it was set. */
      lamina_result_add_warning (result, LAMINA_WARNING_TARGET_NOT_MET, 0,
                                 g_strdup_printf (_("U %s exceeds the target %g W/(m²·K)."),
                                                  lamina_format_u_against (text, u, c->target_u), c->target_u));
    }
}

/* The limits, RT, U and the temperature profile from the current layer
 * resistances.  Ru sits in series beyond the outer layer (6.10). */
static void
solve (Calc         *calc,
       guint         cut,
       double        rse,
       LaminaResult *result)
{
  compute_limits (calc, calc->n, calc->rse + calc->ru, &result->r_upper, &result->r_lower);
  /* 6.7.2.1: RT = (R'T + R''T) / 2, e = (R'T − R''T) / (2 RT) */
  result->r_total = (result->r_upper + result->r_lower) / 2.0;
  result->relative_error = (result->r_upper - result->r_lower) / (2.0 * result->r_total);
  result->u = 1.0 / result->r_total;
  fill_layers (calc, cut, rse, result);
}

/* Annex D with ΔT > 5 K: the air layers' R depends on the temperatures,
 * which depend on R.  Take ΔT and the mean temperature of each air layer
 * (and of each bridged layer with air parts) from the profile, recompute,
 * and repeat until nothing moves. */
static gboolean
iterate_air_layers (Calc         *calc,
                    guint         cut,
                    double        rse,
                    LaminaResult *result,
                    GError      **error)
{
  const LaminaConstruction *c = calc->c;

  for (guint round = 1; round <= AIR_ITERATION_MAX; round++)
    {
      double change = 0.0;

      for (guint i = 0; i < cut; i++)
        {
          const LaminaLayer *layer = c->layers->pdata[i];
          const LaminaLayerResult *lr = &result->layers[i];
          double dt = fabs (lr->temperature_inner - lr->temperature_outer);
          double tm = (lr->temperature_inner + lr->temperature_outer) / 2.0;
          double r;

          if (layer->kind == LAMINA_LAYER_AIR)
            {
              if (!air_resistance (calc, c->heat_flow, layer->thickness, layer->air_width,
                                   layer->emissivity_inner, layer->emissivity_outer, dt, tm, &r, error))
                return prefix_error (error, i + 1, 0);
              change = MAX (change, fabs (r - calc->r[i]));
              calc->r[i] = r;
            }
          else if (layer->kind == LAMINA_LAYER_BRIDGED)
            {
              double conductance = 0.0;

              for (guint p = 0; p < layer->parts->len; p++)
                {
                  const LaminaPart *part = layer->parts->pdata[p];

                  if (lamina_part_is_air (part))
                    {
                      if (!part_air_resistance (calc, c->heat_flow, layer, part, dt, tm, &r, error))
                        return prefix_error (error, i + 1, (int) p + 1);
                      change = MAX (change, fabs (r - calc->part_r[i][p]));
                      calc->part_r[i][p] = r;
                    }
                  conductance += lamina_layer_get_part_fraction (layer, p) / calc->part_r[i][p];
                }
              calc->r[i] = 1.0 / conductance;
            }
        }
      solve (calc, cut, rse, result);
      result->air_iterations = round;
      if (change < AIR_ITERATION_TOLERANCE)
        break;
    }
  return TRUE;
}

/* Annex E: RT so far is R0 (the thin end); the wedge adds R1 at its thick
 * end, and U is the mean of 1/R over the plan. */
static void
apply_taper (const Calc   *calc,
             LaminaResult *result)
{
  for (guint i = 0; i < calc->n; i++)
    {
      const LaminaLayer *layer = calc->c->layers->pdata[i];

      if (!lamina_layer_is_tapered (layer) || result->layers[i].disregarded)
        continue;
      result->tapered = TRUE;
      result->tapered_layer = i + 1;
      result->tapered_r0 = result->r_total;
      result->tapered_r1 = (layer->thickness_max - layer->thickness) / 1000.0 / layer->material->conductivity;
      result->u_thin_end = 1.0 / result->tapered_r0;
      result->u_thick_end = 1.0 / (result->tapered_r0 + result->tapered_r1);
      result->u = lamina_tapered_u (layer->taper, result->tapered_r0, result->tapered_r1);
      return;
    }
}

/* EN ISO 13370: Rf is the floor's own resistance without its surface
 * resistances (area mean with a tapered layer). */
static double
floor_resistance (const LaminaResult *result)
{
  return 1.0 / result->u - result->rsi - result->rse;
}

static void
apply_ground (const LaminaConstruction *c,
              LaminaResult             *result)
{
  if (!c->has_ground)
    return;
  result->has_ground = TRUE;
  lamina_ground_calculate (&c->ground, floor_resistance (result), NAN, &result->ground);
}

const double lamina_ground_table_b_prime[LAMINA_GROUND_TABLE_ROWS] = { 2, 4, 6, 8, 10, 15, 20 };

void
lamina_result_ground_table (const LaminaConstruction *construction,
                            const LaminaResult       *result,
                            double                    u[LAMINA_GROUND_TABLE_ROWS])
{
  g_return_if_fail (construction->has_ground && result->has_ground);

  for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
    {
      LaminaGroundResult row;

      lamina_ground_calculate (&construction->ground, floor_resistance (result),
                               lamina_ground_table_b_prime[i], &row);
      u[i] = row.u;
    }
}

static void
note_method (const LaminaConstruction *c,
             LaminaResult             *result)
{
  if (result->has_ground && result->ground.soil_assumed)
    lamina_result_add_warning (result, LAMINA_WARNING_SOIL_ASSUMED, 0,
                               g_strdup_printf (_("The soil is not known: λ = %.1f W/(m·K) is assumed "
                                                  "(EN ISO 13370, sand or gravel)."),
                                                result->ground.soil_conductivity));
  if (result->has_ground)
    lamina_result_add_warning (result, LAMINA_WARNING_GROUND, 0,
                               g_strdup_printf (_("U with the ground (EN ISO 13370) is %.3f W/(m²·K) for "
                                                  "B′ = %.2f m only; check it for each building's plan."),
                                                result->ground.u, result->ground.b_prime));
  if (result->tapered)
    lamina_result_add_warning (result, LAMINA_WARNING_TAPERED, (int) result->tapered_layer,
                               g_strdup_printf (_("Layer %u is tapered: U is the area mean over the plan "
                                                  "(EN ISO 6946 Annex E), from %.3f at the thin end to "
                                                  "%.3f W/(m²·K) at the thick end."),
                                                result->tapered_layer, result->u_thin_end, result->u_thick_end));
  if (result->r_unheated > 0)
    lamina_result_add_warning (result, LAMINA_WARNING_UNHEATED_SPACE, 0,
                               g_strdup_printf (_("The unheated space outside counts as Ru = %.3f m²·K/W "
                                                  "(EN ISO 6946 6.10)."),
                                                result->r_unheated));
  (void) c;
}

LaminaResult *
lamina_calculate (const LaminaConstruction *construction,
                  GError                  **error)
{
  const LaminaConstruction *c = construction;
  Calc calc = { 0 };
  LaminaResult *result;
  guint cut;
  double rse;

  g_return_val_if_fail (c != NULL, NULL);

  if (!lamina_construction_validate (c, NULL, error))
    return NULL;

  calc.c = c;
  calc.n = c->layers->len;
  /* 6.8 / Annex C; a face to another indoor space takes Rsi on both sides. */
  lamina_surface_resistances (c, &calc.rsi, &calc.rse);
  calc.ru = lamina_unheated_resistance (&c->unheated);
  calc.scratch = lamina_scratch_begin ();
  calc.r = lamina_scratch_alloc (calc.scratch, sizeof (double) * calc.n);
  calc.part_r = lamina_scratch_alloc (calc.scratch, sizeof (double *) * calc.n);
  calc.air = lamina_scratch_alloc (calc.scratch, sizeof (LaminaAirKind) * calc.n);
  calc.bridged = lamina_scratch_alloc (calc.scratch, sizeof (guint) * calc.n);

  if (!resolve_layers (&calc, c->heat_flow, error)
      || !lamina_sections_build (c, calc.scratch, &calc.sections, error))
    {
      lamina_scratch_end (calc.scratch);
      return NULL;
    }

  result = lamina_result_new (calc.n);
  result->heat_flow = c->heat_flow;
  result->inside_temperature = c->inside_temperature;
  result->outside_temperature = c->outside_temperature;
  result->thickness = lamina_construction_get_thickness (c);
  result->n_sections = calc.n_bridged > 0 ? calc.sections.n_sections : 1;
  cut = find_cut (&calc);
  rse = cut < calc.n ? calc.rsi : calc.rse;
  result->rsi = calc.rsi;
  result->rse = rse;

  result->r_unheated = cut == calc.n ? calc.ru : 0.0;

  solve (&calc, cut, rse, result);
  if (c->surfaces.air_from_profile
      && !iterate_air_layers (&calc, cut, rse, result, error))
    {
      lamina_scratch_end (calc.scratch);
      lamina_result_free (result);
      return NULL;
    }
  apply_taper (&calc, result);

  note_ventilation (&calc, cut, result);
  check_scope (&calc, result);
  apply_corrections (&calc, cut, result);
  apply_ground (c, result);
  note_method (c, result);
  check_target (c, result);

  lamina_scratch_end (calc.scratch);
  return result;
}
