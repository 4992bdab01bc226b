/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli import | export | demo: the library and the catalogue XML. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-catalogue.h"
#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-file.h"

#include <glib/gi18n.h>
#include <stdio.h>
#include <string.h>


static int
import_catalogue (LaminaLibrary          *library,
                  const LaminaCatalogue  *catalogue,
                  const char             *name,
                  LaminaImportFlags       flags)
{
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *summary = NULL;

  report = lamina_library_import (library, catalogue, flags, NULL, &error);
  if (report == NULL)
    {
      /* A fault of the library is named as the library (its path leads
       * the message), never as the document being read. */
      if (g_error_matches (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_CORRUPT)
          || g_error_matches (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_READ_ONLY)
          || g_error_matches (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY)
          || g_error_matches (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO))
        lamina_cli_error ("%s", error->message);
      else
        lamina_cli_error ("%s: %s", name, error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  /* Each sentence says what happened to what; conflicts go to stderr. */
  for (guint i = 0; i < report->items->len; i++)
    {
      LaminaImportItem *item = report->items->pdata[i];

      if (item->action == LAMINA_IMPORT_CONFLICT)
        lamina_cli_error (_("conflict: %s"), item->message);
      else
        printf ("%s\n", item->message);
    }
  summary = lamina_import_report_dup_summary (report);
  printf ("%s%s: %s\n", (flags & LAMINA_IMPORT_DRY_RUN) ? _("dry run, nothing written: ") : "", name, summary);
  if (report->n_conflicts > 0)
    {
      lamina_cli_error (g_dngettext (GETTEXT_PACKAGE,
                                     "%s: %u conflict with an approved revision or a library material "
                                     "was not applied (see above)",
                                     "%s: %u conflicts with approved revisions or library materials "
                                     "were not applied (see above)", report->n_conflicts),
                        name, report->n_conflicts);
      return LAMINA_EXIT_BAD_INPUT;
    }
  return LAMINA_EXIT_OK;
}

/* import FILE.xml [--dry-run] [--revise-approved] [--update-materials] [--keep-review] */
int
lamina_cli_import (const LaminaCliGlobals *globals,
                   int                     argc,
                   char                  **argv)
{
  gboolean dry_run = FALSE, revise = FALSE, update = FALSE, keep_review = FALSE;
  const GOptionEntry entries[] = {
    { "dry-run", 0, 0, G_OPTION_ARG_NONE, &dry_run, N_("Report what would happen; write nothing"), NULL },
    { "revise-approved", 0, 0, G_OPTION_ARG_NONE, &revise, N_("Store changes to approved constructions as new draft revisions"), NULL },
    { "update-materials", 0, 0, G_OPTION_ARG_NONE, &update, N_("Replace library materials that differ (their users get flagged)"), NULL },
    { "keep-review", 0, 0, G_OPTION_ARG_NONE, &keep_review, N_("Keep the document's checked and approved states for new constructions (recorded as approved elsewhere); otherwise they arrive as drafts"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("FILE.xml — merge a catalogue into the library"));
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 2)
    {
      lamina_cli_error (_("import takes one catalogue file (see “lamina-cli import --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  catalogue = lamina_catalogue_read_file (argv[1], &error);
  if (catalogue == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  library = lamina_cli_open_library (globals, TRUE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  return import_catalogue (library, catalogue, argv[1],
                           (dry_run ? LAMINA_IMPORT_DRY_RUN : 0)
                           | (revise ? LAMINA_IMPORT_REVISE_APPROVED : 0)
                           | (update ? LAMINA_IMPORT_UPDATE_MATERIALS : 0)
                           | (keep_review ? LAMINA_IMPORT_KEEP_REVIEW : 0));
}

/* export [-o FILE] [--force] [ID…] */
int
lamina_cli_export (const LaminaCliGlobals *globals,
                   int                     argc,
                   char                  **argv)
{
  g_autofree char *output = NULL;
  gboolean force = globals->force;
  const GOptionEntry entries[] = {
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, N_("Write to FILE (default or “-”: standard output)"), "FILE" },
    { "force", 0, 0, G_OPTION_ARG_NONE, &force, N_("Overwrite FILE if it exists"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("[ID…] — write constructions to catalogue XML"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(GPtrArray) ids = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GError) error = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (output != NULL && !lamina_file_check_target (output, force, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  for (int i = 1; i < argc; i++)
    {
      char *id = lamina_cli_resolve_id (library, argv[i]);

      if (id == NULL)
        return LAMINA_EXIT_BAD_INPUT;
      g_ptr_array_add (ids, id);
    }
  g_ptr_array_add (ids, NULL);
  catalogue = lamina_library_export (library, argc > 1 ? (const char * const *) ids->pdata : NULL,
                                     &error);
  if (catalogue == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  /* Standard output goes through the same checked writer as a file: a
   * full disk behind a redirection is an error, not a short document. */
  fflush (stdout);
  if (!lamina_catalogue_write_file (catalogue, output ? output : "-", LAMINA_WRITE_DERIVED, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  /* On stdout only when the catalogue itself is not going there. */
  if (output != NULL && strcmp (output, "-") != 0)
    printf (g_dngettext (GETTEXT_PACKAGE, "%u construction and %u materials exported to %s\n",
                         "%u constructions and %u materials exported to %s\n", catalogue->constructions->len),
            catalogue->constructions->len, catalogue->materials->len, output);
  return LAMINA_EXIT_OK;
}

/* demo: the invented practice's library (data/demo/lamina-demo.xml, built
 * into the program) into an empty library. */
int
lamina_cli_demo (const LaminaCliGlobals *globals,
                 int                     argc,
                 char                  **argv)
{
  g_autoptr(GOptionContext) context = g_option_context_new (_("— fill an empty library with the demo build-ups"));
  g_autoptr(GBytes) bytes = NULL;
  g_autoptr(LaminaCatalogue) catalogue = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;
  gint64 n;

  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("demo takes no arguments"));
      return LAMINA_EXIT_USAGE;
    }
  bytes = g_resources_lookup_data ("/org/example/Lamina/cli/lamina-demo.xml", 0, &error);
  if (bytes == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  catalogue = lamina_catalogue_read_memory (g_bytes_get_data (bytes, NULL), g_bytes_get_size (bytes),
                                            "lamina-demo.xml", &error);
  if (catalogue == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  library = lamina_cli_open_library (globals, TRUE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  lamina_library_query_init (&q);
  n = lamina_library_count (library, &q, &error);
  if (n != 0)
    {
      lamina_cli_error (_("%s: the library holds %lld constructions; the demo "
                          "goes into an empty library only"),
                        lamina_library_get_path (library), (long long) n);
      return LAMINA_EXIT_BAD_INPUT;
    }
  /* The invented practice's own library: its review state is its own. */
  return import_catalogue (library, catalogue, "lamina-demo.xml", LAMINA_IMPORT_KEEP_REVIEW);
}
