/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-close-keys.h: Esc and Ctrl+W close every secondary window. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* From now on every toplevel but the main window (history, materials,
 * parts, reports, preferences, file choosers) closes on Esc and Ctrl+W.
 * Once per process; later calls do nothing. */
void     lamina_close_keys_install     (void);
/* TRUE when @window has the two keys (for tests). */
gboolean lamina_close_keys_has         (GtkWindow *window);

G_END_DECLS
