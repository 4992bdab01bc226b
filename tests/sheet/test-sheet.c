/* SPDX-License-Identifier: GPL-3.0-or-later */
/* Tests of the PDF sheets and catalogues, read back with poppler. */
#define G_LOG_DOMAIN "lamina-test"

#include <glib/gstdio.h>
#include <locale.h>
#include <math.h>
#include <poppler.h>
#include <string.h>

#include "lamina-sheet.h"
#include "lamina-sheet-format.h"
#include "lamina-test-constructions.h"

#define PRACTICE "Tamberlin Oke Architects"

/* poppler-glib 22.12 defines no autoptr cleanups. */
G_DEFINE_AUTOPTR_CLEANUP_FUNC (PopplerPage, g_object_unref)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (PopplerDocument, g_object_unref)

static LaminaConstruction *
fetch_cb (gpointer   user_data,
          guint      index,
          GError   **error)
{
  GPtrArray *all = user_data;

  return lamina_construction_copy (all->pdata[index]);
}

static void
init_options (LaminaSheetOptions *options)
{
  lamina_sheet_options_init (options);
  options->practice = PRACTICE;
  options->library = "Office library";
  options->printed = "2024-05-02";
}

static char *temp_dir;

static char *
dup_temp_path (const char *name)
{
  return g_build_filename (temp_dir, name, NULL);
}

static PopplerDocument *
open_pdf (const char *path)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *uri = g_filename_to_uri (path, NULL, NULL);
  PopplerDocument *doc = poppler_document_new_from_file (uri, NULL, &error);

  g_assert_no_error (error);
  return doc;
}

static char *
normalize (const char *text)
{
  g_auto(GStrv) words = g_strsplit_set (text, " \n\t\r", -1);
  GString *out = g_string_new (NULL);

  for (guint i = 0; words[i]; i++)
    if (*words[i])
      g_string_append_printf (out, "%s%s", out->len ? " " : "", words[i]);
  return g_string_free (out, FALSE);
}

/* Page text with every run of white space made one space: a sentence
 * wrapped over two lines still matches. */
static char *
dup_page_text (PopplerDocument *doc,
               int              index)
{
  g_autoptr(PopplerPage) page = poppler_document_get_page (doc, index);
  g_autofree char *text = poppler_page_get_text (page);

  return normalize (text);
}

static void
assert_contains (const char *text,
                 const char *what,
                 const char *where)
{
  g_autofree char *needle = normalize (what);

  if (strstr (text, needle) == NULL)
    g_error ("%s: “%s” not found in: %s", where, needle, text);
}

/* TRUE when @a and @b share a row of @page: poppler's text order follows
 * columns, so rows are checked by position. */
static gboolean
find_on_row (PopplerPage *page,
             const char  *a,
             const char  *b,
             gboolean     b_after)
{
  GList *ra = poppler_page_find_text (page, a), *rb = poppler_page_find_text (page, b);
  gboolean found = FALSE;

  for (GList *i = ra; i && !found; i = i->next)
    for (GList *j = rb; j && !found; j = j->next)
      {
        PopplerRectangle *x = i->data, *y = j->data;
        double mid_x = (x->y1 + x->y2) / 2, mid_y = (y->y1 + y->y2) / 2;
        found = fabs (mid_x - mid_y) < 2.5 && (b_after ? y->x1 > x->x2 : y->x2 < x->x1);
      }
  g_list_free_full (ra, (GDestroyNotify) poppler_rectangle_free);
  g_list_free_full (rb, (GDestroyNotify) poppler_rectangle_free);
  return found;
}

static void
check_layer_rows (PopplerPage              *page,
                  const LaminaConstruction *c)
{
  char d[LAMINA_FORMAT_SIZE];

  for (guint i = 0; i < c->layers->len; i++)
    {
      const LaminaLayer *layer = c->layers->pdata[i];
      const char *label = lamina_layer_get_label (layer);
      char no[16];

      g_snprintf (no, sizeof no, "%u", i + 1);
      lamina_format_thickness (d, layer->thickness);
      if (!find_on_row (page, label, d, TRUE) || !find_on_row (page, label, no, FALSE))
        g_error ("%s: no table row “%s  %s … %s”", c->code, no, label, d);
    }
}

static void
check_sheet_text (const char               *text,
                  const LaminaConstruction *c)
{
  g_autoptr(LaminaResult) r = lamina_calculate (c, NULL);
  char buffer[LAMINA_FORMAT_SIZE];
  g_autofree char *u = NULL;

  g_assert_nonnull (r);
  assert_contains (text, c->code, c->code);
  assert_contains (text, c->name, c->code);
  /* U as lamina_calculate gives it, to two significant figures. */
  u = g_strdup_printf ("U = %s", lamina_format_u (buffer, r->u_corrected));
  assert_contains (text, u, c->code);
  assert_contains (text, "EN ISO 6946:2017", c->code);
  assert_contains (text, "not a condensation risk assessment", c->code);
  for (guint i = 0; i < r->warnings->len; i++)
    assert_contains (text, ((LaminaWarning *) r->warnings->pdata[i])->message, c->code);
}

typedef struct
{
  GPtrArray       *all;
  char            *path;
  PopplerDocument *doc;
} Fixture;

static void
fixture_set_up (Fixture       *f,
                gconstpointer  data)
{
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;

  f->all = lamina_test_constructions ();
  f->path = dup_temp_path ("catalogue.pdf");
  init_options (&options);
  lamina_sheet_write_catalogue (f->path, FALSE, &options, f->all->len, fetch_cb, f->all, NULL, NULL, &error);
  g_assert_no_error (error);
  f->doc = open_pdf (f->path);
}

static void
fixture_tear_down (Fixture       *f,
                   gconstpointer  data)
{
  g_clear_object (&f->doc);
  g_unlink (f->path);
  g_free (f->path);
  g_ptr_array_unref (f->all);
}

static void
test_catalogue_pages (Fixture       *f,
                      gconstpointer  data)
{
  /* Cover, one index page, one sheet per construction. */
  g_assert_cmpint (poppler_document_get_n_pages (f->doc), ==, 2 + (int) f->all->len);
  for (guint i = 0; i < f->all->len; i++)
    {
      g_autofree char *text = dup_page_text (f->doc, 2 + (int) i);
      g_autofree char *page = g_strdup_printf ("Page %u of %u", 3 + i, 2 + f->all->len);
      g_autoptr(PopplerPage) sheet = poppler_document_get_page (f->doc, 2 + (int) i);
      check_sheet_text (text, f->all->pdata[i]);
      check_layer_rows (sheet, f->all->pdata[i]);
      assert_contains (text, page, "footer");
      assert_contains (text, PRACTICE, "header");
    }
}

static int
compare_link_top_cb (gconstpointer a,
                     gconstpointer b)
{
  const PopplerLinkMapping *la = *(PopplerLinkMapping **) a, *lb = *(PopplerLinkMapping **) b;

  /* PDF y grows upwards: the first row has the largest y. */
  return la->area.y2 > lb->area.y2 ? -1 : la->area.y2 < lb->area.y2;
}

static void
test_catalogue_links (Fixture       *f,
                      gconstpointer  data)
{
  g_autoptr(PopplerPage) index = poppler_document_get_page (f->doc, 1);
  GList *links = poppler_page_get_link_mapping (index);
  g_autoptr(GPtrArray) sorted = g_ptr_array_new ();
  g_autofree char *text = dup_page_text (f->doc, 1);

  for (GList *l = links; l; l = l->next)
    g_ptr_array_add (sorted, l->data);
  g_ptr_array_sort (sorted, compare_link_top_cb);
  g_assert_cmpuint (sorted->len, ==, f->all->len);
  for (guint i = 0; i < sorted->len; i++)
    {
      PopplerLinkMapping *m = sorted->pdata[i];
      PopplerActionGotoDest *go = &m->action->goto_dest;
      PopplerDest *dest;

      g_assert_cmpint (m->action->type, ==, POPPLER_ACTION_GOTO_DEST);
      if (go->dest->type == POPPLER_DEST_NAMED)
        dest = poppler_document_find_dest (f->doc, go->dest->named_dest);
      else
        dest = poppler_dest_copy (go->dest);
      g_assert_nonnull (dest);
      /* Row i (the i-th construction) lands on its sheet: page 3 + i. */
      g_assert_cmpint (dest->page_num, ==, 3 + (int) i);
      poppler_dest_free (dest);
      assert_contains (text, ((LaminaConstruction *) f->all->pdata[i])->code, "index");
    }
  poppler_page_free_link_mapping (links);
}

static void
test_catalogue_draft (Fixture       *f,
                      gconstpointer  data)
{
  for (guint i = 0; i < f->all->len; i++)
    {
      const LaminaConstruction *c = f->all->pdata[i];
      g_autofree char *text = dup_page_text (f->doc, 2 + (int) i);
      gboolean marked = strstr (text, "DRAFT") != NULL;

      if (c->status == LAMINA_STATUS_DRAFT && !marked)
        g_error ("%s is a draft but carries no DRAFT mark", c->code);
      if (c->status != LAMINA_STATUS_DRAFT && marked)
        g_error ("%s is %s but is marked DRAFT", c->code, lamina_status_to_string (c->status));
    }
}

static void
test_catalogue_metadata (Fixture       *f,
                         gconstpointer  data)
{
  g_autofree char *title = poppler_document_get_title (f->doc);
  g_autofree char *author = poppler_document_get_author (f->doc);
  PopplerIndexIter *iter = poppler_index_iter_new (f->doc);
  guint top = 0;

  g_assert_cmpstr (title, ==, "Construction catalogue");
  g_assert_cmpstr (author, ==, PRACTICE);
  /* Bookmarks: cover, index, then one group per element. */
  g_assert_nonnull (iter);
  do
    top++;
  while (poppler_index_iter_next (iter));
  poppler_index_iter_free (iter);
  g_assert_cmpuint (top, ==, 2 + 3); /* walls, roofs, floors */
}

static void
test_warnings_printed (void)
{
  /* Insulation bridged by metal is outside EN ISO 6946:2017 (clause 1):
   * the engine warns and the sheet must say so. */
  g_autoptr(LaminaConstruction) c = lamina_test_steel_stud_wall ();
  g_autoptr(LaminaResult) r = lamina_calculate (c, NULL);
  g_autofree char *path = dup_temp_path ("steel.pdf");
  g_autoptr(PopplerDocument) doc = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  LaminaSheetOptions options;

  g_assert_true (lamina_result_has_warning (r, LAMINA_WARNING_METAL_BRIDGED_INSULATION));
  init_options (&options);
  g_assert_true (lamina_sheet_write_pdf (path, FALSE, &options, c, &error));
  g_assert_no_error (error);
  doc = open_pdf (path);
  g_assert_cmpint (poppler_document_get_n_pages (doc), ==, 1);
  text = dup_page_text (doc, 0);
  assert_contains (text, "Warnings", c->code);
  check_sheet_text (text, c);
  {
    g_autoptr(PopplerPage) page = poppler_document_get_page (doc, 0);
    check_layer_rows (page, c);
  }
  g_unlink (path);
}

static void
test_no_overwrite (void)
{
  g_autoptr(LaminaConstruction) c = lamina_test_masonry_wall ();
  g_autofree char *path = dup_temp_path ("keep.pdf");
  g_autofree char *contents = NULL;
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;

  init_options (&options);
  g_assert_true (g_file_set_contents (path, "precious", -1, NULL));
  g_assert_false (lamina_sheet_write_pdf (path, FALSE, &options, c, &error));
  g_assert_error (error, LAMINA_SHEET_ERROR, LAMINA_SHEET_ERROR_EXISTS);
  g_assert_true (g_file_get_contents (path, &contents, NULL, NULL));
  g_assert_cmpstr (contents, ==, "precious");
  g_clear_error (&error);
  g_assert_true (lamina_sheet_write_pdf (path, TRUE, &options, c, &error));
  g_assert_no_error (error);
  g_clear_pointer (&contents, g_free);
  g_assert_true (g_file_get_contents (path, &contents, NULL, NULL));
  g_assert_true (g_str_has_prefix (contents, "%PDF-"));
  g_unlink (path);
}

static void
test_invalid_construction (void)
{
  g_autoptr(LaminaConstruction) c = lamina_test_masonry_wall ();
  g_autofree char *path = dup_temp_path ("invalid.pdf");
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;

  /* λ must be positive (EN ISO 6946: R = d/λ). */
  ((LaminaLayer *) c->layers->pdata[2])->material->conductivity = 0.0;
  init_options (&options);
  g_assert_false (lamina_sheet_write_pdf (path, FALSE, &options, c, &error));
  g_assert_error (error, LAMINA_SHEET_ERROR, LAMINA_SHEET_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, "EW-01: "));
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
}

static void
test_paper (void)
{
  /* ANSI letter is 8.5 × 11 in = 612 × 792 pt; ISO 216 A3 297 × 420 mm. */
  g_autoptr(LaminaConstruction) c = lamina_test_flat_roof ();
  g_autofree char *path = dup_temp_path ("letter.pdf");
  g_autoptr(PopplerDocument) doc = NULL;
  g_autoptr(PopplerPage) page = NULL;
  g_autoptr(GError) error = NULL;
  LaminaSheetOptions options;
  double w, h;

  init_options (&options);
  g_assert_true (lamina_paper_from_string ("letter", &options.paper));
  g_assert_true (lamina_sheet_write_pdf (path, TRUE, &options, c, &error));
  doc = open_pdf (path);
  page = poppler_document_get_page (doc, 0);
  poppler_page_get_size (page, &w, &h);
  g_assert_cmpfloat_with_epsilon (w, 612, 0.01);
  g_assert_cmpfloat_with_epsilon (h, 792, 0.01);
  lamina_paper_get_size (LAMINA_PAPER_A3, &w, &h);
  g_assert_cmpfloat_with_epsilon (w, 297 * 72 / 25.4, 1e-9);
  g_assert_false (lamina_paper_from_string ("a5", &options.paper));
  g_unlink (path);
}

int
main (int    argc,
      char **argv)
{
  int status;

  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);
  g_test_add ("/sheet/catalogue/pages", Fixture, NULL, fixture_set_up, test_catalogue_pages, fixture_tear_down);
  g_test_add ("/sheet/catalogue/links", Fixture, NULL, fixture_set_up, test_catalogue_links, fixture_tear_down);
  g_test_add ("/sheet/catalogue/draft", Fixture, NULL, fixture_set_up, test_catalogue_draft, fixture_tear_down);
  g_test_add ("/sheet/catalogue/metadata", Fixture, NULL, fixture_set_up, test_catalogue_metadata,
              fixture_tear_down);
  g_test_add_func ("/sheet/pdf/warnings", test_warnings_printed);
  g_test_add_func ("/sheet/pdf/no-overwrite", test_no_overwrite);
  g_test_add_func ("/sheet/pdf/invalid", test_invalid_construction);
  g_test_add_func ("/sheet/pdf/paper", test_paper);
  temp_dir = g_dir_make_tmp ("lamina-sheet-XXXXXX", NULL);
  g_assert_nonnull (temp_dir);
  status = g_test_run ();
  g_rmdir (temp_dir);
  g_free (temp_dir);
  return status;
}
