/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-seed.c: the materials a new library starts with.
 *
 * Generic design values from EN ISO 10456:2007, Table 3 (λ W/(m·K),
 * ρ kg/m³, c J/(kg·K), μ dry cup).  The standard is not freely published;
 * these values are recalled from memory (medium-high confidence), which
 * each material's notes say ("value recalled, verify").  Insulation has no
 * generic value in the table: the insulation entries are typical declared
 * values (common practice) that must be replaced by the product's own
 * declaration. */
#define G_LOG_DOMAIN "lamina-store"

#include "lamina-sqlite-private.h"

#include <math.h>

#include "lamina-library-seed.h"
#include "lamina-store-common.h"

/* The source names the table; that the value is recalled goes in the
 * material's notes, once, not into every source string. */
#define TABLE3 "EN ISO 10456:2007 Table 3"
#define TYPICAL "typical declared value (common practice)"

static const LaminaSeedMaterial seed[] = {
  /* id, name, category, λ, ρ, c, μ, source.  Names carry no λ (it is a
   * column of its own) and no two entries differ only by a nearby λ. */
  { "iso10456-concrete-1800", "Concrete, medium density 1800 kg/m³", LAMINA_CATEGORY_CONCRETE, 1.15, 1800, 1000, 100, TABLE3 },
  { "iso10456-concrete-2000", "Concrete, medium density 2000 kg/m³", LAMINA_CATEGORY_CONCRETE, 1.35, 2000, 1000, 100, TABLE3 },
  { "iso10456-concrete-2200", "Concrete, medium density 2200 kg/m³", LAMINA_CATEGORY_CONCRETE, 1.65, 2200, 1000, 120, TABLE3 },
  { "iso10456-concrete-2400", "Concrete, high density 2400 kg/m³", LAMINA_CATEGORY_CONCRETE, 2.00, 2400, 1000, 130, TABLE3 },
  { "iso10456-concrete-reinforced-1", "Reinforced concrete, 1 % steel", LAMINA_CATEGORY_CONCRETE, 2.3, 2300, 1000, 130, TABLE3 },
  { "iso10456-plasterboard-700", "Gypsum plasterboard 700 kg/m³", LAMINA_CATEGORY_BOARD, 0.21, 700, 1000, 10, TABLE3 },
  { "iso10456-plasterboard-900", "Gypsum plasterboard 900 kg/m³", LAMINA_CATEGORY_BOARD, 0.25, 900, 1000, 10, TABLE3 },
  { "iso10456-gypsum-plaster-1000", "Gypsum plaster 1000 kg/m³", LAMINA_CATEGORY_PLASTER, 0.40, 1000, 1000, 10, TABLE3 },
  { "iso10456-gypsum-plaster-1300", "Gypsum plaster 1300 kg/m³", LAMINA_CATEGORY_PLASTER, 0.57, 1300, 1000, 10, TABLE3 },
  { "iso10456-render-1800", "Cement-sand render 1800 kg/m³", LAMINA_CATEGORY_PLASTER, 1.00, 1800, 1000, 10, TABLE3 },
  { "iso10456-softwood-500", "Softwood timber 500 kg/m³", LAMINA_CATEGORY_TIMBER, 0.13, 500, 1600, 50, TABLE3 },
  { "iso10456-hardwood-700", "Hardwood timber 700 kg/m³", LAMINA_CATEGORY_TIMBER, 0.18, 700, 1600, 50, TABLE3 },
  { "iso10456-plywood-500", "Plywood 500 kg/m³", LAMINA_CATEGORY_BOARD, 0.13, 500, 1600, 200, TABLE3 },
  { "iso10456-osb-650", "Oriented strand board (OSB) 650 kg/m³", LAMINA_CATEGORY_BOARD, 0.13, 650, 1700, 50, TABLE3 },
  { "iso10456-particleboard-600", "Particle board 600 kg/m³", LAMINA_CATEGORY_BOARD, 0.14, 600, 1700, 50, TABLE3 },
  { "iso10456-steel", "Steel", LAMINA_CATEGORY_METAL, 50, 7800, 450, NAN, TABLE3 },
  { "iso10456-stainless-steel", "Stainless steel", LAMINA_CATEGORY_METAL, 17, 7900, 500, NAN, TABLE3 },
  { "iso10456-aluminium", "Aluminium alloys", LAMINA_CATEGORY_METAL, 160, 2800, 880, NAN, TABLE3 },
  { "iso10456-copper", "Copper", LAMINA_CATEGORY_METAL, 380, 8900, 380, NAN, TABLE3 },
  { "iso10456-glass", "Glass, soda lime", LAMINA_CATEGORY_GLASS, 1.00, 2500, 750, NAN, TABLE3 },
  { "iso10456-water", "Water at 10 °C", LAMINA_CATEGORY_OTHER, 0.60, 1000, 4190, NAN, TABLE3 },
  /* Insulation products: typical declared values, not Table 3. */
  { "typical-mineral-wool-035", "Stone mineral wool batt", LAMINA_CATEGORY_INSULATION, 0.035, 30, 1030, 1, TYPICAL },
  { "typical-mineral-wool-040", "Glass mineral wool roll", LAMINA_CATEGORY_INSULATION, 0.040, 20, 1030, 1, TYPICAL },
  { "typical-eps-035", "Expanded polystyrene (EPS) board", LAMINA_CATEGORY_INSULATION, 0.035, 20, 1450, 60, TYPICAL },
  { "typical-xps-034", "Extruded polystyrene (XPS) board", LAMINA_CATEGORY_INSULATION, 0.034, 35, 1450, 150, TYPICAL },
  { "typical-pir-022", "Polyisocyanurate (PIR) board, foil-faced", LAMINA_CATEGORY_INSULATION, 0.022, 30, 1400, 60, TYPICAL },
  { "typical-wood-fibre-040", "Wood-fibre insulation board", LAMINA_CATEGORY_INSULATION, 0.040, 160, 2100, 5, TYPICAL },
};

const LaminaSeedMaterial *
lamina_library_get_seed_materials (guint *n)
{
  *n = G_N_ELEMENTS (seed);
  return seed;
}

gboolean
lamina_sqlite_seed_materials (LaminaSqlite  *self,
                              GError       **error)
{
  g_autofree char *stamp = lamina_library_dup_now ();

  for (guint i = 0; i < G_N_ELEMENTS (seed); i++)
    {
      g_autoptr(LaminaMaterial) m = lamina_store_seed_material_new (i);

      if (!lamina_sqlite_put_material (self, m, stamp, error))
        return FALSE;
    }
  return TRUE;
}
