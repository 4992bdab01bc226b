/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-material.h: a building material with its design values. */
#pragma once

#include <glib-object.h>

#include "lamina-types.h"

G_BEGIN_DECLS

/* The physical range of a design thermal conductivity, W/(m·K): the lowest
 * of a building material is a vacuum insulation panel's, about 0.007, the
 * highest copper's, 380 (EN ISO 10456:2007, Table 3; from memory); the
 * limits leave room on both sides and refuse a typing slip (1e-300). */
#define LAMINA_MIN_CONDUCTIVITY 0.001
#define LAMINA_MAX_CONDUCTIVITY 1000.0

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
  /* Thicknesses the product is sold in, mm, ascending; none when
   * n_stock_thicknesses is 0.  Used to snap a solved thickness. */
  double         *stock_thicknesses;
  guint           n_stock_thicknesses;
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
/* Replaces the stock thicknesses with a sorted copy of @thicknesses
 * (duplicates dropped); @n 0 clears them. */
void            lamina_material_set_stock_thicknesses (LaminaMaterial *material,
                                                       const double   *thicknesses,
                                                       guint           n);
/* "12.5 15 25" (C locale, as in the catalogue XML), or NULL when none. */
char           *lamina_material_dup_stock_string      (const LaminaMaterial *material);
/* Parses a space-separated list of positive thicknesses in mm; FALSE with
 * @error naming the bad item. */
gboolean        lamina_material_parse_stock_string    (LaminaMaterial *material,
                                                       const char     *text,
                                                       GError        **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (LaminaMaterial, lamina_material_free)

G_END_DECLS
