/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-cli verify | backup | restore, and what every command does with
 * the library it opens: waiting for another program, the day's backup. */
#define G_LOG_DOMAIN "lamina-cli"

#include "config.h"

#include "lamina-cli.h"
#include "lamina-cli-library.h"
#include "lamina-library-safety.h"

#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <stdio.h>
#include <string.h>

static void
on_wait (LaminaLibrary *library,
         gboolean       waiting,
         const char    *holder,
         gpointer       user_data)
{
  if (!waiting)
    return;
  if (holder != NULL)
    lamina_cli_error (_("waiting for another program writing this library (%s)…"), holder);
  else
    lamina_cli_error (_("waiting for another program writing this library…"));
}

void
lamina_cli_library_opened (LaminaLibrary *library)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *made = NULL;

  lamina_library_set_wait_func (library, on_wait, NULL);
  /* A library made just now has nothing worth a copy yet. */
  if (lamina_library_get_opened_version (library) == 0)
    return;
  made = lamina_library_backup_daily (library, &error);
  if (error != NULL)
    lamina_cli_error (_("warning: the day's backup was not made: %s"), error->message);
}

/* verify [--json] */
int
lamina_cli_verify (const LaminaCliGlobals *globals,
                   int                     argc,
                   char                  **argv)
{
  gboolean json = FALSE;
  const GOptionEntry entries[] = {
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, N_("Print the findings as JSON"), NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("— check the library: the file, "
                                                              "approved figures, review records"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaVerifyReport) report = NULL;
  g_autoptr(GError) error = NULL;
  const char *path;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("verify takes no arguments (see “lamina-cli verify --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  {
    LaminaCliGlobals existing = *globals;
    g_autofree char *default_path = NULL;

    /* Verifying never creates the library it was asked to look at. */
    if (existing.library_path == NULL)
      existing.library_path = default_path = lamina_library_dup_default_path ();
    library = lamina_cli_open_library (&existing, FALSE);
  }
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  path = lamina_library_get_path (library);
  report = lamina_library_verify (library, &error);
  if (report == NULL)
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (json)
    {
      g_autoptr(JsonBuilder) b = json_builder_new ();

      json_builder_begin_object (b);
      json_builder_set_member_name (b, "library");
      json_builder_add_string_value (b, path);
      json_builder_set_member_name (b, "sound");
      json_builder_add_boolean_value (b, report->problems->len == 0);
      json_builder_set_member_name (b, "storage_checked");
      json_builder_add_boolean_value (b, report->storage_checked);
      json_builder_set_member_name (b, "constructions");
      json_builder_add_int_value (b, report->n_constructions);
      json_builder_set_member_name (b, "approved_revisions");
      json_builder_add_int_value (b, report->n_approved);
      json_builder_set_member_name (b, "review_records");
      json_builder_add_int_value (b, report->n_reviews);
      json_builder_set_member_name (b, "problems");
      json_builder_begin_array (b);
      for (guint i = 0; i < report->problems->len; i++)
        json_builder_add_string_value (b, report->problems->pdata[i]);
      json_builder_end_array (b);
      json_builder_end_object (b);
      lamina_cli_print_json (json_builder_get_root (b));
    }
  else
    {
      if (report->storage_checked)
        printf (_("%s: storage check (SQLite integrity check, references): done\n"), path);
      else
        printf (_("%s: storage check: not supported for this library\n"), path);
      printf (_("%u constructions, %u approved revisions recalculated and compared, "
                "%u review records checked\n"),
              report->n_constructions, report->n_approved, report->n_reviews);
      for (guint i = 0; i < report->problems->len; i++)
        printf ("  %s\n", (char *) report->problems->pdata[i]);
      if (report->problems->len == 0)
        printf (_("no problems found\n"));
    }
  if (report->problems->len > 0)
    {
      lamina_cli_error (g_dngettext (GETTEXT_PACKAGE, "%s: %u problem found",
                                     "%s: %u problems found", report->problems->len),
                        path, report->problems->len);
      return LAMINA_EXIT_BAD_INPUT;
    }
  return LAMINA_EXIT_OK;
}

static void
print_backups (GPtrArray *list)
{
  for (guint i = 0; i < list->len; i++)
    {
      GStatBuf st;

      if (g_stat (list->pdata[i], &st) == 0)
        printf ("%s  %8.1f kB\n", (char *) list->pdata[i], st.st_size / 1000.0);
    }
}

/* backup [--list] [--dir DIR] [--set-folder DIR] [--set-keep N] */
int
lamina_cli_backup (const LaminaCliGlobals *globals,
                   int                     argc,
                   char                  **argv)
{
  gboolean list = FALSE;
  g_autofree char *dir = NULL;
  g_autofree char *set_folder = NULL;
  int set_keep = -1;
  const GOptionEntry entries[] = {
    { "list", 0, 0, G_OPTION_ARG_NONE, &list, N_("List the copies, newest first; make none"), NULL },
    { "dir", 0, 0, G_OPTION_ARG_FILENAME, &dir, N_("Use the backup folder DIR this time (as LAMINA_BACKUP_DIR)"), "DIR" },
    { "set-folder", 0, 0, G_OPTION_ARG_FILENAME, &set_folder, N_("Store DIR as the library's backup folder (relative: to the library's folder; \"\": the default)"), "DIR" },
    { "set-keep", 0, 0, G_OPTION_ARG_INT, &set_keep, N_("Store how many daily copies are kept (0: none are made)"), "N" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("— make a backup copy of the library now"));
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *folder = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc != 1)
    {
      lamina_cli_error (_("backup takes no arguments (see “lamina-cli backup --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (set_keep < -1 || set_keep > 1000)
    {
      lamina_cli_error (_("--set-keep: %d is not a number of copies (allowed: 0 to 1000)"), set_keep);
      return LAMINA_EXIT_USAGE;
    }
  if (dir != NULL)
    g_setenv ("LAMINA_BACKUP_DIR", dir, TRUE);
  library = lamina_cli_open_library (globals, FALSE);
  if (library == NULL)
    return LAMINA_EXIT_BAD_INPUT;
  if (set_folder != NULL || set_keep >= 0)
    {
      if (!lamina_library_set_backup_settings (library, set_folder, set_keep, &error))
        {
          lamina_cli_error ("%s", error->message);
          return LAMINA_EXIT_BAD_INPUT;
        }
    }
  folder = lamina_library_dup_backup_dir (library);
  if (list)
    {
      g_autoptr(GPtrArray) copies = lamina_backup_list (lamina_library_get_path (library), folder);

      print_backups (copies);
      if (copies->len == 0)
        printf (_("no backups in %s\n"), folder);
      return LAMINA_EXIT_OK;
    }
  if (set_folder != NULL || set_keep >= 0)
    {
      printf (_("backups of %s go to %s; the newest %u daily copies are kept\n"),
              lamina_library_get_path (library), folder, lamina_library_get_backup_keep (library));
      return LAMINA_EXIT_OK;
    }
  {
    g_autofree char *made = lamina_library_backup_now (library, &error);

    if (made == NULL)
      {
        lamina_cli_error ("%s", error->message);
        return LAMINA_EXIT_BAD_INPUT;
      }
    printf (_("backup written: %s (the newest %u are kept)\n"), made,
            MAX (lamina_library_get_backup_keep (library), 1));
  }
  return LAMINA_EXIT_OK;
}

/* The folder for a library that may not open: --dir, the environment,
 * the library's setting if it can be read, else the default. */
static char *
restore_folder (const char *path)
{
  g_autoptr(LaminaLibrary) library = NULL;
  const char *env = g_getenv ("LAMINA_BACKUP_DIR");

  if ((env == NULL || *env == '\0') && g_file_test (path, G_FILE_TEST_EXISTS))
    library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_READ_ONLY, NULL);
  if (library != NULL)
    return lamina_library_dup_backup_dir (library);
  return NULL;
}

/* restore [BACKUP] [--yes] [--dir DIR] */
int
lamina_cli_restore (const LaminaCliGlobals *globals,
                    int                     argc,
                    char                  **argv)
{
  gboolean yes = FALSE;
  g_autofree char *dir = NULL;
  const GOptionEntry entries[] = {
    { "yes", 'y', 0, G_OPTION_ARG_NONE, &yes, N_("Restore without asking (for scripts)"), NULL },
    { "dir", 0, 0, G_OPTION_ARG_FILENAME, &dir, N_("Look for copies in DIR (as LAMINA_BACKUP_DIR)"), "DIR" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new (_("[BACKUP] — bring back a copy "
                                                              "(default: the newest)"));
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) copies = NULL;
  g_autofree char *path = NULL;
  g_autofree char *folder = NULL;
  g_autofree char *backup = NULL;
  g_autofree char *kept = NULL;

  g_option_context_add_main_entries (context, entries, GETTEXT_PACKAGE);
  if (!lamina_cli_parse (context, &argc, &argv))
    return LAMINA_EXIT_USAGE;
  if (argc > 2)
    {
      lamina_cli_error (_("restore takes at most one backup file (see “lamina-cli restore --help”)"));
      return LAMINA_EXIT_USAGE;
    }
  if (dir != NULL)
    g_setenv ("LAMINA_BACKUP_DIR", dir, TRUE);
  path = globals->library_path ? g_strdup (globals->library_path)
                               : lamina_library_dup_default_path ();
  /* A server library is never replaced: the refusal (naming the copy into
   * a new database) before any question. */
  if (lamina_library_is_server_address (path))
    {
      lamina_library_restore_backup (path, argc == 2 ? argv[1] : "BACKUP.sqlite", NULL, NULL, &error);
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  folder = restore_folder (path);
  if (argc == 2)
    backup = g_strdup (argv[1]);
  else
    {
      copies = lamina_backup_list (path, folder);
      if (copies->len == 0)
        {
          g_autofree char *where = folder ? g_strdup (folder) : lamina_backup_dup_dir_for_path (path);

          lamina_cli_error (_("%s: no backups in %s; name one (“lamina-cli restore FILE”)"),
                            path, where);
          return LAMINA_EXIT_BAD_INPUT;
        }
      backup = g_strdup (copies->pdata[0]);
    }
  if (!g_file_test (backup, G_FILE_TEST_IS_REGULAR))
    {
      lamina_cli_error (_("%s: no such backup file"), backup);
      return LAMINA_EXIT_BAD_INPUT;
    }
  if (!yes)
    {
      char answer[16] = "";

      fprintf (stderr, _("Replace the library %s with the copy %s?\n"
                         "The current file is kept as a copy first. [y/N] "), path, backup);
      fflush (stderr);
      if (fgets (answer, sizeof answer, stdin) == NULL
          || (g_ascii_strncasecmp (answer, "y", 1) != 0 && g_ascii_strncasecmp (answer, _("y"), 1) != 0))
        {
          lamina_cli_error (_("not restored: no confirmation (“--yes” restores without asking)"));
          return LAMINA_EXIT_BAD_INPUT;
        }
    }
  if (!lamina_library_restore_backup (path, backup, folder, &kept, &error))
    {
      lamina_cli_error ("%s", error->message);
      return LAMINA_EXIT_BAD_INPUT;
    }
  printf (_("%s restored from %s\n"), path, backup);
  if (kept != NULL)
    printf (_("the file it replaced is kept as %s\n"), kept);
  return LAMINA_EXIT_OK;
}
