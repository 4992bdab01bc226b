/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli field FILE.xml --id ID [--json] [--png FILE]
 * lamina-cli field ID [--json] [--png FILE]          (the library)
 *
 * The 2-D check of EN ISO 10211 for one module of a construction. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-catalogue.h"
#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-cli-report.h"
#include "lamina-field-draw.h"

#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <unistd.h>

#define PNG_WIDTH 1400

static JsonNode *
field_to_json (const LaminaConstruction *c,
               const LaminaFieldResult  *f)
{
  g_autoptr(JsonBuilder) b = json_builder_new ();

  json_builder_begin_object (b);
  lamina_cli_json_add_string (b, "id", c->id);
  json_builder_set_member_name (b, "field");
  json_builder_begin_object (b);
  lamina_cli_json_add_number (b, "u", f->u);
  lamina_cli_json_add_number (b, "u_6946", f->u_6946);
  lamina_cli_json_add_number (b, "min_inner_surface_temperature", f->min_inner_surface_temperature);
  lamina_cli_json_add_number (b, "f_rsi", f->f_rsi);
  json_builder_set_member_name (b, "cells");
  json_builder_add_int_value (b, f->cells);
  lamina_cli_json_add_number (b, "module_width", f->module_width);
  json_builder_end_object (b);
  json_builder_end_object (b);
  return json_builder_get_root (b);
}

static void
print_field (const LaminaConstruction *c,
             const LaminaFieldResult  *f)
{
  const LaminaFieldRefinement *ref = &f->refinement;
  g_autofree char *caution = lamina_cli_caution (LAMINA_CLI_CAUTION_FIELD);

  printf ("%s  %s\n", c->code ? c->code : c->id, c->name ? c->name : "");
  printf (_("  2-D check (EN ISO 10211): one module %.0f mm wide, %.1f mm thick, %u cells\n"),
          f->module_width, f->thickness, f->cells);
  printf (_("  U (2-D)                 %.3f W/(m²·K)\n"), f->u);
  printf (_("  U (EN ISO 6946)         %.3f W/(m²·K)\n"), f->u_6946);
  printf (_("  heat flow               %.2f W/m per module (%.0f °C inside, %.0f °C outside)\n"),
          f->heat_flow, f->inside_temperature, f->outside_temperature);
  printf (_("  coldest inner surface   %.1f °C at %.0f mm, fRsi %.3f (Rsi %.2f)\n"),
          f->min_inner_surface_temperature, f->min_inner_surface_position, f->f_rsi, f->rsi);
  printf (_("  mould check             %.1f °C, fRsi %.3f (Rsi %.2f, EN ISO 13788)\n"),
          f->min_inner_surface_temperature_mould, f->f_rsi_mould, LAMINA_FIELD_RSI_MOULD);
  printf (_("  grid                    "));
  for (guint k = 0; k < ref->n_levels; k++)
    printf ("%s%u", k ? " → " : "", ref->cells[k]);
  printf (_(" cells; last halving changed U by %.3f %% (%s 0.1 %%)\n"), 100.0 * ref->change,
          ref->converged ? _("below") : _("NOT below"));
  printf (_("  solver                  conjugate gradients, modified incomplete Cholesky, "
            "relative residual %g\n"), LAMINA_FIELD_SOLVER_TOLERANCE);
  for (guint k = 0; k < f->notes->len; k++)
    printf ("  %s\n", (const char *) f->notes->pdata[k]);
  printf ("  %s\n\n", caution);
}

static gboolean
write_png (const LaminaConstruction *c,
           const LaminaFieldResult  *f,
           const char               *path)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *tmp = NULL;

  /* A temporary file beside the target, then a rename. */
  tmp = g_strdup_printf ("%s.part-%d", path, (int) getpid ());
  if (!lamina_field_write_png (c, f, PNG_WIDTH, 0, tmp, &error) || g_rename (tmp, path) != 0)
    {
      lamina_cli_error ("%s", error ? error->message : g_strerror (errno));
      g_unlink (tmp);
      return FALSE;
    }
  return TRUE;
}

/* The constructions of a catalogue file: all, or the one of id @id. */
static int
collect_from_file (const char *source,
                   const char *id,
                   GPtrArray  *constructions)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (source, &error);

  if (catalogue == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[i];
      if (id == NULL || g_strcmp0 (id, c->id) == 0)
        g_ptr_array_add (constructions, lamina_construction_copy (c));
    }
  if (id != NULL && constructions->len == 0)
    {
      fprintf (stderr, _("%s: no construction with id “%s”\n"), source, id);
      return LAMINA_EXIT_BAD_INPUT;
    }
  return LAMINA_EXIT_OK;
}

/* The library's construction @source (its latest revision); the library
 * is handed back in @store, where the check is kept. */
static int
collect_from_library (const LaminaCliGlobals *globals,
                      const char             *source,
                      const char             *id,
                      GPtrArray              *constructions,
                      LaminaLibrary         **store)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autofree char *key = NULL;
  LaminaConstruction *c;

  if (id != NULL)
    {
      lamina_cli_error (_("--id goes with a catalogue file; give the library's construction id alone"));
      return LAMINA_EXIT_USAGE;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL || (key = lamina_cli_resolve_id (library, source)) == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  c = lamina_library_dup_construction (library, key, 0, &error);
  if (c == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  g_ptr_array_add (constructions, c);
  *store = g_steal_pointer (&library);
  return LAMINA_EXIT_OK;
}

int
lamina_cli_field (const LaminaCliGlobals *globals,
                  int                     argc,
                  char                  **argv)
{
  g_autofree char *id = NULL;
  g_autofree char *png = NULL;
  gboolean json = FALSE;
  const GOptionEntry entries[] = {
    { "id", 0, 0, G_OPTION_ARG_STRING, &id, N_("The construction in the catalogue file"), "ID" },
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print JSON with unrounded figures"), NULL },
    { "png", 0, 0, G_OPTION_ARG_FILENAME, &png, N_("Draw the temperature field to this PNG"), "FILE" },
    { NULL }
  };
  g_autoptr(GOptionContext) context =
    g_option_context_new (_("FILE.xml --id ID | ID — 2-D check of one module (EN ISO 10211)"));
  g_autoptr(GPtrArray) constructions = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_construction_free);
  g_autoptr(JsonArray) array = json_array_new ();
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) store = NULL;
  const char *source;
  gboolean from_file;
  int status;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("field takes a catalogue file with --id, or a construction id of the library "
                          "(see “lamina-cli field --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  source = argv[1];
  from_file = g_str_has_suffix (source, ".xml") || g_file_test (source, G_FILE_TEST_IS_REGULAR);

  status = from_file ? collect_from_file (source, id, constructions)
                     : collect_from_library (globals, source, id, constructions, &store);
  if (status != LAMINA_EXIT_OK)
    return status;
  if (png != NULL && constructions->len != 1)
    {
      lamina_cli_error (_("--png draws one construction: name it with --id"));
      return LAMINA_EXIT_USAGE;
    }
  if (png != NULL && !globals->force && g_file_test (png, G_FILE_TEST_EXISTS))
    {
      lamina_cli_error (_("%s exists; use --force to replace it"), png);
      return LAMINA_EXIT_BAD_INPUT;
    }

  for (guint i = 0; i < constructions->len; i++)
    {
      const LaminaConstruction *c = constructions->pdata[i];
      g_autoptr(LaminaFieldResult) f = lamina_field_calculate (c, 0, NULL, NULL, &error);

      if (f == NULL)
        {
          if (from_file)
            fprintf (stderr, "%s:%d: %s\n", source, c->line, error->message);
          else
            lamina_cli_error ("%s: %s", source, error->message);
          return LAMINA_EXIT_BAD_INPUT;
        }
      /* Kept with the revision it was calculated for. */
      if (store != NULL && !lamina_library_put_field_check (store, c->id, c->revision, f, &error))
        {
          lamina_cli_error (_("%s: the 2-D check was not stored: %s"), source, error->message);
          g_clear_error (&error);
        }
      else if (store != NULL && !json)
        printf (_("2-D check stored with revision %d of %s\n"), c->revision, c->code ? c->code : c->id);
      if (png != NULL && !write_png (c, f, png))
        return LAMINA_EXIT_BAD_INPUT;
      if (json)
        json_array_add_element (array, field_to_json (c, f));
      else
        print_field (c, f);
    }
  if (json)
    {
      g_autofree char *text = lamina_cli_json_document (g_steal_pointer (&array));
      printf ("%s\n", text);
    }
  else if (png != NULL)
    printf (_("temperature field drawn to %s (PNG, %d px wide)\n"), png, PNG_WIDTH);
  return LAMINA_EXIT_OK;
}
