/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-properties-view.h: the construction's own properties beside its
 * layers: element, heat-flow direction, outer side, description, tags and
 * notes.  Each change goes through a pure edit (lamina-editor-state.h)
 * into the document, which recalculates and saves it. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_PROPERTIES_VIEW (lamina_properties_view_get_type ())
G_DECLARE_FINAL_TYPE (LaminaPropertiesView, lamina_properties_view, LAMINA, PROPERTIES_VIEW, GtkWidget)

void       lamina_properties_view_set_document (LaminaPropertiesView *self,
                                                LaminaDocument       *document);
/* Shows @state (and the surface resistances of @result, if any). */
void       lamina_properties_view_update       (LaminaPropertiesView     *self,
                                                const LaminaConstruction *state,
                                                const LaminaResult       *result);
/* Saves what is typed in the text fields now (before a window closes). */
void       lamina_properties_view_commit       (LaminaPropertiesView *self);

G_END_DECLS
