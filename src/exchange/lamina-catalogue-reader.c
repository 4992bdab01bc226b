/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The catalogue reader: a schema-valid document becomes the model.  Every
 * value is parsed strictly, every construction is validated and calculated,
 * and the first fault is reported as "NAME:LINE: message".  Nothing is
 * returned unless the whole document is good. */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-private.h"
#include "lamina-moisture.h"

#include <errno.h>
#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

typedef struct
{
  LaminaMaterial *material;  /* borrowed; id is the library id */
  int             line;
  gboolean        snapshot;
} Entry;

typedef struct
{
  LaminaXmlSource  src;           /* the document's name and the error */
  GHashTable      *materials;     /* id in the document → Entry* */
  GHashTable      *constructions; /* id → line */
  GPtrArray       *snapshots;     /* LaminaMaterial*, owned */
  LaminaCatalogue *catalogue;
} Reader;

#define fail(r, line, code, ...) lamina_xml_fail (&(r)->src, (line), (code), __VA_ARGS__)

static int
line_of (xmlNode *node)
{
  return lamina_xml_node_get_line (node);
}

static gboolean
is_element (xmlNode    *node,
            const char *name)
{
  return lamina_xml_is_element (node, name);
}

static char *
dup_attr (xmlNode    *node,
          const char *name)
{
  return lamina_xml_dup_attr (node, name);
}

static char *
dup_text (xmlNode *node)
{
  return lamina_xml_dup_text (node);
}

/* Strict: the whole attribute is one finite number in the C locale.
 * An absent attribute leaves *value alone. */
#define get_number(r, node, attr, value) lamina_xml_get_number (&(r)->src, (node), (attr), (value))

static gboolean
get_required_number (Reader     *r,
                     xmlNode    *node,
                     const char *attr,
                     double     *value)
{
  if (!xmlHasNsProp (node, (const xmlChar *) attr, NULL))
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("<%s> needs the attribute %s="), (const char *) node->name, attr);
  return get_number (r, node, attr, value);
}

#define get_count(r, node, attr, max, value) \
  lamina_xml_get_count (&(r)->src, (node), (attr), 0, (max), (value))

/* Enumerated attributes; the schema has checked the names already. */
#define GET_ENUM(r, node, attr, from_string, value)                           \
  G_STMT_START {                                                              \
    g_autofree char *text_ = dup_attr (node, attr);                           \
    if (text_ != NULL && !from_string (text_, value))                         \
      return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,               \
                   _("%s=“%s” is not one of the allowed names"), attr, text_); \
  } G_STMT_END

/* Materials */

/* A material that no layer uses is never validated by the model, yet the
 * library takes it in: check its design values here. */
static gboolean
check_material_values (Reader               *r,
                       xmlNode              *node,
                       const LaminaMaterial *m)
{
  struct { const char *attr; double value, min, max; gboolean open_min; } checks[] = {
    { "conductivity", m->conductivity, LAMINA_MIN_CONDUCTIVITY, LAMINA_MAX_CONDUCTIVITY, FALSE },
    { "density", m->density, 0, 25000, FALSE },
    { "specific-heat", m->specific_heat, 0, 100000, FALSE },
    { "vapour-resistance-factor", m->vapour_resistance_factor, 0, 1e7, FALSE },
    { "emissivity", m->emissivity, 0, 1, FALSE },
  };

  for (guint i = 0; i < G_N_ELEMENTS (checks); i++)
    {
      double v = checks[i].value;

      if (isnan (v))
        continue;
      if ((checks[i].open_min ? v <= checks[i].min : v < checks[i].min) || v > checks[i].max)
        return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                     _("material “%s”: %s=%g is outside the allowed range %s%g to %g"),
                     m->id, checks[i].attr, v, checks[i].open_min ? _("above ") : "",
                     checks[i].min, checks[i].max);
    }
  return TRUE;
}

static gboolean
read_material (Reader  *r,
               xmlNode *node)
{
  g_autoptr(LaminaMaterial) m = lamina_material_new (NULL, NULL, LAMINA_CATEGORY_OTHER, NAN);
  g_autofree char *id = dup_attr (node, "id");
  g_autofree char *snapshot_of = dup_attr (node, "snapshot-of");
  g_autofree char *stock = dup_attr (node, "stock-thicknesses");
  g_autoptr(GError) stock_error = NULL;
  Entry *entry, *known;

  if (id == NULL)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, _("<material> needs an id="));
  known = g_hash_table_lookup (r->materials, id);
  if (known != NULL)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("material id “%s” is used twice (first on line %d)"), id, known->line);
  m->name = dup_attr (node, "name");
  m->source = dup_attr (node, "source");
  GET_ENUM (r, node, "category", lamina_category_from_string, &m->category);
  if (!get_required_number (r, node, "conductivity", &m->conductivity)
      || !get_number (r, node, "density", &m->density)
      || !get_number (r, node, "specific-heat", &m->specific_heat)
      || !get_number (r, node, "vapour-resistance-factor", &m->vapour_resistance_factor)
      || !get_number (r, node, "emissivity", &m->emissivity))
    return FALSE;
  m->id = g_strdup (id);
  if (!check_material_values (r, node, m))
    return FALSE;
  if (stock != NULL && !lamina_material_parse_stock_string (m, stock, &stock_error))
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, _("material “%s”: %s"), id, stock_error->message);
  g_clear_pointer (&m->id, g_free);
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    if (is_element (child, "notes"))
      m->notes = dup_text (child);

  entry = g_new0 (Entry, 1);
  entry->line = line_of (node);
  entry->snapshot = snapshot_of != NULL;
  m->id = entry->snapshot ? g_steal_pointer (&snapshot_of) : g_strdup (id);
  entry->material = m;
  if (entry->snapshot)
    g_ptr_array_add (r->snapshots, g_steal_pointer (&m));
  else
    g_ptr_array_add (r->catalogue->materials, g_steal_pointer (&m));
  g_hash_table_insert (r->materials, g_steal_pointer (&id), entry);
  return TRUE;
}

/* Climates (EN ISO 13788:2012 4.2): twelve <month> children, each number
 * once. */

static gboolean
read_month (Reader        *r,
            xmlNode       *node,
            LaminaClimate *climate)
{
  int number = 0;
  double t = NAN, h = NAN;

  if (!get_count (r, node, "number", LAMINA_MONTHS, &number)
      || !get_required_number (r, node, "temperature", &t)
      || !get_required_number (r, node, "humidity", &h))
    return FALSE;
  if (number < 1)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, _("month number=%d is not 1 to 12"), number);
  if (!isnan (climate->temperature[number - 1]))
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("climate “%s”: month %d is given twice"), climate->id, number);
  climate->temperature[number - 1] = t;
  climate->humidity[number - 1] = h;
  return TRUE;
}

static gboolean
read_climate (Reader  *r,
              xmlNode *node)
{
  g_autofree char *id = dup_attr (node, "id");
  g_autofree char *name = dup_attr (node, "name");
  g_autoptr(LaminaClimate) climate = NULL;
  g_autoptr(GError) local = NULL;
  LaminaClimate *known;

  if (id == NULL)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, _("<climate> needs an id="));
  if ((known = lamina_catalogue_find_climate (r->catalogue, id)) != NULL)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("climate id “%s” is used twice (first on line %d)"), id, known->line);
  climate = lamina_climate_new (id, name);
  climate->source = dup_attr (node, "source");
  climate->line = MAX (line_of (node), 1);
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    if (is_element (child, "month") && !read_month (r, child, climate))
      return FALSE;
  if (!lamina_climate_validate (climate, &local))
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, "%s", local->message);
  g_ptr_array_add (r->catalogue->climates, g_steal_pointer (&climate));
  return TRUE;
}

/* A snapshot keeps the library id of a material of the same document. */
static gboolean
check_snapshots (Reader *r)
{
  GHashTableIter iter;
  gpointer key, value;

  g_hash_table_iter_init (&iter, r->materials);
  while (g_hash_table_iter_next (&iter, &key, &value))
    {
      Entry *entry = value;
      Entry *library;

      if (!entry->snapshot)
        continue;
      library = g_hash_table_lookup (r->materials, entry->material->id);
      if (library == NULL || library->snapshot)
        return fail (r, entry->line, LAMINA_XML_ERROR_INVALID,
                     _("material “%s” is a snapshot-of “%s”, which is not a library material "
                       "of this document"), (const char *) key, entry->material->id);
    }
  return TRUE;
}

static LaminaMaterial *
resolve_material (Reader     *r,
                  xmlNode    *node,
                  const char *id)
{
  Entry *entry = g_hash_table_lookup (r->materials, id);

  if (entry == NULL)
    {
      fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, _("unknown material “%s”"), id);
      return NULL;
    }
  return lamina_material_copy (entry->material);
}

/* Layers */

static gboolean
read_part (Reader      *r,
           xmlNode     *node,
           LaminaLayer *layer)
{
  g_autofree char *material_id = dup_attr (node, "material");
  gboolean air = xmlHasNsProp (node, (const xmlChar *) "air", NULL) != NULL;
  g_autoptr(LaminaPart) part = NULL;
  LaminaMaterial *material = NULL;

  if ((material_id != NULL) == air)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("a <part> takes either material= or air=, and one of them"));
  if (material_id != NULL && (material = resolve_material (r, node, material_id)) == NULL)
    return FALSE;
  part = lamina_part_new (material, NAN);
  part->member = dup_attr (node, "member");
  part->line = line_of (node);
  if (air)
    GET_ENUM (r, node, "air", lamina_air_kind_from_string, &part->air);
  if (!air
      && (xmlHasNsProp (node, (const xmlChar *) "emissivity-inner", NULL)
          || xmlHasNsProp (node, (const xmlChar *) "emissivity-outer", NULL)))
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("the emissivities of a <part> belong to an air part (air=)"));
  if (!get_number (r, node, "fraction", &part->fraction)
      || !get_number (r, node, "width", &part->width)
      || !get_number (r, node, "spacing", &part->spacing)
      || !get_number (r, node, "emissivity-inner", &part->emissivity_inner)
      || !get_number (r, node, "emissivity-outer", &part->emissivity_outer))
    return FALSE;
  lamina_layer_add_part (layer, g_steal_pointer (&part));
  return TRUE;
}

static gboolean
read_correction (Reader      *r,
                 xmlNode     *node,
                 LaminaLayer *layer)
{
  LaminaCorrections *k = &layer->corrections;

  if (is_element (node, "air-gaps"))
    {
      k->has_air_gaps = TRUE;
      return get_count (r, node, "level", 2, &k->air_gap_level);
    }
  if (is_element (node, "fasteners"))
    {
      k->has_fasteners = TRUE;
      return get_required_number (r, node, "conductivity", &k->fastener_conductivity)
             && get_required_number (r, node, "cross-section", &k->fastener_cross_section)
             && get_required_number (r, node, "per-square-metre", &k->fasteners_per_square_metre)
             && get_number (r, node, "penetration", &k->fastener_penetration);
    }
  if (is_element (node, "inverted-roof"))
    {
      k->has_inverted_roof = TRUE;
      return get_required_number (r, node, "precipitation", &k->precipitation)
             && get_required_number (r, node, "drainage-factor", &k->drainage_factor);
    }
  return TRUE;
}

static LaminaLayer *
new_layer (Reader  *r,
           xmlNode *node)
{
  g_autofree char *material_id = dup_attr (node, "material");
  gboolean has_resistance = xmlHasNsProp (node, (const xmlChar *) "resistance", NULL) != NULL;
  gboolean has_air = xmlHasNsProp (node, (const xmlChar *) "air", NULL) != NULL;
  gboolean has_parts = FALSE;
  LaminaMaterial *material;

  for (xmlNode *child = node->children; child != NULL; child = child->next)
    has_parts |= is_element (child, "part");
  if ((material_id != NULL) + has_resistance + has_air + has_parts != 1)
    {
      fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
            _("a <layer> takes exactly one of material=, resistance=, air= or <part> elements"));
      return NULL;
    }
  if (!has_air
      && (xmlHasNsProp (node, (const xmlChar *) "vent-area", NULL)
          || xmlHasNsProp (node, (const xmlChar *) "emissivity-inner", NULL)
          || xmlHasNsProp (node, (const xmlChar *) "emissivity-outer", NULL)))
    {
      fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
            _("vent-area= and the emissivities belong to an air layer (air=)"));
      return NULL;
    }
  if (material_id != NULL)
    {
      if ((material = resolve_material (r, node, material_id)) == NULL)
        return NULL;
      return lamina_layer_new_material (NAN, material);
    }
  if (has_resistance)
    return lamina_layer_new_resistance (NAN, NAN);
  if (has_air)
    return lamina_layer_new_air (NAN, LAMINA_AIR_UNVENTILATED);
  return lamina_layer_new_bridged (NAN);
}

static gboolean
read_layer (Reader             *r,
            xmlNode            *node,
            LaminaConstruction *c)
{
  g_autoptr(LaminaLayer) layer = new_layer (r, node);

  if (layer == NULL)
    return FALSE;
  layer->line = line_of (node);
  GET_ENUM (r, node, "air", lamina_air_kind_from_string, &layer->air);
  GET_ENUM (r, node, "taper", lamina_taper_from_string, &layer->taper);
  if (layer->kind != LAMINA_LAYER_AIR && xmlHasNsProp (node, (const xmlChar *) "air-space-width", NULL))
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
                 _("air-space-width= belongs to an air layer (air=)"));
  if (!get_required_number (r, node, "thickness", &layer->thickness)
      || !get_number (r, node, "thickness-max", &layer->thickness_max)
      || !get_number (r, node, "air-space-width", &layer->air_width)
      || !get_number (r, node, "resistance", &layer->resistance)
      || !get_number (r, node, "vent-area", &layer->vent_area)
      || !get_number (r, node, "emissivity-inner", &layer->emissivity_inner)
      || !get_number (r, node, "emissivity-outer", &layer->emissivity_outer)
      || !get_number (r, node, "sd", &layer->sd))
    return FALSE;
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    {
      if (is_element (child, "note"))
        layer->note = dup_text (child);
      else if (is_element (child, "part"))
        {
          if (!read_part (r, child, layer))
            return FALSE;
        }
      else if (child->type == XML_ELEMENT_NODE && !read_correction (r, child, layer))
        return FALSE;
    }
  lamina_construction_add_layer (c, g_steal_pointer (&layer));
  return TRUE;
}

/* Constructions */

static void
read_record (xmlNode  *node,
             char    **by,
             char    **at)
{
  g_free (*by);
  g_free (*at);
  *by = dup_attr (node, "by");
  *at = dup_attr (node, "at");
}

/* <moisture climate= humidity-class= | inside-humidity= [inside-temperature=]> */
static gboolean
read_moisture (Reader             *r,
               xmlNode            *node,
               LaminaConstruction *c)
{
  g_autoptr(LaminaMoistureSettings) m = NULL;
  g_autofree char *climate = dup_attr (node, "climate");

  m = lamina_moisture_settings_new (climate);
  m->line = line_of (node);
  if (!get_count (r, node, "humidity-class", 5, &m->humidity_class)
      || !get_number (r, node, "inside-humidity", &m->inside_humidity)
      || !get_number (r, node, "inside-temperature", &m->inside_temperature))
    return FALSE;
  if (xmlHasNsProp (node, (const xmlChar *) "humidity-class", NULL) && m->humidity_class == 0)
    return fail (r, line_of (node), LAMINA_XML_ERROR_INVALID, _("humidity-class=0 is not 1 to 5"));
  lamina_construction_set_moisture (c, g_steal_pointer (&m));
  return TRUE;
}

/* EN ISO 13370: the plan of a ground floor. */
static gboolean
read_ground (Reader             *r,
             xmlNode            *node,
             LaminaConstruction *c)
{
  LaminaGround *g = &c->ground;

  c->has_ground = TRUE;
  g->line = line_of (node);
  GET_ENUM (r, node, "kind", lamina_ground_kind_from_string, &g->kind);
  GET_ENUM (r, node, "soil", lamina_soil_from_string, &g->soil);
  GET_ENUM (r, node, "edge-insulation", lamina_edge_from_string, &g->edge);
  return get_required_number (r, node, "area", &g->area)
         && get_required_number (r, node, "perimeter", &g->perimeter)
         && get_required_number (r, node, "wall-thickness", &g->wall_thickness)
         && get_number (r, node, "soil-conductivity", &g->soil_conductivity)
         && get_number (r, node, "underfloor-height", &g->underfloor_height)
         && get_number (r, node, "vent-area", &g->vent_area)
         && get_number (r, node, "underfloor-wall-u", &g->underfloor_wall_u)
         && get_number (r, node, "wind-speed", &g->wind_speed)
         && get_number (r, node, "shielding-factor", &g->shielding_factor)
         && get_number (r, node, "depth", &g->depth)
         && get_number (r, node, "basement-wall-resistance", &g->basement_wall_resistance)
         && get_number (r, node, "edge-extent", &g->edge_size)
         && get_number (r, node, "edge-thickness", &g->edge_thickness)
         && get_number (r, node, "edge-resistance", &g->edge_resistance);
}

/* EN ISO 6946 6.10: an unheated space outside. */
static gboolean
read_unheated_space (Reader             *r,
                     xmlNode            *node,
                     LaminaConstruction *c)
{
  LaminaUnheated *u = &c->unheated;

  u->line = line_of (node);
  GET_ENUM (r, node, "kind", lamina_unheated_kind_from_string, &u->kind);
  GET_ENUM (r, node, "roof", lamina_roof_type_from_string, &u->roof);
  return get_number (r, node, "inner-area", &u->inner_area)
         && get_number (r, node, "outer-area", &u->outer_area)
         && get_number (r, node, "outer-u", &u->outer_u)
         && get_number (r, node, "air-change", &u->air_change)
         && get_number (r, node, "volume", &u->volume);
}

/* EN ISO 6946 Annexes C and D. */
static gboolean
read_surfaces (Reader             *r,
               xmlNode            *node,
               LaminaConstruction *c)
{
  LaminaSurfaceConditions *s = &c->surfaces;
  g_autofree char *air_layers = dup_attr (node, "air-layers");

  s->line = line_of (node);
  s->air_from_profile = g_strcmp0 (air_layers, "profile") == 0;
  return get_number (r, node, "wind-speed", &s->wind_speed)
         && get_number (r, node, "emissivity-inside", &s->emissivity_inside)
         && get_number (r, node, "emissivity-outside", &s->emissivity_outside);
}

static gboolean
read_construction_child (Reader             *r,
                         xmlNode            *child,
                         LaminaConstruction *c)
{
  if (is_element (child, "layer"))
    return read_layer (r, child, c);
  if (is_element (child, "moisture"))
    return read_moisture (r, child, c);
  if (is_element (child, "ground"))
    return read_ground (r, child, c);
  if (is_element (child, "unheated-space"))
    return read_unheated_space (r, child, c);
  if (is_element (child, "surfaces"))
    return read_surfaces (r, child, c);
  if (is_element (child, "description"))
    c->description = dup_text (child);
  else if (is_element (child, "notes"))
    c->notes = dup_text (child);
  else if (is_element (child, "tag"))
    g_ptr_array_add (c->tags, dup_text (child));
  else if (is_element (child, "modified"))
    read_record (child, &c->modified_by, &c->modified_at);
  else if (is_element (child, "checked"))
    read_record (child, &c->checked_by, &c->checked_at);
  else if (is_element (child, "approved"))
    read_record (child, &c->approved_by, &c->approved_at);
  /* <derived> is never trusted: the figures are recomputed by whoever
   * needs them.  The schema has checked its form. */
  return TRUE;
}

static LaminaConstruction *
new_construction (Reader  *r,
                  xmlNode *node)
{
  g_autofree char *id = dup_attr (node, "id");
  g_autofree char *name = dup_attr (node, "name");
  g_autofree char *element = dup_attr (node, "element");
  LaminaElement kind;
  int known;

  if (id == NULL || element == NULL || !lamina_element_from_string (element, &kind))
    {
      fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
            _("a <construction> needs an id= and a known element="));
      return NULL;
    }
  known = GPOINTER_TO_INT (g_hash_table_lookup (r->constructions, id));
  if (known != 0)
    {
      fail (r, line_of (node), LAMINA_XML_ERROR_INVALID,
            _("construction id “%s” is used twice (first on line %d)"), id, known);
      return NULL;
    }
  g_hash_table_insert (r->constructions, g_strdup (id), GINT_TO_POINTER (MAX (line_of (node), 1)));
  /* The constructor sets the defaults of heat-flow and outer-side. */
  return lamina_construction_new (id, name, kind);
}

static gboolean
check_moisture (Reader             *r,
                LaminaConstruction *c)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaMoistureResult) result = NULL;
  int line = 0;

  if (c->moisture == NULL)
    return TRUE;
  if (!lamina_catalogue_check_moisture (r->catalogue, c, &line, &local))
    return fail (r, line > 0 ? line : c->line, LAMINA_XML_ERROR_INVALID,
                 _("construction “%s”: %s"), c->id, local->message);
  /* The construction carries the climate it is checked with. */
  lamina_climate_free (c->moisture->climate_data);
  c->moisture->climate_data = lamina_climate_copy (lamina_catalogue_find_climate (r->catalogue,
                                                                                c->moisture->climate));
  c->moisture->climate_data->line = 0;
  /* Other needs of the method (a declared resistance without sd). */
  result = lamina_moisture_calculate_own (c, NAN, &local);
  if (result == NULL)
    return fail (r, c->moisture->line, LAMINA_XML_ERROR_INVALID,
                 _("construction “%s”: %s"), c->id, local->message);
  return TRUE;
}

static gboolean
check_construction (Reader             *r,
                    LaminaConstruction *c)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaResult) result = NULL;
  int line = 0;

  if (!lamina_construction_validate (c, &line, &local))
    return fail (r, line > 0 ? line : c->line, LAMINA_XML_ERROR_INVALID,
                 _("construction “%s”: %s"), c->id, local->message);
  /* Some limits only the engine sees (air layers over 300 mm, framing
   * patterns that cannot line up). */
  result = lamina_calculate (c, &local);
  if (result == NULL)
    return fail (r, c->line, LAMINA_XML_ERROR_INVALID,
                 _("construction “%s”: %s"), c->id, local->message);
  return check_moisture (r, c);
}

static gboolean
read_construction (Reader  *r,
                   xmlNode *node)
{
  g_autoptr(LaminaConstruction) c = new_construction (r, node);

  if (c == NULL)
    return FALSE;
  c->line = line_of (node);
  c->code = dup_attr (node, "code");
  GET_ENUM (r, node, "heat-flow", lamina_heat_flow_from_string, &c->heat_flow);
  GET_ENUM (r, node, "outer-side", lamina_outer_side_from_string, &c->outer_side);
  GET_ENUM (r, node, "status", lamina_status_from_string, &c->status);
  if (!get_count (r, node, "revision", G_MAXINT, &c->revision)
      || !get_number (r, node, "target-u", &c->target_u)
      || !get_number (r, node, "inside-temperature", &c->inside_temperature)
      || !get_number (r, node, "outside-temperature", &c->outside_temperature))
    return FALSE;
  for (xmlNode *child = node->children; child != NULL; child = child->next)
    if (!read_construction_child (r, child, c))
      return FALSE;
  if (!check_construction (r, c))
    return FALSE;
  g_ptr_array_add (r->catalogue->constructions, g_steal_pointer (&c));
  return TRUE;
}

static gboolean
read_catalogue (Reader  *r,
                xmlNode *root)
{
  /* Materials first, so that constructions may come in any order. */
  for (xmlNode *child = root->children; child != NULL; child = child->next)
    {
      if (is_element (child, "title"))
        {
          g_free (r->catalogue->title);
          r->catalogue->title = dup_text (child);
        }
      else if (is_element (child, "material") && !read_material (r, child))
        return FALSE;
      else if (is_element (child, "climate") && !read_climate (r, child))
        return FALSE;
    }
  if (!check_snapshots (r))
    return FALSE;
  for (xmlNode *child = root->children; child != NULL; child = child->next)
    if (is_element (child, "target-set")
        && !lamina_catalogue_read_target_set (r->catalogue, child, &r->src))
      return FALSE;
  for (xmlNode *child = root->children; child != NULL; child = child->next)
    if (is_element (child, "construction") && !read_construction (r, child))
      return FALSE;
  for (xmlNode *child = root->children; child != NULL; child = child->next)
    if (is_element (child, "job") && !lamina_catalogue_read_job (r->catalogue, child, &r->src))
      return FALSE;
  return TRUE;
}

LaminaCatalogue *
lamina_catalogue_read_memory (const char  *data,
                              gsize        length,
                              const char  *name,
                              GError     **error)
{
  g_autoptr(xmlDoc) doc = NULL;
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  Reader r = { 0 };
  gboolean ok;

  g_return_val_if_fail (data != NULL || length == 0, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (name == NULL)
    name = "<memory>";
  doc = lamina_xml_document_parse (data, length, name, error);
  if (doc == NULL)
    return NULL;

  catalogue = lamina_catalogue_new ();
  r.src.name = name;
  r.src.error = error;
  r.catalogue = catalogue;
  r.materials = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, g_free);
  r.constructions = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  r.snapshots = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_material_free);
  ok = read_catalogue (&r, xmlDocGetRootElement (doc));
  g_hash_table_unref (r.materials);
  g_hash_table_unref (r.constructions);
  g_ptr_array_unref (r.snapshots);
  return ok ? g_steal_pointer (&catalogue) : NULL;
}
