/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-materials-window.h: the library's materials, to add and edit.
 * Changing one flags the constructions that use it ("material data changed
 * since review"); they change only when the user updates them. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

GtkWindow *lamina_materials_window_present   (GtkWindow     *parent,
                                              LaminaLibrary *library);
/* For tests: a widget of row @index ("name", "category", "lambda",
 * "density", "heat", "mu", "emissivity", "source", "notes", "error",
 * "save"). */
GtkWidget *lamina_materials_window_get_field (GtkWindow     *window,
                                              guint          index,
                                              const char    *name);

G_END_DECLS
