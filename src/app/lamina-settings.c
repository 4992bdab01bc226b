/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-settings.c: finding the settings schema.  GLib aborts the
 * program when g_settings_new () names a schema it cannot find, which is
 * what an uninstalled run met; the lookup here never does. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-settings.h"

#include <gtk/gtk.h>

#define G_SETTINGS_ENABLE_BACKEND
#include <gio/gsettingsbackend.h>
#include <glib/gstdio.h>

#include "lamina-build-tree.h"

static GSettingsSchema *schema;
static GSettingsBackend *memory_backend; /* only without a schema on disk */

static GSettingsSchema *
lookup_in (GSettingsSchemaSource *source)
{
  return source ? g_settings_schema_source_lookup (source, APP_ID, TRUE) : NULL;
}

/* The copy compiled into the program, read through a file that is gone
 * once it is mapped. */
static GSettingsSchema *
lookup_built_in (void)
{
  g_autoptr(GBytes) bytes = g_resources_lookup_data ("/org/example/Lamina/schema/gschemas.compiled", 0, NULL);
  g_autoptr(GSettingsSchemaSource) source = NULL;
  g_autofree char *dir = g_dir_make_tmp ("lamina-schema-XXXXXX", NULL);
  g_autofree char *file = dir ? g_build_filename (dir, "gschemas.compiled", NULL) : NULL;

  if (bytes == NULL || dir == NULL)
    return NULL;
  if (g_file_set_contents (file, g_bytes_get_data (bytes, NULL), (gssize) g_bytes_get_size (bytes), NULL))
    source = g_settings_schema_source_new_from_directory (dir, NULL, TRUE, NULL);
  g_unlink (file);
  g_rmdir (dir);
  return lookup_in (source);
}

static GSettingsSchema *
lookup_in_directory (const char *dir)
{
  g_autoptr(GSettingsSchemaSource) source = NULL;

  if (dir == NULL || !g_file_test (dir, G_FILE_TEST_IS_DIR))
    return NULL;
  source = g_settings_schema_source_new_from_directory (dir, g_settings_schema_source_get_default (), FALSE, NULL);
  return lookup_in (source);
}

static void
find_schema (void)
{
  schema = lookup_in (g_settings_schema_source_get_default ());
  /* Run from the build folder, or installed into a prefix that is not in
   * XDG_DATA_DIRS (meson setup --prefix ~/lamina). */
  if (schema == NULL)
    schema = lookup_in_directory (lamina_get_build_schema_dir ());
  if (schema == NULL && !lamina_running_from_build_tree ())
    schema = lookup_in_directory (LAMINA_SCHEMA_DIR);
  if (schema == NULL)
    {
      schema = lookup_built_in ();
      memory_backend = g_memory_settings_backend_new ();
      g_warning ("The settings schema %s is not installed: preferences keep their defaults and "
                 "last for this session only (see README, “Installing”)", APP_ID);
    }
}

GSettings *
lamina_settings_new (void)
{
  static gsize done = 0;

  if (g_once_init_enter (&done))
    {
      find_schema ();
      g_once_init_leave (&done, 1);
    }
  g_return_val_if_fail (schema != NULL, NULL);
  return g_settings_new_full (schema, memory_backend, NULL);
}

static void
apply_style (GSettings *settings)
{
  static gboolean system_dark = -1;
  GtkSettings *gtk = gtk_settings_get_default ();
  g_autofree char *style = g_settings_get_string (settings, "style");

  if (gtk == NULL)
    return;
  /* "Follow the system" is whatever GTK had before we touched it. */
  if (system_dark == -1)
    g_object_get (gtk, "gtk-application-prefer-dark-theme", &system_dark, NULL);
  g_object_set (gtk, "gtk-application-prefer-dark-theme",
                g_str_equal (style, "dark") ? TRUE : g_str_equal (style, "light") ? FALSE : system_dark,
                NULL);
}

void
lamina_settings_follow_style (GSettings *settings)
{
  g_return_if_fail (G_IS_SETTINGS (settings));

  apply_style (settings);
  g_signal_connect (settings, "changed::style", G_CALLBACK (apply_style), NULL);
}
