/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-climates-window.h: the library's climates (EN ISO 13788): list,
 * add, edit the twelve monthly means, delete when no construction uses
 * one. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_CLIMATES_WINDOW (lamina_climates_window_get_type ())
G_DECLARE_FINAL_TYPE (LaminaClimatesWindow, lamina_climates_window, LAMINA, CLIMATES_WINDOW, GtkWindow)

LaminaClimatesWindow *lamina_climates_window_new     (GtkWindow     *parent,
                                                      LaminaLibrary *library);
GtkWindow            *lamina_climates_window_present (GtkWindow     *parent,
                                                      LaminaLibrary *library);
/* Shows climate @id in the form (FALSE if the library has none). */
gboolean              lamina_climates_window_select  (LaminaClimatesWindow *self,
                                                      const char           *id);
/* What the buttons do: an empty form for a new climate; validate the form
 * and store it in a worker thread (FALSE, with the reason shown and in
 * @error, when refused; TRUE when the write started: _is_saving until it
 * is done, and a refusal by the library is shown in the status line);
 * delete the climate in the form. */
void                  lamina_climates_window_new_climate (LaminaClimatesWindow *self);
gboolean              lamina_climates_window_save    (LaminaClimatesWindow *self,
                                                      GError              **error);
gboolean              lamina_climates_window_is_saving (LaminaClimatesWindow *self);
gboolean              lamina_climates_window_delete  (LaminaClimatesWindow *self,
                                                      GError              **error);

G_END_DECLS
