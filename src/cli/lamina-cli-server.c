/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli server-init: makes an office library on a PostgreSQL server
 * with the roles the server enforces (lamina_library_server_init). */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-cli-library.h"

#include <glib/gi18n.h>
#include <stdio.h>

/* server-init (with --library ADDRESS) */
int
lamina_cli_server_init (const LaminaCliGlobals *globals,
                        int                     argc,
                        char                  **argv)
{
  g_autoptr(GOptionContext) context = g_option_context_new (
    _("— make the library at --library postgresql://… with roles its server enforces"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;

  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("server-init takes no arguments (see “lamina-cli server-init --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (!lamina_library_is_server_address (globals->library_path))
    {
      lamina_cli_error (_("server-init needs --library with a PostgreSQL server's address "
                          "(postgresql://USER@HOST/DATABASE or service=NAME); a library file "
                          "has no server roles"));
      return LAMINA_EXIT_USAGE;
    }
  library = lamina_cli_open_library (globals, TRUE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (!lamina_library_server_init (library, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  printf (_("%s: library format %d with the roles lamina_author (edits drafts), lamina_checker "
            "and lamina_approver; checks and approvals are now kept by the server.\n"
            "Give each person a login and a role, for example:\n"
            "  CREATE ROLE anna LOGIN; GRANT lamina_approver TO anna;\n"),
          lamina_library_get_path (library), LAMINA_LIBRARY_SCHEMA_VERSION);
  return LAMINA_EXIT_OK;
}
