/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-history-window.h: a construction's revisions, with who, when,
 * the review state and what changed from the revision before; and any two
 * revisions compared. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_HISTORY_WINDOW (lamina_history_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaHistoryWindow, lamina_history_window, LAMINA, HISTORY_WINDOW, GtkWindow)

/* The history of construction @id, transient for @parent (may be NULL). */
LaminaHistoryWindow *lamina_history_window_new     (GtkWindow     *parent,
                                                    LaminaLibrary *library,
                                                    const char    *id);
/* The same, presented. */
GtkWindow           *lamina_history_window_present (GtkWindow     *parent,
                                                    LaminaLibrary *library,
                                                    const char    *id);

G_END_DECLS
