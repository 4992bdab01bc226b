/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-target-set-dialog.h: the library's target sets — a table of
 * maximum U, optional minimum fRsi and moisture criterion per use — new
 * or changed.  Each fault names its row and field. */
#pragma once

#include <gtk/gtk.h>

#include "lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_TARGET_SET_DIALOG (lamina_target_set_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaTargetSetDialog, lamina_target_set_dialog, LAMINA, TARGET_SET_DIALOG, GtkWindow)

/* Opens on the set @id (NULL: a new set).  "saved" (with the set's id)
 * is emitted each time the library takes one; the dialog stays open. */
LaminaTargetSetDialog *lamina_target_set_dialog_new     (GtkWindow             *parent,
                                                         LaminaLibrary         *library,
                                                         const char            *id);
/* Shows set @id (NULL: a new, empty set). */
void                   lamina_target_set_dialog_show    (LaminaTargetSetDialog *self,
                                                         const char            *id);
/* Appends an empty row; returns its index in the rows. */
guint                  lamina_target_set_dialog_add_row (LaminaTargetSetDialog *self);
gboolean               lamina_target_set_dialog_save    (LaminaTargetSetDialog *self,
                                                         GError               **error);

G_END_DECLS
