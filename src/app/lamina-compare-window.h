/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-compare-window.h: two build-ups side by side, the same page as
 * the comparison PDF, with B chosen by id or code (ID@N for a revision). */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_COMPARE_WINDOW (lamina_compare_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaCompareWindow, lamina_compare_window, LAMINA, COMPARE_WINDOW, GtkWindow)

/* A and B are copied; @b may be NULL (chosen in the window). */
LaminaCompareWindow *lamina_compare_window_new    (GtkWindow                *parent,
                                                   LaminaLibrary            *library,
                                                   const LaminaConstruction *a,
                                                   const char               *label_a,
                                                   const LaminaConstruction *b,
                                                   const char               *label_b);
/* B from the library by id or code, "ID@N" for revision N; FALSE with
 * the message shown. */
gboolean             lamina_compare_window_set_b  (LaminaCompareWindow      *self,
                                                   const char               *key);
gboolean             lamina_compare_window_export (LaminaCompareWindow      *self,
                                                   const char               *path,
                                                   GError                  **error);

G_END_DECLS
