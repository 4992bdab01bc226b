/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-history-window-private.h"

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

G_DEFINE_FINAL_TYPE (LaminaHistoryWindow, lamina_history_window, GTK_TYPE_WINDOW)

static int
picked_revision (LaminaHistoryWindow *self,
                 GtkDropDown         *dropdown)
{
  guint i = gtk_drop_down_get_selected (dropdown);

  return i < self->history->len ? ((LaminaRevisionInfo *) self->history->pdata[i])->revision : 0;
}

/* Comparing any two revisions: the sentences between the two picked. */
static void
on_compare_changed_cb (LaminaHistoryWindow *self)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaConstruction) older = NULL;
  g_autoptr(LaminaConstruction) newer = NULL;
  g_autoptr(GPtrArray) changes = NULL;
  g_autofree char *text = NULL;
  int a, b;

  if (self->history == NULL || self->history->len < 2)
    return;
  a = picked_revision (self, self->older);
  b = picked_revision (self, self->newer);
  if (a == 0 || b == 0)
    return;
  if (a == b)
    {
      gtk_label_set_text (self->diff, _("Pick two different revisions to see what changed."));
      return;
    }
  older = lamina_library_dup_construction (self->library, self->id, a, &error);
  newer = older ? lamina_library_dup_construction (self->library, self->id, b, &error) : NULL;
  if (newer == NULL)
    {
      gtk_label_set_text (self->diff, error->message);
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
  gtk_label_set_text (self->diff, text);
}

static void
set_up_compare (LaminaHistoryWindow *self)
{
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);

  for (guint i = 0; i < self->history->len; i++)
    {
      const LaminaRevisionInfo *info = self->history->pdata[i];
      g_autofree char *text = g_strdup_printf (_("Revision %d · %s"), info->revision,
                                               lamina_text_status_name (info->status));

      gtk_string_list_append (names, text);
    }
  gtk_drop_down_set_model (self->older, G_LIST_MODEL (names));
  gtk_drop_down_set_model (self->newer, G_LIST_MODEL (names));
  gtk_drop_down_set_selected (self->older, 1);
  gtk_drop_down_set_selected (self->newer, 0);
  gtk_widget_set_visible (self->compare_box, TRUE);
  on_compare_changed_cb (self);
}

static void
lamina_history_window_dispose (GObject *object)
{
  LaminaHistoryWindow *self = LAMINA_HISTORY_WINDOW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_HISTORY_WINDOW);
  g_clear_object (&self->library);
  g_clear_pointer (&self->id, g_free);
  g_clear_pointer (&self->history, g_ptr_array_unref);

  G_OBJECT_CLASS (lamina_history_window_parent_class)->dispose (object);
}

static void
lamina_history_window_class_init (LaminaHistoryWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_history_window_dispose;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-history-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaHistoryWindow, compare_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaHistoryWindow, older);
  gtk_widget_class_bind_template_child (widget_class, LaminaHistoryWindow, newer);
  gtk_widget_class_bind_template_child (widget_class, LaminaHistoryWindow, diff);
  gtk_widget_class_bind_template_child (widget_class, LaminaHistoryWindow, list);
  gtk_widget_class_bind_template_callback (widget_class, on_compare_changed_cb);
}

static void
lamina_history_window_init (LaminaHistoryWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaHistoryWindow *
lamina_history_window_new (GtkWindow     *parent,
                           LaminaLibrary *library,
                           const char    *id)
{
  g_autoptr(GError) error = NULL;
  LaminaHistoryWindow *self;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);
  g_return_val_if_fail (id != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_HISTORY_WINDOW, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  self->id = g_strdup (id);
  self->history = lamina_library_dup_history (library, id, &error);
  if (self->history == NULL)
    {
      gtk_list_box_append (self->list, gtk_label_new (error->message));
      return self;
    }
  for (guint i = 0; i < self->history->len; i++)
    gtk_list_box_append (self->list,
                         new_revision_row (library, id, self->history->pdata[i],
                                           i + 1 < self->history->len ? self->history->pdata[i + 1] : NULL));
  if (self->history->len > 1)
    set_up_compare (self);
  return self;
}

GtkWindow *
lamina_history_window_present (GtkWindow     *parent,
                               LaminaLibrary *library,
                               const char    *id)
{
  GtkWindow *window = GTK_WINDOW (lamina_history_window_new (parent, library, id));

  gtk_window_present (window);
  return window;
}
