/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli moisture FILE.xml [--id ID] [--json]: surface and interstitial
 * condensation (EN ISO 13788) of the constructions of a catalogue file that
 * carry a <moisture> check. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-catalogue.h"
#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-cli-report.h"

#include <glib/gi18n.h>
#include <math.h>

static JsonNode *
construction_to_json (const LaminaConstruction *c,
                      JsonNode                 *moisture)
{
  JsonObject *o = json_object_new ();
  JsonNode *node = json_node_new (JSON_NODE_OBJECT);

  json_object_set_string_member (o, "id", c->id);
  json_object_set_member (o, "moisture", moisture);
  json_node_take_object (node, o);
  return node;
}

int
lamina_cli_moisture (const LaminaCliGlobals *globals,
                     int                     argc,
                     char                  **argv)
{
  g_autofree char *id = NULL;
  gboolean json = FALSE;
  double limit = NAN;
  const GOptionEntry entries[] = {
    { "id", 0, 0, G_OPTION_ARG_STRING, &id, N_("Only the construction with this id"), "ID" },
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print JSON with unrounded figures in SI units"), NULL },
    { "limit", 0, 0, G_OPTION_ARG_DOUBLE, &limit,
      N_("The limit on the largest accumulation, kg/m² (default: the library's with --library, else 0.5)"), "KG" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("FILE.xml — condensation risk (EN ISO 13788)"));
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(JsonArray) array = json_array_new ();
  guint n_done = 0;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("moisture takes one catalogue file (see “lamina-cli moisture --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (!isnan (limit) && !LAMINA_MOISTURE_LIMIT_IS_VALID (limit))
    {
      lamina_cli_error (_("--limit %g is outside the allowed range above 0 to %g kg/m²"), limit,
                        LAMINA_MOISTURE_LIMIT_MAX);
      return LAMINA_EXIT_USAGE;
    }
  /* The office's limit when a library is named; a file is checked on its
   * own otherwise, whatever library the user happens to have. */
  if (isnan (limit) && globals->library_path != NULL)
    {
      g_autoptr(LaminaLibrary) library = lamina_cli_open_library (globals, FALSE);

      if (library == NULL)
        return LAMINA_EXIT_BAD_INPUT;
      limit = lamina_library_get_moisture_limit (library);
    }

  catalogue = lamina_catalogue_read_file (argv[1], &error);
  if (catalogue == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }

  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[i];
      const LaminaClimate *climate;
      g_autoptr(LaminaMoistureResult) result = NULL;

      if (id != NULL && g_strcmp0 (id, c->id) != 0)
        continue;
      if (c->moisture == NULL)
        {
          if (id != NULL)
            {
              fprintf (stderr, _("%s:%d: construction “%s” has no <moisture> check\n"), argv[1], c->line, c->id);
              return LAMINA_EXIT_BAD_INPUT;
            }
          continue;
        }
      climate = lamina_catalogue_find_climate (catalogue, c->moisture->climate);
      result = lamina_moisture_calculate (c, climate, limit, &error);
      if (result == NULL)
        {
          fprintf (stderr, "%s:%d: %s\n", argv[1], c->moisture->line, error->message);
          return LAMINA_EXIT_BAD_INPUT;
        }
      if (json)
        json_array_add_element (array, construction_to_json (c, lamina_cli_moisture_to_json (c, climate, result)));
      else
        {
          printf ("%s  %s\n", c->id, c->name ? c->name : "");
          lamina_cli_print_moisture (stdout, c, climate, result);
          printf ("\n");
        }
      n_done++;
    }
  if (id != NULL && n_done == 0)
    {
      fprintf (stderr, _("%s: no construction with id “%s”\n"), argv[1], id);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (json)
    {
      g_autofree char *text = lamina_cli_json_document (g_steal_pointer (&array));
      printf ("%s\n", text);
    }
  else if (n_done == 0)
    printf ("%s\n", _("No construction in this file has a moisture check."));
  (void) globals;
  return LAMINA_EXIT_OK;
}
