/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-history-window-private.h: the window's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-history-window.h"

G_BEGIN_DECLS

struct _LaminaHistoryWindow
{
  GtkWindow      parent_instance;

  /* template */
  GtkWidget     *compare_box;
  GtkDropDown   *older;
  GtkDropDown   *newer;
  GtkLabel      *diff;
  GtkListBox    *list;

  /* owned */
  LaminaLibrary *library;
  char          *id;
  GPtrArray     *history;  /* LaminaRevisionInfo*, newest first */
};

G_END_DECLS
