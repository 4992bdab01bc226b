/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-material-chooser-private.h"

#include <glib/gi18n.h>

#include "lamina-text.h"

enum
{
  PICKED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

G_DEFINE_FINAL_TYPE (LaminaMaterialChooser, lamina_material_chooser, GTK_TYPE_WIDGET)

static void
setup_row_cb (GtkSignalListItemFactory *factory,
              GtkListItem              *item)
{
  GtkWidget *label = gtk_label_new (NULL);

  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  gtk_list_item_set_child (item, label);
}

static void
bind_row_cb (GtkSignalListItemFactory *factory,
             GtkListItem              *item)
{
  GtkStringObject *text = gtk_list_item_get_item (item);
  GtkWidget *label = gtk_list_item_get_child (item);

  gtk_label_set_text (GTK_LABEL (label), gtk_string_object_get_string (text));
  gtk_widget_set_tooltip_text (label, gtk_string_object_get_string (text));
}

static void
on_search_changed_cb (LaminaMaterialChooser *self)
{
  gtk_string_filter_set_search (self->filter, gtk_editable_get_text (GTK_EDITABLE (self->search)));
}

static void
on_picked_cb (LaminaMaterialChooser *self)
{
  g_signal_emit (self, signals[PICKED], 0);
}

static void
lamina_material_chooser_dispose (GObject *object)
{
  LaminaMaterialChooser *self = LAMINA_MATERIAL_CHOOSER (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_MATERIAL_CHOOSER);
  g_clear_pointer (&self->materials, g_ptr_array_unref);
  G_OBJECT_CLASS (lamina_material_chooser_parent_class)->dispose (object);
}

static void
lamina_material_chooser_class_init (LaminaMaterialChooserClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_material_chooser_dispose;
  signals[PICKED] = g_signal_new ("picked", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                                  NULL, NULL, NULL, G_TYPE_NONE, 0);
  gtk_widget_class_set_layout_manager_type (widget_class, GTK_TYPE_BIN_LAYOUT);
  gtk_widget_class_set_css_name (widget_class, "lamina-material-chooser");
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-material-chooser.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialChooser, box);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialChooser, search);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialChooser, list);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialChooser, names);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialChooser, filter);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialChooser, selection);
  gtk_widget_class_bind_template_callback (widget_class, setup_row_cb);
  gtk_widget_class_bind_template_callback (widget_class, bind_row_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_search_changed_cb);
  gtk_widget_class_bind_template_callback (widget_class, on_picked_cb);
}

static void
lamina_material_chooser_init (LaminaMaterialChooser *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->materials = g_ptr_array_new ();
}

void
lamina_material_chooser_set_materials (LaminaMaterialChooser *self,
                                       GPtrArray             *materials,
                                       LaminaCategory         prefer,
                                       const char            *current_id)
{
  guint preferred = GTK_INVALID_LIST_POSITION, current = GTK_INVALID_LIST_POSITION;
  guint selected;

  g_return_if_fail (LAMINA_IS_MATERIAL_CHOOSER (self));

  g_clear_pointer (&self->materials, g_ptr_array_unref);
  self->materials = materials != NULL ? materials : g_ptr_array_new ();
  gtk_string_list_splice (self->names, 0, g_list_model_get_n_items (G_LIST_MODEL (self->names)), NULL);
  for (guint i = 0; i < self->materials->len; i++)
    {
      const LaminaMaterial *material = g_ptr_array_index (self->materials, i);
      g_autofree char *lambda = lamina_text_number (material->conductivity, 3);
      g_autofree char *text = g_strdup_printf ("%s (λ %s)", material->name, lambda);

      gtk_string_list_append (self->names, text);
      if (material->category == prefer && preferred == GTK_INVALID_LIST_POSITION)
        preferred = i;
      if (current_id != NULL && g_strcmp0 (material->id, current_id) == 0)
        current = i;
    }
  gtk_single_selection_set_selected (self->selection, current != GTK_INVALID_LIST_POSITION ? current
                                                      : preferred != GTK_INVALID_LIST_POSITION ? preferred : 0);
  /* The selected material in view once the list has its size. */
  selected = gtk_single_selection_get_selected (self->selection);
  if (selected != GTK_INVALID_LIST_POSITION)
    gtk_widget_activate_action (GTK_WIDGET (self->list), "list.scroll-to-item", "u", selected);
  gtk_widget_grab_focus (GTK_WIDGET (self->search));
}

const LaminaMaterial *
lamina_material_chooser_get_material (LaminaMaterialChooser *self)
{
  GObject *picked;

  g_return_val_if_fail (LAMINA_IS_MATERIAL_CHOOSER (self), NULL);

  /* The filter shows a subset of the names: the picked item is found
   * among all of them. */
  picked = gtk_single_selection_get_selected_item (self->selection);
  for (guint i = 0; picked != NULL && i < self->materials->len; i++)
    {
      g_autoptr(GObject) item = g_list_model_get_item (G_LIST_MODEL (self->names), i);

      if (item == picked)
        return g_ptr_array_index (self->materials, i);
    }
  return NULL;
}
