/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-materials-window-private.h"

#include <glib/gi18n.h>

#include "lamina-material-row.h"
#include "lamina-window-work.h"

G_DEFINE_FINAL_TYPE (LaminaMaterialsWindow, lamina_materials_window, GTK_TYPE_WINDOW)

static void reload (LaminaMaterialsWindow *self);

/* Saving a material re-flags every construction that holds other data
 * for it: about a second at 100,000 constructions.  That runs in a
 * worker thread on a connection of its own (lamina-window-work.h), with a
 * pulsing bar here. */
static gboolean
save_material_work (LaminaLibrary  *library,
                    gpointer        data,
                    GCancellable   *cancellable,
                    GError        **error)
{
  return lamina_library_put_material (library, data, error);
}

static gboolean
pulse_cb (gpointer data)
{
  LaminaMaterialsWindow *self = data;

  gtk_progress_bar_pulse (self->progress);
  return G_SOURCE_CONTINUE;
}

static void
set_saving (LaminaMaterialsWindow *self,
            LaminaMaterialRow     *row)
{
  /* Focus leaves the row's fields before they turn insensitive: a text
   * field made insensitive while focused misses its focus-out (GTK warns). */
  if (row != NULL)
    gtk_root_set_focus (GTK_ROOT (self), NULL);
  g_set_object (&self->saving_row, row);
  gtk_widget_set_visible (GTK_WIDGET (self->progress), row != NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (self->list), row == NULL);
  g_clear_handle_id (&self->pulse, g_source_remove);
  if (row != NULL)
    self->pulse = g_timeout_add (100, pulse_cb, self);
}

static void
on_saved_cb (GObject      *source,
             GAsyncResult *result,
             gpointer      data)
{
  LaminaMaterialsWindow *self = LAMINA_MATERIALS_WINDOW (source);
  g_autoptr(GError) error = NULL;
  g_autofree char *saved = NULL;
  const LaminaMaterial *material = lamina_library_work_get_data (result);
  gboolean ok = lamina_library_work_finish (result, &error);

  if (self->library == NULL)   /* closed meanwhile */
    return;
  if (!ok)
    {
      if (self->saving_row != NULL)
        lamina_material_row_show_error (self->saving_row, error->message);
      set_saving (self, NULL);
      return;
    }
  set_saving (self, NULL);
  saved = g_strdup_printf (_("Saved “%s”. Constructions that use it are flagged “material data changed” for re-checking."),
                           material->name);
  gtk_label_set_text (self->status, saved);
  reload (self);
}

static void
on_row_save_cb (LaminaMaterialRow     *row,
                LaminaMaterialsWindow *self)
{
  g_autoptr(LaminaMaterial) material = lamina_material_row_dup_material (row);
  g_autofree char *saving = NULL;

  if (material == NULL || self->saving_row != NULL)
    return;
  saving = g_strdup_printf (_("Saving “%s” and checking the constructions that use it…"), material->name);
  gtk_label_set_text (self->status, saving);
  set_saving (self, row);
  lamina_library_work_run_async (self->library, save_material_work, g_steal_pointer (&material),
                                 (GDestroyNotify) lamina_material_free, self, NULL, on_saved_cb, NULL);
}

gboolean
lamina_materials_window_is_saving (LaminaMaterialsWindow *self)
{
  g_return_val_if_fail (LAMINA_IS_MATERIALS_WINDOW (self), FALSE);
  return self->saving_row != NULL;
}

static void
reload (LaminaMaterialsWindow *self)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) materials = lamina_library_list_materials (self->library, &error);
  GtkWidget *child;

  /* gtk_list_box_remove_all is GTK 4.12. */
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->list))) != NULL)
    gtk_list_box_remove (self->list, child);
  if (materials == NULL)
    {
      gtk_label_set_text (self->status, error->message);
      return;
    }
  for (guint i = 0; i < materials->len; i++)
    {
      LaminaMaterialRow *row = lamina_material_row_new (materials->pdata[i]);

      g_signal_connect_object (row, "save", G_CALLBACK (on_row_save_cb), self, 0);
      gtk_list_box_append (self->list, GTK_WIDGET (row));
    }
}

static void
on_add_clicked_cb (LaminaMaterialsWindow *self)
{
  g_autoptr(LaminaMaterial) material = lamina_material_new (NULL, _("New material"),
                                                            LAMINA_CATEGORY_OTHER, 0.1);
  g_autoptr(GError) error = NULL;

  if (!lamina_library_put_material (self->library, material, &error))
    gtk_label_set_text (self->status, error->message);
  reload (self);
}

static void
lamina_materials_window_dispose (GObject *object)
{
  LaminaMaterialsWindow *self = LAMINA_MATERIALS_WINDOW (object);

  g_clear_handle_id (&self->pulse, g_source_remove);
  g_clear_object (&self->saving_row);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_MATERIALS_WINDOW);
  g_clear_object (&self->library);

  G_OBJECT_CLASS (lamina_materials_window_parent_class)->dispose (object);
}

static void
lamina_materials_window_class_init (LaminaMaterialsWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_materials_window_dispose;

  g_type_ensure (LAMINA_TYPE_MATERIAL_ROW);
  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-materials-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialsWindow, list);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialsWindow, status);
  gtk_widget_class_bind_template_child (widget_class, LaminaMaterialsWindow, progress);
  gtk_widget_class_bind_template_callback (widget_class, on_add_clicked_cb);
}

static void
lamina_materials_window_init (LaminaMaterialsWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}

LaminaMaterialsWindow *
lamina_materials_window_new (GtkWindow     *parent,
                             LaminaLibrary *library)
{
  LaminaMaterialsWindow *self;

  g_return_val_if_fail (LAMINA_IS_LIBRARY (library), NULL);

  self = g_object_new (LAMINA_TYPE_MATERIALS_WINDOW, "transient-for", parent, NULL);
  self->library = g_object_ref (library);
  reload (self);
  return self;
}

GtkWindow *
lamina_materials_window_present (GtkWindow     *parent,
                                 LaminaLibrary *library)
{
  GtkWindow *window = GTK_WINDOW (lamina_materials_window_new (parent, library));

  gtk_window_present (window);
  return window;
}
