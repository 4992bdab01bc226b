/* SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

void lamina_window_install_export_actions (GtkWidgetClass *widget_class);

G_END_DECLS
