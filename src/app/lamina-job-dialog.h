/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-dialog.h: a job's own data — name, number, client, site,
 * architect, status, design temperatures, climate, the ground floor's
 * plan (A and P, or B′) and target set — for a new job or an existing one.
 * Each fault names its field. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_JOB_DIALOG (lamina_job_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaJobDialog, lamina_job_dialog, LAMINA, JOB_DIALOG, GtkWindow)

/* @job NULL: a new job; else the job to edit (copied).  "saved" (with
 * the job's id) is emitted when the library took it. */
LaminaJobDialog *lamina_job_dialog_new  (GtkWindow       *parent,
                                         LaminaLibrary   *library,
                                         const LaminaJob *job);
/* Reads the fields and stores the job; the dialog closes on success. */
gboolean         lamina_job_dialog_save (LaminaJobDialog *self,
                                         GError         **error);

G_END_DECLS
