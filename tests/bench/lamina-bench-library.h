/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-bench-library.h: what the library benchmarks (bench-store for the
 * file, bench-server for the server beside it) share: the synthetic
 * library imported in one go, and the window's first look at it. */
#pragma once

#include "lamina-library.h"

G_BEGIN_DECLS

/* Opens @location (a file or a server address) with @flags and imports
 * the synthetic library of @n constructions (lamina_bench_make_construction
 * with LAMINA_BENCH_SEED, on the benchmark materials) in one
 * lamina_library_import.  Returns the library (NULL: aborts with a
 * message) and sets @import_ms to the time of the import alone, by
 * lamina_bench_now_ms. */
LaminaLibrary *lamina_bench_library_import (const char              *location,
                                            LaminaLibraryOpenFlags   flags,
                                            guint                    n,
                                            double                  *import_ms);

/* Milliseconds to open @location, count its rows (exactly when @at_most
 * is negative, else no further than @at_most, as the list counts), fetch
 * the first page of @page sorted by code and close it: what the window
 * does at start. */
double         lamina_bench_library_time_open_first_page (const char *location,
                                                          guint       page,
                                                          gint64      at_most);

G_END_DECLS
