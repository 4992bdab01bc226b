/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-close-keys.c: one place gives every secondary window the keys a
 * user expects to close it, whoever built the window.  The main window is
 * left alone: Esc there belongs to the search and the editor. */
#define G_LOG_DOMAIN "lamina-app"

#include "lamina-close-keys.h"

#include "lamina-window.h"

/* The windows that have the keys, so that none gets them twice; a window
 * leaves the set when it is finalised.  The keys go on windows of any
 * class, GTK's own file and print dialogs among them, which have no field
 * of ours: the set is kept here rather than as object data on them. */
static GHashTable *keyed_windows;

static void
on_window_finalized (gpointer  data,
                     GObject  *where_the_object_was)
{
  g_hash_table_remove (keyed_windows, where_the_object_was);
}

static void
add_close_keys (GtkWindow *window)
{
  GtkEventController *controller;
  GtkShortcutAction *close;

  if (keyed_windows == NULL)
    keyed_windows = g_hash_table_new (NULL, NULL);
  if (LAMINA_IS_WINDOW (window) || g_hash_table_contains (keyed_windows, window))
    return;
  controller = gtk_shortcut_controller_new ();
  close = gtk_named_action_new ("window.close");
  gtk_shortcut_controller_add_shortcut (GTK_SHORTCUT_CONTROLLER (controller),
                                        gtk_shortcut_new (gtk_keyval_trigger_new (GDK_KEY_Escape, 0),
                                                          g_object_ref (close)));
  gtk_shortcut_controller_add_shortcut (GTK_SHORTCUT_CONTROLLER (controller),
                                        gtk_shortcut_new (gtk_keyval_trigger_new (GDK_KEY_w, GDK_CONTROL_MASK),
                                                          close));
  gtk_widget_add_controller (GTK_WIDGET (window), controller);
  g_hash_table_add (keyed_windows, window);
  g_object_weak_ref (G_OBJECT (window), on_window_finalized, NULL);
}

static void
on_toplevels_changed_cb (GListModel *toplevels,
                         guint       position,
                         guint       removed,
                         guint       added,
                         gpointer    user_data)
{
  for (guint i = position; i < position + added; i++)
    {
      g_autoptr(GtkWindow) window = g_list_model_get_item (toplevels, i);

      add_close_keys (window);
    }
}

void
lamina_close_keys_install (void)
{
  static gboolean installed;
  GListModel *toplevels;

  if (installed)
    return;
  installed = TRUE;
  toplevels = gtk_window_get_toplevels ();
  on_toplevels_changed_cb (toplevels, 0, 0, g_list_model_get_n_items (toplevels), NULL);
  g_signal_connect (toplevels, "items-changed", G_CALLBACK (on_toplevels_changed_cb), NULL);
}

gboolean
lamina_close_keys_has (GtkWindow *window)
{
  g_return_val_if_fail (GTK_IS_WINDOW (window), FALSE);
  return keyed_windows != NULL && g_hash_table_contains (keyed_windows, window);
}
