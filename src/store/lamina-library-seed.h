/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-library-seed.h: the seed material table (private; for tests). */
#pragma once

#include <glib.h>

#include "lamina-types.h"

G_BEGIN_DECLS

typedef struct
{
  const char     *id;
  const char     *name;
  LaminaCategory  category;
  double          conductivity;   /* λ, W/(m·K) */
  double          density;        /* kg/m³ */
  double          specific_heat;  /* J/(kg·K) */
  double          mu;             /* vapour resistance factor, dry; NAN if not applicable */
  const char     *source;
} LaminaSeedMaterial;

const LaminaSeedMaterial *lamina_library_get_seed_materials (guint *n);

G_END_DECLS

