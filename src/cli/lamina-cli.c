/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli: the command-line face of Lamina. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"

#include <glib/gi18n.h>
#include <locale.h>

#include "lamina-build-tree.h"
#include <stdio.h>
#include <string.h>

typedef struct
{
  const char    *name;
  LaminaCliFunc  func;
  const char    *summary;
} Command;

static const Command commands[] = {
  { "calc", lamina_cli_calc, N_("Calculate R and U of the constructions in a catalogue file") },
  { "list", lamina_cli_list, N_("List or search the constructions of the library") },
  { "show", lamina_cli_show, N_("Show a construction of the library with its figures") },
  { "import", lamina_cli_import, N_("Merge a catalogue file into the library") },
  { "export", lamina_cli_export, N_("Write constructions of the library to a catalogue file") },
  { "check", lamina_cli_check, N_("Mark a construction checked by a named person") },
  { "approve", lamina_cli_approve, N_("Approve a construction (named person, date)") },
  { "history", lamina_cli_history, N_("The revisions of a construction") },
  { "materials", lamina_cli_materials, N_("The materials of the library") },
  { "demo", lamina_cli_demo, N_("Fill an empty library with the demo build-ups") },
  { "section", lamina_cli_section, N_("Draw a construction's section to a PNG or SVG image") },
  { "sheet", lamina_cli_sheet, N_("Print a construction's specification sheet to PDF") },
  { "catalogue", lamina_cli_catalogue, N_("Print a catalogue of sheets, with index, to PDF") },
  { "solve", lamina_cli_solve, N_("The thickness of a layer that meets a target U") },
  { "moisture", lamina_cli_moisture, N_("Check the constructions of a catalogue file for condensation (EN ISO 13788)") },
  { "job", lamina_cli_job, N_("Jobs: new, list, show, add, remove, update, sheets, delete") },
  { "field", lamina_cli_field, N_("2-D check of one module of a construction (EN ISO 10211), with a field picture") },
  { "compare", lamina_cli_compare, N_("Two build-ups side by side, as a table or a one-page PDF") },
  { "policy", lamina_cli_policy, N_("Show or set the library's review policy (four eyes or single reviewer)") },
  { "withdraw", lamina_cli_withdraw, N_("Withdraw the approval of a construction, with a reason") },
  { "copy", lamina_cli_copy, N_("Copy a whole library with its history into an empty one (a file or a server)") },
  { "verify", lamina_cli_verify, N_("Check the library file and every approved revision's figures and review records") },
  { "backup", lamina_cli_backup, N_("Make a backup copy of the library now, list the copies, or set where they go") },
  { "restore", lamina_cli_restore, N_("Bring back a backup copy of the library (the current file is kept)") },
  { "moisture-limit", lamina_cli_moisture_limit, N_("Show or set the library's limit on moisture accumulation (EN ISO 13788)") },
  { "server-init", lamina_cli_server_init, N_("Make an office library on a PostgreSQL server, with roles the server enforces") },
};

FILE *
lamina_cli_message_stream (const char *output)
{
  return g_strcmp0 (output, "-") == 0 ? stderr : stdout;
}

void
lamina_cli_error (const char *format,
                  ...)
{
  va_list args;
  g_autofree char *message = NULL;

  va_start (args, format);
  message = g_strdup_vprintf (format, args);
  va_end (args);
  fprintf (stderr, "lamina-cli: %s\n", message);
}

gboolean
lamina_cli_parse (GOptionContext *context,
                  int            *argc,
                  char         ***argv)
{
  g_autoptr(GError) error = NULL;

  if (!g_option_context_parse (context, argc, argv, &error))
    {
      lamina_cli_error ("%s", error->message);
      return FALSE;
    }
  return TRUE;
}

static void
print_usage (FILE *out)
{
  fprintf (out, "%s\n", _("Usage: lamina-cli [--library PATH] [--force] COMMAND [OPTIONS…]"));
  fprintf (out, "\n%s\n", _("Commands:"));
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    fprintf (out, "  %-10s %s\n", commands[i].name, _(commands[i].summary));
  fprintf (out, "\n%s\n", _("“lamina-cli COMMAND --help” describes a command."));
}

/* The global options are also taken after the command name ("export -o
 * office.xml --force" as well as "--force export -o office.xml"), up to a
 * "--" that ends the options.  Returns the command's argc and sets @rest
 * to its argv (NULL-terminated, borrowed strings), or −1 on bad usage. */
static int
take_global_options (LaminaCliGlobals  *globals,
                     int                argc,
                     char             **argv,
                     char            ***rest)
{
  char **out = g_new0 (char *, argc + 1);
  int n = 0;
  gboolean options = TRUE;

  for (int j = 0; j < argc; j++)
    {
      if (j > 0 && options && strcmp (argv[j], "--") == 0)
        options = FALSE;
      else if (j > 0 && options && strcmp (argv[j], "--force") == 0)
        {
          globals->force = TRUE;
          continue;
        }
      else if (j > 0 && options && strcmp (argv[j], "--library") == 0)
        {
          if (j + 1 >= argc)
            {
              lamina_cli_error (_("--library needs a PATH"));
              g_free (out);
              return -1;
            }
          globals->library_path = argv[++j];
          continue;
        }
      else if (j > 0 && options && g_str_has_prefix (argv[j], "--library="))
        {
          globals->library_path = argv[j] + strlen ("--library=");
          continue;
        }
      out[n++] = argv[j];
    }
  *rest = out;
  return n;
}

int
main (int    argc,
      char **argv)
{
  LaminaCliGlobals globals = { NULL, FALSE };
  int i;

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, lamina_get_locale_dir ());
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  /* Global options come before the command. */
  for (i = 1; i < argc && argv[i][0] == '-'; i++)
    {
      if (strcmp (argv[i], "--library") == 0 && i + 1 < argc)
        globals.library_path = argv[++i];
      else if (g_str_has_prefix (argv[i], "--library="))
        globals.library_path = argv[i] + strlen ("--library=");
      else if (strcmp (argv[i], "--force") == 0)
        globals.force = TRUE;
      else if (strcmp (argv[i], "--help") == 0 || strcmp (argv[i], "-h") == 0)
        {
          print_usage (stdout);
          return LAMINA_EXIT_OK;
        }
      else if (strcmp (argv[i], "--version") == 0)
        {
          printf ("lamina-cli %s\n", PACKAGE_VERSION);
          return LAMINA_EXIT_OK;
        }
      else
        {
          lamina_cli_error (_("unknown option “%s”"), argv[i]);
          print_usage (stderr);
          return LAMINA_EXIT_USAGE;
        }
    }
  if (i >= argc)
    {
      print_usage (stderr);
      return LAMINA_EXIT_USAGE;
    }
  for (guint k = 0; k < G_N_ELEMENTS (commands); k++)
    if (strcmp (argv[i], commands[k].name) == 0)
      {
        g_autofree char **rest = NULL;
        int n = take_global_options (&globals, argc - i, argv + i, &rest);

        if (n < 0)
          return LAMINA_EXIT_USAGE;
        return commands[k].func (&globals, n, rest);
      }

  lamina_cli_error (_("unknown command “%s”"), argv[i]);
  print_usage (stderr);
  return LAMINA_EXIT_USAGE;
}
