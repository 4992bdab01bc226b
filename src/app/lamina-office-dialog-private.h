/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-office-dialog-private.h: the instance, for the window tests. */
#pragma once

#include "lamina-office-dialog.h"

G_BEGIN_DECLS

struct _LaminaOfficeDialog
{
  GtkWindow       parent_instance;

  /* template */
  GtkWidget      *recent_box;
  GtkDropDown    *recent_dropdown;
  GtkEntry       *host_entry;
  GtkEntry       *port_entry;
  GtkEntry       *database_entry;
  GtkEntry       *user_entry;
  GtkEntry       *service_entry;
  GtkPasswordEntry *password_entry;
  GtkCheckButton *remember_check;
  GtkLabel       *password_note;
  GtkLabel       *error_label;
  GtkButton      *open_button;
  GtkButton      *cancel_button;

  /* owned */
  GSettings      *settings;
  char          **recent;   /* the recent-servers key when shown */
  GCancellable   *connecting;  /* while a worker connects, else NULL */
};

G_END_DECLS
