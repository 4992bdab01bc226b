/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-editor.h: the editor of one construction: header, section view,
 * layer stack and results.  Every change goes through the pure functions
 * of lamina-editor-state.h into the LaminaDocument, which saves it. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"
#include "lamina-moisture-view.h"
#include "lamina-properties-view.h"
#include "lamina-results-view.h"
#include "lamina-section-view.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_EDITOR (lamina_editor_get_type ())
G_DECLARE_FINAL_TYPE (LaminaEditor, lamina_editor, LAMINA, EDITOR, GtkWidget)

void               lamina_editor_set_document    (LaminaEditor   *self,
                                                  LaminaDocument *document);
LaminaDocument    *lamina_editor_get_document    (LaminaEditor   *self);
LaminaSectionView *lamina_editor_get_section_view (LaminaEditor  *self);
LaminaResultsView *lamina_editor_get_results_view (LaminaEditor  *self);
/* The Moisture page (EN ISO 13788) beside the results. */
LaminaMoistureView *lamina_editor_get_moisture_view (LaminaEditor *self);
/* "results" or "moisture". */
void               lamina_editor_show_results_page (LaminaEditor *self,
                                                    const char   *name);
LaminaPropertiesView *lamina_editor_get_properties_view (LaminaEditor *self);
/* The "method" page: ground, tapered layer, unheated space, Annex C/D. */
GtkWidget          *lamina_editor_get_method_view (LaminaEditor   *self);
/* Shows the "layers" or the "construction" page beside the results. */
void               lamina_editor_show_page       (LaminaEditor   *self,
                                                  const char     *name);
void               lamina_editor_set_snap_step   (LaminaEditor   *self,
                                                  double          step);
/* Resizes layer @index: what the section view's drag, the keyboard and the
 * thickness fields all call.  @live while a drag is under way (saved when
 * the drag ends). */
void               lamina_editor_resize_layer    (LaminaEditor   *self,
                                                  guint           index,
                                                  double          thickness,
                                                  gboolean        live);
int                lamina_editor_get_selected_layer (LaminaEditor *self);
/* Applies the result of a pure edit (takes @next; NULL shows @error). */
void               lamina_editor_apply           (LaminaEditor       *self,
                                                  LaminaConstruction *next,
                                                  const char         *group,
                                                  GError             *error);

G_END_DECLS
