/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-add-dialog.h: adding a library construction to a job's
 * schedule — search, with the target filter set to the chosen use. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_JOB_ADD_DIALOG (lamina_job_add_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaJobAddDialog, lamina_job_add_dialog, LAMINA, JOB_ADD_DIALOG, GtkWindow)

/* @job and @targets (NULL: none) are copied. */
LaminaJobAddDialog *lamina_job_add_dialog_new (GtkWindow             *parent,
                                               LaminaLibrary         *library,
                                               const LaminaJob       *job,
                                               const LaminaTargetSet *targets);
void        lamina_job_add_dialog_set_use     (LaminaJobAddDialog *self,
                                               const char         *use);
void        lamina_job_add_dialog_set_search  (LaminaJobAddDialog *self,
                                               const char         *text);
/* The filter in force: the use's maximum U (NAN: none) and element (-1). */
double      lamina_job_add_dialog_get_max_u   (LaminaJobAddDialog *self);
int         lamina_job_add_dialog_get_element (LaminaJobAddDialog *self);
/* The constructions listed (LaminaSummary*, borrowed). */
GPtrArray  *lamina_job_add_dialog_get_results (LaminaJobAddDialog *self);
/* Adds result @index with @area (NAN: none) to the job and saves it
 * (with "As a job variant" ticked, a copy of the chosen revision made for
 * the job, linked to it as its origin); the dialog closes. */
gboolean    lamina_job_add_dialog_add         (LaminaJobAddDialog *self,
                                               guint               index,
                                               double              area,
                                               GError            **error);

G_END_DECLS
