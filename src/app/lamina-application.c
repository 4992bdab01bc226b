/* SPDX-License-Identifier: GPL-3.0-or-later */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-application.h"
#include "lamina-close-keys.h"
#include "lamina-settings.h"

#include <glib/gi18n.h>
#include <stdio.h>

#include "lamina-demo.h"
#include "lamina-office-dialog.h"
#include "lamina-preferences-window.h"
#include "lamina-window.h"

struct _LaminaApplication
{
  GtkApplication  parent_instance;

  /* owned */
  char           *library_path;
  gboolean        demo;
  LaminaLibrary  *library;
  GSettings      *settings;  /* carries the style's signal */
};

G_DEFINE_FINAL_TYPE (LaminaApplication, lamina_application, GTK_TYPE_APPLICATION)

void
lamina_application_load_style (void)
{
  static gboolean loaded;
  g_autoptr(GtkCssProvider) provider = NULL;
  GdkDisplay *display = gdk_display_get_default ();

  if (loaded || display == NULL)
    return;
  loaded = TRUE;
  provider = gtk_css_provider_new ();
  gtk_css_provider_load_from_resource (provider, "/org/example/Lamina/style.css");
  gtk_style_context_add_provider_for_display (display, GTK_STYLE_PROVIDER (provider),
                                              GTK_STYLE_PROVIDER_PRIORITY_APPLICATION);
  gtk_icon_theme_add_resource_path (gtk_icon_theme_get_for_display (display),
                                    "/org/example/Lamina/icons");
}

static gboolean
is_empty (LaminaLibrary *library)
{
  LaminaLibraryQuery query;

  lamina_library_query_init (&query);
  return lamina_library_count (library, &query, NULL) == 0;
}

static void
show_error (GtkApplication *app,
            const char     *message)
{
  GtkWidget *window = gtk_application_window_new (app);
  GtkWidget *label = gtk_label_new (message);

  /* A library that cannot be opened is left untouched; say why. */
  gtk_window_set_title (GTK_WINDOW (window), _("Lamina"));
  gtk_label_set_wrap (GTK_LABEL (label), TRUE);
  gtk_label_set_selectable (GTK_LABEL (label), TRUE);
  g_object_set (label, "margin-start", 24, "margin-end", 24, "margin-top", 24, "margin-bottom", 24, NULL);
  gtk_window_set_child (GTK_WINDOW (window), label);
  gtk_window_set_default_size (GTK_WINDOW (window), 480, 160);
  gtk_window_present (GTK_WINDOW (window));
}

/* Benchmark hook (build-aux/bench, DEVELOPERS.md "Performance"): with
 * LAMINA_BENCH_FIRST_FRAME set, print the monotonic time of the main
 * window's first painted frame.  The app keeps running (build-aux/bench
 * reads its resident memory two seconds later) unless the variable is
 * "quit". */
static void
on_first_frame_cb (GdkFrameClock *clock,
                   gpointer       data)
{
  GApplication *application = data;

  g_signal_handlers_disconnect_by_func (clock, on_first_frame_cb, data);
  g_print ("lamina-first-frame-monotonic-us: %" G_GINT64_FORMAT "\n", g_get_monotonic_time ());
  fflush (stdout);
  if (g_strcmp0 (g_getenv ("LAMINA_BENCH_FIRST_FRAME"), "quit") == 0)
    g_application_quit (application);
}

static void
watch_first_frame (LaminaApplication *self,
                   GtkWindow         *window)
{
  GdkFrameClock *clock = gtk_widget_get_frame_clock (GTK_WIDGET (window));

  if (clock == NULL)
    {
      g_warning ("LAMINA_BENCH_FIRST_FRAME: the window has no frame clock");
      return;
    }
  g_signal_connect (clock, "after-paint", G_CALLBACK (on_first_frame_cb), self);
}

static void
lamina_application_activate (GApplication *application)
{
  LaminaApplication *self = LAMINA_APPLICATION (application);
  g_autoptr(GError) error = NULL;
  GtkWindow *window = gtk_application_get_active_window (GTK_APPLICATION (self));

  lamina_application_load_style ();
  if (window != NULL)
    {
      gtk_window_present (window);
      return;
    }
  if (self->library == NULL)
    self->library = lamina_library_open (self->library_path, LAMINA_LIBRARY_OPEN_DEFAULT, &error);
  if (self->library == NULL)
    {
      show_error (GTK_APPLICATION (self), error->message);
      return;
    }
  /* Invented demo data goes into a library only when asked for (--demo
   * or the button on an empty library), never into an office's own file
   * by surprise. */
  if (self->demo && is_empty (self->library) &&
      !lamina_demo_load (self->library, &error))
    g_warning ("Demo library: %s", error->message);
  window = GTK_WINDOW (lamina_window_new (GTK_APPLICATION (self), self->library));
  gtk_window_present (window);
  if (g_getenv ("LAMINA_BENCH_FIRST_FRAME") != NULL)
    watch_first_frame (self, window);
}

static int
lamina_application_handle_local_options (GApplication *application,
                                         GVariantDict *options)
{
  LaminaApplication *self = LAMINA_APPLICATION (application);
  const char *path = NULL;

  if (g_variant_dict_lookup (options, "library", "^&ay", &path))
    {
      g_free (self->library_path);
      self->library_path = g_strdup (path);
      /* Another library than the default: its own instance. */
      g_application_set_flags (application,
                               g_application_get_flags (application) | G_APPLICATION_NON_UNIQUE);
    }
  if (g_variant_dict_contains (options, "demo"))
    self->demo = TRUE;
  return -1;
}

static void
preferences_action (GSimpleAction *action,
                    GVariant      *parameter,
                    gpointer       data)
{
  GtkApplication *app = data;
  GtkWindow *parent = gtk_application_get_active_window (app);
  GtkWindow *preferences = lamina_preferences_window_new (parent);

  /* The settings kept in the library are those of the window's library. */
  if (LAMINA_IS_WINDOW (parent))
    lamina_preferences_window_set_library (LAMINA_PREFERENCES_WINDOW (preferences),
                                           lamina_window_get_library (LAMINA_WINDOW (parent)));
  gtk_window_present (preferences);
}

static void
about_action (GSimpleAction *action,
              GVariant      *parameter,
              gpointer       data)
{
  GtkApplication *app = data;
  const char *authors[] = { _("The Lamina developers"), NULL };

  gtk_show_about_dialog (gtk_application_get_active_window (app),
                         "program-name", _("Lamina"),
                         "logo-icon-name", APP_ID,
                         "version", PACKAGE_VERSION,
                         "comments", _("Thermal transmittance of building elements by EN ISO 6946, "
                                       "with an office library of build-ups.\n\n"
                                       "Results hold for the stated conditions only: check them against "
                                       "local codes, product data and licensed professional practice."),
                         "license-type", GTK_LICENSE_GPL_3_0,
                         "authors", authors,
                         NULL);
}

static void
quit_action (GSimpleAction *action,
             GVariant      *parameter,
             gpointer       data)
{
  GtkApplication *app = data;
  GList *windows = gtk_application_get_windows (app);

  /* Close politely so each window commits its state. */
  for (GList *l = windows; l != NULL; )
    {
      GList *next = l->next;

      gtk_window_close (l->data);
      l = next;
    }
}

static const GActionEntry app_actions[] = {
  { "preferences", preferences_action, NULL, NULL, NULL },
  { "about", about_action, NULL, NULL, NULL },
  { "quit", quit_action, NULL, NULL, NULL },
};

static void
lamina_application_startup (GApplication *application)
{
  static const char *quit_accels[] = { "<Control>q", NULL };
  static const char *prefs_accels[] = { "<Control>comma", NULL };

  G_APPLICATION_CLASS (lamina_application_parent_class)->startup (application);

  g_action_map_add_action_entries (G_ACTION_MAP (application), app_actions,
                                   G_N_ELEMENTS (app_actions), application);
  gtk_application_set_accels_for_action (GTK_APPLICATION (application), "app.quit", quit_accels);
  gtk_application_set_accels_for_action (GTK_APPLICATION (application), "app.preferences", prefs_accels);
  lamina_office_install_actions (GTK_APPLICATION (application));
  gtk_window_set_default_icon_name (APP_ID);
  lamina_close_keys_install ();
  LAMINA_APPLICATION (application)->settings = lamina_settings_new ();
  lamina_settings_follow_style (LAMINA_APPLICATION (application)->settings);
}

static void
lamina_application_finalize (GObject *object)
{
  LaminaApplication *self = LAMINA_APPLICATION (object);

  g_clear_object (&self->library);
  g_clear_object (&self->settings);
  g_clear_pointer (&self->library_path, g_free);

  G_OBJECT_CLASS (lamina_application_parent_class)->finalize (object);
}

static void
lamina_application_class_init (LaminaApplicationClass *klass)
{
  GApplicationClass *app_class = G_APPLICATION_CLASS (klass);

  G_OBJECT_CLASS (klass)->finalize = lamina_application_finalize;
  app_class->activate = lamina_application_activate;
  app_class->startup = lamina_application_startup;
  app_class->handle_local_options = lamina_application_handle_local_options;
}

static void
lamina_application_init (LaminaApplication *self)
{
  static const GOptionEntry entries[] = {
    { "library", 'l', 0, G_OPTION_ARG_FILENAME, NULL,
      N_("Open the library file PATH instead of the default one"), N_("PATH") },
    { "demo", 0, 0, G_OPTION_ARG_NONE, NULL,
      N_("Fill an empty library with the demo build-ups"), NULL },
    { NULL }
  };

  g_application_add_main_option_entries (G_APPLICATION (self), entries);
  g_application_set_option_context_summary (G_APPLICATION (self),
                                            _("Calculate and keep the U-values of building elements."));
}

LaminaApplication *
lamina_application_new (void)
{
  return g_object_new (LAMINA_TYPE_APPLICATION,
                       "application-id", APP_ID,
                       "resource-base-path", "/org/example/Lamina",
                       NULL);
}
