/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-materials-window.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-number.h"
#include "lamina-text.h"

typedef struct
{
  LaminaLibrary *library;
  GtkWidget     *window;
  GtkListBox    *list;
  GtkLabel      *status;
} Manager;

static void
manager_free (Manager *m)
{
  g_object_unref (m->library);
  g_free (m);
}

static void reload (Manager *m);

static void
on_save_clicked_cb (GtkButton *button,
                    Manager   *m)
{
  GtkWidget *row = gtk_widget_get_ancestor (GTK_WIDGET (button), GTK_TYPE_LIST_BOX_ROW);
  LaminaMaterial *material = g_object_get_data (G_OBJECT (row), "lamina-material");
  GtkEditable *name = g_object_get_data (G_OBJECT (row), "name");
  GtkEditable *lambda = g_object_get_data (G_OBJECT (row), "lambda");
  GtkEditable *source = g_object_get_data (G_OBJECT (row), "source");
  g_autoptr(LaminaMaterial) copy = lamina_material_copy (material);
  g_autoptr(GError) error = NULL;
  double value;

  if (!lamina_number_parse (LAMINA_FIELD_CONDUCTIVITY, gtk_editable_get_text (lambda), &value, &error))
    {
      g_autofree char *text = g_strdup_printf ("%s: %s", material->name, error->message);

      gtk_label_set_text (m->status, text);
      gtk_widget_add_css_class (GTK_WIDGET (lambda), "error");
      return;
    }
  if (*gtk_editable_get_text (name) == '\0')
    {
      gtk_label_set_text (m->status, _("Name: a material needs a name"));
      return;
    }
  g_free (copy->name);
  copy->name = g_strdup (gtk_editable_get_text (name));
  copy->conductivity = value;
  g_free (copy->source);
  copy->source = g_strdup (gtk_editable_get_text (source));
  if (!lamina_library_put_material (m->library, copy, &error))
    {
      gtk_label_set_text (m->status, error->message);
      return;
    }
  {
    g_autofree char *text = g_strdup_printf (_("Saved “%s”. Constructions that use it are flagged for re-checking."),
                                             copy->name);

    gtk_label_set_text (m->status, text);
  }
  reload (m);
}

static GtkWidget *
new_entry (const char *text,
           int         width,
           const char *accessible)
{
  GtkWidget *entry = gtk_entry_new ();

  gtk_editable_set_text (GTK_EDITABLE (entry), text ? text : "");
  gtk_editable_set_width_chars (GTK_EDITABLE (entry), width);
  gtk_accessible_update_property (GTK_ACCESSIBLE (entry), GTK_ACCESSIBLE_PROPERTY_LABEL, accessible, -1);
  return entry;
}

static GtkWidget *
new_material_row (Manager        *m,
                  LaminaMaterial *material)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 8);
  g_autofree char *lambda = lamina_text_number (material->conductivity, 3);
  GtkWidget *name = new_entry (material->name, 24, _("Material name"));
  GtkWidget *l = new_entry (lambda, 6, _("Thermal conductivity λ"));
  GtkWidget *source = new_entry (material->source, 20, _("Source of the value"));
  GtkWidget *category = gtk_label_new (lamina_category_to_string (material->category));
  GtkWidget *save = gtk_button_new_from_icon_name ("document-save-symbolic");

  gtk_widget_set_hexpand (name, TRUE);
  gtk_widget_set_size_request (category, 90, -1);
  gtk_label_set_xalign (GTK_LABEL (category), 0);
  gtk_widget_add_css_class (category, "dim-label");
  gtk_widget_set_tooltip_text (save, _("Save Material"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (save), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Save material"), -1);
  g_object_set (box, "margin-start", 8, "margin-end", 8, "margin-top", 4, "margin-bottom", 4, NULL);
  gtk_box_append (GTK_BOX (box), category);
  gtk_box_append (GTK_BOX (box), name);
  gtk_box_append (GTK_BOX (box), gtk_label_new ("λ"));
  gtk_box_append (GTK_BOX (box), l);
  gtk_box_append (GTK_BOX (box), source);
  gtk_box_append (GTK_BOX (box), save);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
  gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), FALSE);
  g_object_set_data_full (G_OBJECT (row), "lamina-material", material, (GDestroyNotify) lamina_material_free);
  g_object_set_data (G_OBJECT (row), "name", name);
  g_object_set_data (G_OBJECT (row), "lambda", l);
  g_object_set_data (G_OBJECT (row), "source", source);
  g_signal_connect (save, "clicked", G_CALLBACK (on_save_clicked_cb), m);
  return row;
}

static void
reload (Manager *m)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) materials = lamina_library_list_materials (m->library, &error);
  GtkWidget *child;

  /* gtk_list_box_remove_all is GTK 4.12. */
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (m->list))) != NULL)
    gtk_list_box_remove (m->list, child);
  if (materials == NULL)
    {
      gtk_label_set_text (m->status, error->message);
      return;
    }
  for (guint i = 0; i < materials->len; i++)
    gtk_list_box_append (m->list, new_material_row (m, lamina_material_copy (materials->pdata[i])));
}

static void
on_add_clicked_cb (Manager *m)
{
  g_autoptr(LaminaMaterial) material = lamina_material_new (NULL, _("New material"),
                                                            LAMINA_CATEGORY_OTHER, 0.1);
  g_autoptr(GError) error = NULL;

  if (!lamina_library_put_material (m->library, material, &error))
    gtk_label_set_text (m->status, error->message);
  reload (m);
}

void
lamina_materials_window_present (GtkWindow     *parent,
                                 LaminaLibrary *library)
{
  Manager *m = g_new0 (Manager, 1);
  GtkWidget *header = gtk_header_bar_new ();
  GtkWidget *add = gtk_button_new_from_icon_name ("list-add-symbolic");
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  GtkWidget *scroller = gtk_scrolled_window_new ();

  m->library = g_object_ref (library);
  m->window = gtk_window_new ();
  m->list = GTK_LIST_BOX (gtk_list_box_new ());
  m->status = GTK_LABEL (gtk_label_new (_("λ values are design values in W/(m·K). Use the declared value of the product you specify.")));
  g_object_set_data_full (G_OBJECT (m->window), "lamina-manager", m, (GDestroyNotify) manager_free);

  gtk_window_set_title (GTK_WINDOW (m->window), _("Materials"));
  gtk_window_set_transient_for (GTK_WINDOW (m->window), parent);
  gtk_window_set_default_size (GTK_WINDOW (m->window), 760, 560);
  gtk_widget_set_tooltip_text (add, _("Add Material"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (add), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Add material"), -1);
  g_signal_connect_swapped (add, "clicked", G_CALLBACK (on_add_clicked_cb), m);
  gtk_header_bar_pack_start (GTK_HEADER_BAR (header), add);
  gtk_window_set_titlebar (GTK_WINDOW (m->window), header);

  gtk_list_box_set_selection_mode (m->list, GTK_SELECTION_NONE);
  gtk_accessible_update_property (GTK_ACCESSIBLE (m->list), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Library materials"), -1);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (scroller), GTK_WIDGET (m->list));
  gtk_widget_set_vexpand (scroller, TRUE);
  gtk_label_set_wrap (m->status, TRUE);
  gtk_label_set_xalign (m->status, 0);
  g_object_set (m->status, "margin-start", 12, "margin-end", 12, "margin-bottom", 8, NULL);
  gtk_box_append (GTK_BOX (box), scroller);
  gtk_box_append (GTK_BOX (box), GTK_WIDGET (m->status));
  gtk_window_set_child (GTK_WINDOW (m->window), box);
  reload (m);
  gtk_window_present (GTK_WINDOW (m->window));
}
