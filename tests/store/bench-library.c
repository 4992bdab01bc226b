/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bench-library N: builds a library of N constructions (one import, one
 * transaction), then times opening it, the first page of the list and
 * prefix searches as typed.  Prints figures; asserts nothing about time. */
#include <stdio.h>
#include <stdlib.h>

#include "lamina-library.h"
#include "lamina-store-test-util.h"

static int
compare_double (const void *a,
                const void *b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

int
main (int    argc,
      char **argv)
{
  static const char *const typed[] = { "t", "ti", "tim", "timb", "timber", "timber w",
                                       "timber wa", "wall 12", "ew-0", "ew-01", "odd", "mine" };
  guint n = argc > 1 ? (guint) atoi (argv[1]) : 10000;
  g_autofree char *dir = g_dir_make_tmp ("lamina-bench-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "bench.sqlite", NULL);
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(GError) error = NULL;
  double times[G_N_ELEMENTS (typed) * 20];
  guint n_times = 0;
  gint64 t0;

  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, 0, &error);
    g_autoptr(LaminaImportReport) report = NULL;

    g_assert_no_error (error);
    for (guint i = 0; i < n; i++)
      {
        g_autofree char *code = g_strdup_printf ("EW-%05u", i);
        g_autofree char *name = g_strdup_printf ("Timber frame wall %u", i);
        LaminaConstruction *c = test_make_wall (library, code, name, i % 2 ? "odd" : "even",
                                                90 + i % 150);

        c->id = g_strdup_printf ("bench-%u", i);
        g_ptr_array_add (cat->constructions, c);
      }
    t0 = g_get_monotonic_time ();
    report = lamina_library_import (library, cat, 0, "bench", &error);
    g_assert_no_error (error);
    printf ("import of %u constructions: %.0f ms\n", n, (g_get_monotonic_time () - t0) / 1000.0);
  }

  t0 = g_get_monotonic_time ();
  {
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, 0, &error);
    g_autoptr(GPtrArray) page = NULL;
    LaminaLibraryQuery q;

    g_assert_no_error (error);
    printf ("open: %.2f ms\n", (g_get_monotonic_time () - t0) / 1000.0);
    lamina_library_query_init (&q);
    q.limit = 50;
    page = lamina_library_search (library, &q, &error);
    printf ("open + count + first page of 50: %.2f ms (count %" G_GINT64_FORMAT ")\n",
            (g_get_monotonic_time () - t0) / 1000.0, lamina_library_count (library, &q, NULL));

    for (guint round = 0; round < 20; round++)
      for (guint i = 0; i < G_N_ELEMENTS (typed); i++)
        {
          g_autoptr(GPtrArray) rows = NULL;
          gint64 t = g_get_monotonic_time ();

          q.text = typed[i];
          q.sort = round % 2 ? LAMINA_SORT_RELEVANCE : LAMINA_SORT_CODE;
          rows = lamina_library_search (library, &q, &error);
          lamina_library_count (library, &q, &error);
          g_assert_no_error (error);
          times[n_times++] = (g_get_monotonic_time () - t) / 1000.0;
        }
  }
  qsort (times, n_times, sizeof times[0], compare_double);
  printf ("prefix search as typed (page of 50 + count), %u queries: median %.2f ms, "
          "90th %.2f ms, max %.2f ms\n", n_times, times[n_times / 2],
          times[n_times * 9 / 10], times[n_times - 1]);
  if (g_getenv ("LAMINA_BENCH_KEEP") != NULL)
    printf ("library kept at %s\n", path);
  else
    g_remove (path);
  return 0;
}
