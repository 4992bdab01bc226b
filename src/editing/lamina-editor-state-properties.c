/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The construction's own properties as pure edits: element, heat-flow
 * direction, outer side, notes and tags (lamina-editor-state.h). */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-editor-state.h"

#include <glib/gi18n.h>
#include <string.h>

/* The catalogue schema's limits (data/lamina-catalogue-1.xsd: "label" and
 * "text"), so that whatever the window accepts also exports. */
#define MAX_LABEL_CHARS 1000
#define MAX_TEXT_CHARS  100000

LaminaOuterSide
lamina_edit_default_outer_side (LaminaElement element)
{
  return element == LAMINA_ELEMENT_PARTITION ? LAMINA_OUTER_SIDE_INDOOR : LAMINA_OUTER_SIDE_OUTDOOR;
}

LaminaConstruction *
lamina_edit_set_element (const LaminaConstruction *state,
                         LaminaElement             element,
                         GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if ((guint) element >= LAMINA_N_ELEMENTS)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Element: %d is not a known element"), (int) element);
      return NULL;
    }
  next = lamina_construction_copy (state);
  next->element = element;
  if (state->heat_flow == lamina_element_default_heat_flow (state->element))
    next->heat_flow = lamina_element_default_heat_flow (element);
  if (state->outer_side == lamina_edit_default_outer_side (state->element))
    next->outer_side = lamina_edit_default_outer_side (element);
  return next;
}

LaminaConstruction *
lamina_edit_set_heat_flow (const LaminaConstruction *state,
                           LaminaHeatFlow            heat_flow,
                           GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if ((guint) heat_flow >= LAMINA_N_HEAT_FLOWS)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Heat flow: %d is not a known direction"), (int) heat_flow);
      return NULL;
    }
  next = lamina_construction_copy (state);
  next->heat_flow = heat_flow;
  return next;
}

LaminaConstruction *
lamina_edit_set_outer_side (const LaminaConstruction *state,
                            LaminaOuterSide           outer_side,
                            GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if ((guint) outer_side >= LAMINA_N_OUTER_SIDES)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Outer side: %d is not a known side"), (int) outer_side);
      return NULL;
    }
  next = lamina_construction_copy (state);
  next->outer_side = outer_side;
  return next;
}

LaminaConstruction *
lamina_edit_set_notes (const LaminaConstruction *state,
                       const char               *notes,
                       GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if (notes != NULL && g_utf8_strlen (notes, -1) > MAX_TEXT_CHARS)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Notes: at most %d characters"), MAX_TEXT_CHARS);
      return NULL;
    }
  next = lamina_construction_copy (state);
  g_free (next->notes);
  next->notes = notes != NULL && *notes != '\0' ? g_strdup (notes) : NULL;
  return next;
}

static int
find_tag (const LaminaConstruction *state,
          const char               *tag)
{
  g_autofree char *key = g_utf8_casefold (tag, -1);

  for (guint i = 0; i < state->tags->len; i++)
    {
      g_autofree char *other = g_utf8_casefold (g_ptr_array_index (state->tags, i), -1);

      if (strcmp (key, other) == 0)
        return (int) i;
    }
  return -1;
}

LaminaConstruction *
lamina_edit_add_tag (const LaminaConstruction *state,
                     const char               *tag,
                     GError                  **error)
{
  g_autofree char *clean = NULL;
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);
  g_return_val_if_fail (tag != NULL, NULL);

  clean = g_strstrip (g_strdup (tag));
  if (*clean == '\0')
    {
      g_set_error_literal (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                           _("Tag: type a word to add"));
      return NULL;
    }
  if (g_utf8_strlen (clean, -1) > MAX_LABEL_CHARS)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Tag: at most %d characters"), MAX_LABEL_CHARS);
      return NULL;
    }
  if (find_tag (state, clean) >= 0)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Tag: “%s” is already there"), clean);
      return NULL;
    }
  next = lamina_construction_copy (state);
  lamina_construction_add_tag (next, clean);
  return next;
}

LaminaConstruction *
lamina_edit_remove_tag (const LaminaConstruction *state,
                        const char               *tag,
                        GError                  **error)
{
  LaminaConstruction *next;
  int index;

  g_return_val_if_fail (state != NULL, NULL);
  g_return_val_if_fail (tag != NULL, NULL);

  index = find_tag (state, tag);
  if (index < 0)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Tag: “%s” is not on this construction"), tag);
      return NULL;
    }
  next = lamina_construction_copy (state);
  g_ptr_array_remove_index (next->tags, (guint) index);
  return next;
}
