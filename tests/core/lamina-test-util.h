/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Small builders for test constructions.  The λ values are the generic
 * design values of EN ISO 10456:2007 Table 3 (from memory) unless a test
 * says otherwise; insulation values are typical declared values. */
#pragma once

#include "lamina-calc.h"
#include "lamina-climate.h"

#include <math.h>
#include <string.h>

static inline LaminaMaterial *
test_material (const char     *id,
               LaminaCategory  category,
               double          conductivity)
{
  return lamina_material_new (id, id, category, conductivity);
}

static inline LaminaLayer *
test_layer (double          thickness,
            const char     *id,
            LaminaCategory  category,
            double          conductivity)
{
  return lamina_layer_new_material (thickness, test_material (id, category, conductivity));
}

static inline LaminaConstruction *
test_wall (void)
{
  return lamina_construction_new ("w", "test wall", LAMINA_ELEMENT_WALL);
}

/* The engine's result, failing the test on an error. */
static inline LaminaResult *
test_calculate (const LaminaConstruction *c)
{
  g_autoptr(GError) error = NULL;
  LaminaResult *r = lamina_calculate (c, &error);

  g_assert_no_error (error);
  g_assert_nonnull (r);
  return r;
}

/* Relative closeness, for figures re-derived by hand in the test. */
#define assert_close(a, b, rel) \
  g_assert_cmpfloat_with_epsilon ((a), (b), (rel) * fabs (b) + 1e-12)

/* A climate of constant monthly means (invented test data), id "site". */
static inline LaminaClimate *
test_constant_climate (double temperature,
                       double humidity)
{
  LaminaClimate *climate = lamina_climate_new ("site", "test");

  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      climate->temperature[m] = temperature;
      climate->humidity[m] = humidity;
    }
  return climate;
}
