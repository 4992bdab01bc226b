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
  return g_test_run ();
}
