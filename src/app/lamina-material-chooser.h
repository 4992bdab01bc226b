/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-material-chooser.h: the library's materials in a list that
 * filters as one types, by any part of a word ("fibre" finds
 * "Wood-fibre"), at a fixed height so that a dialog around it keeps still
 * while it filters.  "picked" is emitted when Enter is pressed in the
 * search or a row is activated. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-material.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_MATERIAL_CHOOSER (lamina_material_chooser_get_type ())
G_DECLARE_FINAL_TYPE (LaminaMaterialChooser, lamina_material_chooser, LAMINA, MATERIAL_CHOOSER, GtkWidget)

/* Shows @materials (LaminaMaterial *, taken): @current_id selected if it
 * is among them, else the first of category @prefer, else the first; the
 * selection scrolled into view and the search focused. */
void                  lamina_material_chooser_set_materials (LaminaMaterialChooser *self,
                                                             GPtrArray             *materials,
                                                             LaminaCategory         prefer,
                                                             const char            *current_id);
/* The material picked (among all of them, whatever the filter shows), or
 * NULL. */
const LaminaMaterial *lamina_material_chooser_get_material  (LaminaMaterialChooser *self);

G_END_DECLS
