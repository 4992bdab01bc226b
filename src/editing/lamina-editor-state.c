/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-editor-state.h"

#include <glib/gi18n.h>
#include <math.h>

G_DEFINE_QUARK (lamina-edit-error-quark, lamina_edit_error)

static gboolean
check_index (const LaminaConstruction *state,
             guint                     index,
             GError                  **error)
{
  if (index < state->layers->len)
    return TRUE;
  g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_NO_LAYER,
               _("There is no layer %u (the construction has %u)"),
               index + 1, state->layers->len);
  return FALSE;
}

static LaminaLayer *
get_layer (LaminaConstruction *state,
           guint               index)
{
  return g_ptr_array_index (state->layers, index);
}

/* Replaces layer @index of @state with @layer (taking it). */
static void
replace_layer (LaminaConstruction *state,
               guint               index,
               LaminaLayer        *layer)
{
  lamina_layer_free (g_ptr_array_index (state->layers, index));
  g_ptr_array_index (state->layers, index) = layer;
}

double
lamina_edit_snap (double thickness,
                  double step)
{
  double snapped = thickness;
  double minimum = LAMINA_EDIT_MIN_THICKNESS;

  if (step > 0)
    {
      snapped = round (thickness / step) * step;
      minimum = MAX (step, LAMINA_EDIT_MIN_THICKNESS);
    }
  return CLAMP (snapped, minimum, LAMINA_EDIT_MAX_THICKNESS);
}

LaminaConstruction *
lamina_edit_set_thickness (const LaminaConstruction *state,
                           guint                     index,
                           double                    thickness,
                           GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  if (!(thickness >= LAMINA_EDIT_MIN_THICKNESS && thickness <= LAMINA_EDIT_MAX_THICKNESS))
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: the thickness must be between %.1f and %.0f mm"),
                   index + 1, LAMINA_EDIT_MIN_THICKNESS, LAMINA_EDIT_MAX_THICKNESS);
      return NULL;
    }
  next = lamina_construction_copy (state);
  get_layer (next, index)->thickness = thickness;
  return next;
}

LaminaConstruction *
lamina_edit_insert_layer (const LaminaConstruction *state,
                          guint                     index,
                          const LaminaLayer        *layer,
                          GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);
  g_return_val_if_fail (layer != NULL, NULL);

  if (index > state->layers->len)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_NO_LAYER,
                   _("Cannot insert at position %u (the construction has %u layers)"),
                   index + 1, state->layers->len);
      return NULL;
    }
  next = lamina_construction_copy (state);
  g_ptr_array_insert (next->layers, index, lamina_layer_copy (layer));
  return next;
}

LaminaConstruction *
lamina_edit_remove_layer (const LaminaConstruction *state,
                          guint                     index,
                          GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  next = lamina_construction_copy (state);
  lamina_layer_free (g_ptr_array_steal_index (next->layers, index));
  return next;
}

LaminaConstruction *
lamina_edit_duplicate_layer (const LaminaConstruction *state,
                             guint                     index,
                             GError                  **error)
{
  g_return_val_if_fail (state != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  return lamina_edit_insert_layer (state, index + 1,
                                   g_ptr_array_index (state->layers, index), error);
}

LaminaConstruction *
lamina_edit_move_layer (const LaminaConstruction *state,
                        guint                     from,
                        guint                     to,
                        GError                  **error)
{
  LaminaConstruction *next;
  LaminaLayer *layer;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_index (state, from, error) || !check_index (state, to, error))
    return NULL;
  next = lamina_construction_copy (state);
  layer = g_ptr_array_steal_index (next->layers, from);
  g_ptr_array_insert (next->layers, to, layer);
  return next;
}

LaminaConstruction *
lamina_edit_set_material (const LaminaConstruction *state,
                          guint                     index,
                          const LaminaMaterial     *material,
                          GError                  **error)
{
  LaminaConstruction *next;
  LaminaLayer *old;
  LaminaLayer *layer;

  g_return_val_if_fail (state != NULL, NULL);
  g_return_val_if_fail (material != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  next = lamina_construction_copy (state);
  old = get_layer (next, index);
  layer = lamina_layer_new_material (old->thickness, lamina_material_copy (material));
  layer->corrections = old->corrections;
  layer->note = g_strdup (old->note);
  replace_layer (next, index, layer);
  return next;
}

LaminaConstruction *
lamina_edit_make_bridged (const LaminaConstruction *state,
                          guint                     index,
                          const LaminaMaterial     *infill,
                          const LaminaMaterial     *framing,
                          double                    width,
                          double                    spacing,
                          const char               *member,
                          GError                  **error)
{
  LaminaConstruction *next;
  const LaminaLayer *old;
  const LaminaMaterial *fill;
  LaminaLayer *layer;

  g_return_val_if_fail (state != NULL, NULL);
  g_return_val_if_fail (framing != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  if (!(width > 0 && spacing > width))
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: the framing width must be above 0 and below the spacing"),
                   index + 1);
      return NULL;
    }
  old = g_ptr_array_index (state->layers, index);
  fill = old->kind == LAMINA_LAYER_MATERIAL ? old->material : infill;
  if (fill == NULL)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: choose a material to fill between the framing members"),
                   index + 1);
      return NULL;
    }
  layer = lamina_layer_new_bridged (old->thickness);
  lamina_layer_add_part (layer, lamina_part_new (lamina_material_copy (fill), NAN));
  lamina_layer_add_part (layer, lamina_part_new_framing (lamina_material_copy (framing),
                                                         width, spacing, member));
  layer->corrections = old->corrections;
  layer->note = g_strdup (old->note);
  next = lamina_construction_copy (state);
  replace_layer (next, index, layer);
  return next;
}

LaminaConstruction *
lamina_edit_make_air (const LaminaConstruction *state,
                      guint                     index,
                      LaminaAirKind             air,
                      double                    vent_area,
                      double                    emissivity_inner,
                      double                    emissivity_outer,
                      GError                  **error)
{
  LaminaConstruction *next;
  const LaminaLayer *old;
  LaminaLayer *layer;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  if (!isnan (vent_area) && vent_area < 0)
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: the vent area cannot be negative"), index + 1);
      return NULL;
    }
  old = g_ptr_array_index (state->layers, index);
  layer = lamina_layer_new_air (old->thickness, air);
  layer->vent_area = vent_area;
  layer->emissivity_inner = isnan (emissivity_inner) ? LAMINA_DEFAULT_EMISSIVITY : emissivity_inner;
  layer->emissivity_outer = isnan (emissivity_outer) ? LAMINA_DEFAULT_EMISSIVITY : emissivity_outer;
  layer->note = g_strdup (old->note);
  next = lamina_construction_copy (state);
  replace_layer (next, index, layer);
  return next;
}

LaminaConstruction *
lamina_edit_make_declared (const LaminaConstruction *state,
                           guint                     index,
                           double                    resistance,
                           GError                  **error)
{
  LaminaConstruction *next;
  const LaminaLayer *old;
  LaminaLayer *layer;

  g_return_val_if_fail (state != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  if (!(resistance > 0))
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: the declared thermal resistance must be above 0"), index + 1);
      return NULL;
    }
  old = g_ptr_array_index (state->layers, index);
  layer = lamina_layer_new_resistance (old->thickness, resistance);
  layer->corrections = old->corrections;
  layer->note = g_strdup (old->note);
  next = lamina_construction_copy (state);
  replace_layer (next, index, layer);
  return next;
}

LaminaConstruction *
lamina_edit_set_corrections (const LaminaConstruction *state,
                             guint                     index,
                             const LaminaCorrections  *corrections,
                             GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);
  g_return_val_if_fail (corrections != NULL, NULL);

  if (!check_index (state, index, error))
    return NULL;
  if (corrections->has_air_gaps &&
      (corrections->air_gap_level < 0 || corrections->air_gap_level > 2))
    {
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Layer %u: the air gap level must be 0, 1 or 2"), index + 1);
      return NULL;
    }
  next = lamina_construction_copy (state);
  get_layer (next, index)->corrections = *corrections;
  return next;
}

LaminaConstruction *
lamina_edit_set_conditions (const LaminaConstruction *state,
                            double                    inside,
                            double                    outside,
                            double                    target_u,
                            GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if (!isfinite (inside) || !isfinite (outside))
    {
      g_set_error_literal (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                           _("Design conditions: give both temperatures"));
      return NULL;
    }
  if (!isnan (target_u) && !(target_u > 0))
    {
      g_set_error_literal (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                           _("Target U: must be above 0, or left empty"));
      return NULL;
    }
  next = lamina_construction_copy (state);
  next->inside_temperature = inside;
  next->outside_temperature = outside;
  next->target_u = target_u;
  return next;
}

static gboolean
is_blank (const char *text)
{
  for (; *text; text = g_utf8_next_char (text))
    if (!g_unichar_isspace (g_utf8_get_char (text)))
      return FALSE;
  return TRUE;
}

static void
replace_string (char       **field,
                const char  *value)
{
  if (value == NULL)
    return;
  g_free (*field);
  *field = *value ? g_strdup (value) : NULL;
}

LaminaConstruction *
lamina_edit_set_names (const LaminaConstruction *state,
                       const char               *code,
                       const char               *name,
                       const char               *description,
                       GError                  **error)
{
  LaminaConstruction *next;

  g_return_val_if_fail (state != NULL, NULL);

  if (name != NULL && is_blank (name))
    {
      g_set_error_literal (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                           _("Name: a construction needs a name"));
      return NULL;
    }
  if (description != NULL && g_utf8_strlen (description, -1) > 100000)
    {
      /* The catalogue schema's "text" limit (data/lamina-catalogue-1.xsd). */
      g_set_error (error, LAMINA_EDIT_ERROR, LAMINA_EDIT_ERROR_INVALID,
                   _("Description: at most %d characters"), 100000);
      return NULL;
    }
  next = lamina_construction_copy (state);
  replace_string (&next->code, code);
  if (name != NULL)
    {
      g_free (next->name);
      next->name = g_strstrip (g_strdup (name));
    }
  replace_string (&next->description, description);
  return next;
}
