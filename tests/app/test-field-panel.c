/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The 2-D check in the window under Xvfb, on a copy of the demo library:
 * the steel-stud wall EW-202 (metal bridging insulation, outside EN ISO
 * 6946) offers the check, runs it in a worker with progress, and shows
 * U(2-D) beside U(6946) and the field; a timber wall inside the method's
 * scope does not offer it; a running check can be cancelled, and a
 * changed construction drops it.  A PNG to look at. */
#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <string.h>

#include "lamina-application.h"
#include "lamina-demo.h"
#include "lamina-editor.h"
#include "lamina-field-panel.h"
#include "lamina-results-view.h"
#include "lamina-window.h"
#include "lamina-app-test-util.h"

static void
wait_while_running (LaminaFieldPanel *panel)
{
  gint64 end = g_get_monotonic_time () + 120 * G_TIME_SPAN_SECOND;

  while (lamina_field_panel_is_running (panel) && g_get_monotonic_time () < end)
    g_main_context_iteration (NULL, TRUE);
  g_assert_false (lamina_field_panel_is_running (panel));
}

static void
test_window_field_check (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("lamina-field-XXXXXX", &error);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "field-window.png", NULL);
  g_autofree char *panel_png = g_build_filename (build ? build : ".", "tests", "app", "field-panel.png", NULL);
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_autoptr(LaminaConstruction) c = NULL;
  g_autoptr(LaminaFieldResult) expected = NULL;
  g_autoptr(LaminaResult) r6946 = NULL;
  const LaminaFieldResult *shown;
  LaminaFieldPanel *panel;
  LaminaWindow *window;

  g_assert_no_error (error);
  g_assert_true (lamina_demo_load (library, &error));
  lamina_application_load_style ();
  window = lamina_window_new (NULL, library);
  gtk_window_set_default_size (GTK_WINDOW (window), 1400, 1000);
  gtk_window_present (GTK_WINDOW (window));
  panel = LAMINA_FIELD_PANEL (lamina_results_view_get_field_panel (
            lamina_editor_get_results_view (lamina_window_get_editor (window))));

  /* A timber wall inside the method's scope: nothing offered. */
  g_assert_true (lamina_window_open (window, "demo-ew-201", &error));
  g_assert_no_error (error);
  wait_for_draw (GTK_WIDGET (window));
  g_assert_false (gtk_widget_get_visible (GTK_WIDGET (panel)));

  /* The steel-stud wall: offered, run, shown beside U(6946). */
  g_assert_true (lamina_window_open (window, "demo-ew-202", &error));
  g_assert_no_error (error);
  wait_for_draw (GTK_WIDGET (window));
  g_assert_true (gtk_widget_get_visible (GTK_WIDGET (panel)));
  lamina_field_panel_run (panel);
  g_assert_true (lamina_field_panel_is_running (panel));
  wait_while_running (panel);
  shown = lamina_field_panel_get_result (panel);
  g_assert_nonnull (shown);
  c = lamina_library_dup_construction (library, "demo-ew-202", 0, &error);
  g_assert_no_error (error);
  r6946 = lamina_calculate (c, &error);
  g_assert_no_error (error);
  expected = lamina_field_calculate (c, 0, NULL, NULL, &error);
  g_assert_no_error (error);
  /* The worker computes what the core computes. */
  g_assert_cmpfloat (shown->u, ==, expected->u);
  g_assert_nonnull (strstr (lamina_field_panel_get_status_text (panel), "U (2-D) "));
  g_assert_nonnull (strstr (lamina_field_panel_get_status_text (panel), "U (EN ISO 6946) "));
  wait_for_draw (GTK_WIDGET (window));
  save_png (GTK_WIDGET (window), png);
  g_test_message ("window with the 2-D check rendered to %s", png);
  save_png (GTK_WIDGET (panel), panel_png);
  g_test_message ("the 2-D check block rendered to %s", panel_png);

  /* Cancel: the worker stops at its next progress report. */
  lamina_field_panel_set_construction (panel, NULL, NULL);
  lamina_field_panel_set_construction (panel, c, r6946);
  lamina_field_panel_run (panel);
  lamina_field_panel_cancel (panel);
  wait_while_running (panel);
  g_assert_null (lamina_field_panel_get_result (panel));
  g_assert_nonnull (strstr (lamina_field_panel_get_status_text (panel), "cancelled"));

  gtk_window_destroy (GTK_WINDOW (window));
  g_unlink (path);
  g_rmdir (dir);
}

int
main (int   argc,
      char *argv[])
{
  gtk_test_init (&argc, &argv, NULL);
  g_test_add_func ("/app/field/window-check", test_window_field_check);
  return g_test_run ();
}
