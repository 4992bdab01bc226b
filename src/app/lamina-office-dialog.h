/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-office-dialog.h: "Open Office Library…" (a library on a
 * PostgreSQL server: host, port, database and user, or a libpq service
 * name or connection URI; recent servers remembered in GSettings, never a
 * password) and "Open Library File…".  Each library opens in a window of
 * its own. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_OFFICE_DIALOG (lamina_office_dialog_get_type ())
G_DECLARE_FINAL_TYPE (LaminaOfficeDialog, lamina_office_dialog, LAMINA, OFFICE_DIALOG, GtkWindow)

/* Emits "library-opened" (LaminaLibrary*) and closes once a library is
 * open; a failure is shown in the dialog, which stays open. */
LaminaOfficeDialog *lamina_office_dialog_new (GtkWindow *parent);

/* The connection string for what the fields say: @service (a service
 * name, a key=value string or a URI) when not blank, else a
 * postgresql:// URI from @host, @port, @database and @user.  Refused
 * with an error naming the field: a missing server or database, a bad
 * port, a password inside the string (it would be remembered). */
char    *lamina_office_conninfo (const char  *host,
                                 const char  *port,
                                 const char  *database,
                                 const char  *user,
                                 const char  *service,
                                 GError     **error);

/* A new window on @library (the window title names it). */
GtkWindow *lamina_office_present_library (GtkApplication *application,
                                          LaminaLibrary  *library);

/* app.open-office and app.open-library-file. */
void     lamina_office_install_actions (GtkApplication *application);

G_END_DECLS
