/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Heat transfer via the ground, EN ISO 13370:2017 (clause numbers and
 * coefficients from memory of the standard):
 *
 *   Table 1  thermal conductivity of the ground by soil class
 *   8.1      characteristic dimension B′ = A / (0.5 P)
 *   9.1      slab on ground: dt = w + λ (Rsi + Rf + Rse), two branches
 *   Annex B  edge insulation, horizontal or vertical: U = U0 + 2 ΔΨ / B′
 *   9.3      suspended floor: 1/U = 1/Uf + 1/(Ug + Ux)
 *   9.4      heated basement: floor at depth z, walls, U′ of both */
#define G_LOG_DOMAIN "lamina-core"

#include "lamina-ground.h"

#include <math.h>

/* 9.3: 1450 converts ε·v·fw into W/(m²·K) (from memory). */
#define UNDERFLOOR_VENT_COEFFICIENT 1450.0
/* 9.3, defaults when not given: v at 10 m height and fw for an average
 * site (from memory: 0.02 sheltered, 0.05 average, 0.10 exposed). */
#define DEFAULT_WIND_SPEED 4.0
#define DEFAULT_SHIELDING  0.05

double
lamina_ground_soil_conductivity (LaminaSoil soil)
{
  switch (soil)
    {
    case LAMINA_SOIL_CLAY_SILT:
      return 1.5;
    case LAMINA_SOIL_ROCK:
      return 3.5;
    case LAMINA_SOIL_SAND_GRAVEL:
    case LAMINA_SOIL_UNKNOWN:
    case LAMINA_N_SOILS:
    default:
      return LAMINA_GROUND_DEFAULT_CONDUCTIVITY;
    }
}

/* 9.1: a floor thin against its size (dt < B′) loses heat mainly at the
 * edges: U = 2λ / (πB′ + dt) · ln (πB′/dt + 1); a well insulated floor
 * (dt ≥ B′): U = λ / (0.457 B′ + dt).  The two meet at dt = B′. */
double
lamina_ground_slab_u (double lambda,
                      double b_prime,
                      double dt)
{
  if (dt < b_prime)
    return 2.0 * lambda / (G_PI * b_prime + dt) * log (G_PI * b_prime / dt + 1.0);
  return lambda / (0.457 * b_prime + dt);
}

/* Annex B: the edge insulation adds R′ = Rn − dn/λ over a strip of width
 * (horizontal) or depth (vertical) D; d′ = R′λ.
 *   horizontal: ΔΨ = −λ/π · [ln (D/dt + 1) − ln (D/(dt + d′) + 1)]
 *   vertical:   ΔΨ = −λ/π · [ln (2D/dt + 1) − ln (2D/(dt + d′) + 1)] */
double
lamina_ground_edge_delta_psi (LaminaEdge edge,
                              double     lambda,
                              double     dt,
                              double     size,
                              double     thickness,
                              double     resistance)
{
  double d_extra = (resistance - thickness / lambda) * lambda;
  double reach = edge == LAMINA_EDGE_VERTICAL ? 2.0 * size : size;

  if (edge == LAMINA_EDGE_NONE || d_extra <= 0.0)
    return 0.0;
  return -lambda / G_PI * (log (reach / dt + 1.0) - log (reach / (dt + d_extra) + 1.0));
}

/* 9.3: Ux = 2 h Uw / B′ + 1450 ε v fw / B′ */
double
lamina_ground_underfloor_exchange (double b_prime,
                                   double height,
                                   double wall_u,
                                   double vent_area,
                                   double wind_speed,
                                   double shielding)
{
  return 2.0 * height * wall_u / b_prime
         + UNDERFLOOR_VENT_COEFFICIENT * vent_area * wind_speed * shielding / b_prime;
}

/* 9.4: the slab formulas with dt + z/2 in place of dt. */
double
lamina_ground_basement_floor_u (double lambda,
                                double b_prime,
                                double dt,
                                double depth)
{
  return lamina_ground_slab_u (lambda, b_prime, dt + 0.5 * depth);
}

/* 9.4: Ubw = 2λ/(πz) · (1 + 0.5 dt/(dt + z)) · ln (z/dw + 1) */
double
lamina_ground_basement_wall_u (double lambda,
                               double depth,
                               double dt,
                               double dw)
{
  return 2.0 * lambda / (G_PI * depth) * (1.0 + 0.5 * dt / (dt + depth)) * log (depth / dw + 1.0);
}

static double
ground_conductivity (const LaminaGround *g,
                     gboolean           *assumed)
{
  *assumed = isnan (g->soil_conductivity) && g->soil == LAMINA_SOIL_UNKNOWN;
  if (!isnan (g->soil_conductivity))
    return g->soil_conductivity;
  return lamina_ground_soil_conductivity (g->soil);
}

static double
value_or (double value,
          double fallback)
{
  return isnan (value) ? fallback : value;
}

void
lamina_ground_calculate (const LaminaGround *ground,
                         double              rf,
                         double              b_prime,
                         LaminaGroundResult *result)
{
  const LaminaGround *g = ground;
  double lambda, w = g->wall_thickness / 1000.0;

  *result = (LaminaGroundResult) { .dw = NAN, .u_walls = NAN, .u_basement = NAN,
                                   .u_floor = NAN, .u_ground = NAN, .u_exchange = NAN };
  lambda = ground_conductivity (g, &result->soil_assumed);
  result->soil_conductivity = lambda;
  /* 8.1: B′ = A / (0.5 P) */
  result->b_prime = isnan (b_prime) ? g->area / (0.5 * g->perimeter) : b_prime;
  b_prime = result->b_prime;

  switch (g->kind)
    {
    case LAMINA_GROUND_SUSPENDED:
      /* 9.3: the ground under the floor as a bare slab (Rg = 0), the floor
       * itself with Rsi on both faces (the underfloor space is enclosed). */
      result->dt = w + lambda * (LAMINA_GROUND_RSI + LAMINA_GROUND_RSE);
      result->u_floor = 1.0 / (rf + 2.0 * LAMINA_GROUND_RSI);
      result->u_ground = lamina_ground_slab_u (lambda, b_prime, result->dt);
      result->u_exchange = lamina_ground_underfloor_exchange (b_prime, g->underfloor_height,
                                                              g->underfloor_wall_u, g->vent_area,
                                                              value_or (g->wind_speed, DEFAULT_WIND_SPEED),
                                                              value_or (g->shielding_factor, DEFAULT_SHIELDING));
      result->u = 1.0 / (1.0 / result->u_floor + 1.0 / (result->u_ground + result->u_exchange));
      result->u_without_edge = result->u;
      break;
    case LAMINA_GROUND_BASEMENT:
      result->dt = w + lambda * (LAMINA_GROUND_RSI + rf + LAMINA_GROUND_RSE);
      result->u = lamina_ground_basement_floor_u (lambda, b_prime, result->dt, g->depth);
      result->u_without_edge = result->u;
      if (!isnan (g->basement_wall_resistance))
        {
          /* 9.4: dw = λ (Rsi + Rw + Rse); U′ = (A Ubf + z P Ubw) / (A + z P),
           * per unit of B′: A/P = B′/2. */
          double half_b = b_prime / 2.0;

          result->dw = lambda * (LAMINA_GROUND_RSI_WALL + g->basement_wall_resistance + LAMINA_GROUND_RSE);
          result->u_walls = lamina_ground_basement_wall_u (lambda, g->depth, result->dt, result->dw);
          result->u_basement = (half_b * result->u + g->depth * result->u_walls) / (half_b + g->depth);
        }
      break;
    case LAMINA_GROUND_SLAB:
    case LAMINA_N_GROUND_KINDS:
    default:
      /* 9.1: dt = w + λ (Rsi + Rf + Rse) */
      result->dt = w + lambda * (LAMINA_GROUND_RSI + rf + LAMINA_GROUND_RSE);
      result->u_without_edge = lamina_ground_slab_u (lambda, b_prime, result->dt);
      result->u = result->u_without_edge;
      if (g->edge != LAMINA_EDGE_NONE)
        {
          /* Annex B: U = U0 + 2 ΔΨ / B′ */
          result->delta_psi = lamina_ground_edge_delta_psi (g->edge, lambda, result->dt, g->edge_size,
                                                            g->edge_thickness / 1000.0, g->edge_resistance);
          result->u = result->u_without_edge + 2.0 * result->delta_psi / b_prime;
        }
      break;
    }
}
