/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-store-test-util.h: constructions and files for the store tests. */
#pragma once

#include <glib.h>
#include <glib/gstdio.h>
#include <libpq-fe.h>
#include <math.h>
#include <sqlite3.h>
#include <string.h>

#include "lamina-library.h"

/* A timber-frame wall built from the seeded library materials:
 * plasterboard, studs with mineral wool between, OSB.  @tag and @insulation_mm
 * vary the build-up so that many different constructions can be made. */
static inline LaminaConstruction *
test_make_wall (LaminaLibrary *library,
                const char    *code,
                const char    *name,
                const char    *tag,
                double         insulation_mm)
{
  LaminaConstruction *c = lamina_construction_new (NULL, name, LAMINA_ELEMENT_WALL);
  LaminaLayer *bridged = lamina_layer_new_bridged (insulation_mm);

  c->code = g_strdup (code);
  c->description = g_strdup ("Timber frame wall for an invented test scenario");
  if (tag != NULL)
    lamina_construction_add_tag (c, tag);
  lamina_construction_add_layer (c, lamina_layer_new_material (12.5,
    lamina_library_dup_material (library, "iso10456-plasterboard-700", NULL)));
  lamina_layer_add_part (bridged, lamina_part_new_framing (
    lamina_library_dup_material (library, "iso10456-softwood-500", NULL), 45, 600, "stud"));
  lamina_layer_add_part (bridged, lamina_part_new (
    lamina_library_dup_material (library, "typical-mineral-wool-035", NULL), NAN));
  lamina_construction_add_layer (c, bridged);
  lamina_construction_add_layer (c, lamina_layer_new_material (15,
    lamina_library_dup_material (library, "iso10456-osb-650", NULL)));
  c->target_u = 0.30;
  return c;
}

static inline char *
test_checksum (const char *path)
{
  g_autofree char *data = NULL;
  gsize len = 0;

  g_assert_true (g_file_get_contents (path, &data, &len, NULL));
  return g_compute_checksum_for_data (G_CHECKSUM_SHA256, (const guchar *) data, len);
}

static inline char *
test_library_path (const char *name)
{
  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  return g_build_filename (g_get_user_data_dir (), name, NULL);
}

/* An invented climate (test data only): winter @winter °C in January,
 * 18 K warmer in July, damp winters. */
static inline LaminaClimate *
test_make_climate (const char *id,
                   double      winter)
{
  static const double h[LAMINA_MONTHS] = { .88, .85, .80, .75, .72, .74, .75, .77, .80, .84, .87, .89 };
  LaminaClimate *climate = lamina_climate_new (id, "Test climate");

  climate->source = g_strdup ("invented for a test");
  for (int m = 0; m < LAMINA_MONTHS; m++)
    {
      climate->temperature[m] = winter + 18.0 * (1.0 - cos (2.0 * G_PI * m / 12.0)) / 2.0;
      climate->humidity[m] = h[m];
    }
  return climate;
}

/* The one store suite runs against both backends: under tests/store/
 * pg-fixture, LAMINA_TEST_PG holds the throwaway server's connection
 * string and every library is a fresh database on it; otherwise a file. */
static inline gboolean
test_on_server (void)
{
  return g_getenv ("LAMINA_TEST_PG") != NULL;
}

/* Runs @sql on the server's maintenance database; FALSE on failure. */
static inline gboolean
test_pg_admin (const char *sql)
{
  g_autofree char *conninfo = g_strdup_printf ("%s dbname=postgres", g_getenv ("LAMINA_TEST_PG"));
  PGconn *conn = PQconnectdb (conninfo);
  PGresult *res;
  gboolean ok;

  if (PQstatus (conn) != CONNECTION_OK)
    g_error ("test server: %s", PQerrorMessage (conn));
  res = PQexec (conn, sql);
  ok = PQresultStatus (res) == PGRES_COMMAND_OK || PQresultStatus (res) == PGRES_TUPLES_OK;
  if (!ok)
    g_test_message ("%s: %s", sql, PQerrorMessage (conn));
  PQclear (res);
  PQfinish (conn);
  return ok;
}

/* The library location named after @name, new and empty at its first use in
 * the test program: a path in the test's
 * data folder, or a new database on the test server ("rev.sqlite" →
 * database rev_sqlite). */
static inline char *
test_library_location (const char *name)
{
  static GHashTable *made;
  g_autoptr(GString) db = NULL;
  g_autofree char *sql = NULL;

  if (!test_on_server ())
    return test_library_path (name);
  /* A second open of one name (two colleagues) is the same library. */
  if (made == NULL)
    made = g_hash_table_new (g_str_hash, g_str_equal);
  db = g_string_new (NULL);
  for (const char *p = name; *p; p++)
    g_string_append_c (db, g_ascii_isalnum (*p) ? g_ascii_tolower (*p) : '_');
  if (g_hash_table_contains (made, db->str))
    return g_strdup_printf ("%s dbname=%s", g_getenv ("LAMINA_TEST_PG"), db->str);
  g_hash_table_add (made, g_strdup (db->str));
  sql = g_strdup_printf ("DROP DATABASE IF EXISTS \"%s\" WITH (FORCE)", db->str);
  g_assert_true (test_pg_admin (sql));
  g_free (sql);
  sql = g_strdup_printf ("CREATE DATABASE \"%s\"", db->str);
  g_assert_true (test_pg_admin (sql));
  return g_strdup_printf ("%s dbname=%s", g_getenv ("LAMINA_TEST_PG"), db->str);
}

/* Runs @sql straight on the library at @location, past Lamina (as a user
 * with a database tool could); TRUE if the database accepted it. */
static inline gboolean
test_raw_exec (const char *location,
               const char *sql)
{
  gboolean ok;

  if (test_on_server ())
    {
      PGconn *conn = PQconnectdb (location);
      PGresult *res;

      g_assert_cmpint (PQstatus (conn), ==, CONNECTION_OK);
      res = PQexec (conn, sql);
      ok = PQresultStatus (res) == PGRES_COMMAND_OK || PQresultStatus (res) == PGRES_TUPLES_OK;
      PQclear (res);
      PQfinish (conn);
    }
  else
    {
      sqlite3 *db = NULL;

      g_assert_cmpint (sqlite3_open (location, &db), ==, SQLITE_OK);
      ok = sqlite3_exec (db, sql, NULL, NULL, NULL) == SQLITE_OK;
      sqlite3_close (db);
    }
  return ok;
}

/* The integer the query @sql returns, read straight from the library. */
static inline gint64
test_raw_int (const char *location,
              const char *sql)
{
  gint64 value = -1;

  if (test_on_server ())
    {
      PGconn *conn = PQconnectdb (location);
      PGresult *res;

      g_assert_cmpint (PQstatus (conn), ==, CONNECTION_OK);
      res = PQexec (conn, sql);
      g_assert_cmpint (PQresultStatus (res), ==, PGRES_TUPLES_OK);
      g_assert_cmpint (PQntuples (res), ==, 1);
      value = g_ascii_strtoll (PQgetvalue (res, 0, 0), NULL, 10);
      PQclear (res);
      PQfinish (conn);
    }
  else
    {
      sqlite3 *db = NULL;
      sqlite3_stmt *stmt = NULL;

      g_assert_cmpint (sqlite3_open_v2 (location, &db, SQLITE_OPEN_READONLY, NULL), ==, SQLITE_OK);
      g_assert_cmpint (sqlite3_prepare_v2 (db, sql, -1, &stmt, NULL), ==, SQLITE_OK);
      g_assert_cmpint (sqlite3_step (stmt), ==, SQLITE_ROW);
      value = sqlite3_column_int64 (stmt, 0);
      sqlite3_finalize (stmt);
      sqlite3_close (db);
    }
  return value;
}

/* The same library as test_library_location (@name), as a postgresql://
 * URI on the test server, or the file path. */
static inline char *
test_library_uri (const char *name)
{
  g_autofree char *location = test_library_location (name);
  const char *db;

  if (!test_on_server ())
    return g_steal_pointer (&location);
  db = strstr (location, "dbname=") + strlen ("dbname=");
  return g_strdup_printf ("%s/%s", g_getenv ("LAMINA_TEST_PG_URI"), db);
}
