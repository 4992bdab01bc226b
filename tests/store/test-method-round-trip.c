/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The rest of the method survives every way a construction travels: the
 * catalogue XML (<ground>, <unheated-space>, <surfaces>, tapered and air
 * attributes) and the store's revision body.  The figures are those of
 * EN ISO 13370 and EN ISO 6946 Annex E as the core tests check them. */
#include <math.h>
#include <string.h>

#include "lamina-calc.h"
#include "lamina-catalogue.h"
#include "lamina-store-json.h"

static LaminaCatalogue *
read_example (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "examples",
                                            "ground-floor-and-tapered-roof.xml", NULL);
  g_autoptr(GError) error = NULL;
  LaminaCatalogue *catalogue = lamina_catalogue_read_file (path, &error);

  g_assert_no_error (error);
  return catalogue;
}

static const LaminaConstruction *
find (const LaminaCatalogue *catalogue,
      const char            *id)
{
  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[i];
      if (g_strcmp0 (c->id, id) == 0)
        return c;
    }
  g_error ("no construction %s", id);
}

static void
test_read (void)
{
  g_autoptr(LaminaCatalogue) catalogue = read_example ();
  const LaminaConstruction *slab = find (catalogue, "slab-on-ground");
  const LaminaConstruction *suspended = find (catalogue, "suspended-timber");
  const LaminaConstruction *roof = find (catalogue, "tapered-flat-roof");
  const LaminaConstruction *ceiling = find (catalogue, "loft-ceiling");
  const LaminaConstruction *wall = find (catalogue, "cavity-wall");
  const LaminaLayer *wedge = roof->layers->pdata[1];
  const LaminaLayer *cavity = wall->layers->pdata[1];

  g_assert_true (slab->has_ground);
  g_assert_cmpint (slab->ground.kind, ==, LAMINA_GROUND_SLAB);
  g_assert_cmpfloat (slab->ground.area, ==, 120);
  g_assert_cmpfloat (slab->ground.perimeter, ==, 46);
  g_assert_cmpfloat (slab->ground.wall_thickness, ==, 350);
  g_assert_cmpint (slab->ground.soil, ==, LAMINA_SOIL_CLAY_SILT);
  g_assert_cmpint (slab->ground.edge, ==, LAMINA_EDGE_VERTICAL);
  g_assert_cmpint (suspended->ground.kind, ==, LAMINA_GROUND_SUSPENDED);
  g_assert_cmpfloat (suspended->ground.vent_area, ==, 0.0015);
  g_assert_cmpint (wedge->taper, ==, LAMINA_TAPER_APEX_THICK);
  g_assert_cmpfloat (wedge->thickness, ==, 60);
  g_assert_cmpfloat (wedge->thickness_max, ==, 220);
  g_assert_cmpint (ceiling->unheated.kind, ==, LAMINA_UNHEATED_ROOF_SPACE);
  g_assert_cmpint (ceiling->unheated.roof, ==, LAMINA_ROOF_TILES_FELT);
  g_assert_cmpfloat (wall->surfaces.wind_speed, ==, 6);
  g_assert_true (wall->surfaces.air_from_profile);
  g_assert_cmpfloat (cavity->air_width, ==, 450);
}

/* Written and read back, and through the store's JSON body, every
 * construction is the same and calculates to the same U. */
static void
test_round_trips (void)
{
  g_autoptr(LaminaCatalogue) catalogue = read_example ();
  g_autoptr(GError) error = NULL;
  g_autofree char *xml = lamina_catalogue_write_to_string (catalogue, 0, NULL, &error);
  g_autoptr(LaminaCatalogue) back = NULL;

  g_assert_no_error (error);
  back = lamina_catalogue_read_memory (xml, strlen (xml), "written.xml", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (back->constructions->len, ==, catalogue->constructions->len);
  for (guint i = 0; i < catalogue->constructions->len; i++)
    {
      const LaminaConstruction *c = catalogue->constructions->pdata[i];
      g_autofree char *body = lamina_store_construction_to_json (c);
      g_autoptr(LaminaConstruction) stored = lamina_store_construction_from_json (body, &error);
      g_autoptr(LaminaResult) a = lamina_calculate (c, NULL);
      g_autoptr(LaminaResult) b = NULL;

      g_assert_no_error (error);
      g_assert_true (lamina_construction_equal_content (c, back->constructions->pdata[i]));
      stored->id = g_strdup (c->id);
      g_assert_true (lamina_construction_equal_content (c, stored));
      b = lamina_calculate (stored, NULL);
      g_assert_cmpfloat (a->u, ==, b->u);
      g_assert_cmpint (a->has_ground, ==, b->has_ground);
      if (a->has_ground)
        g_assert_cmpfloat (a->ground.u, ==, b->ground.u);
    }
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/store/method/read", test_read);
  g_test_add_func ("/store/method/round-trips", test_round_trips);
  return g_test_run ();
}
