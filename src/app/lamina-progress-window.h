/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-progress-window.h: a small modal window over long work done in
 * a worker: an optional line of text, a progress bar and Cancel, which
 * cancels the work's GCancellable.  The caller moves the bar and destroys
 * the window when the work is done. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define LAMINA_TYPE_PROGRESS_WINDOW (lamina_progress_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaProgressWindow, lamina_progress_window, LAMINA, PROGRESS_WINDOW, GtkWindow)

LaminaProgressWindow *lamina_progress_window_new      (GtkWindow            *parent,
                                                       const char           *title,
                                                       GCancellable         *cancellable);
GtkProgressBar       *lamina_progress_window_get_bar  (LaminaProgressWindow *self);
/* A line above the bar (hidden while NULL or empty). */
void                  lamina_progress_window_set_text (LaminaProgressWindow *self,
                                                       const char           *text);

G_END_DECLS
