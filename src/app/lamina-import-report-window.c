/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-import-report-window-private.h"

G_DEFINE_FINAL_TYPE (LaminaImportReportWindow, lamina_import_report_window, GTK_TYPE_WINDOW)

static void
lamina_import_report_window_dispose (GObject *object)
{
  gtk_widget_dispose_template (GTK_WIDGET (object), LAMINA_TYPE_IMPORT_REPORT_WINDOW);
  G_OBJECT_CLASS (lamina_import_report_window_parent_class)->dispose (object);
}

static void
lamina_import_report_window_class_init (LaminaImportReportWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_import_report_window_dispose;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-import-report-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaImportReportWindow, box);
  gtk_widget_class_bind_template_child (widget_class, LaminaImportReportWindow, summary);
}

static void
lamina_import_report_window_init (LaminaImportReportWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaImportReportWindow *
lamina_import_report_window_new (GtkWindow                *parent,
                                 const LaminaImportReport *report)
{
  LaminaImportReportWindow *self;
  g_autofree char *summary = NULL;

  g_return_val_if_fail (parent == NULL || GTK_IS_WINDOW (parent), NULL);
  g_return_val_if_fail (report != NULL, NULL);

  self = g_object_new (LAMINA_TYPE_IMPORT_REPORT_WINDOW, "transient-for", parent, NULL);
  summary = lamina_import_report_dup_summary (report);
  gtk_label_set_text (self->summary, summary);
  for (guint i = 0; i < report->items->len; i++)
    {
      const LaminaImportItem *item = g_ptr_array_index (report->items, i);
      GtkWidget *label = gtk_label_new (item->message ? item->message : item->name);

      gtk_label_set_wrap (GTK_LABEL (label), TRUE);
      gtk_label_set_xalign (GTK_LABEL (label), 0);
      if (item->action == LAMINA_IMPORT_CONFLICT)
        gtk_widget_add_css_class (label, "lamina-warning");
      gtk_box_append (self->box, label);
    }
  return self;
}
