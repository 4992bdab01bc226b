/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-library-row.h"

#include <glib/gi18n.h>

#include "lamina-calc.h"
#include "lamina-text.h"

struct _LaminaLibraryRow
{
  GtkBox    parent_instance;

  /* template */
  GtkLabel *code;
  GtkLabel *name;
  GtkLabel *detail;
  GtkLabel *u;
  GtkLabel *status;
};

G_DEFINE_FINAL_TYPE (LaminaLibraryRow, lamina_library_row, GTK_TYPE_BOX)

static void
set_css_class (GtkWidget  *widget,
               const char *css_class,
               gboolean    on)
{
  if (on)
    gtk_widget_add_css_class (widget, css_class);
  else
    gtk_widget_remove_css_class (widget, css_class);
}

void
lamina_library_row_set_summary (LaminaLibraryRow    *self,
                                const LaminaSummary *s)
{
  static const char *status_classes[] = { "draft", "checked", "approved" };
  char u[LAMINA_U_TEXT_SIZE];
  g_autofree char *u_text = NULL;
  g_autofree char *mm = NULL;
  g_autofree char *detail = NULL;
  g_autofree char *accessible = NULL;

  g_return_if_fail (LAMINA_IS_LIBRARY_ROW (self));
  g_return_if_fail (s != NULL);

  lamina_format_u (u, s->u_corrected);
  u_text = g_strdup_printf ("U %s", u);
  mm = lamina_text_mm (s->thickness);
  detail = g_strdup_printf ("%s · %s%s%s", lamina_text_element_name (s->element), mm,
                            (s->flags & LAMINA_SUMMARY_MATERIAL_CHANGED) ? _(" · material data changed") : "",
                            (s->flags & LAMINA_SUMMARY_MOISTURE_FAILS) ? _(" · fails its moisture check") : "");
  gtk_label_set_text (self->code, s->code ? s->code : "—");
  gtk_label_set_text (self->name, s->name);
  gtk_label_set_text (self->detail, detail);
  gtk_label_set_text (self->u, u_text);
  gtk_label_set_text (self->status, lamina_text_status_name (s->status));
  for (guint i = 0; i < G_N_ELEMENTS (status_classes); i++)
    gtk_widget_remove_css_class (GTK_WIDGET (self->status), status_classes[i]);
  gtk_widget_add_css_class (GTK_WIDGET (self->status), status_classes[s->status % 3]);
  set_css_class (GTK_WIDGET (self->u), "not-met", (s->flags & LAMINA_SUMMARY_TARGET_NOT_MET) != 0);
  set_css_class (GTK_WIDGET (self->detail), "lamina-warning",
                 (s->flags & (LAMINA_SUMMARY_MATERIAL_CHANGED | LAMINA_SUMMARY_MOISTURE_FAILS)) != 0);

  accessible = g_strdup_printf ("%s %s, %s, U %s, %s", s->code ? s->code : "", s->name,
                                detail, u, lamina_text_status_name (s->status));
  gtk_accessible_update_property (GTK_ACCESSIBLE (self), GTK_ACCESSIBLE_PROPERTY_LABEL, accessible, -1);
}

static void
lamina_library_row_class_init (LaminaLibraryRowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-library-row.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaLibraryRow, code);
  gtk_widget_class_bind_template_child (widget_class, LaminaLibraryRow, name);
  gtk_widget_class_bind_template_child (widget_class, LaminaLibraryRow, detail);
  gtk_widget_class_bind_template_child (widget_class, LaminaLibraryRow, u);
  gtk_widget_class_bind_template_child (widget_class, LaminaLibraryRow, status);
}

static void
lamina_library_row_init (LaminaLibraryRow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

GtkWidget *
lamina_library_row_new (void)
{
  return g_object_new (LAMINA_TYPE_LIBRARY_ROW, NULL);
}
