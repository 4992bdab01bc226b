/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-entry-dialog.h: one entry of a job's schedule — the pinned
 * revision (a move is recorded in the job's log), the use, the location
 * note and the area. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_JOB_ENTRY_DIALOG (lamina_job_entry_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaJobEntryDialog, lamina_job_entry_dialog, LAMINA, JOB_ENTRY_DIALOG, GtkWindow)

/* Edits entry @n of the stored job @job_id; NULL with @error when there
 * is no such job or entry.  "saved" is emitted when the library took it. */
LaminaJobEntryDialog *lamina_job_entry_dialog_new  (GtkWindow     *parent,
                                                    LaminaLibrary *library,
                                                    const char    *job_id,
                                                    int            n,
                                                    GError       **error);
gboolean              lamina_job_entry_dialog_save (LaminaJobEntryDialog *self,
                                                    GError              **error);

G_END_DECLS
