/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-build-tree.c: the build folder's data for an uninstalled run. */
#define G_LOG_DOMAIN "lamina-exchange"

#include "config.h"

#include "lamina-build-tree.h"

#include <string.h>

gboolean
lamina_running_from_build_tree (void)
{
  static gsize done = 0;
  static gboolean from_build = FALSE;

  if (g_once_init_enter (&done))
    {
      /* Linux names the running executable here; elsewhere the program
       * behaves as installed. */
      g_autofree char *exe = g_file_read_link ("/proc/self/exe", NULL);
      gsize n = strlen (LAMINA_BUILD_ROOT);

      from_build = exe != NULL && strncmp (exe, LAMINA_BUILD_ROOT, n) == 0 && exe[n] == G_DIR_SEPARATOR;
      g_once_init_leave (&done, 1);
    }
  return from_build;
}

const char *
lamina_get_locale_dir (void)
{
  return lamina_running_from_build_tree () ? LAMINA_BUILD_ROOT G_DIR_SEPARATOR_S "po" : LOCALEDIR;
}

const char *
lamina_get_build_schema_dir (void)
{
  return lamina_running_from_build_tree () ? LAMINA_BUILD_ROOT G_DIR_SEPARATOR_S "data" : NULL;
}
