/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-parts-dialog.h: the parts of a bridged layer (infill, studs,
 * noggings…): material or air, fraction or width at spacing, member name,
 * which part takes the remainder.  Every change is a pure edit applied to
 * the document at once (so it joins the document's undo history); the
 * core's validation message is shown beside the part it concerns. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_PARTS_DIALOG (lamina_parts_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaPartsDialog, lamina_parts_dialog, LAMINA, PARTS_DIALOG, GtkWindow)

/* Layer @index of @document; modal over @parent (may be NULL).  Closes
 * itself when the layer stops being a bridged layer (undo). */
LaminaPartsDialog *lamina_parts_dialog_new     (GtkWindow      *parent,
                                                LaminaDocument *document,
                                                guint           index);
/* The same, presented. */
GtkWindow         *lamina_parts_dialog_present (GtkWindow      *parent,
                                                LaminaDocument *document,
                                                guint           index);

G_END_DECLS
