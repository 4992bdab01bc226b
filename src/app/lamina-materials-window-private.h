/* SPDX-License-Identifier: GPL-3.0-or-later */
/* lamina-materials-window-private.h: the window's instance, for its own
 * file and for tests (the template children, typed). */
#pragma once

#include "lamina-materials-window.h"

G_BEGIN_DECLS

struct _LaminaMaterialsWindow
{
  GtkWindow      parent_instance;

  /* template */
  GtkListBox    *list;    /* LaminaMaterialRow, one per material */
  GtkLabel      *status;

  /* owned */
  LaminaLibrary *library;
};

G_END_DECLS
