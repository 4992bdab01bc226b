/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include <glib/gi18n.h>
#include <locale.h>

#include "lamina-build-tree.h"

#include "lamina-application.h"

int
main (int   argc,
      char *argv[])
{
  g_autoptr(LaminaApplication) app = NULL;

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, lamina_get_locale_dir ());
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  app = lamina_application_new ();
  return g_application_run (G_APPLICATION (app), argc, argv);
}
