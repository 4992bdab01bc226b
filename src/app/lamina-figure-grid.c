/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-figure-grid.h"

GtkLabel *
lamina_figure_grid_attach (GtkGrid    *grid,
                           int         row,
                           const char *name,
                           const char *unit)
{
  GtkWidget *name_label = gtk_label_new (name);
  GtkWidget *value_label = gtk_label_new ("–");
  GtkWidget *unit_label = gtk_label_new (unit);

  g_return_val_if_fail (GTK_IS_GRID (grid), NULL);

  gtk_label_set_xalign (GTK_LABEL (name_label), 0);
  gtk_widget_set_hexpand (name_label, TRUE);
  gtk_label_set_wrap (GTK_LABEL (name_label), TRUE);
  gtk_label_set_wrap_mode (GTK_LABEL (name_label), PANGO_WRAP_WORD_CHAR);
  gtk_label_set_width_chars (GTK_LABEL (name_label), 12);
  gtk_label_set_xalign (GTK_LABEL (value_label), 1);
  gtk_widget_set_valign (value_label, GTK_ALIGN_START);
  gtk_label_set_selectable (GTK_LABEL (value_label), TRUE);
  gtk_widget_add_css_class (value_label, "numeric");
  gtk_label_set_xalign (GTK_LABEL (unit_label), 0);
  gtk_widget_set_valign (unit_label, GTK_ALIGN_START);
  gtk_widget_add_css_class (unit_label, "dim-label");
  gtk_accessible_update_relation (GTK_ACCESSIBLE (value_label),
                                  GTK_ACCESSIBLE_RELATION_LABELLED_BY, name_label, NULL, -1);
  gtk_grid_attach (grid, name_label, 0, row, 1, 1);
  gtk_grid_attach (grid, value_label, 1, row, 1, 1);
  gtk_grid_attach (grid, unit_label, 2, row, 1, 1);
  return GTK_LABEL (value_label);
}
