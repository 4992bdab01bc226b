/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-junction-dialog.h: a linear thermal bridge entered by hand
 * in a job's schedule — name, ψ and length. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_JOB_JUNCTION_DIALOG (lamina_job_junction_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaJobJunctionDialog, lamina_job_junction_dialog, LAMINA, JOB_JUNCTION_DIALOG, GtkWindow)

/* Junction @n of the stored job @job_id, or a new one when @n is 0; NULL
 * with @error when there is no such job or junction.  "saved" is emitted
 * when the library took it. */
LaminaJobJunctionDialog *lamina_job_junction_dialog_new  (GtkWindow     *parent,
                                                          LaminaLibrary *library,
                                                          const char    *job_id,
                                                          int            n,
                                                          GError       **error);
gboolean                 lamina_job_junction_dialog_save (LaminaJobJunctionDialog *self,
                                                          GError                 **error);

G_END_DECLS
