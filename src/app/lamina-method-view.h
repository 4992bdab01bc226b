/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-method-view.h: the rest of the method beside the layers: a
 * floor's plan and ground (EN ISO 13370) with U with the ground and its
 * table by B′, the tapered layer (EN ISO 6946 Annex E), an unheated space
 * outside (6.10), and the surface and air-layer conditions (Annexes C, D).
 * Each change is a pure edit (lamina-editor-state.h) into the document. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_METHOD_VIEW (lamina_method_view_get_type ())
G_DECLARE_FINAL_TYPE (LaminaMethodView, lamina_method_view, LAMINA, METHOD_VIEW, GtkWidget)

void       lamina_method_view_set_document (LaminaMethodView         *self,
                                            LaminaDocument           *document);
void       lamina_method_view_update       (LaminaMethodView         *self,
                                            const LaminaConstruction *state,
                                            const LaminaResult       *result);

G_END_DECLS
