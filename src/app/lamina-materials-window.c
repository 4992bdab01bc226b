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

/* The number fields beyond λ: blank means "not known" (NAN). */
static const struct
{
  const char        *key;
  LaminaNumberField  field;
  gsize              offset;
  int                decimals;
  int                width;
  const char        *label;      /* shown before the entry */
  const char        *accessible;
} numbers[] = {
  { "density", LAMINA_FIELD_DENSITY, G_STRUCT_OFFSET (LaminaMaterial, density), 0, 5, "ρ", N_("Density ρ in kg/m³") },
  { "heat", LAMINA_FIELD_SPECIFIC_HEAT, G_STRUCT_OFFSET (LaminaMaterial, specific_heat), 0, 5, "c", N_("Specific heat capacity c in J/(kg·K)") },
  { "mu", LAMINA_FIELD_VAPOUR_RESISTANCE, G_STRUCT_OFFSET (LaminaMaterial, vapour_resistance_factor), 0, 6, "μ", N_("Water vapour resistance factor μ") },
  { "emissivity", LAMINA_FIELD_EMISSIVITY, G_STRUCT_OFFSET (LaminaMaterial, emissivity), 2, 4, "ε", N_("Emissivity ε of the surface") },
};

static void
show_row_error (GtkWidget  *row,
                const char *message)
{
  GtkLabel *error = g_object_get_data (G_OBJECT (row), "error");

  gtk_label_set_text (error, message ? message : "");
  gtk_widget_set_visible (GTK_WIDGET (error), message != NULL);
}

static gboolean
read_number (GtkWidget          *row,
             const char         *key,
             LaminaNumberField   field,
             gboolean            optional,
             double             *value)
{
  GtkWidget *entry = g_object_get_data (G_OBJECT (row), key);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));
  g_autoptr(GError) error = NULL;

  gtk_widget_remove_css_class (entry, "error");
  if (optional && lamina_text_is_blank (text))
    {
      *value = NAN;
      return TRUE;
    }
  if (lamina_number_parse (field, text, value, &error))
    return TRUE;
  /* The parser names the field and its allowed range. */
  gtk_widget_add_css_class (entry, "error");
  show_row_error (row, error->message);
  gtk_widget_grab_focus (entry);
  return FALSE;
}

static void
on_save_clicked_cb (GtkButton *button,
                    Manager   *m)
{
  GtkWidget *row = gtk_widget_get_ancestor (GTK_WIDGET (button), GTK_TYPE_LIST_BOX_ROW);
  LaminaMaterial *material = g_object_get_data (G_OBJECT (row), "lamina-material");
  GtkEditable *name = g_object_get_data (G_OBJECT (row), "name");
  GtkEditable *source = g_object_get_data (G_OBJECT (row), "source");
  GtkEditable *notes = g_object_get_data (G_OBJECT (row), "notes");
  GtkDropDown *category = g_object_get_data (G_OBJECT (row), "category");
  g_autoptr(LaminaMaterial) copy = lamina_material_copy (material);
  g_autoptr(GError) error = NULL;
  g_autofree char *saved = NULL;

  if (!read_number (row, "lambda", LAMINA_FIELD_CONDUCTIVITY, FALSE, &copy->conductivity))
    return;
  for (guint i = 0; i < G_N_ELEMENTS (numbers); i++)
    if (!read_number (row, numbers[i].key, numbers[i].field, TRUE,
                      &G_STRUCT_MEMBER (double, copy, numbers[i].offset)))
      return;
  if (lamina_text_is_blank (gtk_editable_get_text (name)))
    {
      show_row_error (row, _("Name: a material needs a name"));
      return;
    }
  g_free (copy->name);
  copy->name = g_strstrip (g_strdup (gtk_editable_get_text (name)));
  copy->category = (LaminaCategory) gtk_drop_down_get_selected (category);
  g_free (copy->source);
  copy->source = lamina_text_is_blank (gtk_editable_get_text (source)) ? NULL : g_strdup (gtk_editable_get_text (source));
  g_free (copy->notes);
  copy->notes = lamina_text_is_blank (gtk_editable_get_text (notes)) ? NULL : g_strdup (gtk_editable_get_text (notes));
  if (!lamina_library_put_material (m->library, copy, &error))
    {
      show_row_error (row, error->message);
      return;
    }
  saved = g_strdup_printf (_("Saved “%s”. Constructions that use it are flagged “material data changed” for re-checking."),
                           copy->name);
  gtk_label_set_text (m->status, saved);
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
new_number_entry (GtkWidget  *row,
                  GtkWidget  *box,
                  const char *key,
                  const char *symbol,
                  double      value,
                  int         decimals,
                  int         width,
                  const char *accessible)
{
  g_autofree char *text = isnan (value) ? g_strdup ("") : lamina_text_number (value, decimals);
  GtkWidget *label = gtk_label_new (symbol);
  GtkWidget *entry = new_entry (text, width, accessible);

  gtk_entry_set_input_purpose (GTK_ENTRY (entry), GTK_INPUT_PURPOSE_NUMBER);
  gtk_entry_set_placeholder_text (GTK_ENTRY (entry), "–");
  gtk_widget_set_tooltip_text (entry, accessible);
  gtk_widget_add_css_class (label, "dim-label");
  gtk_box_append (GTK_BOX (box), label);
  gtk_box_append (GTK_BOX (box), entry);
  g_object_set_data (G_OBJECT (row), key, entry);
  return entry;
}

static GtkWidget *
new_category_dropdown (LaminaCategory category)
{
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);
  GtkWidget *dropdown;

  for (guint i = 0; i < LAMINA_N_CATEGORIES; i++)
    gtk_string_list_append (names, lamina_text_category_name ((LaminaCategory) i));
  dropdown = gtk_drop_down_new (G_LIST_MODEL (g_steal_pointer (&names)), NULL);
  gtk_drop_down_set_selected (GTK_DROP_DOWN (dropdown), (guint) category);
  gtk_accessible_update_property (GTK_ACCESSIBLE (dropdown), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Category"), -1);
  return dropdown;
}

static GtkWidget *
new_material_row (Manager        *m,
                  LaminaMaterial *material)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 4);
  GtkWidget *top = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkWidget *bottom = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkWidget *name = new_entry (material->name, 24, _("Material name"));
  GtkWidget *category = new_category_dropdown (material->category);
  GtkWidget *source = new_entry (material->source, 14, _("Source of the values"));
  GtkWidget *notes = new_entry (material->notes, 14, _("Notes on the material"));
  GtkWidget *save = gtk_button_new_from_icon_name ("document-save-symbolic");
  GtkWidget *error = gtk_label_new (NULL);

  gtk_widget_set_hexpand (name, TRUE);
  gtk_widget_set_hexpand (notes, TRUE);
  gtk_entry_set_placeholder_text (GTK_ENTRY (source), _("Source"));
  gtk_entry_set_placeholder_text (GTK_ENTRY (notes), _("Notes"));
  gtk_widget_set_tooltip_text (save, _("Save Material"));
  gtk_accessible_update_property (GTK_ACCESSIBLE (save), GTK_ACCESSIBLE_PROPERTY_LABEL, _("Save material"), -1);
  gtk_label_set_xalign (GTK_LABEL (error), 0);
  gtk_label_set_wrap (GTK_LABEL (error), TRUE);
  gtk_widget_add_css_class (error, "lamina-error");
  gtk_widget_add_css_class (error, "caption");
  gtk_widget_set_visible (error, FALSE);
  g_object_set (box, "margin-start", 8, "margin-end", 8, "margin-top", 6, "margin-bottom", 6, NULL);
  gtk_box_append (GTK_BOX (top), category);
  gtk_box_append (GTK_BOX (top), name);
  new_number_entry (row, top, "lambda", "λ", material->conductivity, 3, 6, _("Thermal conductivity λ in W/(m·K)"));
  gtk_box_append (GTK_BOX (top), save);
  for (guint i = 0; i < G_N_ELEMENTS (numbers); i++)
    new_number_entry (row, bottom, numbers[i].key, numbers[i].label,
                      G_STRUCT_MEMBER (double, material, numbers[i].offset),
                      numbers[i].decimals, numbers[i].width, _(numbers[i].accessible));
  gtk_box_append (GTK_BOX (bottom), source);
  gtk_box_append (GTK_BOX (bottom), notes);
  gtk_box_append (GTK_BOX (box), top);
  gtk_box_append (GTK_BOX (box), bottom);
  gtk_box_append (GTK_BOX (box), error);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
  gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), FALSE);
  g_object_set_data_full (G_OBJECT (row), "lamina-material", material, (GDestroyNotify) lamina_material_free);
  g_object_set_data (G_OBJECT (row), "name", name);
  g_object_set_data (G_OBJECT (row), "category", category);
  g_object_set_data (G_OBJECT (row), "source", source);
  g_object_set_data (G_OBJECT (row), "notes", notes);
  g_object_set_data (G_OBJECT (row), "error", error);
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

GtkWindow *
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
  return GTK_WINDOW (m->window);
}

GtkWidget *
lamina_materials_window_get_field (GtkWindow  *window,
                                   guint       index,
                                   const char *name)
{
  Manager *m = g_object_get_data (G_OBJECT (window), "lamina-manager");
  GtkListBoxRow *row = m ? gtk_list_box_get_row_at_index (m->list, (int) index) : NULL;

  if (row == NULL)
    return NULL;
  if (g_str_equal (name, "save"))
    return gtk_widget_get_last_child (gtk_widget_get_first_child (gtk_widget_get_first_child (GTK_WIDGET (row))));
  return g_object_get_data (G_OBJECT (row), name);
}
