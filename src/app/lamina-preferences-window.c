/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-settings.h"
#include "lamina-preferences-window-private.h"

#include <glib/gi18n.h>
#include <math.h>

#include "lamina-moisture.h"
#include "lamina-number.h"
#include "store/lamina-library-safety.h"
#include "lamina-text.h"


G_DEFINE_FINAL_TYPE (LaminaPreferencesWindow, lamina_preferences_window, GTK_TYPE_WINDOW)

static void
lamina_preferences_window_dispose (GObject *object)
{
  LaminaPreferencesWindow *self = LAMINA_PREFERENCES_WINDOW (object);

  g_clear_object (&self->settings);
  g_clear_object (&self->library);
  g_clear_pointer (&self->limit_note_text, g_free);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_PREFERENCES_WINDOW);

  G_OBJECT_CLASS (lamina_preferences_window_parent_class)->dispose (object);
}

static const char *const style_names[] = { "system", "light", "dark" };

static gboolean
style_to_selected (GValue   *value,
                   GVariant *variant,
                   gpointer  user_data)
{
  const char *name = g_variant_get_string (variant, NULL);

  for (guint i = 0; i < G_N_ELEMENTS (style_names); i++)
    if (g_str_equal (name, style_names[i]))
      {
        g_value_set_uint (value, i);
        return TRUE;
      }
  return FALSE;
}

static GVariant *
selected_to_style (const GValue       *value,
                   const GVariantType *type,
                   gpointer            user_data)
{
  guint i = g_value_get_uint (value);

  return g_variant_new_string (style_names[i < G_N_ELEMENTS (style_names) ? i : 0]);
}

/* The office's moisture limit (EN ISO 13788) is the library's, not this
 * user's: it is applied on request, since it recalculates the flags of
 * every construction. */
static gboolean
read_limit (LaminaPreferencesWindow  *self,
            double                   *limit,
            GError                  **error)
{
  return lamina_number_parse (LAMINA_FIELD_MOISTURE_LIMIT, gtk_editable_get_text (GTK_EDITABLE (self->limit_entry)),
                              limit, error);
}

static void
show_limit_message (LaminaPreferencesWindow *self,
                    const char              *message)
{
  gtk_label_set_text (self->limit_note, message ? message : self->limit_note_text);
  if (message != NULL)
    gtk_widget_add_css_class (GTK_WIDGET (self->limit_note), "lamina-error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (self->limit_note), "lamina-error");
}

static void
on_limit_changed_cb (LaminaPreferencesWindow *self)
{
  g_autoptr(GError) error = NULL;
  double limit = NAN;
  gboolean ok = read_limit (self, &limit, &error);

  gtk_widget_set_sensitive (self->limit_apply,
                            ok && limit != lamina_library_get_moisture_limit (self->library)
                            && !lamina_library_is_read_only (self->library));
  show_limit_message (self, ok ? NULL : error->message);
}

static void
on_limit_apply_cb (LaminaPreferencesWindow *self)
{
  g_autoptr(GError) error = NULL;
  double limit = NAN;

  if (!read_limit (self, &limit, &error) || !lamina_library_set_moisture_limit (self->library, limit, &error))
    {
      show_limit_message (self, error->message);
      return;
    }
  on_limit_changed_cb (self);
}

void
lamina_preferences_window_set_library (LaminaPreferencesWindow *self,
                                       LaminaLibrary           *library)
{
  g_autofree char *text = NULL;

  g_return_if_fail (LAMINA_IS_PREFERENCES_WINDOW (self));
  g_return_if_fail (LAMINA_IS_LIBRARY (library));

  g_set_object (&self->library, library);
  text = lamina_text_number (lamina_library_get_moisture_limit (library), 2);
  gtk_editable_set_text (GTK_EDITABLE (self->limit_entry), text);
  gtk_editable_set_editable (GTK_EDITABLE (self->limit_entry), !lamina_library_is_read_only (library));
  gtk_widget_set_visible (self->library_box, TRUE);
  on_limit_changed_cb (self);
}

void
lamina_preferences_window_apply_limit (LaminaPreferencesWindow *self)
{
  g_return_if_fail (LAMINA_IS_PREFERENCES_WINDOW (self));
  on_limit_apply_cb (self);
}

static void
lamina_preferences_window_class_init (LaminaPreferencesWindowClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = lamina_preferences_window_dispose;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-preferences-window.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, practice_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, reviewer_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, inside_spin);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, outside_spin);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, snap_spin);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, style_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, library_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, limit_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, limit_apply);
  gtk_widget_class_bind_template_child (widget_class, LaminaPreferencesWindow, limit_note);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
lamina_preferences_window_init (LaminaPreferencesWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->limit_note_text = g_strdup (gtk_label_get_text (self->limit_note));
  g_signal_connect_object (self->limit_entry, "changed", G_CALLBACK (on_limit_changed_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->limit_entry, "activate", G_CALLBACK (on_limit_apply_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->limit_apply, "clicked", G_CALLBACK (on_limit_apply_cb), self, G_CONNECT_SWAPPED);
  self->settings = lamina_settings_new ();
  g_settings_bind (self->settings, "practice-name", self->practice_entry, "text", G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (self->settings, "reviewer-name", self->reviewer_entry, "text", G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (self->settings, "inside-temperature", self->inside_spin, "value", G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (self->settings, "outside-temperature", self->outside_spin, "value", G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (self->settings, "snap-step", self->snap_spin, "value", G_SETTINGS_BIND_DEFAULT);
  g_settings_bind_with_mapping (self->settings, "style", self->style_dropdown, "selected", G_SETTINGS_BIND_DEFAULT,
                                style_to_selected, selected_to_style, NULL, NULL);
}

GtkWindow *
lamina_preferences_window_new (GtkWindow *parent)
{
  return g_object_new (LAMINA_TYPE_PREFERENCES_WINDOW, "transient-for", parent, NULL);
}
