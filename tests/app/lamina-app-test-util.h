/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-app-test-util.h: waiting for the window to draw, and saving a
 * widget as a PNG to look at, for the window tests under Xvfb. */
#pragma once

#include <glib/gstdio.h>
#include <gtk/gtk.h>

static inline void
wait_for_draw (GtkWidget *widget)
{
  gtk_test_widget_wait_for_draw (widget);
  while (g_main_context_pending (NULL))
    g_main_context_iteration (NULL, FALSE);
}

static inline void
save_png (GtkWidget  *widget,
          const char *path)
{
  g_autoptr(GdkPaintable) paintable = gtk_widget_paintable_new (widget);
  g_autoptr(GskRenderNode) node = NULL;
  g_autoptr(GdkTexture) texture = NULL;
  GskRenderer *renderer = gtk_native_get_renderer (gtk_widget_get_native (widget));
  int width = gtk_widget_get_width (widget);
  int height = gtk_widget_get_height (widget);

  /* On a loaded machine the widget may not have drawn yet after one
   * frame (its paintable then snapshots to nothing): wait for more
   * frames, a bounded number of times. */
  for (int attempt = 0; node == NULL && attempt < 50; attempt++)
    {
      g_autoptr(GtkSnapshot) snapshot = gtk_snapshot_new ();

      if (attempt > 0)
        wait_for_draw (widget);
      gdk_paintable_snapshot (paintable, GDK_SNAPSHOT (snapshot), width, height);
      node = gtk_snapshot_free_to_node (g_steal_pointer (&snapshot));
    }
  g_assert_nonnull (node);
  texture = gsk_renderer_render_texture (renderer, node, &GRAPHENE_RECT_INIT (0, 0, width, height));
  g_assert_true (gdk_texture_save_to_png (texture, path));
  g_assert_cmpint (gdk_texture_get_width (texture), ==, width);
}

/* Runs the main loop until @done (@data) says so, or fails the test after
 * @seconds: for work finished in a worker thread, without sleeps. */
static inline gboolean
wait_until_timeout_cb (gpointer data)
{
  *(gboolean *) data = TRUE;
  return G_SOURCE_REMOVE;
}

static inline void
wait_until (gboolean (*done) (gpointer data),
            gpointer   data,
            double     seconds)
{
  gboolean timed_out = FALSE;
  guint timeout = g_timeout_add ((guint) (seconds * 1000), wait_until_timeout_cb, &timed_out);

  while (!done (data) && !timed_out)
    g_main_context_iteration (NULL, TRUE);
  if (timed_out)
    g_error ("gave up waiting after %g s", seconds);
  g_source_remove (timeout);
}

/* Removes a test's temporary folder with the files in it. */
static inline void
remove_test_dir (const char *path)
{
  g_autoptr(GDir) dir = g_dir_open (path, 0, NULL);
  const char *name;

  while (dir && (name = g_dir_read_name (dir)) != NULL)
    {
      g_autofree char *p = g_build_filename (path, name, NULL);
      g_remove (p);
    }
  g_rmdir (path);
}
