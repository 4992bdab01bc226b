/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-work-progress.c: see lamina-work-progress.h. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-work-progress.h"

#include <glib/gi18n.h>

struct _LaminaWorkProgress
{
  GtkWindow      *window;    /* a reference */
  GtkLabel       *label;
  GtkProgressBar *bar;
  GtkWidget      *cancel;
};

LaminaWorkProgress *
lamina_work_progress_new (GtkWindow    *parent,
                          const char   *title,
                          const char   *text,
                          GCancellable *cancellable)
{
  LaminaWorkProgress *self = g_new0 (LaminaWorkProgress, 1);
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 12);

  self->window = g_object_ref_sink (GTK_WINDOW (gtk_window_new ()));
  gtk_window_set_title (self->window, title);
  gtk_window_set_transient_for (self->window, parent);
  gtk_window_set_modal (self->window, TRUE);
  gtk_window_set_deletable (self->window, FALSE);
  gtk_window_set_default_size (self->window, 420, -1);
  g_object_set (box, "margin-start", 18, "margin-end", 18, "margin-top", 18, "margin-bottom", 18, NULL);
  self->label = GTK_LABEL (gtk_label_new (text));
  gtk_label_set_wrap (self->label, TRUE);
  gtk_label_set_xalign (self->label, 0);
  self->bar = GTK_PROGRESS_BAR (gtk_progress_bar_new ());
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->bar), GTK_ACCESSIBLE_PROPERTY_LABEL, title, -1);
  self->cancel = gtk_button_new_with_mnemonic (_("_Cancel"));
  gtk_widget_set_halign (self->cancel, GTK_ALIGN_END);
  g_signal_connect_object (self->cancel, "clicked", G_CALLBACK (g_cancellable_cancel), cancellable,
                           G_CONNECT_SWAPPED);
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->label));
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (self->bar));
  gtk_box_append (GTK_BOX (box), self->cancel);
  gtk_window_set_child (self->window, box);
  gtk_window_present (self->window);
  return self;
}

void
lamina_work_progress_set_text (LaminaWorkProgress *self,
                               const char         *text)
{
  gtk_label_set_text (self->label, text);
}

void
lamina_work_progress_set_fraction (LaminaWorkProgress *self,
                                   double              fraction)
{
  if (fraction < 0)
    gtk_progress_bar_pulse (self->bar);
  else
    gtk_progress_bar_set_fraction (self->bar, CLAMP (fraction, 0, 1));
}

void
lamina_work_progress_set_can_cancel (LaminaWorkProgress *self,
                                     gboolean            can_cancel)
{
  gtk_widget_set_sensitive (self->cancel, can_cancel);
}

void
lamina_work_progress_free (LaminaWorkProgress *self)
{
  gtk_window_destroy (self->window);
  g_object_unref (self->window);
  g_free (self);
}
