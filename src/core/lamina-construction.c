/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-construction.h"

#include <glib/gi18n-lib.h>
#include <math.h>

G_DEFINE_BOXED_TYPE (LaminaConstruction, lamina_construction,
                     lamina_construction_copy, lamina_construction_free)

static gboolean
same_value (double a,
            double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

/* Parts */

LaminaPart *
lamina_part_new (LaminaMaterial *material,
                 double          fraction)
{
  LaminaPart *part = g_new0 (LaminaPart, 1);

  part->material = material;
  part->fraction = fraction;
  part->width = NAN;
  part->spacing = NAN;
  part->air = LAMINA_AIR_UNVENTILATED;
  part->emissivity_inner = LAMINA_DEFAULT_EMISSIVITY;
  part->emissivity_outer = LAMINA_DEFAULT_EMISSIVITY;
  return part;
}

LaminaPart *
lamina_part_new_framing (LaminaMaterial *material,
                         double          width,
                         double          spacing,
                         const char     *member)
{
  LaminaPart *part = lamina_part_new (material, NAN);

  part->width = width;
  part->spacing = spacing;
  part->member = g_strdup (member);
  return part;
}

LaminaPart *
lamina_part_copy (const LaminaPart *part)
{
  LaminaPart *copy;

  g_return_val_if_fail (part != NULL, NULL);

  copy = g_memdup2 (part, sizeof *part);
  copy->material = part->material ? lamina_material_copy (part->material) : NULL;
  copy->member = g_strdup (part->member);
  return copy;
}

void
lamina_part_free (LaminaPart *part)
{
  if (part == NULL)
    return;
  lamina_material_free (part->material);
  g_free (part->member);
  g_free (part);
}

gboolean
lamina_part_is_air (const LaminaPart *part)
{
  return part->material == NULL;
}

double
lamina_part_get_given_fraction (const LaminaPart *part)
{
  if (!isnan (part->fraction))
    return part->fraction;
  if (!isnan (part->width) && !isnan (part->spacing) && part->spacing > 0)
    return part->width / part->spacing;
  return NAN;
}

static gboolean
part_equal (const LaminaPart *a,
            const LaminaPart *b)
{
  return lamina_material_equal (a->material, b->material)
         && same_value (a->fraction, b->fraction)
         && same_value (a->width, b->width)
         && same_value (a->spacing, b->spacing)
         && g_strcmp0 (a->member, b->member) == 0
         && a->air == b->air
         && same_value (a->emissivity_inner, b->emissivity_inner)
         && same_value (a->emissivity_outer, b->emissivity_outer);
}

/* Layers */

static LaminaLayer *
layer_new (LaminaLayerKind kind,
           double          thickness)
{
  LaminaLayer *layer = g_new0 (LaminaLayer, 1);

  layer->kind = kind;
  layer->thickness = thickness;
  layer->resistance = NAN;
  layer->vent_area = NAN;
  layer->emissivity_inner = LAMINA_DEFAULT_EMISSIVITY;
  layer->emissivity_outer = LAMINA_DEFAULT_EMISSIVITY;
  layer->corrections.fastener_penetration = NAN;
  layer->sd = NAN;
  layer->taper = LAMINA_TAPER_NONE;
  layer->thickness_max = NAN;
  layer->air_width = NAN;
  return layer;
}

LaminaLayer *
lamina_layer_new_material (double          thickness,
                           LaminaMaterial *material)
{
  LaminaLayer *layer = layer_new (LAMINA_LAYER_MATERIAL, thickness);

  layer->material = material;
  return layer;
}

LaminaLayer *
lamina_layer_new_resistance (double thickness,
                             double resistance)
{
  LaminaLayer *layer = layer_new (LAMINA_LAYER_RESISTANCE, thickness);

  layer->resistance = resistance;
  return layer;
}

LaminaLayer *
lamina_layer_new_air (double        thickness,
                      LaminaAirKind air)
{
  LaminaLayer *layer = layer_new (LAMINA_LAYER_AIR, thickness);

  layer->air = air;
  return layer;
}

LaminaLayer *
lamina_layer_new_bridged (double thickness)
{
  LaminaLayer *layer = layer_new (LAMINA_LAYER_BRIDGED, thickness);

  layer->parts = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_part_free);
  return layer;
}

void
lamina_layer_add_part (LaminaLayer *layer,
                       LaminaPart  *part)
{
  g_return_if_fail (layer != NULL && part != NULL);

  if (layer->parts == NULL)
    layer->parts = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_part_free);
  g_ptr_array_add (layer->parts, part);
}

LaminaLayer *
lamina_layer_copy (const LaminaLayer *layer)
{
  LaminaLayer *copy;

  g_return_val_if_fail (layer != NULL, NULL);

  copy = g_memdup2 (layer, sizeof *layer);
  copy->material = layer->material ? lamina_material_copy (layer->material) : NULL;
  copy->note = g_strdup (layer->note);
  copy->parts = NULL;
  if (layer->parts != NULL)
    {
      copy->parts = g_ptr_array_new_full (layer->parts->len,
                                          (GDestroyNotify) lamina_part_free);
      for (guint i = 0; i < layer->parts->len; i++)
        g_ptr_array_add (copy->parts, lamina_part_copy (layer->parts->pdata[i]));
    }
  return copy;
}

void
lamina_layer_free (LaminaLayer *layer)
{
  if (layer == NULL)
    return;
  lamina_material_free (layer->material);
  g_clear_pointer (&layer->parts, g_ptr_array_unref);
  g_free (layer->note);
  g_free (layer);
}

static gboolean
corrections_equal (const LaminaCorrections *a,
                   const LaminaCorrections *b)
{
  if (a->has_air_gaps != b->has_air_gaps
      || a->has_fasteners != b->has_fasteners
      || a->has_inverted_roof != b->has_inverted_roof)
    return FALSE;
  if (a->has_air_gaps && a->air_gap_level != b->air_gap_level)
    return FALSE;
  if (a->has_fasteners
      && !(same_value (a->fastener_conductivity, b->fastener_conductivity)
           && same_value (a->fastener_cross_section, b->fastener_cross_section)
           && same_value (a->fasteners_per_square_metre, b->fasteners_per_square_metre)
           && same_value (a->fastener_penetration, b->fastener_penetration)))
    return FALSE;
  if (a->has_inverted_roof
      && !(same_value (a->precipitation, b->precipitation)
           && same_value (a->drainage_factor, b->drainage_factor)))
    return FALSE;
  return TRUE;
}

gboolean
lamina_layer_equal (const LaminaLayer *a,
                    const LaminaLayer *b)
{
  guint na, nb;

  if (a->kind != b->kind || !same_value (a->thickness, b->thickness))
    return FALSE;
  if (g_strcmp0 (a->note, b->note) != 0
      || !same_value (a->sd, b->sd)
      || !corrections_equal (&a->corrections, &b->corrections))
    return FALSE;
  if (a->taper != b->taper || !same_value (a->thickness_max, b->thickness_max)
      || !same_value (a->air_width, b->air_width))
    return FALSE;
  switch (a->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      return lamina_material_equal (a->material, b->material);
    case LAMINA_LAYER_RESISTANCE:
      return same_value (a->resistance, b->resistance);
    case LAMINA_LAYER_AIR:
      return a->air == b->air
             && same_value (a->vent_area, b->vent_area)
             && same_value (a->emissivity_inner, b->emissivity_inner)
             && same_value (a->emissivity_outer, b->emissivity_outer);
    case LAMINA_LAYER_BRIDGED:
      na = a->parts ? a->parts->len : 0;
      nb = b->parts ? b->parts->len : 0;
      if (na != nb)
        return FALSE;
      for (guint i = 0; i < na; i++)
        if (!part_equal (a->parts->pdata[i], b->parts->pdata[i]))
          return FALSE;
      return TRUE;
    case LAMINA_N_LAYER_KINDS:
    default:
      return FALSE;
    }
}

double
lamina_layer_get_part_fraction (const LaminaLayer *layer,
                                guint              index)
{
  double given, sum = 0.0;

  g_return_val_if_fail (layer->parts != NULL && index < layer->parts->len, NAN);

  given = lamina_part_get_given_fraction (layer->parts->pdata[index]);
  if (!isnan (given))
    return given;
  for (guint i = 0; i < layer->parts->len; i++)
    {
      double f = lamina_part_get_given_fraction (layer->parts->pdata[i]);
      if (i != index && !isnan (f))
        sum += f;
    }
  return 1.0 - sum;
}

const char *
lamina_layer_get_label (const LaminaLayer *layer)
{
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      return layer->material && layer->material->name ? layer->material->name : _("Material");
    case LAMINA_LAYER_RESISTANCE:
      return layer->note ? layer->note : _("Declared resistance");
    case LAMINA_LAYER_AIR:
      switch (layer->air)
        {
        case LAMINA_AIR_SLIGHTLY_VENTILATED:
          return _("Slightly ventilated air layer");
        case LAMINA_AIR_WELL_VENTILATED:
          return _("Well ventilated air layer");
        case LAMINA_AIR_UNVENTILATED:
        case LAMINA_N_AIR_KINDS:
        default:
          return _("Unventilated air layer");
        }
    case LAMINA_LAYER_BRIDGED:
      return _("Bridged layer");
    case LAMINA_N_LAYER_KINDS:
    default:
      return "";
    }
}

/* Moisture settings */

LaminaMoistureSettings *
lamina_moisture_settings_new (const char *climate)
{
  LaminaMoistureSettings *settings = g_new0 (LaminaMoistureSettings, 1);

  settings->climate = g_strdup (climate);
  settings->inside_humidity = NAN;
  settings->inside_temperature = NAN;
  return settings;
}

LaminaMoistureSettings *
lamina_moisture_settings_copy (const LaminaMoistureSettings *settings)
{
  LaminaMoistureSettings *copy;

  g_return_val_if_fail (settings != NULL, NULL);

  copy = g_memdup2 (settings, sizeof *settings);
  copy->climate = g_strdup (settings->climate);
  copy->climate_data = settings->climate_data ? lamina_climate_copy (settings->climate_data) : NULL;
  return copy;
}

void
lamina_moisture_settings_free (LaminaMoistureSettings *settings)
{
  if (settings == NULL)
    return;
  g_free (settings->climate);
  lamina_climate_free (settings->climate_data);
  g_free (settings);
}

gboolean
lamina_moisture_settings_equal (const LaminaMoistureSettings *a,
                                const LaminaMoistureSettings *b)
{
  if (a == b)
    return TRUE;
  if (a == NULL || b == NULL)
    return FALSE;
  return g_strcmp0 (a->climate, b->climate) == 0
         && a->humidity_class == b->humidity_class
         && same_value (a->inside_humidity, b->inside_humidity)
         && same_value (a->inside_temperature, b->inside_temperature)
         /* Data not yet resolved (NULL) are not a difference. */
         && (a->climate_data == NULL || b->climate_data == NULL
             || lamina_climate_equal (a->climate_data, b->climate_data));
}

void
lamina_construction_set_moisture (LaminaConstruction     *construction,
                                  LaminaMoistureSettings *settings)
{
  g_return_if_fail (construction != NULL);

  lamina_moisture_settings_free (construction->moisture);
  construction->moisture = settings;
}

/* Constructions */

LaminaConstruction *
lamina_construction_new (const char    *id,
                         const char    *name,
                         LaminaElement  element)
{
  LaminaConstruction *c = g_new0 (LaminaConstruction, 1);

  c->id = g_strdup (id);
  c->name = g_strdup (name);
  c->element = element;
  c->heat_flow = lamina_element_default_heat_flow (element);
  c->outer_side = element == LAMINA_ELEMENT_PARTITION
                  ? LAMINA_OUTER_SIDE_INDOOR : LAMINA_OUTER_SIDE_OUTDOOR;
  c->tags = g_ptr_array_new_with_free_func (g_free);
  c->layers = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_layer_free);
  c->target_u = NAN;
  c->inside_temperature = LAMINA_DEFAULT_INSIDE_TEMPERATURE;
  c->outside_temperature = LAMINA_DEFAULT_OUTSIDE_TEMPERATURE;
  c->status = LAMINA_STATUS_DRAFT;
  lamina_ground_init (&c->ground);
  lamina_unheated_init (&c->unheated);
  lamina_surface_conditions_init (&c->surfaces);
  return c;
}

LaminaConstruction *
lamina_construction_copy (const LaminaConstruction *construction)
{
  const LaminaConstruction *c = construction;
  LaminaConstruction *copy;

  g_return_val_if_fail (c != NULL, NULL);

  copy = g_memdup2 (c, sizeof *c);
  copy->id = g_strdup (c->id);
  copy->code = g_strdup (c->code);
  copy->name = g_strdup (c->name);
  copy->description = g_strdup (c->description);
  copy->notes = g_strdup (c->notes);
  copy->modified_by = g_strdup (c->modified_by);
  copy->modified_at = g_strdup (c->modified_at);
  copy->checked_by = g_strdup (c->checked_by);
  copy->checked_at = g_strdup (c->checked_at);
  copy->approved_by = g_strdup (c->approved_by);
  copy->approved_at = g_strdup (c->approved_at);
  copy->approval_policy = g_strdup (c->approval_policy);
  copy->approval_reason = g_strdup (c->approval_reason);
  copy->source_review = g_strdup (c->source_review);
  copy->draft_stamp = g_strdup (c->draft_stamp);
  copy->tags = g_ptr_array_new_full (c->tags->len, g_free);
  for (guint i = 0; i < c->tags->len; i++)
    g_ptr_array_add (copy->tags, g_strdup (c->tags->pdata[i]));
  copy->layers = g_ptr_array_new_full (c->layers->len, (GDestroyNotify) lamina_layer_free);
  for (guint i = 0; i < c->layers->len; i++)
    g_ptr_array_add (copy->layers, lamina_layer_copy (c->layers->pdata[i]));
  copy->moisture = c->moisture ? lamina_moisture_settings_copy (c->moisture) : NULL;
  return copy;
}

void
lamina_construction_free (LaminaConstruction *construction)
{
  LaminaConstruction *c = construction;

  if (c == NULL)
    return;
  g_free (c->id);
  g_free (c->code);
  g_free (c->name);
  g_free (c->description);
  g_free (c->notes);
  g_free (c->modified_by);
  g_free (c->modified_at);
  g_free (c->checked_by);
  g_free (c->checked_at);
  g_free (c->approved_by);
  g_free (c->approved_at);
  g_free (c->approval_policy);
  g_free (c->approval_reason);
  g_free (c->source_review);
  g_free (c->draft_stamp);
  g_ptr_array_unref (c->tags);
  g_ptr_array_unref (c->layers);
  lamina_moisture_settings_free (c->moisture);
  g_free (c);
}

void
lamina_construction_add_layer (LaminaConstruction *construction,
                               LaminaLayer        *layer)
{
  g_return_if_fail (construction != NULL && layer != NULL);
  g_ptr_array_add (construction->layers, layer);
}

void
lamina_construction_add_tag (LaminaConstruction *construction,
                             const char         *tag)
{
  g_return_if_fail (construction != NULL && tag != NULL);
  g_ptr_array_add (construction->tags, g_strdup (tag));
}

double
lamina_construction_get_thickness (const LaminaConstruction *construction)
{
  double total = 0.0;

  for (guint i = 0; i < construction->layers->len; i++)
    total += ((LaminaLayer *) construction->layers->pdata[i])->thickness;
  return total;
}

void
lamina_ground_init (LaminaGround *ground)
{
  *ground = (LaminaGround) {
    .kind = LAMINA_GROUND_SLAB,
    .area = NAN, .perimeter = NAN, .wall_thickness = NAN,
    .soil_conductivity = NAN, .soil = LAMINA_SOIL_UNKNOWN,
    .underfloor_height = NAN, .vent_area = NAN, .underfloor_wall_u = NAN,
    .wind_speed = NAN, .shielding_factor = NAN,
    .depth = NAN, .basement_wall_resistance = NAN,
    .edge = LAMINA_EDGE_NONE,
    .edge_size = NAN, .edge_thickness = NAN, .edge_resistance = NAN,
  };
}

void
lamina_unheated_init (LaminaUnheated *unheated)
{
  *unheated = (LaminaUnheated) {
    .kind = LAMINA_UNHEATED_NONE,
    .roof = LAMINA_ROOF_TILES_FELT,
    .inner_area = NAN, .outer_area = NAN, .outer_u = NAN,
    .air_change = NAN, .volume = NAN,
  };
}

void
lamina_surface_conditions_init (LaminaSurfaceConditions *surfaces)
{
  *surfaces = (LaminaSurfaceConditions) {
    .wind_speed = NAN, .emissivity_inside = NAN, .emissivity_outside = NAN,
  };
}

gboolean
lamina_surface_conditions_is_default (const LaminaSurfaceConditions *surfaces)
{
  return isnan (surfaces->wind_speed) && isnan (surfaces->emissivity_inside)
         && isnan (surfaces->emissivity_outside) && !surfaces->air_from_profile;
}

gboolean
lamina_layer_is_tapered (const LaminaLayer *layer)
{
  return layer->taper != LAMINA_TAPER_NONE;
}

static gboolean
ground_equal (const LaminaGround *a,
              const LaminaGround *b)
{
  return a->kind == b->kind && a->soil == b->soil && a->edge == b->edge
         && same_value (a->area, b->area)
         && same_value (a->perimeter, b->perimeter)
         && same_value (a->wall_thickness, b->wall_thickness)
         && same_value (a->soil_conductivity, b->soil_conductivity)
         && same_value (a->underfloor_height, b->underfloor_height)
         && same_value (a->vent_area, b->vent_area)
         && same_value (a->underfloor_wall_u, b->underfloor_wall_u)
         && same_value (a->wind_speed, b->wind_speed)
         && same_value (a->shielding_factor, b->shielding_factor)
         && same_value (a->depth, b->depth)
         && same_value (a->basement_wall_resistance, b->basement_wall_resistance)
         && same_value (a->edge_size, b->edge_size)
         && same_value (a->edge_thickness, b->edge_thickness)
         && same_value (a->edge_resistance, b->edge_resistance);
}

static gboolean
unheated_equal (const LaminaUnheated *a,
                const LaminaUnheated *b)
{
  if (a->kind != b->kind)
    return FALSE;
  switch (a->kind)
    {
    case LAMINA_UNHEATED_ROOF_SPACE:
      return a->roof == b->roof;
    case LAMINA_UNHEATED_OTHER:
      return same_value (a->inner_area, b->inner_area)
             && same_value (a->outer_area, b->outer_area)
             && same_value (a->outer_u, b->outer_u)
             && same_value (a->air_change, b->air_change)
             && same_value (a->volume, b->volume);
    case LAMINA_UNHEATED_NONE:
    case LAMINA_N_UNHEATED_KINDS:
    default:
      return TRUE;
    }
}

static gboolean
surfaces_equal (const LaminaSurfaceConditions *a,
                const LaminaSurfaceConditions *b)
{
  return same_value (a->wind_speed, b->wind_speed)
         && same_value (a->emissivity_inside, b->emissivity_inside)
         && same_value (a->emissivity_outside, b->emissivity_outside)
         && a->air_from_profile == b->air_from_profile;
}

gboolean
lamina_construction_equal_content (const LaminaConstruction *a,
                                   const LaminaConstruction *b)
{
  if (g_strcmp0 (a->id, b->id) != 0
      || g_strcmp0 (a->code, b->code) != 0
      || g_strcmp0 (a->name, b->name) != 0
      || a->element != b->element
      || a->heat_flow != b->heat_flow
      || a->outer_side != b->outer_side
      || g_strcmp0 (a->description, b->description) != 0
      || g_strcmp0 (a->notes, b->notes) != 0
      || !same_value (a->target_u, b->target_u)
      || !same_value (a->inside_temperature, b->inside_temperature)
      || !same_value (a->outside_temperature, b->outside_temperature)
      || a->tags->len != b->tags->len
      || a->layers->len != b->layers->len
      || !lamina_moisture_settings_equal (a->moisture, b->moisture))
    return FALSE;
  if (a->has_ground != b->has_ground
      || (a->has_ground && !ground_equal (&a->ground, &b->ground))
      || !unheated_equal (&a->unheated, &b->unheated)
      || !surfaces_equal (&a->surfaces, &b->surfaces))
    return FALSE;
  for (guint i = 0; i < a->tags->len; i++)
    if (g_strcmp0 (a->tags->pdata[i], b->tags->pdata[i]) != 0)
      return FALSE;
  for (guint i = 0; i < a->layers->len; i++)
    if (!lamina_layer_equal (a->layers->pdata[i], b->layers->pdata[i]))
      return FALSE;
  return TRUE;
}
