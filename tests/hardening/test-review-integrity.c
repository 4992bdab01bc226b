/* SPDX-License-Identifier: GPL-3.0-or-later */
/* What an approval means, through the API and lamina-cli.
 * - Four eyes (the default, stored in the library): whoever checks or
 *   approves a revision is not its author; the single-reviewer policy
 *   relaxes that and the approval record names the policy.
 * - Only a checked revision is approved; --revision N refuses when the
 *   latest moved on; an approval dated before the revision is refused.
 * - Every act is a record: a second check adds one, history shows all.
 * - A result outside the method's scope (EN ISO 6946:2017 clause 1 and
 *   6.7.2.1: insulation bridged by metal, R'T/R''T > 1.5) needs a stored
 *   2-D check or a written reason, which is kept.
 * - An approval can be withdrawn with a reason. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/wait.h>

#include "lamina-hardening-util.h"

static char *
add_wall (LaminaLibrary *library,
          guint          n,
          const char    *author)
{
  g_autoptr(LaminaConstruction) c = lamina_hardening_make_wall (library, n);
  g_autoptr(GError) error = NULL;
  char *id = lamina_library_create_construction (library, c, author, &error);

  g_assert_no_error (error);
  return id;
}

static int
run_cli (const char *library,
         char      **out,
         char      **err,
         ...) G_GNUC_NULL_TERMINATED;

static int
run_cli (const char *library,
         char      **out,
         char      **err,
         ...)
{
  g_autoptr(GPtrArray) argv = g_ptr_array_new_with_free_func (g_free);
  int status = -1;
  va_list ap;

  g_ptr_array_add (argv, g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli", "lamina-cli", NULL));
  g_ptr_array_add (argv, g_strdup ("--library"));
  g_ptr_array_add (argv, g_strdup (library));
  va_start (ap, err);
  for (const char *a = va_arg (ap, const char *); a != NULL; a = va_arg (ap, const char *))
    g_ptr_array_add (argv, g_strdup (a));
  va_end (ap);
  g_ptr_array_add (argv, NULL);
  g_free (*out);
  g_free (*err);
  *out = *err = NULL;
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                               out, err, &status, NULL));
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static void
test_four_eyes_api (void)
{
  g_autofree char *path = NULL;
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("four-eyes.sqlite", &path);
  g_autofree char *id = add_wall (library, 1, "A. Author");
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) events = NULL;
  g_autoptr(LaminaConstruction) c = NULL;

  g_assert_cmpint (lamina_library_get_review_policy (library), ==, LAMINA_REVIEW_FOUR_EYES);
  /* Approving what nobody checked is refused. */
  g_assert_false (lamina_library_approve (library, id, 0, "B. Boss", NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY);
  g_assert_nonnull (strstr (error->message, "not been checked"));
  g_clear_error (&error);
  /* The author cannot check (names compared case-insensitively). */
  g_assert_false (lamina_library_mark_checked (library, id, 0, "a. author ", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY);
  g_assert_nonnull (strstr (error->message, "four eyes"));
  g_clear_error (&error);
  /* Look-alike names: a bidi override or a zero-width space is refused
   * with its position (Unicode general categories Cc and Cf); a name in
   * decomposed form is kept as NFC (Unicode Standard Annex #15). */
  g_assert_false (lamina_library_mark_checked (library, id, 0, "C. Che\xe2\x80\xaeker", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "character 7 is U+202E"));
  g_clear_error (&error);
  g_assert_false (lamina_library_mark_checked (library, id, 0, "A.\xe2\x80\x8b Author", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_true (lamina_library_mark_checked (library, id, 0, "C. Checker", &error));
  /* A second check by another person adds a record, the first stays. */
  g_assert_true (lamina_library_mark_checked (library, id, 0, "D. Second", &error));
  /* Nor can the author approve. */
  g_assert_false (lamina_library_approve (library, id, 0, "A. Author", NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_POLICY);
  g_clear_error (&error);
  /* A stale revision number is refused. */
  g_assert_false (lamina_library_approve (library, id, 2, "B. Boss", NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_STALE);
  g_clear_error (&error);
  g_assert_true (lamina_library_approve (library, id, 1, "B. Boss", "2099-01-02", &error));

  c = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpstr (c->checked_by, ==, "C. Checker");
  g_assert_cmpstr (c->approved_by, ==, "B. Boss");
  events = lamina_library_dup_review_events (library, id, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (events->len, ==, 3);
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[0])->by, ==, "C. Checker");
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[1])->by, ==, "D. Second");
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[2])->act, ==, "approved");
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[2])->policy, ==, "four-eyes");
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[2])->date, ==, "2099-01-02");

  /* Withdrawing needs a reason; then the revision is checked again. */
  g_assert_false (lamina_library_withdraw_approval (library, id, 0, "B. Boss", " ", &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_true (lamina_library_withdraw_approval (library, id, 0, "B. Boss", "wrong insulation product", &error));
  g_clear_pointer (&c, lamina_construction_free);
  c = lamina_library_dup_construction (library, id, 0, &error);
  g_assert_cmpint (c->status, ==, LAMINA_STATUS_CHECKED);
  g_assert_null (c->approved_by);
  g_clear_pointer (&events, g_ptr_array_unref);
  events = lamina_library_dup_review_events (library, id, &error);
  g_assert_cmpuint (events->len, ==, 4);
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[3])->act, ==, "withdrawn");
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[3])->reason, ==, "wrong insulation product");

  /* One-person practice: the policy relaxes the rule and is recorded. */
  /* "Ö" typed as O + combining diaeresis is recorded precomposed. */
  {
    g_autofree char *other = add_wall (library, 4, "A. Author");
    g_autoptr(GPtrArray) recorded = NULL;

    g_assert_true (lamina_library_mark_checked (library, other, 0, "O\xcc\x88. Olsen", &error));
    recorded = lamina_library_dup_review_events (library, other, &error);
    g_assert_cmpstr (((LaminaReviewEvent *) recorded->pdata[0])->by, ==, "\xc3\x96. Olsen");
  }
  g_assert_true (lamina_library_set_review_policy (library, LAMINA_REVIEW_SINGLE, &error));
  g_assert_cmpint (lamina_library_get_review_policy (library), ==, LAMINA_REVIEW_SINGLE);
  g_clear_pointer (&id, g_free);
  id = add_wall (library, 2, "A. Author");
  g_assert_true (lamina_library_mark_checked (library, id, 0, "A. Author", &error));
  g_assert_true (lamina_library_approve (library, id, 0, "A. Author", NULL, &error));
  g_clear_pointer (&events, g_ptr_array_unref);
  events = lamina_library_dup_review_events (library, id, &error);
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[1])->policy, ==, "single");
}

/* Steel studs (λ 50, EN ISO 10456 Table 3) 1 mm wide at 600 mm through
 * 100 mm of mineral wool: insulation bridged by metal, outside the scope
 * of EN ISO 6946:2017 (clause 1). */
static LaminaConstruction *
steel_stud_wall (void)
{
  LaminaConstruction *c = lamina_construction_new ("steel-stud", "Steel stud wall", LAMINA_ELEMENT_WALL);
  LaminaLayer *layer = lamina_layer_new_bridged (100);

  c->code = g_strdup ("SW-1");
  lamina_layer_add_part (layer, lamina_part_new (lamina_material_new ("mw", "Mineral wool",
                                                                      LAMINA_CATEGORY_INSULATION, 0.035), NAN));
  lamina_layer_add_part (layer, lamina_part_new_framing (lamina_material_new ("steel", "Steel",
                                                                              LAMINA_CATEGORY_METAL, 50),
                                                         1, 600, "stud"));
  lamina_construction_add_layer (c, lamina_layer_new_material (12.5, lamina_material_new ("gyp", "Gypsum board",
                                                                                          LAMINA_CATEGORY_BOARD, 0.25)));
  lamina_construction_add_layer (c, layer);
  lamina_construction_add_layer (c, lamina_layer_new_material (12.5, lamina_material_new ("gyp", "Gypsum board",
                                                                                          LAMINA_CATEGORY_BOARD, 0.25)));
  return c;
}

static void
test_method_scope (void)
{
  g_autofree char *path = NULL;
  g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("scope.sqlite", &path);
  g_autoptr(LaminaConstruction) c = steel_stud_wall ();
  g_autoptr(GError) error = NULL;
  g_autofree char *id = lamina_library_create_construction (library, c, "A. Author", &error);
  g_autoptr(GPtrArray) events = NULL;

  g_assert_no_error (error);
  g_assert_true (lamina_library_mark_checked (library, id, 0, "C. Checker", &error));
  g_assert_false (lamina_library_approve (library, id, 0, "B. Boss", NULL, &error));
  g_assert_error (error, LAMINA_LIBRARY_ERROR, LAMINA_LIBRARY_ERROR_SCOPE);
  g_assert_nonnull (strstr (error->message, "EN ISO 10211"));
  g_clear_error (&error);
  g_assert_true (lamina_library_approve_with_reason (library, id, 0, "B. Boss", NULL,
                                                     "manufacturer's 2-D figures, report 17/3", &error));
  events = lamina_library_dup_review_events (library, id, &error);
  g_assert_cmpstr (((LaminaReviewEvent *) events->pdata[1])->reason, ==, "manufacturer's 2-D figures, report 17/3");
  /* The sheet reads both from the construction. */
  {
    g_autoptr(LaminaConstruction) approved = lamina_library_dup_construction (library, id, 0, &error);

    g_assert_cmpstr (approved->approval_policy, ==, "four-eyes");
    g_assert_cmpstr (approved->approval_reason, ==, "manufacturer's 2-D figures, report 17/3");
  }
}

static void
test_cli (void)
{
  g_autofree char *path = NULL;
  g_autofree char *out = NULL, *err = NULL, *id = NULL;

  {
    g_autoptr(LaminaLibrary) library = lamina_hardening_open_library ("cli.sqlite", &path);

    id = add_wall (library, 3, "A. Author");
  }
  g_assert_cmpint (run_cli (path, &out, &err, "policy", NULL), ==, 0);
  /* The policy's name once, then what it means (no second label). */
  g_assert_cmpstr (out, ==, "four-eyes: checked and approved by others than the author\n");
  g_assert_cmpint (run_cli (path, &out, &err, "approve", id, "--by", "B. Boss", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "not been checked"));
  g_assert_cmpint (run_cli (path, &out, &err, "check", id, "--by", "A. Author", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "four eyes"));
  g_assert_cmpint (run_cli (path, &out, &err, "check", id, "--by", "C. Checker", "--revision", "1", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "check", id, "--by", "D. Second", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "approve", id, "--by", "B. Boss", "--revision", "2", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "not the latest"));
  g_assert_cmpint (run_cli (path, &out, &err, "approve", id, "--by", "B. Boss", "--revision", "1", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "history", id, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "C. Checker"));
  g_assert_nonnull (strstr (out, "D. Second"));
  g_assert_nonnull (strstr (out, "four-eyes"));
  /* A draft follows the approved revision: revision 1 stays printable,
   * and the approved-only catalogue prints it. */
  {
    g_autoptr(GError) error = NULL;
    g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error);
    g_autoptr(LaminaConstruction) c = lamina_library_dup_construction (library, id, 0, &error);

    ((LaminaLayer *) c->layers->pdata[0])->thickness += 5;
    g_assert_true (lamina_library_save_construction (library, c, c->revision, "A. Author", &error));
    g_assert_cmpint (c->revision, ==, 2);
  }
  {
    g_autofree char *pdf = g_build_filename (g_get_user_data_dir (), "rev1.pdf", NULL);
    g_autofree char *cat = g_build_filename (g_get_user_data_dir (), "approved.pdf", NULL);

    g_assert_cmpint (run_cli (path, &out, &err, "sheet", id, "--revision", "1", "-o", pdf, NULL), ==, 0);
    g_assert_nonnull (strstr (out, "revision 1 (approved)"));
    g_assert_cmpint (run_cli (path, &out, &err, "catalogue", "--status", "approved", "-o", cat, NULL), ==, 0);
    g_assert_nonnull (strstr (out, "Catalogue of 1 sheet"));
  }
  g_assert_cmpint (run_cli (path, &out, &err, "withdraw", id, "--by", "B. Boss", "--revision", "1",
                            "--reason", "x", NULL), ==, 1);
  g_assert_nonnull (strstr (err, "not the latest"));
  g_assert_cmpint (run_cli (path, &out, &err, "check", id, "--by", "C. Checker", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "approve", id, "--by", "B. Boss", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "withdraw", id, "--by", "B. Boss", NULL), ==, 2);
  g_assert_cmpint (run_cli (path, &out, &err, "withdraw", id, "--by", "B. Boss", "--reason", "site change", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "history", id, NULL), ==, 0);
  g_assert_nonnull (strstr (out, "site change"));
  g_assert_cmpint (run_cli (path, &out, &err, "policy", "--set", "single", NULL), ==, 0);
  g_assert_cmpint (run_cli (path, &out, &err, "policy", NULL), ==, 0);
  g_assert_cmpstr (out, ==, "single: the author may check and approve (a one-person practice)\n");
  g_assert_cmpint (run_cli (path, &out, &err, "policy", "--set", "lax", NULL), ==, 2);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/review/four-eyes", test_four_eyes_api);
  g_test_add_func ("/hardening/review/method-scope", test_method_scope);
  g_test_add_func ("/hardening/review/cli", test_cli);
  return g_test_run ();
}
