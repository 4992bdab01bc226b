/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window-import.c: a catalogue imported from the window in a
 * worker thread (lamina-window-work.h: a connection of its own), with a
 * progress window and Cancel.  The worker reads and checks the document,
 * then waits (cancellably) while another program holds the library's
 * write lock, then writes in one transaction: all or nothing.  Cancel
 * stops it before the write; once the write has begun it ends whole or
 * not at all, so Cancel is off for that moment. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-window-private.h"

#include <glib/gi18n.h>

#include "lamina-catalogue.h"
#include "lamina-window-work.h"
#include "lamina-work-progress.h"
#include "store/lamina-library-safety.h"

typedef struct
{
  char               *path;
  char               *author;
  LaminaImportFlags   flags;
  int                 phase;      /* atomic: LaminaImportPhase */
  LaminaImportReport *report;     /* the worker's result */
} ImportJob;

static void
import_job_clear (ImportJob *job)
{
  g_free (job->path);
  g_free (job->author);
  g_clear_pointer (&job->report, lamina_import_report_free);
}

static void
import_job_release (ImportJob *job)
{
  g_rc_box_release_full (job, (GDestroyNotify) import_job_clear);
}

static gboolean
import_work (LaminaLibrary  *library,
             gpointer        data,
             GCancellable   *cancellable,
             GError        **error)
{
  ImportJob *job = data;
  g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_file (job->path, error);

  if (catalogue == NULL || g_cancellable_set_error_if_cancelled (cancellable, error))
    return FALSE;
  g_atomic_int_set (&job->phase, LAMINA_IMPORT_PHASE_WAITING);
  if (!lamina_library_wait_until_writable (library, 0, cancellable, error))
    return FALSE;
  g_atomic_int_set (&job->phase, LAMINA_IMPORT_PHASE_WRITING);
  job->report = lamina_library_import (library, catalogue, job->flags, job->author, error);
  return job->report != NULL;
}

/* ---- The progress window ------------------------------------------------ */

typedef struct
{
  LaminaWindow   *window;       /* a reference */
  LaminaWorkProgress *progress;
  GCancellable   *cancellable;
  ImportJob      *job;          /* a reference */
  char           *name;         /* the file's name, for the lines */
  guint           pulse;
  int             shown_phase;
} Import;

static void
import_free (Import *import)
{
  g_clear_handle_id (&import->pulse, g_source_remove);
  lamina_work_progress_free (import->progress);
  g_object_unref (import->cancellable);
  import_job_release (import->job);
  g_free (import->name);
  g_object_unref (import->window);
  g_free (import);
}

static gboolean
pulse_cb (gpointer data)
{
  Import *import = data;
  int phase = g_atomic_int_get (&import->job->phase);

  lamina_work_progress_set_fraction (import->progress, -1);
  if (phase != import->shown_phase)
    {
      g_autofree char *text = NULL;

      import->shown_phase = phase;
      if (phase == LAMINA_IMPORT_PHASE_WAITING)
        text = g_strdup_printf (_("“%s” is read and checked. Waiting for another program writing this library…"),
                                import->name);
      else
        text = g_strdup_printf (_("Writing “%s” to the library: all or nothing, it cannot be stopped now…"),
                                import->name);
      lamina_work_progress_set_text (import->progress, text);
      lamina_work_progress_set_can_cancel (import->progress, phase != LAMINA_IMPORT_PHASE_WRITING);
    }
  return G_SOURCE_CONTINUE;
}

static void
on_imported_cb (GObject      *source,
                GAsyncResult *result,
                gpointer      user_data)
{
  Import *import = user_data;
  g_autoptr(LaminaWindow) self = g_object_ref (import->window);
  g_autoptr(GError) error = NULL;
  gboolean ok = lamina_library_work_finish (result, &error);
  g_autoptr(LaminaImportReport) report = ok ? g_steal_pointer (&import->job->report) : NULL;

  self->import = NULL;
  import_free (import);
  if (self->library == NULL)   /* the window was closed meanwhile */
    return;
  if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    {
      lamina_window_notify (self, _("Import cancelled; nothing was written"));
      return;
    }
  if (!ok)
    {
      /* The message names the file and line; nothing was written. */
      lamina_window_notify (self, error->message);
      return;
    }
  lamina_window_refresh_list (self);
  lamina_window_show_import_report (self, report);
}

void
lamina_window_import_file (LaminaWindow      *self,
                           const char        *path,
                           LaminaImportFlags  flags,
                           const char        *author)
{
  Import *import;
  g_autofree char *text = NULL;

  g_return_if_fail (LAMINA_IS_WINDOW (self));
  g_return_if_fail (path != NULL);
  if (self->import != NULL)
    {
      lamina_window_notify (self, _("An import is running; wait for it to finish"));
      return;
    }

  import = g_new0 (Import, 1);
  import->window = g_object_ref (self);
  import->cancellable = g_cancellable_new ();
  import->job = g_rc_box_new0 (ImportJob);
  import->job->path = g_strdup (path);
  import->job->author = author != NULL && *author ? g_strdup (author) : NULL;
  import->job->flags = flags;
  import->name = g_path_get_basename (path);
  import->shown_phase = LAMINA_IMPORT_PHASE_READING;

  text = g_strdup_printf (_("Reading and checking “%s”…"), import->name);
  import->progress = lamina_work_progress_new (GTK_WINDOW (self), _("Import Catalogue XML"), text,
                                               import->cancellable);
  import->pulse = g_timeout_add (100, pulse_cb, import);

  self->import = import;
  lamina_library_work_run_async (self->library, import_work, g_rc_box_acquire (import->job),
                                 (GDestroyNotify) import_job_release, self, import->cancellable,
                                 on_imported_cb, import);
}

LaminaImportPhase
lamina_window_get_import_phase (LaminaWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_WINDOW (self), LAMINA_IMPORT_PHASE_NONE);
  if (self->import == NULL)
    return LAMINA_IMPORT_PHASE_NONE;
  return g_atomic_int_get (&((Import *) self->import)->job->phase);
}

void
lamina_window_cancel_import (LaminaWindow *self)
{
  g_return_if_fail (LAMINA_IS_WINDOW (self));
  if (self->import != NULL)
    g_cancellable_cancel (((Import *) self->import)->cancellable);
}
