/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The window on a read-only library (issue 10) under Xvfb: the line that
 * says so, browsing and the editor open, and an edit refused with the
 * library's one message, the file untouched. */
#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <string.h>

#include "lamina-application.h"
#include "lamina-demo.h"
#include "lamina-editor.h"
#include "lamina-library-safety.h"
#include "lamina-safety-bar.h"
#include "lamina-window.h"
#include "lamina-app-test-util.h"

static GtkWidget *
find_safety_bar (GtkWidget *widget)
{
  if (LAMINA_IS_SAFETY_BAR (widget))
    return widget;
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    {
      GtkWidget *found = find_safety_bar (child);

      if (found != NULL)
        return found;
    }
  return NULL;
}

static char *
checksum (const char *path)
{
  g_autofree char *data = NULL;
  gsize len = 0;

  g_assert_true (g_file_get_contents (path, &data, &len, NULL));
  return g_compute_checksum_for_data (G_CHECKSUM_SHA256, (const guchar *) data, len);
}

static void
on_notice_cb (LaminaDocument *document,
              const char     *message,
              char          **last)
{
  g_free (*last);
  *last = g_strdup (message);
}

static void
test_read_only_window (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("lamina-ro-window-XXXXXX", &error);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "read-only-window.png", NULL);
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  g_autofree char *notice = NULL;
  g_autoptr(LaminaLibrary) library = NULL;
  const LaminaConstruction *shown;
  LaminaDocument *document;
  LaminaWindow *window;
  GtkWidget *bar;
  double thickness;

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_assert_no_error (error);
  g_assert_true (lamina_demo_load (library, &error));
  g_clear_object (&library);
  before = checksum (path);

  library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_READ_ONLY, &error);
  g_assert_no_error (error);
  lamina_application_load_style ();
  window = lamina_window_new (NULL, library);
  gtk_window_set_default_size (GTK_WINDOW (window), 1280, 800);
  gtk_window_present (GTK_WINDOW (window));
  wait_for_draw (GTK_WIDGET (window));

  bar = find_safety_bar (GTK_WIDGET (window));
  g_assert_nonnull (bar);
  g_assert_nonnull (lamina_safety_bar_get_text (LAMINA_SAFETY_BAR (bar)));
  g_assert_true (g_str_has_prefix (lamina_safety_bar_get_text (LAMINA_SAFETY_BAR (bar)), "Read-only: "));
  g_assert_nonnull (strstr (lamina_safety_bar_get_text (LAMINA_SAFETY_BAR (bar)), "opened read-only"));

  /* Browsing works: the editor opens a construction and shows it. */
  g_assert_true (lamina_window_open (window, "demo-ew-101", &error));
  g_assert_no_error (error);
  wait_for_draw (GTK_WIDGET (window));
  save_png (GTK_WIDGET (window), png);
  g_test_message ("read-only window rendered to %s", png);
  document = lamina_editor_get_document (lamina_window_get_editor (window));
  g_assert_nonnull (document);
  g_signal_connect (document, "notice", G_CALLBACK (on_notice_cb), &notice);
  shown = lamina_document_get_construction (document);
  thickness = ((LaminaLayer *) shown->layers->pdata[1])->thickness;

  /* An edit (the section's drag, the thickness field) is refused. */
  lamina_editor_resize_layer (lamina_window_get_editor (window), 1, thickness + 40, FALSE);
  wait_for_draw (GTK_WIDGET (window));
  shown = lamina_document_get_construction (document);
  g_assert_cmpfloat (((LaminaLayer *) shown->layers->pdata[1])->thickness, ==, thickness);
  g_assert_nonnull (notice);
  g_assert_nonnull (strstr (notice, "the library is read-only (opened read-only); nothing was changed"));

  /* The write actions are off: activating them changes nothing. */
  gtk_widget_activate_action (GTK_WIDGET (window), "win.delete", NULL);
  gtk_widget_activate_action (GTK_WIDGET (window), "win.derive", NULL);
  wait_for_draw (GTK_WIDGET (window));

  gtk_window_destroy (GTK_WINDOW (window));
  g_clear_object (&library);
  after = checksum (path);
  g_assert_cmpstr (before, ==, after);
  g_remove (path);
  g_rmdir (dir);
}

int
main (int    argc,
      char **argv)
{
  gtk_test_init (&argc, &argv, NULL);
  g_test_add_func ("/app/read-only-window", test_read_only_window);
  return g_test_run ();
}
