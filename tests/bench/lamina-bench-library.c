/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-bench-library.c: see lamina-bench-library.h. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench-library.h"

#include "lamina-bench.h"

LaminaLibrary *
lamina_bench_library_import (const char              *location,
                             LaminaLibraryOpenFlags   flags,
                             guint                    n,
                             double                  *import_ms)
{
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(GPtrArray) materials = lamina_bench_dup_materials ();
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(GError) error = NULL;
  double t0;

  library = lamina_library_open (location, flags, &error);
  if (library == NULL)
    g_error ("cannot create %s: %s", location, error->message);
  for (guint i = 0; i < materials->len; i++)
    g_ptr_array_add (cat->materials, g_steal_pointer (&materials->pdata[i]));
  for (guint i = 0; i < n; i++)
    g_ptr_array_add (cat->constructions, lamina_bench_make_construction (LAMINA_BENCH_SEED, i));
  t0 = lamina_bench_now_ms ();
  report = lamina_library_import (library, cat, 0, "bench", &error);
  if (report == NULL)
    g_error ("cannot import %u constructions into %s: %s", n, location, error->message);
  *import_ms = lamina_bench_now_ms () - t0;
  return g_steal_pointer (&library);
}

double
lamina_bench_library_time_open_first_page (const char *location,
                                           guint       page,
                                           gint64      at_most)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) rows = NULL;
  LaminaLibraryQuery q;
  LaminaLibrary *library;
  double t0 = lamina_bench_now_ms ();
  gint64 count;

  library = lamina_library_open (location, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  if (library == NULL)
    g_error ("cannot open %s: %s", location, error->message);
  lamina_library_query_init (&q);
  q.limit = page;
  count = at_most < 0 ? lamina_library_count (library, &q, &error)
                      : lamina_library_count_at_most (library, &q, at_most, &error);
  rows = lamina_library_search (library, &q, &error);
  if (rows == NULL || count < 0)
    g_error ("first page: %s", error->message);
  g_object_unref (library);
  return lamina_bench_now_ms () - t0;
}
