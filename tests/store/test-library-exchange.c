/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of import and export: round trip through the catalogue XML,
 * merge cases, and an import killed half-way. */
#include <signal.h>
#include <sqlite3.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "lamina-catalogue.h"
#include "lamina-library.h"
#include "lamina-store-test-util.h"

static LaminaLibrary *
open_at (const char *name)
{
  g_autofree char *path = test_library_location (name);
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);

  g_assert_no_error (error);
  return library;
}

/* A catalogue of @n varied walls with ids test-0 … */
static LaminaCatalogue *
make_catalogue (LaminaLibrary *library,
                guint          n,
                double         base_mm)
{
  LaminaCatalogue *cat = lamina_catalogue_new ();

  for (guint i = 0; i < n; i++)
    {
      g_autofree char *code = g_strdup_printf ("EW-%04u", i);
      g_autofree char *name = g_strdup_printf ("Timber frame wall %u", i);
      LaminaConstruction *c = test_make_wall (library, code, name, i % 2 ? "odd" : "even",
                                              base_mm + i % 100);

      c->id = g_strdup_printf ("test-%u", i);
      g_ptr_array_add (cat->constructions, c);
    }
  return cat;
}

static LaminaCatalogue *
through_xml (const LaminaCatalogue *cat)
{
  g_autoptr(GError) error = NULL;
  gsize len = 0;
  g_autofree char *xml = lamina_catalogue_write_to_string (cat, LAMINA_WRITE_DERIVED, &len, &error);
  LaminaCatalogue *back;

  g_assert_no_error (error);
  back = lamina_catalogue_read_memory (xml, len, "export.xml", &error);
  g_assert_no_error (error);
  return back;
}

/* Library → XML → new library: the same figures, status and review. */
static void
test_round_trip (void)
{
  g_autoptr(LaminaLibrary) a = open_at ("a.sqlite");
  g_autoptr(LaminaLibrary) b = open_at ("b.sqlite");
  g_autoptr(LaminaCatalogue) cat = make_catalogue (a, 12, 90);
  g_autoptr(LaminaImportReport) r1 = NULL;
  g_autoptr(LaminaImportReport) r2 = NULL;
  g_autoptr(LaminaCatalogue) out = NULL;
  g_autoptr(LaminaCatalogue) back = NULL;
  g_autoptr(GError) error = NULL;

  r1 = lamina_library_import (a, cat, LAMINA_IMPORT_DEFAULT, "T", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (r1->n_added, ==, 12);
  g_assert_true (lamina_library_mark_checked (a, "test-3", 0, "C. Checker", NULL));
  g_assert_true (lamina_library_mark_checked (a, "test-4", 0, "C. Checker", NULL));
  g_assert_true (lamina_library_approve (a, "test-4", 0, "D. Director", "2099-05-04", NULL));

  out = lamina_library_export (a, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (out->constructions->len, ==, 12);
  back = through_xml (out);
  /* Moving a library keeps its review only when asked to. */
  r2 = lamina_library_import (b, back, LAMINA_IMPORT_KEEP_REVIEW, "T", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (r2->n_added, ==, 12);

  for (guint i = 0; i < 12; i++)
    {
      g_autofree char *id = g_strdup_printf ("test-%u", i);
      g_autoptr(LaminaResult) ra = lamina_library_dup_result (a, id, 0, NULL);
      g_autoptr(LaminaResult) rb = lamina_library_dup_result (b, id, 0, NULL);
      g_autoptr(LaminaConstruction) ca = lamina_library_dup_construction (a, id, 0, NULL);
      g_autoptr(LaminaConstruction) cb = lamina_library_dup_construction (b, id, 0, NULL);

      g_assert_nonnull (ra);
      g_assert_nonnull (rb);
      g_assert_cmpfloat (ra->r_upper, ==, rb->r_upper);
      g_assert_cmpfloat (ra->r_lower, ==, rb->r_lower);
      g_assert_cmpfloat (ra->r_total, ==, rb->r_total);
      g_assert_cmpfloat (ra->u_corrected, ==, rb->u_corrected);
      g_assert_true (lamina_construction_equal_content (ca, cb));
      g_assert_cmpint (ca->status, ==, cb->status);
      g_assert_cmpint (ca->revision, ==, cb->revision);
      g_assert_cmpstr (ca->approved_by, ==, cb->approved_by);
      g_assert_cmpstr (ca->approved_at, ==, cb->approved_at);
    }
}

/* New → added, changed → new revision, identical → skipped, changed but
 * approved here → conflict, not applied. */
static void
test_merge (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("merge.sqlite");
  g_autoptr(LaminaCatalogue) first = make_catalogue (library, 3, 100);
  g_autoptr(LaminaCatalogue) second = make_catalogue (library, 4, 100);
  g_autoptr(LaminaImportReport) report = NULL;
  g_autoptr(LaminaConstruction) approved = NULL;
  g_autoptr(LaminaConstruction) revised = NULL;
  g_autoptr(GError) error = NULL;
  LaminaConstruction *c;

  report = lamina_library_import (library, first, LAMINA_IMPORT_DEFAULT, "T", &error);
  g_assert_no_error (error);
  g_clear_pointer (&report, lamina_import_report_free);
  g_assert_true (lamina_library_mark_checked (library, "test-2", 0, "C", NULL));
  g_assert_true (lamina_library_approve (library, "test-2", 0, "D", NULL, NULL));

  c = second->constructions->pdata[1];      /* changed */
  ((LaminaLayer *) c->layers->pdata[1])->thickness = 240;
  c = second->constructions->pdata[2];      /* changed, approved here */
  g_free (c->name);
  c->name = g_strdup ("Renamed elsewhere");

  report = lamina_library_import (library, second, LAMINA_IMPORT_DEFAULT, "T", &error);
  g_assert_no_error (error);
  g_assert_cmpuint (report->n_added, ==, 1);
  g_assert_cmpuint (report->n_revised, ==, 1);
  g_assert_cmpuint (report->n_skipped, ==, 1);
  g_assert_cmpuint (report->n_conflicts, ==, 1);
  g_assert_cmpint (((LaminaImportItem *) report->items->pdata[2])->action, ==, LAMINA_IMPORT_CONFLICT);

  approved = lamina_library_dup_construction (library, "test-2", 0, NULL);
  g_assert_cmpint (approved->status, ==, LAMINA_STATUS_APPROVED);
  g_assert_cmpstr (approved->name, ==, "Timber frame wall 2");
  revised = lamina_library_dup_construction (library, "test-1", 0, NULL);
  g_assert_cmpint (revised->revision, ==, 2);
  g_assert_cmpint (revised->status, ==, LAMINA_STATUS_DRAFT);
  g_clear_pointer (&report, lamina_import_report_free);

  /* The user's act: the approved one gets a new draft on top. */
  report = lamina_library_import (library, second, LAMINA_IMPORT_REVISE_APPROVED, "T", &error);
  g_assert_cmpuint (report->n_revised, ==, 1);
  g_clear_pointer (&approved, lamina_construction_free);
  approved = lamina_library_dup_construction (library, "test-2", 1, NULL);
  g_assert_cmpint (approved->status, ==, LAMINA_STATUS_APPROVED);
}

static char *
dump_library (const char *path)
{
  g_autoptr(GString) out = g_string_new (NULL);
  sqlite3 *db = NULL;
  sqlite3_stmt *stmt = NULL;

  if (test_on_server ())
    {
      PGconn *conn = PQconnectdb (path);
      PGresult *res;

      g_assert_cmpint (PQstatus (conn), ==, CONNECTION_OK);
      res = PQexec (conn,
        "SELECT x FROM ("
        " SELECT construction_id || ':' || revision || ':' || status || ':' || body AS x FROM revision"
        " UNION ALL SELECT id || fingerprint FROM material"
        " UNION ALL SELECT 'fts' || count(*) FROM construction WHERE search <> '') t"
        " ORDER BY x COLLATE \"C\";");
      g_assert_cmpint (PQresultStatus (res), ==, PGRES_TUPLES_OK);
      for (int i = 0; i < PQntuples (res); i++)
        g_string_append_printf (out, "%s\n", PQgetvalue (res, i, 0));
      PQclear (res);
      PQfinish (conn);
      return g_string_free (g_steal_pointer (&out), FALSE);
    }
  g_assert_cmpint (sqlite3_open_v2 (path, &db, SQLITE_OPEN_READONLY, NULL), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_prepare_v2 (db, "PRAGMA integrity_check;", -1, &stmt, NULL), ==, SQLITE_OK);
  g_assert_cmpint (sqlite3_step (stmt), ==, SQLITE_ROW);
  g_assert_cmpstr ((const char *) sqlite3_column_text (stmt, 0), ==, "ok");
  sqlite3_finalize (stmt);
  g_assert_cmpint (sqlite3_prepare_v2 (db,
    "SELECT construction_id || ':' || revision || ':' || status || ':' || body FROM revision"
    " UNION ALL SELECT id || fingerprint FROM material"
    " UNION ALL SELECT 'fts' || count(*) FROM construction_fts ORDER BY 1;",
    -1, &stmt, NULL), ==, SQLITE_OK);
  while (sqlite3_step (stmt) == SQLITE_ROW)
    g_string_append_printf (out, "%s\n", sqlite3_column_text (stmt, 0));
  sqlite3_finalize (stmt);
  sqlite3_close (db);
  return g_string_free (g_steal_pointer (&out), FALSE);
}

/* A writer killed during a large import leaves the library exactly as it
 * was (SQLite's atomic commit, or the server's rollback of a transaction
 * whose client is gone; issue 3, crash consistency). */
static void
test_killed_import (void)
{
  g_autofree char *path = test_library_location ("kill.sqlite");
  g_autoptr(LaminaLibrary) library = open_at ("kill.sqlite");
  g_autoptr(LaminaCatalogue) small = make_catalogue (library, 5, 100);
  /* Smaller on a server, where each statement is a round trip. */
  guint n_big = test_on_server () ? 1000 : 3000;
  g_autoptr(LaminaCatalogue) big = make_catalogue (library, n_big, 120);
  g_autoptr(LaminaImportReport) report = lamina_library_import (library, small, 0, "T", NULL);
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  gint64 start, elapsed;
  int status = 0, pipefd[2];
  pid_t pid;
  char ready;

  g_assert_nonnull (report);
  g_clear_object (&library);
  before = dump_library (path);

  /* Time a full import of the same size in a copy, to kill at half. */
  {
    g_autoptr(LaminaLibrary) probe = open_at ("probe.sqlite");
    g_autoptr(LaminaImportReport) r = NULL;

    start = g_get_monotonic_time ();
    r = lamina_library_import (probe, big, 0, "T", NULL);
    elapsed = g_get_monotonic_time () - start;
    g_assert_nonnull (r);
  }
  g_test_message ("full import of %u constructions: %.0f ms", n_big, elapsed / 1000.0);

  g_assert_cmpint (pipe (pipefd), ==, 0);
  pid = fork ();
  g_assert_cmpint (pid, >=, 0);
  if (pid == 0)
    {
      LaminaLibrary *child = lamina_library_open (path, 0, NULL);

      if (write (pipefd[1], "r", 1) != 1 || child == NULL)
        _exit (3);
      lamina_library_import (child, big, 0, "child", NULL);
      _exit (0);
    }
  g_assert_cmpint (read (pipefd[0], &ready, 1), ==, 1);
  g_usleep (elapsed / 2);
  kill (pid, SIGKILL);
  g_assert_cmpint (waitpid (pid, &status, 0), ==, pid);
  close (pipefd[0]);
  close (pipefd[1]);
  if (!WIFSIGNALED (status))
    g_test_message ("the child finished before the kill; the check below still holds");
  else
    {
      after = dump_library (path);
      g_assert_cmpstr (before, ==, after);
      /* And the library opens and works. */
      library = open_at ("kill.sqlite");
      g_clear_pointer (&report, lamina_import_report_free);
      report = lamina_library_import (library, big, 0, "T", NULL);
      g_assert_nonnull (report);
      g_assert_cmpuint (report->n_added, ==, n_big - 5);
    }
}

/* A construction the database refuses half-way through a large import
 * (here a trigger, standing in for any failure at the server: a full
 * disk, a revoked privilege): nothing of the import is kept, the error
 * names the refusal, and the same connection imports again afterwards.
 * On the server the writes are pipelined in batches, so the refusal is
 * tried early (inside the first batch, whose statements are still being
 * prepared) and late (after several batches). */
static void
test_refused_write (void)
{
  g_autofree char *path = test_library_location ("refused.sqlite");
  g_autoptr(LaminaLibrary) library = open_at ("refused.sqlite");
  g_autoptr(LaminaCatalogue) big = make_catalogue (library, 300, 120);
  static const char *const refused[] = { "test-3", "test-250" };

  for (guint k = 0; k < G_N_ELEMENTS (refused); k++)
    {
      g_autoptr(GError) error = NULL;
      g_autoptr(LaminaImportReport) report = NULL;
      g_autofree char *sql = NULL;

      if (test_on_server ())
        sql = g_strdup_printf (
          "CREATE OR REPLACE FUNCTION refuse_one () RETURNS trigger LANGUAGE plpgsql AS $$"
          " BEGIN IF NEW.id = '%s' THEN RAISE EXCEPTION 'refused for a test'; END IF;"
          " RETURN NEW; END $$;"
          "DROP TRIGGER IF EXISTS refuse_one ON construction;"
          "CREATE TRIGGER refuse_one BEFORE INSERT ON construction"
          "  FOR EACH ROW EXECUTE FUNCTION refuse_one ();", refused[k]);
      else
        sql = g_strdup_printf (
          "DROP TRIGGER IF EXISTS refuse_one;"
          "CREATE TRIGGER refuse_one BEFORE INSERT ON construction WHEN NEW.id = '%s'"
          " BEGIN SELECT RAISE (ABORT, 'refused for a test'); END;", refused[k]);
      g_assert_true (test_raw_exec (path, sql));
      report = lamina_library_import (library, big, 0, "T", &error);
      g_assert_null (report);
      g_assert_nonnull (error);
      g_assert_nonnull (strstr (error->message, "refused for a test"));
      g_assert_cmpint (test_raw_int (path, "SELECT count(*) FROM construction"), ==, 0);
      g_assert_cmpint (test_raw_int (path, "SELECT count(*) FROM revision"), ==, 0);
    }
  g_assert_true (test_raw_exec (path, test_on_server ()
                                      ? "DROP TRIGGER refuse_one ON construction;"
                                      : "DROP TRIGGER refuse_one;"));
  {
    g_autoptr(GError) error = NULL;
    g_autoptr(LaminaImportReport) report = lamina_library_import (library, big, 0, "T", &error);
    LaminaLibraryQuery q;

    g_assert_no_error (error);
    g_assert_cmpuint (report->n_added, ==, 300);
    lamina_library_query_init (&q);
    q.text = "odd";
    g_assert_cmpint (lamina_library_count (library, &q, &error), ==, 150);
    g_assert_cmpint (test_raw_int (path, "SELECT count(*) FROM construction_tag"), ==, 300);
  }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);

  g_test_add_func ("/store/exchange/round-trip", test_round_trip);
  g_test_add_func ("/store/exchange/merge", test_merge);
  g_test_add_func ("/store/exchange/killed-import", test_killed_import);
  g_test_add_func ("/store/exchange/refused-write", test_refused_write);
  return g_test_run ();
}
