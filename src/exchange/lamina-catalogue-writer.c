/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The catalogue writer.  It refuses what its reader would refuse (invalid
 * constructions, text XML cannot carry), writes numbers in the shortest
 * form that reads back exactly, and checks its own output against the
 * schema, so that every document it writes can be read back. */
#define G_LOG_DOMAIN "lamina-exchange"

#include "lamina-catalogue-private.h"
#include "lamina-catalogue-materials.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

typedef struct
{
  GString          *out;
  GError          **error;
  LaminaMaterialIds *ids;
} Writer;

static gboolean
fail (Writer     *w,
      const char *format,
      ...) G_GNUC_PRINTF (2, 3);

static gboolean
fail (Writer     *w,
      const char *format,
      ...)
{
  g_autofree char *message = NULL;
  va_list args;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  g_set_error_literal (w->error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID, message);
  return FALSE;
}

/* XML 1.0 (2.2) carries tab, newline, carriage return and characters from
 * U+0020 except U+FFFE and U+FFFF; nothing else, not even escaped. */
static gboolean
check_text (Writer     *w,
            const char *where,
            const char *field,
            const char *text)
{
  if (text == NULL)
    return TRUE;
  if (!g_utf8_validate (text, -1, NULL))
    return fail (w, _("%s: the %s is not valid UTF-8"), where, field);
  for (const char *p = text; *p; p = g_utf8_next_char (p))
    {
      gunichar c = g_utf8_get_char (p);

      if ((c < 0x20 && c != '\t' && c != '\n' && c != '\r') || c == 0xFFFE || c == 0xFFFF)
        return fail (w, _("%s: the %s contains a character XML cannot carry (U+%04X)"),
                     where, field, c);
    }
  return TRUE;
}

static void
append_escaped (GString    *out,
                const char *text,
                gboolean    attribute)
{
  for (const char *p = text; *p; p++)
    {
      /* Copy the run of plain characters at once. */
      gsize plain = strcspn (p, "&<>\r\"\n\t");

      g_string_append_len (out, p, plain);
      p += plain;
      if (*p == '\0')
        break;
      switch (*p)
        {
        case '&': g_string_append (out, "&amp;"); break;
        case '<': g_string_append (out, "&lt;"); break;
        case '>': g_string_append (out, "&gt;"); break;
        /* A reader normalises a raw CR, and raw blanks in attributes. */
        case '\r': g_string_append (out, "&#13;"); break;
        case '"': g_string_append (out, attribute ? "&quot;" : "\""); break;
        case '\n': g_string_append (out, attribute ? "&#10;" : "\n"); break;
        case '\t': g_string_append (out, attribute ? "&#9;" : "\t"); break;
        default: g_string_append_c (out, *p); break;
        }
    }
}

static void
write_attr (Writer     *w,
            const char *name,
            const char *value)
{
  if (value == NULL)
    return;
  /* Plain appends: this runs for every attribute of a 10,000-construction
   * export, and printf-style formatting was a tenth of its time. */
  g_string_append_c (w->out, ' ');
  g_string_append (w->out, name);
  g_string_append (w->out, "=\"");
  append_escaped (w->out, value, TRUE);
  g_string_append_c (w->out, '"');
}

/* The shortest of %.15g, %.16g and %.17g that reads back as @value: 12.5
 * stays "12.5" and 0.035 stays "0.035", and every double survives. */
static void
write_number (Writer     *w,
              const char *name,
              double      value)
{
  char buffer[G_ASCII_DTOSTR_BUF_SIZE];
  static const char *const formats[] = { "%.15g", "%.16g", "%.17g" };

  if (isnan (value))
    return;
  for (guint i = 0; i < G_N_ELEMENTS (formats); i++)
    {
      g_ascii_formatd (buffer, sizeof buffer, formats[i], value);
      if (g_ascii_strtod (buffer, NULL) == value)
        break;
    }
  write_attr (w, name, buffer);
}

static void
write_int (Writer     *w,
           const char *name,
           int         value)
{
  g_string_append_printf (w->out, " %s=\"%d\"", name, value);
}

static void
write_text_element (Writer     *w,
                    const char *indent,
                    const char *name,
                    const char *text)
{
  if (text == NULL)
    return;
  g_string_append (w->out, indent);
  g_string_append_c (w->out, '<');
  g_string_append (w->out, name);
  g_string_append_c (w->out, '>');
  append_escaped (w->out, text, FALSE);
  g_string_append (w->out, "</");
  g_string_append (w->out, name);
  g_string_append (w->out, ">\n");
}

static void
write_record (Writer     *w,
              const char *name,
              const char *by,
              const char *at)
{
  if (by == NULL && at == NULL)
    return;
  g_string_append_printf (w->out, "    <%s", name);
  write_attr (w, "by", by);
  write_attr (w, "at", at);
  g_string_append (w->out, "/>\n");
}

/* Materials */

static gboolean
check_material (Writer               *w,
                const LaminaMaterial *m)
{
  g_autofree char *where = g_strdup_printf (_("material “%s”"), m->id ? m->id : "");

  if (m->name == NULL || m->name[0] == '\0')
    return fail (w, _("%s: a material needs a name"), where);
  if (!isfinite (m->conductivity))
    return fail (w, _("%s: a material needs a finite thermal conductivity"), where);
  return check_text (w, where, _("name"), m->name)
         && check_text (w, where, _("source"), m->source)
         && check_text (w, where, _("notes"), m->notes);
}

static void
write_material (Writer               *w,
                const LaminaMaterial *m,
                const char           *id,
                const char           *snapshot_of)
{
  g_string_append (w->out, "  <material");
  write_attr (w, "id", id);
  if (snapshot_of != NULL)
    write_attr (w, "snapshot-of", snapshot_of);
  write_attr (w, "name", m->name);
  if (m->category != LAMINA_CATEGORY_OTHER)
    write_attr (w, "category", lamina_category_to_string (m->category));
  write_number (w, "conductivity", m->conductivity);
  write_number (w, "density", m->density);
  write_number (w, "specific-heat", m->specific_heat);
  write_number (w, "vapour-resistance-factor", m->vapour_resistance_factor);
  write_number (w, "emissivity", m->emissivity);
  write_attr (w, "source", m->source);
  if (m->n_stock_thicknesses > 0)
    {
      g_autofree char *stock = lamina_material_dup_stock_string (m);
      write_attr (w, "stock-thicknesses", stock);
    }
  if (m->notes == NULL)
    {
      g_string_append (w->out, "/>\n");
      return;
    }
  g_string_append (w->out, ">\n");
  write_text_element (w, "    ", "notes", m->notes);
  g_string_append (w->out, "  </material>\n");
}

static gboolean
write_materials (Writer *w)
{
  for (guint i = 0; i < lamina_material_ids_get_n (w->ids); i++)
    {
      const char *id, *snapshot_of;
      const LaminaMaterial *m = lamina_material_ids_get (w->ids, i, &id, &snapshot_of);

      if (!check_material (w, m))
        return FALSE;
      write_material (w, m, id, snapshot_of);
    }
  return TRUE;
}

/* Layers */

static void
write_part (Writer           *w,
            const LaminaPart *part)
{
  g_string_append (w->out, "      <part");
  if (part->material != NULL)
    write_attr (w, "material", lamina_material_ids_lookup (w->ids, part->material));
  else
    write_attr (w, "air", lamina_air_kind_to_string (part->air));
  write_number (w, "fraction", part->fraction);
  write_number (w, "width", part->width);
  write_number (w, "spacing", part->spacing);
  write_attr (w, "member", part->member);
  if (part->material == NULL && part->emissivity_inner != LAMINA_DEFAULT_EMISSIVITY)
    write_number (w, "emissivity-inner", part->emissivity_inner);
  if (part->material == NULL && part->emissivity_outer != LAMINA_DEFAULT_EMISSIVITY)
    write_number (w, "emissivity-outer", part->emissivity_outer);
  g_string_append (w->out, "/>\n");
}

static void
write_corrections (Writer                  *w,
                   const LaminaCorrections *k)
{
  if (k->has_air_gaps)
    {
      g_string_append (w->out, "      <air-gaps");
      write_int (w, "level", k->air_gap_level);
      g_string_append (w->out, "/>\n");
    }
  if (k->has_fasteners)
    {
      g_string_append (w->out, "      <fasteners");
      write_number (w, "conductivity", k->fastener_conductivity);
      write_number (w, "cross-section", k->fastener_cross_section);
      write_number (w, "per-square-metre", k->fasteners_per_square_metre);
      write_number (w, "penetration", k->fastener_penetration);
      g_string_append (w->out, "/>\n");
    }
  if (k->has_inverted_roof)
    {
      g_string_append (w->out, "      <inverted-roof");
      write_number (w, "precipitation", k->precipitation);
      write_number (w, "drainage-factor", k->drainage_factor);
      g_string_append (w->out, "/>\n");
    }
}

static void
write_layer_attributes (Writer            *w,
                        const LaminaLayer *layer)
{
  write_number (w, "thickness", layer->thickness);
  switch (layer->kind)
    {
    case LAMINA_LAYER_MATERIAL:
      write_attr (w, "material", lamina_material_ids_lookup (w->ids, layer->material));
      break;
    case LAMINA_LAYER_RESISTANCE:
      write_number (w, "resistance", layer->resistance);
      break;
    case LAMINA_LAYER_AIR:
      write_attr (w, "air", lamina_air_kind_to_string (layer->air));
      write_number (w, "vent-area", layer->vent_area);
      if (layer->emissivity_inner != LAMINA_DEFAULT_EMISSIVITY)
        write_number (w, "emissivity-inner", layer->emissivity_inner);
      if (layer->emissivity_outer != LAMINA_DEFAULT_EMISSIVITY)
        write_number (w, "emissivity-outer", layer->emissivity_outer);
      write_number (w, "air-space-width", layer->air_width);
      break;
    case LAMINA_LAYER_BRIDGED:
    case LAMINA_N_LAYER_KINDS:
    default:
      break;
    }
  write_number (w, "sd", layer->sd);
  if (lamina_layer_is_tapered (layer))
    {
      write_number (w, "thickness-max", layer->thickness_max);
      write_attr (w, "taper", lamina_taper_to_string (layer->taper));
    }
}

/* EN ISO 13370, 6946 6.10 and Annexes C/D: after the layers. */
static void
write_method (Writer                   *w,
              const LaminaConstruction *c)
{
  const LaminaGround *g = &c->ground;
  const LaminaUnheated *u = &c->unheated;
  const LaminaSurfaceConditions *s = &c->surfaces;

  if (c->has_ground)
    {
      g_string_append (w->out, "    <ground");
      write_attr (w, "kind", lamina_ground_kind_to_string (g->kind));
      write_number (w, "area", g->area);
      write_number (w, "perimeter", g->perimeter);
      write_number (w, "wall-thickness", g->wall_thickness);
      write_number (w, "soil-conductivity", g->soil_conductivity);
      if (g->soil != LAMINA_SOIL_UNKNOWN)
        write_attr (w, "soil", lamina_soil_to_string (g->soil));
      write_number (w, "underfloor-height", g->underfloor_height);
      write_number (w, "vent-area", g->vent_area);
      write_number (w, "underfloor-wall-u", g->underfloor_wall_u);
      write_number (w, "wind-speed", g->wind_speed);
      write_number (w, "shielding-factor", g->shielding_factor);
      write_number (w, "depth", g->depth);
      write_number (w, "basement-wall-resistance", g->basement_wall_resistance);
      if (g->edge != LAMINA_EDGE_NONE)
        write_attr (w, "edge-insulation", lamina_edge_to_string (g->edge));
      write_number (w, "edge-extent", g->edge_size);
      write_number (w, "edge-thickness", g->edge_thickness);
      write_number (w, "edge-resistance", g->edge_resistance);
      g_string_append (w->out, "/>\n");
    }
  if (u->kind != LAMINA_UNHEATED_NONE)
    {
      g_string_append (w->out, "    <unheated-space");
      write_attr (w, "kind", lamina_unheated_kind_to_string (u->kind));
      if (u->kind == LAMINA_UNHEATED_ROOF_SPACE)
        write_attr (w, "roof", lamina_roof_type_to_string (u->roof));
      else
        {
          write_number (w, "inner-area", u->inner_area);
          write_number (w, "outer-area", u->outer_area);
          write_number (w, "outer-u", u->outer_u);
          write_number (w, "air-change", u->air_change);
          write_number (w, "volume", u->volume);
        }
      g_string_append (w->out, "/>\n");
    }
  if (!lamina_surface_conditions_is_default (s))
    {
      g_string_append (w->out, "    <surfaces");
      write_number (w, "wind-speed", s->wind_speed);
      write_number (w, "emissivity-inside", s->emissivity_inside);
      write_number (w, "emissivity-outside", s->emissivity_outside);
      if (s->air_from_profile)
        write_attr (w, "air-layers", "profile");
      g_string_append (w->out, "/>\n");
    }
}

static void
write_layer (Writer            *w,
             const LaminaLayer *layer)
{
  const LaminaCorrections *k = &layer->corrections;
  gboolean has_parts = layer->kind == LAMINA_LAYER_BRIDGED && layer->parts != NULL;

  g_string_append (w->out, "    <layer");
  write_layer_attributes (w, layer);
  if (layer->note == NULL && !has_parts
      && !k->has_air_gaps && !k->has_fasteners && !k->has_inverted_roof)
    {
      g_string_append (w->out, "/>\n");
      return;
    }
  g_string_append (w->out, ">\n");
  write_text_element (w, "      ", "note", layer->note);
  for (guint p = 0; has_parts && p < layer->parts->len; p++)
    write_part (w, layer->parts->pdata[p]);
  write_corrections (w, k);
  g_string_append (w->out, "    </layer>\n");
}

/* Climates and moisture settings (EN ISO 13788) */

static gboolean
write_climate (Writer              *w,
               const LaminaClimate *climate)
{
  g_autofree char *where = g_strdup_printf (_("climate “%s”"), climate->id ? climate->id : "");
  g_autoptr(GError) local = NULL;

  if (!lamina_climate_validate (climate, &local))
    return fail (w, "%s", local->message);
  if (!check_text (w, where, _("name"), climate->name) || !check_text (w, where, _("source"), climate->source))
    return FALSE;
  g_string_append (w->out, "  <climate");
  write_attr (w, "id", climate->id);
  write_attr (w, "name", climate->name ? climate->name : climate->id);
  write_attr (w, "source", climate->source);
  g_string_append (w->out, ">\n");
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      g_string_append (w->out, "    <month");
      write_int (w, "number", m + 1);
      write_number (w, "temperature", climate->temperature[m]);
      write_number (w, "humidity", climate->humidity[m]);
      g_string_append (w->out, "/>\n");
    }
  g_string_append (w->out, "  </climate>\n");
  return TRUE;
}

static void
write_moisture (Writer                       *w,
                const LaminaMoistureSettings *m)
{
  if (m == NULL)
    return;
  g_string_append (w->out, "    <moisture");
  write_attr (w, "climate", m->climate);
  if (m->humidity_class != 0)
    write_int (w, "humidity-class", m->humidity_class);
  write_number (w, "inside-humidity", m->inside_humidity);
  write_number (w, "inside-temperature", m->inside_temperature);
  g_string_append (w->out, "/>\n");
}

/* Constructions */

static void
write_derived (Writer             *w,
               const LaminaResult *result)
{
  g_string_append (w->out, "    <derived");
  write_number (w, "r-upper", result->r_upper);
  write_number (w, "r-lower", result->r_lower);
  write_number (w, "r-total", result->r_total);
  write_number (w, "relative-error", result->relative_error);
  write_number (w, "u", result->u);
  write_number (w, "delta-u", result->delta_u);
  write_number (w, "u-corrected", result->u_corrected);
  write_number (w, "rsi", result->rsi);
  write_number (w, "rse", result->rse);
  g_string_append (w->out, "/>\n");
}

static gboolean
check_construction (Writer                   *w,
                    const LaminaCatalogue    *catalogue,
                    const LaminaConstruction *c,
                    LaminaResult            **result)
{
  g_autofree char *where = g_strdup_printf (_("construction “%s”"), c->id ? c->id : "");
  g_autoptr(GError) local = NULL;
  const char *texts[][2] = {
    { _("name"), c->name }, { _("code"), c->code }, { _("description"), c->description },
    { _("notes"), c->notes }, { _("modified by"), c->modified_by }, { _("checked by"), c->checked_by },
    { _("approved by"), c->approved_by },
  };

  if (c->name == NULL || c->name[0] == '\0')
    return fail (w, _("%s: a construction needs a name"), where);
  for (guint i = 0; i < G_N_ELEMENTS (texts); i++)
    if (!check_text (w, where, texts[i][0], texts[i][1]))
      return FALSE;
  for (guint i = 0; i < c->tags->len; i++)
    if (!check_text (w, where, _("tag"), c->tags->pdata[i]))
      return FALSE;
  for (guint i = 0; i < c->layers->len; i++)
    if (!check_text (w, where, _("layer note"), ((LaminaLayer *) c->layers->pdata[i])->note))
      return FALSE;
  /* What the reader would refuse is not written. */
  *result = lamina_calculate (c, &local);
  if (*result == NULL || !lamina_catalogue_check_moisture (catalogue, c, NULL, &local))
    return fail (w, "%s: %s", where, local->message);
  return TRUE;
}

static void
write_construction_start (Writer                   *w,
                          const LaminaConstruction *c)
{
  g_string_append (w->out, "  <construction");
  write_attr (w, "id", c->id);
  write_attr (w, "code", c->code);
  write_attr (w, "name", c->name);
  write_attr (w, "element", lamina_element_to_string (c->element));
  write_attr (w, "heat-flow", lamina_heat_flow_to_string (c->heat_flow));
  write_attr (w, "outer-side", lamina_outer_side_to_string (c->outer_side));
  write_attr (w, "status", lamina_status_to_string (c->status));
  if (c->revision > 0)
    write_int (w, "revision", c->revision);
  write_number (w, "target-u", c->target_u);
  write_number (w, "inside-temperature", c->inside_temperature);
  write_number (w, "outside-temperature", c->outside_temperature);
  g_string_append (w->out, ">\n");
}

static gboolean
write_construction (Writer                   *w,
                    const LaminaCatalogue    *catalogue,
                    const LaminaConstruction *c,
                    LaminaWriteFlags          flags)
{
  g_autoptr(LaminaResult) result = NULL;

  if (!check_construction (w, catalogue, c, &result))
    return FALSE;
  write_construction_start (w, c);
  write_text_element (w, "    ", "description", c->description);
  for (guint i = 0; i < c->tags->len; i++)
    write_text_element (w, "    ", "tag", c->tags->pdata[i]);
  write_text_element (w, "    ", "notes", c->notes);
  write_record (w, "modified", c->modified_by, c->modified_at);
  write_record (w, "checked", c->checked_by, c->checked_at);
  write_record (w, "approved", c->approved_by, c->approved_at);
  for (guint i = 0; i < c->layers->len; i++)
    write_layer (w, c->layers->pdata[i]);
  write_moisture (w, c->moisture);
  write_method (w, c);
  if (flags & LAMINA_WRITE_DERIVED)
    write_derived (w, result);
  g_string_append (w->out, "  </construction>\n");
  return TRUE;
}

static gboolean
write_catalogue (Writer                *w,
                 const LaminaCatalogue *catalogue,
                 LaminaWriteFlags       flags)
{
  g_string_append (w->out, "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
                           "<catalogue xmlns=\"" LAMINA_CATALOGUE_NAMESPACE "\" format=\"1\">\n");
  if (!check_text (w, _("catalogue"), _("title"), catalogue->title))
    return FALSE;
  write_text_element (w, "  ", "title", catalogue->title);
  if (!write_materials (w))
    return FALSE;
  for (guint i = 0; i < catalogue->climates->len; i++)
    if (!write_climate (w, catalogue->climates->pdata[i]))
      return FALSE;
  if (!lamina_catalogue_write_target_sets (catalogue, w->out, w->error))
    return FALSE;
  for (guint i = 0; i < catalogue->constructions->len; i++)
    if (!write_construction (w, catalogue, catalogue->constructions->pdata[i], flags))
      return FALSE;
  if (!lamina_catalogue_write_jobs (catalogue, w->out, w->error))
    return FALSE;
  g_string_append (w->out, "</catalogue>\n");
  return TRUE;
}

char *
lamina_catalogue_write_to_string (const LaminaCatalogue *catalogue,
                                  LaminaWriteFlags       flags,
                                  gsize                 *length,
                                  GError               **error)
{
  g_autoptr(GString) out = g_string_new (NULL);
  g_autoptr(GError) local = NULL;
  Writer w = { out, error, NULL };
  gboolean ok;

  g_return_val_if_fail (catalogue != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  w.ids = lamina_material_ids_new (catalogue, error);
  if (w.ids == NULL)
    return NULL;
  ok = write_catalogue (&w, catalogue, flags);
  lamina_material_ids_free (w.ids);
  if (!ok)
    return NULL;

  /* A last guard: ids, names and dates must fit the schema too. */
  if (!lamina_xml_document_check (out->str, out->len, _("the written catalogue"), &local))
    {
      g_set_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_INVALID,
                   _("The catalogue cannot be written as a valid document: %s"), local->message);
      return NULL;
    }
  if (length != NULL)
    *length = out->len;
  return g_string_free (g_steal_pointer (&out), FALSE);
}

/* The same writing for the parts of the vocabulary in their own files. */

void
lamina_xml_write_attr (GString    *out,
                       const char *name,
                       const char *value)
{
  Writer w = { out, NULL, NULL };

  write_attr (&w, name, value);
}

void
lamina_xml_write_number (GString    *out,
                         const char *name,
                         double      value)
{
  Writer w = { out, NULL, NULL };

  write_number (&w, name, value);
}

void
lamina_xml_write_text_element (GString    *out,
                               const char *indent,
                               const char *name,
                               const char *text)
{
  Writer w = { out, NULL, NULL };

  write_text_element (&w, indent, name, text);
}

gboolean
lamina_xml_check_text (const char  *where,
                       const char  *field,
                       const char  *text,
                       GError     **error)
{
  Writer w = { NULL, error, NULL };

  return check_text (&w, where, field, text);
}
