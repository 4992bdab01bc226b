/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-undo-stack.h: undo and redo over editor states.  Each entry is a
 * whole LaminaConstruction (small: a dozen layers), which keeps undo exact
 * and trivially correct.  Consecutive changes with the same non-NULL group
 * (one drag, typing in one field) merge into one step.  No GTK. */
#pragma once

#include "lamina-construction.h"

G_BEGIN_DECLS

typedef struct _LaminaUndoStack LaminaUndoStack;

LaminaUndoStack          *lamina_undo_stack_new      (guint                     limit);
void                      lamina_undo_stack_free     (LaminaUndoStack          *stack);
/* Records that the state is about to change from @before (copied).
 * Clears the redo side. */
void                      lamina_undo_stack_push     (LaminaUndoStack          *stack,
                                                      const LaminaConstruction *before,
                                                      const char               *group);
/* Ends merging: the next push starts a new step even with the same group. */
void                      lamina_undo_stack_seal     (LaminaUndoStack          *stack);
gboolean                  lamina_undo_stack_can_undo (LaminaUndoStack          *stack);
gboolean                  lamina_undo_stack_can_redo (LaminaUndoStack          *stack);
/* Returns the state to go back to (owned by the caller) and keeps
 * @current (copied) for redo; NULL when there is nothing to undo. */
LaminaConstruction       *lamina_undo_stack_undo     (LaminaUndoStack          *stack,
                                                      const LaminaConstruction *current);
LaminaConstruction       *lamina_undo_stack_redo     (LaminaUndoStack          *stack,
                                                      const LaminaConstruction *current);
void                      lamina_undo_stack_clear    (LaminaUndoStack          *stack);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaUndoStack, lamina_undo_stack_free)

G_END_DECLS
