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
  char u[LAMINA_U_TEXT_SIZE];
  g_autofree char *title = g_strdup_printf (_("Revision %d · %s · U %s"), info->revision,
                                            lamina_text_status_name (info->status),
                                            lamina_format_u (u, info->u_corrected));
  g_autofree char *saved_at = lamina_text_local_date (info->modified_at);
  g_autofree char *reviewed_at = lamina_text_local_date (info->approved_by ? info->approved_at : info->checked_at);
  g_autofree char *who = g_strdup_printf (_("Saved by %s on %s"),
                                          info->modified_by ? info->modified_by : _("unknown"), saved_at);
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
        ? g_strdup_printf (_("Approved by %s on %s"), info->approved_by, reviewed_at)
        : g_strdup_printf (_("Checked by %s on %s"), info->checked_by, reviewed_at);
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
      g_autoptr(LaminaConstruction) a = lamina_library_dup_construction (library, id, previous->revision, NULL);
      g_autoptr(LaminaConstruction) b = lamina_library_dup_construction (library, id, info->revision, NULL);
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

/* Comparing any two revisions: the pickers and the sentences between. */
typedef struct
{
  LaminaLibrary *library;
  char          *id;
  GPtrArray     *history;  /* LaminaRevisionInfo*, newest first; owned */
  GtkDropDown   *older;
  GtkDropDown   *newer;
  GtkLabel      *diff;
} Compare;

static void
compare_free (Compare *c)
{
  g_object_unref (c->library);
  g_free (c->id);
  g_ptr_array_unref (c->history);
  g_free (c);
}

static int
picked_revision (Compare     *c,
                 GtkDropDown *dropdown)
{
  guint i = gtk_drop_down_get_selected (dropdown);

  return i < c->history->len ? ((LaminaRevisionInfo *) c->history->pdata[i])->revision : 0;
}

static void
on_compare_changed_cb (Compare *c)
{
  int a = picked_revision (c, c->older);
  int b = picked_revision (c, c->newer);
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) older = NULL;
  g_autoptr(LaminaConstruction) newer = NULL;
  g_autoptr(GPtrArray) changes = NULL;
  g_autofree char *text = NULL;

  if (a == 0 || b == 0)
    return;
  if (a == b)
    {
      gtk_label_set_text (c->diff, _("Pick two different revisions to see what changed."));
      return;
    }
  older = lamina_library_dup_construction (c->library, c->id, a, &error);
  newer = older ? lamina_library_dup_construction (c->library, c->id, b, &error) : NULL;
  if (newer == NULL)
    {
      gtk_label_set_text (c->diff, error->message);
      return;
    }
  changes = lamina_revision_diff (older, newer);
  if (changes->len == 0)
    text = g_strdup (_("No change to the build-up between these revisions (review only)"));
  else
    {
      g_ptr_array_add (changes, NULL);
      text = g_strjoinv ("\n", (char **) changes->pdata);
    }
  gtk_label_set_text (c->diff, text);
}

static GtkDropDown *
new_revision_picker (Compare    *c,
                     guint       selected,
                     const char *accessible)
{
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);
  GtkWidget *dropdown;

  for (guint i = 0; i < c->history->len; i++)
    {
      const LaminaRevisionInfo *info = c->history->pdata[i];
      g_autofree char *text = g_strdup_printf (_("Revision %d · %s"), info->revision,
                                               lamina_text_status_name (info->status));

      gtk_string_list_append (names, text);
    }
  dropdown = gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&names)), NULL);
  gtk_drop_down_set_selected (GTK_DROP_DOWN (dropdown), MIN (selected, c->history->len - 1));
  gtk_accessible_update_property (GTK_ACCESSIBLE (dropdown), GTK_ACCESSIBLE_PROPERTY_LABEL, accessible, -1);
  g_signal_connect_swapped (dropdown, "notify::selected", G_CALLBACK (on_compare_changed_cb), c);
  return GTK_DROP_DOWN (dropdown);
}

static GtkWidget *
new_compare_box (GtkWidget     *window,
                 LaminaLibrary *library,
                 const char    *id,
                 GPtrArray     *history)
{
  Compare *c = g_new0 (Compare, 1);
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  GtkWidget *line = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
  GtkWidget *title = gtk_label_new (_("Compare"));

  c->library = g_object_ref (library);
  c->id = g_strdup (id);
  c->history = g_ptr_array_ref (history);
  g_object_set_data_full (G_OBJECT (window), "lamina-compare", c, (GDestroyNotify) compare_free);
  c->older = new_revision_picker (c, 1, _("Older revision"));
  c->newer = new_revision_picker (c, 0, _("Newer revision"));
  c->diff = GTK_LABEL (gtk_label_new (NULL));
  gtk_label_set_xalign (c->diff, 0);
  gtk_label_set_wrap (c->diff, TRUE);
  gtk_label_set_selectable (c->diff, TRUE);
  gtk_widget_add_css_class (GTK_WIDGET (c->diff), "lamina-diff");
  gtk_widget_add_css_class (title, "heading");
  gtk_box_append (GTK_BOX (line), title);
  gtk_box_append (GTK_BOX (line), GTK_WIDGET (c->older));
  gtk_box_append (GTK_BOX (line), gtk_label_new ("→"));
  gtk_box_append (GTK_BOX (line), GTK_WIDGET (c->newer));
  gtk_box_append (GTK_BOX (box), line);
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (c->diff));
  g_object_set (box, "margin-start", 12, "margin-end", 12, "margin-top", 12, NULL);
  on_compare_changed_cb (c);
  return box;
}

GtkWindow *
lamina_history_window_present (GtkWindow     *parent,
                               LaminaLibrary *library,
                               const char    *id)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) history = lamina_library_dup_history (library, id, &error);
  GtkWidget *window = gtk_window_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 0);
  GtkWidget *scroller = gtk_scrolled_window_new ();
  GtkWidget *list = gtk_list_box_new ();

  gtk_window_set_title (GTK_WINDOW (window), _("Revision History"));
  gtk_window_set_transient_for (GTK_WINDOW (window), parent);
  gtk_window_set_default_size (GTK_WINDOW (window), 560, 600);
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
  if (history != NULL && history->len > 1)
    gtk_box_append (GTK_BOX (box), new_compare_box (window, library, id, history));
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), list);
  gtk_widget_set_vexpand (scroller, TRUE);
  gtk_box_append (GTK_BOX (box), scroller);
  gtk_window_set_child (GTK_WINDOW (window), box);
  gtk_window_present (GTK_WINDOW (window));
  return GTK_WINDOW (window);
}

GtkWidget *
lamina_history_window_get_field (GtkWindow  *window,
                                 const char *name)
{
  Compare *c = g_object_get_data (G_OBJECT (window), "lamina-compare");

  if (c == NULL)
    return NULL;
  if (g_str_equal (name, "older"))
    return GTK_WIDGET (c->older);
  if (g_str_equal (name, "newer"))
    return GTK_WIDGET (c->newer);
  return g_str_equal (name, "diff") ? GTK_WIDGET (c->diff) : NULL;
}
