/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-office-dialog.c: opening another library (an office's on a
 * server, or a file) in a window of its own.
 *
 * Passwords: never in GSettings, never in a remembered connection string.
 * A password typed in the dialog is handed to libpq for this library's
 * connections only (lamina_library_open_with_password); with libsecret it
 * can be kept in the desktop keyring, else libpq's own sources apply
 * (~/.pgpass, the service file).
 *
 * The connection is made in a worker thread (a server that is slow or
 * does not answer would freeze the window for as long as libpq waits):
 * the dialog says "Connecting to …" meanwhile, and closing it drops the
 * connection when it comes. */
#define G_LOG_DOMAIN "lamina-app"

#include "config.h"

#include "lamina-office-dialog-private.h"

#include <glib/gi18n.h>
#include <string.h>

#ifdef HAVE_LIBSECRET
#include <libsecret/secret.h>
#endif

#include "lamina-settings.h"
#include "lamina-text.h"
#include "lamina-window.h"

#define MAX_RECENT 8

G_DEFINE_FINAL_TYPE (LaminaOfficeDialog, lamina_office_dialog, GTK_TYPE_WINDOW)

enum
{
  LIBRARY_OPENED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

/* ---- The connection string ---------------------------------------------- */

static gboolean
is_blank (const char *text)
{
  return text == NULL || lamina_text_is_blank (text);
}

static gboolean
holds_password (const char *conninfo)
{
  g_autoptr(GUri) uri = NULL;

  /* password=… in a key=value string or a URI's query. */
  for (const char *at = strstr (conninfo, "password"); at != NULL; at = strstr (at + 1, "password"))
    {
      const char *after = at + strlen ("password");

      while (*after == ' ')
        after++;
      if (*after == '=')
        return TRUE;
    }
  if (strstr (conninfo, "://") == NULL)
    return FALSE;
  uri = g_uri_parse (conninfo, G_URI_FLAGS_HAS_PASSWORD | G_URI_FLAGS_ENCODED | G_URI_FLAGS_NON_DNS, NULL);
  return uri != NULL && g_uri_get_password (uri) != NULL;
}

char *
lamina_office_conninfo (const char  *host,
                        const char  *port,
                        const char  *database,
                        const char  *user,
                        const char  *service,
                        GError     **error)
{
  g_autoptr(GString) uri = NULL;
  g_autofree char *h = g_strstrip (g_strdup (host ? host : ""));
  g_autofree char *p = g_strstrip (g_strdup (port ? port : ""));
  g_autofree char *d = g_strstrip (g_strdup (database ? database : ""));
  g_autofree char *u = g_strstrip (g_strdup (user ? user : ""));

  if (!is_blank (service))
    {
      g_autofree char *s = g_strstrip (g_strdup (service));

      if (holds_password (s))
        {
          g_set_error_literal (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA,
                               _("Or: the connection string holds a password; type it in the "
                                 "Password field instead, so that it is never remembered in plain text"));
          return NULL;
        }
      if (strstr (s, "://") != NULL || strchr (s, '=') != NULL)
        return g_steal_pointer (&s);
      for (const char *c = s; *c != '\0'; c++)
        if (!g_ascii_isalnum (*c) && *c != '_' && *c != '-' && *c != '.')
          {
            g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA,
                         _("Or: “%s” is neither a service name (letters, digits, - _ .) "
                           "nor a connection URI (postgresql://user@host:port/database)"), s);
            return NULL;
          }
      return g_strdup_printf ("service=%s", s);
    }
  if (*h == '\0')
    {
      g_set_error_literal (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA,
                           _("Server: give the server’s host name or address, or a service name below"));
      return NULL;
    }
  if (*p != '\0')
    {
      guint64 n = 0;

      if (!g_ascii_string_to_unsigned (p, 10, 1, 65535, &n, NULL))
        {
          g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA,
                       _("Port: “%s” is not a port number (1 to 65535; PostgreSQL’s usual one is 5432)"), p);
          return NULL;
        }
    }
  if (*d == '\0')
    {
      g_set_error_literal (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA,
                           _("Database: give the name of the office’s library database"));
      return NULL;
    }
  uri = g_string_new ("postgresql://");
  if (*u != '\0')
    {
      g_autofree char *escaped = g_uri_escape_string (u, NULL, FALSE);

      g_string_append_printf (uri, "%s@", escaped);
    }
  /* An IPv6 address goes in brackets. */
  g_string_append_printf (uri, strchr (h, ':') != NULL && h[0] != '[' ? "[%s]" : "%s", h);
  if (*p != '\0')
    g_string_append_printf (uri, ":%s", p);
  {
    g_autofree char *escaped = g_uri_escape_string (d, NULL, FALSE);

    g_string_append_printf (uri, "/%s", escaped);
  }
  return g_string_free (g_steal_pointer (&uri), FALSE);
}

/* ---- Passwords ----------------------------------------------------------- */

#ifdef HAVE_LIBSECRET
static const SecretSchema *
office_secret_schema (void)
{
  static const SecretSchema schema = {
    "org.example.Lamina.OfficeLibrary", SECRET_SCHEMA_NONE,
    { { "server", SECRET_SCHEMA_ATTRIBUTE_STRING }, { NULL, 0 } },
    0, NULL, NULL, NULL, NULL, NULL, NULL, NULL,
  };

  return &schema;
}
#endif

static gboolean
in_strv (char       **strv,
         const char  *s)
{
  return strv != NULL && g_strv_contains ((const char * const *) strv, s);
}

/* The keyring's password for @conninfo when the user asked to keep one
 * there, else NULL (libpq's own sources then apply). */
static char *
lookup_password (LaminaOfficeDialog *self,
                 const char         *conninfo)
{
#ifdef HAVE_LIBSECRET
  g_auto(GStrv) kept = g_settings_get_strv (self->settings, "keyring-servers");
  g_autoptr(GError) error = NULL;
  char *secret, *password;

  if (!in_strv (kept, conninfo))
    return NULL;
  secret = secret_password_lookup_sync (office_secret_schema (), NULL, &error, "server", conninfo, NULL);
  if (secret == NULL)
    {
      if (error != NULL)
        g_message ("keyring: %s", error->message);
      return NULL;
    }
  password = g_strdup (secret);
  secret_password_free (secret);
  return password;
#else
  return NULL;
#endif
}

/* Keeps @password for @conninfo in the keyring; FALSE with @error. */
static gboolean
store_password (LaminaOfficeDialog  *self,
                const char          *conninfo,
                const char          *password,
                GError             **error)
{
#ifdef HAVE_LIBSECRET
  g_auto(GStrv) kept = g_settings_get_strv (self->settings, "keyring-servers");
  g_autofree char *label = g_strdup_printf (_("Lamina office library %s"), conninfo);
  g_autoptr(GStrvBuilder) builder = g_strv_builder_new ();
  g_auto(GStrv) next = NULL;

  if (!secret_password_store_sync (office_secret_schema (), SECRET_COLLECTION_DEFAULT, label,
                                   password, NULL, error, "server", conninfo, NULL))
    return FALSE;
  if (!in_strv (kept, conninfo))
    {
      g_strv_builder_addv (builder, (const char **) kept);
      g_strv_builder_add (builder, conninfo);
      next = g_strv_builder_end (builder);
      g_settings_set_strv (self->settings, "keyring-servers", (const char * const *) next);
    }
  return TRUE;
#else
  g_set_error_literal (error, G_IO_ERROR, G_IO_ERROR_NOT_SUPPORTED,
                       _("this build has no keyring support"));
  return FALSE;
#endif
}

/* ---- The dialog ----------------------------------------------------------- */

static void
show_error (LaminaOfficeDialog *self,
            const char         *message)
{
  gtk_label_set_text (self->error_label, message);
  gtk_widget_set_visible (GTK_WIDGET (self->error_label), message != NULL);
}

static void
remember_server (LaminaOfficeDialog *self,
                 const char         *conninfo)
{
  g_auto(GStrv) recent = g_settings_get_strv (self->settings, "recent-servers");
  g_autoptr(GStrvBuilder) builder = g_strv_builder_new ();
  g_auto(GStrv) next = NULL;
  guint n = 1;

  g_strv_builder_add (builder, conninfo);
  for (guint i = 0; recent[i] != NULL && n < MAX_RECENT; i++)
    if (g_strcmp0 (recent[i], conninfo) != 0)
      {
        g_strv_builder_add (builder, recent[i]);
        n++;
      }
  next = g_strv_builder_end (builder);
  g_settings_set_strv (self->settings, "recent-servers", (const char * const *) next);
}

typedef struct
{
  char     *conninfo;
  char     *password;   /* typed or from the keyring, or NULL */
  gboolean  typed;      /* the password was typed (may be kept) */
} Connect;

static void
connect_free (gpointer data)
{
  Connect *c = data;

  g_free (c->conninfo);
  if (c->password != NULL)
    memset (c->password, 0, strlen (c->password));
  g_free (c->password);
  g_free (c);
}

static void
connect_thread (GTask        *task,
                gpointer      source,
                gpointer      task_data,
                GCancellable *cancellable)
{
  Connect *c = task_data;
  GError *error = NULL;
  LaminaLibrary *library = lamina_library_open_with_password (c->conninfo, c->password,
                                                              LAMINA_LIBRARY_OPEN_EXISTING, &error);

  if (library == NULL)
    g_task_return_error (task, error);
  else
    g_task_return_pointer (task, library, g_object_unref);
}

static void
set_connecting (LaminaOfficeDialog *self,
                const char         *conninfo)
{
  gboolean busy = conninfo != NULL;

  gtk_widget_set_sensitive (GTK_WIDGET (self->open_button), !busy);
  if (busy)
    {
      g_autofree char *text = g_strdup_printf (_("Connecting to %s…"), conninfo);

      gtk_widget_remove_css_class (GTK_WIDGET (self->error_label), "lamina-error");
      show_error (self, text);
    }
  else
    gtk_widget_add_css_class (GTK_WIDGET (self->error_label), "lamina-error");
}

static void
on_connected_cb (GObject      *source,
                 GAsyncResult *result,
                 gpointer      user_data)
{
  LaminaOfficeDialog *self;
  Connect *c = g_task_get_task_data (G_TASK (result));
  g_autoptr(GError) error = NULL;
  g_autoptr(LaminaLibrary) library = g_task_propagate_pointer (G_TASK (result), &error);

  /* The dialog was closed meanwhile: the library goes with the task. */
  if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    return;
  self = LAMINA_OFFICE_DIALOG (source);
  g_clear_object (&self->connecting);
  set_connecting (self, NULL);
  if (library == NULL)
    {
      /* Named once: a file library's message names it already, a
       * server's (libpq's) may not. */
      g_autofree char *text = strstr (error->message, c->conninfo) != NULL
        ? g_strdup_printf (_("Could not open the office library: %s"), error->message)
        : g_strdup_printf (_("Could not open the office library: %s: %s"), c->conninfo, error->message);

      show_error (self, text);
      return;
    }
  show_error (self, NULL);
  remember_server (self, c->conninfo);
  if (c->typed && gtk_check_button_get_active (self->remember_check)
      && !store_password (self, c->conninfo, c->password, &error))
    g_message ("keyring: the password was not kept: %s", error->message);
  g_signal_emit (self, signals[LIBRARY_OPENED], 0, library);
  gtk_window_close (GTK_WINDOW (self));
}

static void
on_open_clicked_cb (LaminaOfficeDialog *self)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GTask) task = NULL;
  g_autofree char *conninfo = NULL;
  const char *typed = gtk_editable_get_text (GTK_EDITABLE (self->password_entry));
  Connect *c;

  if (self->connecting != NULL)
    return;
  conninfo = lamina_office_conninfo (gtk_editable_get_text (GTK_EDITABLE (self->host_entry)),
                                     gtk_editable_get_text (GTK_EDITABLE (self->port_entry)),
                                     gtk_editable_get_text (GTK_EDITABLE (self->database_entry)),
                                     gtk_editable_get_text (GTK_EDITABLE (self->user_entry)),
                                     gtk_editable_get_text (GTK_EDITABLE (self->service_entry)),
                                     &error);
  if (conninfo == NULL)
    {
      show_error (self, error->message);
      return;
    }
  c = g_new0 (Connect, 1);
  c->conninfo = g_strdup (conninfo);
  c->typed = *typed != '\0';
  c->password = c->typed ? g_strdup (typed) : lookup_password (self, conninfo);
  gtk_editable_set_text (GTK_EDITABLE (self->password_entry), "");
  self->connecting = g_cancellable_new ();
  set_connecting (self, conninfo);
  task = g_task_new (self, self->connecting, on_connected_cb, NULL);
  g_task_set_source_tag (task, on_open_clicked_cb);
  g_task_set_task_data (task, c, connect_free);
  g_task_run_in_thread (task, connect_thread);
}

/* A recent server fills the fields it was made from. */
static void
on_recent_selected_cb (LaminaOfficeDialog *self)
{
  guint i = gtk_drop_down_get_selected (self->recent_dropdown);
  g_autoptr(GUri) uri = NULL;
  const char *conninfo;

  if (self->recent == NULL || i == 0 || i == GTK_INVALID_LIST_POSITION
      || i > g_strv_length (self->recent))
    return;
  conninfo = self->recent[i - 1];
  uri = g_str_has_prefix (conninfo, "postgresql://")
        ? g_uri_parse (conninfo, G_URI_FLAGS_NON_DNS, NULL) : NULL;
  if (uri != NULL && g_uri_get_host (uri) != NULL)
    {
      g_autofree char *port = g_uri_get_port (uri) > 0 ? g_strdup_printf ("%d", g_uri_get_port (uri)) : g_strdup ("");
      const char *path = g_uri_get_path (uri);

      gtk_editable_set_text (GTK_EDITABLE (self->host_entry), g_uri_get_host (uri));
      gtk_editable_set_text (GTK_EDITABLE (self->port_entry), port);
      gtk_editable_set_text (GTK_EDITABLE (self->database_entry), path[0] == '/' ? path + 1 : path);
      gtk_editable_set_text (GTK_EDITABLE (self->user_entry), g_uri_get_user (uri) ? g_uri_get_user (uri) : "");
      gtk_editable_set_text (GTK_EDITABLE (self->service_entry), "");
    }
  else
    gtk_editable_set_text (GTK_EDITABLE (self->service_entry),
                           g_str_has_prefix (conninfo, "service=") && strchr (conninfo, ' ') == NULL
                           ? conninfo + strlen ("service=") : conninfo);
}

static void
load_recent (LaminaOfficeDialog *self)
{
  g_autoptr(GtkStringList) list = gtk_string_list_new (NULL);

  g_strfreev (self->recent);
  self->recent = g_settings_get_strv (self->settings, "recent-servers");
  gtk_string_list_append (list, _("Choose a recent server…"));
  for (guint i = 0; self->recent[i] != NULL; i++)
    gtk_string_list_append (list, self->recent[i]);
  gtk_drop_down_set_model (self->recent_dropdown, G_LIST_MODEL (list));
  gtk_drop_down_set_selected (self->recent_dropdown, 0);
  gtk_widget_set_visible (self->recent_box, self->recent[0] != NULL);
}

static void
lamina_office_dialog_dispose (GObject *object)
{
  LaminaOfficeDialog *self = LAMINA_OFFICE_DIALOG (object);

  if (self->connecting != NULL)
    g_cancellable_cancel (self->connecting);
  g_clear_object (&self->connecting);
  g_clear_object (&self->settings);
  g_clear_pointer (&self->recent, g_strfreev);
  gtk_widget_dispose_template (GTK_WIDGET (self), LAMINA_TYPE_OFFICE_DIALOG);
  G_OBJECT_CLASS (lamina_office_dialog_parent_class)->dispose (object);
}

static void
lamina_office_dialog_class_init (LaminaOfficeDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = lamina_office_dialog_dispose;
  signals[LIBRARY_OPENED] = g_signal_new ("library-opened", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST,
                                          0, NULL, NULL, NULL, G_TYPE_NONE, 1, LAMINA_TYPE_LIBRARY);

  gtk_widget_class_set_template_from_resource (widget_class, "/org/example/Lamina/lamina-office-dialog.ui");
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, recent_box);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, recent_dropdown);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, host_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, port_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, database_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, user_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, service_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, password_entry);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, remember_check);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, password_note);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, error_label);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, open_button);
  gtk_widget_class_bind_template_child (widget_class, LaminaOfficeDialog, cancel_button);
}

static void
lamina_office_dialog_init (LaminaOfficeDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  self->settings = lamina_settings_new ();
#ifdef HAVE_LIBSECRET
  gtk_label_set_text (self->password_note,
                      _("Leave the password empty to use the one kept in the keyring, or libpq’s "
                        "password file (~/.pgpass). Lamina writes a password nowhere else."));
#else
  gtk_widget_set_visible (GTK_WIDGET (self->remember_check), FALSE);
  gtk_label_set_text (self->password_note,
                      _("Lamina keeps no passwords: leave the field empty to use libpq’s password "
                        "file (~/.pgpass, readable by you only) or your service file; a password "
                        "typed here is used for this connection only."));
#endif
  load_recent (self);
  g_signal_connect_object (self->recent_dropdown, "notify::selected", G_CALLBACK (on_recent_selected_cb),
                           self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->open_button, "clicked", G_CALLBACK (on_open_clicked_cb), self, G_CONNECT_SWAPPED);
  g_signal_connect_object (self->cancel_button, "clicked", G_CALLBACK (gtk_window_close), self, G_CONNECT_SWAPPED);
  gtk_window_set_default_widget (GTK_WINDOW (self), GTK_WIDGET (self->open_button));
  gtk_entry_set_activates_default (self->host_entry, TRUE);
  gtk_entry_set_activates_default (self->database_entry, TRUE);
  gtk_entry_set_activates_default (self->service_entry, TRUE);
  g_object_set (self->password_entry, "activates-default", TRUE, NULL);
}

LaminaOfficeDialog *
lamina_office_dialog_new (GtkWindow *parent)
{
  return g_object_new (LAMINA_TYPE_OFFICE_DIALOG, "transient-for", parent, NULL);
}

/* ---- Opening a library in a window of its own ---------------------------- */

GtkWindow *
lamina_office_present_library (GtkApplication *application,
                               LaminaLibrary  *library)
{
  GtkWindow *window = GTK_WINDOW (lamina_window_new (application, library));
  g_autofree char *title = g_strdup_printf (_("Lamina — %s"), lamina_library_get_path (library));

  gtk_window_set_title (window, title);
  gtk_window_present (window);
  return window;
}

static void
on_library_opened_cb (LaminaOfficeDialog *dialog,
                      LaminaLibrary      *library,
                      GtkApplication     *application)
{
  lamina_office_present_library (application, library);
}

static void
open_office_action (GSimpleAction *action,
                    GVariant      *parameter,
                    gpointer       data)
{
  GtkApplication *application = data;
  LaminaOfficeDialog *dialog = lamina_office_dialog_new (gtk_application_get_active_window (application));

  g_signal_connect_object (dialog, "library-opened", G_CALLBACK (on_library_opened_cb), application, 0);
  gtk_window_present (GTK_WINDOW (dialog));
}

static void
on_file_chosen_cb (GtkNativeDialog *chooser,
                   int              response,
                   GtkApplication  *application)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (chooser));
      g_autofree char *path = g_file_get_path (file);
      g_autoptr(GError) error = NULL;
      g_autoptr(LaminaLibrary) library = path ? lamina_library_open (path, LAMINA_LIBRARY_OPEN_EXISTING, &error) : NULL;
      GtkWindow *parent = gtk_native_dialog_get_transient_for (chooser);

      if (library != NULL)
        lamina_office_present_library (application, library);
      else if (parent != NULL && LAMINA_IS_WINDOW (parent))
        {
          g_autofree char *text = g_strdup_printf (_("Could not open the library: %s"),
                                                   error ? error->message : _("not a local file"));

          lamina_window_notify (LAMINA_WINDOW (parent), text);
        }
    }
  gtk_native_dialog_destroy (chooser);
  g_object_unref (chooser);
}

static void
open_file_action (GSimpleAction *action,
                  GVariant      *parameter,
                  gpointer       data)
{
  GtkApplication *application = data;
  g_autoptr(GtkFileFilter) filter = gtk_file_filter_new ();
  GtkFileChooserNative *chooser =
    gtk_file_chooser_native_new (_("Open Library File"), gtk_application_get_active_window (application),
                                 GTK_FILE_CHOOSER_ACTION_OPEN, _("_Open"), _("_Cancel"));

  gtk_file_filter_add_pattern (filter, "*.sqlite");
  gtk_file_filter_add_pattern (filter, "*.db");
  gtk_file_filter_set_name (filter, _("Lamina libraries"));
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (chooser), filter);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (chooser), TRUE);
  g_signal_connect (chooser, "response", G_CALLBACK (on_file_chosen_cb), application);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (chooser));
}

void
lamina_office_install_actions (GtkApplication *application)
{
  static const GActionEntry actions[] = {
    { "open-office", open_office_action, NULL, NULL, NULL },
    { "open-library-file", open_file_action, NULL, NULL, NULL },
  };

  g_action_map_add_action_entries (G_ACTION_MAP (application), actions, G_N_ELEMENTS (actions), application);
}
