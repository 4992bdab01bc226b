/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-store-test-util.h: constructions and files for the store tests. */
#pragma once

#include <glib.h>
#include <glib/gstdio.h>
#include <math.h>

#include "lamina-library.h"

/* A timber-frame wall built from the seeded library materials:
 * plasterboard, studs with mineral wool between, OSB.  @tag and @insulation_mm
 * vary the build-up so that many different constructions can be made. */
static inline LaminaConstruction *
test_make_wall (LaminaLibrary *library,
                const char    *code,
                const char    *name,
                const char    *tag,
                double         insulation_mm)
{
  LaminaConstruction *c = lamina_construction_new (NULL, name, LAMINA_ELEMENT_WALL);
  LaminaLayer *bridged = lamina_layer_new_bridged (insulation_mm);

  c->code = g_strdup (code);
  c->description = g_strdup ("Timber frame wall for an invented test scenario");
  if (tag != NULL)
    lamina_construction_add_tag (c, tag);
  lamina_construction_add_layer (c, lamina_layer_new_material (12.5,
    lamina_library_dup_material (library, "iso10456-plasterboard-700", NULL)));
  lamina_layer_add_part (bridged, lamina_part_new_framing (
    lamina_library_dup_material (library, "iso10456-softwood-500", NULL), 45, 600, "stud"));
  lamina_layer_add_part (bridged, lamina_part_new (
    lamina_library_dup_material (library, "typical-mineral-wool-035", NULL), NAN));
  lamina_construction_add_layer (c, bridged);
  lamina_construction_add_layer (c, lamina_layer_new_material (15,
    lamina_library_dup_material (library, "iso10456-osb-650", NULL)));
  c->target_u = 0.30;
  return c;
}

static inline char *
test_checksum (const char *path)
{
  g_autofree char *data = NULL;
  gsize len = 0;

  g_assert_true (g_file_get_contents (path, &data, &len, NULL));
  return g_compute_checksum_for_data (G_CHECKSUM_SHA256, (const guchar *) data, len);
}

static inline char *
test_library_path (const char *name)
{
  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  return g_build_filename (g_get_user_data_dir (), name, NULL);
}

/* An invented climate (test data only): winter @winter °C in January,
 * 18 K warmer in July, damp winters. */
static inline LaminaClimate *
test_make_climate (const char *id,
                   double      winter)
{
  static const double h[LAMINA_MONTHS] = { .88, .85, .80, .75, .72, .74, .75, .77, .80, .84, .87, .89 };
  LaminaClimate *climate = lamina_climate_new (id, "Test climate");

  climate->source = g_strdup ("invented for a test");
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      climate->temperature[m] = winter + 18.0 * (1.0 - cos (2.0 * G_PI * m / 12.0)) / 2.0;
      climate->humidity[m] = h[m];
    }
  return climate;
}
