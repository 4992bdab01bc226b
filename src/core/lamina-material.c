/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-material.h"

#include <math.h>

G_DEFINE_BOXED_TYPE (LaminaMaterial, lamina_material,
                     lamina_material_copy, lamina_material_free)

LaminaMaterial *
lamina_material_new (const char     *id,
                     const char     *name,
                     LaminaCategory  category,
                     double          conductivity)
{
  LaminaMaterial *m = g_new0 (LaminaMaterial, 1);

  m->id = g_strdup (id);
  m->name = g_strdup (name);
  m->category = category;
  m->conductivity = conductivity;
  m->density = NAN;
  m->specific_heat = NAN;
  m->vapour_resistance_factor = NAN;
  m->emissivity = NAN;
  return m;
}

LaminaMaterial *
lamina_material_copy (const LaminaMaterial *material)
{
  LaminaMaterial *m;

  g_return_val_if_fail (material != NULL, NULL);

  m = g_memdup2 (material, sizeof *material);
  m->id = g_strdup (material->id);
  m->name = g_strdup (material->name);
  m->source = g_strdup (material->source);
  m->notes = g_strdup (material->notes);
  return m;
}

void
lamina_material_free (LaminaMaterial *material)
{
  if (material == NULL)
    return;
  g_free (material->id);
  g_free (material->name);
  g_free (material->source);
  g_free (material->notes);
  g_free (material);
}

/* NAN compares equal to NAN here: "not known" is the same value. */
static gboolean
same_value (double a,
            double b)
{
  return (isnan (a) && isnan (b)) || a == b;
}

gboolean
lamina_material_equal (const LaminaMaterial *a,
                       const LaminaMaterial *b)
{
  if (a == b)
    return TRUE;
  if (a == NULL || b == NULL)
    return FALSE;
  return g_strcmp0 (a->id, b->id) == 0
         && g_strcmp0 (a->name, b->name) == 0
         && a->category == b->category
         && same_value (a->conductivity, b->conductivity)
         && same_value (a->density, b->density)
         && same_value (a->specific_heat, b->specific_heat)
         && same_value (a->vapour_resistance_factor, b->vapour_resistance_factor)
         && same_value (a->emissivity, b->emissivity)
         && g_strcmp0 (a->source, b->source) == 0
         && g_strcmp0 (a->notes, b->notes) == 0;
}
