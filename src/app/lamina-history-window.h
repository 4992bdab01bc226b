/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-history-window.h: a construction's revisions, with who, when,
 * the review state and what changed from the revision before. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

void lamina_history_window_present (GtkWindow     *parent,
                                    LaminaLibrary *library,
                                    const char    *id);

G_END_DECLS
