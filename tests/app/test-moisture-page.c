/* SPDX-License-Identifier: GPL-3.0-or-later */
/* The Moisture page beside the results, under Xvfb, on a copy of the demo
 * library: the verdict of the demo's internally lined brick wall (EN ISO
 * 13788, condensation that dries out) and of the solid wall as found (the
 * mould check fails), the same figures as the core gives, the month picker
 * and the sd toggle, live recalculation while a layer is dragged, and a
 * PNG to look at. */
#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <math.h>
#include <string.h>

#include "lamina-application.h"
#include "lamina-demo.h"
#include "lamina-editor.h"
#include "lamina-window.h"
#include "lamina-app-test-util.h"

static void
test_moisture_page (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *dir = g_dir_make_tmp ("lamina-moisture-XXXXXX", &error);
  g_autofree char *path = g_build_filename (dir, "library.sqlite", NULL);
  const char *build = g_getenv ("LAMINA_BUILD_DIR");
  g_autofree char *png = g_build_filename (build ? build : ".", "tests", "app", "moisture-page.png", NULL);
  g_autoptr(LaminaLibrary) library = lamina_library_open (path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  g_autoptr(LaminaConstruction) stored = NULL;
  g_autoptr(LaminaMoistureResult) expected = NULL;
  const LaminaMoistureResult *shown;
  LaminaWindow *window;
  LaminaEditor *editor;
  LaminaMoistureView *view;
  LaminaSectionView *section;
  double before, x, y;

  g_assert_no_error (error);
  g_assert_true (lamina_demo_load (library, &error));
  lamina_application_load_style ();
  window = lamina_window_new (NULL, library);
  gtk_window_set_default_size (GTK_WINDOW (window), 1280, 860);
  gtk_window_present (GTK_WINDOW (window));

  /* EW-302: internal PIR lining; condensation at the PIR/plaster plane in
   * winter that dries out (figures in data/demo/README.md). */
  g_assert_true (lamina_window_open (window, "demo-ew-302", &error));
  g_assert_no_error (error);
  editor = lamina_window_get_editor (window);
  lamina_editor_show_results_page (editor, "moisture");
  view = lamina_editor_get_moisture_view (editor);
  wait_for_draw (GTK_WIDGET (view));
  g_assert_cmpstr (lamina_moisture_view_get_status (view), ==, "Moisture check passes");
  shown = lamina_moisture_view_get_result (view);
  g_assert_nonnull (shown);
  stored = lamina_library_dup_construction (library, "demo-ew-302", 0, &error);
  expected = lamina_moisture_calculate_own (stored, NAN, &error);
  g_assert_no_error (error);
  g_assert_true (shown->condensation);
  g_assert_true (shown->dries_out);
  g_assert_cmpfloat (shown->max_accumulation, ==, expected->max_accumulation);
  g_assert_cmpint (shown->max_month, ==, 3);
  save_png (GTK_WIDGET (window), png);
  g_test_message ("moisture page rendered to %s", png);
  lamina_moisture_view_set_by_sd (view, TRUE);
  lamina_moisture_view_set_month (view, 1);
  wait_for_draw (GTK_WIDGET (view));

  /* Live: thicker PIR (layer 3) while dragging lowers the accumulation
   * (more sd on the warm side of the condensing plane, EN ISO 13788
   * clause 7: the plane is the PIR's outer face). */
  before = shown->max_accumulation;
  section = lamina_editor_get_section_view (editor);
  wait_for_draw (GTK_WIDGET (section));
  g_assert_true (lamina_section_view_get_boundary_point (section, 3, &x, &y));
  g_assert_true (lamina_section_view_drag_begin (section, x, y));
  lamina_section_view_drag_update (section, 40, 0, FALSE);
  shown = lamina_moisture_view_get_result (view);
  g_assert_nonnull (shown);
  g_assert_cmpfloat (shown->max_accumulation, <, before);
  lamina_section_view_drag_end (section, 40, 0, FALSE);

  /* EW-301: the solid wall as found fails the mould check in January. */
  g_assert_true (lamina_window_open (window, "demo-ew-301", &error));
  g_assert_no_error (error);
  wait_for_draw (GTK_WIDGET (view));
  g_assert_cmpstr (lamina_moisture_view_get_status (view), ==, "Moisture check fails");
  shown = lamina_moisture_view_get_result (view);
  g_assert_false (shown->surface_passes);
  g_assert_cmpint (shown->critical_month, ==, 1);

  /* A construction without a check says how to get one. */
  g_assert_true (lamina_window_open (window, "demo-cl-301", &error));
  g_assert_no_error (error);
  g_assert_cmpstr (lamina_moisture_view_get_status (view), ==, "No moisture check");
  g_assert_null (lamina_moisture_view_get_result (view));

  gtk_window_destroy (GTK_WINDOW (window));
  lamina_library_close (library);
  g_unlink (path);
  g_rmdir (dir);
}

int
main (int argc, char **argv)
{
  gtk_test_init (&argc, &argv, NULL);
  g_test_add_func ("/app/moisture/page", test_moisture_page);
  return g_test_run ();
}
