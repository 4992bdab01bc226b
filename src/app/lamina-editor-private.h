/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-editor-private.h: shared between the editor and its dialogs. */
#pragma once

#include "lamina-editor.h"

G_BEGIN_DECLS

void lamina_editor_choose_material  (LaminaEditor *self,
                                     gboolean      insert);
void lamina_editor_edit_bridged     (LaminaEditor *self);
void lamina_editor_edit_air         (LaminaEditor *self);
void lamina_editor_edit_declared    (LaminaEditor *self);
void lamina_editor_edit_corrections (LaminaEditor *self);

G_END_DECLS
