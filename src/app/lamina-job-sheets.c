/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-sheets.c: see lamina-job-sheets.h. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-job-sheets.h"

#include <glib/gi18n.h>

#include "lamina-revision-diff.h"
#include "lamina-sheet.h"
#include "lamina-window-work.h"
#include "lamina-work-progress.h"

typedef struct
{
  char         *job_id;
  char         *path;
  char         *practice;
  char         *library_path;
  double        moisture_limit;
  GCancellable *cancellable;
  int           done;        /* atomic: sheets drawn */
  int           total;       /* atomic */
} SheetsJob;

static void
sheets_job_clear (SheetsJob *job)
{
  g_free (job->job_id);
  g_free (job->path);
  g_free (job->practice);
  g_free (job->library_path);
  g_clear_object (&job->cancellable);
}

static void
sheets_job_release (SheetsJob *job)
{
  g_rc_box_release_full (job, (GDestroyNotify) sheets_job_clear);
}

static void
on_sheet_cb (gpointer data,
             guint    done,
             guint    total)
{
  SheetsJob *job = data;

  g_atomic_int_set (&job->total, (int) total);
  g_atomic_int_set (&job->done, (int) done);
}

static gboolean
keep_going_cb (gpointer   data,
               GError   **error)
{
  SheetsJob *job = data;

  return !g_cancellable_set_error_if_cancelled (job->cancellable, error);
}

static gboolean
sheets_work (LaminaLibrary  *library,
             gpointer        data,
             GCancellable   *cancellable,
             GError        **error)
{
  SheetsJob *job = data;
  g_autoptr(LaminaJobReport) report = NULL;
  LaminaSheetOptions options;

  /* A fresh check of its own: the variants' notes go on the sheets only. */
  report = lamina_library_check_job (library, job->job_id, error);
  if (report == NULL || g_cancellable_set_error_if_cancelled (cancellable, error))
    return FALSE;
  lamina_revision_diff_note_variants (library, report);
  lamina_sheet_options_init (&options);
  options.practice = job->practice;
  options.library = job->library_path;
  options.moisture_limit = job->moisture_limit;
  return lamina_sheet_write_job_full (job->path, TRUE, &options, report->job, report->targets,
                                      report->check, on_sheet_cb, keep_going_cb, job, error);
}

typedef struct
{
  GTask              *task;      /* the caller's */
  SheetsJob          *job;       /* a reference */
  LaminaWorkProgress *progress;
  guint               timeout;
} Sheets;

static gboolean
show_progress_cb (gpointer data)
{
  Sheets *sheets = data;
  int total = g_atomic_int_get (&sheets->job->total);

  lamina_work_progress_set_fraction (sheets->progress,
                                     total > 0 ? (double) g_atomic_int_get (&sheets->job->done) / total : -1);
  return G_SOURCE_CONTINUE;
}

static void
on_written_cb (GObject      *source,
               GAsyncResult *result,
               gpointer      user_data)
{
  Sheets *sheets = user_data;
  GError *error = NULL;

  g_clear_handle_id (&sheets->timeout, g_source_remove);
  lamina_work_progress_free (sheets->progress);
  if (lamina_library_work_finish (result, &error))
    g_task_return_boolean (sheets->task, TRUE);
  else
    g_task_return_error (sheets->task, error);
  g_object_unref (sheets->task);
  sheets_job_release (sheets->job);
  g_free (sheets);
}

void
lamina_job_sheets_write_async (GtkWindow           *parent,
                               LaminaLibrary       *library,
                               const char          *job_id,
                               const char          *path,
                               const char          *practice,
                               GCancellable        *cancellable,
                               GAsyncReadyCallback  callback,
                               gpointer             user_data)
{
  Sheets *sheets = g_new0 (Sheets, 1);
  SheetsJob *job = g_rc_box_new0 (SheetsJob);
  g_autofree char *name = g_path_get_basename (path);
  g_autofree char *text = g_strdup_printf (_("Writing the job’s sheet set to “%s”…"), name);

  g_return_if_fail (LAMINA_IS_LIBRARY (library));
  g_return_if_fail (job_id != NULL && path != NULL);

  job->job_id = g_strdup (job_id);
  job->path = g_strdup (path);
  job->practice = practice != NULL && *practice ? g_strdup (practice) : NULL;
  job->library_path = g_strdup (lamina_library_get_path (library));
  job->moisture_limit = lamina_library_get_moisture_limit (library);
  job->cancellable = cancellable ? g_object_ref (cancellable) : g_cancellable_new ();
  sheets->task = g_task_new (NULL, job->cancellable, callback, user_data);
  g_task_set_source_tag (sheets->task, lamina_job_sheets_write_async);
  sheets->job = job;
  sheets->progress = lamina_work_progress_new (parent, _("Print the Job’s Sheet Set"), text, job->cancellable);
  sheets->timeout = g_timeout_add (100, show_progress_cb, sheets);
  lamina_library_work_run_async (library, sheets_work, g_rc_box_acquire (job),
                                 (GDestroyNotify) sheets_job_release, NULL, job->cancellable,
                                 on_written_cb, sheets);
}

gboolean
lamina_job_sheets_write_finish (GAsyncResult  *result,
                                GError       **error)
{
  g_return_val_if_fail (g_task_is_valid (result, NULL), FALSE);
  return g_task_propagate_boolean (G_TASK (result), error);
}
