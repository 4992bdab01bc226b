/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-store-json.h"

#include <json-glib/json-glib.h>
#include <math.h>

#include "lamina-library.h"

/* Numbers that are not given (NAN) are stored as null. */
static void
add_number (JsonBuilder *b,
            const char  *key,
            double       value)
{
  json_builder_set_member_name (b, key);
  if (isnan (value))
    json_builder_add_null_value (b);
  else
    json_builder_add_double_value (b, value);
}

static void
add_string (JsonBuilder *b,
            const char  *key,
            const char  *value)
{
  if (value == NULL)
    return;
  json_builder_set_member_name (b, key);
  json_builder_add_string_value (b, value);
}

static void
add_material (JsonBuilder          *b,
              const char           *key,
              const LaminaMaterial *m)
{
  if (m == NULL)
    return;
  json_builder_set_member_name (b, key);
  json_builder_begin_object (b);
  add_string (b, "id", m->id);
  add_string (b, "name", m->name);
  add_string (b, "category", lamina_category_to_string (m->category));
  add_number (b, "conductivity", m->conductivity);
  add_number (b, "density", m->density);
  add_number (b, "specific_heat", m->specific_heat);
  add_number (b, "mu", m->vapour_resistance_factor);
  add_number (b, "emissivity", m->emissivity);
  add_string (b, "source", m->source);
  add_string (b, "notes", m->notes);
  if (m->n_stock_thicknesses > 0)
    {
      json_builder_set_member_name (b, "stock_thicknesses");
      json_builder_begin_array (b);
      for (guint i = 0; i < m->n_stock_thicknesses; i++)
        json_builder_add_double_value (b, m->stock_thicknesses[i]);
      json_builder_end_array (b);
    }
  json_builder_end_object (b);
}

static void
read_stock_thicknesses (JsonObject     *o,
                        LaminaMaterial *m)
{
  JsonArray *a = json_object_has_member (o, "stock_thicknesses")
                 ? json_object_get_array_member (o, "stock_thicknesses") : NULL;
  g_autofree double *values = NULL;
  guint n = 0;

  if (a == NULL)
    return;
  values = g_new (double, json_array_get_length (a) + 1);
  for (guint i = 0; i < json_array_get_length (a); i++)
    {
      double v = json_node_get_double (json_array_get_element (a, i));
      if (isfinite (v) && v > 0)
        values[n++] = v;
    }
  lamina_material_set_stock_thicknesses (m, values, n);
}

static void
add_corrections (JsonBuilder             *b,
                 const LaminaCorrections *k)
{
  if (!k->has_air_gaps && !k->has_fasteners && !k->has_inverted_roof)
    return;
  json_builder_set_member_name (b, "corrections");
  json_builder_begin_object (b);
  if (k->has_air_gaps)
    {
      json_builder_set_member_name (b, "air_gap_level");
      json_builder_add_int_value (b, k->air_gap_level);
    }
  if (k->has_fasteners)
    {
      json_builder_set_member_name (b, "fasteners");
      json_builder_begin_object (b);
      add_number (b, "conductivity", k->fastener_conductivity);
      add_number (b, "cross_section", k->fastener_cross_section);
      add_number (b, "per_square_metre", k->fasteners_per_square_metre);
      add_number (b, "penetration", k->fastener_penetration);
      json_builder_end_object (b);
    }
  if (k->has_inverted_roof)
    {
      json_builder_set_member_name (b, "inverted_roof");
      json_builder_begin_object (b);
      add_number (b, "precipitation", k->precipitation);
      add_number (b, "drainage_factor", k->drainage_factor);
      json_builder_end_object (b);
    }
  json_builder_end_object (b);
}

static void
add_layer (JsonBuilder       *b,
           const LaminaLayer *layer)
{
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "kind");
  json_builder_add_int_value (b, layer->kind);
  add_number (b, "thickness", layer->thickness);
  add_material (b, "material", layer->material);
  add_number (b, "resistance", layer->resistance);
  add_string (b, "air", lamina_air_kind_to_string (layer->air));
  add_number (b, "vent_area", layer->vent_area);
  add_number (b, "emissivity_inner", layer->emissivity_inner);
  add_number (b, "emissivity_outer", layer->emissivity_outer);
  if (layer->parts != NULL)
    {
      json_builder_set_member_name (b, "parts");
      json_builder_begin_array (b);
      for (guint i = 0; i < layer->parts->len; i++)
        {
          const LaminaPart *p = layer->parts->pdata[i];

          json_builder_begin_object (b);
          add_material (b, "material", p->material);
          add_number (b, "fraction", p->fraction);
          add_number (b, "width", p->width);
          add_number (b, "spacing", p->spacing);
          add_string (b, "member", p->member);
          if (p->material == NULL)
            {
              add_string (b, "air", lamina_air_kind_to_string (p->air));
              add_number (b, "emissivity_inner", p->emissivity_inner);
              add_number (b, "emissivity_outer", p->emissivity_outer);
            }
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
    }
  add_corrections (b, &layer->corrections);
  if (!isnan (layer->sd))
    add_number (b, "sd", layer->sd);
  add_string (b, "note", layer->note);
  if (lamina_layer_is_tapered (layer))
    {
      add_string (b, "taper", lamina_taper_to_string (layer->taper));
      add_number (b, "thickness_max", layer->thickness_max);
    }
  if (!isnan (layer->air_width))
    add_number (b, "air_space_width", layer->air_width);
  json_builder_end_object (b);
}

/* EN ISO 13370, EN ISO 6946 6.10 and Annexes C/D (issue 14). */
static void
add_method (JsonBuilder              *b,
            const LaminaConstruction *c)
{
  const LaminaGround *g = &c->ground;
  const LaminaUnheated *u = &c->unheated;
  const LaminaSurfaceConditions *s = &c->surfaces;

  if (c->has_ground)
    {
      json_builder_set_member_name (b, "ground");
      json_builder_begin_object (b);
      add_string (b, "kind", lamina_ground_kind_to_string (g->kind));
      add_number (b, "area", g->area);
      add_number (b, "perimeter", g->perimeter);
      add_number (b, "wall_thickness", g->wall_thickness);
      add_number (b, "soil_conductivity", g->soil_conductivity);
      add_string (b, "soil", lamina_soil_to_string (g->soil));
      add_number (b, "underfloor_height", g->underfloor_height);
      add_number (b, "vent_area", g->vent_area);
      add_number (b, "underfloor_wall_u", g->underfloor_wall_u);
      add_number (b, "wind_speed", g->wind_speed);
      add_number (b, "shielding_factor", g->shielding_factor);
      add_number (b, "depth", g->depth);
      add_number (b, "basement_wall_resistance", g->basement_wall_resistance);
      add_string (b, "edge", lamina_edge_to_string (g->edge));
      add_number (b, "edge_extent", g->edge_size);
      add_number (b, "edge_thickness", g->edge_thickness);
      add_number (b, "edge_resistance", g->edge_resistance);
      json_builder_end_object (b);
    }
  if (u->kind != LAMINA_UNHEATED_NONE)
    {
      json_builder_set_member_name (b, "unheated_space");
      json_builder_begin_object (b);
      add_string (b, "kind", lamina_unheated_kind_to_string (u->kind));
      add_string (b, "roof", lamina_roof_type_to_string (u->roof));
      add_number (b, "inner_area", u->inner_area);
      add_number (b, "outer_area", u->outer_area);
      add_number (b, "outer_u", u->outer_u);
      add_number (b, "air_change", u->air_change);
      add_number (b, "volume", u->volume);
      json_builder_end_object (b);
    }
  if (!lamina_surface_conditions_is_default (s))
    {
      json_builder_set_member_name (b, "surfaces");
      json_builder_begin_object (b);
      add_number (b, "wind_speed", s->wind_speed);
      add_number (b, "emissivity_inside", s->emissivity_inside);
      add_number (b, "emissivity_outside", s->emissivity_outside);
      json_builder_set_member_name (b, "air_from_profile");
      json_builder_add_boolean_value (b, s->air_from_profile);
      json_builder_end_object (b);
    }
}


static void
add_months (JsonBuilder         *b,
            const LaminaClimate *climate)
{
  const char *keys[2] = { "temperature", "humidity" };
  const double *values[2] = { climate->temperature, climate->humidity };

  for (int k = 0; k < 2; k++)
    {
      json_builder_set_member_name (b, keys[k]);
      json_builder_begin_array (b);
      for (int m = 0; m < LAMINA_MONTHS; m++)
        json_builder_add_double_value (b, values[k][m]);
      json_builder_end_array (b);
    }
}

/* EN ISO 13788 settings, with the climate data as checked and their
 * fingerprint (for the "changed since review" flag). */
static void
add_moisture (JsonBuilder                  *b,
              const LaminaMoistureSettings *m)
{
  if (m == NULL)
    return;
  json_builder_set_member_name (b, "moisture");
  json_builder_begin_object (b);
  add_string (b, "climate", m->climate);
  json_builder_set_member_name (b, "humidity_class");
  json_builder_add_int_value (b, m->humidity_class);
  add_number (b, "inside_humidity", m->inside_humidity);
  add_number (b, "inside_temperature", m->inside_temperature);
  if (m->climate_data != NULL)
    {
      g_autofree char *fingerprint = lamina_store_climate_fingerprint (m->climate_data);

      json_builder_set_member_name (b, "climate_data");
      json_builder_begin_object (b);
      add_string (b, "name", m->climate_data->name);
      add_string (b, "source", m->climate_data->source);
      add_months (b, m->climate_data);
      json_builder_end_object (b);
      add_string (b, "climate_fingerprint", fingerprint);
    }
  json_builder_end_object (b);
}

char *
lamina_store_construction_to_json (const LaminaConstruction *c)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();
  g_autoptr(JsonGenerator) gen = json_generator_new ();
  g_autoptr(JsonNode) root = NULL;

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "format");
  json_builder_add_int_value (b, 1);
  add_string (b, "code", c->code);
  add_string (b, "name", c->name);
  add_string (b, "element", lamina_element_to_string (c->element));
  add_string (b, "heat_flow", lamina_heat_flow_to_string (c->heat_flow));
  add_string (b, "outer_side", lamina_outer_side_to_string (c->outer_side));
  add_string (b, "description", c->description);
  json_builder_set_member_name (b, "tags");
  json_builder_begin_array (b);
  for (guint i = 0; i < c->tags->len; i++)
    json_builder_add_string_value (b, c->tags->pdata[i]);
  json_builder_end_array (b);
  json_builder_set_member_name (b, "layers");
  json_builder_begin_array (b);
  for (guint i = 0; i < c->layers->len; i++)
    add_layer (b, c->layers->pdata[i]);
  json_builder_end_array (b);
  add_number (b, "target_u", c->target_u);
  add_number (b, "inside_temperature", c->inside_temperature);
  add_number (b, "outside_temperature", c->outside_temperature);
  add_string (b, "notes", c->notes);
  add_string (b, "source_review", c->source_review);
  add_string (b, "draft_stamp", c->draft_stamp);
  add_method (b, c);

  add_moisture (b, c->moisture);
  json_builder_end_object (b);

  root = json_builder_get_root (b);
  json_generator_set_root (gen, root);
  return json_generator_to_data (gen, NULL);
}

/* Reading back */

static double
get_number (JsonObject *o,
            const char *key)
{
  JsonNode *n = json_object_get_member (o, key);

  if (n == NULL || JSON_NODE_HOLDS_NULL (n))
    return NAN;
  return json_node_get_double (n);
}

static char *
dup_string (JsonObject *o,
            const char *key)
{
  JsonNode *n = json_object_get_member (o, key);

  if (n == NULL || !JSON_NODE_HOLDS_VALUE (n))
    return NULL;
  return g_strdup (json_node_get_string (n));
}

static LaminaMaterial *
read_material (JsonObject *parent,
               const char *key)
{
  JsonObject *o;
  LaminaMaterial *m;
  g_autofree char *category = NULL;
  LaminaCategory cat = LAMINA_CATEGORY_OTHER;

  if (!json_object_has_member (parent, key))
    return NULL;
  o = json_object_get_object_member (parent, key);
  if (o == NULL)
    return NULL;
  category = dup_string (o, "category");
  if (category != NULL)
    lamina_category_from_string (category, &cat);
  m = lamina_material_new (NULL, NULL, cat, get_number (o, "conductivity"));
  m->id = dup_string (o, "id");
  m->name = dup_string (o, "name");
  m->density = get_number (o, "density");
  m->specific_heat = get_number (o, "specific_heat");
  m->vapour_resistance_factor = get_number (o, "mu");
  m->emissivity = get_number (o, "emissivity");
  m->source = dup_string (o, "source");
  m->notes = dup_string (o, "notes");
  read_stock_thicknesses (o, m);
  return m;
}

static void
read_corrections (JsonObject        *o,
                  LaminaCorrections *k)
{
  JsonObject *c, *sub;

  if (!json_object_has_member (o, "corrections"))
    return;
  c = json_object_get_object_member (o, "corrections");
  if (json_object_has_member (c, "air_gap_level"))
    {
      k->has_air_gaps = TRUE;
      k->air_gap_level = (int) json_object_get_int_member (c, "air_gap_level");
    }
  if (json_object_has_member (c, "fasteners"))
    {
      sub = json_object_get_object_member (c, "fasteners");
      k->has_fasteners = TRUE;
      k->fastener_conductivity = get_number (sub, "conductivity");
      k->fastener_cross_section = get_number (sub, "cross_section");
      k->fasteners_per_square_metre = get_number (sub, "per_square_metre");
      k->fastener_penetration = get_number (sub, "penetration");
    }
  if (json_object_has_member (c, "inverted_roof"))
    {
      sub = json_object_get_object_member (c, "inverted_roof");
      k->has_inverted_roof = TRUE;
      k->precipitation = get_number (sub, "precipitation");
      k->drainage_factor = get_number (sub, "drainage_factor");
    }
}

/* An unknown name leaves the value alone (the validation names it). */
#define read_enum(o, key, from_string, value)                 \
  G_STMT_START {                                              \
    g_autofree char *name_ = dup_string (o, key);             \
    if (name_ != NULL)                                        \
      from_string (name_, value);                             \
  } G_STMT_END

static JsonObject *
get_object (JsonObject *o,
            const char *key)
{
  JsonNode *n = json_object_get_member (o, key);

  return n != NULL && JSON_NODE_HOLDS_OBJECT (n) ? json_node_get_object (n) : NULL;
}

static void
read_part_air (JsonObject *o,
               LaminaPart *part)
{
  if (part->material != NULL)
    return;
  read_enum (o, "air", lamina_air_kind_from_string, &part->air);
  if (json_object_has_member (o, "emissivity_inner"))
    part->emissivity_inner = get_number (o, "emissivity_inner");
  if (json_object_has_member (o, "emissivity_outer"))
    part->emissivity_outer = get_number (o, "emissivity_outer");
}

static LaminaLayer *
read_layer (JsonObject *o)
{
  LaminaLayer *layer;
  g_autofree char *air = NULL;
  gint64 kind = json_object_get_int_member (o, "kind");

  if (kind == LAMINA_LAYER_BRIDGED)
    layer = lamina_layer_new_bridged (NAN);
  else
    layer = lamina_layer_new_material (NAN, NULL);
  layer->kind = (LaminaLayerKind) CLAMP (kind, 0, LAMINA_N_LAYER_KINDS - 1);
  layer->thickness = get_number (o, "thickness");
  layer->material = read_material (o, "material");
  layer->resistance = get_number (o, "resistance");
  air = dup_string (o, "air");
  if (air != NULL)
    lamina_air_kind_from_string (air, &layer->air);
  layer->vent_area = get_number (o, "vent_area");
  layer->emissivity_inner = get_number (o, "emissivity_inner");
  layer->emissivity_outer = get_number (o, "emissivity_outer");
  if (json_object_has_member (o, "parts"))
    {
      JsonArray *parts = json_object_get_array_member (o, "parts");

      for (guint i = 0; i < json_array_get_length (parts); i++)
        {
          JsonObject *po = json_array_get_object_element (parts, i);
          LaminaPart *p = lamina_part_new (read_material (po, "material"),
                                           get_number (po, "fraction"));

          p->width = get_number (po, "width");
          p->spacing = get_number (po, "spacing");
          p->member = dup_string (po, "member");
          read_part_air (po, p);
          lamina_layer_add_part (layer, p);
        }
    }
  read_corrections (o, &layer->corrections);
  layer->sd = get_number (o, "sd");
  layer->note = dup_string (o, "note");
  read_enum (o, "taper", lamina_taper_from_string, &layer->taper);
  layer->thickness_max = get_number (o, "thickness_max");
  layer->air_width = get_number (o, "air_space_width");
  return layer;
}

static void
read_method (JsonObject         *o,
             LaminaConstruction *c)
{
  JsonObject *sub;

  if ((sub = get_object (o, "ground")) != NULL)
    {
      LaminaGround *g = &c->ground;

      c->has_ground = TRUE;
      read_enum (sub, "kind", lamina_ground_kind_from_string, &g->kind);
      read_enum (sub, "soil", lamina_soil_from_string, &g->soil);
      read_enum (sub, "edge", lamina_edge_from_string, &g->edge);
      g->area = get_number (sub, "area");
      g->perimeter = get_number (sub, "perimeter");
      g->wall_thickness = get_number (sub, "wall_thickness");
      g->soil_conductivity = get_number (sub, "soil_conductivity");
      g->underfloor_height = get_number (sub, "underfloor_height");
      g->vent_area = get_number (sub, "vent_area");
      g->underfloor_wall_u = get_number (sub, "underfloor_wall_u");
      g->wind_speed = get_number (sub, "wind_speed");
      g->shielding_factor = get_number (sub, "shielding_factor");
      g->depth = get_number (sub, "depth");
      g->basement_wall_resistance = get_number (sub, "basement_wall_resistance");
      g->edge_size = get_number (sub, "edge_extent");
      g->edge_thickness = get_number (sub, "edge_thickness");
      g->edge_resistance = get_number (sub, "edge_resistance");
    }
  if ((sub = get_object (o, "unheated_space")) != NULL)
    {
      LaminaUnheated *u = &c->unheated;

      read_enum (sub, "kind", lamina_unheated_kind_from_string, &u->kind);
      read_enum (sub, "roof", lamina_roof_type_from_string, &u->roof);
      u->inner_area = get_number (sub, "inner_area");
      u->outer_area = get_number (sub, "outer_area");
      u->outer_u = get_number (sub, "outer_u");
      u->air_change = get_number (sub, "air_change");
      u->volume = get_number (sub, "volume");
    }
  if ((sub = get_object (o, "surfaces")) != NULL)
    {
      LaminaSurfaceConditions *s = &c->surfaces;

      s->wind_speed = get_number (sub, "wind_speed");
      s->emissivity_inside = get_number (sub, "emissivity_inside");
      s->emissivity_outside = get_number (sub, "emissivity_outside");
      s->air_from_profile = json_object_get_boolean_member_with_default (sub, "air_from_profile", FALSE);
    }
}

static gboolean
read_months (JsonObject    *o,
             LaminaClimate *climate)
{
  JsonArray *t = json_object_has_member (o, "temperature") ? json_object_get_array_member (o, "temperature") : NULL;
  JsonArray *h = json_object_has_member (o, "humidity") ? json_object_get_array_member (o, "humidity") : NULL;

  if (t == NULL || h == NULL || json_array_get_length (t) != LAMINA_MONTHS
      || json_array_get_length (h) != LAMINA_MONTHS)
    return FALSE;
  for (guint m = 0; m < LAMINA_MONTHS; m++)
    {
      climate->temperature[m] = json_array_get_double_element (t, m);
      climate->humidity[m] = json_array_get_double_element (h, m);
    }
  return TRUE;
}

static LaminaMoistureSettings *
read_moisture (JsonObject *parent)
{
  JsonObject *o, *data;
  LaminaMoistureSettings *m;
  g_autofree char *climate = NULL;

  if (!json_object_has_member (parent, "moisture"))
    return NULL;
  o = json_object_get_object_member (parent, "moisture");
  climate = dup_string (o, "climate");
  m = lamina_moisture_settings_new (climate);
  m->humidity_class = (int) json_object_get_int_member_with_default (o, "humidity_class", 0);
  m->inside_humidity = get_number (o, "inside_humidity");
  m->inside_temperature = get_number (o, "inside_temperature");
  if (json_object_has_member (o, "climate_data"))
    {
      g_autofree char *name = NULL;

      data = json_object_get_object_member (o, "climate_data");
      name = dup_string (data, "name");
      m->climate_data = lamina_climate_new (climate, name);
      m->climate_data->source = dup_string (data, "source");
      if (!read_months (data, m->climate_data))
        g_clear_pointer (&m->climate_data, lamina_climate_free);
    }
  return m;
}

LaminaConstruction *
lamina_store_construction_from_json (const char  *json,
                                     GError     **error)
{
  g_autoptr(JsonParser) parser = json_parser_new ();
  g_autoptr(GError) local = NULL;
  g_autofree char *element = NULL, *heat_flow = NULL, *outer = NULL;
  JsonObject *o;
  JsonArray *a;
  LaminaConstruction *c;
  LaminaElement el;

  if (!json_parser_load_from_data (parser, json, -1, &local)
      || !JSON_NODE_HOLDS_OBJECT (json_parser_get_root (parser)))
    {
      g_set_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                   "stored construction is damaged: %s",
                   local ? local->message : "not an object");
      return NULL;
    }
  o = json_node_get_object (json_parser_get_root (parser));
  element = dup_string (o, "element");
  if (element == NULL || !lamina_element_from_string (element, &el)
      || !json_object_has_member (o, "layers"))
    {
      g_set_error_literal (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT,
                           "stored construction is damaged: no element or layers");
      return NULL;
    }
  c = lamina_construction_new (NULL, NULL, el);
  c->code = dup_string (o, "code");
  c->name = dup_string (o, "name");
  heat_flow = dup_string (o, "heat_flow");
  if (heat_flow != NULL)
    lamina_heat_flow_from_string (heat_flow, &c->heat_flow);
  outer = dup_string (o, "outer_side");
  if (outer != NULL)
    lamina_outer_side_from_string (outer, &c->outer_side);
  c->description = dup_string (o, "description");
  a = json_object_get_array_member (o, "tags");
  for (guint i = 0; a != NULL && i < json_array_get_length (a); i++)
    lamina_construction_add_tag (c, json_array_get_string_element (a, i));
  a = json_object_get_array_member (o, "layers");
  for (guint i = 0; i < json_array_get_length (a); i++)
    lamina_construction_add_layer (c, read_layer (json_array_get_object_element (a, i)));
  c->target_u = get_number (o, "target_u");
  c->inside_temperature = get_number (o, "inside_temperature");
  c->outside_temperature = get_number (o, "outside_temperature");
  c->notes = dup_string (o, "notes");
  c->source_review = dup_string (o, "source_review");
  c->draft_stamp = dup_string (o, "draft_stamp");
  read_method (o, c);

  c->moisture = read_moisture (o);
  return c;
}

char *
lamina_store_material_fingerprint (const LaminaMaterial *m)
{
  char buf[5][G_ASCII_DTOSTR_BUF_SIZE];
  const double v[5] = { m->conductivity, m->density, m->specific_heat,
                        m->vapour_resistance_factor, m->emissivity };

  for (int i = 0; i < 5; i++)
    {
      if (isnan (v[i]))
        g_strlcpy (buf[i], "-", sizeof buf[i]);
      else
        g_ascii_dtostr (buf[i], sizeof buf[i], v[i]);
    }
  return g_strjoin ("|", buf[0], buf[1], buf[2], buf[3], buf[4], NULL);
}

char *
lamina_store_climate_fingerprint (const LaminaClimate *climate)
{
  GString *text = g_string_new (NULL);
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      g_string_append (text, g_ascii_dtostr (buf, sizeof buf, climate->temperature[m]));
      g_string_append_c (text, '/');
      g_string_append (text, g_ascii_dtostr (buf, sizeof buf, climate->humidity[m]));
      if (m + 1 < LAMINA_MONTHS)
        g_string_append_c (text, '|');
    }
  return g_string_free (text, FALSE);
}

char *
lamina_store_climate_months_to_json (const LaminaClimate *climate)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();
  g_autoptr(JsonGenerator) gen = json_generator_new ();
  g_autoptr(JsonNode) root = NULL;

  json_builder_begin_object (b);
  add_months (b, climate);
  json_builder_end_object (b);
  root = json_builder_get_root (b);
  json_generator_set_root (gen, root);
  return json_generator_to_data (gen, NULL);
}

gboolean
lamina_store_climate_months_from_json (const char    *json,
                                       LaminaClimate *climate)
{
  g_autoptr(JsonParser) parser = json_parser_new ();

  if (json == NULL || !json_parser_load_from_data (parser, json, -1, NULL)
      || !JSON_NODE_HOLDS_OBJECT (json_parser_get_root (parser)))
    return FALSE;
  return read_months (json_node_get_object (json_parser_get_root (parser)), climate);
}
