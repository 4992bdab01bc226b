/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Look-alike identities, through the API and lamina-cli.
 * - Ids and office codes are kept in Unicode normalisation form C
 *   (Unicode Standard Annex #15: "É" typed as E + U+0301 is stored as
 *   U+00C9), and control or format characters (general categories Cc and
 *   Cf, and the separators Zl/Zp: bidi overrides, zero-width characters,
 *   newlines, escape codes) are refused with their position.
 * - Office codes are unique within a library (common practice: a code is
 *   how drawings and specifications name a build-up); an import that
 *   would add a second "EW-101" reports a conflict. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <string.h>
#include <sys/wait.h>

#include "lamina-hardening-util.h"
#include "lamina-library-safety.h"

#include <sqlite3.h>

static char *
add (LaminaLibrary *library,
     guint          n,
     const char    *id,
     const char    *code,
     GError       **error)
{
  g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, n);

  g_free (c->id);
  c->id = g_strdup (id);
  g_free (c->code);
  c->code = g_strdup (code);
  return lamina_library_create_construction (library, c, "A. Author", error);
}

static void
test_api (void)
{
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("identity.sqlite", NULL);
  g_autoptr(GError) error = NULL;
  g_autofree char *first = NULL, *accented = NULL;
  g_autoptr(LaminaConstruction) c = NULL;

  /* U+202E RIGHT-TO-LEFT OVERRIDE at character 4 of the code. */
  g_assert_null (add (library, 1, NULL, "EW-\xe2\x80\xae" "101", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "code: character 4 is U+202E"));
  g_clear_error (&error);
  /* U+200B ZERO WIDTH SPACE in an id; a newline in a code. */
  g_assert_null (add (library, 1, "wall\xe2\x80\x8b" "1", "EW-101", &error));
  g_assert_nonnull (strstr (error->message, "id: character 5 is U+200B"));
  g_clear_error (&error);
  g_assert_null (add (library, 1, NULL, "EW-\n101", &error));
  g_assert_nonnull (strstr (error->message, "U+000A"));
  g_clear_error (&error);

  first = add (library, 1, NULL, "EW-101", &error);
  g_assert_no_error (error);
  /* The same code, in other letter case, is refused by name. */
  g_assert_null (add (library, 2, NULL, "ew-101", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS);
  g_assert_nonnull (strstr (error->message, "already used by “Test wall 1”"));
  g_clear_error (&error);
  /* Decomposed "É" (E + U+0301) is stored precomposed (U+00C9). */
  accented = add (library, 3, NULL, "E\xcc\x81W-7", &error);
  g_assert_no_error (error);
  c = lamina_library_dup_construction (library, accented, 0, &error);
  g_assert_cmpstr (c->code, ==, "\xc3\x89W-7");
  /* Renaming it to a code in use is refused as well. */
  g_free (c->code);
  c->code = g_strdup ("EW-101");
  g_assert_false (lamina_library_save_construction (library, c, c->revision, "A. Author", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_EXISTS);
  g_clear_error (&error);

  /* An import: a second EW-101 is a reported conflict, nothing stored. */
  {
    g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
    g_autoptr(LaminaImportReport) report = NULL;
    LaminaConstruction *other = lamina_hardening_make_wall (library, 4);
    LaminaConstruction *twice = lamina_hardening_make_wall (library, 5);
    LaminaConstruction *again = lamina_hardening_make_wall (library, 6);

    other->id = (g_free (other->id), g_strdup ("from-elsewhere"));
    other->code = (g_free (other->code), g_strdup ("EW-101"));
    twice->id = (g_free (twice->id), g_strdup ("new-a"));
    twice->code = (g_free (twice->code), g_strdup ("RF-9"));
    again->id = (g_free (again->id), g_strdup ("new-b"));
    again->code = (g_free (again->code), g_strdup ("rf-9"));
    g_ptr_array_add (cat->constructions, other);
    g_ptr_array_add (cat->constructions, twice);
    g_ptr_array_add (cat->constructions, again);
    report = lamina_library_import (library, cat, LAMINA_IMPORT_DEFAULT, "I. Importer", &error);
    g_assert_no_error (error);
    g_assert_cmpuint (report->n_conflicts, ==, 2);
    g_assert_cmpuint (report->n_added, ==, 1);
    g_assert_null (lamina_library_dup_construction (library, "from-elsewhere", 0, NULL));
    g_assert_null (lamina_library_dup_construction (library, "new-b", 0, NULL));
  }
}

/* Material ids as constructions' ids: Unicode Standard Annex #15
 * (Unicode Normalization Forms), canonical composition: "Å" typed as
 * A + U+030A COMBINING RING ABOVE is the same text as U+00C5 in NFC, so a
 * library keeps one form (from memory: U+00C5 decomposes canonically to
 * U+0041 U+030A and is not excluded from composition). */
#define DECOMPOSED  "A\xcc\x8a-board"   /* A, U+030A, "-board" */
#define PRECOMPOSED "\xc3\x85-board"    /* U+00C5, "-board" */

static void
test_material_ids (void)
{
  g_autofree char *path = NULL;
  g_autoptr(GError) error = NULL;

  {
    g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("materials.sqlite", &path);
    g_autoptr(LaminaMaterial) board = lamina_material_new (DECOMPOSED, "Ring board",
                                                           LAMINA_CATEGORY_INSULATION, 0.035);
    g_autoptr(LaminaMaterial) hidden = lamina_material_new ("board\xe2\x80\x8b" "2", "Hidden board",
                                                            LAMINA_CATEGORY_INSULATION, 0.035);
    g_autoptr(LaminaMaterial) found = NULL;

    /* Put: stored precomposed, found by the precomposed id. */
    g_assert_true (lamina_library_put_material (library, board, &error));
    g_assert_no_error (error);
    g_assert_cmpstr (board->id, ==, PRECOMPOSED);
    found = lamina_library_dup_material (library, PRECOMPOSED, &error);
    g_assert_no_error (error);
    g_assert_cmpstr (found->name, ==, "Ring board");
    /* U+200B ZERO WIDTH SPACE at character 6: refused, located. */
    g_assert_false (lamina_library_put_material (library, hidden, &error));
    g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
    g_assert_nonnull (strstr (error->message, "material “Hidden board”, id: character 6 is U+200B"));
    g_clear_error (&error);
  }
  {
    /* An import whose material id holds a decomposed "Ö" (O + U+0308
     * COMBINING DIAERESIS) stores it as U+00D6 (UAX #15, canonical
     * composition; from memory), and the layer naming it follows. */
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, 0, &error);
    g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
    g_autoptr(LaminaImportReport) report = NULL;
    g_autoptr(LaminaConstruction) stored = NULL;
    g_autoptr(LaminaMaterial) found = NULL;
    LaminaConstruction *wall = lamina_hardening_make_wall (library, 21);
    LaminaLayer *first = wall->layers->pdata[0];

    g_assert_no_error (error);
    g_ptr_array_add (cat->materials, lamina_material_new ("O\xcc\x88-slab", "Umlaut slab",
                                                          LAMINA_CATEGORY_INSULATION, 0.036));
    g_free (first->material->id);
    first->material->id = g_strdup ("O\xcc\x88-slab");
    wall->id = (g_free (wall->id), g_strdup ("umlaut-wall"));
    g_ptr_array_add (cat->constructions, wall);
    report = lamina_library_import (library, cat, LAMINA_IMPORT_DEFAULT, "I. Importer", &error);
    g_assert_no_error (error);
    found = lamina_library_dup_material (library, "\xc3\x96-slab", &error);
    g_assert_no_error (error);
    g_assert_cmpstr (found->name, ==, "Umlaut slab");
    stored = lamina_library_dup_construction (library, "umlaut-wall", 0, &error);
    g_assert_no_error (error);
    g_assert_cmpstr (((LaminaLayer *) stored->layers->pdata[0])->material->id, ==,
                     "\xc3\x96-slab");
  }
  {
    /* A library written before ids were cleaned, holding a decomposed
     * material id: it opens, the material is listed and read as stored,
     * and verify names it instead of refusing the library. */
    sqlite3 *db = NULL;
    g_autoptr(LaminaLibrary) library = NULL;
    g_autoptr(LaminaMaterial) found = NULL;
    g_autoptr(LaminaVerifyReport) report = NULL;
    gboolean named = FALSE;

    g_assert_cmpint (sqlite3_open (path, &db), ==, SQLITE_OK);
    g_assert_cmpint (sqlite3_exec (db, "UPDATE material SET id = 'A' || char(778) || '-board'"
                                       " WHERE name = 'Ring board';", NULL, NULL, NULL), ==, SQLITE_OK);
    g_assert_cmpint (sqlite3_changes (db), ==, 1);
    sqlite3_close (db);

    library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
    g_assert_no_error (error);
    found = lamina_library_dup_material (library, DECOMPOSED, &error);
    g_assert_no_error (error);
    g_assert_cmpstr (found->name, ==, "Ring board");
    report = lamina_library_verify (library, &error);
    g_assert_no_error (error);
    for (guint i = 0; i < report->problems->len; i++)
      if (strstr (report->problems->pdata[i], "material “" DECOMPOSED "”") != NULL
          && strstr (report->problems->pdata[i], "normalization form C (NFC)") != NULL)
        named = TRUE;
    g_assert_true (named);
    g_assert_cmpuint (report->problems->len, ==, 1);
  }
}

static void
test_cli (void)
{
  g_autofree char *path = NULL, *out = NULL, *err = NULL;
  g_autofree char *xml = g_build_filename (g_get_user_data_dir (), "lookalike.xml", NULL);
  g_autofree char *cli = g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL);
  g_autoptr(GError) error = NULL;
  int status = -1;

  {
    g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("cli.sqlite", &path);
    g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
    LaminaConstruction *c = lamina_hardening_make_wall (library, 8);

    g_autofree char *text = NULL;
    g_auto(GStrv) parts = NULL;
    g_autofree char *joined = NULL;

    /* The writer keeps its output clean; the look-alike is put in by hand,
     * as a hostile or careless document would carry it. */
    c->id = (g_free (c->id), g_strdup ("lookalike-wall"));
    c->code = (g_free (c->code), g_strdup ("EW-LOOKALIKE101"));
    g_ptr_array_add (cat->constructions, c);
    g_assert_true (lamina_catalogue_write_file (cat, xml, 0, &error));
    g_assert_true (g_file_get_contents (xml, &text, NULL, NULL));
    parts = g_strsplit (text, "LOOKALIKE", -1);
    joined = g_strjoinv ("\xe2\x80\xae", parts);
    g_assert_true (g_file_set_contents (xml, joined, -1, NULL));
  }
  {
    const char *argv[] = { cli, "--library", path, "import", xml, NULL };

    g_assert_true (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                                 &out, &err, &status, NULL));
  }
  g_assert_true (WIFEXITED (status));
  g_assert_cmpint (WEXITSTATUS (status), ==, 1);
  /* Located: the construction, its line in the document, the character. */
  g_assert_nonnull (strstr (err, "construction 1 (line "));
  g_assert_nonnull (strstr (err, "code: character 4 is U+202E"));
  g_assert_nonnull (strstr (err, "nothing was imported"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/identity/api", test_api);
  g_test_add_func ("/hardening/identity/cli", test_cli);
  g_test_add_func ("/hardening/identity/material-ids", test_material_ids);
  return g_test_run ();
}
