/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-window-work.c: see lamina-window-work.h. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-window-work.h"


typedef struct
{
  LaminaLibrary         *library;  /* the caller's connection (main thread only) */
  LaminaLibrary         *worker;   /* a second connection, used by the worker only */
  LaminaLibraryWorkFunc  func;
  gpointer               data;
  GDestroyNotify         data_free;
} Work;

static void
work_free (Work *work)
{
  /* The worker's connection is closed in the worker; this is the last
   * reference. */
  g_clear_object (&work->worker);
  g_clear_object (&work->library);
  if (work->data_free != NULL)
    work->data_free (work->data);
  g_free (work);
}

static void
work_in_thread (GTask        *task,
                gpointer      source,
                gpointer      task_data,
                GCancellable *cancellable)
{
  Work *work = task_data;
  GError *error = NULL;
  gboolean ok = work->func (work->worker, work->data, cancellable, &error);

  lamina_library_close (work->worker);
  if (ok)
    g_task_return_boolean (task, TRUE);
  else
    g_task_return_error (task, error);
}

void
lamina_library_work_run_async (LaminaLibrary         *library,
                               LaminaLibraryWorkFunc  func,
                               gpointer               data,
                               GDestroyNotify         data_free,
                               gpointer               source_object,
                               GCancellable          *cancellable,
                               GAsyncReadyCallback    callback,
                               gpointer               user_data)
{
  g_autoptr(GTask) task = NULL;
  g_autoptr(GError) error = NULL;
  Work *work;

  g_return_if_fail (LAMINA_IS_LIBRARY (library));
  g_return_if_fail (func != NULL);

  work = g_new0 (Work, 1);
  work->library = g_object_ref (library);
  work->func = func;
  work->data = data;
  work->data_free = data_free;
  task = g_task_new (source_object, cancellable, callback, user_data);
  g_task_set_source_tag (task, lamina_library_work_run_async);
  g_task_set_task_data (task, work, (GDestroyNotify) work_free);
  work->worker = lamina_library_open (lamina_library_get_path (library),
                                      LAMINA_LIBRARY_OPEN_EXISTING, NULL);
  if (work->worker == NULL)
    {
      /* No second connection to this library: work here and wait. */
      if (func (library, data, cancellable, &error))
        g_task_return_boolean (task, TRUE);
      else
        g_task_return_error (task, g_steal_pointer (&error));
      return;
    }
  /* The worker's connection waits for another program's lock as long as
   * a terminal would (LAMINA_BUSY_TIMEOUT, else 60 s): the window does
   * not wait with it. */
  g_task_run_in_thread (task, work_in_thread);
}

gboolean
lamina_library_work_finish (GAsyncResult  *result,
                            GError       **error)
{
  Work *work;

  g_return_val_if_fail (G_IS_TASK (result), FALSE);
  work = g_task_get_task_data (G_TASK (result));
  /* The window's connection: the rows, flags and list again now. */
  lamina_library_check_for_changes (work->library);
  return g_task_propagate_boolean (G_TASK (result), error);
}

gpointer
lamina_library_work_get_data (GAsyncResult *result)
{
  Work *work;

  g_return_val_if_fail (G_IS_TASK (result), NULL);
  work = g_task_get_task_data (G_TASK (result));
  return work->data;
}
