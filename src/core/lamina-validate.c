/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Validation of a construction before it is calculated or stored.  Every
 * message names the layer (1-based, from the inner surface), the part and
 * the field, with the allowed range. */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-construction.h"
#include "lamina-error.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

G_DEFINE_QUARK (lamina-calc-error-quark, lamina_calc_error)

#define MAX_LAYERS 200
#define MAX_PARTS  32
#define FRACTION_TOLERANCE 1e-6

typedef struct
{
  int     *line;
  GError **error;
} Check;

/* Where a value sits: formatted only when a check fails, so that a valid
 * construction costs no allocation. */
typedef struct
{
  guint layer;   /* 1-based, 0 for the construction */
  guint part;    /* 1-based, 0 for the layer itself */
} Where;

static char *
where_to_string (Where where)
{
  if (where.part == 0)
    return g_strdup_printf (_("layer %u"), where.layer);
  return g_strdup_printf (_("layer %u, part %u"), where.layer, where.part);
}

static gboolean
fail (Check      *check,
      int         line,
      const char *format,
      ...) G_GNUC_PRINTF (3, 4);

static gboolean
fail (Check      *check,
      int         line,
      const char *format,
      ...)
{
  va_list args;
  g_autofree char *message = NULL;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  if (check->line != NULL)
    *check->line = line;
  g_set_error_literal (check->error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID, message);
  return FALSE;
}

/* fail() with the location in front: "layer 2, part 1: …". */
static gboolean
fail_at (Check      *check,
         int         line,
         Where       where,
         const char *format,
         ...) G_GNUC_PRINTF (4, 5);

static gboolean
fail_at (Check      *check,
         int         line,
         Where       where,
         const char *format,
         ...)
{
  va_list args;
  g_autofree char *place = NULL;
  g_autofree char *message = NULL;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  /* A value of the construction itself needs no place: the caller (the XML
   * reader, the window's field) already names the construction. */
  if (where.layer == 0)
    return fail (check, line, "%s", message);
  place = where_to_string (where);
  return fail (check, line, "%s: %s", place, message);
}

/* TRUE when @value is finite and within [min, max] (or (min, max] when
 * @open_min). */
static gboolean
in_range (double   value,
          double   min,
          double   max,
          gboolean open_min)
{
  if (!isfinite (value))
    return FALSE;
  if (open_min ? value <= min : value < min)
    return FALSE;
  return value <= max;
}

static gboolean
check_range (Check      *check,
             int         line,
             Where       where,
             const char *field,
             double      value,
             double      min,
             double      max,
             gboolean    open_min,
             const char *unit)
{
  if (in_range (value, min, max, open_min))
    return TRUE;
  /* @field is marked with N_() by the callers and translated only here. */
  return fail_at (check, line, where, _("%s %g is outside the allowed range %s%g to %g%s%s"), _(field), value, open_min ? _("above ") : "", min, max,
               unit[0] ? " " : "", unit);
}

static gboolean
check_material (Check                *check,
                int                   line,
                Where                 where,
                const LaminaMaterial *material)
{
  if (material == NULL)
    return fail_at (check, line, where, _("no material"));
  return check_range (check, line, where, N_("thermal conductivity"),
                      material->conductivity, LAMINA_MIN_CONDUCTIVITY, LAMINA_MAX_CONDUCTIVITY, FALSE, "W/(m·K)");
}

static gboolean
check_part (Check             *check,
            const LaminaLayer *layer,
            Where              where,
            const LaminaPart  *part)
{
  gboolean has_fraction = !isnan (part->fraction);
  gboolean has_width = !isnan (part->width);
  gboolean has_spacing = !isnan (part->spacing);

  if (!lamina_part_is_air (part) && !check_material (check, part->line, where, part->material))
    return FALSE;
  if (lamina_part_is_air (part))
    {
      if (part->air != LAMINA_AIR_UNVENTILATED && part->air != LAMINA_AIR_SLIGHTLY_VENTILATED)
        return fail_at (check, part->line, where,
                        _("an air part may be unventilated or slightly ventilated; make a well ventilated "
                          "space its own layer"));
      if (!check_range (check, part->line, where, N_("inner emissivity"), part->emissivity_inner, 0, 1, TRUE, "")
          || !check_range (check, part->line, where, N_("outer emissivity"), part->emissivity_outer, 0, 1, TRUE, ""))
        return FALSE;
    }
  if (has_fraction && (has_width || has_spacing))
    return fail_at (check, part->line, where, _("give either a fraction or width and spacing, not both"));
  if (has_width != has_spacing)
    return fail_at (check, part->line, where, _("width and spacing go together"));
  if (has_fraction)
    return check_range (check, part->line, where, N_("fraction"), part->fraction, 0, 1, TRUE, "");
  if (has_width)
    {
      if (!check_range (check, part->line, where, N_("spacing"), part->spacing, 0, 100000, TRUE, "mm")
          || !check_range (check, part->line, where, N_("width"), part->width, 0, part->spacing, TRUE, "mm"))
        return FALSE;
    }
  (void) layer;
  return TRUE;
}

/* Index of the part before @before that names @member, or -1.  Layers have
 * a handful of parts: a scan beats a hash table here. */
static int
find_member (const LaminaLayer *layer,
             guint              before,
             const char        *member)
{
  for (guint q = 0; q < before; q++)
    {
      const LaminaPart *part = layer->parts->pdata[q];
      if (part->member != NULL && strcmp (part->member, member) == 0)
        return (int) q;
    }
  return -1;
}

static gboolean
check_parts (Check             *check,
             const LaminaLayer *layer,
             Where              where)
{
  double sum = 0.0;
  int n_rest = 0, n_unnamed = 0, n_named = 0;

  if (layer->parts == NULL || layer->parts->len == 0)
    return fail_at (check, layer->line, where, _("a bridged layer needs at least one part"));
  if (layer->parts->len > MAX_PARTS)
    return fail_at (check, layer->line, where, _("more than %d parts"), MAX_PARTS);

  for (guint p = 0; p < layer->parts->len; p++)
    {
      const LaminaPart *part = layer->parts->pdata[p];
      Where part_where = { where.layer, p + 1 };
      double f;

      if (!check_part (check, layer, part_where, part))
        return FALSE;
      f = lamina_part_get_given_fraction (part);
      if (isnan (f))
        n_rest++;
      else
        sum += f;
      if (part->member == NULL)
        n_unnamed++;
      else if (find_member (layer, p, part->member) >= 0)
        return fail_at (check, part->line, part_where, _("member “%s” appears twice in this layer"), part->member);
      else
        n_named++;
    }
  if (n_rest > 1)
    return fail_at (check, layer->line, where, _("only one part may leave its fraction out (the remainder)"));
  if (n_named > 0 && n_unnamed > 1)
    return fail_at (check, layer->line, where,
                    _("a layer with framing members may have only one part without a member (the infill)"));
  if (n_rest == 1 && sum >= 1.0 - FRACTION_TOLERANCE)
    return fail_at (check, layer->line, where,
                    _("the part fractions sum to %g, leaving nothing for the remainder part"), sum);
  if (n_rest == 0 && fabs (sum - 1.0) > FRACTION_TOLERANCE)
    return fail_at (check, layer->line, where,
                    _("the part fractions sum to %g, not 1 (leave one part's fraction out to take the remainder)"),
                    sum);
  return TRUE;
}

static gboolean
check_corrections (Check             *check,
                   const LaminaLayer *layer,
                   Where              where)
{
  const LaminaCorrections *k = &layer->corrections;

  if (k->has_air_gaps && (k->air_gap_level < 0 || k->air_gap_level > 2))
    return fail_at (check, layer->line, where, _("air gap level %d is not 0, 1 or 2"), k->air_gap_level);
  if (k->has_fasteners)
    {
      if (!check_range (check, layer->line, where, N_("fastener conductivity"),
                        k->fastener_conductivity, LAMINA_MIN_CONDUCTIVITY, LAMINA_MAX_CONDUCTIVITY, FALSE, "W/(m·K)")
          || !check_range (check, layer->line, where, N_("fastener cross-section"),
                           k->fastener_cross_section, 0, 10000, TRUE, "mm²")
          || !check_range (check, layer->line, where, N_("fasteners per square metre"),
                           k->fasteners_per_square_metre, 0, 1000, TRUE, "1/m²"))
        return FALSE;
      if (!isnan (k->fastener_penetration)
          && !check_range (check, layer->line, where, N_("fastener penetration"),
                           k->fastener_penetration, 0, layer->thickness, TRUE, "mm"))
        return FALSE;
    }
  if (k->has_inverted_roof)
    {
      if (!check_range (check, layer->line, where, N_("precipitation"),
                        k->precipitation, 0, 100, FALSE, "mm/day")
          || !check_range (check, layer->line, where, N_("drainage factor"),
                           k->drainage_factor, 0, 1, FALSE, ""))
        return FALSE;
    }
  return TRUE;
}

/* Annex E: a tapered layer is a material layer thicker at one end. */
static gboolean
check_taper (Check             *check,
             const LaminaLayer *layer,
             Where              where)
{
  if ((guint) layer->taper >= LAMINA_N_TAPERS)
    return fail_at (check, layer->line, where, _("unknown taper shape"));
  if (!lamina_layer_is_tapered (layer))
    {
      if (!isnan (layer->thickness_max))
        return fail_at (check, layer->line, where, _("a maximum thickness needs a taper shape"));
      return TRUE;
    }
  if (layer->kind != LAMINA_LAYER_MATERIAL)
    return fail_at (check, layer->line, where, _("only a layer of one material can be tapered"));
  if (isnan (layer->thickness_max))
    return fail_at (check, layer->line, where, _("a tapered layer needs its maximum thickness"));
  if (!(layer->thickness_max > layer->thickness))
    return fail_at (check, layer->line, where, _("maximum thickness %g mm is not above the thickness %g mm of the thin end"),
                    layer->thickness_max, layer->thickness);
  return check_range (check, layer->line, where, N_("maximum thickness"), layer->thickness_max, 0, 10000, TRUE, "mm");
}

static gboolean
check_layer (Check             *check,
             const LaminaLayer *layer,
             guint              number)
{
  Where where = { number, 0 };

  if (!check_range (check, layer->line, where, N_("thickness"), layer->thickness,
                   LAMINA_MIN_THICKNESS, LAMINA_MAX_THICKNESS, FALSE, "mm"))
    return FALSE;
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      if (!check_material (check, layer->line, where, layer->material))
        return FALSE;
      break;
    case LAMINA_LAYER_RESISTANCE:
      if (!check_range (check, layer->line, where, N_("thermal resistance"),
                        layer->resistance, 0, 100, FALSE, "m²·K/W"))
        return FALSE;
      break;
    case LAMINA_LAYER_AIR:
      if ((guint) layer->air >= LAMINA_N_AIR_KINDS)
        return fail_at (check, layer->line, where, _("unknown air layer ventilation"));
      if (!check_range (check, layer->line, where, N_("inner emissivity"),
                        layer->emissivity_inner, 0, 1, TRUE, "")
          || !check_range (check, layer->line, where, N_("outer emissivity"),
                           layer->emissivity_outer, 0, 1, TRUE, ""))
        return FALSE;
      if (!isnan (layer->vent_area)
          && !check_range (check, layer->line, where, N_("vent area"),
                           layer->vent_area, 0, 1e6, FALSE, "mm²"))
        return FALSE;
      if (layer->air == LAMINA_AIR_SLIGHTLY_VENTILATED && isnan (layer->vent_area))
        return fail_at (check, layer->line, where, _("a slightly ventilated air layer needs its vent area"));
      if (!isnan (layer->air_width)
          && !check_range (check, layer->line, where, N_("air space width"),
                           layer->air_width, 0, 100000, TRUE, "mm"))
        return FALSE;
      break;
    case LAMINA_LAYER_BRIDGED:
      if (!check_parts (check, layer, where))
        return FALSE;
      break;
    case LAMINA_N_LAYER_KINDS:
    default:
      return fail_at (check, layer->line, where, _("unknown kind of layer"));
    }
  /* EN ISO 13788:2012 3.1 (from memory): sd is the thickness of still air
   * with the layer's vapour resistance; a foil's declared sd stands for μ·d. */
  if (!isnan (layer->sd)
      && !check_range (check, layer->line, where, N_("sd"), layer->sd, 0, 100000, TRUE, "m"))
    return FALSE;
  if (!check_taper (check, layer, where))
    return FALSE;
  return check_corrections (check, layer, where);
}

/* A framing member that runs through several layers must have the same
 * width fraction in each (it is the same stud). */
static gboolean
check_members (Check                    *check,
               const LaminaConstruction *c)
{
  /* Compare each named part with the first earlier layer naming it. */
  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      if (layer->kind != LAMINA_LAYER_BRIDGED)
        continue;
      for (guint p = 0; p < layer->parts->len; p++)
        {
          const LaminaPart *part = layer->parts->pdata[p];
          double f;

          if (part->member == NULL)
            continue;
          f = lamina_layer_get_part_fraction (layer, p);
          for (guint j = 0; j < i; j++)
            {
              const LaminaLayer *earlier = c->layers->pdata[j];
              int q;
              double known;

              if (earlier->kind != LAMINA_LAYER_BRIDGED
                  || (q = find_member (earlier, earlier->parts->len, part->member)) < 0)
                continue;
              known = lamina_layer_get_part_fraction (earlier, (guint) q);
              if (fabs (known - f) > FRACTION_TOLERANCE)
                return fail (check, part->line,
                             _("layer %u, part %u: member “%s” covers a fraction %g here but %g in layer %u; "
                               "a member that runs through several layers must line up"),
                             i + 1, p + 1, part->member, f, known, j + 1);
              break;
            }
        }
    }
  return TRUE;
}

/* The inside conditions of EN ISO 13788:2012 4.2.3 and Annex A. */
static gboolean
check_moisture (Check                        *check,
                const LaminaMoistureSettings *m)
{
  const Where whole = { 0, 0 };

  if (m == NULL)
    return TRUE;
  if (m->climate == NULL || m->climate[0] == '\0')
    return fail (check, m->line, _("moisture check: no climate"));
  if ((m->humidity_class != 0) == !isnan (m->inside_humidity))
    return fail (check, m->line, _("moisture check: give either a humidity class or an inside humidity"));
  if (m->humidity_class != 0 && (m->humidity_class < 1 || m->humidity_class > 5))
    return fail (check, m->line, _("moisture check: humidity class %d is not 1 to 5"), m->humidity_class);
  if (!isnan (m->inside_humidity)
      && !check_range (check, m->line, whole, N_("inside humidity"), m->inside_humidity, 0, 1, TRUE, ""))
    return FALSE;
  if (!isnan (m->inside_temperature)
      && !check_range (check, m->line, whole, N_("inside temperature"), m->inside_temperature, -60, 60, FALSE, "°C"))
    return FALSE;
  return TRUE;
}

typedef struct
{
  const char *field;
  double      value;
  double      min;
  double      max;
  gboolean    open_min;
  gboolean    required;
  const char *unit;
} Bound;

static gboolean
check_bounds (Check       *check,
              int          line,
              const Bound *bounds,
              guint        n_bounds)
{
  const Where whole = { 0, 0 };

  for (guint i = 0; i < n_bounds; i++)
    {
      const Bound *b = &bounds[i];

      if (isnan (b->value) && !b->required)
        continue;
      if (isnan (b->value))
        return fail (check, line, _("%s is needed"), _(b->field));
      if (!check_range (check, line, whole, b->field, b->value, b->min, b->max, b->open_min, b->unit))
        return FALSE;
    }
  return TRUE;
}

/* EN ISO 13370: the plan and the ground under a floor. */
static gboolean
check_ground (Check                    *check,
              const LaminaConstruction *c)
{
  const LaminaGround *g = &c->ground;
  gboolean suspended = g->kind == LAMINA_GROUND_SUSPENDED;
  gboolean basement = g->kind == LAMINA_GROUND_BASEMENT;
  gboolean edge = g->edge != LAMINA_EDGE_NONE;
  const Bound bounds[] = {
    { N_("ground floor area"), g->area, 0, 1e7, TRUE, TRUE, "m²" },
    { N_("ground floor perimeter"), g->perimeter, 0, 1e6, TRUE, TRUE, "m" },
    { N_("wall thickness"), g->wall_thickness, 0, 5000, FALSE, TRUE, "mm" },
    { N_("soil conductivity"), g->soil_conductivity, 0, 20, TRUE, FALSE, "W/(m·K)" },
    { N_("underfloor height"), g->underfloor_height, 0, 20, FALSE, suspended, "m" },
    { N_("underfloor vent area"), g->vent_area, 0, 1, FALSE, suspended, "m²/m" },
    { N_("underfloor wall U"), g->underfloor_wall_u, 0, 10, FALSE, suspended, "W/(m²·K)" },
    { N_("wind speed"), g->wind_speed, 0, 50, FALSE, FALSE, "m/s" },
    { N_("shielding factor"), g->shielding_factor, 0, 1, FALSE, FALSE, "" },
    { N_("basement depth"), g->depth, 0, 50, TRUE, basement, "m" },
    { N_("basement wall resistance"), g->basement_wall_resistance, 0, 100, FALSE, FALSE, "m²·K/W" },
    { N_("edge insulation width or depth"), g->edge_size, 0, 20, TRUE, edge, "m" },
    { N_("edge insulation thickness"), g->edge_thickness, 0, 2000, TRUE, edge, "mm" },
    { N_("edge insulation resistance"), g->edge_resistance, 0, 100, TRUE, edge, "m²·K/W" },
  };

  if (!c->has_ground)
    return TRUE;
  if (c->element != LAMINA_ELEMENT_FLOOR)
    return fail (check, g->line, _("ground: only a floor can lie on or over the ground"));
  if ((guint) g->kind >= LAMINA_N_GROUND_KINDS || (guint) g->soil >= LAMINA_N_SOILS
      || (guint) g->edge >= LAMINA_N_EDGES)
    return fail (check, g->line, _("ground: unknown kind, soil or edge insulation"));
  if (edge && g->kind != LAMINA_GROUND_SLAB)
    return fail (check, g->line, _("ground: edge insulation applies to a slab on ground"));
  if (!check_bounds (check, g->line, bounds, G_N_ELEMENTS (bounds)))
    {
      g_prefix_error (check->error, _("ground: "));
      return FALSE;
    }
  return TRUE;
}

/* EN ISO 6946 6.10 and Annex C. */
static gboolean
check_unheated_surfaces (Check                    *check,
                         const LaminaConstruction *c)
{
  const LaminaUnheated *u = &c->unheated;
  const LaminaSurfaceConditions *s = &c->surfaces;
  gboolean other = u->kind == LAMINA_UNHEATED_OTHER;
  const Bound unheated_bounds[] = {
    { N_("area towards the unheated space"), u->inner_area, 0, 1e6, TRUE, TRUE, "m²" },
    { N_("area of the unheated space to outside"), u->outer_area, 0, 1e6, TRUE, TRUE, "m²" },
    { N_("U of the unheated space to outside"), u->outer_u, 0, 10, TRUE, TRUE, "W/(m²·K)" },
    { N_("air change of the unheated space"), u->air_change, 0, 100, FALSE, TRUE, "1/h" },
    { N_("volume of the unheated space"), u->volume, 0, 1e7, FALSE, TRUE, "m³" },
  };
  const Bound surface_bounds[] = {
    { N_("wind speed"), s->wind_speed, 0, 50, FALSE, FALSE, "m/s" },
    { N_("inner surface emissivity"), s->emissivity_inside, 0, 1, TRUE, FALSE, "" },
    { N_("outer surface emissivity"), s->emissivity_outside, 0, 1, TRUE, FALSE, "" },
  };

  if ((guint) u->kind >= LAMINA_N_UNHEATED_KINDS || (guint) u->roof >= LAMINA_N_ROOF_TYPES)
    return fail (check, u->line, _("unheated space: unknown kind or roof type"));
  if (u->kind != LAMINA_UNHEATED_NONE && c->outer_side == LAMINA_OUTER_SIDE_INDOOR)
    return fail (check, u->line, _("unheated space: the outer side must face outdoors"));
  if (other && !check_bounds (check, u->line, unheated_bounds, G_N_ELEMENTS (unheated_bounds)))
    {
      g_prefix_error (check->error, _("unheated space: "));
      return FALSE;
    }
  return check_bounds (check, s->line, surface_bounds, G_N_ELEMENTS (surface_bounds));
}

static gboolean
check_single_taper (Check                    *check,
                    const LaminaConstruction *c)
{
  guint first = 0;

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];

      if (!lamina_layer_is_tapered (layer))
        continue;
      if (first > 0)
        return fail (check, layer->line, _("layer %u: only one layer can be tapered (layer %u already is)"),
                     i + 1, first);
      first = i + 1;
    }
  return TRUE;
}

gboolean
lamina_construction_validate (const LaminaConstruction *construction,
                              int                      *line,
                              GError                  **error)
{
  const LaminaConstruction *c = construction;
  Check check = { line, error };
  const Where whole = { 0, 0 };

  g_return_val_if_fail (c != NULL, FALSE);

  if (line != NULL)
    *line = 0;
  if (c->layers->len == 0)
    return fail (&check, c->line, "%s", _("no layers"));
  if (c->layers->len > MAX_LAYERS)
    return fail (&check, c->line, _("more than %d layers"), MAX_LAYERS);
  if ((guint) c->element >= LAMINA_N_ELEMENTS || (guint) c->heat_flow >= LAMINA_N_HEAT_FLOWS
      || (guint) c->outer_side >= LAMINA_N_OUTER_SIDES)
    return fail (&check, c->line, "%s", _("unknown element, heat flow or outer side"));
  if (!check_range (&check, c->line, whole, N_("inside temperature"),
                    c->inside_temperature, -60, 60, FALSE, "°C")
      || !check_range (&check, c->line, whole, N_("outside temperature"),
                       c->outside_temperature, -60, 60, FALSE, "°C"))
    return FALSE;
  if (!isnan (c->target_u)
      && !check_range (&check, c->line, whole, N_("target U"), c->target_u, 0, 10, TRUE, "W/(m²·K)"))
    return FALSE;
  for (guint i = 0; i < c->layers->len; i++)
    if (!check_layer (&check, c->layers->pdata[i], i + 1))
      return FALSE;
  if (!check_single_taper (&check, c) || !check_ground (&check, c)
      || !check_unheated_surfaces (&check, c))
    return FALSE;
  if (!check_members (&check, c))
    return FALSE;
  return check_moisture (&check, c->moisture);
}
