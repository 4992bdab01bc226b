/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Concurrent use of one library file (issue 3 "Concurrency", issue 7).
 *
 * Two processes edit, approve and import on the same shared constructions
 * at once for a bounded time (LAMINA_TEST_CONCURRENT_SECONDS, default 4 s
 * each, run side by side).  Each keeps a log of what the library accepted
 * (construction, revision, a token unique to that write) and of every
 * refusal.  Afterwards, from a third connection:
 * - the file is intact (integrity_check, foreign keys, full read);
 * - nothing is lost: every accepted write is found at the revision it was
 *   given, with its own token, or (a draft that follows an approved
 *   revision is updated in place by its author) was the state another
 *   accepted write was based on, so no write was overwritten silently;
 *   the revisions of each construction are exactly the initial ones plus
 *   the accepted writes that made a revision;
 * - every refusal was reported as STALE, BUSY or IMMUTABLE with a message,
 *   and import conflicts with approved revisions were reported in the
 *   import report, never applied. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "lamina-hardening-util.h"

#define N_SHARED 4
#define BUSY_EXIT(e) (g_error_matches ((e), LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_BUSY) ? 3 : 2)

typedef struct
{
  guint ops, accepted, stale, busy, immutable, import_conflicts;
} Counts;

static char *
shared_id (guint i)
{
  return g_strdup_printf ("shared-%u", i);
}

static void
log_accepted (FILE       *log,
              const char *kind,
              const char *id,
              int         revision,
              const char *token)
{
  fprintf (log, "%s %s %d %s\n", kind, id, revision, token);
}

static gboolean
count_refusal (Counts       *counts,
               const GError *error)
{
  if (error == NULL || error->domain != LAMINA_LIBRARY_ERROR || error->message[0] == '\0')
    return FALSE;
  switch (error->code)
    {
    case LAMINA_LIBRARY_ERROR_STALE:
      counts->stale++;
      return TRUE;
    case LAMINA_LIBRARY_ERROR_BUSY:
      counts->busy++;
      return TRUE;
    case LAMINA_LIBRARY_ERROR_IMMUTABLE:
      counts->immutable++;
      return TRUE;
    default:
      return FALSE;
    }
}

/* Reads the latest revision, waits a little (the other process may save
 * meanwhile), then saves on top of what it read. */
static gboolean
do_edit (LaminaLibrary *library,
         const char    *id,
         const char    *token,
         FILE          *log,
         Counts        *counts,
         GError       **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, error);

  if (c == NULL)
    return FALSE;
  int base = c->revision;
  g_autofree char *base_stamp = g_strdup (c->draft_stamp ? c->draft_stamp : "-");

  g_free (c->description);
  c->description = g_strdup (token);
  g_usleep (g_random_int_range (0, 3000));
  if (!lamina_library_save_construction (library, c, c->revision, "Editor", error))
    return FALSE;
  /* save ID REVISION TOKEN BASE-REVISION BASE-STAMP NEW-STAMP */
  fprintf (log, "save %s %d %s %d %s %s\n", id, c->revision, token, base, base_stamp,
           c->draft_stamp ? c->draft_stamp : "-");
  return TRUE;
}

static gboolean
do_approve (LaminaLibrary *library,
            const char    *id,
            const char    *who,
            FILE          *log,
            GError       **error)
{
  g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, error);

  if (c == NULL)
    return FALSE;
  g_usleep (g_random_int_range (0, 3000));
  /* Only a checked revision can be approved: check it first (a second
   * check of a checked revision adds a record). */
  if (!lamina_library_mark_checked (library, id, c->revision, "C. Checker", error)
      || !lamina_library_approve (library, id, c->revision, who, "2099-06-01", error))
    return FALSE;
  log_accepted (log, "approve", id, c->revision, who);
  return TRUE;
}

static gboolean
do_import (LaminaLibrary *library,
           const char    *id,
           const char    *token,
           FILE          *log,
           Counts        *counts,
           GError       **error)
{
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(LaminaImportReport) report = NULL;
  LaminaConstruction *c = lamina_library_dup_construction (library, id, 0, error);

  if (c == NULL)
    return FALSE;
  g_free (c->description);
  c->description = g_strdup (token);
  g_ptr_array_add (cat->constructions, c);
  report = lamina_library_import (library, cat, 0, "Importer", error);
  if (report == NULL)
    return FALSE;
  for (guint i = 0; i < report->items->len; i++)
    {
      LaminaImportItem *item = report->items->pdata[i];

      if (item->is_material)
        continue;
      if (item->action == LAMINA_IMPORT_REVISED || item->action == LAMINA_IMPORT_ADDED)
        log_accepted (log, "import", item->id, item->revision, token);
      else if (item->action == LAMINA_IMPORT_CONFLICT)
        {
          g_assert_nonnull (item->message);
          counts->import_conflicts++;
        }
    }
  return TRUE;
}

static void
run_worker (const char *path,
            const char *log_path,
            guint       worker,
            double      seconds)
{
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(GTimer) timer = g_timer_new ();
  g_autoptr(GError) error = NULL;
  g_autofree char *who = g_strdup_printf ("Reviewer-%u", worker);
  Counts counts = { 0 };
  FILE *log = fopen (log_path, "w");

  g_assert_nonnull (log);
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  while (g_timer_elapsed (timer, NULL) < seconds)
    {
      g_autofree char *id = shared_id (g_random_int_range (0, N_SHARED));
      g_autofree char *token = g_strdup_printf ("w%u-op%u", worker, counts.ops);
      guint which = g_random_int_range (0, 10);
      gboolean ok;

      g_clear_error (&error);
      if (which < 6)
        ok = do_edit (library, id, token, log, &counts, &error);
      else if (which < 8)
        ok = do_import (library, id, token, log, &counts, &error);
      else
        ok = do_approve (library, id, who, log, &error);
      counts.ops++;
      if (ok)
        counts.accepted++;
      else if (!count_refusal (&counts, error))
        g_error ("worker %u: an unexplained failure: %s", worker,
                 error ? error->message : "(no error)");
    }
  fprintf (log, "counts %u %u %u %u %u %u\n", counts.ops, counts.accepted, counts.stale,
           counts.busy, counts.immutable, counts.import_conflicts);
  fclose (log);
}

static void
check_logs (const char *path,
            char      **logs,
            int        *initial_revisions,
            Counts     *total)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  int writes[N_SHARED] = { 0 };
  /* "ID REVISION STAMP" of the states that in-place saves were based on. */
  g_autoptr(GHashTable) replaced = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);

  g_assert_no_error (error);
  for (guint w = 0; logs[w] != NULL; w++)
    {
      g_autofree char *text = NULL;
      g_auto(GStrv) lines = NULL;

      g_assert_true (g_file_get_contents (logs[w], &text, NULL, NULL));
      lines = g_strsplit (text, "\n", -1);
      for (guint i = 0; lines[i] != NULL && lines[i][0] != '\0'; i++)
        {
          g_auto(GStrv) f = g_strsplit (lines[i], " ", -1);

          if (g_str_equal (f[0], "save") && atoi (f[2]) == atoi (f[4]))
            g_hash_table_add (replaced, g_strdup_printf ("%s %s %s", f[1], f[2], f[5]));
        }
    }
  for (guint w = 0; logs[w] != NULL; w++)
    {
      g_autofree char *text = NULL;
      g_auto(GStrv) lines = NULL;

      g_assert_true (g_file_get_contents (logs[w], &text, NULL, NULL));
      lines = g_strsplit (text, "\n", -1);
      for (guint i = 0; lines[i] != NULL && lines[i][0] != '\0'; i++)
        {
          g_auto(GStrv) f = g_strsplit (lines[i], " ", -1);

          if (g_str_equal (f[0], "counts"))
            {
              total->ops += atoi (f[1]);
              total->accepted += atoi (f[2]);
              total->stale += atoi (f[3]);
              total->busy += atoi (f[4]);
              total->immutable += atoi (f[5]);
              total->import_conflicts += atoi (f[6]);
              continue;
            }
          {
            int revision = atoi (f[2]);
            g_autoptr(LaminaConstruction) c =
              lamina_library_dup_construction (library, f[1], revision, &error);

            g_assert_no_error (error);
            if (g_str_equal (f[0], "approve"))
              {
                g_assert_cmpint (c->status, ==, LAMINA_STATUS_APPROVED);
                g_assert_cmpstr (c->approved_by, ==, f[3]);
              }
            else if (g_str_equal (f[0], "save")
                     && g_strcmp0 (c->draft_stamp, f[6]) != 0)
              {
                /* Replaced in place: by a save based on this very state. */
                g_autofree char *key = g_strdup_printf ("%s %s %s", f[1], f[2], f[6]);

                g_assert_true (g_hash_table_contains (replaced, key));
                if (atoi (f[2]) != atoi (f[4]))
                  writes[atoi (f[1] + strlen ("shared-"))]++;
              }
            else
              {
                /* The revision this write was given still holds it. */
                g_assert_cmpstr (c->description, ==, f[3]);
                if (!g_str_equal (f[0], "save") || atoi (f[2]) != atoi (f[4]))
                  writes[atoi (f[1] + strlen ("shared-"))]++;
              }
          }
        }
    }
  g_print ("# %u saves updated a draft in place\n", g_hash_table_size (replaced));
  for (guint i = 0; i < N_SHARED; i++)
    {
      g_autofree char *id = shared_id (i);
      g_autoptr(GPtrArray) history = lamina_library_dup_history (library, id, &error);

      g_assert_no_error (error);
      /* Nothing lost, nothing extra: one revision per accepted write. */
      g_assert_cmpint (history->len, ==, initial_revisions[i] + writes[i]);
      for (guint h = 0; h < history->len; h++)
        g_assert_cmpint (((LaminaRevisionInfo *) history->pdata[h])->revision, ==,
                         (int) history->len - (int) h);
    }
}

static void
test_two_processes (void)
{
  g_autofree char *path = g_build_filename (g_get_user_data_dir (), "shared.sqlite", NULL);
  const char *env = g_getenv ("LAMINA_TEST_CONCURRENT_SECONDS");
  double seconds = env ? g_ascii_strtod (env, NULL) : 4.0;
  char *logs[3] = { NULL, NULL, NULL };
  int initial[N_SHARED];
  Counts total = { 0 };
  pid_t pids[2];
  g_autoptr(GError) error = NULL;

  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);

    g_assert_no_error (error);
    for (guint i = 0; i < N_SHARED; i++)
      {
        g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, i);
        g_autofree char *id = NULL;

        c->id = shared_id (i);
        id = lamina_library_create_construction (library, c, "Author", &error);
        g_assert_no_error (error);
        initial[i] = 1;
      }
  }
  for (guint w = 0; w < 2; w++)
    {
      logs[w] = g_strdup_printf ("%s.log%u", path, w);
      pids[w] = fork ();
      g_assert_cmpint (pids[w], >=, 0);
      if (pids[w] == 0)
        {
          g_random_set_seed (1000 + w);
          run_worker (path, logs[w], w, seconds);
          _exit (0);
        }
    }
  for (guint w = 0; w < 2; w++)
    {
      int status;

      g_assert_cmpint (waitpid (pids[w], &status, 0), ==, pids[w]);
      g_assert_true (WIFEXITED (status) && WEXITSTATUS (status) == 0);
    }
  if (!lamina_hardening_check_library (path, &error))
    g_error ("library damaged by concurrent use: %s", error->message);
  check_logs (path, logs, initial, &total);
  g_print ("# figures: %u operations, %u accepted, %u refused as stale, %u busy, "
           "%u immutable, %u import conflicts reported\n", total.ops, total.accepted,
           total.stale, total.busy, total.immutable, total.import_conflicts);
  g_assert_cmpuint (total.ops, ==, total.accepted + total.stale + total.busy + total.immutable);
  /* The test provokes races: with two writers on four constructions some
   * saves must have been refused as stale. */
  g_assert_cmpuint (total.stale, >, 0);
  for (guint w = 0; w < 2; w++)
    g_free (logs[w]);
}

/* Two processes open a library that does not exist yet at the same
 * moment (two colleagues starting the app on a new office file) and each
 * saves a construction: both are kept, whoever created the file. */
static void
test_create_race (void)
{
  guint rounds = 12;

  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  for (guint round = 0; round < rounds; round++)
    {
      g_autofree char *path = g_strdup_printf ("%s/new-%u.sqlite", g_get_user_data_dir (), round);
      g_autoptr(LaminaLibrary) library = NULL;
      g_autoptr(GError) error = NULL;
      int go[2];
      pid_t pids[2];

      g_assert_cmpint (pipe (go), ==, 0);
      for (guint w = 0; w < 2; w++)
        {
          pids[w] = fork ();
          g_assert_cmpint (pids[w], >=, 0);
          if (pids[w] == 0)
            {
              LaminaLibrary *mine;
              g_autoptr(LaminaConstruction) c = NULL;
              char byte;

              close (go[1]);
              /* Both start when the pipe is closed. */
              if (read (go[0], &byte, 1) < 0)
                _exit (5);
              mine = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
              if (mine == NULL)
                {
                  g_printerr ("worker %u: %s\n", w, error->message);
                  _exit (BUSY_EXIT (error));
                }
              c = lamina_hardening_make_wall (mine, w);
              c->id = g_strdup_printf ("first-%u", w);
              g_free (lamina_library_create_construction (mine, c, "Author", &error));
              if (error != NULL)
                g_printerr ("worker %u: saving: %s\n", w, error->message);
              g_object_unref (mine);
              _exit (error == NULL ? 0 : 1);
            }
        }
      close (go[0]);
      g_usleep (20000);
      close (go[1]);
      for (guint w = 0; w < 2; w++)
        {
          int status;

          g_assert_cmpint (waitpid (pids[w], &status, 0), ==, pids[w]);
          g_assert_true (WIFEXITED (status));
          g_assert_cmpint (WEXITSTATUS (status), ==, 0);
        }
      if (!lamina_hardening_check_library (path, &error))
        g_error ("new library damaged: %s", error->message);
      library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
      for (guint w = 0; w < 2; w++)
        {
          g_autofree char *id = g_strdup_printf ("first-%u", w);
          g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, &error);

          if (c == NULL)
            g_error ("round %u: construction of worker %u lost: %s", round, w, error->message);
        }
    }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/concurrent/two-processes", test_two_processes);
  g_test_add_func ("/hardening/concurrent/create-race", test_create_race);
  return g_test_run ();
}
