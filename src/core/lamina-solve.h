/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-solve.h: the thickness of one layer at which a construction meets
 * a target U.  The engine (EN ISO 6946:2017, corrections included) is
 * evaluated as a function of that thickness and the root is bracketed and
 * bisected; nothing is linearised, so bridged layers, sections and Annex F
 * corrections count exactly as in the calculation itself. */
#pragma once

#include "lamina-calc.h"

G_BEGIN_DECLS

/* The largest thickness a layer may take (the model's limit), mm; a
 * bridged layer with an air part stops at LAMINA_AIR_LAYER_MAX_THICKNESS. */
#define LAMINA_SOLVE_MAX_THICKNESS 10000.0
/* Exactness of the solved thickness, mm (the bracket is closed far below
 * this; the figure is what a caller may rely on). */
#define LAMINA_SOLVE_TOLERANCE 0.01
/* The round-up step used when no stock thickness fits, mm. */
#define LAMINA_SOLVE_SNAP_STEP 10.0

typedef struct
{
  guint    layer;              /* 1-based, 1 = innermost */
  double   target;             /* W/(m²·K) */
  double   thickness;          /* mm: corrected U equals the target */
  double   u;                  /* corrected U at thickness */
  double   thickness_snapped;  /* mm: rounded up to stock or to 10 mm */
  double   u_snapped;          /* corrected U at thickness_snapped */
  gboolean stock;              /* thickness_snapped is a stock thickness */
  double   thickness_before;   /* mm, the layer as it was */
  double   u_before;           /* corrected U as it was */
} LaminaSolve;

/* Whether layer @layer (1-based) has a thickness the solver can vary: a
 * homogeneous material layer or a bridged layer (its members grow with
 * it).  FALSE with @error saying why not. */
gboolean lamina_solve_check_layer (const LaminaConstruction *construction,
                                   guint                     layer,
                                   GError                  **error);

/* Corrected U of @construction with layer @layer at @thickness mm. */
gboolean lamina_solve_u_at        (const LaminaConstruction *construction,
                                   guint                     layer,
                                   double                    thickness,
                                   double                   *u,
                                   GError                  **error);

/* Solves for @target.  LAMINA_CALC_ERROR_UNREACHABLE when no thickness up
 * to LAMINA_SOLVE_MAX_THICKNESS reaches the target, or when the target is
 * met even at the thinnest layer (any thickness would do). */
gboolean lamina_solve_thickness   (const LaminaConstruction *construction,
                                   guint                     layer,
                                   double                    target,
                                   LaminaSolve              *solve,
                                   GError                  **error);

/* The thickness a solved @thickness is built at: the smallest stock
 * thickness ≥ @thickness that every material of the layer with a stock
 * list offers, else @thickness rounded up to LAMINA_SOLVE_SNAP_STEP.
 * @stock, if not NULL, says which. */
double   lamina_solve_snap        (const LaminaLayer        *layer,
                                   double                    thickness,
                                   gboolean                 *stock);

/* U against the layer's thickness for a chart: @n samples from @from to @to
 * mm into @thickness and @u (NAN where the engine refuses a thickness). */
gboolean lamina_solve_curve       (const LaminaConstruction *construction,
                                   guint                     layer,
                                   double                    from,
                                   double                    to,
                                   guint                     n,
                                   double                   *thickness,
                                   double                   *u,
                                   GError                  **error);

G_END_DECLS
