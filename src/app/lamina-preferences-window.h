/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-preferences-window.h: practice and reviewer names, default design
 * conditions and the snap step, bound to GSettings. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define LAMINA_TYPE_PREFERENCES_WINDOW (lamina_preferences_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaPreferencesWindow, lamina_preferences_window, LAMINA, PREFERENCES_WINDOW, GtkWindow)

GtkWindow *lamina_preferences_window_new (GtkWindow *parent);

G_END_DECLS
