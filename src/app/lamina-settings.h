/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-settings.h: the app's GSettings, wherever the schema is. */
#pragma once

#include <gio/gio.h>

G_BEGIN_DECLS

/* The settings of APP_ID: from the installed schema; from the build
 * folder's when run from there; otherwise, with a warning, from a copy
 * built into the program, kept in memory for the session. */
GSettings *lamina_settings_new (void);

/* Applies the "style" setting (system, light, dark) to GTK now and
 * whenever it changes; @settings must live as long as the app. */
void       lamina_settings_follow_style (GSettings *settings);

G_END_DECLS
