/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Surface and interstitial condensation by EN ISO 13788:2012 (the monthly
 * method).  Clause numbers are given beside each rule; the standard was not
 * to hand when this was written, so they are from memory. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-moisture.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

G_DEFINE_BOXED_TYPE (LaminaMoistureResult, lamina_moisture_result,
                     lamina_moisture_result_copy, lamina_moisture_result_free)

/* Annex A: Δp at θe ≤ 0 °C for classes 1–5 (Δv 0.002…0.010 kg/m³). */
static const double class_excess[5] = { 270.0, 540.0, 810.0, 1080.0, 1350.0 };
/* 4.2.3 (from memory): the design internal vapour pressure adds a safety
 * factor of 1.10 to the class's excess. */
#define CLASS_SAFETY_FACTOR 1.10

double
lamina_saturation_pressure (double temperature)
{
  double t = temperature;

  /* Annex E, E.1 (over water) and E.2 (over ice), from memory. */
  if (t >= 0.0)
    return 610.5 * exp (17.269 * t / (237.3 + t));
  return 610.5 * exp (21.875 * t / (265.5 + t));
}

double
lamina_saturation_temperature (double pressure)
{
  double x;

  g_return_val_if_fail (pressure > 0.0, NAN);

  /* The inverse of E.1/E.2: θ = b·x / (a − x), x = ln (p / 610.5). */
  x = log (pressure / 610.5);
  if (pressure >= 610.5)
    return 237.3 * x / (17.269 - x);
  return 265.5 * x / (21.875 - x);
}

double
lamina_humidity_class_excess (int    humidity_class,
                              double outside_temperature)
{
  double full;

  g_return_val_if_fail (humidity_class >= 1 && humidity_class <= 5, NAN);

  /* Annex A: full excess at θe ≤ 0 °C, falling linearly to 0 at 20 °C. */
  full = class_excess[humidity_class - 1];
  if (outside_temperature <= 0.0)
    return full;
  if (outside_temperature >= 20.0)
    return 0.0;
  return full * (1.0 - outside_temperature / 20.0);
}

/* Results */

static void
warning_free (gpointer data)
{
  LaminaMoistureWarning *warning = data;

  g_free (warning->message);
  g_free (warning);
}

static gpointer
warning_copy (gconstpointer src,
              gpointer      user_data)
{
  const LaminaMoistureWarning *warning = src;
  LaminaMoistureWarning *copy = g_memdup2 (warning, sizeof *warning);

  copy->message = g_strdup (warning->message);
  return copy;
}

static LaminaMoistureResult *
result_new (guint n_layers)
{
  LaminaMoistureResult *r = g_new0 (LaminaMoistureResult, 1);
  guint n = n_layers + 1;

  r->n_layers = n_layers;
  r->n_points = n;
  r->layer_index = g_new0 (guint, n_layers);
  r->resistance = g_new0 (double, n_layers);
  r->position = g_new0 (double, n);
  r->sd = g_new0 (double, n);
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      /* One block per month: temperature, psat, pressure, accumulation. */
      double *block = g_new0 (double, 4 * n);

      r->months[m].temperature = block;
      r->months[m].saturation = block + n;
      r->months[m].pressure = block + 2 * n;
      r->months[m].accumulation = block + 3 * n;
    }
  r->f_rsi_min = NAN;
  r->inside_humidity = NAN;
  r->warnings = g_ptr_array_new_with_free_func (warning_free);
  return r;
}

LaminaMoistureResult *
lamina_moisture_result_copy (const LaminaMoistureResult *result)
{
  LaminaMoistureResult *copy;
  guint n;

  g_return_val_if_fail (result != NULL, NULL);

  n = result->n_points;
  copy = g_memdup2 (result, sizeof *result);
  copy->layer_index = g_memdup2 (result->layer_index, sizeof (guint) * result->n_layers);
  copy->resistance = g_memdup2 (result->resistance, sizeof (double) * result->n_layers);
  copy->position = g_memdup2 (result->position, sizeof (double) * n);
  copy->sd = g_memdup2 (result->sd, sizeof (double) * n);
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      double *block = g_memdup2 (result->months[m].temperature, sizeof (double) * 4 * n);

      copy->months[m].temperature = block;
      copy->months[m].saturation = block + n;
      copy->months[m].pressure = block + 2 * n;
      copy->months[m].accumulation = block + 3 * n;
    }
  copy->warnings = g_ptr_array_copy (result->warnings, warning_copy, NULL);
  g_ptr_array_set_free_func (copy->warnings, warning_free);
  return copy;
}

void
lamina_moisture_result_free (LaminaMoistureResult *result)
{
  if (result == NULL)
    return;
  g_free (result->layer_index);
  g_free (result->resistance);
  g_free (result->position);
  g_free (result->sd);
  for (int m = 0; m < LAMINA_MONTHS; m++)
    g_free (result->months[m].temperature);
  g_ptr_array_unref (result->warnings);
  g_free (result);
}

gboolean
lamina_moisture_result_has_warning (const LaminaMoistureResult *result,
                                    LaminaMoistureWarningKind   kind)
{
  for (guint i = 0; i < result->warnings->len; i++)
    if (((LaminaMoistureWarning *) result->warnings->pdata[i])->kind == kind)
      return TRUE;
  return FALSE;
}

gboolean
lamina_moisture_result_fails (const LaminaMoistureResult *result)
{
  return !result->surface_passes || !result->dries_out || result->over_limit;
}

static void
add_warning (LaminaMoistureResult     *result,
             LaminaMoistureWarningKind kind,
             char                     *message)
{
  LaminaMoistureWarning *warning = g_new0 (LaminaMoistureWarning, 1);

  warning->kind = kind;
  warning->message = message;
  g_ptr_array_add (result->warnings, warning);
}

/* The section */

static gboolean
fail_layer (GError           **error,
            guint              number,
            const LaminaLayer *layer,
            const char        *message)
{
  g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
               _("layer %u (%s): %s"), number, lamina_layer_get_label (layer), message);
  return FALSE;
}

/* sd of a material's thickness: μ·d (3.1, from memory). */
static gboolean
material_sd (const LaminaMaterial *material,
             double                thickness,
             guint                 number,
             double               *sd,
             GError              **error)
{
  double mu = material->vapour_resistance_factor;

  if (!isfinite (mu) || mu <= 0.0)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("layer %u: material “%s” has no vapour resistance factor μ, which the moisture "
                     "check needs"), number, material->name ? material->name : material->id);
      return FALSE;
    }
  *sd = mu * thickness / 1000.0;
  return TRUE;
}

static guint
largest_part (const LaminaLayer *layer)
{
  guint best = 0;

  for (guint p = 1; p < layer->parts->len; p++)
    if (lamina_layer_get_part_fraction (layer, p) > lamina_layer_get_part_fraction (layer, best))
      best = p;
  return best;
}

/* R and sd of layer @i as the moisture check reads it.  A bridged layer
 * enters through its largest part (a reading fixed for the product). */
static gboolean
read_layer (const LaminaConstruction *c,
            const LaminaResult       *thermal,
            guint                     i,
            double                   *r,
            double                   *sd,
            GError                  **error)
{
  const LaminaLayer *layer = c->layers->pdata[i];
  double d = layer->thickness / 1000.0;
  double own_sd = NAN;

  *r = thermal->layers[i].resistance;
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      if (isnan (layer->sd) && !material_sd (layer->material, layer->thickness, i + 1, &own_sd, error))
        return FALSE;
      break;
    case LAMINA_LAYER_RESISTANCE:
      if (isnan (layer->sd))
        return fail_layer (error, i + 1, layer,
                           _("a layer of declared thermal resistance needs its sd for the moisture check"));
      break;
    case LAMINA_LAYER_AIR:
      /* Still air: μ = 1 (EN ISO 10456, from memory). */
      own_sd = d;
      break;
    case LAMINA_LAYER_BRIDGED:
      {
        const LaminaPart *part = layer->parts->pdata[largest_part (layer)];

        if (part->material == NULL)
          {
            if (!lamina_air_layer_resistance (layer->thickness, c->heat_flow, LAMINA_DEFAULT_EMISSIVITY,
                                              LAMINA_DEFAULT_EMISSIVITY, r, error))
              return FALSE;
            own_sd = d;
          }
        else
          {
            *r = d / part->material->conductivity;
            if (isnan (layer->sd) && !material_sd (part->material, layer->thickness, i + 1, &own_sd, error))
              return FALSE;
          }
      }
      break;
    case LAMINA_N_LAYER_KINDS:
    default:
      g_assert_not_reached ();
    }
  *sd = isnan (layer->sd) ? own_sd : layer->sd;
  return TRUE;
}

static gboolean
read_section (const LaminaConstruction *c,
              const LaminaResult       *thermal,
              LaminaMoistureResult    **out,
              GError                  **error)
{
  g_autoptr(LaminaMoistureResult) result = NULL;
  guint kept = 0;

  while (kept < thermal->n_layers && !thermal->layers[kept].disregarded)
    kept++;
  result = result_new (kept);
  result->rsi = thermal->rsi;
  result->rse = thermal->rse;
  for (guint i = 0; i < kept; i++)
    {
      double r, sd;

      if (!read_layer (c, thermal, i, &r, &sd, error))
        return FALSE;
      result->layer_index[i] = i;
      result->resistance[i] = r;
      result->position[i + 1] = result->position[i] + ((LaminaLayer *) c->layers->pdata[i])->thickness;
      result->sd[i + 1] = result->sd[i] + sd;
    }
  if (kept < thermal->n_layers)
    add_warning (result, LAMINA_MOISTURE_WARNING_LAYERS_DROPPED,
                 g_strdup_printf (_("Layer %u is a well ventilated air layer: it and the layers outside it "
                                    "are left out, with Rse = Rsi and the outside vapour pressure taken "
                                    "at that layer."), kept + 1));
  *out = g_steal_pointer (&result);
  return TRUE;
}

/* Inside and outside conditions of each month (4.2, Annex A). */
static void
set_conditions (const LaminaConstruction *c,
                const LaminaClimate      *climate,
                LaminaMoistureResult     *result)
{
  const LaminaMoistureSettings *s = c->moisture;
  double ti = isnan (s->inside_temperature) ? c->inside_temperature : s->inside_temperature;

  result->humidity_class = s->humidity_class;
  result->inside_humidity = s->inside_humidity;
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      double te = climate->temperature[m];
      double pe = climate->humidity[m] * lamina_saturation_pressure (te);

      result->inside_temperature[m] = ti;
      result->outside_temperature[m] = te;
      result->outside_pressure[m] = pe;
      /* Annex A: pi = pe + 1.10·Δp for a class; else φi·psat(θi). */
      if (s->humidity_class != 0)
        result->inside_pressure[m] = pe + CLASS_SAFETY_FACTOR
                                          * lamina_humidity_class_excess (s->humidity_class, te);
      else
        result->inside_pressure[m] = s->inside_humidity * lamina_saturation_pressure (ti);
    }
}

/* Clause 5: mould on the inner surface.  The lowest acceptable inner
 * surface temperature keeps φsi ≤ 0.8: psat(θsi,min) = pi / 0.8, and
 * fRsi,min = (θsi,min − θe) / (θi − θe).  The construction's own
 * fRsi = 1 − Rsi·U* with Rsi = 0.25 (4.3). */
static void
check_surface (const LaminaResult   *thermal,
               LaminaMoistureResult *result)
{
  double rt = thermal->r_total - thermal->rsi + LAMINA_MOISTURE_SURFACE_RSI;

  result->u_star = 1.0 / rt;
  result->f_rsi = 1.0 - LAMINA_MOISTURE_SURFACE_RSI * result->u_star;
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      double ti = result->inside_temperature[m], te = result->outside_temperature[m];
      double tsi = lamina_saturation_temperature (result->inside_pressure[m] / LAMINA_MOISTURE_MOULD_HUMIDITY);

      /* No heat flows outwards: the month cannot be critical. */
      result->f_rsi_min_month[m] = ti - te > 0.0 ? (tsi - te) / (ti - te) : NAN;
      if (!isnan (result->f_rsi_min_month[m])
          && (result->critical_month == 0 || result->f_rsi_min_month[m] > result->f_rsi_min))
        {
          result->critical_month = m + 1;
          result->f_rsi_min = result->f_rsi_min_month[m];
        }
    }
  result->surface_passes = result->critical_month == 0 || result->f_rsi >= result->f_rsi_min;
}

/* Temperatures and psat at the points of the section in each month. */
static void
set_profiles (LaminaMoistureResult *result)
{
  double total = result->rsi + result->rse;

  for (guint i = 0; i < result->n_layers; i++)
    total += result->resistance[i];
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      LaminaMoistureMonth *month = &result->months[m];
      double ti = result->inside_temperature[m], te = result->outside_temperature[m];
      double cumulative = result->rsi;

      for (guint j = 0; j < result->n_points; j++)
        {
          month->temperature[j] = ti - (ti - te) * cumulative / total;
          month->saturation[j] = lamina_saturation_pressure (month->temperature[j]);
          if (j < result->n_layers)
            cumulative += result->resistance[j];
        }
    }
}

static gboolean
run_month (LaminaMoistureResult *result,
           int                   m,
           double               *accumulation)
{
  return lamina_glaser_month (result->n_points, result->sd, result->months[m].saturation,
                              result->inside_pressure[m], result->outside_pressure[m],
                              lamina_month_days (m + 1) * 86400.0, accumulation,
                              result->months[m].pressure);
}

/* Clause 7.3 (from memory): the year starts in the first month with
 * condensation after one without, each month tested from dry; months are
 * tried in calendar order.  Condensation in every month starts in January. */
static int
find_start_month (LaminaMoistureResult *result,
                  double               *accumulation)
{
  gboolean wet[LAMINA_MONTHS];
  gboolean any = FALSE;

  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      memset (accumulation, 0, sizeof (double) * result->n_points);
      wet[m] = run_month (result, m, accumulation);
      any |= wet[m];
    }
  if (!any)
    return 0;
  for (int m = 0; m < LAMINA_MONTHS; m++)
    if (wet[m] && !wet[(m + LAMINA_MONTHS - 1) % LAMINA_MONTHS])
      return m + 1;
  return 1;
}

static void
check_interstitial (LaminaMoistureResult *result)
{
  g_autofree double *accumulation = g_new0 (double, result->n_points);
  int start;

  start = find_start_month (result, accumulation);
  result->start_month = start;
  result->dries_out = TRUE;
  if (start == 0)
    return;   /* the dry runs left the pressure lines of every month */

  result->condensation = TRUE;
  memset (accumulation, 0, sizeof (double) * result->n_points);
  for (int k = 0; k < LAMINA_MONTHS; k++)
    {
      int m = (start - 1 + k) % LAMINA_MONTHS;
      double sum = 0.0;

      run_month (result, m, accumulation);
      for (guint j = 0; j < result->n_points; j++)
        sum += accumulation[j];
      memcpy (result->months[m].accumulation, accumulation, sizeof (double) * result->n_points);
      result->accumulation[m] = sum;
      if (sum > result->max_accumulation)
        {
          result->max_accumulation = sum;
          result->max_month = m + 1;
        }
    }
  for (guint j = 0; j < result->n_points; j++)
    if (accumulation[j] > 0.0)
      result->dries_out = FALSE;
  result->over_limit = result->max_accumulation > result->limit;
}

/* The plane holding most moisture in the worst month, as "between layers
 * a and b" of the construction (1-based). */
static void
worst_plane (const LaminaMoistureResult *result,
             guint                      *inner,
             guint                      *outer)
{
  const double *acc = result->months[MAX (result->max_month, 1) - 1].accumulation;
  guint best = 1;

  for (guint j = 1; j + 1 < result->n_points; j++)
    if (acc[j] > acc[best])
      best = j;
  *inner = result->layer_index[best - 1] + 1;
  *outer = result->layer_index[best] + 1;
}

static void
add_findings (LaminaMoistureResult *result)
{
  if (!result->surface_passes)
    add_warning (result, LAMINA_MOISTURE_WARNING_SURFACE,
                 g_strdup_printf (_("Risk of mould on the inner surface: fRsi %.3f is below fRsi,min %.3f "
                                    "in %s (EN ISO 13788 clause 5)."),
                                  result->f_rsi, result->f_rsi_min, lamina_month_name (result->critical_month)));
  if (result->condensation && result->n_points > 2)
    {
      guint inner, outer;

      worst_plane (result, &inner, &outer);
      add_warning (result, LAMINA_MOISTURE_WARNING_CONDENSATION,
                   g_strdup_printf (_("Interstitial condensation between layers %u and %u: up to %.3f kg/m² "
                                      "at the end of %s (EN ISO 13788 clause 7)."),
                                    inner, outer, result->max_accumulation,
                                    lamina_month_name (result->max_month)));
    }
  if (!result->dries_out)
    add_warning (result, LAMINA_MOISTURE_WARNING_NOT_DRYING,
                 g_strdup_printf (_("The condensate does not dry out in the year (%.3f kg/m² left after "
                                    "12 months): the construction fails."),
                                  result->accumulation[(result->start_month + LAMINA_MONTHS - 2) % LAMINA_MONTHS]));
  if (result->over_limit)
    add_warning (result, LAMINA_MOISTURE_WARNING_OVER_LIMIT,
                 g_strdup_printf (_("The largest accumulation, %.3f kg/m², exceeds the office limit of "
                                    "%.2f kg/m² (0.5 kg/m² is common practice)."),
                                  result->max_accumulation, result->limit));
  add_warning (result, LAMINA_MOISTURE_WARNING_METHOD,
               g_strdup (_("EN ISO 13788 uses monthly means and ignores liquid transport, built-in moisture, "
                           "rain and air leakage: a failing or borderline result needs a hygrothermal "
                           "simulation (EN 15026) or specialist advice. Local codes and licensed practice "
                           "govern.")));
}

LaminaMoistureResult *
lamina_moisture_calculate (const LaminaConstruction *construction,
                           const LaminaClimate      *climate,
                           double                    limit,
                           GError                  **error)
{
  const LaminaConstruction *c = construction;
  g_autoptr(LaminaResult) thermal = NULL;
  g_autoptr(LaminaMoistureResult) result = NULL;

  g_return_val_if_fail (c != NULL, NULL);

  if (c->moisture == NULL)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("construction “%s” has no moisture settings"), c->id ? c->id : "");
      return NULL;
    }
  if (climate == NULL || g_strcmp0 (c->moisture->climate, climate->id) != 0)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("construction “%s” is checked for climate “%s”, not “%s”"),
                   c->id ? c->id : "", c->moisture->climate, climate ? climate->id : "");
      return NULL;
    }
  if (!lamina_climate_validate (climate, error)
      || (thermal = lamina_calculate (c, error)) == NULL
      || !read_section (c, thermal, &result, error))
    return NULL;

  result->limit = isnan (limit) ? LAMINA_MOISTURE_DEFAULT_LIMIT : limit;
  set_conditions (c, climate, result);
  check_surface (thermal, result);
  set_profiles (result);
  check_interstitial (result);
  add_findings (result);
  return g_steal_pointer (&result);
}

LaminaMoistureResult *
lamina_moisture_calculate_own (const LaminaConstruction *construction,
                               double                    limit,
                               GError                  **error)
{
  g_return_val_if_fail (construction != NULL, NULL);

  if (construction->moisture != NULL && construction->moisture->climate_data == NULL)
    {
      g_set_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID,
                   _("moisture check: the data of climate “%s” are not known"),
                   construction->moisture->climate);
      return NULL;
    }
  return lamina_moisture_calculate (construction,
                                    construction->moisture ? construction->moisture->climate_data : NULL,
                                    limit, error);
}
