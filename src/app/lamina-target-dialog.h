/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-target-dialog.h: "Meet Target U" on a layer: the exact and the
 * buildable thickness with their U, a chart of U against the layer's
 * thickness, and one undoable edit when applied. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-document.h"
#include "lamina-solve.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_TARGET_DIALOG (lamina_target_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaTargetDialog, lamina_target_dialog, LAMINA, TARGET_DIALOG, GtkWindow)

/* For layer @index (0-based) of the document's construction; transient
 * for @parent. */
LaminaTargetDialog *lamina_target_dialog_new        (GtkWindow      *parent,
                                                     LaminaDocument *document,
                                                     guint           index);
/* Solves for @text as if typed; FALSE with the message shown. */
gboolean            lamina_target_dialog_set_target (LaminaTargetDialog *self,
                                                     const char         *text);
/* The last solution, NULL when there is none. */
const LaminaSolve  *lamina_target_dialog_get_solve  (LaminaTargetDialog *self);
/* Applies the snapped (or exact) thickness as one undoable edit and
 * closes. */
void                lamina_target_dialog_apply      (LaminaTargetDialog *self,
                                                     gboolean            snapped);

G_END_DECLS
