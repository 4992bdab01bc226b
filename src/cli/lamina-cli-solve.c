/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli solve FILE.xml [--id ID] --layer N --target U [--json]
 * lamina-cli solve ID --layer N --target U [--json]      (the library)
 *
 * The thickness of layer N (1 = innermost) at which the corrected U equals
 * the target, and that thickness rounded up to a stock thickness of the
 * layer's material or to the next 10 mm. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-catalogue.h"
#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-cli-report.h"
#include "lamina-number.h"
#include "lamina-solve.h"

#include <glib/gi18n.h>

typedef struct
{
  guint      layer;
  double     target;
  gboolean   json;
  JsonArray *array;       /* borrowed */
} Request;

static JsonNode *
solve_to_json (const LaminaConstruction *c,
               const LaminaSolve        *s)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  json_builder_begin_object (b);
  lamina_cli_json_add_string (b, "id", c->id);
  json_builder_set_member_name (b, "solve");
  json_builder_begin_object (b);
  json_builder_set_member_name (b, "layer");
  json_builder_add_int_value (b, s->layer);
  lamina_cli_json_add_number (b, "target", s->target);
  lamina_cli_json_add_number (b, "thickness", s->thickness);
  lamina_cli_json_add_number (b, "u", s->u);
  lamina_cli_json_add_number (b, "thickness_snapped", s->thickness_snapped);
  lamina_cli_json_add_number (b, "u_snapped", s->u_snapped);
  json_builder_set_member_name (b, "snapped_to_stock");
  json_builder_add_boolean_value (b, s->stock);
  lamina_cli_json_add_number (b, "thickness_before", s->thickness_before);
  lamina_cli_json_add_number (b, "u_before", s->u_before);
  json_builder_end_object (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

static void
print_solve (const LaminaConstruction *c,
             const LaminaSolve        *s)
{
  const LaminaLayer *layer = c->layers->pdata[s->layer - 1];
  char reported[LAMINA_U_TEXT_SIZE];
  g_autofree char *caution = lamina_cli_caution (LAMINA_CLI_CAUTION_LAYERS);

  printf ("%s%s%s — %s\n", c->code ? c->code : "", c->code ? " " : "", c->id, c->name);
  printf (_("  layer %u (%s), now %.1f mm, U %.4f W/(m²K)\n"), s->layer, lamina_layer_get_label (layer),
          s->thickness_before, s->u_before);
  printf (_("  target U %.4f W/(m²K): exact %.2f mm (U %.4f)\n"), s->target, s->thickness, s->u);
  printf (s->stock ? _("  build %g mm (stock thickness): U %.4f W/(m²K), reported U = %s\n")
                   : _("  build %g mm (next 10 mm): U %.4f W/(m²K), reported U = %s\n"),
          s->thickness_snapped, s->u_snapped, lamina_format_u (reported, s->u_snapped));
  printf ("  %s\n\n", caution);
}

/* Solves one construction; FALSE after printing a message starting with
 * @where. */
static gboolean
solve_one (const Request            *req,
           const LaminaConstruction *c,
           const char               *where)
{
  g_autoptr(GError) error = NULL;
  LaminaSolve s;

  if (!lamina_solve_thickness (c, req->layer, req->target, &s, &error))
    {
      fprintf (stderr, _("%s: construction “%s”: %s\n"), where, c->id, error->message);
      return FALSE;
    }
  if (req->json)
    json_array_add_element (req->array, solve_to_json (c, &s));
  else
    print_solve (c, &s);
  return TRUE;
}

static int
solve_file (const Request *req,
            const char    *path,
            const char    *id)
{
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(GError) error = NULL;
  guint n_done = 0;

  catalogue = lamina_catalogue_read_file (path, &error);
  if (catalogue == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[i];
      g_autofree char *where = g_strdup_printf ("%s:%d", path, c->line);

      if (id != NULL && g_strcmp0 (id, c->id) != 0)
        continue;
      if (!solve_one (req, c, where))
        return LAMINA_EXIT_BAD_INPUT;
      n_done++;
    }
  if (n_done == 0)
    {
      fprintf (stderr, id != NULL ? _("%s: no construction with id “%s”\n") : _("%s: no constructions\n"),
               path, id);
      return LAMINA_EXIT_BAD_INPUT;
    }
  return LAMINA_EXIT_OK;
}

static int
solve_library (const LaminaCliGlobals *globals,
               const Request          *req,
               const char             *key)
{
  g_autoptr(LaminaLibrary) library = lamina_cli_open_library (globals, FALSE);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  if (library == NULL || (id = lamina_cli_resolve_id (library, key)) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  c = lamina_library_dup_construction (library, id, 0, &error);
  if (c == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  return solve_one (req, c, lamina_library_get_path (library)) ? LAMINA_EXIT_OK : LAMINA_EXIT_BAD_INPUT;
}

/* A catalogue file is named by its extension or by existing as a file;
 * anything else is an id or code in the library. */
static gboolean
names_file (const char *arg)
{
  return g_str_has_suffix (arg, ".xml") || g_str_has_suffix (arg, ".XML")
         || g_file_test (arg, G_FILE_TEST_IS_REGULAR);
}

int
lamina_cli_solve (const LaminaCliGlobals *globals,
                  int                     argc,
                  char                  **argv)
{
  g_autofree char *id = NULL, *target = NULL;
  int layer = 0;
  gboolean json = FALSE;
  const GOptionEntry entries[] = {
    { "id", 0, 0, G_OPTION_ARG_STRING, &id, N_("In a file: only the construction with this id"), "ID" },
    { "layer", 0, 0, G_OPTION_ARG_INT, &layer, N_("The layer to size, 1 = innermost"), "N" },
    { "target", 0, 0, G_OPTION_ARG_STRING, &target, N_("Target corrected U in W/(m²·K)"), "U" },
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print JSON (thickness in mm)"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context =
    g_option_context_new (_("FILE.xml|ID — the thickness of a layer that meets a target U"));
  g_autoptr(JsonArray) array = json_array_new ();
  g_autoptr(GError) error = NULL;
  Request req = { 0 };
  int status;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("solve takes one catalogue file or construction id (see “lamina-cli solve --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (layer < 1)
    {
      lamina_cli_error (_("--layer: give the layer to size as a number from 1 (the innermost)"));
      return LAMINA_EXIT_USAGE;
    }
  if (target == NULL)
    {
      lamina_cli_error (_("--target: give the target U in W/(m²·K)"));
      return LAMINA_EXIT_USAGE;
    }
  if (!lamina_number_parse (LAMINA_FIELD_TARGET_U, target, &req.target, &error))
    {
      lamina_cli_error ("--target: %s", error->message);
      return LAMINA_EXIT_USAGE;
    }
  req.layer = (guint) layer;
  req.json = json;
  req.array = array;

  if (names_file (argv[1]))
    status = solve_file (&req, argv[1], id);
  else if (id != NULL)
    {
      lamina_cli_error (_("--id goes with a catalogue file; name a library construction directly"));
      return LAMINA_EXIT_USAGE;
    }
  else
    status = solve_library (globals, &req, argv[1]);
  if (status == LAMINA_EXIT_OK && json)
    {
      g_autofree char *text = lamina_cli_json_document (g_steal_pointer (&array));
      printf ("%s\n", text);
    }
  return status;
}
