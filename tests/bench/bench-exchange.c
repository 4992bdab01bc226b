/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Benchmarks 4 and 5: reading and writing the catalogue XML.
 *
 *   bench-exchange [SIZE…]     (default 1000 10000 100000)
 *
 * Import: lamina_catalogue_read_memory (parse, schema validation, model
 * rules) of a document of SIZE synthetic constructions; floor: libxml2's
 * bare xmlReadMemory of the same bytes.  Export: lamina_catalogue_write_to_string
 * with the computed figures (what the CLI and the window write).  The
 * targets are set for 10,000 constructions; the other sizes show growth. */
#define G_LOG_DOMAIN "lamina-bench"

#include "lamina-bench.h"
#include "lamina-catalogue.h"

#include <libxml/parser.h>
#include <malloc.h>
#include <math.h>
#include <stdlib.h>

#define TARGET_SIZE 10000

static LaminaCatalogue *
make_catalogue (guint n)
{
  LaminaCatalogue *cat = lamina_catalogue_new ();
  g_autoptr(GPtrArray) materials = lamina_bench_dup_materials ();

  cat->title = g_strdup ("Invented practice: synthetic benchmark library");
  for (guint i = 0; i < materials->len; i++)
    g_ptr_array_add (cat->materials, g_steal_pointer (&materials->pdata[i]));
  for (guint i = 0; i < n; i++)
    g_ptr_array_add (cat->constructions, lamina_bench_make_construction (LAMINA_BENCH_SEED, i));
  return cat;
}

static guint
runs_for (guint n)
{
  /* The largest size takes seconds per run: three runs are enough to see
   * its growth. */
  return n > TARGET_SIZE && !g_getenv ("LAMINA_BENCH_RUNS") ? 3 : lamina_bench_runs ();
}

typedef struct
{
  double export_ms, import_ms, parse_ms;
} SizeFigures;

static void
bench_size (guint        n,
            SizeFigures *out)
{
  g_autoptr(LaminaCatalogue) cat = make_catalogue (n);
  g_autofree char *xml = NULL;
  g_autofree char *export_name = g_strdup_printf ("exchange.export_xml.n%u", n);
  g_autofree char *import_name = g_strdup_printf ("exchange.import_xml.n%u", n);
  guint runs = runs_for (n);
  g_autofree double *export_runs = g_new (double, runs);
  g_autofree double *import_runs = g_new (double, runs);
  g_autofree double *parse_runs = g_new (double, runs);
  gsize length = 0;
  LaminaBenchFigure f;

  for (guint run = 0; run < runs; run++)
    {
      g_autoptr(GError) error = NULL;
      double t0;

      g_clear_pointer (&xml, g_free);
      malloc_trim (0);
      t0 = lamina_bench_now_ms ();
      xml = lamina_catalogue_write_to_string (cat, LAMINA_WRITE_DERIVED, &length, &error);
      export_runs[run] = lamina_bench_now_ms () - t0;
      if (xml == NULL)
        g_error ("export of %u constructions failed: %s", n, error->message);
    }

  for (guint run = 0; run < runs; run++)
    {
      g_autoptr(GError) error = NULL;
      g_autoptr(LaminaCatalogue) back = NULL;
      xmlDoc *doc;
      double t0;

      /* Each timed part starts from a consolidated heap, so that neither
       * pays for the frees of the one before (glibc defers that work to
       * the next large malloc: a quarter of the import's profile). */
      malloc_trim (0);
      t0 = lamina_bench_now_ms ();

      doc = xmlReadMemory (xml, (int) length, NULL, NULL, XML_PARSE_NONET | XML_PARSE_BIG_LINES);
      parse_runs[run] = lamina_bench_now_ms () - t0;
      if (doc == NULL)
        g_error ("libxml2 cannot parse the exported document");
      xmlFreeDoc (doc);

      malloc_trim (0);
      t0 = lamina_bench_now_ms ();
      back = lamina_catalogue_read_memory (xml, length, "bench.xml", &error);
      import_runs[run] = lamina_bench_now_ms () - t0;
      if (back == NULL)
        {
          lamina_bench_print_skip (import_name, error->message);
          import_runs[run] = NAN;
          break;
        }
      if (back->constructions->len != n)
        g_error ("import read %u constructions of %u", back->constructions->len, n);
    }

  lamina_bench_figure_init (&f, export_name, "ms");
  lamina_bench_figure_set_runs (&f, export_runs, runs);
  f.size = n;
  if (n == TARGET_SIZE)
    f.target = 1000;
  lamina_bench_print (&f);
  out->export_ms = f.value;

  out->parse_ms = lamina_bench_median (parse_runs, runs);
  out->import_ms = NAN;
  if (isfinite (import_runs[0]))
    {
      lamina_bench_figure_init (&f, import_name, "ms");
      lamina_bench_figure_set_runs (&f, import_runs, runs);
      f.floor = out->parse_ms;
      f.size = n;
      if (n == TARGET_SIZE)
        f.target = 3 * f.floor;   /* ≤ 3 × libxml2's bare parse */
      lamina_bench_print (&f);
      out->import_ms = f.value;
    }
  printf ("%-40s %.1f MB of XML, %.0f bytes per construction\n", "", length / 1e6, (double) length / n);
}

int
main (int    argc,
      char **argv)
{
  guint default_sizes[] = { 1000, TARGET_SIZE, 100000 };
  g_autofree guint *sizes = NULL;
  g_autofree double *exports = NULL, *imports = NULL;
  guint n_sizes, n_imports = 0;

  n_sizes = argc > 1 ? (guint) argc - 1 : G_N_ELEMENTS (default_sizes);
  sizes = g_new (guint, n_sizes);
  exports = g_new (double, n_sizes);
  imports = g_new (double, n_sizes);
  for (guint i = 0; i < n_sizes; i++)
    sizes[i] = argc > 1 ? (guint) atoi (argv[i + 1]) : default_sizes[i];

  xmlInitParser ();
  for (guint i = 0; i < n_sizes; i++)
    {
      SizeFigures s;

      bench_size (sizes[i], &s);
      exports[i] = s.export_ms;
      imports[i] = s.import_ms;
      if (isfinite (s.import_ms))
        n_imports = i + 1;
    }
  if (n_sizes > 1)
    {
      lamina_bench_print_growth ("exchange.export_xml.growth", "ms", sizes, exports, n_sizes);
      if (n_imports > 1)
        lamina_bench_print_growth ("exchange.import_xml.growth", "ms", sizes, imports, n_imports);
    }
  return 0;
}
