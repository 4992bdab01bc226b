/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-settings.h"
#include "lamina-preferences-window.h"

struct _LaminaPreferencesWindow
{
  GtkWindow      parent_instance;

  /* template */
  GtkEntry      *practice_entry;
  GtkEntry      *reviewer_entry;
  GtkSpinButton *inside_spin;
  GtkSpinButton *outside_spin;
  GtkSpinButton *snap_spin;
  GtkDropDown   *style_dropdown;

  /* owned */
  GSettings     *settings;
};

G_DEFINE_FINAL_TYPE (LaminaPreferencesWindow, lamina_preferences_window, GTK_TYPE_WINDOW)

static void
lamina_preferences_window_dispose (GObject *object)
{
  LaminaPreferencesWindow *self = LAMINA_PREFERENCES_WINDOW (object);

  g_clear_object (&self->settings);
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
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);
}

static void
lamina_preferences_window_init (LaminaPreferencesWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
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
