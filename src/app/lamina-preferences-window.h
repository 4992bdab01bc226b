/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-preferences-window.h: practice and reviewer names, default design
 * conditions and the snap step, bound to GSettings. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_PREFERENCES_WINDOW (lamina_preferences_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaPreferencesWindow, lamina_preferences_window, LAMINA, PREFERENCES_WINDOW, GtkWindow)

GtkWindow *lamina_preferences_window_new (GtkWindow *parent);
/* Shows the settings kept in @library (the office's moisture limit). */
void       lamina_preferences_window_set_library (LaminaPreferencesWindow *self,
                                                  LaminaLibrary           *library);
/* What the Apply button does (for tests). */
void       lamina_preferences_window_apply_limit (LaminaPreferencesWindow *self);

G_END_DECLS
