/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Internal to the engine: heat-flow sections of bridged constructions. */
#pragma once

#include "lamina-calc.h"

G_BEGIN_DECLS

#define LAMINA_MAX_SECTIONS 4096

/* Per-thread working memory of one calculation (lamina-scratch.c). */
typedef struct _LaminaScratch LaminaScratch;
LaminaScratch *lamina_scratch_begin (void);
void           lamina_scratch_end   (LaminaScratch *scratch);
/* Zeroed, 16-byte aligned, valid until lamina_scratch_end(). */
gpointer       lamina_scratch_alloc (LaminaScratch *scratch,
                                     gsize          bytes);

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

/* The arrays of @sections come from @scratch. */
gboolean lamina_sections_build (const LaminaConstruction *construction,
                                LaminaScratch            *scratch,
                                LaminaSections           *sections,
                                GError                  **error);

/* The ventilation class an air layer is calculated with: its vent area
 * decides when given (6.9.3), else the declared class. */
LaminaAirKind lamina_air_layer_effective_kind (const LaminaLayer *layer);

/* Whether any part of the bridged layer names a framing member. */
gboolean lamina_layer_has_members (const LaminaLayer *layer);
/* A bridged layer in which metal (a metal category or λ ≥ 10) bridges
 * insulation: outside the scope of EN ISO 6946 (clause 1). */
gboolean lamina_layer_metal_bridges_insulation (const LaminaLayer *layer);

/* A share [base, base + share] of the progress of a longer job, for the
 * 2-D solver's passes. */
typedef struct
{
  gboolean (*progress) (double fraction, gpointer user_data);
  gpointer user_data;
  double   base, share;
} LaminaProgressShare;
gboolean lamina_progress_share (double   fraction,
                                gpointer share);

/* A result with its arrays allocated, for the engine to fill. */
LaminaResult *lamina_result_new     (guint                     n_layers);
void          lamina_result_add_warning (LaminaResult         *result,
                                         LaminaWarningKind     kind,
                                         int                   layer,
                                         char                 *message);

G_END_DECLS
