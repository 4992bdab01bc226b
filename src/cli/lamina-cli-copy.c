/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli copy --from LIBRARY --to LIBRARY: moves a whole library with
 * its history (a file to a server and back). */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-library-copy.h"

#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <stdio.h>

/* A library file this command created and could not fill goes again, so
 * that a failed copy leaves nothing behind. */
static void
remove_created_file (const char *path)
{
  static const char *const suffixes[] = { "", "-wal", "-shm", "-journal" };

  if (!g_file_test (path, G_FILE_TEST_IS_REGULAR))
    return;
  for (guint i = 0; i < G_N_ELEMENTS (suffixes); i++)
    {
      g_autofree char *name = g_strconcat (path, suffixes[i], NULL);

      g_unlink (name);
    }
}

static void
print_report (const LaminaCopyReport *r)
{
  printf (_("  constructions   %6u (%u of them deleted, kept with their history)\n"),
          r->constructions, r->deleted);
  printf (_("  revisions       %6u\n"), r->revisions);
  printf (_("  review records  %6u\n"), r->review_records);
  printf (_("  2-D checks      %6u\n"), r->field_checks);
  printf (_("  materials       %6u\n"), r->materials);
  printf (_("  climates        %6u\n"), r->climates);
  printf (_("  target sets     %6u\n"), r->target_sets);
  printf (_("  jobs            %6u\n"), r->jobs);
  printf (_("  settings        %6u\n"), r->settings);
}

int
lamina_cli_copy (const LaminaCliGlobals *globals,
                 int                     argc,
                 char                  **argv)
{
  g_autofree char *from_path = NULL, *to_path = NULL;
  const GOptionEntry entries[] = {
    { "from", 0, 0, G_OPTION_ARG_STRING, &from_path, N_("The library to copy (a file, or a server's connection string)"), "LIBRARY" },
    { "to", 0, 0, G_OPTION_ARG_STRING, &to_path, N_("The empty library to copy into (a new file is created)"), "LIBRARY" },
    { NULL }
  };
  g_autoptr(GOptionContext) context =
    g_option_context_new (_("--from LIBRARY --to LIBRARY — copy a whole library with its history"));
  g_autoptr(LaminaLibrary) from = NULL;
  g_autoptr(LaminaLibrary) to = NULL;
  g_autoptr(GError) error = NULL;
  LaminaCopyReport report = { 0 };
  gboolean created;

  (void) globals;
  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  g_option_context_set_description (context,
    _("Copies every construction with all its revisions, review records and 2-D checks, "
      "the materials, climates, target sets, jobs and the review policy, in one "
      "transaction: all or nothing.  The target must be empty (a new file is).  "
      "A password comes from libpq's usual sources, never from the command line."));
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1 || from_path == NULL || to_path == NULL)
    {
      lamina_cli_error (_("copy takes --from LIBRARY and --to LIBRARY and no other arguments"));
      return LAMINA_EXIT_USAGE;
    }

  from = lamina_library_open (from_path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  if (from == NULL)
    {
      lamina_cli_error ("--from: %s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  created = !g_file_test (to_path, G_FILE_TEST_EXISTS);
  to = lamina_library_open (to_path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  if (to == NULL)
    {
      lamina_cli_error ("--to: %s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (!lamina_library_copy (from, to, &report, &error))
    {
      lamina_cli_error (_("copy cancelled, nothing was written: %s"), error->message);
      g_clear_object (&to);
      if (created)
        remove_created_file (to_path);
      return LAMINA_EXIT_BAD_INPUT;
    }
  printf (_("copied %s to %s:\n"), lamina_library_get_path (from), lamina_library_get_path (to));
  print_report (&report);
  return LAMINA_EXIT_OK;
}
