/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli calc FILE.xml [--id ID] [--json] */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-catalogue.h"
#include "lamina-cli.h"
#include "lamina-cli-report.h"

#include <glib/gi18n.h>
#include <math.h>

int
lamina_cli_calc (const LaminaCliGlobals *globals,
                 int                     argc,
                 char                  **argv)
{
  g_autofree char *id = NULL;
  gboolean json = FALSE;
  const GOptionEntry entries[] = {
    { "id", 0, 0, G_OPTION_ARG_STRING, &id, N_("Only the construction with this id"), "ID" },
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print JSON with unrounded figures in SI units"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("FILE.xml — calculate R and U (EN ISO 6946)"));
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(JsonArray) array = json_array_new ();
  guint n_done = 0;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("calc takes one catalogue file (see “lamina-cli calc --help”)"));
      return LAMINA_EXIT_USAGE;
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
      g_autoptr(LaminaResult) result = NULL;
      g_autoptr(LaminaMoistureResult) moisture = NULL;
      JsonNode *moisture_node = NULL;

      if (id != NULL && g_strcmp0 (id, c->id) != 0)
        continue;
      result = lamina_calculate (c, &error);
      if (result == NULL)
        {
          fprintf (stderr, "%s:%d: %s\n", argv[1], c->line, error->message);
          return LAMINA_EXIT_BAD_INPUT;
        }
      if (c->moisture != NULL)
        {
          const LaminaClimate *climate = lamina_catalogue_find_climate (catalogue, c->moisture->climate);

          moisture = lamina_moisture_calculate (c, climate, NAN, &error);
          if (moisture == NULL)
            {
              fprintf (stderr, "%s:%d: %s\n", argv[1], c->moisture->line, error->message);
              return LAMINA_EXIT_BAD_INPUT;
            }
          if (json)
            moisture_node = lamina_cli_moisture_to_json (c, climate, moisture);
        }
      if (json)
        {
          JsonNode *node = lamina_cli_result_to_json (c, result);

          if (moisture_node != NULL)
            json_object_set_member (json_node_get_object (node), "moisture", moisture_node);
          json_array_add_element (array, node);
        }
      else
        {
          lamina_cli_print_result (stdout, c, result);
          if (moisture != NULL)
            lamina_cli_print_moisture (stdout, c, lamina_catalogue_find_climate (catalogue, c->moisture->climate),
                                       moisture);
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
  (void) globals;
  return LAMINA_EXIT_OK;
}
