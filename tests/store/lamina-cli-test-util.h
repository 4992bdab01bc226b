/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli-test-util.h: running lamina-cli from the store's end-to-end
 * tests. */
#pragma once

#include <gio/gio.h>
#include <glib.h>
#include <sys/wait.h>

static char *library_path;

/* lamina-cli --library LIB ARGS… as an argument vector (NULL-terminated). */
static GPtrArray *
cli_args_new (const char *first,
              va_list     ap)
{
  GPtrArray *args = g_ptr_array_new_with_free_func (g_free);
  const char *build = g_getenv ("LAMINA_BUILD_DIR");

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
  for (const char *a = first; a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (args, g_strdup (a));
  g_ptr_array_add (args, NULL);
  return args;
}

/* Runs lamina-cli --library LIB ARGS…; returns the exit status. */
static int
run (char       **out,
     char       **err,
     const char  *first,
     ...)
{
  g_autoptr(GPtrArray) args = NULL;
  g_autoptr(GError) error = NULL;
  int status = 0;
  va_list ap;

  va_start (ap, first);
  args = cli_args_new (first, ap);
  va_end (ap);
  g_assert_true (g_spawn_sync (NULL, (char **) args->pdata, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               out, err, &status, &error));
  g_assert_no_error (error);
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

/* As run, with @input on the standard input (what a person types). */
G_GNUC_UNUSED static int
run_with_stdin (const char  *input,
                char       **out,
                char       **err,
                const char  *first,
                ...)
{
  g_autoptr(GPtrArray) args = NULL;
  g_autoptr(GSubprocess) process = NULL;
  g_autoptr(GError) error = NULL;
  va_list ap;

  va_start (ap, first);
  args = cli_args_new (first, ap);
  va_end (ap);
  process = g_subprocess_newv ((const char *const *) args->pdata,
                               G_SUBPROCESS_FLAGS_STDIN_PIPE | G_SUBPROCESS_FLAGS_STDOUT_PIPE
                               | G_SUBPROCESS_FLAGS_STDERR_PIPE, &error);
  g_assert_no_error (error);
  g_assert_true (g_subprocess_communicate_utf8 (process, input, NULL, out, err, &error));
  g_assert_no_error (error);
  return g_subprocess_get_if_exited (process) ? g_subprocess_get_exit_status (process) : -1;
}
