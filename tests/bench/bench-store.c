/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Benchmarks 2 and 3: the office library at 1,000, 10,000 and 100,000
 * constructions.
 *
 *   bench-store [SIZE…]     (default 1000 10000 100000)
 *
 * Each synthetic library is built once (one lamina_library_import, one
 * transaction, outside the timed part) and cached in $LAMINA_BENCH_CACHE
 * under a name keyed by generator version, schema, size and seed.
 *
 * store.open_first_page: open the file, count the rows and fetch the first
 *   page of 50 sorted by code, close: what the window does at start.
 * store.prefix_search: 1,000 queries as typed, letter by letter, as the
 *   list asks for them: the first page of 50 in its sort order (by code) and
 *   the count stopped at 1,001 ("1,000+ constructions"); floor: the bounded
 *   design's two FTS5 queries alone through sqlite3 on a read-only
 *   connection (first 50 matches in the index's order, count to 1,001).
 * store.reflag_material: one library material's data changed
 *   (lamina_library_put_material of a board most constructions use, its λ
 *   up and down by turns), which flags every construction whose layers
 *   hold other data for it: on a copy of the library, three changes.
 * store.reflag_climate: one library climate's monthly data changed
 *   (lamina_library_put_climate, its January up and down by turns), which
 *   works out every construction's "data changed" flag again (materials
 *   and climates): on the same copy, three changes, as the window's worker
 *   does it.
 * store.prefix_search_ranked: the same texts by relevance (every match
 *   ranked) with the exact count, as the list asked before; floor: the same
 *   two FTS5 queries alone. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-bench-library.h"
#include "lamina-library.h"
#include "lamina-library-search.h"

#include <gio/gio.h>
#include <glib/gstdio.h>
#include <math.h>
#include <sqlite3.h>
#include <stdlib.h>

#define GENERATOR_VERSION 1
#define PAGE              50
#define N_QUERIES         1000
#define TARGET_SIZE       100000

static char *
ensure_library (guint n)
{
  g_autofree char *name = g_strdup_printf ("bench-library-g%d-v%d-n%u-seed%u.sqlite", GENERATOR_VERSION,
                                           LAMINA_LIBRARY_SCHEMA_VERSION, n, LAMINA_BENCH_SEED);
  char *path = g_build_filename (lamina_bench_cache_dir (), name, NULL);
  g_autofree char *partial = g_strconcat (path, ".partial", NULL);
  g_autoptr(LaminaLibrary) library = NULL;
  gint64 t0;
  double import_ms;

  if (g_file_test (path, G_FILE_TEST_EXISTS))
    return path;
  g_remove (partial);
  t0 = g_get_monotonic_time ();
  library = lamina_bench_library_import (partial, LAMINA_LIBRARY_OPEN_NO_SEED, n, &import_ms);
  lamina_library_close (library);
  printf ("%-40s built %s: %u constructions in one import, %.1f s wall\n", "", name, n,
          (g_get_monotonic_time () - t0) / 1e6);
  if (g_rename (partial, path) != 0)
    g_error ("cannot rename %s", partial);
  return path;
}

/* What a user types: words of the synthetic library, letter by letter,
 * sometimes two words, sometimes a code. */
static GPtrArray *
make_queries (void)
{
  static const char *const words[] = {
    "millbrook school wall", "quayside roof", "orchard", "hollins library floor", "fernhill",
    "tannery ceiling", "westgate partition", "larkspur nursery", "timber", "retrofit passive",
    "acoustic", "mineral wool", "wood fibre", "clay brick", "pir board", "ew-001", "rf-02",
    "build-up 42", "external wall", "heritage", "slate", "screed", "cork", "larch cladding",
  };
  g_autoptr(GRand) rand = g_rand_new_with_seed (LAMINA_BENCH_SEED);
  GPtrArray *queries = g_ptr_array_new_with_free_func (g_free);

  while (queries->len < N_QUERIES)
    {
      const char *word = words[g_rand_int_range (rand, 0, G_N_ELEMENTS (words))];

      for (gsize len = 1; word[len - 1] != '\0' && queries->len < N_QUERIES; len++)
        g_ptr_array_add (queries, g_strndup (word, len));
    }
  return queries;
}

typedef struct
{
  sqlite3      *db;
  sqlite3_stmt *page;
  sqlite3_stmt *count;
} Floor;

/* The floor of the search as it is specified (ranked page + exact count),
 * and of a bounded design (first page in index order + a count that stops
 * at 1,000, shown as "1,000+"): what a list could reach on short prefixes
 * that match most of a large library. */
static const char *const floor_sql[2][2] = {
  { "SELECT rowid FROM construction_fts WHERE construction_fts MATCH ?1"
    " ORDER BY rank LIMIT " G_STRINGIFY (PAGE),
    "SELECT count(*) FROM construction_fts WHERE construction_fts MATCH ?1" },
  { "SELECT rowid FROM construction_fts WHERE construction_fts MATCH ?1 LIMIT " G_STRINGIFY (PAGE),
    "SELECT count(*) FROM (SELECT 1 FROM construction_fts WHERE construction_fts MATCH ?1 LIMIT 1001)" },
};

static void
floor_open (Floor      *f,
            const char *path,
            gboolean    bounded)
{
  if (sqlite3_open_v2 (path, &f->db, SQLITE_OPEN_READONLY, NULL) != SQLITE_OK
      || sqlite3_prepare_v2 (f->db, floor_sql[bounded][0], -1, &f->page, NULL) != SQLITE_OK
      || sqlite3_prepare_v2 (f->db, floor_sql[bounded][1], -1, &f->count, NULL) != SQLITE_OK)
    g_error ("floor: %s", sqlite3_errmsg (f->db));
}

static void
floor_close (Floor *f)
{
  sqlite3_finalize (f->page);
  sqlite3_finalize (f->count);
  sqlite3_close (f->db);
}

static double
time_floor_query (Floor      *f,
                  const char *text)
{
  g_autofree char *fts = NULL;
  volatile gint64 sink = 0;
  double t0 = lamina_bench_now_ms ();

  /* The text → FTS5 translation is part of the floor: any search needs it. */
  fts = lamina_library_text_to_fts_query (text);
  sqlite3_bind_text (f->page, 1, fts, -1, SQLITE_STATIC);
  while (sqlite3_step (f->page) == SQLITE_ROW)
    sink += sqlite3_column_int64 (f->page, 0);
  sqlite3_reset (f->page);
  sqlite3_bind_text (f->count, 1, fts, -1, SQLITE_STATIC);
  if (sqlite3_step (f->count) == SQLITE_ROW)
    sink += sqlite3_column_int64 (f->count, 0);
  sqlite3_reset (f->count);
  return lamina_bench_now_ms () - t0;
}

/* @ranked: by relevance with the exact count; otherwise as the list asks
 * now (by code, the count stopped at 1,001). */
static double
time_query (LaminaLibrary *library,
            const char    *text,
            gboolean       ranked)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) page = NULL;
  LaminaLibraryQuery q;
  double t0 = lamina_bench_now_ms ();
  gint64 n;

  lamina_library_query_init (&q);
  q.text = text;
  q.sort = ranked ? LAMINA_SORT_RELEVANCE : LAMINA_SORT_CODE;
  q.limit = PAGE;
  page = lamina_library_search (library, &q, &error);
  if (page != NULL)
    n = ranked ? lamina_library_count (library, &q, &error) : lamina_library_count_at_most (library, &q, 1000, &error);
  if (page == NULL || n < 0)
    g_error ("search “%s”: %s", text, error->message);
  return lamina_bench_now_ms () - t0;
}

/* LAMINA_BENCH_VERBOSE: which typed texts make the tail of the figure. */
static void
print_slowest (GPtrArray    *queries,
               const double *times)
{
  g_autofree guint *order = g_new (guint, queries->len);

  for (guint i = 0; i < queries->len; i++)
    order[i] = i;
  for (guint k = 0; k < 10; k++)
    for (guint i = k + 1; i < queries->len; i++)
      if (times[order[i]] > times[order[k]])
        {
          guint t = order[k];
          order[k] = order[i];
          order[i] = t;
        }
  for (guint k = 0; k < 10; k++)
    printf ("%-40s slow query “%s”: %.2f ms\n", "", (char *) queries->pdata[order[k]], times[order[k]]);
}

/* A re-flag figure: the target is 2 s at 100,000. */
static void
print_reflag (const char   *name,
              double       *times,
              guint         runs,
              guint         n)
{
  LaminaBenchFigure f;

  lamina_bench_figure_init (&f, name, "ms");
  lamina_bench_figure_set_runs (&f, times, runs);
  f.size = n;
  if (n == TARGET_SIZE)
    f.target = 2000;
  lamina_bench_print (&f);
}

/* On a copy of @path (the cached library stays as built). */
static void
bench_reflag (const char *path,
              guint       n)
{
  g_autofree char *copy = g_strconcat (path, ".reflag", NULL);
  g_autofree char *name = g_strdup_printf ("store.reflag_material.n%u", n);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  g_autoptr(LaminaMaterial) m = NULL;
  double times[3];
  g_autoptr(GFile) from = g_file_new_for_path (path);
  g_autoptr(GFile) to = g_file_new_for_path (copy);

  if (!g_file_copy (from, to, G_FILE_COPY_OVERWRITE, NULL, NULL, NULL, &error))
    g_error ("copy %s: %s", path, error->message);
  library = lamina_library_open (copy, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  if (library == NULL)
    g_error ("open %s: %s", copy, error->message);
  m = lamina_library_dup_material (library, "bench-gypsum-board", &error);
  if (m == NULL)
    g_error ("material: %s", error->message);
  for (guint run = 0; run < G_N_ELEMENTS (times); run++)
    {
      double t0 = lamina_bench_now_ms ();

      m->conductivity *= run % 2 == 0 ? 1.25 : 0.8;
      if (!lamina_library_put_material (library, m, &error))
        g_error ("put material: %s", error->message);
      times[run] = lamina_bench_now_ms () - t0;
    }
  print_reflag (name, times, G_N_ELEMENTS (times), n);

  {
    g_autoptr(LaminaClimate) climate = lamina_climate_new ("bench-inland", "Inland (invented)");
    g_autofree char *climate_name = g_strdup_printf ("store.reflag_climate.n%u", n);

    for (int month = 0; month < LAMINA_MONTHS; month++)
      {
        climate->temperature[month] = 10 - 8 * cos (2 * G_PI * month / 12.0);
        climate->humidity[month] = 0.8;
      }
    if (!lamina_library_put_climate (library, climate, &error))
      g_error ("put climate: %s", error->message);
    for (guint run = 0; run < G_N_ELEMENTS (times); run++)
      {
        double t0 = lamina_bench_now_ms ();

        climate->temperature[0] += run % 2 == 0 ? -1 : 1;
        if (!lamina_library_put_climate (library, climate, &error))
          g_error ("put climate: %s", error->message);
        times[run] = lamina_bench_now_ms () - t0;
      }
    print_reflag (climate_name, times, G_N_ELEMENTS (times), n);
  }
  g_clear_object (&library);
  g_remove (copy);
  {
    g_autofree char *wal = g_strconcat (copy, "-wal", NULL);
    g_autofree char *shm = g_strconcat (copy, "-shm", NULL);

    g_remove (wal);
    g_remove (shm);
  }
}

typedef struct
{
  double open_ms, search_ms, floor_ms;
} SizeFigures;

static void
bench_size (guint        n,
            GPtrArray   *queries,
            SizeFigures *out)
{
  g_autofree char *path = ensure_library (n);
  g_autofree char *open_name = g_strdup_printf ("store.open_first_page.n%u", n);
  g_autofree char *search_name = g_strdup_printf ("store.prefix_search.n%u", n);
  /* 1,000 queries per run are already a distribution: three runs suffice
   * for the large libraries. */
  guint runs = n >= 10000 && !g_getenv ("LAMINA_BENCH_RUNS") ? 3 : lamina_bench_runs ();
  g_autofree double *open_runs = g_new (double, runs);
  g_autofree double *medians = g_new (double, runs);
  g_autofree double *p99s = g_new (double, runs);
  g_autofree double *floor_medians = g_new (double, runs);
  g_autofree double *ranked_medians = g_new (double, runs);
  g_autofree double *ranked_p99s = g_new (double, runs);
  g_autofree char *ranked_name = g_strdup_printf ("store.prefix_search_ranked.n%u", n);
  g_autofree double *bounded_medians = g_new (double, runs);
  g_autofree double *bounded_p99s = g_new (double, runs);
  g_autofree char *bounded_name = g_strdup_printf ("store.prefix_search_bounded_floor.n%u", n);
  g_autofree double *one = g_new (double, queries->len);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  LaminaBenchFigure f;
  Floor fl = { 0 }, bounded = { 0 };

  lamina_bench_library_time_open_first_page (path, PAGE, -1);   /* warm the page cache */
  for (guint run = 0; run < runs; run++)
    open_runs[run] = lamina_bench_library_time_open_first_page (path, PAGE, -1);
  lamina_bench_figure_init (&f, open_name, "ms");
  lamina_bench_figure_set_runs (&f, open_runs, runs);
  f.size = n;
  if (n == TARGET_SIZE)
    f.target = 100;
  lamina_bench_print (&f);
  out->open_ms = f.value;

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
  g_assert_no_error (error);
  floor_open (&fl, path, FALSE);
  floor_open (&bounded, path, TRUE);
  for (guint run = 0; run < runs; run++)
    {
      for (guint i = 0; i < queries->len; i++)
        one[i] = time_query (library, queries->pdata[i], FALSE);
      if (run == 0 && g_getenv ("LAMINA_BENCH_VERBOSE"))
        print_slowest (queries, one);
      medians[run] = lamina_bench_median (one, queries->len);
      p99s[run] = lamina_bench_percentile (one, queries->len, 99);
      for (guint i = 0; i < queries->len; i++)
        one[i] = time_query (library, queries->pdata[i], TRUE);
      ranked_medians[run] = lamina_bench_median (one, queries->len);
      ranked_p99s[run] = lamina_bench_percentile (one, queries->len, 99);
      for (guint i = 0; i < queries->len; i++)
        one[i] = time_floor_query (&fl, queries->pdata[i]);
      floor_medians[run] = lamina_bench_median (one, queries->len);
      for (guint i = 0; i < queries->len; i++)
        one[i] = time_floor_query (&bounded, queries->pdata[i]);
      bounded_medians[run] = lamina_bench_median (one, queries->len);
      bounded_p99s[run] = lamina_bench_percentile (one, queries->len, 99);
    }
  floor_close (&fl);
  floor_close (&bounded);
  lamina_bench_figure_init (&f, search_name, "ms");
  lamina_bench_figure_set_runs (&f, medians, runs);
  f.p99 = lamina_bench_median (p99s, runs);
  f.floor = lamina_bench_median (bounded_medians, runs);
  f.size = n;
  if (n == TARGET_SIZE)
    {
      f.target = 2;
      f.p99_target = 16;
    }
  else if (n == 10000)
    f.target = 1;
  lamina_bench_print (&f);
  out->search_ms = f.value;
  out->floor_ms = f.floor;

  lamina_bench_figure_init (&f, bounded_name, "ms");
  lamina_bench_figure_set_runs (&f, bounded_medians, runs);
  f.p99 = lamina_bench_median (bounded_p99s, runs);
  f.size = n;
  lamina_bench_print (&f);

  lamina_bench_figure_init (&f, ranked_name, "ms");
  lamina_bench_figure_set_runs (&f, ranked_medians, runs);
  f.p99 = lamina_bench_median (ranked_p99s, runs);
  f.floor = lamina_bench_median (floor_medians, runs);
  f.size = n;
  lamina_bench_print (&f);

  g_clear_object (&library);
  bench_reflag (path, n);
}

int
main (int    argc,
      char **argv)
{
  guint default_sizes[] = { 1000, 10000, TARGET_SIZE };
  g_autoptr(GPtrArray) queries = make_queries ();
  g_autofree guint *sizes = NULL;
  g_autofree double *opens = NULL, *searches = NULL;
  guint n_sizes = argc > 1 ? (guint) argc - 1 : G_N_ELEMENTS (default_sizes);

  sizes = g_new (guint, n_sizes);
  opens = g_new (double, n_sizes);
  searches = g_new (double, n_sizes);
  for (guint i = 0; i < n_sizes; i++)
    {
      SizeFigures s;

      sizes[i] = argc > 1 ? (guint) atoi (argv[i + 1]) : default_sizes[i];
      bench_size (sizes[i], queries, &s);
      opens[i] = s.open_ms;
      searches[i] = s.search_ms;
    }
  if (n_sizes > 1)
    {
      lamina_bench_print_growth ("store.open_first_page.growth", "ms", sizes, opens, n_sizes);
      lamina_bench_print_growth ("store.prefix_search.growth", "ms", sizes, searches, n_sizes);
    }
  return 0;
}
