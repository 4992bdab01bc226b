/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-material-row.h: one material of the library as a row of entries
 * (category, name, λ, ρ, c, μ, ε, source, notes) with its Save button.
 * The row reads and checks what was typed; saving is its window's job
 * (the "save" signal). */
#pragma once

#include <gtk/gtk.h>

#include "lamina-material.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_MATERIAL_ROW (lamina_material_row_get_type ())
G_DECLARE_FINAL_TYPE (LaminaMaterialRow, lamina_material_row, LAMINA, MATERIAL_ROW, GtkListBoxRow)

/* Shows a copy of @material. */
LaminaMaterialRow *lamina_material_row_new          (const LaminaMaterial *material);
/* The material as typed, or NULL with the refusal shown in the row (the
 * parser's message names the field and the allowed range). */
LaminaMaterial    *lamina_material_row_dup_material (LaminaMaterialRow    *self);
/* @message below the row; NULL hides it. */
void               lamina_material_row_show_error   (LaminaMaterialRow    *self,
                                                     const char           *message);

G_END_DECLS
