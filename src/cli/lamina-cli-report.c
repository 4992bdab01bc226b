/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli-report.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-dynamic.h"

const char *
lamina_cli_method (gboolean ground)
{
  return ground ? "EN ISO 13370:2017" : "EN ISO 6946:2017";
}

char *
lamina_cli_caution (LaminaCliCaution method)
{
  const char *by;

  switch (method)
    {
    case LAMINA_CLI_CAUTION_GROUND:
      by = _("by EN ISO 13370:2017 with the ground (the floor itself by EN ISO 6946:2017), for the stated "
             "plan and soil");
      break;
    case LAMINA_CLI_CAUTION_MIXED:
      by = _("by EN ISO 6946:2017, ground floors with the ground by EN ISO 13370:2017 for the stated plan "
             "and soil");
      break;
    case LAMINA_CLI_CAUTION_FIELD:
      by = _("by EN ISO 10211:2017 (a 2-D numerical calculation)");
      break;
    case LAMINA_CLI_CAUTION_LAYERS:
    default:
      by = _("by EN ISO 6946:2017");
      break;
    }
  return g_strdup_printf (_("Caution: figures are for the stated design conditions %s. Check product "
                            "declarations, local building codes and condensation risk (EN ISO 13788) "
                            "with a licensed professional before use."), by);
}

void
lamina_cli_json_add_number (JsonBuilder *b,
                            const char  *key,
                            double       value)
{
  json_builder_set_member_name (b, key);
  if (isfinite (value))
    json_builder_add_double_value (b, value);
  else
    json_builder_add_null_value (b);
}

void
lamina_cli_json_add_string (JsonBuilder *b,
                            const char  *key,
                            const char  *value)
{
  json_builder_set_member_name (b, key);
  if (value == NULL)
    json_builder_add_null_value (b);
  else
    json_builder_add_string_value (b, value);
}

static void
add_layers (JsonBuilder              *b,
            const LaminaConstruction *c,
            const LaminaResult       *r)
{
  json_builder_set_member_name (b, "layers");
  json_builder_begin_array (b);
  for (guint i = 0; i < r->n_layers; i++)
    {
      const LaminaLayerResult *lr = &r->layers[i];

      json_builder_begin_object (b);
      lamina_cli_json_add_number (b, "thickness", lr->thickness / 1000.0);
      lamina_cli_json_add_number (b, "resistance", lr->resistance);
      json_builder_set_member_name (b, "label");
      json_builder_add_string_value (b, lamina_layer_get_label (c->layers->pdata[i]));
      json_builder_set_member_name (b, "bridged");
      json_builder_add_boolean_value (b, lr->bridged);
      json_builder_set_member_name (b, "disregarded");
      json_builder_add_boolean_value (b, lr->disregarded);
      lamina_cli_json_add_number (b, "temperature_inner", lr->temperature_inner);
      lamina_cli_json_add_number (b, "temperature_outer", lr->temperature_outer);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
}

/* "dynamic": EN ISO 13786 figures in the contract's units (κ in kJ). */
static void
add_dynamic (JsonBuilder         *b,
             const LaminaDynamic *d)
{
  json_builder_set_member_name (b, "dynamic");
  json_builder_begin_object (b);
  lamina_cli_json_add_number (b, "decrement_factor", d->decrement_factor);
  lamina_cli_json_add_number (b, "time_shift", d->time_shift);
  lamina_cli_json_add_number (b, "periodic_transmittance", d->periodic_transmittance);
  lamina_cli_json_add_number (b, "areal_heat_capacity_inner", d->areal_heat_capacity_inner / 1000.0);
  lamina_cli_json_add_number (b, "areal_heat_capacity_outer", d->areal_heat_capacity_outer / 1000.0);
  lamina_cli_json_add_number (b, "admittance_inner", d->admittance_inner);
  lamina_cli_json_add_number (b, "admittance_outer", d->admittance_outer);
  lamina_cli_json_add_number (b, "period", d->period);
  json_builder_set_member_name (b, "bridged_equivalent");
  json_builder_add_boolean_value (b, d->bridged_equivalent);
  json_builder_end_object (b);
}

/* EN ISO 13370 and EN ISO 6946 Annex E, 6.10, Annex D (issue 14). */
static void
add_method (JsonBuilder              *b,
            const LaminaConstruction *c,
            const LaminaResult       *r)
{
  if (r->has_ground)
    {
      const LaminaGroundResult *g = &r->ground;
      double table[LAMINA_GROUND_TABLE_ROWS];

      json_builder_set_member_name (b, "ground");
      json_builder_begin_object (b);
      lamina_cli_json_add_number (b, "b_prime", g->b_prime);
      lamina_cli_json_add_number (b, "dt", g->dt);
      lamina_cli_json_add_number (b, "u", g->u);
      lamina_cli_json_add_string (b, "kind", lamina_ground_kind_to_string (c->ground.kind));
      lamina_cli_json_add_number (b, "soil_conductivity", g->soil_conductivity);
      json_builder_set_member_name (b, "soil_assumed");
      json_builder_add_boolean_value (b, g->soil_assumed);
      if (c->ground.edge != LAMINA_EDGE_NONE)
        {
          lamina_cli_json_add_number (b, "u_without_edge", g->u_without_edge);
          lamina_cli_json_add_number (b, "delta_psi", g->delta_psi);
        }
      if (c->ground.kind == LAMINA_GROUND_SUSPENDED)
        {
          lamina_cli_json_add_number (b, "u_floor", g->u_floor);
          lamina_cli_json_add_number (b, "u_ground", g->u_ground);
          lamina_cli_json_add_number (b, "u_exchange", g->u_exchange);
        }
      if (!isnan (g->u_walls))
        {
          lamina_cli_json_add_number (b, "dw", g->dw);
          lamina_cli_json_add_number (b, "u_walls", g->u_walls);
          lamina_cli_json_add_number (b, "u_basement", g->u_basement);
        }
      lamina_result_ground_table (c, r, table);
      json_builder_set_member_name (b, "by_b_prime");
      json_builder_begin_array (b);
      for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
        {
          json_builder_begin_object (b);
          lamina_cli_json_add_number (b, "b_prime", lamina_ground_table_b_prime[i]);
          lamina_cli_json_add_number (b, "u", table[i]);
          json_builder_end_object (b);
        }
      json_builder_end_array (b);
      json_builder_end_object (b);
    }
  if (r->tapered)
    {
      json_builder_set_member_name (b, "tapered");
      json_builder_begin_object (b);
      lamina_cli_json_add_number (b, "r0", r->tapered_r0);
      lamina_cli_json_add_number (b, "r1", r->tapered_r1);
      json_builder_set_member_name (b, "layer");
      json_builder_add_int_value (b, r->tapered_layer);
      lamina_cli_json_add_string (b, "taper",
                                  lamina_taper_to_string (((LaminaLayer *) c->layers->pdata[r->tapered_layer - 1])->taper));
      lamina_cli_json_add_number (b, "u_thin_end", r->u_thin_end);
      lamina_cli_json_add_number (b, "u_thick_end", r->u_thick_end);
      json_builder_end_object (b);
    }
  if (r->r_unheated > 0)
    lamina_cli_json_add_number (b, "r_unheated", r->r_unheated);
  if (r->air_iterations > 0)
    {
      json_builder_set_member_name (b, "air_iterations");
      json_builder_add_int_value (b, r->air_iterations);
    }
}

JsonNode *
lamina_cli_result_to_json (const LaminaConstruction *c,
                           const LaminaResult       *r)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();
  g_autoptr(GError) dynamic_error = NULL;
  LaminaDynamic dynamic;
  gboolean has_dynamic = lamina_dynamic_calculate (c, r, LAMINA_DYNAMIC_PERIOD_HOURS, &dynamic, &dynamic_error);

  json_builder_begin_object (b);
  json_builder_set_member_name (b, "id");
  json_builder_add_string_value (b, c->id);
  if (c->code != NULL)
    {
      json_builder_set_member_name (b, "code");
      json_builder_add_string_value (b, c->code);
    }
  json_builder_set_member_name (b, "name");
  json_builder_add_string_value (b, c->name);
  json_builder_set_member_name (b, "element");
  json_builder_add_string_value (b, lamina_element_to_string (c->element));
  json_builder_set_member_name (b, "heat_flow");
  json_builder_add_string_value (b, lamina_heat_flow_to_string (r->heat_flow));
  /* The method of the U that is reported (ground floors: ground.u). */
  lamina_cli_json_add_string (b, "method", lamina_cli_method (r->has_ground));
  lamina_cli_json_add_number (b, "rsi", r->rsi);
  lamina_cli_json_add_number (b, "rse", r->rse);
  lamina_cli_json_add_number (b, "r_upper", r->r_upper);
  lamina_cli_json_add_number (b, "r_lower", r->r_lower);
  lamina_cli_json_add_number (b, "r_total", r->r_total);
  lamina_cli_json_add_number (b, "relative_error", r->relative_error);
  lamina_cli_json_add_number (b, "u", r->u);
  lamina_cli_json_add_number (b, "delta_u", r->delta_u);
  lamina_cli_json_add_number (b, "u_corrected", r->u_corrected);
  lamina_cli_json_add_number (b, "thickness", r->thickness / 1000.0);
  json_builder_set_member_name (b, "sections");
  json_builder_add_int_value (b, r->n_sections);
  if (r->has_target)
    {
      lamina_cli_json_add_number (b, "target_u", c->target_u);
      json_builder_set_member_name (b, "target_met");
      json_builder_add_boolean_value (b, r->target_met);
    }
  add_layers (b, c, r);
  if (has_dynamic)
    add_dynamic (b, &dynamic);
  add_method (b, c, r);
  json_builder_set_member_name (b, "warnings");
  json_builder_begin_array (b);
  for (guint i = 0; i < r->warnings->len; i++)
    json_builder_add_string_value (b, ((LaminaWarning *) r->warnings->pdata[i])->message);
  if (!has_dynamic)
    json_builder_add_string_value (b, dynamic_error->message);
  json_builder_end_array (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

char *
lamina_cli_json_document (JsonArray *constructions)
{
  g_autoptr(JsonNode) root = json_node_new (JSON_NODE_OBJECT);
  g_autoptr(JsonObject) object = json_object_new ();
  g_autoptr(JsonGenerator) generator = json_generator_new ();

  json_object_set_array_member (object, "constructions", constructions);
  json_node_set_object (root, object);
  json_generator_set_root (generator, root);
  json_generator_set_pretty (generator, TRUE);
  return json_generator_to_data (generator, NULL);
}

/* @text cut or padded to @width characters (not bytes: λ, ², “ are
 * multibyte in UTF-8 and printf pads by bytes). */
static char *
fit (const char *text,
     glong       width,
     gboolean    right)
{
  glong len = g_utf8_strlen (text, -1);
  GString *s = g_string_new (NULL);

  if (len > width)
    {
      const char *end = g_utf8_offset_to_pointer (text, width - 1);
      g_string_append_len (s, text, end - text);
      g_string_append (s, "…");
      return g_string_free (s, FALSE);
    }
  if (right)
    for (glong i = len; i < width; i++)
      g_string_append_c (s, ' ');
  g_string_append (s, text);
  if (!right)
    for (glong i = len; i < width; i++)
      g_string_append_c (s, ' ');
  return g_string_free (s, FALSE);
}

static void
print_row (FILE       *out,
           const char *no,
           const char *label,
           const char *thickness,
           const char *lambda,
           const char *resistance,
           const char *note)
{
  g_autofree char *a = fit (no, 4, FALSE);
  g_autofree char *b = fit (label, 46, FALSE);
  g_autofree char *c = fit (thickness, 9, TRUE);
  g_autofree char *d = fit (lambda, 9, TRUE);
  g_autofree char *e = fit (resistance, 9, TRUE);

  fprintf (out, "  %s %s %s %s %s%s\n", a, b, c, d, e, note);
}

static void
print_parts (FILE              *out,
             const LaminaLayer *layer)
{
  for (guint p = 0; p < layer->parts->len; p++)
    {
      const LaminaPart *part = layer->parts->pdata[p];
      g_autofree char *label = g_strdup_printf ("  %s %.1f %%%s%s", part->material ? part->material->name : _("air"),
                                                100.0 * lamina_layer_get_part_fraction (layer, p),
                                                part->member ? " · " : "", part->member ? part->member : "");
      g_autofree char *lambda = part->material ? g_strdup_printf ("%.3f", part->material->conductivity) : g_strdup ("");

      print_row (out, "", label, "", lambda, "", "");
    }
}

static void
print_method (FILE                     *out,
              const LaminaConstruction *c,
              const LaminaResult       *r)
{
  if (r->tapered)
    fprintf (out, _("  tapered layer %u: R0 %.3f  R1 %.3f m²K/W   U %.4f (thin end) to %.4f (thick end), "
                    "area mean %.4f W/(m²K)\n"),
             r->tapered_layer, r->tapered_r0, r->tapered_r1, r->u_thin_end, r->u_thick_end, r->u);
  if (r->r_unheated > 0)
    fprintf (out, _("  unheated space outside: Ru %.3f m²K/W (included in RT)\n"), r->r_unheated);
  if (r->has_ground)
    {
      double table[LAMINA_GROUND_TABLE_ROWS];
      char reported[LAMINA_U_TEXT_SIZE];

      fprintf (out, _("  with the ground (EN ISO 13370, %s): B′ %.2f m   dt %.2f m   λ %.1f W/(mK)   "
                      "U %.4f W/(m²K)   reported U = %s W/(m²K)\n"),
               lamina_ground_kind_to_string (c->ground.kind), r->ground.b_prime, r->ground.dt,
               r->ground.soil_conductivity, r->ground.u, lamina_format_u (reported, r->ground.u));
      lamina_result_ground_table (c, r, table);
      fprintf (out, _("  U by B′:"));
      for (guint i = 0; i < LAMINA_GROUND_TABLE_ROWS; i++)
        fprintf (out, "  %g m %.3f", lamina_ground_table_b_prime[i], table[i]);
      fprintf (out, "\n");
    }
}

/* One line per warning under a result. */
static void
print_warning (FILE       *out,
               const char *message)
{
  /* Built first: GCC 12's -Wformat-overflow takes the translated format
   * of an fprintf here for a null one in the optimised sanitizer build. */
  g_autofree char *line = g_strdup_printf (_("  warning: %s\n"), message);

  fputs (line, out);
}

void
lamina_cli_print_result (FILE                     *out,
                         const LaminaConstruction *c,
                         const LaminaResult       *r)
{
  char reported[LAMINA_U_TEXT_SIZE];
  g_autoptr(GError) dynamic_error = NULL;
  g_autofree char *caution = lamina_cli_caution (r->has_ground ? LAMINA_CLI_CAUTION_GROUND
                                                               : LAMINA_CLI_CAUTION_LAYERS);
  LaminaDynamic dynamic;

  fprintf (out, "%s%s%s — %s\n", c->code ? c->code : "", c->code ? " " : "", c->id, c->name);
  fprintf (out, _("  %s, heat flow %s, outer side %s\n"), lamina_element_to_string (c->element),
           lamina_heat_flow_to_string (r->heat_flow), lamina_outer_side_to_string (c->outer_side));
  print_row (out, _("no."), _("layer"), _("d mm"), _("λ W/(m·K)"), _("R m²·K/W"), "");
  for (guint i = 0; i < r->n_layers; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      g_autofree char *no = g_strdup_printf ("%u", i + 1);
      g_autofree char *d = g_strdup_printf ("%.1f", r->layers[i].thickness);
      g_autofree char *lambda = layer->kind == LAMINA_LAYER_MATERIAL
                                ? g_strdup_printf ("%.3f", layer->material->conductivity) : g_strdup ("—");
      g_autofree char *res = g_strdup_printf ("%.3f", r->layers[i].resistance);

      print_row (out, no, lamina_layer_get_label (layer), d, lambda, res,
                 r->layers[i].disregarded ? _("  (disregarded)") : "");
      if (layer->kind == LAMINA_LAYER_BRIDGED)
        print_parts (out, layer);
    }
  fprintf (out, _("  Rsi %.2f   Rse %.2f   total thickness %.1f mm\n"), r->rsi, r->rse, r->thickness);
  fprintf (out, _("  R'T %.3f   R''T %.3f   RT %.3f m²K/W   relative error %.1f %%\n"),
           r->r_upper, r->r_lower, r->r_total, 100.0 * r->relative_error);
  fprintf (out, _("  U %.4f   ΔU %.4f   Uc %.4f W/(m²K)   reported U = %s W/(m²K)\n"),
           r->u, r->delta_u, r->u_corrected, lamina_format_u (reported, r->u_corrected));
  print_method (out, c, r);
  if (r->has_target)
    fprintf (out, _("  target U %g: %s\n"), c->target_u, r->target_met ? _("met") : _("NOT MET"));
  if (lamina_dynamic_calculate (c, r, LAMINA_DYNAMIC_PERIOD_HOURS, &dynamic, &dynamic_error))
    {
      fprintf (out, _("  EN ISO 13786 (24 h): |Y12| %.4f W/(m²K)   f %.3f   time shift %.1f h   |Y11| %.2f W/(m²K)\n"),
               dynamic.periodic_transmittance, dynamic.decrement_factor, dynamic.time_shift,
               dynamic.admittance_inner);
      fprintf (out, _("  κ1 %.1f   κ2 %.1f kJ/(m²K)%s\n"), dynamic.areal_heat_capacity_inner / 1000.0,
               dynamic.areal_heat_capacity_outer / 1000.0,
               dynamic.bridged_equivalent ? _("   (bridged layers by their lower-limit equivalent)") : "");
    }
  for (guint i = 0; i < r->warnings->len; i++)
    print_warning (out, ((LaminaWarning *) r->warnings->pdata[i])->message);
  if (dynamic_error != NULL)
    print_warning (out, dynamic_error->message);
  fprintf (out, "  %s\n\n", caution);
}
