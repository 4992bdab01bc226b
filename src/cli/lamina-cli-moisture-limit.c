/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli moisture-limit [--set KG]: the office's limit on the largest
 * interstitial accumulation (EN ISO 13788) that the library keeps and every
 * moisture check of the library uses. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-moisture.h"

#include <glib/gi18n.h>
#include <math.h>

int
lamina_cli_moisture_limit (const LaminaCliGlobals *globals,
                           int                     argc,
                           char                  **argv)
{
  double set = NAN;
  const GOptionEntry entries[] = {
    { "set", 0, 0, G_OPTION_ARG_DOUBLE, &set,
      N_("Set the limit, kg/m² (above 0; common practice 0.5)"), "KG" },
    { NULL }
  };
  g_autoptr(GOptionContext) context =
    g_option_context_new (_("— the library's limit on moisture accumulation (EN ISO 13788)"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("moisture-limit takes no arguments (see “lamina-cli moisture-limit --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (!isnan (set) && !LAMINA_MOISTURE_LIMIT_IS_VALID (set))
    {
      lamina_cli_error (_("--set %g is outside the allowed range above 0 to %g kg/m²"), set,
                        LAMINA_MOISTURE_LIMIT_MAX);
      return LAMINA_EXIT_USAGE;
    }
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (!isnan (set) && !lamina_library_set_moisture_limit (library, set, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  printf (_("%g kg/m²: the largest accumulation in a year that dries out (EN ISO 13788 sets no limit; "
            "0.5 kg/m² is common practice)\n"), lamina_library_get_moisture_limit (library));
  return LAMINA_EXIT_OK;
}
