/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli-test-util.h: running lamina-cli from the store's end-to-end
 * tests. */
#pragma once

#include <glib.h>
#include <sys/wait.h>

static char *library_path;

/* Runs lamina-cli --library LIB ARGS…; returns the exit status. */
static int
run (char       **out,
     char       **err,
     const char  *first,
     ...)
{
  g_autoptr(GPtrArray) args = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GError) error = NULL;
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  int status = 0;
  va_list ap;

  g_assert_nonnull (build);
  /* LAMINA_CLI_WRAPPER (e.g. "valgrind --leak-check=full -q") runs the
   * CLI under a checker (build-aux/check-hardening). */
  if (g_getenv ("LAMINA_CLI_WRAPPER") != NULL)
    {
      g_auto(GStrv) wrapper = NULL;

      g_assert_true (g_shell_parse_argv (g_getenv ("LAMINA_CLI_WRAPPER"), NULL, &wrapper, NULL));
      g_ptr_array_add (args, g_find_program_in_path (wrapper[0]));
      for (guint i = 1; wrapper[i] != NULL; i++)
        g_ptr_array_add (args, g_strdup (wrapper[i]));
    }
  g_ptr_array_add (args, g_build_filename (build, "src", "cli", "lamina-cli", NULL));
  g_ptr_array_add (args, g_strdup ("--library"));
  g_ptr_array_add (args, g_strdup (library_path));
  va_start (ap, first);
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (args, g_strdup (a));
  va_end (ap);
  g_ptr_array_add (args, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) args->pdata, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               out, err, &status, &error));
  g_assert_no_error (error);
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

