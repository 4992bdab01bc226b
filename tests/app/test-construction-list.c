/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window's list model over a library of 1,234 constructions: a text
 * that matches more than LAMINA_CONSTRUCTION_LIST_COUNT_BOUND rows is
 * counted up to the bound + 1 ("1000+ constructions"), and the list grows
 * to the exact count when the view asks for a row near its end (after an
 * idle) or on demand; its rows are the library's, page after page, in the
 * list's order.  No display needed: the model is plain GIO. */
#include <glib/gstdio.h>

#include "lamina-construction-item.h"
#include "lamina-construction-list.h"

#define N_ROWS 1234

static LaminaLibrary *
make_library (void)
{
  g_autofree char *path = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(LaminaImportReport) report = NULL;
  LaminaMaterial *board = lamina_material_new ("test-board", "Test board", LAMINA_CATEGORY_TIMBER, 0.2);
  LaminaLibrary *library;

  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  path = g_build_filename (g_get_user_data_dir (), "list.lamina", NULL);
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_NO_SEED, &error);
  g_assert_no_error (error);
  g_ptr_array_add (cat->materials, lamina_material_copy (board));
  for (guint i = 0; i < N_ROWS; i++)
    {
      g_autofree char *id = g_strdup_printf ("list-%04u", i);
      g_autofree char *name = g_strdup_printf ("%s wall %u", i % 10 == 0 ? "Rare" : "Timber", i);
      LaminaConstruction *c = lamina_construction_new (id, name, LAMINA_ELEMENT_WALL);

      g_free (c->code);
      c->code = g_strdup_printf ("EW-%04u", i);
      lamina_construction_add_layer (c, lamina_layer_new_material (100, lamina_material_copy (board)));
      g_ptr_array_add (cat->constructions, c);
    }
  lamina_material_free (board);
  report = lamina_library_import (library, cat, 0, "test", &error);
  g_assert_no_error (error);
  return library;
}

static void
on_items_changed_cb (GListModel *model,
                     guint       position,
                     guint       removed,
                     guint       added,
                     guint      *grown)
{
  if (position > 0 && removed == 0)
    *grown += added;
}

static const char *
id_at (LaminaConstructionList *list,
       guint                   position)
{
  g_autoptr(LaminaConstructionItem) item = g_list_model_get_item (G_LIST_MODEL (list), position);

  g_assert_nonnull (item);
  return lamina_construction_item_get_id (item);
}

static void
test_count_bound (void)
{
  g_autoptr(LaminaLibrary) library = make_library ();
  g_autoptr(LaminaConstructionList) list = lamina_construction_list_new (library);
  guint grown = 0;

  g_signal_connect (list, "items-changed", G_CALLBACK (on_items_changed_cb), &grown);

  /* Everything: 1,234 rows counted up to 1,001. */
  g_assert_cmpuint (g_list_model_get_n_items (G_LIST_MODEL (list)), ==, LAMINA_CONSTRUCTION_LIST_COUNT_BOUND + 1);
  g_assert_false (lamina_construction_list_is_count_exact (list));
  g_assert_cmpstr (id_at (list, 0), ==, "list-0000");
  g_assert_cmpstr (id_at (list, 700), ==, "list-0700");

  /* A row near the end: the exact count follows in an idle. */
  g_assert_cmpstr (id_at (list, LAMINA_CONSTRUCTION_LIST_COUNT_BOUND), ==, "list-1000");
  while (g_main_context_iteration (NULL, FALSE))
    ;
  g_assert_true (lamina_construction_list_is_count_exact (list));
  g_assert_cmpuint (g_list_model_get_n_items (G_LIST_MODEL (list)), ==, N_ROWS);
  g_assert_cmpuint (grown, ==, N_ROWS - LAMINA_CONSTRUCTION_LIST_COUNT_BOUND - 1);
  g_assert_cmpstr (id_at (list, N_ROWS - 1), ==, "list-1233");

  /* A text that matches 1,110 of them (every name but the rare ones has
   * "timber"): bounded again, exact on demand. */
  lamina_construction_list_set_text (list, "timb");
  g_assert_false (lamina_construction_list_is_count_exact (list));
  g_assert_cmpstr (id_at (list, 0), ==, "list-0001");
  lamina_construction_list_count_exactly (list);
  g_assert_true (lamina_construction_list_is_count_exact (list));
  g_assert_cmpuint (g_list_model_get_n_items (G_LIST_MODEL (list)), ==, N_ROWS - (N_ROWS + 9) / 10);

  /* A text under the bound is counted exactly at once. */
  lamina_construction_list_set_text (list, "rare");
  g_assert_true (lamina_construction_list_is_count_exact (list));
  g_assert_cmpuint (g_list_model_get_n_items (G_LIST_MODEL (list)), ==, (N_ROWS + 9) / 10);
  g_assert_cmpstr (id_at (list, 1), ==, "list-0010");
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/app/construction-list/count-bound", test_count_bound);
  return g_test_run ();
}
