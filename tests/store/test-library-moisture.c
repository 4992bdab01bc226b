/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Climates in the office library (EN ISO 13788): stored and read back
 * exactly, carried by the constructions checked with them, flagged like a
 * material change when their data change, exported and imported with the
 * catalogue, and found by "fails its moisture check".  The climates are
 * invented test data. */
#include "lamina-store-test-util.h"
#include "lamina-moisture.h"


static LaminaLibrary *
open_library (const char *name)
{
  g_autofree char *path = test_library_location (name);
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);

  g_assert_no_error (error);
  return library;
}

/* The seeded wall (plasterboard μ 10, studs/wool, OSB μ 50: EN ISO 10456
 * Table 3 from memory) has no vapour control layer: in a cold climate with
 * humidity class 4 it traps water that does not dry out. */
static LaminaConstruction *
make_checked_wall (LaminaLibrary *library,
                   const char    *climate,
                   int            humidity_class)
{
  LaminaConstruction *c = test_make_wall (library, "EW-M", "Wall with moisture check", NULL, 145);

  lamina_construction_set_moisture (c, lamina_moisture_settings_new (climate));
  c->moisture->humidity_class = humidity_class;
  return c;
}

static void
test_climate_round_trip (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("climates.sqlite");
  g_autoptr(LaminaClimate) climate = test_make_climate ("north", -8);
  g_autoptr(LaminaClimate) back = NULL;
  g_autoptr(GPtrArray) list = NULL;
  g_autoptr(GError) error = NULL;

  g_assert_true (lamina_library_put_climate (library, climate, &error));
  g_assert_no_error (error);
  back = lamina_library_dup_climate (library, "north", &error);
  g_assert_no_error (error);
  g_assert_true (lamina_climate_equal (climate, back));
  list = lamina_library_list_climates (library, &error);
  g_assert_cmpuint (list->len, ==, 1);
  /* bad months are refused, naming the month */
  climate->humidity[4] = 1.2;
  g_assert_false (lamina_library_put_climate (library, climate, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "month 5"));
}

static void
test_construction_carries_climate (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("carries.sqlite");
  g_autoptr(LaminaClimate) climate = test_make_climate ("north", -8);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaConstruction) back = NULL;
  g_autoptr(LaminaConstruction) bad = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  g_autofree char *bad_id = NULL;

  g_assert_true (lamina_library_put_climate (library, climate, NULL));
  c = make_checked_wall (library, "north", 4);
  ((LaminaLayer *) c->layers->pdata[2])->sd = 3.5;
  id = lamina_library_create_construction (library, c, "tester", &error);
  g_assert_no_error (error);
  back = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_no_error (error);
  g_assert_nonnull (back->moisture);
  g_assert_cmpstr (back->moisture->climate, ==, "north");
  g_assert_cmpint (back->moisture->humidity_class, ==, 4);
  g_assert_true (lamina_climate_equal (back->moisture->climate_data, climate));
  g_assert_cmpfloat (((LaminaLayer *) back->layers->pdata[2])->sd, ==, 3.5);
  g_assert_true (isnan (((LaminaLayer *) back->layers->pdata[0])->sd));
  g_assert_true (lamina_moisture_settings_equal (c->moisture, back->moisture));
  for (guint i = 0; i < c->layers->len; i++)
    g_assert_true (lamina_layer_equal (c->layers->pdata[i], back->layers->pdata[i]));
  g_assert_true (lamina_construction_equal_content (c, back));

  /* a climate the library lacks is refused with the field named */
  bad = make_checked_wall (library, "nowhere", 2);
  bad_id = lamina_library_create_construction (library, bad, "tester", &error);
  g_assert_null (bad_id);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "nowhere"));
}

static guint
count_flagged (LaminaLibrary *library,
               gboolean       moisture)
{
  LaminaLibraryQuery q;
  g_autoptr(GPtrArray) rows = NULL;

  lamina_library_query_init (&q);
  if (moisture)
    q.moisture_fails_only = TRUE;
  else
    q.material_changed_only = TRUE;
  rows = lamina_library_search (library, &q, NULL);
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, rows->len);
  return rows->len;
}

/* A change of climate data flags the construction as a material change
 * does; updating it takes the new data and clears the flag.  The seeded wall
 * without vapour control fails for class 4 in a −8 °C winter and passes in
 * a mild one (+6 °C) at class 1; the "fails" filter finds only the first. */
static void
test_flags_and_filter (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("flags.sqlite");
  g_autoptr(LaminaClimate) cold = test_make_climate ("cold", -8);
  g_autoptr(LaminaClimate) mild = test_make_climate ("mild", 6);
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(LaminaConstruction) b = NULL;
  g_autoptr(LaminaConstruction) back = NULL;
  g_autoptr(LaminaMoistureResult) ra = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *ida = NULL, *idb = NULL;
  int revision;

  g_assert_true (lamina_library_put_climate (library, cold, NULL));
  g_assert_true (lamina_library_put_climate (library, mild, NULL));
  a = make_checked_wall (library, "cold", 4);
  b = make_checked_wall (library, "mild", 1);
  g_free (b->code);
  b->code = g_strdup ("EW-N");
  ida = lamina_library_create_construction (library, a, NULL, &error);
  g_assert_no_error (error);
  idb = lamina_library_create_construction (library, b, NULL, &error);
  g_assert_no_error (error);
  back = lamina_library_dup_construction (library, ida, 0, NULL);
  ra = lamina_moisture_calculate_own (back, NAN, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_moisture_result_fails (ra));   /* the test is not empty */
  g_assert_cmpuint (count_flagged (library, TRUE), ==, 1);
  g_assert_cmpuint (count_flagged (library, FALSE), ==, 0);

  /* the library's cold climate gets colder: only "a" is flagged */
  cold->temperature[0] -= 2;
  g_assert_true (lamina_library_put_climate (library, cold, NULL));
  g_assert_cmpuint (count_flagged (library, FALSE), ==, 1);
  revision = lamina_library_update_materials (library, ida, 0, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpint (revision, ==, 2);
  g_clear_pointer (&back, lamina_construction_free);
  back = lamina_library_dup_construction (library, ida, 0, NULL);
  g_assert_cmpfloat (back->moisture->climate_data->temperature[0], ==, cold->temperature[0]);
  g_assert_cmpuint (count_flagged (library, FALSE), ==, 0);
  /* a material change still flags it too */
  {
    g_autoptr(LaminaMaterial) osb = lamina_library_dup_material (library, "iso10456-osb-650", NULL);

    osb->vapour_resistance_factor = 200;
    g_assert_true (lamina_library_put_material (library, osb, NULL));
    g_assert_cmpuint (count_flagged (library, FALSE), ==, 2);
  }
}

/* Export writes the climates the constructions use; importing into a fresh
 * library brings them back exactly. */
static void
test_export_import (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("export.sqlite");
  g_autoptr(LaminaLibrary) other = open_library ("import.sqlite");
  g_autoptr(LaminaClimate) cold = test_make_climate ("cold", -8);
  g_autoptr(LaminaClimate) unused = test_make_climate ("unused", 2);
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(LaminaCatalogue) cat = NULL;
  g_autoptr(LaminaCatalogue) reread = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaClimate) back = NULL;
  g_autoptr(LaminaConstruction) imported = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  g_autofree char *text = NULL;
  const char *ids[2] = { NULL, NULL };
  gsize length;

  g_assert_true (lamina_library_put_climate (library, cold, NULL));
  g_assert_true (lamina_library_put_climate (library, unused, NULL));
  a = make_checked_wall (library, "cold", 3);
  id = lamina_library_create_construction (library, a, NULL, &error);
  g_assert_no_error (error);
  ids[0] = id;
  cat = lamina_library_export (library, ids, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (cat->climates->len, ==, 1);
  text = lamina_catalogue_write_to_string (cat, LAMINA_WRITE_DEFAULT, &length, &error);
  g_assert_no_error (error);
  reread = lamina_catalogue_read_memory (text, length, "export.xml", &error);
  g_assert_no_error (error);
  report = lamina_library_import (other, reread, LAMINA_IMPORT_DEFAULT, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (report->n_added, ==, 1);
  back = lamina_library_dup_climate (other, "cold", &error);
  g_assert_no_error (error);
  g_assert_true (lamina_climate_equal (back, cold));
  imported = lamina_library_dup_construction (other, id, 0, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_climate_equal (imported->moisture->climate_data, cold));
  /* a whole export carries every climate */
  g_clear_pointer (&cat, lamina_catalogue_free);
  cat = lamina_library_export (library, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (cat->climates->len, ==, 2);
}

/* An import is all or nothing, climates included: when the last
 * construction cannot be stored (here a trigger refuses its revision, as a
 * full disk or a broken connection would at that point), the climate the
 * document brought is not left behind. */
static void
test_failed_import_leaves_no_climate (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("source.sqlite");
  g_autofree char *path = test_library_location ("refusing.sqlite");
  g_autoptr(LaminaLibrary) other = NULL;
  g_autoptr(LaminaClimate) cold = test_make_climate ("cold", -8);
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(LaminaConstruction) b = NULL;
  g_autoptr(LaminaCatalogue) cat = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaClimate) back = NULL;
  g_autoptr(GPtrArray) list = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *first = NULL;
  g_autofree char *last = NULL;
  g_autofree char *sql = NULL;

  g_assert_true (lamina_library_put_climate (library, cold, NULL));
  a = make_checked_wall (library, "cold", 3);
  first = lamina_library_create_construction (library, a, NULL, &error);
  g_assert_no_error (error);
  b = make_checked_wall (library, "cold", 2);
  g_free (b->code);
  b->code = g_strdup ("EW-N");
  last = lamina_library_create_construction (library, b, NULL, &error);
  g_assert_no_error (error);
  cat = lamina_library_export (library, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (cat->climates->len, ==, 1);
  g_assert_cmpuint (cat->constructions->len, ==, 2);
  g_assert_cmpstr (((LaminaConstruction *) cat->constructions->pdata[1])->id, ==, last);

  g_clear_object (&other);
  other = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  g_clear_object (&other);
  if (test_on_server ())
    sql = g_strdup_printf ("CREATE FUNCTION refuse_last () RETURNS trigger LANGUAGE plpgsql AS $$"
                           " BEGIN RAISE EXCEPTION 'refused by the test' USING ERRCODE = 'check_violation';"
                           " END $$;"
                           "CREATE TRIGGER refuse_last BEFORE INSERT ON revision FOR EACH ROW"
                           " WHEN (NEW.construction_id = '%s') EXECUTE FUNCTION refuse_last ();", last);
  else
    sql = g_strdup_printf ("CREATE TRIGGER refuse_last BEFORE INSERT ON revision"
                           " WHEN NEW.construction_id = '%s'"
                           " BEGIN SELECT RAISE (ABORT, 'refused by the test'); END;", last);
  g_assert_true (test_raw_exec (path, sql));

  other = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  report = lamina_library_import (other, cat, LAMINA_IMPORT_DEFAULT, NULL, &error);
  g_assert_null (report);
  /* the constraint the trigger raises reads as a refused value */
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "the library is unchanged"));
  g_clear_error (&error);
  back = lamina_library_dup_climate (other, "cold", &error);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_assert_null (back);
  g_clear_error (&error);
  list = lamina_library_list_climates (other, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (list->len, ==, 0);
  g_assert_null (lamina_library_dup_construction (other, first, 0, NULL));
}

/* The office's limit on the largest accumulation (EN ISO 13788:2012 sets
 * none; 0.5 kg/m² by default is common practice) is the library's: the
 * stored "fails" flags follow it when it changes and when a revision is
 * stored.  The seeded wall without vapour control at class 2 in the mild
 * climate (winter +6 °C) condenses, dries out by the year's end and passes
 * on the surface; its largest accumulation, about 1.08 kg/m² as calculated,
 * is then the only thing that fails it. */
static void
test_office_limit (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("limit.sqlite");
  g_autoptr(LaminaClimate) mild = test_make_climate ("mild", 6);
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(LaminaConstruction) back = NULL;
  g_autoptr(LaminaMoistureResult) r = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  const double bad[] = { 0, -0.5, LAMINA_MOISTURE_LIMIT_MAX + 1, NAN };

  g_assert_cmpfloat (lamina_library_get_moisture_limit (library), ==, LAMINA_MOISTURE_DEFAULT_LIMIT);
  g_assert_true (lamina_library_put_climate (library, mild, NULL));
  a = make_checked_wall (library, "mild", 2);
  id = lamina_library_create_construction (library, a, NULL, &error);
  g_assert_no_error (error);
  back = lamina_library_dup_construction (library, id, 0, NULL);
  r = lamina_moisture_calculate_own (back, NAN, &error);
  g_assert_no_error (error);
  g_assert_true (r->condensation && r->dries_out && r->surface_passes);
  g_assert_cmpfloat (r->max_accumulation, >, 0.5);
  g_assert_cmpfloat (r->max_accumulation, <, 2.0);
  g_assert_cmpuint (count_flagged (library, TRUE), ==, 1);

  /* a looser office limit clears the flag at once, and a new revision keeps it clear */
  g_assert_true (lamina_library_set_moisture_limit (library, 2.0, &error));
  g_assert_no_error (error);
  g_assert_cmpfloat (lamina_library_get_moisture_limit (library), ==, 2.0);
  g_assert_cmpuint (count_flagged (library, TRUE), ==, 0);
  back->description = (g_free (back->description), g_strdup ("Edited after the limit changed"));
  g_assert_true (lamina_library_save_construction (library, back, back->revision, NULL, &error));
  g_assert_no_error (error);
  g_assert_cmpint (back->revision, ==, 2);
  g_assert_cmpuint (count_flagged (library, TRUE), ==, 0);
  /* back to the default: flagged again */
  g_assert_true (lamina_library_set_moisture_limit (library, 0.5, &error));
  g_assert_cmpuint (count_flagged (library, TRUE), ==, 1);

  /* refusals name the setting and leave it as it was */
  for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      g_assert_false (lamina_library_set_moisture_limit (library, bad[i], &error));
      g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
      g_assert_nonnull (strstr (error->message, "moisture limit"));
      g_clear_error (&error);
    }
  g_assert_cmpfloat (lamina_library_get_moisture_limit (library), ==, 0.5);
}

/* A climate is deleted only while no construction's latest revision is
 * checked with it. */
static void
test_delete_climate (void)
{
  g_autoptr(LaminaLibrary) library = open_library ("delete.sqlite");
  g_autoptr(LaminaClimate) cold = test_make_climate ("cold", -8);
  g_autoptr(LaminaClimate) unused = test_make_climate ("unused", 2);
  g_autoptr(LaminaConstruction) a = NULL;
  g_autoptr(GPtrArray) list = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  g_assert_true (lamina_library_put_climate (library, cold, NULL));
  g_assert_true (lamina_library_put_climate (library, unused, NULL));
  a = make_checked_wall (library, "cold", 2);
  id = lamina_library_create_construction (library, a, NULL, &error);
  g_assert_no_error (error);

  g_assert_false (lamina_library_delete_climate (library, "cold", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IN_USE);
  g_assert_nonnull (strstr (error->message, "EW-M"));
  g_clear_error (&error);
  g_assert_true (lamina_library_delete_climate (library, "unused", &error));
  g_assert_no_error (error);
  g_assert_false (lamina_library_delete_climate (library, "unused", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);
  /* once its only user is deleted, it may go */
  g_assert_true (lamina_library_delete_construction (library, id, NULL, &error));
  g_assert_true (lamina_library_delete_climate (library, "cold", &error));
  g_assert_no_error (error);
  list = lamina_library_list_climates (library, &error);
  g_assert_cmpuint (list->len, ==, 0);
}

int
main (int argc, char **argv)
{

  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/store/moisture/climate-round-trip", test_climate_round_trip);
  g_test_add_func ("/store/moisture/construction-carries-climate", test_construction_carries_climate);
  g_test_add_func ("/store/moisture/flags-and-filter", test_flags_and_filter);
  g_test_add_func ("/store/moisture/export-import", test_export_import);
  g_test_add_func ("/store/moisture/failed-import-leaves-no-climate",
                   test_failed_import_leaves_no_climate);
  g_test_add_func ("/store/moisture/office-limit", test_office_limit);
  g_test_add_func ("/store/moisture/delete-climate", test_delete_climate);
  return g_test_run ();
}
