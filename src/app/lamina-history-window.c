/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-history-window.h"

#include <glib/gi18n.h>

#include "lamina-text.h"
#include "lamina-revision-diff.h"

static GtkWidget *
new_revision_row (LaminaLibrary            *library,
                  const char               *id,
                  const LaminaRevisionInfo *info,
                  const LaminaRevisionInfo *previous)
{
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 4);
  g_autofree char *u = lamina_text_u (info->u_corrected);
  g_autofree char *title = g_strdup_printf (_("Revision %d · %s · U %s"), info->revision,
                                            lamina_text_status_name (info->status), u);
  g_autofree char *who = g_strdup_printf (_("Saved by %s on %s"),
                                          info->modified_by ? info->modified_by : _("unknown"),
                                          info->modified_at ? info->modified_at : "–");
  GtkWidget *label = gtk_label_new (title);
  GtkWidget *detail = gtk_label_new (who);

  g_object_set (box, "margin-start", 12, "margin-end", 12, "margin-top", 8, "margin-bottom", 8, NULL);
  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_widget_add_css_class (label, "heading");
  gtk_label_set_xalign (GTK_LABEL (detail), 0);
  gtk_widget_add_css_class (detail, "dim-label");
  gtk_box_append (GTK_BOX (box), label);
  gtk_box_append (GTK_BOX (box), detail);

  if (info->approved_by != NULL || info->checked_by != NULL)
    {
      g_autofree char *review = info->approved_by
        ? g_strdup_printf (_("Approved by %s on %s"), info->approved_by, info->approved_at ? info->approved_at : "–")
        : g_strdup_printf (_("Checked by %s on %s"), info->checked_by, info->checked_at ? info->checked_at : "–");
      GtkWidget *r = gtk_label_new (review);

      gtk_label_set_xalign (GTK_LABEL (r), 0);
      gtk_box_append (GTK_BOX (box), r);
    }
  if (info->comment != NULL)
    {
      GtkWidget *c = gtk_label_new (info->comment);

      gtk_label_set_xalign (GTK_LABEL (c), 0);
      gtk_widget_add_css_class (c, "dim-label");
      gtk_box_append (GTK_BOX (box), c);
    }
  if (previous != NULL)
    {
      g_autoptr(LaminaConstruction) a = lamina_library_get_construction (library, id, previous->revision, NULL);
      g_autoptr(LaminaConstruction) b = lamina_library_get_construction (library, id, info->revision, NULL);
      g_autoptr(GPtrArray) changes = a && b ? lamina_revision_diff (a, b) : NULL;
      g_autofree char *text = NULL;
      GtkWidget *c;

      if (changes != NULL && changes->len > 0)
        {
          g_ptr_array_add (changes, NULL);
          text = g_strjoinv ("\n", (char **) changes->pdata);
        }
      else
        text = g_strdup (_("No change to the build-up (review only)"));
      c = gtk_label_new (text);
      gtk_label_set_xalign (GTK_LABEL (c), 0);
      gtk_label_set_wrap (GTK_LABEL (c), TRUE);
      gtk_widget_add_css_class (c, "lamina-diff");
      gtk_box_append (GTK_BOX (box), c);
    }
  return box;
}

void
lamina_history_window_present (GtkWindow     *parent,
                               LaminaLibrary *library,
                               const char    *id)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) history = lamina_library_get_history (library, id, &error);
  GtkWidget *window = gtk_window_new ();
  GtkWidget *scroller = gtk_scrolled_window_new ();
  GtkWidget *list = gtk_list_box_new ();

  gtk_window_set_title (GTK_WINDOW (window), _("Revision History"));
  gtk_window_set_transient_for (GTK_WINDOW (window), parent);
  gtk_window_set_default_size (GTK_WINDOW (window), 520, 560);
  gtk_list_box_set_selection_mode (GTK_LIST_BOX (list), GTK_SELECTION_NONE);
  gtk_widget_add_css_class (list, "boxed-list");
  gtk_accessible_update_property (GTK_ACCESSIBLE (list), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Revisions, newest first"), -1);
  if (history == NULL)
    gtk_list_box_append (GTK_LIST_BOX (list), gtk_label_new (error->message));
  for (guint i = 0; history != NULL && i < history->len; i++)
    gtk_list_box_append (GTK_LIST_BOX (list),
                         new_revision_row (library, id, history->pdata[i],
                                           i + 1 < history->len ? history->pdata[i + 1] : NULL));
  g_object_set (list, "margin-start", 12, "margin-end", 12, "margin-top", 12, "margin-bottom", 12, NULL);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), list);
  gtk_window_set_child (GTK_WINDOW (window), scroller);
  gtk_window_present (GTK_WINDOW (window));
}
