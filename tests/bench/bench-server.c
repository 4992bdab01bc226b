/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The office library on a PostgreSQL server beside the SQLite file (issue
 * 18), over the loopback, run by tests/store/pg-fixture:
 *
 *   pg-fixture bench-server [SIZE…]     (default 10000)
 *
 * For each size the same synthetic library (lamina_bench_make_construction)
 * is imported once into a new file and once into a new database on the
 * server (one lamina_library_import each, timed), then both are timed at
 * what the window does: open, the count that stops at 1,001 and the first
 * page of 50 by code, close; and prefix searches as typed, as the list
 * asks (page of 50 by code + the count stopped at 1,001) and by relevance
 * (every match ranked, the exact count).
 * Wall-clock time (the server works in its own process); the file's figure
 * is the floor, × the server's ratio to it.  Prints figures, judges
 * nothing. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-bench-library.h"
#include "lamina-library.h"

#include <glib/gstdio.h>
#include <libpq-fe.h>
#include <stdlib.h>

#define PAGE      50
#define N_QUERIES 200

static void
admin (const char *sql)
{
  g_autofree char *conninfo = g_strdup_printf ("%s dbname=postgres", g_getenv ("LAMINA_TEST_PG"));
  PGconn *conn = PQconnectdb (conninfo);
  PGresult *res = PQexec (conn, sql);

  if (PQresultStatus (res) != PGRES_COMMAND_OK)
    g_error ("%s: %s", sql, PQerrorMessage (conn));
  PQclear (res);
  PQfinish (conn);
}

static double
import_into (const char *location,
             guint       n)
{
  g_autoptr(LaminaLibrary) library = NULL;
  double ms;

  library = lamina_bench_library_import (location, LAMINA_LIBRARY_OPEN_NO_SEED, n, &ms);
  return ms;
}

/* Median milliseconds of a query as typed, letter by letter. */
static double
time_search (const char *location,
             gboolean    ranked,
             double     *p90)
{
  static const char *const words[] = {
    "timber", "mineral wool", "external wall", "pir board", "ew-001", "clay brick", "roof",
    "wood fibre", "screed", "acoustic",
  };
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = lamina_library_open (location, LAMINA_LIBRARY_OPEN_EXISTING,
                                                          &error);
  double times[N_QUERIES];
  guint n = 0;

  g_assert_no_error (error);
  while (n < N_QUERIES)
    for (guint w = 0; w < G_N_ELEMENTS (words) && n < N_QUERIES; w++)
      for (gsize len = 1; words[w][len - 1] != '\0' && n < N_QUERIES; len++)
        {
          g_autofree char *text = g_strndup (words[w], len);
          g_autoptr(GPtrArray) rows = NULL;
          LaminaLibraryQuery q;
          double t0 = lamina_bench_now_ms ();

          lamina_library_query_init (&q);
          q.text = text;
          q.sort = ranked ? LAMINA_SORT_RELEVANCE : LAMINA_SORT_CODE;
          q.limit = PAGE;
          rows = lamina_library_search (library, &q, &error);
          if (rows == NULL
              || (ranked ? lamina_library_count (library, &q, &error)
                         : lamina_library_count_at_most (library, &q, 1000, &error)) < 0)
            g_error ("search “%s”: %s", text, error->message);
          times[n++] = lamina_bench_now_ms () - t0;
        }
  *p90 = lamina_bench_percentile (times, n, 90);
  return lamina_bench_median (times, n);
}

static void
print_pair (const char *what,
            guint       n,
            const char *unit,
            double      file,
            double      server)
{
  LaminaBenchFigure figure;
  g_autofree char *name = g_strdup_printf ("server.%s.n%u", what, n);

  lamina_bench_figure_init (&figure, name, unit);
  figure.value = server;
  figure.spread = 0;
  figure.floor = file;
  figure.runs = 1;
  figure.size = n;
  lamina_bench_print (&figure);
}

static void
bench_size (guint n)
{
  g_autofree char *dir = g_dir_make_tmp ("lamina-bench-server-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "bench.sqlite", NULL);
  g_autofree char *db = g_strdup_printf ("bench_%u", n);
  g_autofree char *sql = g_strdup_printf ("DROP DATABASE IF EXISTS %s; ", db);
  g_autofree char *location = g_strdup_printf ("%s dbname=%s", g_getenv ("LAMINA_TEST_PG"), db);
  guint runs = lamina_bench_runs ();
  double file_open[31], server_open[31];
  double file_import, server_import, file_search, server_search, p90_file, p90_server;

  admin (sql);
  g_free (sql);
  sql = g_strdup_printf ("CREATE DATABASE %s", db);
  admin (sql);
  file_import = import_into (path, n);
  server_import = import_into (location, n);
  print_pair ("import", n, "ms", file_import, server_import);
  for (guint r = 0; r < runs; r++)
    {
      file_open[r] = lamina_bench_library_time_open_first_page (path, PAGE, 1000);
      server_open[r] = lamina_bench_library_time_open_first_page (location, PAGE, 1000);
    }
  print_pair ("open_first_page", n, "ms", lamina_bench_median (file_open, runs),
              lamina_bench_median (server_open, runs));
  file_search = time_search (path, FALSE, &p90_file);
  server_search = time_search (location, FALSE, &p90_server);
  print_pair ("prefix_search", n, "ms", file_search, server_search);
  print_pair ("prefix_search_p90", n, "ms", p90_file, p90_server);
  file_search = time_search (path, TRUE, &p90_file);
  server_search = time_search (location, TRUE, &p90_server);
  print_pair ("prefix_search_ranked", n, "ms", file_search, server_search);
  print_pair ("prefix_search_ranked_p90", n, "ms", p90_file, p90_server);
  g_remove (path);
  g_rmdir (dir);
}

int
main (int    argc,
      char **argv)
{
  /* The server does its work in its own process: only wall time compares. */
  g_setenv ("LAMINA_BENCH_CLOCK", "wall", TRUE);
  if (g_getenv ("LAMINA_TEST_PG") == NULL)
    {
      fprintf (stderr, "bench-server: run it through tests/store/pg-fixture "
                       "(LAMINA_TEST_PG is not set)\n");
      return 1;
    }
  printf ("The library on a PostgreSQL server over the loopback (value) beside the SQLite file "
          "(floor); wall time\n");
  if (argc < 2)
    bench_size (10000);
  for (int i = 1; i < argc; i++)
    bench_size ((guint) atoi (argv[i]));
  return 0;
}
