/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window on a library of 10,000 constructions (issue 5: "works
 * smoothly with 10,000 entries"): time to the first frame, a jump to a far
 * row of the list, and search as you type, each to the next drawn frame.
 * A benchmark (meson test --benchmark), never a pass/fail test. */
#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <stdio.h>
#include <string.h>

#include "lamina-application.h"
#include "lamina-bench.h"
#include "lamina-construction-item.h"
#include "lamina-window.h"

#define N_CONSTRUCTIONS 10000

static double
now_ms (void)
{
  return g_get_monotonic_time () / 1000.0;
}

static void
settle (GtkWidget *widget)
{
  gtk_test_widget_wait_for_draw (widget);
  while (g_main_context_pending (NULL))
    g_main_context_iteration (NULL, FALSE);
}

static LaminaLibrary *
build_library (const char *path)
{
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(GPtrArray) materials = lamina_bench_dup_materials ();
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_NO_SEED, &error);

  g_assert_no_error (error);
  for (guint i = 0; i < materials->len; i++)
    g_ptr_array_add (cat->materials, g_steal_pointer (&materials->pdata[i]));
  for (guint i = 0; i < N_CONSTRUCTIONS; i++)
    g_ptr_array_add (cat->constructions, lamina_bench_make_construction (LAMINA_BENCH_SEED, i));
  report = lamina_library_import (library, cat, 0, "bench", &error);
  g_assert_no_error (error);
  return library;
}

int
main (int   argc,
      char *argv[])
{
  g_autofree char *dir = g_dir_make_tmp ("lamina-bench-window-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  const char *prefixes[] = { "w", "wa", "wal", "wall", "walls" };
  LaminaWindow *window;
  GListModel *list;
  double t0;

  gtk_init ();
  library = build_library (path);
  lamina_application_load_style ();

  t0 = now_ms ();
  window = lamina_window_new (NULL, library);
  gtk_window_set_default_size (GTK_WINDOW (window), 1200, 760);
  gtk_window_present (GTK_WINDOW (window));
  settle (GTK_WIDGET (window));
  printf ("window-first-frame-10k        %8.1f ms\n", now_ms () - t0);

  list = G_LIST_MODEL (lamina_window_get_list (window));
  g_assert_cmpuint (g_list_model_get_n_items (list), ==, N_CONSTRUCTIONS);
  t0 = now_ms ();
  for (guint i = 0; i < 100; i++)
    {
      g_autoptr(GObject) item = g_list_model_get_item (list, g_random_int_range (0, N_CONSTRUCTIONS));
    }
  printf ("list-random-row (mean of 100) %8.2f ms\n", (now_ms () - t0) / 100);

  for (guint i = 0; i < G_N_ELEMENTS (prefixes); i++)
    {
      LaminaLibraryQuery query;
      g_autoptr(GPtrArray) page = NULL;
      double t1;

      /* The store's share: one COUNT and one page of rows. */
      lamina_library_query_init (&query);
      query.text = prefixes[i];
      t1 = now_ms ();
      lamina_library_count (library, &query, NULL);
      printf ("  store count “%s”%*s %8.1f ms\n", prefixes[i], (int) (8 - strlen (prefixes[i])), "", now_ms () - t1);
      query.limit = 64;
      t1 = now_ms ();
      page = lamina_library_search (library, &query, NULL);
      printf ("  store page  “%s”%*s %8.1f ms\n", prefixes[i], (int) (8 - strlen (prefixes[i])), "", now_ms () - t1);

      t0 = now_ms ();
      lamina_window_set_search (window, prefixes[i]);
      printf ("  model and selection         %8.1f ms\n", now_ms () - t0);
      settle (GTK_WIDGET (window));
      printf ("search-as-you-type “%s”%*s %8.1f ms  (%u rows)\n", prefixes[i],
              (int) (8 - strlen (prefixes[i])), "", now_ms () - t0, g_list_model_get_n_items (list));
    }

  {
    g_autoptr(LaminaConstructionItem) item = NULL;

    lamina_window_set_search (window, "");
    item = g_list_model_get_item (list, g_list_model_get_n_items (list) / 2);

    t0 = now_ms ();
    lamina_window_open (window, lamina_construction_item_get_id (item), NULL);
    settle (GTK_WIDGET (window));
    printf ("open-construction             %8.1f ms\n", now_ms () - t0);
  }

  gtk_window_destroy (GTK_WINDOW (window));
  lamina_library_close (library);
  return 0;
}
