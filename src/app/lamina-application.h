/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-application.h: the GtkApplication: opens the library (the default
 * one, or --library PATH), its windows and app.* actions. */
#pragma once

#include <gtk/gtk.h>

#include "store/lamina-library.h"

G_BEGIN_DECLS

#define LAMINA_TYPE_APPLICATION (lamina_application_get_type ())
G_DECLARE_FINAL_TYPE (LaminaApplication, lamina_application, LAMINA, APPLICATION, GtkApplication)

LaminaApplication *lamina_application_new (void);

/* Loads the CSS and icons from the resources (for tests that build a
 * window without running the application). */
void     lamina_application_load_style (void);

G_END_DECLS
