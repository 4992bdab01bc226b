/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "lamina-undo-stack.h"

struct _LaminaUndoStack
{
  GPtrArray *undo;   /* LaminaConstruction*, oldest first */
  GPtrArray *redo;   /* LaminaConstruction*, the next redo last */
  char      *group;  /* group of the top undo entry, NULL = sealed */
  guint      limit;
};

LaminaUndoStack *
lamina_undo_stack_new (guint limit)
{
  LaminaUndoStack *stack = g_new0 (LaminaUndoStack, 1);

  stack->undo = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_construction_free);
  stack->redo = g_ptr_array_new_with_free_func ((GDestroyNotify) lamina_construction_free);
  stack->limit = limit > 0 ? limit : 200;
  return stack;
}

void
lamina_undo_stack_free (LaminaUndoStack *stack)
{
  if (stack == NULL)
    return;
  g_ptr_array_unref (stack->undo);
  g_ptr_array_unref (stack->redo);
  g_free (stack->group);
  g_free (stack);
}

void
lamina_undo_stack_push (LaminaUndoStack          *stack,
                        const LaminaConstruction *before,
                        const char               *group)
{
  g_return_if_fail (stack != NULL);
  g_return_if_fail (before != NULL);

  g_ptr_array_set_size (stack->redo, 0);
  /* Same group as the step on top: that step already holds the state
   * from before the group began. */
  if (group != NULL && g_strcmp0 (group, stack->group) == 0 && stack->undo->len > 0)
    return;
  g_ptr_array_add (stack->undo, lamina_construction_copy (before));
  if (stack->undo->len > stack->limit)
    g_ptr_array_remove_index (stack->undo, 0);
  g_free (stack->group);
  stack->group = g_strdup (group);
}

void
lamina_undo_stack_seal (LaminaUndoStack *stack)
{
  g_return_if_fail (stack != NULL);
  g_clear_pointer (&stack->group, g_free);
}

gboolean
lamina_undo_stack_can_undo (LaminaUndoStack *stack)
{
  return stack->undo->len > 0;
}

gboolean
lamina_undo_stack_can_redo (LaminaUndoStack *stack)
{
  return stack->redo->len > 0;
}

LaminaConstruction *
lamina_undo_stack_undo (LaminaUndoStack          *stack,
                        const LaminaConstruction *current)
{
  g_return_val_if_fail (stack != NULL, NULL);

  if (stack->undo->len == 0)
    return NULL;
  lamina_undo_stack_seal (stack);
  g_ptr_array_add (stack->redo, lamina_construction_copy (current));
  return g_ptr_array_steal_index (stack->undo, stack->undo->len - 1);
}

LaminaConstruction *
lamina_undo_stack_redo (LaminaUndoStack          *stack,
                        const LaminaConstruction *current)
{
  g_return_val_if_fail (stack != NULL, NULL);

  if (stack->redo->len == 0)
    return NULL;
  lamina_undo_stack_seal (stack);
  g_ptr_array_add (stack->undo, lamina_construction_copy (current));
  return g_ptr_array_steal_index (stack->redo, stack->redo->len - 1);
}

void
lamina_undo_stack_clear (LaminaUndoStack *stack)
{
  g_return_if_fail (stack != NULL);
  g_ptr_array_set_size (stack->undo, 0);
  g_ptr_array_set_size (stack->redo, 0);
  lamina_undo_stack_seal (stack);
}
