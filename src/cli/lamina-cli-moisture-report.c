/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The moisture block (EN ISO 13788) of the CLI's reports, shared by
 * `moisture`, `calc` and `show` so that all print it the same way under the
 * same keys. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli-report.h"

#include <glib/gi18n.h>
#include <math.h>

static void
add_month (JsonBuilder *b,
           const char  *key,
           int          month)
{
  json_builder_set_member_name (b, key);
  if (month >= 1 && month <= LAMINA_MONTHS)
    json_builder_add_int_value (b, month);
  else
    json_builder_add_null_value (b);
}

static void
add_boolean (JsonBuilder *b,
             const char  *key,
             gboolean     value)
{
  json_builder_set_member_name (b, key);
  json_builder_add_boolean_value (b, value);
}

JsonNode *
lamina_cli_moisture_to_json (const LaminaConstruction   *c,
                             const LaminaClimate        *climate,
                             const LaminaMoistureResult *r)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  json_builder_begin_object (b);
  lamina_cli_json_add_string (b, "climate", climate->id);
  lamina_cli_json_add_string (b, "climate_name", climate->name);
  lamina_cli_json_add_string (b, "climate_source", climate->source);
  json_builder_set_member_name (b, "humidity_class");
  if (c->moisture->humidity_class != 0)
    json_builder_add_int_value (b, c->moisture->humidity_class);
  else
    json_builder_add_null_value (b);
  lamina_cli_json_add_number (b, "inside_humidity", c->moisture->inside_humidity);
  lamina_cli_json_add_number (b, "inside_temperature", r->inside_temperature[0]);
  add_boolean (b, "fails", lamina_moisture_result_fails (r));

  json_builder_set_member_name (b, "surface");
  json_builder_begin_object (b);
  lamina_cli_json_add_number (b, "f_rsi", r->f_rsi);
  lamina_cli_json_add_number (b, "f_rsi_min", r->f_rsi_min);
  add_month (b, "critical_month", r->critical_month);
  add_boolean (b, "passes", r->surface_passes);
  json_builder_end_object (b);

  json_builder_set_member_name (b, "interstitial");
  json_builder_begin_object (b);
  add_boolean (b, "condensation", r->condensation);
  lamina_cli_json_add_number (b, "max_accumulation", r->max_accumulation);
  add_month (b, "max_month", r->max_month);
  add_boolean (b, "dries_out", r->dries_out);
  lamina_cli_json_add_number (b, "limit", r->limit);
  add_month (b, "start_month", r->start_month);
  json_builder_set_member_name (b, "months");
  json_builder_begin_array (b);
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      json_builder_begin_object (b);
      json_builder_set_member_name (b, "month");
      json_builder_add_int_value (b, m + 1);
      lamina_cli_json_add_number (b, "accumulation", r->accumulation[m]);
      json_builder_end_object (b);
    }
  json_builder_end_array (b);
  json_builder_end_object (b);

  json_builder_set_member_name (b, "warnings");
  json_builder_begin_array (b);
  for (guint i = 0; i < r->warnings->len; i++)
    json_builder_add_string_value (b, ((LaminaMoistureWarning *) r->warnings->pdata[i])->message);
  json_builder_end_array (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

void
lamina_cli_print_moisture (FILE                       *out,
                           const LaminaConstruction   *c,
                           const LaminaClimate        *climate,
                           const LaminaMoistureResult *r)
{
  g_autofree char *inside = NULL;

  if (c->moisture->humidity_class != 0)
    inside = g_strdup_printf (_("humidity class %d"), c->moisture->humidity_class);
  else
    inside = g_strdup_printf (_("inside humidity %.0f %%"), 100.0 * c->moisture->inside_humidity);
  fprintf (out, _("  Moisture (EN ISO 13788): climate %s (%s), %s, inside %.1f °C\n"),
           climate->name ? climate->name : climate->id, climate->source ? climate->source : _("no source given"),
           inside, r->inside_temperature[0]);
  if (r->critical_month > 0)
    fprintf (out, _("  Surface: fRsi %.3f, fRsi,min %.3f in %s: %s\n"), r->f_rsi, r->f_rsi_min,
             lamina_month_name (r->critical_month), r->surface_passes ? _("passes") : _("FAILS"));
  else
    fprintf (out, _("  Surface: fRsi %.3f; no month is colder outside than inside: passes\n"), r->f_rsi);
  if (!r->condensation)
    fprintf (out, "%s\n", _("  Interstitial: no condensation in any month"));
  else
    {
      fprintf (out, _("  Interstitial: condensation from %s, at most %.3f kg/m² at the end of %s; %s\n"),
               lamina_month_name (r->start_month), r->max_accumulation, lamina_month_name (r->max_month),
               r->dries_out ? _("dries out") : _("does NOT dry out"));
      fprintf (out, "   ");
      for (int m = 0; m < LAMINA_MONTHS; m++)
        fprintf (out, " %d:%.3f", m + 1, r->accumulation[m]);
      fprintf (out, " %s\n", _("kg/m²"));
    }
  fprintf (out, "  %s\n", lamina_moisture_result_fails (r) ? _("Result: FAILS") : _("Result: passes"));
  for (guint i = 0; i < r->warnings->len; i++)
    fprintf (out, "  ! %s\n", ((LaminaMoistureWarning *) r->warnings->pdata[i])->message);
}

/* The check of a construction that carries its climate data; NULL (and
 * no error) when it has none, NULL with @error when it cannot be made. */
static LaminaMoistureResult *
calculate_own (const LaminaConstruction *c,
               double                    limit,
               GError                  **error)
{
  return c->moisture == NULL ? NULL : lamina_moisture_calculate_own (c, limit, error);
}

gboolean
lamina_cli_add_moisture (JsonNode                 *node,
                         const LaminaConstruction *c,
                         double                    limit,
                         GError                  **error)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaMoistureResult) result = calculate_own (c, limit, &local);

  if (result != NULL)
    json_object_set_member (json_node_get_object (node), "moisture",
                            lamina_cli_moisture_to_json (c, c->moisture->climate_data, result));
  if (local == NULL)
    return TRUE;
  g_propagate_error (error, g_steal_pointer (&local));
  return FALSE;
}

gboolean
lamina_cli_print_moisture_own (FILE                     *out,
                               const LaminaConstruction *c,
                               double                    limit,
                               GError                  **error)
{
  g_autoptr(GError) local = NULL;
  g_autoptr(LaminaMoistureResult) result = calculate_own (c, limit, &local);

  if (result != NULL)
    {
      fprintf (out, "\n");
      lamina_cli_print_moisture (out, c, c->moisture->climate_data, result);
    }
  if (local == NULL)
    return TRUE;
  g_propagate_error (error, g_steal_pointer (&local));
  return FALSE;
}
