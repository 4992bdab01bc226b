/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-materials-window.h: the library's materials, to add and edit.
 * Changing one flags the constructions that use it ("material data changed
 * since review"); they change only when the user updates them. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_MATERIALS_WINDOW (lamina_materials_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaMaterialsWindow, lamina_materials_window, LAMINA, MATERIALS_WINDOW, GtkWindow)

/* @library's materials, one LaminaMaterialRow each; transient for @parent
 * (may be NULL). */
LaminaMaterialsWindow *lamina_materials_window_new     (GtkWindow     *parent,
                                                        LaminaLibrary *library);
/* The same, presented. */
/* TRUE while a saved material is written and the library re-flagged in a
 * worker thread (the list is insensitive, a bar pulses). */
gboolean               lamina_materials_window_is_saving (LaminaMaterialsWindow *self);
GtkWindow             *lamina_materials_window_present (GtkWindow     *parent,
                                                        LaminaLibrary *library);

G_END_DECLS
