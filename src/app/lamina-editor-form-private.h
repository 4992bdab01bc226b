/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-editor-form-private.h: the editor's small dialogs
 * (lamina-editor-dialogs.c) are one type, LaminaEditorForm, whose template
 * holds the fields of them all; each dialog shows its own rows.  The
 * instance is here for its own file and for tests (the template's
 * children, typed). */
#pragma once

#include <gtk/gtk.h>

#include "lamina-editor.h"
#include "lamina-material-chooser.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_EDITOR_FORM (lamina_editor_form_get_type ())
G_DECLARE_FINAL_TYPE (LaminaEditorForm, lamina_editor_form, LAMINA, EDITOR_FORM, GtkWindow)

typedef gboolean (*LaminaEditorFormApply) (LaminaEditorForm *form,
                                           GError          **error);

struct _LaminaEditorForm
{
  GtkWindow              parent_instance;

  /* template */
  GtkGrid               *grid;
  GtkLabel              *error_label;
  /* Material and Add Layer; Bridged Layer (its framing member) */
  GtkLabel              *material_label;
  LaminaMaterialChooser *chooser;
  GtkEntry              *thickness;
  GtkEntry              *width;
  GtkEntry              *spacing;
  /* Air Layer */
  GtkDropDown           *ventilation;
  GtkEntry              *vent_area;
  GtkEntry              *inner_emissivity;
  GtkEntry              *outer_emissivity;
  /* Declared Resistance */
  GtkEntry              *resistance;
  /* Corrections to U */
  GtkCheckButton        *air_gaps;
  GtkEntry              *gap_level;
  GtkCheckButton        *fasteners;
  GtkEntry              *fastener_lambda;
  GtkEntry              *fastener_area;
  GtkEntry              *fastener_count;
  GtkCheckButton        *inverted;
  GtkEntry              *precipitation;
  GtkEntry              *drainage;

  /* owned */
  LaminaEditor          *editor;
  LaminaEditorFormApply  apply;
  gboolean               insert;
};

G_END_DECLS
