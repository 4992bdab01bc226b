/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-hardening-util.c: integrity and state checks of a library file. */
#define G_LOG_DOMAIN "lamina-test"

#include "lamina-hardening-util.h"
#include "lamina-store-test-util.h"

#include <glib/gstdio.h>
#include <math.h>
#include <sqlite3.h>

static gboolean
pragma_is_clean (sqlite3     *db,
                 const char  *sql,
                 gboolean     expect_ok,
                 const char  *path,
                 GError     **error)
{
  sqlite3_stmt *stmt = NULL;
  int rc = sqlite3_prepare_v2 (db, sql, -1, &stmt, NULL);
  gboolean clean = TRUE;
  g_autofree char *first = NULL;

  if (rc != SQLITE_OK)
    {
      g_set_error (error, G_FILE_ERROR, G_FILE_ERROR_FAILED, "%s: %s: %s", path, sql,
                   sqlite3_errmsg (db));
      return FALSE;
    }
  while ((rc = sqlite3_step (stmt)) == SQLITE_ROW)
    {
      const char *text = (const char *) sqlite3_column_text (stmt, 0);

      /* integrity_check answers one row "ok"; foreign_key_check no rows. */
      if (!expect_ok || g_strcmp0 (text, "ok") != 0)
        {
          clean = FALSE;
          if (first == NULL)
            first = g_strdup (text ? text : "(violation)");
        }
    }
  if (rc != SQLITE_DONE)
    {
      clean = FALSE;
      first = g_strdup (sqlite3_errmsg (db));
    }
  sqlite3_finalize (stmt);
  if (!clean)
    g_set_error (error, G_FILE_ERROR, G_FILE_ERROR_FAILED, "%s: %s: %s", path, sql, first);
  return clean;
}

static gboolean
read_everything (LaminaLibrary  *library,
                 GError        **error)
{
  g_autoptr(GPtrArray) materials = lamina_library_list_materials (library, error);
  g_autoptr(GPtrArray) rows = NULL;
  LaminaLibraryQuery q;

  if (materials == NULL)
    return FALSE;
  lamina_library_query_init (&q);
  rows = lamina_library_search (library, &q, error);
  if (rows == NULL)
    return FALSE;
  for (guint i = 0; i < rows->len; i++)
    {
      LaminaSummary *s = rows->pdata[i];
      g_autoptr(GPtrArray) history = lamina_library_dup_history (library, s->id, error);

      if (history == NULL)
        return FALSE;
      for (guint h = 0; h < history->len; h++)
        {
          LaminaRevisionInfo *info = history->pdata[h];
          g_autoptr(LaminaConstruction) c =
            lamina_library_dup_construction (library, s->id, info->revision, error);

          if (c == NULL)
            return FALSE;
        }
    }
  return TRUE;
}

gboolean
lamina_hardening_check_library (const char  *path,
                                GError     **error)
{
  sqlite3 *db = NULL;
  gboolean ok;
  g_autoptr(LaminaLibrary) library = NULL;

  if (sqlite3_open_v2 (path, &db, SQLITE_OPEN_READWRITE, NULL) != SQLITE_OK)
    {
      g_set_error (error, G_FILE_ERROR, G_FILE_ERROR_FAILED, "%s: %s", path,
                   db ? sqlite3_errmsg (db) : "cannot open");
      sqlite3_close (db);
      return FALSE;
    }
  sqlite3_busy_timeout (db, 10000);
  ok = pragma_is_clean (db, "PRAGMA integrity_check;", TRUE, path, error)
       && pragma_is_clean (db, "PRAGMA foreign_key_check;", FALSE, path, error);
  sqlite3_close (db);
  if (!ok)
    return FALSE;
  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, error);
  return library != NULL && read_everything (library, error);
}

static void
add_double (GString *s,
            double   v)
{
  if (isnan (v))
    g_string_append (s, "nan;");
  else
    g_string_append_printf (s, "%.17g;", v);
}

char *
lamina_hardening_dup_state (LaminaLibrary  *library,
                            GError        **error)
{
  g_autoptr(GString) s = g_string_new (NULL);
  g_autoptr(GPtrArray) materials = lamina_library_list_materials (library, error);
  g_autoptr(GPtrArray) rows = NULL;
  LaminaLibraryQuery q;

  if (materials == NULL)
    return NULL;
  for (guint i = 0; i < materials->len; i++)
    {
      LaminaMaterial *m = materials->pdata[i];

      g_string_append_printf (s, "M %s|%s|", m->id, m->name);
      add_double (s, m->conductivity);
      add_double (s, m->density);
      add_double (s, m->vapour_resistance_factor);
      g_string_append_c (s, '\n');
    }
  lamina_library_query_init (&q);
  rows = lamina_library_search (library, &q, error);
  if (rows == NULL)
    return NULL;
  for (guint i = 0; i < rows->len; i++)
    {
      LaminaSummary *s_row = rows->pdata[i];
      g_autoptr(GPtrArray) history = lamina_library_dup_history (library, s_row->id, error);

      if (history == NULL)
        return NULL;
      for (guint h = 0; h < history->len; h++)
        {
          LaminaRevisionInfo *r = history->pdata[h];
          g_autoptr(LaminaConstruction) c =
            lamina_library_dup_construction (library, s_row->id, r->revision, error);
          g_autoptr(LaminaCatalogue) one = lamina_catalogue_new ();
          g_autofree char *xml = NULL;
          gsize len = 0;

          if (c == NULL)
            return NULL;
          /* Clock times differ between two runs of the same edit; who did
           * what, and the approval date, do not. */
          g_clear_pointer (&c->modified_at, g_free);
          g_clear_pointer (&c->checked_at, g_free);
          g_ptr_array_add (one->constructions, g_steal_pointer (&c));
          xml = lamina_catalogue_write_to_string (one, LAMINA_WRITE_DEFAULT, &len, error);
          if (xml == NULL)
            return NULL;
          g_string_append_printf (s, "C %s r%d %s %s|%s|%s|%s\n%s\n", s_row->id,
                                  r->revision, lamina_status_to_string (r->status),
                                  r->modified_by,
                                  r->checked_by ? r->checked_by : "-",
                                  r->approved_by ? r->approved_by : "-",
                                  r->approved_at ? r->approved_at : "-", xml);
        }
    }
  return g_compute_checksum_for_string (G_CHECKSUM_SHA256, s->str, (gssize) s->len);
}

char *
lamina_hardening_dup_file_state (const char  *path,
                                 GError     **error)
{
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING,
                                                          error);

  return library ? lamina_hardening_dup_state (library, error) : NULL;
}

LaminaConstruction *
lamina_hardening_make_wall (LaminaLibrary *library,
                            guint          n)
{
  g_autofree char *name = g_strdup_printf ("Test wall %u", n);
  g_autofree char *code = g_strdup_printf ("HW-%04u", n);

  return test_make_wall (library, code, name, "hardening", 100 + (n % 200));
}

void
lamina_hardening_copy_library (const char *from,
                               const char *to)
{
  g_autofree char *data = NULL;
  g_autofree char *wal = g_strconcat (to, "-wal", NULL);
  g_autofree char *shm = g_strconcat (to, "-shm", NULL);
  gsize len = 0;

  g_unlink (wal);
  g_unlink (shm);
  if (!g_file_get_contents (from, &data, &len, NULL)
      || !g_file_set_contents (to, data, (gssize) len, NULL))
    g_error ("cannot copy %s to %s", from, to);
}

LaminaLibrary *
lamina_hardening_open_library (const char  *name,
                               char       **path)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *file = NULL;
  LaminaLibrary *library;

  g_mkdir_with_parents (g_get_user_data_dir (), 0700);
  file = g_build_filename (g_get_user_data_dir (), name, NULL);
  library = lamina_library_open (file, 0, &error);
  g_assert_no_error (error);
  if (path != NULL)
    *path = g_steal_pointer (&file);
  return library;
}
