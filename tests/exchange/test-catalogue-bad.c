/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Bad catalogue documents: each is refused as a whole, with the error
 * naming the document and the line ("NAME:LINE: message").
 *
 * The rules checked come from the catalogue format (issue 2 of the
 * project: vocabulary, units, untrusted input) and EN ISO 6946:2017
 * (6.7.2: bridged layers and their area fractions; 6.9: air layers up to
 * 300 mm).  The attack documents are the classic ones: the "billion
 * laughs" entity expansion and an external entity naming a local file
 * (common practice in XML security testing). */
#include <glib.h>
#include <glib/gstdio.h>
#include <stdio.h>
#include <string.h>

#include "lamina-catalogue.h"

/* Lines 1–6 of every case.  libxml2 numbers an element by the line where
 * its start tag ends, so each case keeps its tags on one line. */
#define HEAD                                                                           \
  "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"                                          \
  "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n"                          \
  "  <material id=\"gyp\" name=\"Gypsum board\" conductivity=\"0.25\"/>\n"                \
  "  <material id=\"mw\" name=\"Mineral wool\" conductivity=\"0.035\" category=\"insulation\"/>\n" \
  "  <material id=\"wood\" name=\"Softwood\" conductivity=\"0.13\" category=\"timber\"/>\n" \
  "  <material id=\"steel\" name=\"Steel\" conductivity=\"50\" category=\"metal\"/>\n"
/* Line 7 when it follows HEAD. */
#define OPEN  "  <construction id=\"w\" name=\"Wall\" element=\"wall\">\n"
#define CLOSE "  </construction>\n</catalogue>\n"
#define GOOD  "    <layer thickness=\"12.5\" material=\"gyp\"/>\n"
#define STUDS(d, w) \
  "    <layer thickness=\"" d "\">\n" \
  "      <part material=\"mw\"/>\n" \
  "      <part material=\"wood\" width=\"" w "\" spacing=\"600\" member=\"stud\"/>\n" \
  "    </layer>\n"

/* A climate on lines 7–20 (EN ISO 13788: twelve monthly means), then a
 * construction opening on line 21. */
#define MONTH(n) "    <month number=\"" #n "\" temperature=\"0\" humidity=\"0.8\"/>\n"
#define MONTHS_2_12 MONTH (2) MONTH (3) MONTH (4) MONTH (5) MONTH (6) MONTH (7) MONTH (8) \
                    MONTH (9) MONTH (10) MONTH (11) MONTH (12)
#define CLIMATE_OPEN "  <climate id=\"site\" name=\"Site\" source=\"invented\">\n"
#define CLIMATE CLIMATE_OPEN MONTH (1) MONTHS_2_12 "  </climate>\n"
#define OPEN_AFTER_CLIMATE "  <construction id=\"w\" name=\"Wall\" element=\"wall\">\n"

typedef struct
{
  const char *path;
  const char *text;     /* appended to HEAD unless raw */
  gboolean    raw;
  int         code;
  int         line;
  const char *pattern;  /* g_pattern_match_simple on the message after "NAME:LINE: " */
} BadCase;

static const BadCase cases[] = {
  /* Values the model refuses (EN ISO 6946 needs d > 0 and λ > 0). */
  { "/exchange/bad/thickness-zero", OPEN "    <layer thickness=\"0\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*layer 1: thickness 0 is outside*" },
  { "/exchange/bad/thickness-negative", OPEN GOOD "    <layer thickness=\"-5\" material=\"mw\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 9, "*layer 2: thickness -5 is outside*" },
  { "/exchange/bad/conductivity-zero", "  <material id=\"x\" name=\"X\" conductivity=\"0\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "*material “x”: conductivity=0 is outside*" },
  { "/exchange/bad/conductivity-negative", "  <material id=\"x\" name=\"X\" conductivity=\"-0.04\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "*conductivity=-0.04*" },
  { "/exchange/bad/density-negative", "  <material id=\"x\" name=\"X\" conductivity=\"1\" density=\"-1\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "*density=-1*" },
  /* Physical ranges, with the allowed range: the lowest design λ of a
   * building material is about 0.007 W/(m·K) (vacuum insulation panel;
   * EN ISO 10456:2007, Table 3, from memory). */
  { "/exchange/bad/conductivity-tiny", "  <material id=\"x\" name=\"X\" conductivity=\"1e-300\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "material “x”: conductivity=1e-300 is outside the allowed range 0.001 to 1000" },
  { "/exchange/bad/thickness-tiny", OPEN "    <layer thickness=\"1e-300\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "construction “w”: layer 1: thickness 1e-300 is outside the allowed range 0.01 to 10000 mm" },
  /* Lexical form of numbers: the schema refuses NaN, INF, blanks, units. */
  { "/exchange/bad/nan", OPEN "    <layer thickness=\"NaN\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 8, "*thickness*NaN*" },
  { "/exchange/bad/inf", "  <material id=\"x\" name=\"X\" conductivity=\"inf\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_SCHEMA, 7, "*conductivity*inf*" },
  { "/exchange/bad/empty-number", OPEN "    <layer thickness=\"\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 8, "*thickness*" },
  { "/exchange/bad/trailing-junk", OPEN "    <layer thickness=\"12.5mm\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 8, "*thickness*12.5mm*" },
  { "/exchange/bad/comma-decimal", OPEN "    <layer thickness=\"12,5\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 8, "*12,5*" },
  /* Well-formed numbers beyond a double: refused by the reader. */
  { "/exchange/bad/overflow-thickness", OPEN "    <layer thickness=\"1e999\" material=\"gyp\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "thickness=“1e999” is out of range*" },
  { "/exchange/bad/overflow-conductivity", "  <material id=\"x\" name=\"X\" conductivity=\"-1e400\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "conductivity=“-1e400” is out of range*" },
  /* Bridged layers, EN ISO 6946:2017 6.7.2: fractions sum to 1. */
  { "/exchange/bad/fractions-over-one",
    OPEN "    <layer thickness=\"100\">\n"
         "      <part material=\"mw\" fraction=\"0.6\"/>\n"
         "      <part material=\"wood\" fraction=\"0.6\"/>\n"
         "    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*fractions sum to 1.2*" },
  { "/exchange/bad/no-room-for-remainder",
    OPEN "    <layer thickness=\"100\">\n"
         "      <part material=\"mw\"/>\n"
         "      <part material=\"wood\" fraction=\"1\"/>\n"
         "    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*leaving nothing for the remainder*" },
  { "/exchange/bad/fraction-above-one",
    OPEN GOOD "    <layer thickness=\"100\">\n"
              "      <part material=\"mw\"/>\n"
              "      <part material=\"wood\" fraction=\"1.5\"/>\n"
              "    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 11, "*part 2: fraction 1.5*" },
  { "/exchange/bad/two-remainders",
    OPEN "    <layer thickness=\"100\">\n"
         "      <part material=\"mw\"/>\n"
         "      <part material=\"wood\"/>\n"
         "    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*only one part may leave its fraction out*" },
  { "/exchange/bad/width-wider-than-spacing", OPEN STUDS ("100", "700") CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 10, "*part 2: width 700*" },
  /* A member through two layers must line up (6.7.2: the same stud). */
  { "/exchange/bad/member-mismatch", OPEN STUDS ("100", "45") STUDS ("50", "90") CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 14, "*member “stud”*must line up*" },
  /* Found only by the engine: members lining up through three layers
   * cover more than the whole area. */
  { "/exchange/bad/member-pattern",
    OPEN "    <layer thickness=\"50\">\n"
         "      <part material=\"mw\"/>\n"
         "      <part material=\"wood\" fraction=\"0.5\" member=\"stud\"/>\n"
         "    </layer>\n"
         "    <layer thickness=\"50\">\n"
         "      <part material=\"wood\" fraction=\"0.5\" member=\"stud\"/>\n"
         "      <part material=\"wood\" fraction=\"0.5\" member=\"rail\"/>\n"
         "    </layer>\n"
         "    <layer thickness=\"50\">\n"
         "      <part material=\"mw\"/>\n"
         "      <part material=\"wood\" fraction=\"0.5\" member=\"rail\"/>\n"
         "      <part material=\"wood\" fraction=\"0.4\" member=\"post\"/>\n"
         "    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "construction “w”: *more than 1*" },
  /* EN ISO 6946:2017 6.9: air layers up to 300 mm only (engine check). */
  { "/exchange/bad/air-too-thick", OPEN GOOD "    <layer thickness=\"350\" air=\"unventilated\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "construction “w”: *350 mm*" },
  { "/exchange/bad/slightly-ventilated-needs-area", OPEN "    <layer thickness=\"25\" air=\"slightly-ventilated\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*vent area*" },
  /* References and ids. */
  { "/exchange/bad/unknown-material", OPEN GOOD "    <layer thickness=\"100\" material=\"eps\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 9, "unknown material “eps”" },
  { "/exchange/bad/unknown-part-material",
    OPEN "    <layer thickness=\"100\">\n"
         "      <part material=\"mw\"/>\n"
         "      <part material=\"oak\" fraction=\"0.1\"/>\n"
         "    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 10, "unknown material “oak”" },
  { "/exchange/bad/duplicate-material", "  <material id=\"gyp\" name=\"Again\" conductivity=\"0.21\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "material id “gyp” is used twice (first on line 3)" },
  { "/exchange/bad/duplicate-construction", OPEN GOOD "  </construction>\n" OPEN GOOD CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 10, "construction id “w” is used twice (first on line 7)" },
  { "/exchange/bad/snapshot-of-unknown",
    "  <material id=\"mw~2\" snapshot-of=\"pir\" name=\"PIR\" conductivity=\"0.022\"/>\n" "</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "*snapshot-of “pir”*" },
  /* Vocabulary. */
  { "/exchange/bad/unknown-element",
    "  <construction id=\"w\" name=\"Wall\" element=\"door\">\n" GOOD CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 7, "*element*door*" },
  { "/exchange/bad/unknown-heat-flow",
    "  <construction id=\"w\" name=\"Wall\" element=\"wall\" heat-flow=\"sideways\">\n" GOOD CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 7, "*heat-flow*sideways*" },
  { "/exchange/bad/unknown-attribute", OPEN "    <layer thickness=\"10\" material=\"gyp\" colour=\"red\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 8, "*colour*" },
  { "/exchange/bad/air-gap-level", OPEN "    <layer thickness=\"10\" material=\"gyp\">\n      <air-gaps level=\"3\"/>\n    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 9, "*level*" },
  { "/exchange/bad/no-layers", OPEN CLOSE, FALSE, LAMINA_XML_ERROR_SCHEMA, 7, "*layer*" },
  { "/exchange/bad/two-kinds", OPEN "    <layer thickness=\"10\" material=\"gyp\" resistance=\"0.1\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*exactly one of material=*" },
  { "/exchange/bad/no-kind", OPEN "    <layer thickness=\"10\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*exactly one of material=*" },
  { "/exchange/bad/vent-area-on-material", OPEN "    <layer thickness=\"10\" material=\"gyp\" vent-area=\"800\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*air layer*" },
  { "/exchange/bad/part-material-and-air",
    OPEN "    <layer thickness=\"100\">\n      <part material=\"mw\" air=\"unventilated\"/>\n    </layer>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 9, "*either material= or air=*" },
  { "/exchange/bad/design-temperature",
    "  <construction id=\"w\" name=\"Wall\" element=\"wall\" inside-temperature=\"99\">\n" GOOD CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "*inside temperature 99*" },
  { "/exchange/bad/derived-malformed", OPEN GOOD
    "    <derived r-upper=\"1\" r-lower=\"1\" r-total=\"1\" relative-error=\"0\" u=\"abc\" delta-u=\"0\""
    " u-corrected=\"1\" rsi=\"0.13\" rse=\"0.04\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 9, "*'u'*abc*" },
  /* Documents that are not catalogues. */
  { "/exchange/bad/empty", "", TRUE, LAMINA_XML_ERROR_MALFORMED, 1, "the document is empty" },
  { "/exchange/bad/blank", "  \n\n", TRUE, LAMINA_XML_ERROR_MALFORMED, 3, "*" },
  { "/exchange/bad/truncated", HEAD OPEN "    <layer thickness=\"12.5\" mat", TRUE,
    LAMINA_XML_ERROR_MALFORMED, 8, "*" },
  /* libxml2 names the line where the data ends. */
  { "/exchange/bad/unclosed", HEAD OPEN GOOD, TRUE, LAMINA_XML_ERROR_MALFORMED, 9, "Premature end of data*" },
  { "/exchange/bad/not-utf8", HEAD "  <material id=\"x\" name=\"Gips\xff\xfe\" conductivity=\"0.2\"/>\n</catalogue>\n",
    TRUE, LAMINA_XML_ERROR_MALFORMED, 7, "*UTF-8*" },
  { "/exchange/bad/nul-byte", HEAD "  <title>a\x01z</title>\n</catalogue>\n", TRUE,
    LAMINA_XML_ERROR_MALFORMED, 7, "*" },
  { "/exchange/bad/wrong-namespace",
    "<?xml version=\"1.0\"?>\n<catalogue xmlns=\"urn:x-lamina:catalogue:2\" format=\"1\"/>\n", TRUE,
    LAMINA_XML_ERROR_MALFORMED, 2, "not a Lamina catalogue*urn:x-lamina:catalogue:2*" },
  { "/exchange/bad/no-namespace", "<catalogue format=\"1\"/>\n", TRUE,
    LAMINA_XML_ERROR_MALFORMED, 1, "not a Lamina catalogue*" },
  { "/exchange/bad/wrong-root", "<?xml version=\"1.0\"?>\n\n<library xmlns=\"urn:x-lamina:catalogue:1\"/>\n", TRUE,
    LAMINA_XML_ERROR_MALFORMED, 3, "not a Lamina catalogue: the root element is <library>*" },
  { "/exchange/bad/format-2",
    "<?xml version=\"1.0\"?>\n<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"2\"/>\n", TRUE,
    LAMINA_XML_ERROR_MALFORMED, 2, "catalogue format “2” is not supported*" },
  { "/exchange/bad/no-format", "<catalogue xmlns=\"urn:x-lamina:catalogue:1\"/>\n", TRUE,
    LAMINA_XML_ERROR_SCHEMA, 1, "*format*" },
  /* Entity attacks: refused at the DOCTYPE, before any entity exists. */
  { "/exchange/bad/billion-laughs",
    "<?xml version=\"1.0\"?>\n"
    "<!DOCTYPE catalogue [\n"
    " <!ENTITY lol \"lol\">\n"
    " <!ENTITY lol1 \"&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;\">\n"
    " <!ENTITY lol2 \"&lol1;&lol1;&lol1;&lol1;&lol1;&lol1;&lol1;&lol1;&lol1;&lol1;\">\n"
    " <!ENTITY lol3 \"&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;\">\n"
    " <!ENTITY lol4 \"&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;\">\n"
    " <!ENTITY lol5 \"&lol4;&lol4;&lol4;&lol4;&lol4;&lol4;&lol4;&lol4;&lol4;&lol4;\">\n"
    " <!ENTITY lol6 \"&lol5;&lol5;&lol5;&lol5;&lol5;&lol5;&lol5;&lol5;&lol5;&lol5;\">\n"
    " <!ENTITY lol7 \"&lol6;&lol6;&lol6;&lol6;&lol6;&lol6;&lol6;&lol6;&lol6;&lol6;\">\n"
    " <!ENTITY lol8 \"&lol7;&lol7;&lol7;&lol7;&lol7;&lol7;&lol7;&lol7;&lol7;&lol7;\">\n"
    " <!ENTITY lol9 \"&lol8;&lol8;&lol8;&lol8;&lol8;&lol8;&lol8;&lol8;&lol8;&lol8;\">\n"
    "]>\n"
    "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\"><title>&lol9;</title></catalogue>\n",
    TRUE, LAMINA_XML_ERROR_MALFORMED, 2, "*DOCTYPE*not allowed*" },
  { "/exchange/bad/external-entity",
    "<?xml version=\"1.0\"?>\n"
    "<!DOCTYPE catalogue [ <!ENTITY secret SYSTEM \"file:///etc/passwd\"> ]>\n"
    "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\"><title>&secret;</title></catalogue>\n",
    TRUE, LAMINA_XML_ERROR_MALFORMED, 2, "*DOCTYPE*not allowed*" },
  { "/exchange/bad/parameter-entity",
    "<?xml version=\"1.0\"?>\n"
    "<!DOCTYPE catalogue [ <!ENTITY % remote SYSTEM \"file:///etc/passwd\"> %remote; ]>\n"
    "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\"/>\n",
    TRUE, LAMINA_XML_ERROR_MALFORMED, 2, "*DOCTYPE*not allowed*" },
  { "/exchange/bad/external-dtd",
    "<?xml version=\"1.0\"?>\n\n"
    "<!DOCTYPE catalogue SYSTEM \"file:///etc/passwd\">\n"
    "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\"/>\n",
    TRUE, LAMINA_XML_ERROR_MALFORMED, 3, "*DOCTYPE*not allowed*" },
  { "/exchange/bad/undeclared-entity",
    HEAD "  <title>&secret;</title>\n</catalogue>\n",
    TRUE, LAMINA_XML_ERROR_MALFORMED, 7, "*secret*" },
  /* EN ISO 13788 input: a material without μ in a construction with a
   * moisture check is named with its line; the climate must be in the
   * document, complete, and each month once. */
  { "/exchange/bad/moisture-without-mu",
    CLIMATE OPEN_AFTER_CLIMATE GOOD "    <moisture climate=\"site\" humidity-class=\"3\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 22, "*layer 1: material “gyp” has no vapour-resistance-factor*" },
  { "/exchange/bad/moisture-unknown-climate",
    OPEN GOOD "    <moisture climate=\"nowhere\" humidity-class=\"3\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 9, "*unknown climate “nowhere”*" },
  { "/exchange/bad/moisture-class-and-humidity",
    CLIMATE OPEN_AFTER_CLIMATE "    <layer thickness=\"12.5\" material=\"gyp\" sd=\"0.1\"/>\n"
    "    <moisture climate=\"site\" humidity-class=\"3\" inside-humidity=\"0.5\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 23, "*either a humidity class or an inside humidity*" },
  { "/exchange/bad/moisture-class-six",
    OPEN GOOD "    <moisture climate=\"site\" humidity-class=\"6\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_SCHEMA, 9, "*humidity-class*" },
  { "/exchange/bad/climate-eleven-months",
    CLIMATE_OPEN MONTHS_2_12 "  </climate>\n</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_SCHEMA, 7, "*climate*" },
  { "/exchange/bad/climate-month-twice",
    CLIMATE_OPEN MONTH (2) MONTHS_2_12 "  </climate>\n</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 9, "*month 2 is given twice*" },
  { "/exchange/bad/climate-humidity-over-one",
    CLIMATE_OPEN MONTH (1) MONTH (2) "    <month number=\"3\" temperature=\"0\" humidity=\"1.5\"/>\n"
    MONTH (4) MONTH (5) MONTH (6) MONTH (7) MONTH (8) MONTH (9) MONTH (10) MONTH (11) MONTH (12)
    "  </climate>\n</catalogue>\n",
    FALSE, LAMINA_XML_ERROR_INVALID, 7, "*climate “site”, month 3: relative humidity 1.5*" },
  { "/exchange/bad/sd-negative",
    OPEN "    <layer thickness=\"12.5\" material=\"gyp\" sd=\"-1\"/>\n" CLOSE,
    FALSE, LAMINA_XML_ERROR_INVALID, 8, "*layer 1: sd -1 is outside*" },
};

static void
test_bad_case (gconstpointer data)
{
  const BadCase *bad = data;
  g_autofree char *text = bad->raw ? g_strdup (bad->text) : g_strconcat (HEAD, bad->text, NULL);
  g_autofree char *prefix = g_strdup_printf ("case.xml:%d: ", bad->line);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaCatalogue) catalogue = NULL;

  catalogue = lamina_catalogue_read_memory (text, strlen (text), "case.xml", &error);
  g_assert_null (catalogue);
  g_assert_nonnull (error);
  g_test_message ("%s", error->message);
  g_assert_error (error, LAMINA_XML_ERROR, bad->code);
  if (!g_str_has_prefix (error->message, prefix))
    g_error ("expected the message to start with “%s”: %s", prefix, error->message);
  if (!g_pattern_match_simple (bad->pattern, error->message + strlen (prefix)))
    g_error ("expected the message to match “%s”: %s", bad->pattern, error->message);
}

/* libxml2 reports through our handlers only: nothing on stderr. */
static void
test_quiet (void)
{
  if (g_test_subprocess ())
    {
      for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
        {
          g_autofree char *text = cases[i].raw ? g_strdup (cases[i].text) : g_strconcat (HEAD, cases[i].text, NULL);
          g_autoptr(GError) error = NULL;
          g_autoptr(LaminaCatalogue) catalogue = lamina_catalogue_read_memory (text, strlen (text), "q.xml", &error);

          g_assert_null (catalogue);
        }
      return;
    }
  g_test_trap_subprocess (NULL, 0, G_TEST_SUBPROCESS_DEFAULT);
  g_test_trap_assert_passed ();
  g_test_trap_assert_stderr ("");
  g_test_trap_assert_stdout ("");
}

/* Whatever is wrong, the path given is the name in the message, so that
 * "lamina-cli calc" can print it as it is. */
static void
test_file_names (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp (NULL, NULL);
  g_autofree char *path = g_build_filename (dir, "broken.xml", NULL);
  g_autofree char *missing = g_build_filename (dir, "missing.xml", NULL);
  g_autofree char *text = g_strconcat (HEAD, OPEN, "    <layer thickness=\"0\" material=\"gyp\"/>\n", CLOSE, NULL);
  g_autofree char *expected = g_strdup_printf ("%s:8: ", path);

  g_assert_true (g_file_set_contents (path, text, -1, NULL));
  g_assert_null (lamina_catalogue_read_file (path, &error));
  g_assert_true (g_str_has_prefix (error->message, expected));
  g_clear_error (&error);

  g_assert_null (lamina_catalogue_read_file (missing, &error));
  g_assert_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_IO);
  g_assert_nonnull (strstr (error->message, missing));

  g_unlink (path);
  g_rmdir (dir);
}

/* Line numbers past 65535 stay right (libxml2 keeps only 16 bits unless
 * told otherwise). */
static void
test_big_line_numbers (void)
{
  g_autoptr(GString) text = g_string_new (HEAD OPEN);
  g_autoptr(GError) error = NULL;

  for (int i = 0; i < 70000; i++)
    g_string_append (text, GOOD);
  g_string_append (text, "    <layer thickness=\"100\" material=\"eps\"/>\n" CLOSE);
  g_assert_null (lamina_catalogue_read_memory (text->str, text->len, "big.xml", &error));
  g_assert_cmpstr (error->message, ==, "big.xml:70008: unknown material “eps”");
}

/* A file over 256 MiB is refused before it is read (a sparse file: no
 * disk space is used). */
static void
test_too_large (void)
{
  g_autofree char *dir = g_dir_make_tmp (NULL, NULL);
  g_autofree char *path = g_build_filename (dir, "huge.xml", NULL);
  g_autoptr(GError) error = NULL;
  FILE *file = fopen (path, "w");

  g_assert_nonnull (file);
  g_assert_cmpint (fseek (file, 257L * 1024 * 1024, SEEK_SET), ==, 0);
  g_assert_cmpint (fputc ('<', file), ==, '<');
  fclose (file);
  g_assert_null (lamina_catalogue_read_file (path, &error));
  g_assert_error (error, LAMINA_XML_ERROR, LAMINA_XML_ERROR_MALFORMED);
  g_assert_true (g_str_has_suffix (error->message, "larger than 256 MiB"));
  g_unlink (path);
  g_rmdir (dir);
}

/* A message names its construction once: the writer puts "construction
 * “w”: " in front of what the model says, and the model does not say it
 * again. */
static void
test_named_once (void)
{
  g_autoptr(LaminaCatalogue) cat = lamina_catalogue_new ();
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  gsize length;

  g_ptr_array_add (cat->constructions, lamina_construction_new ("w", "Wall", LAMINA_ELEMENT_WALL));
  text = lamina_catalogue_write_to_string (cat, 0, &length, &error);
  g_assert_null (text);
  g_assert_cmpstr (error->message, ==, "construction “w”: no layers");
}

/* Nesting deeper than the parser's limit is said in the document's terms,
 * without the parser's option names. */
static void
test_depth_in_words (void)
{
  g_autoptr(GString) doc = g_string_new ("<?xml version=\"1.0\"?>\n"
                                         "<catalogue xmlns=\"urn:x-lamina:catalogue:1\" format=\"1\">\n");
  g_autoptr(LaminaCatalogue) cat = NULL;
  g_autoptr(GError) error = NULL;

  for (int i = 0; i < 400; i++)
    g_string_append (doc, "<notes>");
  cat = lamina_catalogue_read_memory (doc->str, doc->len, "deep.xml", &error);
  g_assert_null (cat);
  g_assert_nonnull (strstr (error->message, "deep.xml:"));
  g_assert_nonnull (strstr (error->message, "nested too deeply"));
  g_assert_null (strstr (error->message, "XML_PARSE"));
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    g_test_add_data_func (cases[i].path, &cases[i], test_bad_case);
  g_test_add_func ("/exchange/bad/quiet", test_quiet);
  g_test_add_func ("/exchange/bad/named-once", test_named_once);
  g_test_add_func ("/exchange/bad/depth-in-words", test_depth_in_words);
  g_test_add_func ("/exchange/bad/file-names", test_file_names);
  g_test_add_func ("/exchange/bad/big-line-numbers", test_big_line_numbers);
  g_test_add_func ("/exchange/bad/too-large", test_too_large);
  return g_test_run ();
}
