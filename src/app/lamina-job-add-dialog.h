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
/* Chooses result @index: the revisions of its construction are listed,
 * the default selected (the latest approved, else the latest, with a
 * note that it is not approved). */
void        lamina_job_add_dialog_choose      (LaminaJobAddDialog *self,
                                               guint               index);
/* The revision selected for the chosen construction (0: none chosen);
 * set_revision selects @revision, FALSE when it is not listed. */
int         lamina_job_add_dialog_get_revision (LaminaJobAddDialog *self);
gboolean    lamina_job_add_dialog_set_revision (LaminaJobAddDialog *self,
                                                int                 revision);
/* Adds result @index with @area (NAN: none) to the job and saves it,
 * pinning the revision selected when @index is the chosen result, else
 * the default one (with "As a job variant" ticked, a copy of the chosen revision made for
 * the job, linked to it as its origin); the dialog closes. */
gboolean    lamina_job_add_dialog_add         (LaminaJobAddDialog *self,
                                               guint               index,
                                               double              area,
                                               GError            **error);

G_END_DECLS
