/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-history-window.h: a construction's revisions, with who, when,
 * the review state and what changed from the revision before; and any two
 * revisions compared. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

GtkWindow *lamina_history_window_present   (GtkWindow     *parent,
                                            LaminaLibrary *library,
                                            const char    *id);
/* For tests: the "older" and "newer" revision pickers and the "diff"
 * label; NULL when there is only one revision. */
GtkWidget *lamina_history_window_get_field (GtkWindow     *window,
                                            const char    *name);

G_END_DECLS
