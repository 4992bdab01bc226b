/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-dynamic-view.h: the dynamic characteristics (EN ISO 13786) in
 * the results panel. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_DYNAMIC_VIEW (lamina_dynamic_view_get_type ())
G_DECLARE_FINAL_TYPE (LaminaDynamicView, lamina_dynamic_view, LAMINA, DYNAMIC_VIEW, GtkWidget)

/* Shows the figures of @construction, or why they are left out; NULL
 * @result clears them. */
void        lamina_dynamic_view_update   (LaminaDynamicView        *self,
                                          const LaminaConstruction *construction,
                                          const LaminaResult       *result);
/* The text of the decrement factor shown (for tests). */
const char *lamina_dynamic_view_get_decrement_text (LaminaDynamicView *self);

G_END_DECLS
