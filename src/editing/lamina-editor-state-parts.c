/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The parts of a bridged layer as pure edits (lamina-editor-state.h):
 * infill, studs, noggings, battens, each a material (or air) over an area
 * fraction, EN ISO 6946:2017 6.7.2. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-editor-state.h"

#include <glib/gi18n.h>
#include <math.h>

/* The core's limit on parts per layer (lamina-validate.c). */
#define MAX_PARTS 32

/* Checks that layer @index is bridged and, unless @part is G_MAXUINT,
 * that it has part @part. */
static gboolean
check_part (const LaminaConstruction *state,
            guint                     index,
            guint                     part,
            GError                  **error)
{
  const LaminaLayer *layer;

  if (index >= state->layers->len)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_NO_LAYER,
                   _("There is no layer %u (the construction has %u)"),
                   index + 1, state->layers->len);
      return FALSE;
    }
  layer = g_ptr_array_index (state->layers, index);
  if (layer->kind != LAMINA_LAYER_BRIDGED || layer->parts == NULL)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u is not a bridged layer"), index + 1);
      return FALSE;
    }
  if (part != G_MAXUINT && part >= layer->parts->len)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_NO_LAYER,
                   _("Layer %u has no part %u"), index + 1, part + 1);
      return FALSE;
    }
  return TRUE;
}

static LaminaPart *
get_part (LaminaConstruction *state,
          guint               index,
          guint               part)
{
  LaminaLayer *layer = g_ptr_array_index (state->layers, index);

  return g_ptr_array_index (layer->parts, part);
}

static gboolean
check_fraction (guint    index,
                guint    part,
                double   fraction,
                GError **error)
{
  if (fraction > 0 && fraction <= 1)
    return TRUE;
  g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
               _("Layer %u, part %u: the fraction must be above 0 and at most 100 %%"),
               index + 1, part + 1);
  return FALSE;
}

static void
set_member (LaminaPart *part,
            const char *member)
{
  g_autofree char *clean = member ? g_strstrip (g_strdup (member)) : NULL;

  g_free (part->member);
  part->member = clean != NULL && *clean != '\0' ? g_steal_pointer (&clean) : NULL;
}

LaminaConstruction *
lamina_edit_add_part (const LaminaConstruction *state,
                      guint                     index,
                      const LaminaMaterial     *material,
                      double                    fraction,
                      const char               *member,
                      GError                  **error)
{
  const LaminaLayer *layer;
  LaminaConstruction *next;
  LaminaPart *part;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, G_MAXUINT, error))
    return NULL;
  layer = g_ptr_array_index (state->layers, index);
  if (layer->parts->len >= MAX_PARTS)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: at most %d parts"), index + 1, MAX_PARTS);
      return NULL;
    }
  if (!isnan (fraction) && !check_fraction (index, layer->parts->len, fraction, error))
    return NULL;
  next = lamina_construction_copy (state);
  part = lamina_part_new (material ? lamina_material_copy (material) : NULL, fraction);
  set_member (part, member);
  lamina_layer_add_part (g_ptr_array_index (next->layers, index), part);
  return next;
}

LaminaConstruction *
lamina_edit_remove_part (const LaminaConstruction *state,
                         guint                     index,
                         guint                     part,
                         GError                  **error)
{
  const LaminaLayer *layer;
  LaminaConstruction *next;
  LaminaLayer *changed;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, part, error))
    return NULL;
  layer = g_ptr_array_index (state->layers, index);
  if (layer->parts->len <= 1)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: a bridged layer keeps at least one part (choose a material for the layer instead)"),
                   index + 1);
      return NULL;
    }
  next = lamina_construction_copy (state);
  changed = g_ptr_array_index (next->layers, index);
  g_ptr_array_remove_index (changed->parts, part);
  return next;
}

LaminaConstruction *
lamina_edit_set_part_material (const LaminaConstruction *state,
                               guint                     index,
                               guint                     part,
                               const LaminaMaterial     *material,
                               GError                  **error)
{
  LaminaConstruction *next;
  LaminaPart *p;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, part, error))
    return NULL;
  next = lamina_construction_copy (state);
  p = get_part (next, index, part);
  g_clear_pointer (&p->material, lamina_material_free);
  p->material = material ? lamina_material_copy (material) : NULL;
  return next;
}

LaminaConstruction *
lamina_edit_set_part_fraction (const LaminaConstruction *state,
                               guint                     index,
                               guint                     part,
                               double                    fraction,
                               GError                  **error)
{
  LaminaConstruction *next;
  LaminaPart *p;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, part, error) || !check_fraction (index, part, fraction, error))
    return NULL;
  next = lamina_construction_copy (state);
  p = get_part (next, index, part);
  p->fraction = fraction;
  p->width = NAN;
  p->spacing = NAN;
  return next;
}

LaminaConstruction *
lamina_edit_set_part_framing (const LaminaConstruction *state,
                              guint                     index,
                              guint                     part,
                              double                    width,
                              double                    spacing,
                              GError                  **error)
{
  LaminaConstruction *next;
  LaminaPart *p;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, part, error))
    return NULL;
  if (!(width > 0 && spacing > width))
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u, part %u: the width must be above 0 and below the spacing"),
                   index + 1, part + 1);
      return NULL;
    }
  next = lamina_construction_copy (state);
  p = get_part (next, index, part);
  p->fraction = NAN;
  p->width = width;
  p->spacing = spacing;
  return next;
}

LaminaConstruction *
lamina_edit_set_part_remainder (const LaminaConstruction *state,
                                guint                     index,
                                guint                     part,
                                GError                  **error)
{
  const LaminaLayer *layer;
  LaminaConstruction *next;
  LaminaLayer *changed;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, part, error))
    return NULL;
  layer = g_ptr_array_index (state->layers, index);
  next = lamina_construction_copy (state);
  changed = g_ptr_array_index (next->layers, index);
  for (guint i = 0; i < layer->parts->len; i++)
    {
      LaminaPart *other = g_ptr_array_index (changed->parts, i);
      double resolved = lamina_layer_get_part_fraction (layer, i);

      if (i == part || !isnan (lamina_part_get_given_fraction (other)))
        continue;
      /* The old remainder keeps its share (if it had one to keep). */
      other->fraction = resolved > 0 && resolved <= 1 ? resolved : NAN;
    }
  get_part (next, index, part)->fraction = NAN;
  get_part (next, index, part)->width = NAN;
  get_part (next, index, part)->spacing = NAN;
  return next;
}

LaminaConstruction *
lamina_edit_set_part_member (const LaminaConstruction *state,
                             guint                     index,
                             guint                     part,
                             const char               *member,
                             GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_part (state, index, part, error))
    return NULL;
  if (member != NULL && g_utf8_strlen (member, -1) > 1000)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u, part %u: the member name is longer than %d characters"),
                   index + 1, part + 1, 1000);
      return NULL;
    }
  next = lamina_construction_copy (state);
  set_member (get_part (next, index, part), member);
  return next;
}
