/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Every boundary validates (issue 7): tables of bad input per boundary.
 * - typed numbers (lamina_number_parse, for the window's entries):
 *   the message names the field and the allowed range;
 * - lamina-cli arguments: exit 2 (usage) or 1 (bad input) and a message
 *   on stderr naming the option (or the file) and what is allowed;
 * - catalogue XML values beyond the exchange module's own table
 *   (tests/exchange/test-catalogue-bad.c): refused with "NAME:LINE:".
 * The ranges are the model's (lamina-validate.c): thickness above 0 to
 * 10000 mm, λ above 0 to 1000 W/(m·K), temperatures −60 to 60 °C
 * (common practice design bounds, not from a standard). */
#define G_LOG_DOMAIN "lamina-test"

#include <glib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/wait.h>

#include "lamina-catalogue.h"
#include "lamina-hardening-util.h"
#include "lamina-number.h"

static guint n_number, n_cli, n_xml;

/* ---- typed numbers ----------------------------------------------------- */

typedef struct
{
  LaminaNumberField  field;
  const char        *text;
} BadNumber;

static const BadNumber bad_numbers[] = {
  { LAMINA_FIELD_THICKNESS, "" }, { LAMINA_FIELD_THICKNESS, "   " },
  { LAMINA_FIELD_THICKNESS, "0" }, { LAMINA_FIELD_THICKNESS, "-5" },
  { LAMINA_FIELD_THICKNESS, "−5" }, { LAMINA_FIELD_THICKNESS, "10001" },
  { LAMINA_FIELD_THICKNESS, "12 cm" }, { LAMINA_FIELD_THICKNESS, "12mmm" },
  { LAMINA_FIELD_THICKNESS, "1.2.3" }, { LAMINA_FIELD_THICKNESS, "1,200.5" },
  { LAMINA_FIELD_THICKNESS, "0x10" }, { LAMINA_FIELD_THICKNESS, "inf" },
  { LAMINA_FIELD_THICKNESS, "nan" }, { LAMINA_FIELD_THICKNESS, "1e999" },
  { LAMINA_FIELD_THICKNESS, "abc" }, { LAMINA_FIELD_THICKNESS, "12 34" },
  { LAMINA_FIELD_THICKNESS, "\xff\xfe" }, { LAMINA_FIELD_THICKNESS, "." },
  { LAMINA_FIELD_THICKNESS, "-" }, { LAMINA_FIELD_THICKNESS, "1e" },
  { LAMINA_FIELD_THICKNESS, "100000000000000000000000000000000000000000000000000000000000000000000" },
  { LAMINA_FIELD_CONDUCTIVITY, "0" }, { LAMINA_FIELD_CONDUCTIVITY, "-0.035" },
  { LAMINA_FIELD_CONDUCTIVITY, "1001" }, { LAMINA_FIELD_CONDUCTIVITY, "0,035 W/m2K" },
  { LAMINA_FIELD_CONDUCTIVITY, "λ" }, { LAMINA_FIELD_CONDUCTIVITY, "0.035 mm" },
  { LAMINA_FIELD_FRACTION, "0" }, { LAMINA_FIELD_FRACTION, "1.01" },
  { LAMINA_FIELD_FRACTION, "12 %" }, { LAMINA_FIELD_FRACTION, "-0.1" },
  { LAMINA_FIELD_PERCENTAGE, "0 %" }, { LAMINA_FIELD_PERCENTAGE, "101" },
  { LAMINA_FIELD_PERCENTAGE, "15 mm" }, { LAMINA_FIELD_PERCENTAGE, "%" },
  { LAMINA_FIELD_INSIDE_TEMPERATURE, "61" }, { LAMINA_FIELD_INSIDE_TEMPERATURE, "-61" },
  { LAMINA_FIELD_INSIDE_TEMPERATURE, "20 K" }, { LAMINA_FIELD_INSIDE_TEMPERATURE, "room" },
  { LAMINA_FIELD_OUTSIDE_TEMPERATURE, "−70" }, { LAMINA_FIELD_OUTSIDE_TEMPERATURE, "100 °C" },
  { LAMINA_FIELD_OUTSIDE_TEMPERATURE, "-10 °F" },
  { LAMINA_FIELD_TARGET_U, "0" }, { LAMINA_FIELD_TARGET_U, "11" },
  { LAMINA_FIELD_U_FILTER, "-0.1" }, { LAMINA_FIELD_THERMAL_RESISTANCE, "-1" },
  { LAMINA_FIELD_THERMAL_RESISTANCE, "101" }, { LAMINA_FIELD_EMISSIVITY, "0" },
  { LAMINA_FIELD_EMISSIVITY, "1.1" }, { LAMINA_FIELD_DENSITY, "0" },
  { LAMINA_FIELD_DENSITY, "30000" }, { LAMINA_FIELD_SPECIFIC_HEAT, "-1" },
  { LAMINA_FIELD_VAPOUR_RESISTANCE, "0.5" }, { LAMINA_FIELD_SPACING, "0" },
  { LAMINA_FIELD_WIDTH, "-45" },
};

static void
test_numbers_bad (void)
{
  for (guint i = 0; i < G_N_ELEMENTS (bad_numbers); i++)
    {
      const BadNumber *b = &bad_numbers[i];
      const LaminaNumberRange *r = lamina_number_field_get_range (b->field);
      g_autofree char *range = lamina_number_dup_range_text (b->field);
      g_autoptr(GError) error = NULL;
      double value = 42;

      if (lamina_number_parse (b->field, b->text, &value, &error))
        g_error ("%s: “%s” was accepted as %g", r->name, b->text, value);
      g_assert_error (error, LAMINA_CALC_ERROR, LAMINA_CALC_ERROR_INVALID);
      g_assert_true (g_str_has_prefix (error->message, r->name));
      g_assert_nonnull (strstr (error->message, range));
      g_assert_cmpfloat (value, ==, 42);
      n_number++;
    }
}

typedef struct
{
  LaminaNumberField  field;
  const char        *text;
  double             value;
} GoodNumber;

/* What people type from data sheets (EN ISO 10456 Table 3 style values). */
static const GoodNumber good_numbers[] = {
  { LAMINA_FIELD_THICKNESS, "12.5", 12.5 }, { LAMINA_FIELD_THICKNESS, " 12,5 mm ", 12.5 },
  { LAMINA_FIELD_THICKNESS, "10000", 10000 }, { LAMINA_FIELD_THICKNESS, ".5", 0.5 },
  { LAMINA_FIELD_CONDUCTIVITY, "0,035 W/(m·K)", 0.035 }, { LAMINA_FIELD_CONDUCTIVITY, "0.13 W/mK", 0.13 },
  { LAMINA_FIELD_CONDUCTIVITY, "3.5e-2", 0.035 },
  { LAMINA_FIELD_FRACTION, "1", 1 }, { LAMINA_FIELD_PERCENTAGE, "15 %", 15 },
  { LAMINA_FIELD_INSIDE_TEMPERATURE, "20 °C", 20 }, { LAMINA_FIELD_OUTSIDE_TEMPERATURE, "−10", -10 },
  { LAMINA_FIELD_OUTSIDE_TEMPERATURE, "-60", -60 }, { LAMINA_FIELD_U_FILTER, "0", 0 },
  { LAMINA_FIELD_THERMAL_RESISTANCE, "0", 0 }, { LAMINA_FIELD_VAPOUR_RESISTANCE, "1", 1 },
};

static void
test_numbers_good (void)
{
  for (guint i = 0; i < G_N_ELEMENTS (good_numbers); i++)
    {
      g_autoptr(GError) error = NULL;
      double value = NAN;

      lamina_number_parse (good_numbers[i].field, good_numbers[i].text, &value, &error);
      g_assert_no_error (error);
      g_assert_cmpfloat_with_epsilon (value, good_numbers[i].value, 1e-12);
    }
}

/* ---- lamina-cli arguments ---------------------------------------------- */

typedef struct
{
  const char *args[8];     /* after "--library LIB"; "@ID" = a construction id */
  int         status;
  const char *needles[3];  /* all must be in stderr */
} BadCli;

static const BadCli bad_cli[] = {
  { { "list", "--max-u", "abc" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "-0.1" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "11" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "nan" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "inf" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "0x1" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--max-u", "0.2.3" }, 2, { "--max-u", "0 to 10" } },
  { { "list", "--element", "roofs" }, 2, { "--element", "wall, roof" } },
  { { "list", "--status", "final" }, 2, { "--status", "draft, checked, approved" } },
  { { "list", "extra" }, 2, { "list" } },
  { { "show", "@ID", "--revision", "0" }, 2, { "--revision", "1 to" } },
  { { "show", "@ID", "--revision", "-1" }, 2, { "--revision", "1 to" } },
  { { "show", "@ID", "--revision", "abc" }, 2, { "--revision", "1 to" } },
  { { "show", "@ID", "--revision", "1.5" }, 2, { "--revision", "1 to" } },
  { { "show", "@ID", "--revision", "99999999999" }, 2, { "--revision", "1 to" } },
  { { "show", "@ID", "--revision", "7" }, 1, { "revision" } },
  { { "show", "no-such-construction" }, 1, { "no-such-construction" } },
  /* A date that is not a date is a usage error (exit 2). */
  { { "approve", "@ID", "--by", "R", "--date", "2024-13-01" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "R", "--date", "2023-02-29" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "R", "--date", "24-01-01" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "R", "--date", "2024-1-1" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "R", "--date", "yesterday" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "R", "--date", "1800-01-01" }, 2, { "--date", "1900-01-01" } },
  { { "approve", "@ID", "--by", "R", "--date", "2024-01-01x" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "R", "--date", "" }, 2, { "--date", "YYYY-MM-DD" } },
  { { "approve", "@ID", "--by", "" }, 1, { "--by", "1 to 200" } },
  { { "approve", "@ID", "--by", "   " }, 1, { "--by", "1 to 200" } },
  { { "approve", "@ID" }, 2, { "--by" } },
  { { "approve", "@ID", "--by", "R", "--revision", "0" }, 2, { "--revision", "1 to" } },
  { { "approve", "@ID", "--by", "R", "--revision", "5" }, 1, { "revision" } },
  { { "check", "@ID", "--by", "R", "--date", "2024-01-01" }, 2, { "--date" } },
  { { "check", "@ID", "--by", "R", "--revision", "x" }, 2, { "--revision", "1 to" } },
  { { "import", "@DIR/missing.xml" }, 1, { "missing.xml" } },
  { { "import", "@DIR/bad.xml" }, 1, { "bad.xml:3" } },
  { { "import" }, 2, { "import" } },
  { { "export", "-o", "@DIR/existing.xml" }, 1, { "existing.xml", "--force" } },
  { { "export", "no-such-construction" }, 1, { "no-such-construction" } },
  { { "history", "no-such-construction" }, 1, { "no-such-construction" } },
  { { "frobnicate" }, 2, { "frobnicate" } },
  { { "list", "--frobnicate" }, 2, { "frobnicate" } },
};

static int
run_cli (const char  *library,
         const char  *dir,
         const char  *id,
         const char  *const *args,
         char       **err)
{
  g_autoptr(GPtrArray) argv = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GError) error = NULL;
  int status = -1;

  g_ptr_array_add (argv, g_build_filename (g_getenv ("LAMINA_BUILD_DIR"), "src", "cli",
                                           "lamina-cli", NULL));
  g_ptr_array_add (argv, g_strdup ("--library"));
  g_ptr_array_add (argv, g_strdup (library));
  for (guint i = 0; i < 8 && args[i] != NULL; i++)
    {
      if (g_str_equal (args[i], "@ID"))
        g_ptr_array_add (argv, g_strdup (id));
      else if (g_str_has_prefix (args[i], "@DIR/"))
        g_ptr_array_add (argv, g_build_filename (dir, args[i] + 5, NULL));
      else
        g_ptr_array_add (argv, g_strdup (args[i]));
    }
  g_ptr_array_add (argv, NULL);
  g_assert_true (g_spawn_sync (NULL, (char **) argv->pdata, NULL, G_SPAWN_STDOUT_TO_DEV_NULL,
                               NULL, NULL, NULL, err, &status, &error));
  g_assert_no_error (error);
  return WIFEXITED (status) ? WEXITSTATUS (status) : -1;
}

static void
test_cli_bad (void)
{
  g_autofree char *dir = g_build_filename (g_get_user_data_dir (), "cli", NULL);
  g_autofree char *library_path = g_build_filename (dir, "library.sqlite", NULL);
  g_autofree char *existing = g_build_filename (dir, "existing.xml", NULL);
  g_autofree char *bad = g_build_filename (dir, "bad.xml", NULL);
  g_autofree char *id = NULL;
  g_autofree char *before = NULL, *after = NULL;

  g_mkdir_with_parents (dir, 0700);
  {
    g_autoptr(GError) error = NULL;
    g_autoptr(LaminaLibrary) library = lamina_library_open (library_path, 0, &error);
    g_autoptr(LaminaConstruction) c = NULL;

    g_assert_no_error (error);
    c = lamina_hardening_make_wall (library, 1);
    id = lamina_library_create_construction (library, c, "Author", &error);
    g_assert_no_error (error);
    before = lamina_hardening_dup_state (library, &error);
  }
  g_assert_true (g_file_set_contents (existing, "keep me", -1, NULL));
  g_assert_true (g_file_set_contents (bad,
    "<?xml version=\"1.0\"?>\n<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n"
    "  <material id=\"m\" name=\"M\" conductivity=\"-1\"/>\n</catalogue>\n", -1, NULL));

  for (guint i = 0; i < G_N_ELEMENTS (bad_cli); i++)
    {
      const BadCli *b = &bad_cli[i];
      g_autofree char *err = NULL;
      g_autofree char *joined = g_strjoinv (" ", (char **) b->args);
      int status = run_cli (library_path, dir, id, b->args, &err);

      if (status != b->status)
        g_error ("lamina-cli %s: exit %d, expected %d; stderr: %s", joined, status, b->status, err);
      for (guint n = 0; n < 3 && b->needles[n] != NULL; n++)
        if (strstr (err, b->needles[n]) == NULL)
          g_error ("lamina-cli %s: stderr lacks “%s”: %s", joined, b->needles[n], err);
      n_cli++;
    }
  /* No bad argument changed the library or the file not to overwrite. */
  after = lamina_hardening_dup_file_state (library_path, NULL);
  g_assert_cmpstr (before, ==, after);
  {
    g_autofree char *kept = NULL;

    g_assert_true (g_file_get_contents (existing, &kept, NULL, NULL));
    g_assert_cmpstr (kept, ==, "keep me");
  }
}

/* ---- XML values beyond the exchange module's table --------------------- */

#define XML_HEAD \
  "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" \
  "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n" \
  "  <material id=\"gyp\" name=\"Gypsum board\" conductivity=\"0.25\"/>\n" \
  "  <material id=\"mw\" name=\"Mineral wool\" conductivity=\"0.035\"/>\n" \
  "  <material id=\"wood\" name=\"Softwood\" conductivity=\"0.13\"/>\n"

typedef struct
{
  const char *text;     /* from line 6 on */
  const char *needle;   /* besides "bad.xml:" */
} BadXml;

static const BadXml bad_xml[] = {
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"0x10\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "thickness" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"1e400\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "thickness" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"10001\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "thickness" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\" 12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "thickness" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"12,5\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "thickness" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" inside-temperature=\"99\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "temperature" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" outside-temperature=\"-61\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "temperature" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" target-u=\"0\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "target" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" target-u=\"11\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "target" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" revision=\"-2\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "revision" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" revision=\"99999999999\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n  </construction>\n</catalogue>\n", "revision" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"100\">\n      <part material=\"mw\"/>\n      <part material=\"wood\" width=\"45\" spacing=\"0\" member=\"stud\"/>\n    </layer>\n  </construction>\n</catalogue>\n", "spacing" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"100\">\n      <part material=\"mw\" fraction=\"50%\"/>\n      <part material=\"wood\" fraction=\"0.5\"/>\n    </layer>\n  </construction>\n</catalogue>\n", "fraction" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\">\n    <layer thickness=\"25\" air=\"unventilated\" emissivity-inner=\"1.5\"/>\n  </construction>\n</catalogue>\n", "emissivity" },
  { "  <material id=\"x\" name=\"X\" conductivity=\"0.1\" vapour-resistance-factor=\"-3\"/>\n</catalogue>\n", "vapour" },
  { "  <material id=\"x\" name=\"X\" conductivity=\"1001\"/>\n</catalogue>\n", "conductivity" },
  { "  <construction id=\"w\" name=\"W\" element=\"wall\" status=\"approved\">\n    <layer thickness=\"12\" material=\"gyp\"/>\n    <approved by=\"R\" at=\"2024-13-45\"/>\n  </construction>\n</catalogue>\n", "" },
};

static void
test_xml_bad (void)
{
  for (guint i = 0; i < G_N_ELEMENTS (bad_xml); i++)
    {
      g_autofree char *doc = g_strconcat (XML_HEAD, bad_xml[i].text, NULL);
      g_autoptr(GError) error = NULL;
      g_autoptr(LaminaCatalogue) cat = lamina_catalogue_read_memory (doc, strlen (doc), "bad.xml",
                                                                     &error);

      if (cat != NULL)
        g_error ("case %u accepted:\n%s", i, bad_xml[i].text);
      g_assert_true (g_str_has_prefix (error->message, "bad.xml:"));
      if (strstr (error->message, bad_xml[i].needle) == NULL)
        g_error ("case %u: message lacks “%s”: %s", i, bad_xml[i].needle, error->message);
      n_xml++;
    }
}

int
main (int    argc,
      char **argv)
{
  int rc;

  g_test_init (&argc, &argv, G_TEST_OPTION_ISOLATE_DIRS, NULL);
  g_test_add_func ("/hardening/boundaries/numbers-bad", test_numbers_bad);
  g_test_add_func ("/hardening/boundaries/numbers-good", test_numbers_good);
  g_test_add_func ("/hardening/boundaries/cli-bad", test_cli_bad);
  g_test_add_func ("/hardening/boundaries/xml-bad", test_xml_bad);
  rc = g_test_run ();
  g_print ("# figures: bad inputs tried: %u typed numbers, %u CLI arguments, %u XML values "
           "(plus the exchange module's own table)\n", n_number, n_cli, n_xml);
  return rc;
}
