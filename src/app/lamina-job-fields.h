/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-job-fields.h: what the job, entry, junction and target-set
 * dialogs share: reading a text field or a number field of a GtkEntry,
 * and a refusal that names the field, marks it and puts the focus on it. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-number.h"

G_BEGIN_DECLS

/* The entry's text without surrounding blanks; NULL when empty. */
char     *lamina_job_fields_dup_text   (GtkEntry          *entry);
/* Parses @entry for @field into @value (NAN for an empty optional
 * field).  On a fault, @error says "@label: why", the entry is marked
 * and focused. */
gboolean  lamina_job_fields_parse      (GtkEntry          *entry,
                                        const char        *label,
                                        LaminaNumberField  field,
                                        gboolean           optional,
                                        double            *value,
                                        GError           **error);
/* Sets @entry to @value with up to @digits decimals ("" for NAN). */
void      lamina_job_fields_set_number (GtkEntry          *entry,
                                        double             value,
                                        int                digits);
/* Refuses (INVALID) naming @label and marks @entry (NULL: no widget). */
gboolean  lamina_job_fields_refuse     (GtkEntry          *entry,
                                        const char        *label,
                                        const char        *message,
                                        GError           **error);
/* Clears the marks of @entry. */
void      lamina_job_fields_clear_mark (GtkEntry          *entry);
/* Lists @history (LaminaRevisionInfo*, newest first) in @dropdown, each
 * revision with its review status, @marked's with @mark after it, and
 * selects @selected; @revisions gets the numbers in the same order.
 * Returns how many were listed. */
guint     lamina_job_fields_fill_revisions (GtkDropDown     *dropdown,
                                            GArray          *revisions,
                                            const GPtrArray *history,
                                            int              marked,
                                            const char      *mark,
                                            int              selected);

G_END_DECLS
