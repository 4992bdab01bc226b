/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-work-progress.h: the small window that stands beside work done
 * in a worker thread: a line, a bar (a fraction, or pulsing while the
 * amount is unknown) and Cancel, which cancels the work's GCancellable. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

typedef struct _LaminaWorkProgress LaminaWorkProgress;

/* Presented at once, modal to @parent. */
LaminaWorkProgress *lamina_work_progress_new      (GtkWindow          *parent,
                                                   const char         *title,
                                                   const char         *text,
                                                   GCancellable       *cancellable);
void                lamina_work_progress_set_text (LaminaWorkProgress *self,
                                                   const char         *text);
/* @fraction < 0: pulses. */
void                lamina_work_progress_set_fraction (LaminaWorkProgress *self,
                                                       double              fraction);
/* Off while a step runs that cannot be stopped (an all-or-nothing write). */
void                lamina_work_progress_set_can_cancel (LaminaWorkProgress *self,
                                                         gboolean            can_cancel);
/* Closes the window. */
void                lamina_work_progress_free     (LaminaWorkProgress *self);

G_END_DECLS
