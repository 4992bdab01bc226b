/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-field.h: two-dimensional steady-state heat conduction (EN ISO 10211).
 *
 * Two levels:
 *
 * - a geometry API: a rectangle of width × height (metres) painted with
 *   rectangles of materials (later rectangles paint over earlier ones), each
 *   side adiabatic or exchanging heat with an environment through a surface
 *   resistance (0 = the side is held at the temperature);
 * - the construction: one repeating module of a layer build-up
 *   (lamina_field_calculate), with U, the coldest inner surface point and
 *   the temperature field for the picture.
 *
 * The method: finite volumes on a node-centred rectilinear grid whose lines
 * fall on every material boundary (surface points and material corners are
 * nodes), graded towards those lines; materials are constant per cell, so
 * the conductance between two nodes sums the two half cells beside their
 * link exactly.  The linear system is symmetric positive definite and is
 * solved by conjugate gradients preconditioned with a modified incomplete
 * Cholesky factorisation.  The grid is halved until the boundary heat flow
 * changes by less than 0.1 % between two grids (EN ISO 10211 asks for
 * 1 %; the tighter rule is ours). */
#pragma once

#include <glib.h>

#include "lamina-calc.h"

G_BEGIN_DECLS

typedef enum
{
  LAMINA_FIELD_SIDE_BOTTOM,   /* y = 0 */
  LAMINA_FIELD_SIDE_TOP,      /* y = height */
  LAMINA_FIELD_SIDE_LEFT,     /* x = 0 */
  LAMINA_FIELD_SIDE_RIGHT,    /* x = width */
  LAMINA_FIELD_N_SIDES
} LaminaFieldSide;

/* Relative residual at which the conjugate gradients stop: ‖b − Ax‖₂ ≤
 * this × ‖b‖₂ (b holds the boundary heat flows, W/m). */
#define LAMINA_FIELD_SOLVER_TOLERANCE 1e-9
/* Grid refinement stops when the heat flow changes less than this. */
#define LAMINA_FIELD_CONVERGENCE 0.001
/* Default limit on grid nodes for the refinement (about 100 MB). */
#define LAMINA_FIELD_MAX_NODES 1500000

/* Called now and then with the estimated share of the work done (0–1);
 * return FALSE to cancel: the solve then fails with
 * LAMINA_FIELD_ERROR_CANCELLED.  Called from the solving thread. */
typedef gboolean (*LaminaFieldProgress) (double   fraction,
                                         gpointer user_data);

#define LAMINA_FIELD_ERROR (lamina_field_error_quark ())
typedef enum
{
  LAMINA_FIELD_ERROR_GEOMETRY,   /* a region not covered, a bad rectangle */
  LAMINA_FIELD_ERROR_CANCELLED,
  LAMINA_FIELD_ERROR_NOT_CONVERGED,
} LaminaFieldError;
GQuark lamina_field_error_quark (void);

typedef struct _LaminaFieldModel LaminaFieldModel;

LaminaFieldModel *lamina_field_model_new          (double            width,
                                                   double            height);
void              lamina_field_model_free         (LaminaFieldModel *model);
/* Returns the material's index.  λ along x and along y, W/(m·K). */
guint             lamina_field_model_add_material (LaminaFieldModel *model,
                                                   double            conductivity_x,
                                                   double            conductivity_y);
void              lamina_field_model_add_rectangle (LaminaFieldModel *model,
                                                    double            x0,
                                                    double            y0,
                                                    double            x1,
                                                    double            y1,
                                                    guint             material);
/* Every side is adiabatic until given a boundary. */
void              lamina_field_model_set_boundary (LaminaFieldModel *model,
                                                   LaminaFieldSide   side,
                                                   double            resistance,
                                                   double            temperature);
/* Grid lines through the point, so that it is a node on every grid. */
void              lamina_field_model_add_point    (LaminaFieldModel *model,
                                                   double            x,
                                                   double            y);
/* Largest and smallest (next to a material line) spacing of the first
 * grid, metres; each refinement halves both. */
void              lamina_field_model_set_spacing  (LaminaFieldModel *model,
                                                   double            coarse,
                                                   double            fine);

typedef struct
{
  guint   nx, ny;           /* nodes along x and y */
  double *x, *y;            /* node coordinates, m */
  double *t;                /* temperatures, °C, index j * nx + i */
  guint8 *material;         /* per cell, (nx − 1) × (ny − 1) */
  double  heat_flow[LAMINA_FIELD_N_SIDES]; /* W/m into the body */
  guint   iterations;
  double  residual;         /* relative, at the end */
} LaminaFieldSolution;

void      lamina_field_solution_free (LaminaFieldSolution *solution);
/* Bilinear between the nodes; NAN outside. */
double    lamina_field_solution_temperature_at (const LaminaFieldSolution *solution,
                                                double                     x,
                                                double                     y);
/* (nx − 1) × (ny − 1). */
guint     lamina_field_solution_get_cells (const LaminaFieldSolution *solution);
/* Σ|heat flow| / 2 over the sides, W/m: what the refinement watches. */
double    lamina_field_solution_get_throughput (const LaminaFieldSolution *solution);

/* One grid: @level halvings of the first grid.  @guess (another grid of the
 * same model, or NULL) starts the iteration. */
LaminaFieldSolution *lamina_field_model_solve_level (const LaminaFieldModel    *model,
                                                     guint                      level,
                                                     const LaminaFieldSolution *guess,
                                                     LaminaFieldProgress        progress,
                                                     gpointer                   user_data,
                                                     GError                   **error);

/* The linear system of one grid, for comparing solvers: the symmetric
 * five-point matrix A (diagonal, and the negated links to the east and
 * north neighbour of each node, index j·nx + i) and the right-hand side;
 * held nodes are rows of the identity.  Returns the solution layout as
 * a solution without temperatures (free it), or NULL. */
LaminaFieldSolution *lamina_field_model_dup_system (const LaminaFieldModel *model,
                                                    guint                   level,
                                                    double                **diagonal,
                                                    double                **east,
                                                    double                **north,
                                                    double                **rhs,
                                                    GError                **error);

#define LAMINA_FIELD_MAX_LEVELS 8
typedef struct
{
  guint  n_levels;
  guint  cells[LAMINA_FIELD_MAX_LEVELS];
  double throughput[LAMINA_FIELD_MAX_LEVELS]; /* W/m */
  guint  iterations[LAMINA_FIELD_MAX_LEVELS];
  gboolean converged;       /* the last change was below the rule */
  double   change;          /* relative change between the last two grids */
} LaminaFieldRefinement;

/* Halves the grid from the first one until the throughput changes less
 * than LAMINA_FIELD_CONVERGENCE or the next grid would pass @max_nodes
 * (0: LAMINA_FIELD_MAX_NODES); then @refinement says it did not converge.
 * Returns the finest solution. */
LaminaFieldSolution *lamina_field_model_solve (const LaminaFieldModel *model,
                                               guint                   max_nodes,
                                               LaminaFieldRefinement  *refinement,
                                               LaminaFieldProgress     progress,
                                               gpointer                user_data,
                                               GError                **error);

/* ---- One module of a construction ---------------------------------- */

typedef struct
{
  double x0, y0, x1, y1;    /* mm: x across the module, y from the inner surface */
  int    layer;             /* 0-based layer */
  int    part;              /* part of a bridged layer, −1 for the whole layer */
} LaminaFieldRegion;

typedef struct
{
  double u;                 /* W/(m²·K): the 2-D U plus the Annex F ΔU of 6946 */
  double u_field;           /* W/(m²·K): the 2-D U alone */
  double u_6946;            /* the EN ISO 6946 U (with its Annex F corrections) */
  double heat_flow;         /* W per metre of the module, design temperatures */
  double min_inner_surface_temperature; /* °C, with Rsi as for U */
  double min_inner_surface_position;    /* mm across the module */
  double f_rsi;             /* (θsi,min − θe)/(θi − θe), Rsi as for U */
  double min_inner_surface_temperature_mould; /* °C, Rsi 0.25 */
  double f_rsi_mould;       /* with Rsi 0.25 (EN ISO 13788) */
  double rsi, rse;          /* m²·K/W used for U */
  double inside_temperature, outside_temperature;
  double module_width;      /* mm */
  double thickness;         /* mm modelled (inside a well-ventilated layer) */
  guint  cells;             /* of the finest grid */
  LaminaFieldRefinement refinement;
  GPtrArray *notes;         /* char*: how the build-up was modelled */
  guint  n_regions;
  LaminaFieldRegion *regions; /* the material regions, for the picture */
  LaminaFieldSolution *field;  /* finest grid, Rsi as for U; metres */
} LaminaFieldResult;

/* Rsi for the mould criterion of EN ISO 13788 (6.2). */
#define LAMINA_FIELD_RSI_MOULD 0.25

void lamina_field_result_free (LaminaFieldResult *result);

/* Whether the construction needs the numerical check: the EN ISO 6946
 * result carries a metal-bridging or limit-ratio warning. */
gboolean lamina_field_is_advised (const LaminaResult *result);

/* Calculates @construction by EN ISO 6946 and then one module numerically.
 * @max_nodes as for lamina_field_model_solve (). */
LaminaFieldResult *lamina_field_calculate (const LaminaConstruction *construction,
                                           guint                     max_nodes,
                                           LaminaFieldProgress       progress,
                                           gpointer                  user_data,
                                           GError                  **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaFieldModel, lamina_field_model_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaFieldSolution, lamina_field_solution_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaFieldResult, lamina_field_result_free)

G_END_DECLS
