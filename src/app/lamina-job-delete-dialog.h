/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-delete-dialog.h: deleting a job with its schedule, after
 * asking — by name and entry count, and for a job submitted or built only
 * once its job number is typed in full. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_JOB_DELETE_DIALOG (lamina_job_delete_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaJobDeleteDialog, lamina_job_delete_dialog, LAMINA, JOB_DELETE_DIALOG, GtkWindow)

/* Asks about @job (copied).  "deleted" (the job's id) is emitted when
 * the library has deleted it; the dialog then closes. */
LaminaJobDeleteDialog *lamina_job_delete_dialog_new     (GtkWindow             *parent,
                                                         LaminaLibrary         *library,
                                                         const LaminaJob       *job);
/* What the architect must type before Delete is offered: the job number
 * (its id when it has none) for a job submitted or built, else NULL. */
const char            *lamina_job_delete_dialog_get_key (LaminaJobDeleteDialog *self);
/* The Delete button's act: refused (INVALID) while the typed text is not
 * the key; otherwise the library's refusal, if any. */
gboolean               lamina_job_delete_dialog_delete  (LaminaJobDeleteDialog *self,
                                                         GError               **error);

G_END_DECLS
