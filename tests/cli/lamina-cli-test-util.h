/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Running lamina-cli from the end-to-end tests. */
#pragma once

#include <glib.h>
#include <sys/wait.h>

static inline char *
data_path (const char *name)
{
  return g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "tests", "cli", "data", name, NULL);
}

static inline int
run_cli (const char *const *args,
         char              **out,
         char              **err)
{
  g_autoptr(GPtrArray) argv = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GError) error = NULL;
  int status = -1;

  /* LAMINA_CLI_WRAPPER (e.g. "valgrind --leak-check=full -q") runs the
   * CLI under a checker (build-aux/check-hardening). */
  if (g_getenv ("LAMINA_CLI_WRAPPER") != NULL)
    {
      g_auto(GStrv) wrapper = NULL;

      g_assert_true (g_shell_parse_argv (g_getenv ("LAMINA_CLI_WRAPPER"), NULL, &wrapper, NULL));
      g_ptr_array_add (argv, g_find_program_in_path (wrapper[0]));
      for (guint i = 1; wrapper[i] != NULL; i++)
        g_ptr_array_add (argv, g_strdup (wrapper[i]));
    }
  g_ptr_array_add (argv, g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL));
  for (guint i = 0; args[i] != NULL; i++)
    g_ptr_array_add (argv, g_strdup (args[i]));
  g_ptr_array_add (argv, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               out, err, &status, &error));
  g_assert_no_error (error);
  g_assert_true (WIFEXITED (status));
  return WEXITSTATUS (status);
}

