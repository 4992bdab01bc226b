/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The office library on a PostgreSQL server (issue 18), run by
 * tests/store/pg-fixture against a throwaway server: what only a server
 * library has (addresses, other programs' databases, the schema version,
 * colleagues' notifications, many clients at once) and the search giving
 * the SQLite library's results on the demo.  The shared store suite runs
 * on the server as well (the *-pg tests). */
#include <string.h>

#include "lamina-library.h"
#include "lamina-library-safety.h"
#include "lamina-store-test-util.h"

static LaminaLibrary *
open_at (const char *name)
{
  g_autofree char *location = test_library_location (name);
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library = lamina_library_open (location, LAMINA_LIBRARY_OPEN_DEFAULT, &error);

  g_assert_no_error (error);
  return library;
}

static void
test_address (void)
{
  g_assert_true (lamina_library_is_server_address ("postgresql://office@db.example:5432/lamina"));
  g_assert_true (lamina_library_is_server_address ("postgres://db.example/lamina"));
  g_assert_true (lamina_library_is_server_address ("service=office"));
  g_assert_true (lamina_library_is_server_address ("host=db.example dbname=lamina"));
  /* Paths stay paths, even with an "=" or a colon in them. */
  g_assert_false (lamina_library_is_server_address ("library.sqlite"));
  g_assert_false (lamina_library_is_server_address ("/srv/office/library.sqlite"));
  g_assert_false (lamina_library_is_server_address ("a=b.sqlite"));
  g_assert_false (lamina_library_is_server_address ("postgresql:library.sqlite"));
  g_assert_false (lamina_library_is_server_address ("./service=office"));
  g_assert_false (lamina_library_is_server_address (NULL));
}

static LaminaCatalogue *
read_demo (void)
{
  g_autofree char *path = g_build_filename (g_getenv ("LAMINA_SOURCE_DIR"), "data", "demo",
                                            "lamina-demo.xml", NULL);
  g_autoptr(GError) error = NULL;
  LaminaCatalogue *catalogue = lamina_catalogue_read_file (path, &error);

  g_assert_no_error (error);
  return catalogue;
}

static char *
search_codes (LaminaLibrary *library,
              const char    *text,
              LaminaSortKey  sort,
              gboolean       descending)
{
  g_autoptr(GPtrArray) rows = NULL;
  g_autoptr(GString) codes = g_string_new (NULL);
  g_autoptr(GError) error = NULL;
  LaminaLibraryQuery q;

  lamina_library_query_init (&q);
  q.text = text;
  q.sort = sort;
  q.descending = descending;
  rows = lamina_library_search (library, &q, &error);
  g_assert_no_error (error);
  for (guint i = 0; i < rows->len; i++)
    {
      const LaminaSummary *s = rows->pdata[i];

      g_string_append_printf (codes, "%s ", s->code ? s->code : s->name);
    }
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, rows->len);
  return g_string_free (g_steal_pointer (&codes), FALSE);
}

/* The demo in a file and on the server: every search finds the same
 * constructions in the same order (the words are split as SQLite's
 * unicode61 tokenizer splits them, without diacritics; issue 18 asks for
 * SQLite's results). */
static void
test_search_matches_sqlite (void)
{
  g_autoptr(LaminaCatalogue) demo = read_demo ();
  g_autofree char *path = test_library_path ("demo.sqlite");
  g_autoptr(LaminaLibrary) file = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
  g_autoptr(LaminaLibrary) server = open_at ("demo");
  g_autoptr(LaminaImportReport) r1 = lamina_library_import (file, demo, 0, "T", NULL);
  g_autoptr(LaminaImportReport) r2 = lamina_library_import (server, demo, 0, "T", NULL);
  static const char *const texts[] = {
    NULL, "", "w", "wa", "wall", "EW", "ew-1", "EW-101", "timber", "tim fra", "min",
    "mineral wool", "concrete", "roof", "floor", "brick", "plaster", "osb", "eps", "pir",
    "x", "zzz", "100", "35", "board", "insul", "ground", "partition", "\"", "*", "w*", "NOT",
    "-", "é", "beton", "flat", "pitched",
  };
  static const LaminaSortKey sorts[] = {
    LAMINA_SORT_CODE, LAMINA_SORT_NAME, LAMINA_SORT_U, LAMINA_SORT_THICKNESS,
  };
  guint found = 0;

  g_assert_nonnull (r1);
  g_assert_nonnull (r2);
  g_assert_cmpuint (r1->n_added, ==, r2->n_added);
  for (guint i = 0; i < G_N_ELEMENTS (texts); i++)
    for (guint k = 0; k < G_N_ELEMENTS (sorts); k++)
      for (int d = 0; d < 2; d++)
        {
          g_autofree char *a = search_codes (file, texts[i], sorts[k], d);
          g_autofree char *b = search_codes (server, texts[i], sorts[k], d);

          g_test_message ("“%s”: %s", texts[i] ? texts[i] : "(none)", a);
          g_assert_cmpstr (a, ==, b);
          found += *a != '\0';
        }
  /* Not a comparison of empty lists. */
  g_assert_cmpuint (found, >, 20 * G_N_ELEMENTS (sorts));
}

/* A colleague's save is seen by the next check; one's own is not
 * reported back as a colleague's. */
static void
test_notification (void)
{
  g_autoptr(LaminaLibrary) a = open_at ("notify");
  g_autoptr(LaminaLibrary) b = open_at ("notify");
  g_autoptr(LaminaConstruction) c = test_make_wall (a, "EW-9", "Notified wall", NULL, 100);
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;

  g_assert_false (lamina_library_check_for_changes (a));
  g_assert_false (lamina_library_check_for_changes (b));
  id = lamina_library_create_construction (a, c, "A. Planner", &error);
  g_assert_no_error (error);
  g_assert_false (lamina_library_check_for_changes (a));
  g_assert_true (lamina_library_check_for_changes (b));
  g_assert_false (lamina_library_check_for_changes (b));
  g_assert_true (lamina_library_mark_checked (b, id, 1, "C. Checker", &error));
  g_assert_true (lamina_library_check_for_changes (a));
}

/* A database of another program, or of a newer Lamina, is refused and
 * left as it was; an empty one is not made a library when only an
 * existing one may be opened. */
static void
test_refusals (void)
{
  g_autofree char *foreign = test_library_location ("foreign");
  g_autofree char *empty = test_library_location ("empty");
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = NULL;

  g_assert_true (test_raw_exec (foreign, "CREATE TABLE invoice (n integer);"));
  g_assert_null (lamina_library_open (foreign, LAMINA_LIBRARY_OPEN_DEFAULT, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_NOT_A_LIBRARY);
  g_clear_error (&error);
  g_assert_cmpint (test_raw_int (foreign, "SELECT count(*) FROM pg_tables WHERE schemaname = 'public';"),
                   ==, 1);

  g_assert_null (lamina_library_open (empty, LAMINA_LIBRARY_OPEN_EXISTING, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "server-init"));
  g_clear_error (&error);
  g_assert_cmpint (test_raw_int (empty, "SELECT count(*) FROM pg_tables WHERE schemaname = 'public';"),
                   ==, 0);

  library = lamina_library_open (empty, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  g_assert_cmpint (lamina_library_get_opened_version (library), ==, 0);
  g_clear_object (&library);
  g_assert_true (test_raw_exec (empty, "UPDATE meta SET value = '99' WHERE key = 'schema_version';"));
  g_assert_null (lamina_library_open (empty, LAMINA_LIBRARY_OPEN_DEFAULT, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_TOO_NEW);
  g_clear_error (&error);
  g_assert_cmpint (test_raw_int (empty, "SELECT value::integer FROM meta WHERE key = 'schema_version';"),
                   ==, 99);

  /* Opened read-only: every write refused before it reaches the server. */
  g_assert_true (test_raw_exec (empty, "UPDATE meta SET value = '8' WHERE key = 'schema_version';"));
  library = lamina_library_open (empty, LAMINA_LIBRARY_OPEN_READ_ONLY, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_library_is_read_only (library));
  {
    g_autoptr(LaminaConstruction) c = test_make_wall (library, "RO-1", "Read-only wall", NULL, 100);

    g_assert_null (lamina_library_create_construction (library, c, "A. Planner", &error));
    g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_READ_ONLY);
    g_clear_error (&error);
  }
  g_clear_object (&library);

  /* No server there: a located error, no file made. */
  g_assert_null (lamina_library_open ("postgresql://nobody@127.0.0.1:1/none",
                                      LAMINA_LIBRARY_OPEN_DEFAULT, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "postgresql://nobody@127.0.0.1:1/none"));
  g_assert_false (g_file_test ("postgresql:", G_FILE_TEST_EXISTS));
}

static char *
as_user (const char *location,
         const char *user)
{
  return g_strdup_printf ("%s user=%s", location, user);
}

static LaminaLibrary *
open_as (const char *location,
         const char *user)
{
  g_autofree char *conninfo = as_user (location, user);
  g_autoptr(GError) error = NULL;
  LaminaLibrary *library = lamina_library_open (conninfo, LAMINA_LIBRARY_OPEN_EXISTING, &error);

  g_assert_no_error (error);
  return library;
}

/* server-init: the server, not the client, keeps the review (issue 18).
 * An author with psql cannot forge a check, an approval or a review
 * record, nor store a reviewed revision, nor turn the four-eyes policy
 * off; the review records carry the server's name of the person. */
static void
test_roles (void)
{
  g_autofree char *location = test_library_location ("office");
  g_autofree char *alice = as_user (location, "alice");
  g_autoptr(LaminaLibrary) owner = lamina_library_open (location, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
  g_autoptr(LaminaLibrary) a = NULL, c = NULL, d = NULL;
  g_autoptr(LaminaConstruction) wall = NULL;
  g_autoptr(LaminaConstruction) edit = NULL;
  g_autoptr(GPtrArray) events = NULL;
  g_autoptr(GPtrArray) history = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = NULL;
  g_autofree char *sql = NULL;

  g_assert_nonnull (owner);
  g_assert_true (lamina_library_server_init (owner, &error));
  g_assert_no_error (error);
  /* Again: nothing breaks. */
  g_assert_true (lamina_library_server_init (owner, &error));
  g_assert_true (test_pg_admin ("CREATE ROLE alice LOGIN; GRANT lamina_author TO alice;"
                                "CREATE ROLE carol LOGIN; GRANT lamina_checker TO carol;"
                                "CREATE ROLE dave LOGIN; GRANT lamina_approver TO dave;"));
  a = open_as (location, "alice");
  c = open_as (location, "carol");
  d = open_as (location, "dave");

  wall = test_make_wall (a, "EW-20", "Office wall", NULL, 160);
  id = lamina_library_create_construction (a, wall, "A. Planner", &error);
  g_assert_no_error (error);
  /* Recorded under the server's name of the person. */
  history = lamina_library_dup_history (c, id, &error);
  g_assert_cmpstr (((LaminaRevisionInfo *) history->pdata[0])->modified_by, ==, "alice");

  /* Plain SQL as the author: every forgery refused by the server. */
  g_assert_false (test_raw_exec (alice, "UPDATE revision SET status = 'approved', approved_by = 'dave';"));
  g_assert_false (test_raw_exec (alice, "UPDATE revision SET checked_by = 'carol';"));
  sql = g_strdup_printf ("INSERT INTO review_event (construction_id, revision, act, person, at)"
                         " VALUES ('%s', 1, 'approved', 'dave', '2026-01-01');", id);
  g_assert_false (test_raw_exec (alice, sql));
  g_free (sql);
  sql = g_strdup_printf ("INSERT INTO revision (construction_id, revision, status, body, modified_by,"
                         " modified_at, approved_by, approved_at) SELECT construction_id, 2,"
                         " 'approved', body, 'alice', modified_at, 'dave', '2026-01-01'"
                         " FROM revision WHERE construction_id = '%s';", id);
  g_assert_false (test_raw_exec (alice, sql));
  g_free (sql);
  sql = g_strdup_printf ("SELECT lamina_review_act ('%s', 0, 'checked', 'carol', 'now', NULL, NULL, NULL);", id);
  g_assert_false (test_raw_exec (alice, sql));
  g_assert_false (test_raw_exec (alice, "UPDATE meta SET value = 'single' WHERE key = 'review-policy';"));
  g_assert_false (test_raw_exec (alice, "INSERT INTO meta VALUES ('review-policy', 'single');"));
  g_assert_false (test_raw_exec (alice, "ALTER TABLE revision DISABLE TRIGGER ALL;"));
  g_assert_false (test_raw_exec (alice, "DELETE FROM revision;"));
  /* Allowed, but the list's status follows the revision's. */
  g_assert_true (test_raw_exec (alice, "UPDATE construction SET status = 'approved';"));
  g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM construction WHERE status <> 'draft';"), ==, 0);
  g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM revision WHERE status <> 'draft';"), ==, 0);
  g_assert_cmpint (test_raw_int (location, "SELECT count(*) FROM review_event;"), ==, 0);

  /* Through Lamina: the author holds no checker's role. */
  g_assert_false (lamina_library_mark_checked (a, id, 1, "C. Colleague", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY);
  g_assert_nonnull (strstr (error->message, "lamina_checker"));
  g_clear_error (&error);
  /* The checker and the approver: recorded as who they are on the server. */
  g_assert_true (lamina_library_mark_checked (c, id, 1, "C. Checker", &error));
  g_assert_no_error (error);
  g_assert_false (lamina_library_approve (c, id, 1, "D. Director", NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY);
  g_clear_error (&error);
  g_assert_true (lamina_library_approve (d, id, 1, "D. Director", NULL, &error));
  g_assert_no_error (error);
  events = lamina_library_dup_review_events (a, id, &error);
  g_assert_cmpuint (events->len, ==, 2);
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[0])->by, ==, "carol");
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[1])->by, ==, "dave");
  g_assert_false (test_raw_exec (alice, "UPDATE revision SET approved_by = 'alice';"));
  {
    g_autoptr(LaminaVerifyReport) report = lamina_library_verify (owner, &error);

    g_assert_no_error (error);
    g_assert_true (report->storage_checked);
    g_assert_cmpuint (report->problems->len, ==, 0);
    /* The owner could drop a guard: the check says so. */
    g_assert_true (test_raw_exec (location, "ALTER TABLE revision DISABLE TRIGGER revision_guard;"));
    g_clear_pointer (&report, lamina_verify_report_free);
    report = lamina_library_verify (owner, &error);
    g_assert_cmpuint (report->problems->len, ==, 1);
    g_assert_nonnull (strstr (report->problems->pdata[0], "revision_guard"));
    g_assert_true (test_raw_exec (location, "ALTER TABLE revision ENABLE TRIGGER revision_guard;"));
  }

  /* Four eyes on the server: the checker's own revision is not theirs to
   * check, whatever name the client gives. */
  edit = lamina_library_dup_construction (c, id, 0, &error);
  g_free (edit->name);
  edit->name = g_strdup ("Office wall, revised");
  g_assert_true (lamina_library_save_construction (c, edit, 1, "C. Checker", &error));
  g_assert_no_error (error);
  g_assert_false (lamina_library_mark_checked (c, id, 2, "Someone Else", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY);
  g_assert_nonnull (strstr (error->message, "carol wrote this revision"));
  g_clear_error (&error);
  g_assert_true (lamina_library_mark_checked (d, id, 2, "D. Director", &error));
  g_assert_no_error (error);
}

/* A draft after an approval is edited in place by its author, and saving
 * the approved build-up again removes it (replace_draft, drop_draft on
 * the server). */
static void
test_draft_in_place (void)
{
  g_autoptr(LaminaLibrary) library = open_at ("drafts");
  g_autoptr(LaminaConstruction) wall = test_make_wall (library, "EW-30", "Draft wall", NULL, 150);
  g_autoptr(LaminaConstruction) edit = NULL;
  g_autoptr(LaminaConstruction) now = NULL;
  g_autoptr(GPtrArray) history = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *id = lamina_library_create_construction (library, wall, "A. Planner", &error);
  LaminaLayer *layer;

  g_assert_no_error (error);
  g_assert_true (lamina_library_mark_checked (library, id, 1, "C. Checker", &error));
  g_assert_true (lamina_library_approve (library, id, 1, "D. Director", NULL, &error));
  g_assert_no_error (error);

  edit = lamina_library_dup_construction (library, id, 0, &error);
  layer = edit->layers->pdata[1];
  layer->thickness = 195;
  g_assert_true (lamina_library_save_construction (library, edit, 1, "A. Planner", &error));
  g_assert_no_error (error);
  g_assert_cmpint (edit->revision, ==, 2);
  layer->thickness = 220;
  g_assert_true (lamina_library_save_construction (library, edit, 2, "A. Planner", &error));
  g_assert_no_error (error);
  history = lamina_library_dup_history (library, id, &error);
  g_assert_cmpuint (history->len, ==, 2);
  now = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpint (now->revision, ==, 2);
  g_assert_cmpfloat (((LaminaLayer *) now->layers->pdata[1])->thickness, ==, 220);

  /* Back to the approved build-up: the draft goes, the approval is the latest. */
  layer->thickness = 150;
  g_assert_true (lamina_library_save_construction (library, edit, 2, "A. Planner", &error));
  g_assert_no_error (error);
  g_clear_pointer (&now, lamina_construction_free);
  now = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpint (now->revision, ==, 1);
  g_assert_cmpint (now->status, ==, LAMINA_STATUS_APPROVED);
}

/* Clients at once, each with its own connection (issue 18: "two and five
 * concurrent clients editing, checking, approving and importing with
 * nothing lost and every refusal reported"). */
typedef struct
{
  const char *location;
  const char *shared_id;
  int         client;
  int         rounds;
  int         saves;       /* successful saves of the shared construction */
  int         reviews;     /* successful checks and approvals */
  int         refusals;    /* refused with STALE, IMMUTABLE or POLICY */
} Client;

static gboolean
expected_refusal (const GError *error)
{
  return error != NULL && error->domain == LAMINA_LIBRARY_ERROR
         && (error->code == LAMINA_LIBRARY_ERROR_STALE || error->code == LAMINA_LIBRARY_ERROR_IMMUTABLE
             || error->code == LAMINA_LIBRARY_ERROR_POLICY);
}

static gpointer
client_run (gpointer data)
{
  Client *cl = data;
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = lamina_library_open (cl->location, LAMINA_LIBRARY_OPEN_EXISTING,
                                                          &error);
  g_autofree char *author = g_strdup_printf ("Author %d", cl->client);
  g_autofree char *checker = g_strdup_printf ("Checker %d", cl->client);

  g_assert_no_error (error);
  for (int k = 0; k < cl->rounds; k++)
    {
      g_autofree char *code = g_strdup_printf ("T%d-%d", cl->client, k);
      g_autoptr(LaminaConstruction) own = test_make_wall (library, code, "Own wall", "mine", 100 + k);
      g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_new ();
      g_autoptr(LaminaImportReport) report = NULL;
      g_autofree char *own_id = lamina_library_create_construction (library, own, author, &error);
      gboolean saved = FALSE;

      g_assert_no_error (error);
      /* Edit the shared construction until the save goes through. */
      for (int attempt = 0; attempt < 50 && !saved; attempt++)
        {
          g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, cl->shared_id, 0,
                                                                            &error);

          g_assert_no_error (error);
          g_free (c->description);
          c->description = g_strdup_printf ("edited by client %d, round %d", cl->client, k);
          saved = lamina_library_save_construction (library, c, c->revision, author, &error);
          if (!saved)
            {
              g_assert_true (expected_refusal (error));
              cl->refusals++;
              g_clear_error (&error);
            }
        }
      g_assert_true (saved);
      cl->saves++;
      /* Check, then approve, the shared construction's latest. */
      if (lamina_library_mark_checked (library, cl->shared_id, 0, checker, &error))
        cl->reviews++;
      else
        {
          g_assert_true (expected_refusal (error));
          cl->refusals++;
          g_clear_error (&error);
        }
      if (lamina_library_approve (library, cl->shared_id, 0, checker, NULL, &error))
        cl->reviews++;
      else
        {
          g_assert_true (expected_refusal (error));
          cl->refusals++;
          g_clear_error (&error);
        }
      /* Import three new constructions at once. */
      for (int j = 0; j < 3; j++)
        {
          LaminaConstruction *w = test_make_wall (library, NULL, "Imported wall", "imported", 120 + j);

          w->id = g_strdup_printf ("imp-%d-%d-%d", cl->client, k, j);
          g_ptr_array_add (catalogue->constructions, w);
        }
      report = lamina_library_import (library, catalogue, 0, author, &error);
      g_assert_no_error (error);
      g_assert_cmpuint (report->n_added, ==, 3);
    }
  return NULL;
}

static void
run_clients (const char *name,
             int         n)
{
  g_autofree char *location = test_library_location (name);
  g_autoptr(LaminaLibrary) library = lamina_library_open (location, LAMINA_LIBRARY_OPEN_DEFAULT, NULL);
  g_autoptr(LaminaConstruction) shared = test_make_wall (library, "EW-SH", "Shared wall", NULL, 140);
  g_autofree char *id = lamina_library_create_construction (library, shared, "Owner", NULL);
  g_autofree Client *clients = g_new0 (Client, n);
  g_autofree GThread **threads = g_new0 (GThread *, n);
  g_autofree char *sql = NULL;
  int saves = 0, reviews = 0, refusals = 0, rounds = 4;
  LaminaLibraryQuery q;

  g_assert_nonnull (id);
  for (int i = 0; i < n; i++)
    {
      clients[i] = (Client) { location, id, i, rounds, 0, 0, 0 };
      threads[i] = g_thread_new ("client", client_run, &clients[i]);
    }
  for (int i = 0; i < n; i++)
    {
      g_thread_join (threads[i]);
      saves += clients[i].saves;
      reviews += clients[i].reviews;
      refusals += clients[i].refusals;
    }
  g_test_message ("%d clients: %d saves, %d reviews, %d refusals reported", n, saves, reviews, refusals);
  /* Nothing lost: every save is a revision, every review a record, every
   * creation and import a construction. */
  sql = g_strdup_printf ("SELECT count(*) FROM revision WHERE construction_id = '%s';", id);
  g_assert_cmpint (test_raw_int (location, sql), ==, 1 + saves);
  g_free (sql);
  sql = g_strdup_printf ("SELECT count(*) FROM review_event WHERE construction_id = '%s';", id);
  g_assert_cmpint (test_raw_int (location, sql), ==, reviews);
  lamina_library_query_init (&q);
  q.tag = "mine";
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, n * rounds);
  q.tag = "imported";
  g_assert_cmpint (lamina_library_count (library, &q, NULL), ==, n * rounds * 3);
  g_assert_cmpint (saves, ==, n * rounds);
}

static void
test_two_clients (void)
{
  run_clients ("two", 2);
}

static void
test_five_clients (void)
{
  run_clients ("five", 5);
}

/* While a save waits for a colleague's row lock, the library's wait
 * function hears who holds it, as it does for a file library's writer
 * (and once more when the wait ends); the save then goes through. */
static gpointer
commit_later (gpointer data)
{
  PGconn *conn = data;

  g_usleep (G_USEC_PER_SEC * 3 / 2);
  PQclear (PQexec (conn, "COMMIT;"));
  return NULL;
}

static void
record_wait (LaminaLibrary *library,
             gboolean       waiting,
             const char    *holder,
             gpointer       user_data)
{
  g_ptr_array_add (user_data, g_strdup_printf ("%s %s", waiting ? "wait" : "done",
                                               holder ? holder : "-"));
}

static void
test_lock_wait (void)
{
  g_autofree char *location = test_library_location ("waits");
  g_autofree char *holder_info = g_strdup_printf ("%s application_name=colleague-tool", location);
  g_autoptr(LaminaLibrary) library = open_at ("waits");
  g_autoptr(LaminaConstruction) c = test_make_wall (library, "EW-50", "Awaited wall", NULL, 100);
  g_autoptr(GPtrArray) calls = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GError) error = NULL;
  g_autofree char *id = lamina_library_create_construction (library, c, "A. Planner", &error);
  g_autoptr(LaminaConstruction) edit = lamina_library_dup_construction (library, id, 0, &error);
  PGconn *colleague = PQconnectdb (holder_info);
  PGresult *res;
  GThread *thread;

  g_assert_no_error (error);
  g_assert_cmpint (PQstatus (colleague), ==, CONNECTION_OK);
  res = PQexec (colleague, "BEGIN; SELECT 1 FROM construction FOR UPDATE;");
  g_assert_cmpint (PQresultStatus (res), ==, PGRES_TUPLES_OK);
  PQclear (res);
  lamina_library_set_wait_func (library, record_wait, calls);
  thread = g_thread_new ("colleague", commit_later, colleague);
  ((LaminaLayer *) edit->layers->pdata[1])->thickness = 140;
  g_assert_true (lamina_library_save_construction (library, edit, 1, "A. Planner", &error));
  g_assert_no_error (error);
  g_thread_join (thread);
  PQfinish (colleague);
  g_assert_cmpuint (calls->len, ==, 2);
  g_assert_true (g_str_has_prefix (calls->pdata[0], "wait colleague-tool, server process "));
  g_assert_true (g_str_has_suffix (calls->pdata[0], ", user postgres"));
  g_assert_cmpstr (calls->pdata[1], ==, "done -");

  /* A password given to the open stays out of the library's path. */
  {
    g_autoptr(LaminaLibrary) again = lamina_library_open_with_password (location, "not-shown",
                                                                        LAMINA_LIBRARY_OPEN_EXISTING,
                                                                        &error);

    g_assert_no_error (error);
    g_assert_null (strstr (lamina_library_get_path (again), "not-shown"));
  }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  if (!test_on_server ())
    g_error ("run by tests/store/pg-fixture: LAMINA_TEST_PG is not set");
  g_test_add_func ("/store/server/address", test_address);
  g_test_add_func ("/store/server/search-matches-sqlite", test_search_matches_sqlite);
  g_test_add_func ("/store/server/notification", test_notification);
  g_test_add_func ("/store/server/refusals", test_refusals);
  g_test_add_func ("/store/server/roles", test_roles);
  g_test_add_func ("/store/server/draft-in-place", test_draft_in_place);
  g_test_add_func ("/store/server/two-clients", test_two_clients);
  g_test_add_func ("/store/server/five-clients", test_five_clients);
  g_test_add_func ("/store/server/lock-wait", test_lock_wait);
  return g_test_run ();
}
