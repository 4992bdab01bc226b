/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-ground.h: heat transfer via the ground, EN ISO 13370:2017.
 * Pure functions; lengths in metres here (the model's wall thickness and
 * edge insulation thickness are in mm and converted by the caller). */
#pragma once

#include <glib.h>

#include "lamina-construction.h"

G_BEGIN_DECLS

/* EN ISO 13370:2017 9.1, 9.3, 9.4 (from memory): the conventional surface
 * resistances of a floor to the ground, m²·K/W. */
#define LAMINA_GROUND_RSI  0.17
#define LAMINA_GROUND_RSE  0.04
/* Rsi of a basement wall (horizontal heat flow, EN ISO 6946 Table 7). */
#define LAMINA_GROUND_RSI_WALL 0.13
/* λ of the ground when the soil is unknown, W/(m·K). */
#define LAMINA_GROUND_DEFAULT_CONDUCTIVITY 2.0

typedef struct
{
  double   b_prime;            /* B′ = A / (0.5 P), m */
  double   dt;                 /* equivalent thickness of the floor, m (dg
                                  of the ground under a suspended floor) */
  double   u;                  /* the floor's U with the ground, W/(m²·K) */
  double   soil_conductivity;  /* λ used */
  gboolean soil_assumed;       /* λ is the default for unknown soil */
  double   u_without_edge;     /* U0 before edge insulation (slab) */
  double   delta_psi;          /* ΔΨ of the edge insulation, W/(m·K), or 0 */
  double   u_floor;            /* Uf of the suspended part (suspended) */
  double   u_ground;           /* Ug under a suspended floor */
  double   u_exchange;         /* Ux of the underfloor space */
  double   dw;                 /* equivalent thickness of basement walls, m, or NAN */
  double   u_walls;            /* Ubw, or NAN */
  double   u_basement;         /* U′ of floor and walls together, or NAN */
} LaminaGroundResult;

/* Table 1: λ by soil class (2.0 when unknown). */
double   lamina_ground_soil_conductivity (LaminaSoil soil);
/* 9.1: U of a slab on ground for B′ and dt (both branches). */
double   lamina_ground_slab_u            (double     lambda,
                                          double     b_prime,
                                          double     dt);
/* Annex B: ΔΨ of horizontal or vertical edge insulation of width or depth
 * @size (m), thickness @thickness (m) and resistance @resistance. */
double   lamina_ground_edge_delta_psi    (LaminaEdge edge,
                                          double     lambda,
                                          double     dt,
                                          double     size,
                                          double     thickness,
                                          double     resistance);
/* 9.3: Ux, heat exchange of a ventilated underfloor space. */
double   lamina_ground_underfloor_exchange (double   b_prime,
                                            double   height,
                                            double   wall_u,
                                            double   vent_area,
                                            double   wind_speed,
                                            double   shielding);
/* 9.4: basement floor at depth z, and basement walls. */
double   lamina_ground_basement_floor_u  (double     lambda,
                                          double     b_prime,
                                          double     dt,
                                          double     depth);
double   lamina_ground_basement_wall_u   (double     lambda,
                                          double     depth,
                                          double     dt,
                                          double     dw);

/* The floor with the ground for the plan of @ground (@b_prime NAN) or for
 * a given B′ (the table of U against B′).  @rf is the floor's thermal
 * resistance without surface resistances. */
void     lamina_ground_calculate         (const LaminaGround *ground,
                                          double              rf,
                                          double              b_prime,
                                          LaminaGroundResult *result);

G_END_DECLS
