/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-jobs-page.h: the Jobs view of the window — the jobs of the
 * library, one job's data, its schedule checked against its targets at a
 * glance, adding constructions from the library, and its sheet set. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-job-add-dialog.h"
#include "lamina-job-delete-dialog.h"
#include "lamina-job-dialog.h"
#include "lamina-job-entry-dialog.h"
#include "lamina-job-junction-dialog.h"
#include "lamina-target-set-dialog.h"
#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_JOBS_PAGE (lamina_jobs_page_get_type ())
G_DECLARE_FINAL_TYPE (LaminaJobsPage, lamina_jobs_page, LAMINA, JOBS_PAGE, GtkBox)

void        lamina_jobs_page_set_library   (LaminaJobsPage *self,
                                            LaminaLibrary  *library);
/* Re-reads the jobs (after a change of the library). */
void        lamina_jobs_page_reload        (LaminaJobsPage *self);
gboolean    lamina_jobs_page_select        (LaminaJobsPage *self,
                                            const char     *id);
const char *lamina_jobs_page_get_job_id    (LaminaJobsPage *self);
/* The compliance line ("4 of 5 entries meet their target …"). */
const char *lamina_jobs_page_get_summary   (LaminaJobsPage *self);
guint       lamina_jobs_page_get_n_entries (LaminaJobsPage *self);
/* Opens the add dialog with @use chosen (NULL: the first use). */
LaminaJobAddDialog *lamina_jobs_page_open_add_dialog (LaminaJobsPage *self,
                                                      const char     *use);
/* The dialogs that change a job: its data (@new_job: a new job), entry
 * @n, junction @n (0: a new one).  The page shows the job again when one
 * saves. */
LaminaJobDialog *lamina_jobs_page_open_job_dialog (LaminaJobsPage *self,
                                                   gboolean        new_job);
LaminaJobEntryDialog *lamina_jobs_page_open_entry_dialog (LaminaJobsPage *self,
                                                          int             n);
LaminaJobJunctionDialog *lamina_jobs_page_open_junction_dialog (LaminaJobsPage *self,
                                                                int             n);
/* "Delete Job…": asks about the shown job first (see
 * LaminaJobDeleteDialog); the page shows no job once it is deleted. */
LaminaJobDeleteDialog *lamina_jobs_page_open_delete_dialog (LaminaJobsPage *self);
/* The library's target sets, on the shown job's set (else a new one). */
LaminaTargetSetDialog *lamina_jobs_page_open_target_sets (LaminaJobsPage *self);
/* For a job variant (entry @n of the selected job): what differs from
 * its origin at the origin's revision (char*, sentences); NULL when the
 * entry is not a variant. */
GPtrArray  *lamina_jobs_page_dup_differences (LaminaJobsPage *self,
                                              int             n);
/* One sentence naming the jobs whose schedules pin @construction_id
 * (what the library shows for a construction). */
char       *lamina_jobs_page_dup_uses_text (LaminaJobsPage *self,
                                            const char     *construction_id);
/* Writes the sheet of entry @n of the selected job, with the job's band,
 * in its design conditions, to @path. */
gboolean    lamina_jobs_page_export_entry  (LaminaJobsPage *self,
                                            int             n,
                                            const char     *path,
                                            GError        **error);
/* Writes the selected job's sheet set to @path. */
gboolean    lamina_jobs_page_export        (LaminaJobsPage *self,
                                            const char     *path,
                                            GError        **error);

/* The sheet set written in a worker with a progress window and Cancel
 * (@cancellable, or NULL); the status line says how it ended. */
void            lamina_jobs_page_export_in_worker (LaminaJobsPage *self,
                                                   const char     *path,
                                                   GCancellable   *cancellable);

G_END_DECLS
