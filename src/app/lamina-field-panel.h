/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-field-panel.h: the 2-D check (EN ISO 10211) in the results panel.
 * Shown only when the EN ISO 6946 result carries a method-limit warning
 * (lamina_field_is_advised); runs lamina_field_calculate in a worker
 * thread (GTask) with progress and cancel, then shows U(2-D) beside
 * U(6946), the coldest inner surface point and the temperature field. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-field.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_FIELD_PANEL (lamina_field_panel_get_type ())
G_DECLARE_FINAL_TYPE (LaminaFieldPanel, lamina_field_panel, LAMINA, FIELD_PANEL, GtkWidget)

GtkWidget   *lamina_field_panel_new (void);
/* The construction on screen and its EN ISO 6946 result (either may be
 * NULL).  A changed construction cancels a running check and drops a
 * finished one: it no longer applies. */
void         lamina_field_panel_set_construction (LaminaFieldPanel         *self,
                                                  const LaminaConstruction *construction,
                                                  const LaminaResult       *result);
/* Starts the check (as the button does). */
void         lamina_field_panel_run    (LaminaFieldPanel *self);
void         lamina_field_panel_cancel (LaminaFieldPanel *self);
gboolean     lamina_field_panel_is_running (LaminaFieldPanel *self);
/* The finished check, or NULL. */
const LaminaFieldResult *lamina_field_panel_get_result (LaminaFieldPanel *self);
/* The text of the figures line (for tests and accessibility). */
const char  *lamina_field_panel_get_status_text (LaminaFieldPanel *self);

G_END_DECLS
