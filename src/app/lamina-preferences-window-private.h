/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-preferences-window-private.h: the window's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-preferences-window.h"

G_BEGIN_DECLS

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
  GtkWidget     *library_box;
  GtkEntry      *limit_entry;
  GtkWidget     *limit_apply;
  GtkLabel      *limit_note;

  /* owned */
  GSettings     *settings;
  LaminaLibrary *library;
  char          *limit_note_text;
};

G_END_DECLS
