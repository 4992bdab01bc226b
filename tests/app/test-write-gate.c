/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window while another program holds the library's write lock, under
 * Xvfb, with a real second process holding it (this program run with
 * --hold, SQLite's BEGIN IMMEDIATE: the WAL write lock).  The window's
 * edits wait behind a banner that names the holder, with Cancel; the main
 * loop keeps running; the edits made meanwhile are written once when the
 * lock is free (no lost edit, no double write); Cancel writes nothing and
 * the edit on screen is saved with the next change.  Common practice for
 * a desktop program (no standard applies): the window never waits on
 * another program. */
#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <sqlite3.h>
#include <stdio.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "lamina-application.h"
#include "lamina-catalogue.h"
#include "lamina-construction-item.h"
#include "lamina-demo.h"
#include "lamina-editor-state.h"
#include "lamina-job-sheets.h"
#include "lamina-window-private.h"
#include "lamina-write-gate.h"
#include "lamina-app-test-util.h"

static const char *self_path;

/* ---- The second process ------------------------------------------------ */

static int
hold_main (const char *path)
{
  sqlite3 *db = NULL;
  char line[16];

  if (sqlite3_open (path, &db) != SQLITE_OK)
    return 2;
  sqlite3_busy_timeout (db, 10000);
  if (sqlite3_exec (db, "BEGIN IMMEDIATE;", NULL, NULL, NULL) != SQLITE_OK)
    return 3;
  printf ("held\n");
  fflush (stdout);
  /* until the test says so (a line or end of input) */
  if (fgets (line, sizeof line, stdin) == NULL)
    line[0] = '\0';
  sqlite3_exec (db, "ROLLBACK;", NULL, NULL, NULL);
  sqlite3_close (db);
  return 0;
}

typedef struct
{
  GPid pid;
  int  in;
} Holder;

static void
hold (Holder     *h,
      const char *path)
{
  g_autoptr(GError) error = NULL;
  const char *argv[] = { self_path, "--hold", path, NULL };
  char buffer[16] = { 0 };
  int out = -1;
  ssize_t n;

  g_assert_true (g_spawn_async_with_pipes (NULL, (char **) argv, NULL, G_SPAWN_DO_NOT_REAP_CHILD, NULL, NULL,
                                           &h->pid, &h->in, &out, NULL, &error));
  g_assert_no_error (error);
  /* the child says when it holds the lock: no sleeping here */
  n = read (out, buffer, sizeof buffer - 1);
  close (out);
  g_assert_cmpint (n, >, 0);
  g_assert_cmpstr (buffer, ==, "held\n");
}

static void
release (Holder *h)
{
  int status = 0;

  g_assert_cmpint (write (h->in, "\n", 1), ==, 1);
  close (h->in);
  g_assert_cmpint (waitpid (h->pid, &status, 0), ==, h->pid);
  g_spawn_close_pid (h->pid);
  g_assert_true (WIFEXITED (status));
  g_assert_cmpint (WEXITSTATUS (status), ==, 0);
}

/* ---- The window ---------------------------------------------------------- */

typedef struct
{
  char            *dir;
  char            *path;
  LaminaLibrary   *library;
  LaminaWindow    *window;
  LaminaWriteGate *gate;
  char            *id;
} Fixture;

static void
fixture_setup (Fixture       *f,
               gconstpointer  data)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstructionItem) item = NULL;

  f->dir = g_dir_make_tmp ("lamina-gate-XXXXXX", &error);
  g_assert_no_error (error);
  f->path = g_build_filename (f->dir, "library.sqlite", NULL);
  f->library = lamina_library_open (f->path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_demo_load (f->library, &error));
  lamina_application_load_style ();
  f->window = lamina_window_new (NULL, f->library);
  f->gate = f->window->write_gate;
  gtk_window_present (GTK_WINDOW (f->window));
  wait_for_draw (GTK_WIDGET (f->window));
  /* a draft: deleting it asks nothing first */
  for (guint i = 0; f->id == NULL; i++)
    {
      item = g_list_model_get_item (G_LIST_MODEL (lamina_window_get_list (f->window)), i);
      g_assert_nonnull (item);
      if (lamina_construction_item_get_summary (item)->status == LAMINA_STATUS_DRAFT)
        f->id = g_strdup (lamina_construction_item_get_id (item));
      g_clear_object (&item);
    }
  g_assert_true (lamina_window_open (f->window, f->id, &error));
  g_assert_no_error (error);
}

static void
fixture_teardown (Fixture       *f,
                  gconstpointer  data)
{
  gtk_window_destroy (GTK_WINDOW (f->window));
  lamina_library_close (f->library);
  g_clear_object (&f->library);
  remove_test_dir (f->dir);
  g_free (f->dir);
  g_free (f->path);
  g_free (f->id);
}

/* The first layer @delta mm thicker, as one committed edit; returns the
 * seconds the call took on the main thread. */
static double
thicken (Fixture *f,
         double   delta)
{
  g_autoptr(GError) error = NULL;
  const LaminaConstruction *state = lamina_document_get_construction (f->window->document);
  const LaminaLayer *layer = state->layers->pdata[0];
  LaminaConstruction *next = lamina_edit_set_thickness (state, 0, layer->thickness + delta, &error);
  gint64 start = g_get_monotonic_time ();

  g_assert_no_error (error);
  lamina_document_apply (f->window->document, next, NULL, LAMINA_APPLY_DEFAULT);
  return (g_get_monotonic_time () - start) / (double) G_USEC_PER_SEC;
}

static double
stored_thickness (Fixture *f)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) stored = lamina_library_dup_construction (f->library, f->id, 0, &error);

  g_assert_no_error (error);
  return ((LaminaLayer *) stored->layers->pdata[0])->thickness;
}

static guint
n_revisions (Fixture *f)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) history = lamina_library_dup_history (f->library, f->id, &error);

  g_assert_no_error (error);
  return history->len;
}

static gboolean
holder_named (gpointer data)
{
  Fixture *f = data;
  const char *text = lamina_write_gate_get_text (f->gate);

  return text != NULL && strstr (text, "test-app-write-gate") != NULL;
}

static gboolean
gate_done (gpointer data)
{
  Fixture *f = data;

  return !lamina_write_gate_is_waiting (f->gate);
}

static gboolean
tick_cb (gpointer data)
{
  (*(guint *) data)++;
  return G_SOURCE_CONTINUE;
}

static gboolean
ticked (gpointer data)
{
  return *(guint *) data >= 3;
}

static void
test_edits_wait (Fixture       *f,
                 gconstpointer  data)
{
  double d0 = stored_thickness (f);
  guint revisions = n_revisions (f);
  g_autofree char *pid = NULL;
  guint ticks = 0, tick;
  Holder h;

  hold (&h, f->path);
  pid = g_strdup_printf ("process %ld", (long) h.pid);
  /* The window's own connection waits a moment (0.2 s), not the 15 s it
   * waited before; the bound is generous and not a performance check. */
  g_assert_cmpfloat (thicken (f, 10), <, 5);
  g_assert_true (lamina_write_gate_is_waiting (f->gate));
  g_assert_cmpuint (lamina_write_gate_get_n_waiting (f->gate), ==, 1);
  g_assert_nonnull (strstr (lamina_write_gate_get_text (f->gate), "Waiting for another program writing this library"));
  /* the worker names the holder, and the main loop runs meanwhile */
  wait_until (holder_named, f, 20);
  g_assert_nonnull (strstr (lamina_write_gate_get_text (f->gate), pid));
  tick = g_timeout_add (10, tick_cb, &ticks);
  wait_until (ticked, &ticks, 20);
  g_source_remove (tick);
  {
    g_autofree char *png = g_build_filename (g_getenv ("LAMINA_BUILD_DIR") ? g_getenv ("LAMINA_BUILD_DIR") : ".",
                                             "tests", "app", "write-gate.png", NULL);

    wait_for_draw (GTK_WIDGET (f->window));
    save_png (GTK_WIDGET (f->window), png);
    g_test_message ("window waiting for the lock rendered to %s", png);
  }

  /* A second edit joins the waiting save: still one write, none done. */
  g_assert_cmpfloat (thicken (f, 10), <, 5);
  g_assert_cmpuint (lamina_write_gate_get_n_waiting (f->gate), ==, 1);
  g_assert_cmpfloat (stored_thickness (f), ==, d0);
  /* A review act is refused while edits wait, and says why. */
  g_settings_set_string (f->window->settings, "reviewer-name", "Bo Checker");
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.mark-checked", NULL);
  g_assert_cmpuint (lamina_write_gate_get_n_waiting (f->gate), ==, 1);
  g_assert_nonnull (strstr (f->window->notice, "Not now"));

  release (&h);
  wait_until (gate_done, f, 20);
  /* Both edits, written once. */
  g_assert_cmpfloat (stored_thickness (f), ==, d0 + 20);
  g_assert_cmpuint (n_revisions (f), <=, revisions + 1);
  g_assert_null (lamina_write_gate_get_text (f->gate));
}

static void
test_cancel (Fixture       *f,
             gconstpointer  data)
{
  g_autoptr(GError) error = NULL;
  double d0 = stored_thickness (f);
  Holder h;

  hold (&h, f->path);
  thicken (f, 10);
  g_assert_true (lamina_write_gate_is_waiting (f->gate));
  lamina_write_gate_cancel (f->gate);
  g_assert_false (lamina_write_gate_is_waiting (f->gate));
  g_assert_nonnull (strstr (lamina_write_gate_get_text (f->gate), "nothing of this was written"));
  release (&h);
  /* nothing was written; the edit is still on screen ... */
  g_assert_cmpfloat (stored_thickness (f), ==, d0);
  g_assert_cmpfloat (((LaminaLayer *) lamina_document_get_construction (f->window->document)->layers->pdata[0])->thickness,
                     ==, d0 + 10);
  /* ... and is saved with the next commit */
  g_assert_true (lamina_document_commit (f->window->document, &error));
  g_assert_no_error (error);
  g_assert_cmpfloat (stored_thickness (f), ==, d0 + 10);
}

/* A deletion asked for while an edit waits is written after it. */
static void
test_delete_queued (Fixture       *f,
                    gconstpointer  data)
{
  double d0 = stored_thickness (f);
  Holder h;

  hold (&h, f->path);
  thicken (f, 5);
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.delete", NULL);
  g_assert_cmpuint (lamina_write_gate_get_n_waiting (f->gate), ==, 2);
  release (&h);
  wait_until (gate_done, f, 20);
  {
    g_autoptr(GError) error = NULL;
    g_autoptr(LaminaConstruction) gone = lamina_library_dup_construction (f->library, f->id, 0, &error);

    g_assert_null (gone);
    g_assert_nonnull (error);
  }
  g_assert_null (f->window->document);
  /* undo brings it back with the edit */
  gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo-delete", NULL);
  g_assert_cmpfloat (stored_thickness (f), ==, d0 + 5);
}

static gint64
count_all (LaminaLibrary *library)
{
  LaminaLibraryQuery q;

  lamina_library_query_init (&q);
  return lamina_library_count (library, &q, NULL);
}

typedef struct
{
  LaminaWindow      *window;
  LaminaImportPhase  phase;
} PhaseWait;

static gboolean
phase_reached (gpointer data)
{
  PhaseWait *w = data;

  return lamina_window_get_import_phase (w->window) == w->phase;
}

/* The window's import runs in a worker: it reads the document, waits
 * (cancellably) while another program holds the lock, and writes all or
 * nothing.  Cancelled while waiting, nothing is written; then whole. */
static void
test_import (Fixture       *f,
             gconstpointer  data)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) catalogue = lamina_library_export (f->library, NULL, &error);
  g_autofree char *xml = g_build_filename (f->dir, "office.xml", NULL);
  g_autofree char *path = g_build_filename (f->dir, "empty.sqlite", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  LaminaWindow *window;
  PhaseWait w;
  Holder h;

  g_assert_no_error (error);
  g_assert_true (lamina_catalogue_write_file (catalogue, xml, LAMINA_WRITE_DEFAULT, &error));
  g_assert_no_error (error);
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  window = lamina_window_new (NULL, library);
  gtk_window_present (GTK_WINDOW (window));
  wait_for_draw (GTK_WIDGET (window));
  g_assert_cmpint (count_all (library), ==, 0);

  hold (&h, path);
  lamina_window_import_file (window, xml, LAMINA_IMPORT_DEFAULT, "Ida Importer");
  g_assert_cmpint (lamina_window_get_import_phase (window), !=, LAMINA_IMPORT_PHASE_NONE);
  w = (PhaseWait) { window, LAMINA_IMPORT_PHASE_WAITING };
  wait_until (phase_reached, &w, 20);
  lamina_window_cancel_import (window);
  w.phase = LAMINA_IMPORT_PHASE_NONE;
  wait_until (phase_reached, &w, 20);
  release (&h);
  g_assert_cmpint (count_all (library), ==, 0);

  lamina_window_import_file (window, xml, LAMINA_IMPORT_DEFAULT, "Ida Importer");
  wait_until (phase_reached, &w, 20);
  lamina_library_check_for_changes (library);
  g_assert_cmpint (count_all (library), ==, (gint64) catalogue->constructions->len);
  gtk_window_destroy (GTK_WINDOW (window));
  lamina_library_close (library);
}

typedef struct
{
  gboolean  done;
  gboolean  ok;
  GError   *error;
} Written;

static void
on_written_cb (GObject      *source,
               GAsyncResult *result,
               gpointer      data)
{
  Written *w = data;

  w->ok = lamina_job_sheets_write_finish (result, &w->error);
  w->done = TRUE;
}

static gboolean
written (gpointer data)
{
  return ((Written *) data)->done;
}

/* Files in @dir whose names hold @part, other than @except. */
static guint
count_files (const char *dir,
             const char *part,
             const char *except)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;
  guint n = 0;

  while ((name = g_dir_read_name (d)) != NULL)
    if (strstr (name, part) != NULL && g_strcmp0 (name, except) != 0)
      n++;
  return n;
}

/* The job's sheet set in a worker: written whole; cancelled, it leaves
 * the earlier file as it was and no temporary beside it. */
static void
test_job_sheets (Fixture       *f,
                 gconstpointer  data)
{
  g_autofree char *pdf = g_build_filename (f->dir, "riverside.pdf", NULL);
  g_autoptr(GCancellable) cancellable = g_cancellable_new ();
  g_autofree char *contents = NULL;
  Written w = { 0 };
  gsize length = 0;

  g_assert_true (g_file_set_contents (pdf, "an earlier file", -1, NULL));
  g_cancellable_cancel (cancellable);
  lamina_job_sheets_write_async (GTK_WINDOW (f->window), f->library, "demo-job-riverside", pdf,
                                 "Test Practice", cancellable, on_written_cb, &w);
  wait_until (written, &w, 30);
  g_assert_false (w.ok);
  g_assert_error (w.error, G_IO_ERROR, G_IO_ERROR_CANCELLED);
  g_clear_error (&w.error);
  g_assert_true (g_file_get_contents (pdf, &contents, NULL, NULL));
  g_assert_cmpstr (contents, ==, "an earlier file");
  g_clear_pointer (&contents, g_free);
  g_assert_cmpuint (count_files (f->dir, "riverside", "riverside.pdf"), ==, 0);

  w = (Written) { 0 };
  lamina_job_sheets_write_async (GTK_WINDOW (f->window), f->library, "demo-job-riverside", pdf,
                                 "Test Practice", NULL, on_written_cb, &w);
  wait_until (written, &w, 30);
  g_assert_no_error (w.error);
  g_assert_true (w.ok);
  g_assert_true (g_file_get_contents (pdf, &contents, &length, NULL));
  g_assert_true (length > 1000 && memcmp (contents, "%PDF", 4) == 0);
  g_assert_cmpuint (count_files (f->dir, "riverside", "riverside.pdf"), ==, 0);
}

int
main (int    argc,
      char **argv)
{
  if (argc == 3 && g_str_equal (argv[1], "--hold"))
    return hold_main (argv[2]);
  self_path = argv[0];
  gtk_test_init (&argc, &argv, NULL);
  g_test_add ("/app/write-gate/edits-wait", Fixture, NULL, fixture_setup, test_edits_wait, fixture_teardown);
  g_test_add ("/app/write-gate/cancel", Fixture, NULL, fixture_setup, test_cancel, fixture_teardown);
  g_test_add ("/app/write-gate/delete-queued", Fixture, NULL, fixture_setup, test_delete_queued, fixture_teardown);
  g_test_add ("/app/write-gate/import", Fixture, NULL, fixture_setup, test_import, fixture_teardown);
  g_test_add ("/app/write-gate/job-sheets", Fixture, NULL, fixture_setup, test_job_sheets, fixture_teardown);
  return g_test_run ();
}
