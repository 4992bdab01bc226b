/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-safety-bar.h: the line under the header that says what the
 * user must know about the library itself: that it is read-only, that a
 * write is waiting for another program, that the day's backup failed. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_SAFETY_BAR (lamina_safety_bar_get_type ())
G_DECLARE_FINAL_TYPE (LaminaSafetyBar, lamina_safety_bar, LAMINA, SAFETY_BAR, GtkBox)

/* Shows the read-only state of @library at once, takes its wait
 * function, and makes the day's backup in a worker thread (its own
 * connection to the file). */
GtkWidget  *lamina_safety_bar_new      (LaminaLibrary   *library);
/* The line shown, or NULL when hidden. */
const char *lamina_safety_bar_get_text (LaminaSafetyBar *self);

G_END_DECLS
