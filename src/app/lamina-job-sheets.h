/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-sheets.h: a job's sheet set written in a worker thread (a
 * connection of its own, lamina-window-work.h) with a progress window and
 * Cancel.  The PDF is written to a temporary file and renamed at the end,
 * so Cancel or a failure leaves no partial file and an earlier file as it
 * was. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

/* Checks job @job_id afresh and writes its sheet set to @path; @practice
 * (or NULL) heads the sheets.  @cancellable (or NULL: one of its own)
 * is what the progress window's Cancel cancels.  @callback gets a
 * GAsyncResult for _finish. */
void     lamina_job_sheets_write_async  (GtkWindow           *parent,
                                         LaminaLibrary       *library,
                                         const char          *job_id,
                                         const char          *path,
                                         const char          *practice,
                                         GCancellable        *cancellable,
                                         GAsyncReadyCallback  callback,
                                         gpointer             user_data);
/* FALSE with the reason (G_IO_ERROR_CANCELLED after Cancel). */
gboolean lamina_job_sheets_write_finish (GAsyncResult        *result,
                                         GError             **error);

G_END_DECLS
