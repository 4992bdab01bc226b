/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-progress-window-private.h"

G_DEFINE_FINAL_TYPE (LaminaProgressWindow, lamina_progress_window, GTK_TYPE_WINDOW)

static void
on_cancel_clicked_cb (LaminaProgressWindow *self)
{
  if (self->cancellable != NULL)
    g_cancellable_cancel (self->cancellable);
}

static void
lamina_progress_window_dispose (GObject *object)
{
  LaminaProgressWindow *self = LAMINA_PROGRESS_WINDOW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_PROGRESS_WINDOW);
  g_clear_object (&self->cancellable);
  G_OBJECT_CLASS (lamina_progress_window_parent_class)->dispose (object);
}

static void
lamina_progress_window_class_init (LaminaProgressWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_progress_window_dispose;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-progress-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaProgressWindow, label);
  gtk_widget_class_bind_template_child (widget_class, LaminaProgressWindow, bar);
  gtk_widget_class_bind_template_child (widget_class, LaminaProgressWindow, cancel);
  gtk_widget_class_bind_template_callback (widget_class, on_cancel_clicked_cb);
}

static void
lamina_progress_window_init (LaminaProgressWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaProgressWindow *
lamina_progress_window_new (GtkWindow    *parent,
                            const char   *title,
                            GCancellable *cancellable)
{
  LaminaProgressWindow *self;

  g_return_val_if_fail (parent == NULL || GTK_IS_WINDOW (parent), NULL);
  g_return_val_if_fail (cancellable == NULL || G_IS_CANCELLABLE (cancellable), NULL);

  self = g_object_new (LAMINA_TYPE_PROGRESS_WINDOW, "title", title, "transient-for", parent, NULL);
  g_set_object (&self->cancellable, cancellable);
  return self;
}

GtkProgressBar *
lamina_progress_window_get_bar (LaminaProgressWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_PROGRESS_WINDOW (self), NULL);
  return self->bar;
}

void
lamina_progress_window_set_text (LaminaProgressWindow *self,
                                 const char           *text)
{
  g_return_if_fail (LAMINA_IS_PROGRESS_WINDOW (self));
  gtk_label_set_text (self->label, text != NULL ? text : "");
  gtk_widget_set_visible (GTK_WIDGET (self->label), text != NULL && *text != '\0');
}
