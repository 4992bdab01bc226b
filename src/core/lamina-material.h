/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-material.h: a building material with its design values. */
#pragma once

#include <glib-object.h>

#include "lamina-types.h"

G_BEGIN_DECLS

/* Units: conductivity λ W/(m·K), density kg/m³, specific heat J/(kg·K),
 * vapour resistance factor μ (dimensionless), emissivity 0–1.  A value that
 * is not known is NAN (except conductivity, which a material must have). */
typedef struct
{
  char           *id;
  char           *name;
  LaminaCategory  category;
  double          conductivity;
  double          density;
  double          specific_heat;
  double          vapour_resistance_factor;
  double          emissivity;
  char           *source;
  char           *notes;
} LaminaMaterial;

#define LAMINA_TYPE_MATERIAL (lamina_material_get_type ())
GType           lamina_material_get_type (void) G_GNUC_CONST;

LaminaMaterial *lamina_material_new      (const char           *id,
                                          const char           *name,
                                          LaminaCategory        category,
                                          double                conductivity);
LaminaMaterial *lamina_material_copy     (const LaminaMaterial *material);
void            lamina_material_free     (LaminaMaterial       *material);
gboolean        lamina_material_equal    (const LaminaMaterial *a,
                                          const LaminaMaterial *b);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaMaterial, lamina_material_free)

G_END_DECLS
