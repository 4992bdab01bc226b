/* SPDX-License-Identifier: GPL-3.0-or-later */
/* One repeating module of a construction, calculated in two dimensions
 * (EN ISO 10211:2017).
 *
 * The section runs across the framing: x across the module, y from the
 * inner surface outwards.  The module is as wide as the largest member
 * spacing of the bridged layers in the section; each member is centred in
 * its share of the module, and members that the construction names in
 * several layers keep the same centre in each, so they line up as built.
 * The edges of the module are lines of symmetry (mid-bay), so adiabatic.
 *
 * One pattern of bridged layers lies in the section: the one with metal
 * bridging insulation if any, else the one whose layers differ most
 * between parallel and series conduction.  Other bridged layers cross the
 * section (battens across studs) and enter with their layer's lower-limit
 * equivalent conductivity d / R of EN ISO 6946 6.7.2.3; unventilated air
 * layers enter as d / R with R from 6.9.2.  A well-ventilated air layer
 * and everything outside it are left out with Rse = Rsi (6.9.4), as in
 * the EN ISO 6946 result.  The notes of the result say all this. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-field.h"
#include "lamina-calc-private.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

/* With no member spacing given (fractions only), a module this wide. */
#define DEFAULT_MODULE_WIDTH 600.0
/* A build-up without bridged layers is one-dimensional: any width does. */
#define PLAIN_MODULE_WIDTH 100.0
/* Grid of the first pass, mm: largest spacing, spacing at material lines. */
#define COARSE_SPACING 20.0
#define FINE_SPACING 1.0
/* A declared resistance below this is taken as this (m²·K/W), so that a
 * layer declared R = 0 keeps a finite conductance; the effect on U is
 * below 0.01 %. */
#define MIN_DECLARED_RESISTANCE 1e-4
/* Along a layer of declared resistance (membranes, foils) heat is assumed
 * to spread no better than this, W/(m·K) (common practice: such layers are
 * thin; their lateral conduction is negligible). */
#define DECLARED_LATERAL_CONDUCTIVITY 1.0

typedef struct
{
  const LaminaConstruction *c;
  const LaminaResult       *r6946;
  guint                     n;        /* layers modelled (before a cut) */
  gboolean                 *in_plane; /* per layer */
  GPtrArray                *slots;    /* member names (borrowed), or part names for a plain layer */
  int                       plain;    /* the plain in-plane layer, or −1 */
  double                    width;    /* mm */
  GArray                   *regions;  /* LaminaFieldRegion */
  GArray                   *lambda;   /* double pairs (x, y) per region */
  GPtrArray                *notes;
} Build;

void
lamina_field_result_free (LaminaFieldResult *result)
{
  if (result == NULL)
    return;
  if (result->notes != NULL)
    g_ptr_array_unref (result->notes);
  g_free (result->regions);
  lamina_field_solution_free (result->field);
  g_free (result);
}

gboolean
lamina_field_is_advised (const LaminaResult *result)
{
  return lamina_result_has_warning (result, LAMINA_WARNING_METAL_BRIDGED_INSULATION)
         || lamina_result_has_warning (result, LAMINA_WARNING_RATIO_OUT_OF_RANGE);
}

/* Resistance of a part, m²·K/W, as EN ISO 6946 takes it. */
static gboolean
part_resistance (const LaminaConstruction *c,
                 const LaminaLayer        *layer,
                 const LaminaPart         *part,
                 double                   *r,
                 GError                  **error)
{
  if (lamina_part_is_air (part))
    return lamina_air_layer_resistance (layer->thickness, c->heat_flow, LAMINA_DEFAULT_EMISSIVITY,
                                        LAMINA_DEFAULT_EMISSIVITY, r, error);
  *r = layer->thickness / 1000.0 / part->material->conductivity;
  return TRUE;
}

/* How much the layer's parts differ: parallel over series conductance
 * (1 for a uniform layer). */
static double
layer_contrast (const LaminaConstruction *c,
                const LaminaLayer        *layer)
{
  double parallel = 0.0, series = 0.0;

  for (guint p = 0; p < layer->parts->len; p++)
    {
      double f = lamina_layer_get_part_fraction (layer, p), r;

      if (!part_resistance (c, layer, layer->parts->pdata[p], &r, NULL))
        return 1.0;
      parallel += f / r;
      series += f * r;
    }
  return parallel * series;
}

static gboolean
layer_names_member (const LaminaLayer *layer,
                    const char        *member)
{
  for (guint p = 0; p < layer->parts->len; p++)
    if (g_strcmp0 (((LaminaPart *) layer->parts->pdata[p])->member, member) == 0)
      return TRUE;
  return FALSE;
}

/* The part that fills the rest of a plain layer: the remainder part, or
 * the one with the largest fraction. */
static guint
plain_infill (const LaminaLayer *layer)
{
  guint best = 0;

  for (guint p = 0; p < layer->parts->len; p++)
    {
      if (isnan (lamina_part_get_given_fraction (layer->parts->pdata[p])))
        return p;
      if (lamina_layer_get_part_fraction (layer, p) > lamina_layer_get_part_fraction (layer, best))
        best = p;
    }
  return best;
}

static void
choose_section_pattern (Build *b)
{
  const LaminaConstruction *c = b->c;
  int primary = -1;
  double best = 0.0;
  gboolean grew = TRUE;

  for (guint i = 0; i < b->n; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      double score;

      if (layer->kind != LAMINA_LAYER_BRIDGED)
        continue;
      /* How much the layer's bridging can change U: its contrast over
       * its thickness; metal bridging insulation first. */
      score = (layer_contrast (c, layer) - 1.0) * layer->thickness
              * (lamina_layer_metal_bridges_insulation (layer) ? 1e6 : 1.0);
      if (primary < 0 || score > best)
        {
          primary = (int) i;
          best = score;
        }
    }
  if (primary < 0)
    return;
  b->in_plane[primary] = TRUE;
  if (!lamina_layer_has_members (c->layers->pdata[primary]))
    {
      b->plain = primary;
      return;
    }
  /* The layers that share a member with the pattern, transitively. */
  while (grew)
    {
      grew = FALSE;
      for (guint i = 0; i < b->n; i++)
        {
          const LaminaLayer *a = c->layers->pdata[i];

          if (!b->in_plane[i])
            continue;
          for (guint p = 0; p < a->parts->len; p++)
            {
              const char *member = ((LaminaPart *) a->parts->pdata[p])->member;
              if (member == NULL)
                continue;
              for (guint j = 0; j < b->n; j++)
                {
                  const LaminaLayer *o = c->layers->pdata[j];
                  if (!b->in_plane[j] && o->kind == LAMINA_LAYER_BRIDGED && layer_names_member (o, member))
                    b->in_plane[j] = grew = TRUE;
                }
            }
        }
    }
}

/* The slots across the module and the module width. */
static void
lay_out_members (Build *b)
{
  const LaminaConstruction *c = b->c;
  double spacing = 0.0;

  for (guint i = 0; i < b->n; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      if (!b->in_plane[i])
        continue;
      for (guint p = 0; p < layer->parts->len; p++)
        {
          const LaminaPart *part = layer->parts->pdata[p];
          gboolean known = FALSE;

          if (!isnan (part->spacing))
            spacing = MAX (spacing, part->spacing);
          if (b->plain >= 0)
            {
              if (p != plain_infill (layer))
                g_ptr_array_add (b->slots, GUINT_TO_POINTER (p + 1));
              continue;
            }
          if (part->member == NULL)
            continue;
          for (guint s = 0; s < b->slots->len && !known; s++)
            known = strcmp (b->slots->pdata[s], part->member) == 0;
          if (!known)
            g_ptr_array_add (b->slots, part->member);
        }
    }
  if (b->slots->len == 0)
    b->width = PLAIN_MODULE_WIDTH;
  else if (spacing > 0)
    b->width = spacing;
  else
    {
      b->width = DEFAULT_MODULE_WIDTH;
      g_ptr_array_add (b->notes, g_strdup_printf (_("No member spacing is given: the module is taken as %g mm wide, "
                                                    "the members as their area fractions of it."),
                                                  DEFAULT_MODULE_WIDTH));
    }
}

static void
add_region (Build  *b,
            double  x0,
            double  x1,
            double  y0,
            double  y1,
            int     layer,
            int     part,
            double  lambda_x,
            double  lambda_y)
{
  LaminaFieldRegion region = { x0, y0, x1, y1, layer, part };

  g_array_append_val (b->regions, region);
  g_array_append_val (b->lambda, lambda_x);
  g_array_append_val (b->lambda, lambda_y);
}

static gboolean
add_bridged_in_plane (Build             *b,
                      guint              i,
                      double             y0,
                      double             y1,
                      GError           **error)
{
  const LaminaLayer *layer = b->c->layers->pdata[i];
  double d = layer->thickness / 1000.0, r;
  int infill = -1;
  guint k = b->slots->len;

  if (b->plain >= 0)
    infill = (int) plain_infill (layer);
  else
    for (guint p = 0; p < layer->parts->len && infill < 0; p++)
      if (((LaminaPart *) layer->parts->pdata[p])->member == NULL)
        infill = (int) p;
  if (infill < 0)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("layer %u: every part names a framing member, so nothing fills the rest of the module; "
                     "add an infill part without a member"), i + 1);
      return FALSE;
    }
  if (!part_resistance (b->c, layer, layer->parts->pdata[infill], &r, error))
    return FALSE;
  add_region (b, 0, b->width, y0, y1, (int) i, infill, d / r, d / r);

  for (guint s = 0; s < k; s++)
    {
      int part = -1;
      const LaminaPart *pp;
      double f, w, pitch;
      guint copies = 1;

      if (b->plain >= 0)
        part = (int) GPOINTER_TO_UINT (b->slots->pdata[s]) - 1;
      else
        for (guint p = 0; p < layer->parts->len && part < 0; p++)
          if (g_strcmp0 (((LaminaPart *) layer->parts->pdata[p])->member, b->slots->pdata[s]) == 0)
            part = (int) p;
      if (part < 0)
        continue;       /* this member does not reach the layer: infill */
      pp = layer->parts->pdata[part];
      if (!part_resistance (b->c, layer, pp, &r, error))
        return FALSE;
      if (!isnan (pp->spacing) && pp->spacing > 0)
        copies = (guint) MAX (1.0, round (b->width / pp->spacing));
      f = lamina_layer_get_part_fraction (layer, (guint) part);
      w = f * b->width / copies;
      pitch = b->width / copies;
      for (guint n = 0; n < copies; n++)
        {
          double centre = pitch * (n + (s + 0.5) / k);
          add_region (b, centre - w / 2, centre + w / 2, y0, y1, (int) i, part, d / r, d / r);
        }
    }
  return TRUE;
}

static gboolean
build_layers (Build   *b,
              GError **error)
{
  const LaminaConstruction *c = b->c;
  double y = 0.0;

  for (guint i = 0; i < b->n; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      double d = layer->thickness / 1000.0, y1 = y + layer->thickness, r, lambda;

      switch (layer->kind)
        {
        case LAMINA_LAYER_MATERIAL:
          lambda = layer->material->conductivity;
          add_region (b, 0, b->width, y, y1, (int) i, -1, lambda, lambda);
          break;
        case LAMINA_LAYER_RESISTANCE:
          lambda = d / MAX (layer->resistance, MIN_DECLARED_RESISTANCE);
          add_region (b, 0, b->width, y, y1, (int) i, -1, MIN (lambda, DECLARED_LATERAL_CONDUCTIVITY), lambda);
          break;
        case LAMINA_LAYER_AIR:
          if (!lamina_air_layer_resistance (layer->thickness, c->heat_flow, layer->emissivity_inner,
                                            layer->emissivity_outer, &r, error))
            {
              g_prefix_error (error, _("layer %u: "), i + 1);
              return FALSE;
            }
          lambda = d / r;
          add_region (b, 0, b->width, y, y1, (int) i, -1, lambda, lambda);
          g_ptr_array_add (b->notes,
                           g_strdup_printf (_("Layer %u, an unventilated air layer, conducts as d/R = %.3g W/(m·K) "
                                              "(R %.2f m²·K/W, EN ISO 6946 6.9.2)."), i + 1, lambda, r));
          break;
        case LAMINA_LAYER_BRIDGED:
          if (b->in_plane[i])
            {
              if (!add_bridged_in_plane (b, i, y, y1, error))
                return FALSE;
              break;
            }
          {
            double conductance = 0.0;

            for (guint p = 0; p < layer->parts->len; p++)
              {
                if (!part_resistance (c, layer, layer->parts->pdata[p], &r, error))
                  return FALSE;
                conductance += lamina_layer_get_part_fraction (layer, p) / r;
              }
            lambda = d * conductance;
            add_region (b, 0, b->width, y, y1, (int) i, -1, lambda, lambda);
            g_ptr_array_add (b->notes,
                             g_strdup_printf (_("Layer %u crosses the section: it enters with its lower-limit "
                                                "equivalent conductivity %.3g W/(m·K) (EN ISO 6946 6.7.2.3)."),
                                              i + 1, lambda));
          }
          break;
        case LAMINA_N_LAYER_KINDS:
        default:
          g_assert_not_reached ();
        }
      y = y1;
    }
  return TRUE;
}

static LaminaFieldModel *
make_model (const Build *b,
            double       rsi,
            double       rse,
            double      *height)
{
  LaminaFieldModel *model;
  double h = 0.0;

  for (guint k = 0; k < b->regions->len; k++)
    h = MAX (h, g_array_index (b->regions, LaminaFieldRegion, k).y1);
  *height = h;
  model = lamina_field_model_new (b->width / 1000.0, h / 1000.0);
  lamina_field_model_set_spacing (model, MIN (COARSE_SPACING, MAX (b->width, h) / 20.0) / 1000.0,
                                  FINE_SPACING / 1000.0);
  for (guint k = 0; k < b->regions->len; k++)
    {
      const LaminaFieldRegion *r = &g_array_index (b->regions, LaminaFieldRegion, k);
      guint m = lamina_field_model_add_material (model, g_array_index (b->lambda, double, 2 * k),
                                                 g_array_index (b->lambda, double, 2 * k + 1));
      lamina_field_model_add_rectangle (model, r->x0 / 1000.0, r->y0 / 1000.0, r->x1 / 1000.0, r->y1 / 1000.0, m);
    }
  /* Normalised temperatures: 1 inside, 0 outside; scaled afterwards. */
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_BOTTOM, rsi, 1.0);
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_TOP, rse, 0.0);
  return model;
}

static double
coldest_inner_node (const LaminaFieldSolution *s,
                    guint                     *index)
{
  double min = G_MAXDOUBLE;

  for (guint i = 0; i < s->nx; i++)
    if (s->t[i] < min)
      {
        min = s->t[i];
        if (index != NULL)
          *index = i;
      }
  return min;
}

/* The layers the check covers: those inside the first well ventilated
 * air layer (EN ISO 6946 6.9.4), said in a note.  Slightly ventilated air
 * layers are refused, as is a build-up with nothing inside the cut. */
static gboolean
find_cut (const LaminaConstruction *c,
          GPtrArray                *notes,
          guint                    *cut_out,
          GError                  **error)
{
  guint cut = c->layers->len;

  for (guint i = 0; i < c->layers->len && cut == c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      if (layer->kind != LAMINA_LAYER_AIR)
        continue;
      switch (lamina_air_layer_effective_kind (layer))
        {
        case LAMINA_AIR_WELL_VENTILATED:
          cut = i;
          g_ptr_array_add (notes,
                           g_strdup_printf (_("Layer %u is a well ventilated air layer: it and the layers outside "
                                              "it are left out and Rse is taken as Rsi (EN ISO 6946 6.9.4)."), i + 1));
          break;
        case LAMINA_AIR_SLIGHTLY_VENTILATED:
          g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                       _("layer %u: the 2-D check does not cover slightly ventilated air layers; "
                         "calculate the build-up with the layer unventilated and well ventilated"), i + 1);
          return FALSE;
        case LAMINA_AIR_UNVENTILATED:
        case LAMINA_N_AIR_KINDS:
        default:
          break;
        }
    }
  if (cut == 0)
    {
      g_set_error_literal (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                           _("nothing is left to calculate inside the well ventilated air layer"));
      return FALSE;
    }
  *cut_out = cut;
  return TRUE;
}

/* The result's figures from the solved fields (in temperature factors):
 * U with the Annex F corrections, the coldest inner surface at Rsi and at
 * the mould criterion's Rsi; then the field in °C. */
static void
fill_figures (LaminaFieldResult         *result,
              const LaminaConstruction  *c,
              const LaminaResult        *r6946,
              double                     width,
              double                     height,
              const LaminaFieldSolution *mould)
{
  double dt = c->inside_temperature - c->outside_temperature, theta;
  guint coldest = 0;

  result->inside_temperature = c->inside_temperature;
  result->outside_temperature = c->outside_temperature;
  result->module_width = width;
  result->thickness = height;
  result->cells = lamina_field_solution_get_cells (result->field);
  result->u_field = result->field->heat_flow[LAMINA_FIELD_SIDE_BOTTOM] / (width / 1000.0);
  result->u = result->u_field + r6946->delta_u;
  result->u_6946 = r6946->u_corrected;
  if (r6946->delta_u > 0)
    g_ptr_array_add (result->notes,
                     g_strdup_printf (_("U includes the EN ISO 6946 Annex F corrections, ΔU = %.3f W/(m²·K)."),
                                      r6946->delta_u));
  result->heat_flow = result->field->heat_flow[LAMINA_FIELD_SIDE_BOTTOM] * dt;
  theta = coldest_inner_node (result->field, &coldest);
  result->f_rsi = theta;
  result->min_inner_surface_temperature = c->outside_temperature + dt * theta;
  result->min_inner_surface_position = result->field->x[coldest] * 1000.0;
  result->f_rsi_mould = coldest_inner_node (mould, NULL);
  result->min_inner_surface_temperature_mould = c->outside_temperature + dt * result->f_rsi_mould;

  /* The field in °C for the picture and the probes. */
  for (gsize p = 0; p < (gsize) result->field->nx * result->field->ny; p++)
    result->field->t[p] = c->outside_temperature + dt * result->field->t[p];
  for (guint k = 0; k < LAMINA_FIELD_N_SIDES; k++)
    result->field->heat_flow[k] *= dt;
}

LaminaFieldResult *
lamina_field_calculate (const LaminaConstruction *construction,
                        guint                     max_nodes,
                        LaminaFieldProgress       progress,
                        gpointer                  user_data,
                        GError                  **error)
{
  const LaminaConstruction *c = construction;
  g_autoptr (LaminaResult) r6946 = NULL;
  g_autoptr (LaminaFieldResult) result = NULL;
  g_autoptr (LaminaFieldModel) model = NULL;
  g_autoptr (LaminaFieldSolution) mould = NULL;
  g_autofree gboolean *in_plane = NULL;
  g_autoptr (GPtrArray) slots = g_ptr_array_new ();
  g_autoptr (GArray) regions = g_array_new (FALSE, FALSE, sizeof (LaminaFieldRegion));
  g_autoptr (GArray) lambda = g_array_new (FALSE, FALSE, sizeof (double));
  Build b = { 0 };
  LaminaProgressShare share = { progress, user_data, 0.0, 0.85 };
  double height;
  guint cut;

  g_return_val_if_fail (c != NULL, NULL);

  r6946 = lamina_calculate (c, error);
  if (r6946 == NULL)
    return NULL;
  result = g_new0 (LaminaFieldResult, 1);
  result->notes = g_ptr_array_new_with_free_func (g_free);

  if (!find_cut (c, result->notes, &cut, error))
    return NULL;

  in_plane = g_new0 (gboolean, c->layers->len);
  b = (Build) { c, r6946, cut, in_plane, slots, -1, 0.0, regions, lambda, result->notes };
  choose_section_pattern (&b);
  lay_out_members (&b);
  if (!build_layers (&b, error))
    return NULL;
  if (regions->len > 250)
    {
      g_set_error_literal (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_UNSUPPORTED,
                           _("the build-up has too many regions for the 2-D check"));
      return NULL;
    }
  for (guint i = 0; i < cut; i++)
    if (in_plane[i])
      g_ptr_array_add (result->notes,
                       g_strdup_printf (_("Layer %u lies in the section: its members are drawn to size, "
                                          "centred in the module."), i + 1));

  result->rsi = r6946->rsi;
  result->rse = r6946->rse;
  model = make_model (&b, result->rsi, result->rse, &height);
  result->field = lamina_field_model_solve (model, max_nodes, &result->refinement,
                                            progress ? lamina_progress_share : NULL, &share, error);
  if (result->field == NULL)
    return NULL;
  if (!result->refinement.converged)
    g_ptr_array_add (result->notes,
                     g_strdup_printf (_("The grid did not converge to 0.1 %% within the node limit: the last "
                                        "halving changed U by %.2f %%."), 100.0 * result->refinement.change));

  /* The mould criterion's Rsi on the finest grid. */
  lamina_field_model_set_boundary (model, LAMINA_FIELD_SIDE_BOTTOM, LAMINA_FIELD_RSI_MOULD, 1.0);
  share.base = 0.85;
  share.share = 0.15;
  mould = lamina_field_model_solve_level (model, result->refinement.n_levels - 1, result->field,
                                          progress ? lamina_progress_share : NULL, &share, error);
  if (mould == NULL)
    return NULL;

  fill_figures (result, c, r6946, b.width, height, mould);
  result->n_regions = regions->len;
  result->regions = (LaminaFieldRegion *) g_array_free (g_steal_pointer (&regions), FALSE);
  return g_steal_pointer (&result);
}
