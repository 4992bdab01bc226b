/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Internal to the engine: heat-flow sections of bridged constructions. */
#pragma once

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_MAX_SECTIONS 4096

/* The parallel heat-flow paths through a construction (EN ISO 6946:2017
 * 6.7.2.2).  Section s covers area fraction fraction[s]; in bridged layer i
 * it passes through part choice[s * n_layers + i] (0 for other layers). */
typedef struct
{
  guint    n_layers;
  guint    n_sections;
  double  *fraction;
  guint8  *choice;
} LaminaSections;

gboolean lamina_sections_build (const LaminaConstruction *construction,
                                LaminaSections           *sections,
                                GError                  **error);
void     lamina_sections_clear (LaminaSections           *sections);

/* A result with its arrays allocated, for the engine to fill. */
LaminaResult *lamina_result_new     (guint                     n_layers);
void          lamina_result_add_warning (LaminaResult         *result,
                                         LaminaWarningKind     kind,
                                         int                   layer,
                                         char                 *message);

G_END_DECLS
